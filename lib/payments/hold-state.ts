import { isCurrencyCode } from "@/lib/money/money";
import type { LedgerMovement } from "./ledger";

/*
 * The deposit hold as a pure state machine (CONVENTIONS habit 6). The caller stores the snapshot, writes a
 * history row per move, and carries out the effects: ledger movements (lib/payments/ledger.ts entriesFor)
 * and processor calls (lib/payments/processor.ts: release = capture, cancel_hold = give the authorisation back).
 *
 *   pending ──authorize──▶ held ──release (all)────▶ released
 *      │                    │  ──release (part)───▶ partially_released   (the rest goes back to the farmer)
 *      │                    │  ──refund───────────▶ refunded
 *      │                    │  ──expire───────────▶ expired
 *      │                    └──freeze──▶ frozen ──resolve for_farmer──▶ refunded
 *      │                                        ──resolve for_provider─▶ released | partially_released
 *      │                                        ──expire──────────────▶ expired
 *      ├──fail──▶ failed
 *      └──void──▶ voided
 *
 * `frozen` is a dispute: only an admin's resolution (or the processor letting the authorisation lapse) moves it.
 * `expired` is not in the brief: card authorisations lapse on the network's schedule (Stripe's "Place a hold on
 * a payment method" page gives 7 days for most customer-initiated online card payments), and the processor then
 * returns the money without being asked. The machine records that instead of pretending the money is still held.
 */

export const HOLD_STATES = ["pending", "held", "frozen", "released", "partially_released", "refunded", "failed", "voided", "expired"] as const;
export type HoldState = (typeof HOLD_STATES)[number];

export const HOLD_EVENTS = ["authorize", "fail", "void", "release", "refund", "freeze", "resolve", "expire"] as const;
export type HoldEventType = (typeof HOLD_EVENTS)[number];

/** Who moves a hold. `provider` is the hatchery or builder being paid. */
export const HOLD_ACTORS = ["farmer", "provider", "admin", "system"] as const;
export type HoldActor = (typeof HOLD_ACTORS)[number];

export const FINAL_HOLD_STATES: readonly HoldState[] = ["released", "partially_released", "refunded", "failed", "voided", "expired"];

export interface DepositHold {
  holdId: string;
  currency: string;
  /** what the farmer is asked to pay */
  amountMinor: number;
  state: HoldState;
  /** held now: amountMinor from authorisation until settlement, 0 before and after */
  heldMinor: number;
  /** settled to the provider */
  releasedMinor: number;
  /** given back to the farmer (refund, expiry, or the remainder of a partial release) */
  returnedMinor: number;
}

export type HoldEvent =
  /** the processor confirmed the authorisation, for this amount and currency */
  | { type: "authorize"; amountMinor: number; currency: string }
  /** the processor declined the authorisation */
  | { type: "fail" }
  /** give up a payment that was never authorised (the reservation or job ended first) */
  | { type: "void" }
  /** settle to the provider; less than held is a partial release and the rest returns to the farmer */
  | { type: "release"; amountMinor: number }
  /** give everything held back to the farmer */
  | { type: "refund" }
  /** a dispute is open: nothing moves until an admin resolves it */
  | { type: "freeze" }
  | { type: "resolve"; outcome: "for_farmer" }
  | { type: "resolve"; outcome: "for_provider"; amountMinor: number }
  /** the processor reports the authorisation lapsed and the money went back */
  | { type: "expire" };

export type HoldEffect =
  | { kind: "ledger"; movement: LedgerMovement }
  /** capture `amountMinor` of the authorisation (the processor returns any remainder itself) */
  | { kind: "processor"; call: "release"; amountMinor: number }
  /** cancel the authorisation or the unfinished payment */
  | { kind: "processor"; call: "cancel_hold" };

export type HoldRefusal =
  | "illegal_transition"
  | "forbidden_actor"
  | "amount_mismatch"
  | "currency_mismatch"
  | "invalid_amount";

export type HoldTransitionResult =
  | { ok: true; next: DepositHold; effects: HoldEffect[] }
  | { ok: false; reason: HoldRefusal; message: string };

/**
 * From which states each event may fire, and who may fire it there. A provider can never release money to
 * itself, and only an admin can move a frozen hold. Refund is open to every party because each has a
 * legitimate path to it (the farmer or provider cancelling before delivery, an admin, or the system
 * returning a payment that arrived after its reservation lapsed); the reservation and job machines decide when.
 */
export const HOLD_RULES: { readonly [E in HoldEventType]: Readonly<Partial<Record<HoldState, readonly HoldActor[]>>> } = {
  authorize: { pending: ["system"] },
  fail: { pending: ["system"] },
  void: { pending: ["farmer", "provider", "system"] },
  release: { held: ["farmer", "system"] },
  refund: { held: ["farmer", "provider", "admin", "system"] },
  freeze: { held: ["farmer", "admin"] },
  resolve: { frozen: ["admin"] },
  expire: { held: ["system"], frozen: ["system"] },
};

/** A new hold, before the farmer has paid. */
export function newHold(input: { holdId: string; currency: string; amountMinor: number }): DepositHold {
  if (!input.holdId) throw new RangeError("A hold needs an id");
  if (!isCurrencyCode(input.currency)) throw new RangeError(`Not an ISO 4217 currency code: ${input.currency}`);
  if (!Number.isSafeInteger(input.amountMinor) || input.amountMinor <= 0) {
    throw new RangeError(`A hold amount must be a positive integer count of minor units, got ${input.amountMinor}`);
  }
  return { ...input, state: "pending", heldMinor: 0, releasedMinor: 0, returnedMinor: 0 };
}

const refuse = (reason: HoldRefusal, message: string): HoldTransitionResult => ({ ok: false, reason, message });

function settleToProvider(hold: DepositHold, amountMinor: number): HoldTransitionResult {
  if (!Number.isSafeInteger(amountMinor) || amountMinor < 1 || amountMinor > hold.heldMinor) {
    return refuse("invalid_amount", `Release between 1 and ${hold.heldMinor} minor units, not ${amountMinor}`);
  }
  const returnMinor = hold.heldMinor - amountMinor;
  return {
    ok: true,
    next: {
      ...hold,
      state: returnMinor === 0 ? "released" : "partially_released",
      heldMinor: 0,
      releasedMinor: amountMinor,
      returnedMinor: hold.returnedMinor + returnMinor,
    },
    effects: [
      { kind: "processor", call: "release", amountMinor },
      { kind: "ledger", movement: { kind: "release", holdId: hold.holdId, currency: hold.currency, releaseMinor: amountMinor, returnMinor } },
    ],
  };
}

function returnToFarmer(hold: DepositHold, state: "refunded" | "expired", callProcessor: boolean): HoldTransitionResult {
  const effects: HoldEffect[] = callProcessor ? [{ kind: "processor", call: "cancel_hold" }] : [];
  effects.push({ kind: "ledger", movement: { kind: "refund", holdId: hold.holdId, currency: hold.currency, amountMinor: hold.heldMinor } });
  return {
    ok: true,
    next: { ...hold, state, heldMinor: 0, returnedMinor: hold.returnedMinor + hold.heldMinor },
    effects,
  };
}

export function holdTransition(hold: DepositHold, event: HoldEvent, actor: HoldActor): HoldTransitionResult {
  const allowed = HOLD_RULES[event.type][hold.state];
  if (!allowed) return refuse("illegal_transition", `A ${hold.state} hold cannot take "${event.type}"`);
  if (!allowed.includes(actor)) return refuse("forbidden_actor", `"${event.type}" on a ${hold.state} hold is not for the ${actor}`);

  switch (event.type) {
    case "authorize": {
      if (event.currency !== hold.currency) return refuse("currency_mismatch", `Authorised in ${event.currency}, hold is in ${hold.currency}`);
      // The processor may only ever hold what we asked for; anything else is a bug or tampering, never "close enough".
      if (event.amountMinor !== hold.amountMinor) return refuse("amount_mismatch", `Authorised ${event.amountMinor}, asked for ${hold.amountMinor}`);
      return {
        ok: true,
        next: { ...hold, state: "held", heldMinor: hold.amountMinor },
        effects: [{ kind: "ledger", movement: { kind: "hold", holdId: hold.holdId, currency: hold.currency, amountMinor: hold.amountMinor } }],
      };
    }
    case "fail":
      return { ok: true, next: { ...hold, state: "failed" }, effects: [] };
    case "void":
      return { ok: true, next: { ...hold, state: "voided" }, effects: [{ kind: "processor", call: "cancel_hold" }] };
    case "release":
      return settleToProvider(hold, event.amountMinor);
    case "refund":
      return returnToFarmer(hold, "refunded", true);
    case "freeze":
      return { ok: true, next: { ...hold, state: "frozen" }, effects: [] };
    case "resolve":
      return event.outcome === "for_farmer" ? returnToFarmer(hold, "refunded", true) : settleToProvider(hold, event.amountMinor);
    case "expire":
      // The network already gave the money back; there is nothing to ask the processor.
      return returnToFarmer(hold, "expired", false);
  }
}
