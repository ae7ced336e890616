import "server-only";
import { sql } from "drizzle-orm";
import { db as appDb, type Database } from "@/db/client";
import { apiRateLimit } from "@/db/schema";
import { writeTransaction } from "@/db/write-transaction";
import { TooManyRequests } from "@/lib/errors";

/*
 * Per-account limits on the API calls that take stock or storage. A fixed window per (limit, account) kept in the
 * api_rate_limit table, so every app instance counts against the same row. One statement decides: an UPSERT that
 * either opens a new window (count 1) or adds one to the open window, and returns the count; SQLite runs it
 * atomically, so concurrent requests (from one instance or several) each get a distinct count and no more than
 * `max` get through. It runs in writeTransaction because this process's other write transactions must not overlap
 * it (see db/write-transaction.ts). Refused attempts are counted too; the window still closes on time.
 * Routes count after the body has parsed: a malformed request does no work beyond its schema's refusal, and a
 * farmer's mistyped form should not use up the allowance.
 *
 * Sign-in, sign-up and password reset are limited by better-auth itself (lib/auth/auth.ts, table rate_limit).
 */

export type RateLimitRule = {
  /** first part of the row key */
  name: string;
  max: number;
  windowSeconds: number;
  /** what is being counted, for the message: "new reservations" */
  what: string;
};

export const RATE_LIMITS = {
  // A reservation is one filled-in form (batch, count, collection or delivery); a farmer buying from several
  // hatcheries in one sitting makes a handful. 30 in 10 minutes is one every 20 seconds kept up for 10 minutes:
  // only a script does that, and each reservation takes a hatchery's stock and sends it an e-mail.
  reservationCreate: { name: "reservation:create", max: 30, windowSeconds: 600, what: "new reservations" },
  // The most photos one sitting needs: a builder adding finished tanks to the portfolio (12 photos per item, see
  // lib/storage/upload-kinds.ts) — 120 is ten full items in 10 minutes, while an 8 MB photo from a phone on a rural
  // connection takes tens of seconds to send. A script asking for upload links without end would fill storage
  // (a site photo may name a request not posted yet, so the per-object photo count alone does not stop it).
  uploadPresign: { name: "upload:presign", max: 120, windowSeconds: 600, what: "photo uploads" },
  // One per uploaded photo (a retried submit counts again), so the same allowance.
  uploadComplete: { name: "upload:complete", max: 120, windowSeconds: 600, what: "photo uploads" },
} as const satisfies Record<string, RateLimitRule>;

export type RateLimitDecision = {
  allowed: boolean;
  /** attempts in the current window, this one included */
  count: number;
  windowStartedAt: number;
  /** whole seconds until the window closes (at least 1) */
  retryAfterSeconds: number;
};

export function rateLimitKey(rule: RateLimitRule, subject: string): string {
  return `${rule.name}:${subject}`;
}

/** Counts one attempt of `subject` (an account id) against `rule` and says whether it may go ahead. */
export async function consumeRateLimit(rule: RateLimitRule, subject: string, options: { db?: Database; now?: number } = {}): Promise<RateLimitDecision> {
  const db = options.db ?? appDb;
  const now = options.now ?? Date.now();
  const windowMs = rule.windowSeconds * 1000;
  // A window opened at or before this instant has closed ([start, start + window) is open).
  const closedBefore = now - windowMs;
  const key = rateLimitKey(rule, subject);
  const rows = await writeTransaction(db, (tx) =>
    tx
      .insert(apiRateLimit)
      .values({ key, windowStartedAt: now, count: 1 })
      .onConflictDoUpdate({
        target: apiRateLimit.key,
        // Both expressions read the row as it was before this update (SQL's UPDATE semantics).
        set: {
          count: sql`case when ${apiRateLimit.windowStartedAt} <= ${closedBefore} then 1 else ${apiRateLimit.count} + 1 end`,
          windowStartedAt: sql`case when ${apiRateLimit.windowStartedAt} <= ${closedBefore} then ${now} else ${apiRateLimit.windowStartedAt} end`,
        },
      })
      .returning({ count: apiRateLimit.count, windowStartedAt: apiRateLimit.windowStartedAt }),
  );
  const row = rows[0];
  if (!row) throw new Error(`rate limit ${key}: the upsert returned no row`);
  return {
    allowed: row.count <= rule.max,
    count: row.count,
    windowStartedAt: row.windowStartedAt,
    retryAfterSeconds: Math.max(1, Math.ceil((row.windowStartedAt + windowMs - now) / 1000)),
  };
}

function inWords(seconds: number): string {
  if (seconds < 90) return `${seconds} second${seconds === 1 ? "" : "s"}`;
  const minutes = Math.ceil(seconds / 60);
  return `${minutes} minutes`;
}

/** Throws TooManyRequests (429 with Retry-After) once `subject` has used up `rule` in the current window. */
export async function enforceRateLimit(rule: RateLimitRule, subject: string): Promise<void> {
  const decision = await consumeRateLimit(rule, subject);
  if (decision.allowed) return;
  throw new TooManyRequests(
    `Too many ${rule.what} from this account: at most ${rule.max} in ${inWords(rule.windowSeconds)}. Try again in ${inWords(decision.retryAfterSeconds)}.`,
    decision.retryAfterSeconds,
  );
}
