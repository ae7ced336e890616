import "server-only";
import { createHash } from "node:crypto";
import { and, eq, isNull } from "drizzle-orm";
import { NextResponse } from "next/server";
import { db } from "@/db/client";
import { apiIdempotencyKey } from "@/db/schema-reservations";
import { writeTransaction } from "@/db/write-transaction";
import { Conflict, DomainError, Invalid } from "@/lib/errors";
import { STALE_CLAIM_MS } from "./stale-claim";

// Idempotency keys for API calls that take stock or move money (creating a reservation, paying a deposit). The
// client sends `Idempotency-Key`; the first call with a key runs and its answer is stored; a retry with the same
// key and body gets that answer again (marked Idempotent-Replayed) instead of acting twice. Answers of 5xx are not
// stored, so a call that failed on our side can be retried for real. Keys live in the database: every instance agrees.

const KEY_PATTERN = /^[A-Za-z0-9_.:-]{8,200}$/;

export type ApiAnswer = { status: number; body: unknown };

function bodyOf(error: DomainError) {
  return { error: { code: error.code, message: error.message, ...(error.fieldErrors ? { fieldErrors: error.fieldErrors } : {}) } };
}

export function idempotencyKeyOf(request: Request): string {
  const key = request.headers.get("idempotency-key");
  if (!key || !KEY_PATTERN.test(key)) {
    const message = "Send an Idempotency-Key header (8 to 200 letters, digits or - _ . :), the same one when you retry this request.";
    throw new Invalid(message, { "idempotency-key": [message] });
  }
  return key;
}

// A stale claim (STALE_CLAIM_MS, ./stale-claim.ts) is taken over by one retry, which runs again. That is safe
// because every call behind a key is repeatable: a reservation's id is derived from the key (stableIdFor) and a
// payment reuses its processor idempotency key.
export { STALE_CLAIM_MS };

/** A UUID-shaped id fixed by (user, scope, key), so a re-run of the same request writes the same row. */
export function stableIdFor(userId: string, scope: string, key: string): string {
  const h = createHash("sha256").update(`${userId}\u0000${scope}\u0000${key}`).digest("hex");
  // RFC 9562 layout with version 8 (custom) and the RFC variant bits, so it reads as any other UUID.
  const variant = ((parseInt(h.slice(16, 17), 16) & 0x3) | 0x8).toString(16);
  return `${h.slice(0, 8)}-${h.slice(8, 12)}-8${h.slice(13, 16)}-${variant}${h.slice(17, 20)}-${h.slice(20, 32)}`;
}

export type IdempotentRun = { key: string; stableId: string };

export async function withIdempotency(request: Request, userId: string, scope: string, body: unknown, run: (call: IdempotentRun) => Promise<ApiAnswer>, now = new Date()): Promise<NextResponse> {
  const key = idempotencyKeyOf(request);
  const requestHash = createHash("sha256").update(JSON.stringify(body ?? null)).digest("hex");
  const where = and(eq(apiIdempotencyKey.userId, userId), eq(apiIdempotencyKey.scope, scope), eq(apiIdempotencyKey.key, key));
  const claimed = await writeTransaction(db, (tx) =>
    tx.insert(apiIdempotencyKey).values({ userId, scope, key, requestHash, createdAt: now }).onConflictDoNothing().returning({ key: apiIdempotencyKey.key }),
  );
  if (claimed.length === 0) {
    const earlier = (await db.select().from(apiIdempotencyKey).where(where).limit(1))[0];
    if (!earlier) throw new Conflict("The same request is being retried right now. Wait a moment and reload.");
    if (earlier.requestHash !== requestHash) throw new Conflict("This Idempotency-Key was already used for a different request. Use a new key for a new request.");
    if (earlier.completedAt === null || earlier.responseStatus === null) {
      const stale = now.getTime() - earlier.createdAt.getTime() >= STALE_CLAIM_MS;
      // Only one retry wins the takeover: the update matches the claim's old time.
      const taken = stale
        ? await writeTransaction(db, (tx) =>
            tx.update(apiIdempotencyKey).set({ createdAt: now }).where(and(where, isNull(apiIdempotencyKey.completedAt), eq(apiIdempotencyKey.createdAt, earlier.createdAt))).returning({ key: apiIdempotencyKey.key }),
          )
        : [];
      if (taken.length === 0) throw new Conflict("The same request is still being processed. Wait a moment and reload.");
    } else {
      return NextResponse.json(earlier.responseBody, { status: earlier.responseStatus, headers: { "Idempotent-Replayed": "true" } });
    }
  }
  let answer: ApiAnswer;
  try {
    answer = await run({ key, stableId: stableIdFor(userId, scope, key) });
  } catch (error) {
    if (error instanceof DomainError && error.status < 500) {
      answer = { status: error.status, body: bodyOf(error) };
    } else {
      await writeTransaction(db, (tx) => tx.delete(apiIdempotencyKey).where(where));
      throw error;
    }
  }
  await writeTransaction(db, (tx) => tx.update(apiIdempotencyKey).set({ responseStatus: answer.status, responseBody: answer.body, completedAt: new Date() }).where(where));
  return NextResponse.json(answer.body, { status: answer.status });
}
