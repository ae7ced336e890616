import { describe, expect, it } from "vitest";
import { reservationAmounts, settlementFor } from "./amounts";

// Hand-worked arithmetic (beside each check), with the deposit share of 100 % from RESERVATION_PARAMETERS (a
// product choice) and the rule from the brief: a farmer never pays for a fish not received.

describe("reservation total and deposit", () => {
  it("holds the whole price: 500 fish × ZMW 1.50 = ZMW 750.00", () => {
    expect(reservationAmounts(500, 150)).toEqual({ totalMinor: 75_000, depositMinor: 75_000 });
    // JPY has no minor digits: 120 fish at ¥35 = ¥4 200.
    expect(reservationAmounts(120, 35)).toEqual({ totalMinor: 4_200, depositMinor: 4_200 });
  });

  it("refuses counts and prices that are not whole and positive", () => {
    expect(() => reservationAmounts(0, 150)).toThrow(RangeError);
    expect(() => reservationAmounts(2.5, 150)).toThrow(RangeError);
    expect(() => reservationAmounts(10, 0)).toThrow(RangeError);
    expect(() => reservationAmounts(10, 1.5)).toThrow(RangeError);
  });
});

describe("settling a deposit pro rata to the fish handed over", () => {
  it("rounds the hatchery's share down, so any fraction of a minor unit goes back to the farmer", () => {
    // 750.00 for 500 fish, 480 handed over: 750.00 × 480/500 = 720.00, 30.00 back.
    expect(settlementFor(75_000, 500, 480)).toEqual({ releaseMinor: 72_000, returnMinor: 3_000 });
    // 10.01 for 3 fish, 2 handed over: 1001 × 2/3 = 667.33…, so 667 to the hatchery and 334 back.
    expect(settlementFor(1001, 3, 2)).toEqual({ releaseMinor: 667, returnMinor: 334 });
    expect(settlementFor(1001, 3, 3)).toEqual({ releaseMinor: 1001, returnMinor: 0 });
    expect(settlementFor(1001, 3, 0)).toEqual({ releaseMinor: 0, returnMinor: 1001 });
  });

  it("refuses more fish handed over than reserved", () => {
    expect(() => settlementFor(1001, 3, 4)).toThrow(RangeError);
    expect(() => settlementFor(1001, 3, -1)).toThrow(RangeError);
  });
});
