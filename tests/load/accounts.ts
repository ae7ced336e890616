import type { Client } from "@libsql/client";
import { DEMO_PASSWORD } from "../../db/seed";

// Seeded accounts the load signs in through the real sign-in API (POST /api/auth/sign-in/email), before any load
// starts. Sign-in is rate limited per client (lib/auth/auth.ts: 30 a minute), so the test signs in few accounts,
// paced, and waits out a 429 as the reply tells it to.

export interface Account {
  id: string;
  email: string;
  /** the Cookie header of the signed-in session */
  cookie: string;
}

export interface SeededBatch {
  id: string;
  hatcheryId: string;
  countAvailable: number;
  /** what a reservation of this batch asks for: collection unless the batch is delivered only */
  handoverMethod: "pickup" | "delivery";
}

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** Farmers who are not hatcheries (a hatchery cannot reserve its own fish), in a stable order. */
export async function farmerEmails(db: Client, limit: number): Promise<string[]> {
  const rows = await db.execute({
    sql: `select u.email from user u join user_role r on r.user_id = u.id and r.role = 'farmer'
          where not exists (select 1 from user_role h where h.user_id = u.id and h.role = 'hatchery') order by u.email limit ?`,
    args: [limit],
  });
  return rows.rows.map((r) => String(r.email));
}

/** Hatcheries with the most fish on offer in open batches that are still selling for at least a week. */
export async function hatcheryEmails(db: Client, limit: number): Promise<string[]> {
  const rows = await db.execute({
    sql: `select u.email from batch b join user u on u.id = b.hatchery_id
          where b.state = 'open' and b.sell_by > ? group by u.id order by sum(b.count_available) desc, u.email limit ?`,
    args: [Date.now() + 7 * 86_400_000, limit],
  });
  return rows.rows.map((r) => String(r.email));
}

/** Open batches still selling for at least a week (optionally of some hatcheries only). */
export async function openBatches(db: Client, hatcheryIds?: readonly string[]): Promise<SeededBatch[]> {
  const rows = await db.execute({ sql: "select id, hatchery_id, count_available, delivery from batch where state = 'open' and sell_by > ? order by id", args: [Date.now() + 7 * 86_400_000] });
  return rows.rows
    .map((r) => ({ id: String(r.id), hatcheryId: String(r.hatchery_id), countAvailable: Number(r.count_available), handoverMethod: r.delivery === "delivery" ? ("delivery" as const) : ("pickup" as const) }))
    .filter((b) => !hatcheryIds || hatcheryIds.includes(b.hatcheryId));
}

/** Signs one account in; on 429 waits the seconds the reply names (X-Retry-After) and tries again, up to 4 times. */
async function signIn(base: string, email: string): Promise<Account> {
  for (let attempt = 0; attempt < 5; attempt++) {
    const res = await fetch(`${base}/api/auth/sign-in/email`, {
      method: "POST",
      headers: { "content-type": "application/json", origin: base },
      body: JSON.stringify({ email, password: DEMO_PASSWORD }),
      signal: AbortSignal.timeout(30_000),
    });
    if (res.status === 429) {
      await res.arrayBuffer();
      const wait = Math.min(65, Number(res.headers.get("x-retry-after") ?? res.headers.get("retry-after") ?? 10) || 10);
      console.log(`[load] sign-in rate limit reached: waiting ${wait} s`);
      await sleep(wait * 1000);
      continue;
    }
    const body = (await res.json()) as { user?: { id: string } };
    const cookie = res.headers
      .getSetCookie()
      .map((c) => c.split(";")[0] ?? "")
      .filter(Boolean)
      .join("; ");
    if (res.status !== 200 || !body.user || !cookie.includes("session_token")) throw new Error(`sign-in of ${email} answered ${res.status}`);
    return { id: body.user.id, email, cookie };
  }
  throw new Error(`sign-in of ${email} stayed rate limited`);
}

/** Signs the accounts in one after another, at most `perMinute` a minute (under the sign-in limit). */
export async function signInAll(base: string, emails: readonly string[], perMinute = 25): Promise<Account[]> {
  const out: Account[] = [];
  const gap = 60_000 / perMinute;
  let sentInWindow = 0;
  let windowStart = Date.now();
  for (const email of emails) {
    if (sentInWindow >= perMinute) {
      const wait = windowStart + 61_000 - Date.now();
      if (wait > 0) {
        console.log(`[load] pacing sign-ins: waiting ${Math.ceil(wait / 1000)} s`);
        await sleep(wait);
      }
      sentInWindow = 0;
      windowStart = Date.now();
    }
    out.push(await signIn(base, email));
    sentInWindow += 1;
    if (emails.length > perMinute) await sleep(gap / 4);
  }
  return out;
}
