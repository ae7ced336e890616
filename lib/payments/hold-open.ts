import "server-only";
import { randomUUID } from "node:crypto";
import { and, eq } from "drizzle-orm";
import { db } from "@/db/client";
import { auditLog } from "@/db/schema";
import { depositHold, holdHistory, type DepositHoldRow, type HoldSubjectType } from "@/db/schema-reservations";
import { writeTransaction, type WriteTx } from "@/db/write-transaction";
import { Conflict, DomainError, Invalid } from "@/lib/errors";
import { holdTransition, newHold } from "./hold-state";
import { commitHoldMove, loadHold, machineOf, viewOf, type HoldView } from "./hold-store";
import { PaymentError, type Hold, type PaymentProcessor } from "./processor";
import { paymentProcessor } from "./processor-from-env";

// Opening a deposit hold and taking the processor's answer to it, whichever way the answer comes (the response to
// our call, a webhook, or the sweep asking again with the same idempotency key). Part of holds.ts's interface.

export interface OpenHoldInput {
  subjectType: HoldSubjectType;
  subjectId: string;
  payerId: string;
  payeeId: string;
  amountMinor: number;
  currency: string;
  /** the same key for a retried payment; a new attempt (another card) needs a new key */
  idempotencyKey: string;
  /** the processor's token for the payer's card (e.g. pm_card_visa against the stand-in) */
  paymentMethod: string;
  description?: string;
}

export type OpenHoldResult =
  | { ok: true; hold: HoldView }
  | { ok: false; reason: "declined"; declineCode: string | null; message: string; hold: HoldView }
  /** the reservation or job ended while the payment was on its way; the authorisation was given back */
  | { ok: false; reason: "voided"; message: string; hold: HoldView };

const PROCESSOR_UNAVAILABLE = "The payment service did not answer. Nothing was charged twice: try again in a minute.";

function unavailable(): DomainError {
  return new DomainError(PROCESSOR_UNAVAILABLE, 503, "payment_unavailable");
}

function resultOf(row: DepositHoldRow): OpenHoldResult {
  const hold = viewOf(row);
  if (row.state === "failed") {
    return { ok: false, reason: "declined", declineCode: row.failureCode, message: row.failureMessage ?? "The payment was declined.", hold };
  }
  if (row.state === "voided") return { ok: false, reason: "voided", message: "This payment was stopped because the reservation ended first. Nothing was charged.", hold };
  return { ok: true, hold };
}

async function insertPendingHold(input: OpenHoldInput, now: Date): Promise<DepositHoldRow> {
  const id = randomUUID();
  try {
    newHold({ holdId: id, currency: input.currency, amountMinor: input.amountMinor });
  } catch (err) {
    throw new Invalid(err instanceof Error ? err.message : String(err), { amountMinor: ["Not a valid amount for a deposit"] });
  }
  try {
    return await writeTransaction(db, async (tx) => {
      const [row] = await tx
        .insert(depositHold)
        .values({
          id,
          subjectType: input.subjectType,
          subjectId: input.subjectId,
          payerId: input.payerId,
          payeeId: input.payeeId,
          currency: input.currency,
          amountMinor: input.amountMinor,
          state: "pending",
          processor: paymentProcessor().name,
          paymentMethod: input.paymentMethod,
          idempotencyKey: input.idempotencyKey,
        })
        .returning();
      if (!row) throw new Error("hold insert returned nothing");
      await tx.insert(holdHistory).values({ holdId: id, fromState: null, toState: "pending", event: "open", actor: "farmer", actorId: input.payerId, at: now });
      await tx.insert(auditLog).values({ actorId: input.payerId, action: "hold.open", subjectType: "deposit_hold", subjectId: id, detail: { for: `${input.subjectType}:${input.subjectId}`, amountMinor: input.amountMinor, currency: input.currency }, createdAt: now });
      return row;
    });
  } catch (err) {
    if (err instanceof Error && /UNIQUE constraint failed: deposit_hold\.subject_type/.test(`${err.message} ${String(err.cause ?? "")}`)) {
      throw new Conflict("A payment for this is already in progress or held.");
    }
    throw err;
  }
}

/** The processor authorised the hold (its answer to our call, or its webhook): pending → held, unless it was voided meanwhile. */
export async function authorizeInTx(tx: WriteTx, row: DepositHoldRow, authorised: { processorHoldId: string; heldMinor: number; currency: string }, via: string, now: Date): Promise<{ row: DepositHoldRow; cancelAtProcessor: boolean; becameHeld: boolean }> {
  const voidQueued = row.pendingOp?.event.type === "void";
  if (row.state === "pending" && !voidQueued) {
    const t = holdTransition(machineOf(row), { type: "authorize", amountMinor: authorised.heldMinor, currency: authorised.currency }, "system");
    if (!t.ok) {
      // Held a different amount than we asked for: never keep it. Fail the hold and give the authorisation back.
      const failed = holdTransition(machineOf(row), { type: "fail" }, "system");
      if (!failed.ok) throw new Error(failed.message);
      const after = await commitHoldMove(tx, row, { ...failed, event: "fail", caller: { role: "system" }, at: now, detail: { via, refused: t.message }, set: { processorHoldId: authorised.processorHoldId, failureCode: t.reason, failureMessage: t.message } });
      return { row: after, cancelAtProcessor: true, becameHeld: false };
    }
    const after = await commitHoldMove(tx, row, { ...t, event: "authorize", caller: { role: "system" }, at: now, detail: { via }, set: { processorHoldId: authorised.processorHoldId, authorizedAt: now } });
    return { row: after, cancelAtProcessor: false, becameHeld: true };
  }
  if (row.state === "pending" && voidQueued) {
    const t = holdTransition(machineOf(row), { type: "void" }, row.pendingOp?.actor ?? "system");
    if (!t.ok) throw new Error(t.message);
    const after = await commitHoldMove(tx, row, { ...t, event: "void", caller: { role: row.pendingOp?.actor ?? "system", userId: row.pendingOp?.actorId ?? null }, at: now, detail: { via, late: true }, set: { processorHoldId: authorised.processorHoldId, pendingOp: null } });
    return { row: after, cancelAtProcessor: true, becameHeld: false };
  }
  if (row.state === "voided") {
    if (row.processorHoldId === null) {
      const [after] = await tx.update(depositHold).set({ processorHoldId: authorised.processorHoldId, version: row.version + 1 }).where(and(eq(depositHold.id, row.id), eq(depositHold.version, row.version))).returning();
      return { row: after ?? row, cancelAtProcessor: true, becameHeld: false };
    }
    return { row, cancelAtProcessor: true, becameHeld: false };
  }
  return { row, cancelAtProcessor: false, becameHeld: false };
}

export async function cancelLateAuthorisation(row: DepositHoldRow, processorHoldId: string): Promise<void> {
  try {
    await paymentProcessor().cancelHold({ holdId: processorHoldId, idempotencyKey: `late:${row.id}`, reason: "abandoned" });
  } catch (err) {
    // Already cancelled is the outcome we want; anything else is logged and the authorisation lapses on its own.
    if (!(err instanceof PaymentError && err.code === "invalid_state")) console.error("[holds] could not give back a late authorisation", row.id, err);
  }
}

async function settleProcessorAnswer(holdId: string, answer: Hold | null, declined: { code: string | null; message: string } | null, now: Date): Promise<DepositHoldRow> {
  const outcome = await writeTransaction(db, async (tx) => {
    const row = await loadHold(tx, holdId);
    if (answer && answer.status === "held") return authorizeInTx(tx, row, { processorHoldId: answer.holdId, heldMinor: answer.heldMinor, currency: answer.currency }, "response", now);
    if (row.state !== "pending") return { row, cancelAtProcessor: false, becameHeld: false };
    const t = holdTransition(machineOf(row), { type: "fail" }, "system");
    if (!t.ok) throw new Error(t.message);
    const message = declined?.message ?? "The card needs a step this app cannot take. Try another card.";
    const after = await commitHoldMove(tx, row, {
      ...t,
      event: "fail",
      caller: { role: "system" },
      at: now,
      detail: { declineCode: declined?.code ?? null },
      set: { processorHoldId: answer?.holdId ?? row.processorHoldId, failureCode: declined?.code ?? "requires_action", failureMessage: message, pendingOp: null },
    });
    // An answer that is neither held nor declined (it wants a step we cannot take) must not stay open at the processor.
    return { row: after, cancelAtProcessor: answer !== null && declined === null, becameHeld: false };
  });
  if (outcome.cancelAtProcessor && outcome.row.processorHoldId) await cancelLateAuthorisation(outcome.row, outcome.row.processorHoldId);
  return outcome.row;
}

/** Asks the processor to hold the deposit, or replays the answer for a retried key. Same key, same hold. */
async function authoriseAtProcessor(row: DepositHoldRow, description: string | undefined, now: Date): Promise<DepositHoldRow> {
  let result: Awaited<ReturnType<PaymentProcessor["holdDeposit"]>>;
  try {
    result = await paymentProcessor().holdDeposit({
      amountMinor: row.amountMinor,
      currency: row.currency,
      reference: row.id,
      idempotencyKey: row.id,
      paymentMethod: row.paymentMethod,
      ...(description === undefined ? {} : { description }),
    });
  } catch (err) {
    if (err instanceof PaymentError && (err.code === "invalid_request" || err.code === "idempotency_conflict")) {
      return settleProcessorAnswer(row.id, null, { code: err.code, message: "The payment details were not accepted. Choose another card." }, now);
    }
    if (err instanceof PaymentError) throw unavailable();
    throw err;
  }
  if (result.ok) return settleProcessorAnswer(row.id, result.hold, null, now);
  return settleProcessorAnswer(row.id, result.hold, { code: result.declineCode, message: result.message }, now);
}

/**
 * Opens a deposit hold and asks the processor to authorise it. A retry with the same idempotency key returns the
 * same hold (and, if the first attempt never got an answer, asks the processor again with the same key).
 */
export async function openHold(input: OpenHoldInput, now = new Date()): Promise<OpenHoldResult> {
  const existing = (await db.select().from(depositHold).where(eq(depositHold.idempotencyKey, input.idempotencyKey)).limit(1))[0];
  if (existing) {
    const same =
      existing.subjectType === input.subjectType &&
      existing.subjectId === input.subjectId &&
      existing.payerId === input.payerId &&
      existing.amountMinor === input.amountMinor &&
      existing.currency === input.currency &&
      existing.paymentMethod === input.paymentMethod;
    if (!same) throw new Conflict("This payment key was already used for a different payment.");
    if (existing.state !== "pending") return resultOf(existing);
    return resultOf(await authoriseAtProcessor(existing, input.description, now));
  }
  const row = await insertPendingHold(input, now);
  return resultOf(await authoriseAtProcessor(row, input.description, now));
}

// ---------------------------------------------------------------------------------------------------------------

/** For the sweep: a hold still pending long after it was opened asks the processor again (same key, same answer). */
export async function retryAuthorisation(holdId: string, now = new Date()): Promise<HoldView> {
  const row = await loadHold(db, holdId);
  if (row.state !== "pending" || row.pendingOp) return viewOf(row);
  return viewOf(await authoriseAtProcessor(row, undefined, now));
}

