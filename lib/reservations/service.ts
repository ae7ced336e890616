import "server-only";
import { randomUUID } from "node:crypto";
import { and, eq, gte, inArray, isNull, sql } from "drizzle-orm";
import { db } from "@/db/client";
import { auditLog, batch } from "@/db/schema";
import { depositHold, reservation, reservationHistory, type ReservationRow } from "@/db/schema-reservations";
import { writeTransaction, type WriteTx } from "@/db/write-transaction";
import { can } from "@/lib/auth/permissions";
import { Conflict, DomainError, Forbidden, Invalid, NotFound } from "@/lib/errors";
import { viewOf as viewOfHold } from "@/lib/payments/hold-store";
import { sendReviewRequest } from "@/lib/reviews/review-mail";
import { afterReservationMoveInTx } from "@/lib/reviews/trust-hooks";
import { applyHoldEventInTx, openHold, refundHold, runHoldOperation, type HoldView } from "@/lib/payments/holds";
import type { ReservationAction, ReserveValues } from "@/lib/validations/reservations";
import { reservationReference } from "./labels";
import { deliverPendingMail, queueReservationMail, type MailContext } from "./mail-outbox";
import { actorFor, loadReservation, machineOf, refusalError, type Caller } from "./records";
import { FINAL_RESERVATION_STATES, requestReservation, transition, type ReservationActor, type ReservationEffect, type ReservationEvent, type ReservationState } from "./state";

/*
 * Reservations kept in the database. Every move runs the pure machine (state.ts) on the row as read inside one
 * write transaction, and writes, in that transaction: the new state (only if the row's version is still the one
 * read: a conditional UPDATE, so two requests or two sweeps cannot both move it), a history row, the stock given
 * back (at most once: stock_returned_at is claimed by a conditional UPDATE), the hold move or the queued processor
 * call, and the e-mails to send. Processor calls and e-mails run after commit (holds.ts, mail-outbox.ts).
 */

const LIVE_HOLD_STATES = ["pending", "held", "frozen"] as const;

function columnsAfter(next: ReturnType<typeof machineOf>, effects: readonly ReservationEffect[], now: Date) {
  const scheduled = (event: "lapse" | "remind_survival" | "auto_release") => effects.find((e): e is Extract<ReservationEffect, { kind: "schedule" }> => e.kind === "schedule" && e.event === event)?.at;
  const final = FINAL_RESERVATION_STATES.includes(next.state);
  const lapseKeeps = next.state === "requested" || next.state === "accepted";
  const quarantineKeeps = next.state === "quarantine";
  return {
    state: next.state,
    acceptedAt: next.acceptedAt,
    depositHeldAt: next.depositHeldAt,
    handedOverAt: next.handedOverAt,
    handedOverCount: next.handedOverCount,
    survivalReminderSentAt: next.survivalReminderSentAt,
    survivedCount: next.survivedCount,
    closedAt: final ? now : null,
    lapseAt: scheduled("lapse") ?? (lapseKeeps ? undefined : null),
    remindAt: scheduled("remind_survival") ?? (quarantineKeeps ? undefined : null),
    autoReleaseAt: scheduled("auto_release") ?? (quarantineKeeps ? undefined : null),
  };
}

/** Gives the reserved fish back to the batch, once: the claim on stock_returned_at decides who does it. */
async function returnStock(tx: WriteTx, row: ReservationRow, now: Date): Promise<boolean> {
  const claimed = await tx
    .update(reservation)
    .set({ stockReturnedAt: now })
    .where(and(eq(reservation.id, row.id), isNull(reservation.stockReturnedAt)))
    .returning({ id: reservation.id });
  if (claimed.length === 0) return false;
  await tx
    .update(batch)
    .set({ countAvailable: sql`${batch.countAvailable} + ${row.count}` })
    .where(eq(batch.id, row.batchId));
  return true;
}

async function liveHold(tx: WriteTx, reservationId: string): Promise<{ id: string; state: string } | null> {
  return (
    (
      await tx
        .select({ id: depositHold.id, state: depositHold.state })
        .from(depositHold)
        .where(and(eq(depositHold.subjectType, "reservation"), eq(depositHold.subjectId, reservationId), inArray(depositHold.state, [...LIVE_HOLD_STATES])))
        .limit(1)
    )[0] ?? null
  );
}

export interface MoveOptions {
  /** shown in the history row (a reason, the count handed over) and passed to the e-mails */
  detail?: Record<string, unknown>;
  mail?: MailContext;
  /** the field a bad count is reported on */
  countField?: string;
}

/**
 * One move of a reservation. Throws the machine's refusal (nothing is written) or Conflict if the row moved since
 * it was read. Returns the holds whose processor call was queued by the move.
 */
async function moveInTx(tx: WriteTx, id: string, event: ReservationEvent, actor: ReservationActor, now: Date, options: MoveOptions): Promise<{ row: ReservationRow; queuedHolds: string[]; askForReview: boolean }> {
  const row = await loadReservation(tx, id);
  const result = transition(machineOf(row), event, { actor, now });
  if (!result.ok) throw refusalError(result, options.countField);
  const [after] = await tx
    .update(reservation)
    .set({ ...columnsAfter(result.next, result.effects, now), version: row.version + 1 })
    .where(and(eq(reservation.id, id), eq(reservation.version, row.version)))
    .returning();
  if (!after) throw new Conflict("The reservation changed while this was being done. Reload and try again.");
  const actorId = actor.role === "system" ? null : actor.userId;
  const [history] = await tx
    .insert(reservationHistory)
    .values({ reservationId: id, fromState: row.state, toState: result.next.state, event: event.type, actorId, actorRole: actor.role, at: now, detail: { ...eventDetail(event), ...options.detail } })
    .returning({ id: reservationHistory.id });
  if (!history) throw new Error("history insert returned nothing");
  // An admin's decision over someone's money goes to the append-only audit log as well.
  if (actor.role === "admin") {
    await tx.insert(auditLog).values({ actorId, action: `reservation.${event.type}`, subjectType: "reservation", subjectId: id, detail: { from: row.state, to: result.next.state, ...eventDetail(event), ...options.detail }, createdAt: now });
  }

  const queuedHolds: string[] = [];
  for (const effect of result.effects) {
    switch (effect.kind) {
      case "return_stock":
        await returnStock(tx, row, now);
        break;
      case "hold": {
        const hold = await liveHold(tx, id);
        if (!hold) throw new Conflict("The deposit for this reservation is not held any more. Shoal support will look into it.");
        const queued = await applyHoldEventInTx(tx, hold.id, effect.event, { role: effect.actor, userId: actorId }, `reservation:${id}:${history.id}`, now);
        if (queued.queued) queuedHolds.push(hold.id);
        break;
      }
      case "void_pending_hold": {
        const hold = await liveHold(tx, id);
        if (hold?.state === "pending") {
          const queued = await applyHoldEventInTx(tx, hold.id, { type: "void" }, { role: effect.actor, userId: actorId }, `reservation:${id}:${history.id}`, now);
          if (queued.queued) queuedHolds.push(hold.id);
        }
        break;
      }
      case "mail":
        await queueReservationMail(tx, after, effect.template, effect.to, history.id, options.mail);
        break;
      case "take_stock": // only when a reservation is created (createReservation)
      case "record_survival": // the survival figure is the reservation's own survived_count / handed_over_count
      case "schedule": // written by columnsAfter
        break;
    }
  }
  // Answers, releases, survival reports and refunds change the hatchery's trust; a released reservation may now be reviewed.
  const askForReview = await afterReservationMoveInTx(tx, after, event.type, result.next.state, actor.role);
  return { row: after, queuedHolds, askForReview };
}

function eventDetail(event: ReservationEvent): Record<string, unknown> {
  switch (event.type) {
    case "hand_over":
      return { count: event.count };
    case "report_survival":
      return { survived: event.survived };
    case "pay_deposit":
      return { heldMinor: event.heldMinor, currency: event.currency };
    case "resolve_dispute":
      return { outcome: event.outcome };
    default:
      return {};
  }
}

/** Runs a move, then the processor calls and e-mails it queued. */
export async function moveReservation(id: string, event: ReservationEvent, actor: ReservationActor, now = new Date(), options: MoveOptions = {}): Promise<ReservationRow> {
  const { row, queuedHolds, askForReview } = await writeTransaction(db, (tx) => moveInTx(tx, id, event, actor, now, options));
  for (const holdId of queuedHolds) await runHoldOperation(holdId, now);
  await deliverPendingMail({ reservationId: id, now });
  if (askForReview) await sendReviewRequest("reservation", id);
  return row;
}

// ---------------------------------------------------------------------------------------------------------------
// What people do
// ---------------------------------------------------------------------------------------------------------------

/**
 * A farmer reserves fish. One transaction reads the batch, asks the machine, takes the stock with a conditional
 * UPDATE (… WHERE count_available >= N, so it can never go below zero or sell a fish twice, whatever runs at the
 * same time) and writes the reservation, its first history row and the hatchery's e-mail.
 */
export async function createReservation(caller: Caller, input: ReserveValues, now = new Date(), options: { id?: string } = {}): Promise<ReservationRow> {
  if (!can(caller, "reservation:create")) throw new Forbidden("Only a farmer account can reserve fish.");
  // A retried API call passes the id derived from its Idempotency-Key: if the first attempt committed and then
  // the process died before its answer was stored, the retry finds that reservation instead of taking fish twice.
  const id = options.id ?? randomUUID();
  const actor: ReservationActor = { role: "farmer", userId: caller.id };
  const created = await writeTransaction(db, async (tx) => {
    const earlier = options.id ? (await tx.select().from(reservation).where(eq(reservation.id, id)).limit(1))[0] : undefined;
    if (earlier) {
      if (earlier.farmerId !== caller.id || earlier.batchId !== input.batchId || earlier.count !== input.count) throw new Conflict("This request id belongs to another reservation.");
      return earlier;
    }
    const b = (await tx.select().from(batch).where(eq(batch.id, input.batchId)).limit(1))[0];
    if (!b) throw new NotFound("No such batch");
    if (b.state !== "open") throw new DomainError(b.state === "paused" ? "The hatchery has paused this batch: it takes no reservations for now." : "This batch is closed.", 409, "batch_not_open");
    if (b.sellBy.getTime() < now.getTime()) throw new DomainError("This batch is past its last selling day.", 409, "batch_expired");
    if (b.delivery !== "both" && b.delivery !== input.handoverMethod) {
      const message = b.delivery === "pickup" ? "This batch is for collection at the hatchery only." : "This batch is delivered only.";
      throw new Invalid(message, { handoverMethod: [message] });
    }
    const result = requestReservation(
      { farmerId: caller.id, hatcheryId: b.hatcheryId, count: input.count, availableCount: b.countAvailable, pricePerFishMinor: b.priceMinor, currency: b.currency },
      { actor, now },
    );
    if (!result.ok) throw refusalError(result);
    const taken = await tx
      .update(batch)
      .set({ countAvailable: sql`${batch.countAvailable} - ${input.count}` })
      .where(and(eq(batch.id, b.id), eq(batch.state, "open"), gte(batch.countAvailable, input.count)))
      .returning({ left: batch.countAvailable });
    if (taken.length === 0) {
      // Another instance took the fish between our read and our write.
      throw refusalError({ reason: "not_enough_stock", message: `Not enough fish are left for ${input.count}. Reload to see what is available.` });
    }
    const next = result.next;
    const lapseAt = result.effects.find((e) => e.kind === "schedule" && e.event === "lapse");
    const [row] = await tx
      .insert(reservation)
      .values({
        id,
        batchId: b.id,
        farmerId: caller.id,
        hatcheryId: b.hatcheryId,
        state: next.state,
        count: next.count,
        species: b.species,
        meanWeightG: b.meanWeightG,
        meanLengthCm: b.meanLengthCm,
        pricePerFishMinor: b.priceMinor,
        currency: b.currency,
        totalMinor: b.priceMinor * next.count,
        depositMinor: next.depositMinor,
        handoverMethod: input.handoverMethod,
        note: input.note ? input.note : null,
        requestedAt: now,
        lapseAt: lapseAt?.kind === "schedule" ? lapseAt.at : null,
      })
      .returning();
    if (!row) throw new Error("reservation insert returned nothing");
    const [history] = await tx
      .insert(reservationHistory)
      .values({ reservationId: id, fromState: null, toState: "requested", event: "request", actorId: caller.id, actorRole: "farmer", at: now, detail: { count: next.count, batchId: b.id, leftInBatch: taken[0]?.left ?? null } })
      .returning({ id: reservationHistory.id });
    if (!history) throw new Error("history insert returned nothing");
    for (const effect of result.effects) {
      if (effect.kind === "mail") await queueReservationMail(tx, row, effect.template, effect.to, history.id);
    }
    return row;
  });
  await deliverPendingMail({ reservationId: id, now });
  return created;
}

const EVENT_OF: Record<Exclude<ReservationAction["action"], "check">, (a: ReservationAction, row: ReservationRow) => ReservationEvent> = {
  accept: () => ({ type: "accept" }),
  decline: () => ({ type: "decline" }),
  cancel: () => ({ type: "cancel" }),
  hand_over: (a) => ({ type: "hand_over", count: a.action === "hand_over" ? a.count : 0 }),
  report_survival: (a) => ({ type: "report_survival", survived: a.action === "report_survival" ? a.survived : -1 }),
  dispute: () => ({ type: "dispute" }),
  resolve_dispute: (a) => ({ type: "resolve_dispute", outcome: a.action === "resolve_dispute" ? a.outcome : "for_farmer" }),
  refund: () => ({ type: "refund" }),
};

/** A person moves their reservation (accept, decline, cancel, hand over, report survival, dispute, and the admin's moves). */
export async function actOnReservation(caller: Caller, id: string, action: ReservationAction, now = new Date()): Promise<ReservationRow> {
  const row = await loadReservation(db, id);
  const adminOnly = action.action === "resolve_dispute" || action.action === "refund";
  const actor = actorFor(caller, row, adminOnly);
  if (action.action === "check") return tickChecklist(actor, row, action.item, action.done, now);
  const event = EVENT_OF[action.action](action, row);
  const reason = "reason" in action ? (action.reason ?? null) : null;
  const outcomeText =
    action.action === "resolve_dispute" ? (action.outcome === "for_farmer" ? "The dispute was decided for the farmer: the whole deposit goes back to them." : "The dispute was decided for the hatchery: the deposit is released for the fish handed over.") : null;
  return moveReservation(id, event, actor, now, {
    detail: { ...(reason ? { reason } : {}), ...(action.action === "resolve_dispute" && action.note ? { note: action.note } : {}) },
    mail: { reason, outcomeText },
    countField: action.action === "report_survival" ? "survived" : "count",
  });
}

async function tickChecklist(actor: ReservationActor, row: ReservationRow, item: string, done: boolean, now: Date): Promise<ReservationRow> {
  if (actor.role !== "farmer") throw new Forbidden("Only the farmer keeps the quarantine checklist.");
  if (row.state !== "quarantine") throw new DomainError("The checklist is for the quarantine week after hand-over.", 409, "illegal_transition");
  return writeTransaction(db, async (tx) => {
    const current = await loadReservation(tx, row.id);
    const checks = { ...current.quarantineChecks };
    if (done) checks[item] = now.toISOString();
    else delete checks[item];
    const [after] = await tx.update(reservation).set({ quarantineChecks: checks }).where(eq(reservation.id, row.id)).returning();
    return after ?? current;
  });
}

// ---------------------------------------------------------------------------------------------------------------
// Paying the deposit
// ---------------------------------------------------------------------------------------------------------------

export type PayResult = { ok: true; row: ReservationRow } | { ok: false; declineCode: string | null; message: string; row: ReservationRow };

/**
 * The farmer pays the deposit of an accepted reservation: the hold is authorised by the processor, then the
 * reservation moves to deposit_held. A decline leaves the reservation accepted (the farmer may try another card).
 * `attemptKey` is the API call's idempotency key: a retried call finds the same hold.
 */
export async function payDeposit(caller: Caller, id: string, paymentMethod: string, attemptKey: string, now = new Date()): Promise<PayResult> {
  const row = await loadReservation(db, id);
  const actor = actorFor(caller, row);
  if (actor.role !== "farmer") throw new Forbidden("Only the farmer who reserved pays the deposit.");
  if (row.state !== "accepted") {
    if (row.state === "deposit_held" || row.state === "quarantine") throw new DomainError("The deposit is already paid.", 409, "already_done");
    throw new DomainError(row.state === "requested" ? "Wait until the hatchery accepts before paying." : "This reservation no longer takes a payment.", 409, "illegal_transition");
  }
  const existing = (await db.select().from(depositHold).where(and(eq(depositHold.subjectType, "reservation"), eq(depositHold.subjectId, id), inArray(depositHold.state, [...LIVE_HOLD_STATES]))).limit(1))[0];
  if (existing && existing.idempotencyKey !== `reservation:${id}:pay:${attemptKey}`) {
    if (existing.state === "held") return { ok: true, row: await settleHeldDeposit(viewOfHold(existing), { role: "farmer", userId: caller.id }, now) };
    throw new DomainError("A payment for this reservation is already on its way. Wait a moment and reload.", 409, "payment_in_progress");
  }
  const opened = await openHold(
    {
      subjectType: "reservation",
      subjectId: id,
      payerId: row.farmerId,
      payeeId: row.hatcheryId,
      amountMinor: row.depositMinor,
      currency: row.currency,
      idempotencyKey: `reservation:${id}:pay:${attemptKey}`,
      paymentMethod,
      description: `Deposit for reservation ${reservationReference(id)} (${row.count} fingerlings)`,
    },
    now,
  );
  if (!opened.ok) {
    if (opened.reason === "voided") throw new DomainError(opened.message, 409, "illegal_transition");
    return { ok: false, declineCode: opened.declineCode, message: opened.message, row: await loadReservation(db, id) };
  }
  return { ok: true, row: await settleHeldDeposit(opened.hold, { role: "farmer", userId: caller.id }, now) };
}

/**
 * A hold of this reservation is held (the farmer's own request, a webhook, or the sweep noticed): move the
 * reservation to deposit_held. If it already moved, nothing to do; if it ended first (lapsed, cancelled), the
 * money goes back, since nothing is left to pay for.
 */
export async function settleHeldDeposit(hold: HoldView, actor: ReservationActor, now = new Date()): Promise<ReservationRow> {
  const row = await loadReservation(db, hold.subjectId);
  if (hold.state !== "held") return row;
  if (row.state === "accepted") {
    try {
      return await moveReservation(row.id, { type: "pay_deposit", heldMinor: hold.heldMinor, currency: hold.currency }, actor, now);
    } catch (err) {
      if (!(err instanceof DomainError) || err.status !== 409) throw err;
      // Someone else moved it at the same moment; look again below.
    }
  }
  const latest = await loadReservation(db, hold.subjectId);
  const ended: ReservationState[] = ["lapsed", "cancelled", "declined"];
  if (ended.includes(latest.state)) {
    try {
      await refundHold({ holdId: hold.id, actor: { role: "system" }, idempotencyKey: `reservation:${latest.id}:ended-refund:${hold.id}` });
    } catch (err) {
      // Refunded by a concurrent caller already (the hold is no longer held): that is the outcome we wanted.
      if (!(err instanceof DomainError && err.status === 409)) throw err;
    }
  }
  return latest;
}
