import "server-only";
import { createHash } from "node:crypto";
import { and, eq } from "drizzle-orm";
import { NextResponse } from "next/server";
import { db } from "@/db/client";
import { apiIdempotencyKey } from "@/db/schema-reservations";
import { writeTransaction } from "@/db/write-transaction";
import { Conflict, DomainError, Invalid } from "@/lib/errors";

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
    throw new Invalid("Send an Idempotency-Key header (8 to 200 letters, digits or - _ . :), the same one when you retry this request.");
  }
  return key;
}

export async function withIdempotency(request: Request, userId: string, scope: string, body: unknown, run: () => Promise<ApiAnswer>): Promise<NextResponse> {
  const key = idempotencyKeyOf(request);
  const requestHash = createHash("sha256").update(JSON.stringify(body ?? null)).digest("hex");
  const where = and(eq(apiIdempotencyKey.userId, userId), eq(apiIdempotencyKey.scope, scope), eq(apiIdempotencyKey.key, key));
  const claimed = await writeTransaction(db, (tx) =>
    tx.insert(apiIdempotencyKey).values({ userId, scope, key, requestHash }).onConflictDoNothing().returning({ key: apiIdempotencyKey.key }),
  );
  if (claimed.length === 0) {
    const earlier = (await db.select().from(apiIdempotencyKey).where(where).limit(1))[0];
    if (!earlier) throw new Conflict("The same request is being retried right now. Wait a moment and reload.");
    if (earlier.requestHash !== requestHash) throw new Conflict("This Idempotency-Key was already used for a different request. Use a new key for a new request.");
    if (earlier.completedAt === null || earlier.responseStatus === null) throw new Conflict("The same request is still being processed. Wait a moment and reload.");
    return NextResponse.json(earlier.responseBody, { status: earlier.responseStatus, headers: { "Idempotent-Replayed": "true" } });
  }
  let answer: ApiAnswer;
  try {
    answer = await run();
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
