import "server-only";
import { and, desc, eq } from "drizzle-orm";
import { db } from "@/db/client";
import { auditLog } from "@/db/schema";
import { depositHold, type DepositHoldRow, type HoldPendingOp, type HoldSubjectType } from "@/db/schema-reservations";
import { writeTransaction, type WriteTx } from "@/db/write-transaction";
import { Conflict } from "@/lib/errors";
import { holdTransition, type HoldEvent } from "./hold-state";
import { commitHoldMove, findHold, holdRefusalError, loadHold, machineOf, viewOf, type HoldCaller, type HoldView } from "./hold-store";
import { PaymentError, type Hold } from "./processor";
import { paymentProcessor } from "./processor-from-env";

/*
 * The deposit hold, kept in the database: used by reservations (lib/reservations/service.ts) and by builder jobs.
 * Every move goes through the pure machine (hold-state.ts) and is written with its balanced ledger legs, a hold
 * history row and an audit row in one transaction. Processor calls never run inside a transaction: a move that
 * needs one is first *queued* on the hold (pending_op, in the same transaction as whatever caused it), then run,
 * and only the processor's answer writes the new state. A queued call that could not reach the processor stays
 * queued and the sweep retries it with the same idempotency key, so it happens exactly once.
 *
 * Card-hold expiry. A card authorisation lapses after about 7 days (Stripe, "Place a hold on a payment method"),
 * but a reservation's deposit can be held for weeks: paid within 48 h of acceptance, kept until hand-over (the batch
 * may be ready later) and up to 14 days after it. Re-authorising near the deadline can be declined, which would
 * leave the hatchery unprotected after the fish have left, so we do not do that. Instead we authorise first (a
 * reservation cancelled in its first days is then returned by cancelling the authorisation: the farmer never sees
 * a charge and Shoal pays no card fee on money it gives back), and if the money is still held after
 * SAFEKEEP_AFTER_HOURS the sweep captures the whole authorisation into Shoal's holding ("safekeep"). From then on a
 * release is a payout from our holding (no processor call; a short count refunds the rest), and a return is a
 * processor refund. The ledger does not change at safekeeping: the money was Shoal's to hold from authorisation,
 * only where it sits changes. Two days of margin before the 7 leave room for a sweep that did not run for a while.
 */

/** Capture a still-held authorisation into Shoal's holding this long after it was made (see above). */
export const SAFEKEEP_AFTER_HOURS = 5 * 24;

// The interface other domains call (reservations, builder jobs). Opening a hold and processor events live beside
// this file; they are part of the same interface.
export { openHold, retryAuthorisation, type OpenHoldInput, type OpenHoldResult } from "./hold-open";
export { applyPaymentEvent, type PaymentEventOutcome } from "./hold-events";
export { paymentProcessor } from "./processor-from-env";
export type { HoldCaller, HoldView } from "./hold-store";

/** After a move that may have queued a processor call: `settled` is false while the call waits for a retry. */
export interface HoldOperationResult {
  hold: HoldView;
  settled: boolean;
}

// ---------------------------------------------------------------------------------------------------------------
// Moves after authorisation: applied at once when they need no processor call, queued and run when they do
// ---------------------------------------------------------------------------------------------------------------

type QueueableEvent = Exclude<HoldPendingOp["event"], { type: "safekeep" }>;

/**
 * Applies `event` to the hold inside the caller's transaction. A move with no processor call (freeze; a void before
 * the processor knows the hold) is written now; one with a call is queued for runHoldOperation after commit.
 * Throws the machine's refusal as a DomainError, which rolls the caller's transaction back.
 */
export async function applyHoldEventInTx(tx: WriteTx, holdId: string, event: HoldEvent, caller: HoldCaller, idempotencyKey: string, now: Date): Promise<{ queued: boolean }> {
  // Authorisations, declines and lapses come from the processor (openHold, applyPaymentEvent), never from a caller.
  if (event.type === "authorize" || event.type === "fail" || event.type === "expire") throw new Error(`"${event.type}" is the processor's to report`);
  const row = await loadHold(tx, holdId);
  if (row.pendingOp) {
    if (row.pendingOp.idempotencyKey === idempotencyKey) return { queued: true };
    throw new Conflict("Another change to this deposit is being processed. Try again in a minute.");
  }
  const t = holdTransition(machineOf(row), event, caller.role);
  if (!t.ok) throw holdRefusalError(t.reason, t.message);
  const needsProcessor = t.effects.some((e) => e.kind === "processor") && row.processorHoldId !== null;
  if (!needsProcessor || event.type === "freeze") {
    await commitHoldMove(tx, row, { ...t, event: event.type, caller, at: now });
    return { queued: false };
  }
  const op: HoldPendingOp = { event, actor: caller.role, actorId: caller.userId ?? null, idempotencyKey, queuedAt: now.toISOString() };
  const updated = await tx.update(depositHold).set({ pendingOp: op, version: row.version + 1 }).where(and(eq(depositHold.id, row.id), eq(depositHold.version, row.version))).returning({ id: depositHold.id });
  if (updated.length === 0) throw new Conflict("The deposit changed while this was being done. Reload and try again.");
  return { queued: true };
}

/** The processor call a queued move needs, in the hold's current mode (authorised, or captured into our holding). */
async function callProcessor(row: DepositHoldRow, op: HoldPendingOp): Promise<void> {
  const processorHoldId = row.processorHoldId;
  if (processorHoldId === null) return;
  const processor = paymentProcessor();
  const captured = row.capturedAt !== null;
  const key = op.idempotencyKey;
  switch (op.event.type) {
    case "safekeep":
      await processor.release({ holdId: processorHoldId, amountMinor: row.heldMinor, idempotencyKey: `safekeep:${row.id}` });
      return;
    case "release":
    case "resolve": {
      const releaseMinor = op.event.type === "release" ? op.event.amountMinor : op.event.outcome === "for_provider" ? op.event.amountMinor : 0;
      if (releaseMinor === 0) {
        // resolve for_farmer: everything goes back
        if (captured) await processor.refund({ holdId: processorHoldId, amountMinor: row.heldMinor, idempotencyKey: key, reason: "requested_by_customer" });
        else await processor.cancelHold({ holdId: processorHoldId, idempotencyKey: key, reason: "requested_by_customer" });
        return;
      }
      if (!captured) {
        await processor.release({ holdId: processorHoldId, amountMinor: releaseMinor, idempotencyKey: key });
        return;
      }
      const rest = row.heldMinor - releaseMinor;
      if (rest > 0) await processor.refund({ holdId: processorHoldId, amountMinor: rest, idempotencyKey: key, reason: "requested_by_customer" });
      return;
    }
    case "refund":
    case "void":
      if (captured) await processor.refund({ holdId: processorHoldId, amountMinor: row.heldMinor, idempotencyKey: key, reason: "requested_by_customer" });
      else await processor.cancelHold({ holdId: processorHoldId, idempotencyKey: key, reason: op.event.type === "void" ? "abandoned" : "requested_by_customer" });
      return;
  }
}

async function dropOperation(row: DepositHoldRow, why: string, now: Date): Promise<DepositHoldRow> {
  return writeTransaction(db, async (tx) => {
    const current = await loadHold(tx, row.id);
    if (current.version !== row.version) return current;
    const [after] = await tx.update(depositHold).set({ pendingOp: null, version: current.version + 1 }).where(and(eq(depositHold.id, row.id), eq(depositHold.version, current.version))).returning();
    await tx.insert(auditLog).values({ actorId: row.pendingOp?.actorId ?? null, action: "hold.operation_dropped", subjectType: "deposit_hold", subjectId: row.id, detail: { operation: row.pendingOp?.event ?? null, why }, createdAt: now });
    return after ?? current;
  });
}

/** Runs the hold's queued processor call (if any) and writes the move. Safe to call twice: the same key, one write. */
export async function runHoldOperation(holdId: string, now = new Date()): Promise<HoldOperationResult> {
  const row = await loadHold(db, holdId);
  const op = row.pendingOp;
  if (!op) return { hold: viewOf(row), settled: true };
  const event = op.event;
  const t = event.type === "safekeep" ? null : holdTransition(machineOf(row), event, op.actor);
  if (t && !t.ok) return { hold: viewOf(await dropOperation(row, t.message, now)), settled: true };
  let lapsed = false;
  try {
    await callProcessor(row, op);
  } catch (err) {
    if (!(err instanceof PaymentError)) throw err;
    if (err.code === "unavailable" || err.code === "authentication") {
      console.error("[holds] processor call left queued for the sweep", holdId, err.message);
      return { hold: viewOf(row), settled: false };
    }
    const remote = err.code === "invalid_state" && row.processorHoldId ? await paymentProcessor().retrieve(row.processorHoldId).catch(() => null) : null;
    if (remote && processorShows(remote, event)) {
      // The processor already did it (an earlier attempt whose answer was lost): write the move below.
    } else if (remote && event.type === "safekeep" && remote.status === "canceled") {
      lapsed = true; // the network let the authorisation go before we could capture it
    } else {
      return { hold: viewOf(await dropOperation(row, `${err.code}: ${err.message}`, now)), settled: true };
    }
  }
  const after = await writeTransaction(db, async (tx) => {
    const current = await loadHold(tx, holdId);
    // Someone else (a concurrent sweep) already wrote this move.
    if (current.version !== row.version || current.pendingOp?.idempotencyKey !== op.idempotencyKey) return current;
    if (lapsed) {
      const expired = holdTransition(machineOf(current), { type: "expire" }, "system");
      if (!expired.ok) throw new Error(expired.message);
      return commitHoldMove(tx, current, { ...expired, event: "expire", caller: { role: "system" }, at: now, detail: { via: "safekeep" }, set: { pendingOp: null } });
    }
    if (!t) {
      return commitHoldMove(tx, current, { next: machineOf(current), effects: [], event: "safekeep", caller: { role: "system" }, at: now, detail: { capturedMinor: current.heldMinor }, set: { pendingOp: null, capturedAt: now } });
    }
    return commitHoldMove(tx, current, { next: t.next, effects: t.effects, event: event.type, caller: { role: op.actor, userId: op.actorId }, at: now, set: { pendingOp: null } });
  });
  return { hold: viewOf(after), settled: true };
}

/** Does the processor's record already show what the queued move wanted? */
function processorShows(remote: Hold, event: HoldPendingOp["event"]): boolean {
  const wantsReturn = event.type === "refund" || event.type === "void" || (event.type === "resolve" && event.outcome === "for_farmer");
  if (wantsReturn) return remote.status === "canceled" || remote.status === "refunded";
  return remote.status === "released";
}

async function applyAndRun(holdId: string, event: QueueableEvent | { type: "freeze" }, caller: HoldCaller, idempotencyKey: string): Promise<HoldOperationResult> {
  const now = new Date();
  await writeTransaction(db, (tx) => applyHoldEventInTx(tx, holdId, event, caller, idempotencyKey, now));
  return runHoldOperation(holdId, now);
}

/** Settles the hold to the payee: all that is held, or `amountMinor` of it with the rest returned to the payer. */
export async function releaseHold(input: { holdId: string; amountMinor?: number; actor: HoldCaller; idempotencyKey: string }): Promise<HoldOperationResult> {
  const row = await loadHold(db, input.holdId);
  return applyAndRun(input.holdId, { type: "release", amountMinor: input.amountMinor ?? row.heldMinor }, input.actor, input.idempotencyKey);
}

/** Gives everything held back to the payer. */
export async function refundHold(input: { holdId: string; actor: HoldCaller; idempotencyKey: string }): Promise<HoldOperationResult> {
  return applyAndRun(input.holdId, { type: "refund" }, input.actor, input.idempotencyKey);
}

/** A dispute: nothing moves until an admin resolves it. */
export async function freezeHold(input: { holdId: string; actor: HoldCaller }): Promise<HoldView> {
  return (await applyAndRun(input.holdId, { type: "freeze" }, input.actor, `freeze:${input.holdId}`)).hold;
}

/** An admin's decision on a frozen hold: all back to the payer, or `releaseMinor` (default all) to the payee. */
export async function resolveHold(input: { holdId: string; outcome: "for_farmer" | "for_provider"; releaseMinor?: number; actor: HoldCaller; idempotencyKey: string }): Promise<HoldOperationResult> {
  const row = await loadHold(db, input.holdId);
  const event: QueueableEvent = input.outcome === "for_farmer" ? { type: "resolve", outcome: "for_farmer" } : { type: "resolve", outcome: "for_provider", amountMinor: input.releaseMinor ?? row.heldMinor };
  return applyAndRun(input.holdId, event, input.actor, input.idempotencyKey);
}

/** Gives up a payment that was never authorised (its reservation or job ended first). */
export async function voidHold(input: { holdId: string; actor: HoldCaller; idempotencyKey: string }): Promise<HoldOperationResult> {
  return applyAndRun(input.holdId, { type: "void" }, input.actor, input.idempotencyKey);
}

export async function getHold(holdId: string): Promise<HoldView | null> {
  const row = await findHold(db, holdId);
  return row ? viewOf(row) : null;
}

/** Every hold of a reservation or job, newest first (a declined card leaves a failed hold before the one that worked). */
export async function holdsForSubject(subjectType: HoldSubjectType, subjectId: string): Promise<HoldView[]> {
  const rows = await db
    .select()
    .from(depositHold)
    .where(and(eq(depositHold.subjectType, subjectType), eq(depositHold.subjectId, subjectId)))
    .orderBy(desc(depositHold.createdAt), desc(depositHold.id));
  return rows.map(viewOf);
}

