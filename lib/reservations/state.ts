import { isCurrencyCode } from "@/lib/money/money";
import type { HoldActor, HoldEvent } from "@/lib/payments/hold-state";
import { reservationAmounts, settlementFor } from "./amounts";
import { RESERVATION_PARAMETERS, addDays, addHours } from "./parameters";

/*
 * A farmer's claim on fish of one batch, as a pure state machine (CONVENTIONS habit 6). The caller stores the
 * snapshot, writes a history row per move (from, to, event, actor, time) and carries out the effects.
 *
 *   requested ──accept──▶ accepted ──pay_deposit──▶ deposit_held ──hand_over──▶ quarantine ──report_survival──▶ released
 *       │                    │                          │                          │  ──auto_release──────▶ released
 *       ├─decline─▶ declined │                          │                          │  ──remind_survival──▶ quarantine (day-7 e-mail, once)
 *       ├─lapse───▶ lapsed ◀─┤ lapse                    │                          │  ──refund (admin)───▶ refunded
 *       └─cancel──▶ cancelled ◀── cancel ───────────────┤ cancel                   └──dispute──▶ disputed ──resolve_dispute for_farmer───▶ refunded
 *                                                       └─refund (admin)─▶ refunded                      ──resolve_dispute for_provider─▶ released
 *
 * Hand-over goes straight to quarantine: there is no separate `handed_over` state or `start_quarantine` event.
 * Quarantine starts the moment the fish change hands, so a separate system step would only open a window in
 * which a crash leaves fish delivered but the clock not started (and a farmer unable to dispute). The
 * "handed over" step the farmer sees is the hand_over history row (handedOverAt, handedOverCount).
 *
 * Stock goes back to the batch on decline, lapse, cancel and an admin refund before hand-over: all of them end the
 * reservation (final states), so it can happen once at most along any path.
 */

export const RESERVATION_STATES = [
  "requested",
  "accepted",
  "deposit_held",
  "quarantine",
  "released",
  "cancelled",
  "declined",
  "lapsed",
  "disputed",
  "refunded",
] as const;
export type ReservationState = (typeof RESERVATION_STATES)[number];

export const FINAL_RESERVATION_STATES: readonly ReservationState[] = ["released", "cancelled", "declined", "lapsed", "refunded"];

export const RESERVATION_EVENTS = [
  "accept",
  "decline",
  "pay_deposit",
  "hand_over",
  "remind_survival",
  "report_survival",
  "auto_release",
  "cancel",
  "lapse",
  "dispute",
  "resolve_dispute",
  "refund",
] as const;
export type ReservationEventType = (typeof RESERVATION_EVENTS)[number];

export const RESERVATION_ACTORS = ["farmer", "hatchery", "admin", "system"] as const;
export type ReservationActorRole = (typeof RESERVATION_ACTORS)[number];

/** The system is the sweep or a processor webhook; everyone else is a signed-in user. */
export type ReservationActor = { role: "farmer" | "hatchery" | "admin"; userId: string } | { role: "system" };

export type ReservationEvent =
  | { type: "accept" }
  | { type: "decline" }
  /** the processor confirmed the deposit hold (synchronously in the farmer's request, or by webhook) */
  | { type: "pay_deposit"; heldMinor: number; currency: string }
  /** the count actually handed over, at most the count reserved */
  | { type: "hand_over"; count: number }
  | { type: "remind_survival" }
  | { type: "report_survival"; survived: number }
  | { type: "auto_release" }
  | { type: "cancel" }
  | { type: "lapse" }
  | { type: "dispute" }
  | { type: "resolve_dispute"; outcome: "for_farmer" | "for_provider" }
  | { type: "refund" };

// The event list and the event union must name the same events.
type SameKeys<A, B> = [A] extends [B] ? ([B] extends [A] ? true : false) : false;
const eventsMatch: SameKeys<ReservationEvent["type"], ReservationEventType> = true;
void eventsMatch;

export interface Reservation {
  state: ReservationState;
  farmerId: string;
  hatcheryId: string;
  /** fish reserved (taken from the batch's available count) */
  count: number;
  currency: string;
  /** what the deposit hold is for (reservationAmounts) */
  depositMinor: number;
  requestedAt: Date;
  acceptedAt: Date | null;
  depositHeldAt: Date | null;
  handedOverAt: Date | null;
  handedOverCount: number | null;
  survivalReminderSentAt: Date | null;
  survivedCount: number | null;
}

export type ReservationMailTemplate =
  | "reservation-requested"
  | "reservation-accepted"
  | "reservation-declined"
  | "reservation-deposit-held"
  | "reservation-handed-over"
  | "reservation-survival-reminder"
  | "reservation-released"
  | "reservation-lapsed"
  | "reservation-cancelled"
  | "reservation-disputed"
  | "reservation-dispute-resolved"
  | "reservation-refunded";

export type ReservationMailRecipient = "farmer" | "hatchery" | "admins";

export type ReservationEffect =
  /** decrement the batch's available count (in the same transaction that checks it) */
  | { kind: "take_stock"; count: number }
  /** give the reserved fish back to the batch's available count */
  | { kind: "return_stock"; count: number }
  /** apply this event to the reservation's deposit hold (lib/payments/hold-state.ts) as this actor */
  | { kind: "hold"; event: HoldEvent; actor: HoldActor }
  /** if a payment was started and never confirmed, void it (hold event "void"); nothing to do otherwise */
  | { kind: "void_pending_hold"; actor: HoldActor }
  /** the survival figure that feeds the hatchery's trust score */
  | { kind: "record_survival"; handedOver: number; survived: number }
  | { kind: "mail"; template: ReservationMailTemplate; to: ReservationMailRecipient }
  /** when the sweep should next look at this reservation for the event */
  | { kind: "schedule"; event: "lapse" | "remind_survival" | "auto_release"; at: Date };

export type ReservationRefusal =
  | "illegal_transition"
  | "forbidden_actor"
  | "not_party"
  | "too_early"
  | "too_late"
  | "already_done"
  | "invalid_count"
  | "not_enough_stock"
  | "amount_mismatch"
  | "invalid_request";

export type ReservationResult =
  | { ok: true; next: Reservation; effects: ReservationEffect[] }
  | { ok: false; reason: ReservationRefusal; message: string };

export interface ReservationContext {
  actor: ReservationActor;
  now: Date;
}

/** Which state each event may leave, and who may fire it from there. */
export const RESERVATION_RULES: {
  readonly [E in ReservationEventType]: Readonly<Partial<Record<ReservationState, readonly ReservationActorRole[]>>>;
} = {
  accept: { requested: ["hatchery"] },
  decline: { requested: ["hatchery"] },
  // The farmer's own request when the processor answers at once; the system when it answers by webhook.
  pay_deposit: { accepted: ["farmer", "system"] },
  hand_over: { deposit_held: ["hatchery"] },
  remind_survival: { quarantine: ["system"] },
  report_survival: { quarantine: ["farmer"] },
  auto_release: { quarantine: ["system"] },
  // A hatchery answers a new request with decline, so cancel is for it only once it has accepted.
  cancel: { requested: ["farmer"], accepted: ["farmer", "hatchery"], deposit_held: ["farmer", "hatchery"] },
  lapse: { requested: ["system"], accepted: ["system"] },
  dispute: { quarantine: ["farmer"] },
  resolve_dispute: { disputed: ["admin"] },
  refund: { deposit_held: ["admin"], quarantine: ["admin"] },
};

export interface ReservationDeadlines {
  /** the hatchery must accept before this; the sweep lapses the request from this moment */
  acceptBy: Date;
  /** the deposit must be confirmed before the sweep lapses the reservation from this moment */
  payBy: Date | null;
  /** the farmer may report survival (and gets the reminder) from this moment */
  survivalReportFrom: Date | null;
  /** released automatically from this moment; disputes close at the same moment */
  autoReleaseAt: Date | null;
}

export function reservationDeadlines(r: Reservation): ReservationDeadlines {
  const p = RESERVATION_PARAMETERS;
  return {
    acceptBy: addHours(r.requestedAt, p.acceptWithinHours.value),
    payBy: r.acceptedAt ? addHours(r.acceptedAt, p.payWithinHours.value) : null,
    survivalReportFrom: r.handedOverAt ? addDays(r.handedOverAt, p.quarantineDays.value) : null,
    autoReleaseAt: r.handedOverAt ? addDays(r.handedOverAt, p.autoReleaseDays.value) : null,
  };
}

const refuse = (reason: ReservationRefusal, message: string): ReservationResult => ({ ok: false, reason, message });

function holdActorFor(actor: ReservationActor): HoldActor {
  return actor.role === "hatchery" ? "provider" : actor.role;
}

export interface ReservationRequest {
  farmerId: string;
  hatcheryId: string;
  count: number;
  /** the batch's available count as read in the same transaction that will take the stock */
  availableCount: number;
  pricePerFishMinor: number;
  currency: string;
}

/** A farmer reserves fish: the new reservation, and the stock to take in the same transaction. */
export function requestReservation(input: ReservationRequest, context: ReservationContext): ReservationResult {
  const { actor, now } = context;
  if (actor.role !== "farmer") return refuse("forbidden_actor", "Only a farmer can reserve fish");
  if (actor.userId !== input.farmerId) return refuse("not_party", "A farmer reserves for themselves only");
  if (input.farmerId === input.hatcheryId) return refuse("invalid_request", "A hatchery cannot reserve its own fish");
  if (!isCurrencyCode(input.currency)) return refuse("invalid_request", `Not an ISO 4217 currency code: ${input.currency}`);
  if (!Number.isSafeInteger(input.pricePerFishMinor) || input.pricePerFishMinor < 1) return refuse("invalid_request", "The batch has no valid price");
  if (!Number.isSafeInteger(input.count) || input.count < 1) return refuse("invalid_count", "Reserve at least one whole fish");
  if (input.count > input.availableCount) {
    return refuse("not_enough_stock", `Only ${Math.max(0, input.availableCount)} fish are available, not ${input.count}`);
  }
  const { depositMinor } = reservationAmounts(input.count, input.pricePerFishMinor);
  const next: Reservation = {
    state: "requested",
    farmerId: input.farmerId,
    hatcheryId: input.hatcheryId,
    count: input.count,
    currency: input.currency,
    depositMinor,
    requestedAt: now,
    acceptedAt: null,
    depositHeldAt: null,
    handedOverAt: null,
    handedOverCount: null,
    survivalReminderSentAt: null,
    survivedCount: null,
  };
  return {
    ok: true,
    next,
    effects: [
      { kind: "take_stock", count: input.count },
      { kind: "mail", template: "reservation-requested", to: "hatchery" },
      { kind: "schedule", event: "lapse", at: reservationDeadlines(next).acceptBy },
    ],
  };
}

/** Settle the hold for the hatchery, pro rata to the fish handed over. */
function settleForHatchery(r: Reservation, actor: HoldActor, viaDispute: boolean): ReservationEffect {
  const { releaseMinor } = settlementFor(r.depositMinor, r.count, r.handedOverCount ?? 0);
  // A deposit too small to give the hatchery even one minor unit settles as a full return.
  if (releaseMinor === 0) return { kind: "hold", actor, event: viaDispute ? { type: "resolve", outcome: "for_farmer" } : { type: "refund" } };
  const event: HoldEvent = viaDispute ? { type: "resolve", outcome: "for_provider", amountMinor: releaseMinor } : { type: "release", amountMinor: releaseMinor };
  return { kind: "hold", actor, event };
}

const mailBoth = (template: ReservationMailTemplate): ReservationEffect[] => [
  { kind: "mail", template, to: "farmer" },
  { kind: "mail", template, to: "hatchery" },
];

export function transition(current: Reservation, event: ReservationEvent, context: ReservationContext): ReservationResult {
  const { actor, now } = context;
  const allowed = RESERVATION_RULES[event.type][current.state];
  if (!allowed) return refuse("illegal_transition", `A ${current.state} reservation cannot take "${event.type}"`);
  if (!allowed.includes(actor.role)) return refuse("forbidden_actor", `"${event.type}" on a ${current.state} reservation is not for the ${actor.role}`);
  if (actor.role === "farmer" && actor.userId !== current.farmerId) return refuse("not_party", "This is another farmer's reservation");
  if (actor.role === "hatchery" && actor.userId !== current.hatcheryId) return refuse("not_party", "This reservation is for another hatchery's batch");

  const deadlines = reservationDeadlines(current);
  const at = now.getTime();
  const p = RESERVATION_PARAMETERS;

  switch (event.type) {
    case "accept": {
      // The farmer was told the request expires at acceptBy; a late accept must not revive it.
      if (at >= deadlines.acceptBy.getTime()) return refuse("too_late", "The request lapsed before it was accepted");
      return {
        ok: true,
        next: { ...current, state: "accepted", acceptedAt: now },
        effects: [
          { kind: "mail", template: "reservation-accepted", to: "farmer" },
          { kind: "schedule", event: "lapse", at: addHours(now, p.payWithinHours.value) },
        ],
      };
    }
    case "decline":
      return {
        ok: true,
        next: { ...current, state: "declined" },
        effects: [
          { kind: "return_stock", count: current.count },
          { kind: "mail", template: "reservation-declined", to: "farmer" },
        ],
      };
    case "pay_deposit": {
      // No deadline check: the money is already authorised when this arrives, and a payment that beats the sweep
      // wins. If the sweep lapsed the reservation first, this is refused as illegal and the caller refunds the hold.
      if (event.currency !== current.currency) return refuse("amount_mismatch", `Paid in ${event.currency}, reservation is in ${current.currency}`);
      if (event.heldMinor !== current.depositMinor) return refuse("amount_mismatch", `Held ${event.heldMinor}, deposit is ${current.depositMinor}`);
      return {
        ok: true,
        next: { ...current, state: "deposit_held", depositHeldAt: now },
        effects: [{ kind: "mail", template: "reservation-deposit-held", to: "hatchery" }],
      };
    }
    case "hand_over": {
      if (!Number.isSafeInteger(event.count) || event.count < 1 || event.count > current.count) {
        return refuse("invalid_count", `Hand over between 1 and ${current.count} fish, not ${event.count}`);
      }
      return {
        ok: true,
        next: { ...current, state: "quarantine", handedOverAt: now, handedOverCount: event.count },
        effects: [
          { kind: "mail", template: "reservation-handed-over", to: "farmer" },
          { kind: "schedule", event: "remind_survival", at: addDays(now, p.quarantineDays.value) },
          { kind: "schedule", event: "auto_release", at: addDays(now, p.autoReleaseDays.value) },
        ],
      };
    }
    case "remind_survival": {
      if (deadlines.survivalReportFrom && at < deadlines.survivalReportFrom.getTime()) return refuse("too_early", "The quarantine week is not over");
      if (current.survivalReminderSentAt) return refuse("already_done", "The day-7 reminder was already sent");
      return {
        ok: true,
        next: { ...current, survivalReminderSentAt: now },
        effects: [{ kind: "mail", template: "reservation-survival-reminder", to: "farmer" }],
      };
    }
    case "report_survival": {
      // Still taken after autoReleaseAt if the sweep has not run: the outcome is the same release, plus the survival figure.
      if (deadlines.survivalReportFrom && at < deadlines.survivalReportFrom.getTime()) {
        return refuse("too_early", `Report survival from day ${p.quarantineDays.value} after hand-over`);
      }
      const handedOver = current.handedOverCount ?? 0;
      if (!Number.isSafeInteger(event.survived) || event.survived < 0 || event.survived > handedOver) {
        return refuse("invalid_count", `Survivors must be between 0 and the ${handedOver} fish handed over, not ${event.survived}`);
      }
      return {
        ok: true,
        next: { ...current, state: "released", survivedCount: event.survived },
        effects: [
          settleForHatchery(current, holdActorFor(actor), false),
          { kind: "record_survival", handedOver, survived: event.survived },
          ...mailBoth("reservation-released"),
        ],
      };
    }
    case "auto_release": {
      if (deadlines.autoReleaseAt && at < deadlines.autoReleaseAt.getTime()) return refuse("too_early", "The release window is still open");
      return {
        ok: true,
        next: { ...current, state: "released" },
        effects: [settleForHatchery(current, "system", false), ...mailBoth("reservation-released")],
      };
    }
    case "cancel": {
      const effects: ReservationEffect[] = [{ kind: "return_stock", count: current.count }];
      if (current.state === "accepted") effects.push({ kind: "void_pending_hold", actor: holdActorFor(actor) });
      if (current.state === "deposit_held") effects.push({ kind: "hold", event: { type: "refund" }, actor: holdActorFor(actor) });
      effects.push({ kind: "mail", template: "reservation-cancelled", to: actor.role === "farmer" ? "hatchery" : "farmer" });
      return { ok: true, next: { ...current, state: "cancelled" }, effects };
    }
    case "lapse": {
      const due = current.state === "requested" ? deadlines.acceptBy : deadlines.payBy;
      if (due && at < due.getTime()) return refuse("too_early", `Nothing lapses before ${due.toISOString()}`);
      const effects: ReservationEffect[] = [{ kind: "return_stock", count: current.count }];
      if (current.state === "accepted") effects.push({ kind: "void_pending_hold", actor: "system" });
      effects.push(...mailBoth("reservation-lapsed"));
      return { ok: true, next: { ...current, state: "lapsed" }, effects };
    }
    case "dispute": {
      if (deadlines.autoReleaseAt && at >= deadlines.autoReleaseAt.getTime()) return refuse("too_late", "The dispute window closed when the hold was due for release");
      return {
        ok: true,
        next: { ...current, state: "disputed" },
        effects: [
          { kind: "hold", event: { type: "freeze" }, actor: "farmer" },
          { kind: "mail", template: "reservation-disputed", to: "hatchery" },
          { kind: "mail", template: "reservation-disputed", to: "admins" },
        ],
      };
    }
    case "resolve_dispute": {
      if (event.outcome === "for_farmer") {
        return {
          ok: true,
          next: { ...current, state: "refunded" },
          effects: [{ kind: "hold", event: { type: "resolve", outcome: "for_farmer" }, actor: "admin" }, ...mailBoth("reservation-dispute-resolved")],
        };
      }
      return {
        ok: true,
        next: { ...current, state: "released" },
        effects: [settleForHatchery(current, "admin", true), ...mailBoth("reservation-dispute-resolved")],
      };
    }
    case "refund": {
      const effects: ReservationEffect[] = [];
      // Before hand-over the fish are still at the hatchery, so they go back on sale.
      if (current.state === "deposit_held") effects.push({ kind: "return_stock", count: current.count });
      effects.push({ kind: "hold", event: { type: "refund" }, actor: "admin" }, ...mailBoth("reservation-refunded"));
      return { ok: true, next: { ...current, state: "refunded" }, effects };
    }
  }
}
