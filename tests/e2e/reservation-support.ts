import { createClient, type Client } from "@libsql/client";
import { expect, request as newRequest, type APIRequestContext } from "@playwright/test";
import { existsSync } from "node:fs";
import { E2E_BASE_URL, E2E_PORT, E2E_SERVICE_PORTS } from "./ports";
import { DEMO_PASSWORD } from "./support";

// Helpers for the reservation specs: signed-in API contexts, the e2e server's database file (opened only to
// make time pass for the quarantine week, or to count rows before and after), the sweep and the payments stand-in.

if (existsSync(".env")) process.loadEnvFile(".env"); // the e2e server reads the same file (scripts/demo.ts)

/** The defaults of lib/env.ts, unless .env says otherwise. */
export const CRON_SECRET = process.env.CRON_SECRET || "cron_local_shoal_sweep";
export const STRIPE_SECRET = process.env.STRIPE_SECRET_KEY || "sk_test_local_shoal";
export const PAYMENTS_API = `http://127.0.0.1:${E2E_SERVICE_PORTS.payments}`;

export async function apiAs(email: string): Promise<{ ctx: APIRequestContext; id: string }> {
  const ctx = await newRequest.newContext({ baseURL: E2E_BASE_URL, extraHTTPHeaders: { origin: E2E_BASE_URL } });
  expect((await ctx.post("/api/auth/sign-in/email", { data: { email, password: DEMO_PASSWORD } })).status(), `sign in ${email}`).toBe(200);
  const me = (await (await ctx.get("/api/v1/me")).json()) as { user: { id: string } };
  return { ctx, id: me.user.id };
}

export function e2eDatabase(): Client {
  return createClient({ url: `file:./data/e2e-${E2E_PORT}/shoal.db`, timeout: 5000 });
}

/** Makes `days` pass for one reservation's quarantine clock (a fixture for "a week later", not an app feature). */
export async function backdateHandOver(reservationId: string, days: number): Promise<void> {
  const db = e2eDatabase();
  const ms = days * 86_400_000;
  try {
    await db.execute({
      sql: "update reservation set handed_over_at = handed_over_at - ?, remind_at = remind_at - ?, auto_release_at = auto_release_at - ? where id = ?",
      args: [ms, ms, ms, reservationId],
    });
  } finally {
    db.close();
  }
}

export async function runSweep(ctx: APIRequestContext): Promise<Record<string, unknown>> {
  const r = await ctx.post("/api/cron/sweep", { headers: { authorization: `Bearer ${CRON_SECRET}` } });
  expect(r.status()).toBe(200);
  return ((await r.json()) as { swept: Record<string, unknown> }).swept;
}

export function dateInDays(days: number): string {
  return new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);
}

export async function postBatch(ctx: APIRequestContext, countAvailable: number, meanWeightG = "3"): Promise<string> {
  const r = await ctx.post("/api/v1/batches", {
    data: { species: "tilapia", meanWeightG, meanLengthCm: "5", countAvailable: String(countAvailable), pricePerFish: "1.00", currency: "ZMW", readyFrom: dateInDays(0), sellBy: dateInDays(20), delivery: "both" },
  });
  expect(r.status()).toBe(201);
  return ((await r.json()) as { batch: { id: string } }).batch.id;
}
