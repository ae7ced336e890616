import "server-only";
import { and, eq, inArray, isNotNull, isNull, lte } from "drizzle-orm";
import { db } from "@/db/client";
import { depositHold, type HoldPendingOp } from "@/db/schema-reservations";
import { writeTransaction } from "@/db/write-transaction";
import { retryAuthorisation, runHoldOperation, SAFEKEEP_AFTER_HOURS } from "./holds";

// The deposit holds' part of the scheduled sweep. Each step claims a hold with a conditional UPDATE before it calls
// the processor, and every processor call carries the hold's idempotency key, so two sweeps running at once do each
// thing once.

const HOUR_MS = 3_600_000;
/** A queued processor call that is still there this long after it was queued lost its first attempt: retry it. */
const RETRY_QUEUED_AFTER_MS = 30_000;
/** A hold still pending this long after it was opened never got the processor's answer: ask again with the same key. */
const RETRY_PENDING_AFTER_MS = 10 * 60_000;

export interface HoldSweepReport {
  safekept: number;
  retried: number;
  reauthorised: number;
}

/** Queues a capture into Shoal's holding for each authorisation older than SAFEKEEP_AFTER_HOURS; returns the ids claimed. */
async function claimAgingAuthorisations(now: Date): Promise<string[]> {
  const cutoff = new Date(now.getTime() - SAFEKEEP_AFTER_HOURS * HOUR_MS);
  const due = await db
    .select({ id: depositHold.id, version: depositHold.version })
    .from(depositHold)
    .where(and(inArray(depositHold.state, ["held", "frozen"]), isNull(depositHold.capturedAt), isNull(depositHold.pendingOp), isNotNull(depositHold.processorHoldId), lte(depositHold.authorizedAt, cutoff)))
    .limit(200);
  const claimed: string[] = [];
  for (const hold of due) {
    const op: HoldPendingOp = { event: { type: "safekeep" }, actor: "system", actorId: null, idempotencyKey: `safekeep:${hold.id}`, queuedAt: now.toISOString() };
    const won = await writeTransaction(db, (tx) =>
      tx
        .update(depositHold)
        .set({ pendingOp: op, version: hold.version + 1 })
        .where(and(eq(depositHold.id, hold.id), eq(depositHold.version, hold.version), isNull(depositHold.pendingOp)))
        .returning({ id: depositHold.id }),
    );
    if (won.length > 0) claimed.push(hold.id);
  }
  return claimed;
}

export async function sweepHolds(now = new Date()): Promise<HoldSweepReport> {
  const report: HoldSweepReport = { safekept: 0, retried: 0, reauthorised: 0 };

  for (const id of await claimAgingAuthorisations(now)) {
    const result = await runHoldOperation(id, now);
    if (result.settled && result.hold.capturedAt) report.safekept += 1;
  }

  // Queued calls whose first attempt failed (processor down, process stopped between commit and call).
  const queued = await db.select({ id: depositHold.id, op: depositHold.pendingOp }).from(depositHold).where(isNotNull(depositHold.pendingOp)).limit(200);
  for (const hold of queued) {
    if (!hold.op || now.getTime() - Date.parse(hold.op.queuedAt) < RETRY_QUEUED_AFTER_MS) continue;
    const result = await runHoldOperation(hold.id, now);
    if (result.settled) report.retried += 1;
  }

  // Authorisations that never got an answer: the same key makes the processor replay its first answer.
  const stale = await db
    .select({ id: depositHold.id })
    .from(depositHold)
    .where(and(eq(depositHold.state, "pending"), isNull(depositHold.pendingOp), lte(depositHold.createdAt, new Date(now.getTime() - RETRY_PENDING_AFTER_MS))))
    .limit(100);
  for (const hold of stale) {
    try {
      const after = await retryAuthorisation(hold.id, now);
      if (after.state !== "pending") report.reauthorised += 1;
    } catch (err) {
      console.error("[sweep] could not ask again about a pending payment", hold.id, err instanceof Error ? err.message : err);
    }
  }
  return report;
}
