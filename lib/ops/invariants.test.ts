import { describe, expect, it } from "vitest";
import { entriesFor } from "@/lib/payments/ledger";
import { acknowledgementProblems, holdProblems, nearestRank, stockProblems, type Acknowledgement, type FoundReservation } from "./invariants";

describe("nearestRank", () => {
  it("matches the nearest-rank worked example", () => {
    // The nearest-rank method's worked example (Wikipedia, "Percentile", from memory): for 15, 20, 35, 40, 50 the
    // 5th percentile is 15, the 30th 20, the 40th 20, the 50th 35 and the 100th 50.
    const sorted = [15, 20, 35, 40, 50];
    expect([5, 30, 40, 50, 100].map((p) => nearestRank(sorted, p))).toEqual([15, 20, 20, 35, 50]);
    expect(nearestRank([], 50)).toBeNaN();
  });
});

describe("stockProblems", () => {
  // Worked by hand: a batch of 500 with live reservations of 120 and 30 and a cancelled one of 80 (fish given
  // back) has 500 − (120 + 30) = 350 fish on offer.
  const reservations = [
    { batchId: "b", count: 120, stockReturned: false },
    { batchId: "b", count: 80, stockReturned: true },
    { batchId: "b", count: 30, stockReturned: false },
  ];

  it("accepts a batch whose stock is what its live reservations leave", () => {
    expect(stockProblems([{ id: "b", countTotal: 500, countAvailable: 350 }], reservations)).toEqual([]);
  });

  it("names a batch that counts the cancelled fish twice, one below zero and one above its total", () => {
    expect(stockProblems([{ id: "b", countTotal: 500, countAvailable: 430 }], reservations)).toEqual([{ kind: "stock_mismatch", batchId: "b", countTotal: 500, countAvailable: 430, heldByReservations: 150 }]);
    expect(stockProblems([{ id: "z", countTotal: 10, countAvailable: -1 }], []).map((p) => p.kind)).toEqual(["below_zero", "stock_mismatch"]);
    expect(stockProblems([{ id: "z", countTotal: 10, countAvailable: 11 }], []).map((p) => p.kind)).toEqual(["above_total", "stock_mismatch"]);
  });
});

describe("holdProblems", () => {
  // A deposit of ZMW 150.00 (15 000 ngwee, ISO 4217: two minor digits) authorised, then settled for 400 of 500 fish:
  // 15 000 × 400 / 500 = 12 000 released to the hatchery and 3 000 returned, in one capture of 12 000. Stripe
  // releases the rest of an authorisation captured for less ("Place a hold on a payment method", from memory), so
  // the processor ends with 12 000 received and nothing capturable.
  const legs = [
    ...entriesFor({ kind: "hold", holdId: "h", currency: "ZMW", amountMinor: 15_000 }),
    ...entriesFor({ kind: "release", holdId: "h", currency: "ZMW", releaseMinor: 12_000, returnMinor: 3_000 }),
  ];
  const settled = { id: "h", currency: "ZMW", state: "partially_released", heldMinor: 0, releasedMinor: 12_000 };
  const processor = new Map([["h", { amountCapturable: 0, amountReceived: 12_000, amountRefunded: 0 }]]);

  it("accepts balanced legs that agree with the hold and the processor", () => {
    expect(holdProblems([settled], legs, processor)).toEqual([]);
  });

  it("names a hold whose columns or processor record disagree with its legs", () => {
    expect(holdProblems([{ ...settled, heldMinor: 15_000 }], legs)).toEqual([{ kind: "holding_mismatch", holdId: "h", ledgerMinor: 0, heldMinor: 15_000 }]);
    // Never captured: the processor still has the whole authorisation, the ledger says 12 000 went to the hatchery.
    expect(holdProblems([settled], legs, new Map([["h", { amountCapturable: 15_000, amountReceived: 0, amountRefunded: 0 }]]))).toEqual([
      { kind: "processor_mismatch", holdId: "h", processorMinor: 15_000, ledgerMinor: 12_000 },
    ]);
  });

  it("names a leg lost in a crash and legs of a hold that does not exist", () => {
    const kinds = holdProblems([settled], legs.slice(0, -1)).map((p) => (p.kind === "ledger" ? p.problem.kind : p.kind));
    expect(kinds).toContain("unbalanced_hold");
    expect(holdProblems([], legs).map((p) => p.kind)).toEqual(["orphan_legs"]);
  });
});

describe("acknowledgementProblems", () => {
  const ack: Acknowledgement = { reservationId: "r", farmerId: "f", batchId: "b", count: 12, step: "paid", inDoubt: null };
  const row: FoundReservation = { id: "r", farmerId: "f", batchId: "b", count: 12, state: "deposit_held", stockReturned: false, depositMinor: 1_800, holds: [{ state: "held", heldMinor: 1_800, queued: false }] };

  it("accepts a paid reservation with its deposit held, and a step in doubt that happened", () => {
    expect(acknowledgementProblems([ack], new Map([["r", row]]))).toEqual([]);
    const cancelled = { ...row, state: "cancelled", stockReturned: true, holds: [{ state: "held", heldMinor: 1_800, queued: true }] };
    expect(acknowledgementProblems([{ ...ack, inDoubt: "cancelled" }], new Map([["r", cancelled]]))).toEqual([]);
  });

  it("names a lost reservation, a state behind what the client saw, and a cancel that kept the fish", () => {
    expect(acknowledgementProblems([ack], new Map())).toEqual([{ kind: "lost", reservationId: "r", step: "paid" }]);
    expect(acknowledgementProblems([ack], new Map([["r", { ...row, state: "accepted", holds: [] }]]))).toEqual([{ kind: "wrong_state", reservationId: "r", step: "paid", state: "accepted", allowed: ["deposit_held"] }]);
    expect(acknowledgementProblems([{ ...ack, step: "cancelled" }], new Map([["r", { ...row, state: "cancelled", holds: [{ state: "refunded", heldMinor: 0, queued: false }] }]]))).toEqual([
      { kind: "stock_not_returned", reservationId: "r" },
    ]);
    expect(acknowledgementProblems([ack], new Map([["r", { ...row, holds: [{ state: "pending", heldMinor: 0, queued: false }] }]]))).toEqual([{ kind: "deposit_not_held", reservationId: "r", state: "deposit_held" }]);
  });
});
