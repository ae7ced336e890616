import { describe, expect, it } from "vitest";
import { HOLD_ACTORS, HOLD_EVENTS, HOLD_STATES, holdTransition, newHold, type DepositHold, type HoldActor, type HoldEffect, type HoldEvent, type HoldState } from "./hold-state";

// The oracle is the brief for this machine ("pending → held → released | refunded | partially released; frozen
// while disputed"), the processor contract in lib/payments/processor.ts (release = capture, cancel = return) and
// card authorisations lapsing on their own (Stripe, "Place a hold on a payment method": 7 days for most online
// card payments). The table below is written out by hand from those, not read from HOLD_RULES.

const AMOUNT = 75_000; // ZMW 750.00
const PART = 60_000; // ZMW 600.00 released, so ZMW 150.00 goes back

function holdIn(state: HoldState): DepositHold {
  const base = { holdId: "h1", currency: "ZMW", amountMinor: AMOUNT, state, heldMinor: 0, releasedMinor: 0, returnedMinor: 0 };
  switch (state) {
    case "held":
    case "frozen":
      return { ...base, heldMinor: AMOUNT };
    case "released":
      return { ...base, releasedMinor: AMOUNT };
    case "partially_released":
      return { ...base, releasedMinor: PART, returnedMinor: AMOUNT - PART };
    case "refunded":
    case "expired":
      return { ...base, returnedMinor: AMOUNT };
    default:
      return base;
  }
}

const SAMPLES: Record<string, HoldEvent> = {
  authorize: { type: "authorize", amountMinor: AMOUNT, currency: "ZMW" },
  fail: { type: "fail" },
  void: { type: "void" },
  "release all": { type: "release", amountMinor: AMOUNT },
  "release part": { type: "release", amountMinor: PART },
  refund: { type: "refund" },
  freeze: { type: "freeze" },
  "resolve for farmer": { type: "resolve", outcome: "for_farmer" },
  "resolve for provider, all": { type: "resolve", outcome: "for_provider", amountMinor: AMOUNT },
  "resolve for provider, part": { type: "resolve", outcome: "for_provider", amountMinor: PART },
  expire: { type: "expire" },
};

const ledgerHold = { kind: "ledger", movement: { kind: "hold", holdId: "h1", currency: "ZMW", amountMinor: AMOUNT } } as const;
const ledgerRefund = { kind: "ledger", movement: { kind: "refund", holdId: "h1", currency: "ZMW", amountMinor: AMOUNT } } as const;
const ledgerRelease = (releaseMinor: number) =>
  ({ kind: "ledger", movement: { kind: "release", holdId: "h1", currency: "ZMW", releaseMinor, returnMinor: AMOUNT - releaseMinor } }) as const;
const capture = (amountMinor: number) => ({ kind: "processor", call: "release", amountMinor }) as const;
const cancelHold = { kind: "processor", call: "cancel_hold" } as const;

interface Expected {
  actors: HoldActor[];
  next: HoldState;
  /** heldMinor, releasedMinor, returnedMinor after the move */
  amounts: [number, number, number];
  effects: HoldEffect[];
}

/** Every legal (state, event); anything not listed must be refused. */
const EXPECTED: Record<string, Expected> = {
  "pending authorize": { actors: ["system"], next: "held", amounts: [AMOUNT, 0, 0], effects: [ledgerHold] },
  "pending fail": { actors: ["system"], next: "failed", amounts: [0, 0, 0], effects: [] },
  "pending void": { actors: ["farmer", "provider", "system"], next: "voided", amounts: [0, 0, 0], effects: [cancelHold] },
  "held release all": { actors: ["farmer", "system"], next: "released", amounts: [0, AMOUNT, 0], effects: [capture(AMOUNT), ledgerRelease(AMOUNT)] },
  "held release part": {
    actors: ["farmer", "system"],
    next: "partially_released",
    amounts: [0, PART, AMOUNT - PART],
    effects: [capture(PART), ledgerRelease(PART)],
  },
  "held refund": { actors: ["farmer", "provider", "admin", "system"], next: "refunded", amounts: [0, 0, AMOUNT], effects: [cancelHold, ledgerRefund] },
  "held freeze": { actors: ["farmer", "admin"], next: "frozen", amounts: [AMOUNT, 0, 0], effects: [] },
  "held expire": { actors: ["system"], next: "expired", amounts: [0, 0, AMOUNT], effects: [ledgerRefund] },
  "frozen resolve for farmer": { actors: ["admin"], next: "refunded", amounts: [0, 0, AMOUNT], effects: [cancelHold, ledgerRefund] },
  "frozen resolve for provider, all": { actors: ["admin"], next: "released", amounts: [0, AMOUNT, 0], effects: [capture(AMOUNT), ledgerRelease(AMOUNT)] },
  "frozen resolve for provider, part": {
    actors: ["admin"],
    next: "partially_released",
    amounts: [0, PART, AMOUNT - PART],
    effects: [capture(PART), ledgerRelease(PART)],
  },
  "frozen expire": { actors: ["system"], next: "expired", amounts: [0, 0, AMOUNT], effects: [ledgerRefund] },
};

describe("deposit hold state machine: the whole state × event × actor space", () => {
  it("samples every event type the machine has", () => {
    expect(new Set(Object.values(SAMPLES).map((e) => e.type))).toEqual(new Set(HOLD_EVENTS));
  });

  const cases = HOLD_STATES.flatMap((state) => Object.keys(SAMPLES).flatMap((sample) => HOLD_ACTORS.map((actor) => ({ state, sample, actor }))));

  it(`checks all ${HOLD_STATES.length} × ${Object.keys(SAMPLES).length} × ${HOLD_ACTORS.length} combinations`, () => {
    let legal = 0;
    for (const { state, sample, actor } of cases) {
      const event = SAMPLES[sample];
      if (!event) throw new Error(`no sample ${sample}`);
      const expected = EXPECTED[`${state} ${sample}`];
      const result = holdTransition(holdIn(state), event, actor);
      const label = `${state} + ${sample} by ${actor}`;
      if (expected && expected.actors.includes(actor)) {
        legal++;
        expect(result, label).toMatchObject({ ok: true });
        if (!result.ok) continue;
        expect(result.next.state, label).toBe(expected.next);
        expect([result.next.heldMinor, result.next.releasedMinor, result.next.returnedMinor], label).toEqual(expected.amounts);
        expect(result.effects, label).toEqual(expected.effects);
      } else {
        expect(result, label).toMatchObject({ ok: false, reason: expected ? "forbidden_actor" : "illegal_transition" });
      }
    }
    // 1+1+3 from pending, 2+2+4+2+1 from held, 1+1+1+1 from frozen
    expect(legal).toBe(20);
  });
});

describe("deposit hold guards", () => {
  it("holds exactly what was asked for, in the asked currency", () => {
    const pending = holdIn("pending");
    expect(holdTransition(pending, { type: "authorize", amountMinor: AMOUNT - 1, currency: "ZMW" }, "system")).toMatchObject({ ok: false, reason: "amount_mismatch" });
    expect(holdTransition(pending, { type: "authorize", amountMinor: AMOUNT, currency: "USD" }, "system")).toMatchObject({ ok: false, reason: "currency_mismatch" });
  });

  it("releases between one minor unit and everything held", () => {
    const held = holdIn("held");
    for (const amountMinor of [0, -1, AMOUNT + 1, 1.5, Number.NaN]) {
      expect(holdTransition(held, { type: "release", amountMinor }, "farmer"), String(amountMinor)).toMatchObject({ ok: false, reason: "invalid_amount" });
    }
    const one = holdTransition(held, { type: "release", amountMinor: 1 }, "farmer");
    expect(one.ok && [one.next.state, one.next.releasedMinor, one.next.returnedMinor]).toEqual(["partially_released", 1, AMOUNT - 1]);
    expect(holdTransition(holdIn("frozen"), { type: "resolve", outcome: "for_provider", amountMinor: 0 }, "admin")).toMatchObject({ ok: false, reason: "invalid_amount" });
  });

  it("refuses to create a hold that cannot be booked", () => {
    expect(() => newHold({ holdId: "h", currency: "ZMW", amountMinor: 0 })).toThrow(RangeError);
    expect(() => newHold({ holdId: "h", currency: "zmw", amountMinor: 100 })).toThrow(RangeError);
    expect(() => newHold({ holdId: "", currency: "ZMW", amountMinor: 100 })).toThrow(RangeError);
    expect(newHold({ holdId: "h", currency: "ZMW", amountMinor: 100 })).toEqual({
      holdId: "h",
      currency: "ZMW",
      amountMinor: 100,
      state: "pending",
      heldMinor: 0,
      releasedMinor: 0,
      returnedMinor: 0,
    });
  });
});
