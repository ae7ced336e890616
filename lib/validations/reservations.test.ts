import { describe, expect, it } from "vitest";
import { batchFormSchema, reserveSchema, reservationListQuerySchema } from "./reservations";

// The price check follows each currency's minor unit in ISO 4217's list (ZMW and USD 2 digits, JPY 0, BHD 3),
// as the runtime's Intl data gives it (lib/money/money.ts minorDigits).
const base = { species: "tilapia", meanWeightG: "5", meanLengthCm: "6", countAvailable: "1000", currency: "ZMW", readyFrom: "2030-03-01", sellBy: "2030-03-31", delivery: "pickup" };

describe("the batch form schema", () => {
  it("turns typed text into numbers and the price into minor units", () => {
    const v = batchFormSchema.parse({ ...base, pricePerFish: "1,50" });
    expect(v).toMatchObject({ meanWeightG: 5, countAvailable: 1000, pricePerFish: 1.5, priceMinor: 150 });
  });

  it("allows as many decimals as the currency's minor unit, and no more (ISO 4217)", () => {
    expect(batchFormSchema.safeParse({ ...base, pricePerFish: "1.505" }).success).toBe(false);
    expect(batchFormSchema.parse({ ...base, currency: "BHD", pricePerFish: "1.505" }).priceMinor).toBe(1505);
    expect(batchFormSchema.safeParse({ ...base, currency: "JPY", pricePerFish: "1.5" }).success).toBe(false);
    expect(batchFormSchema.parse({ ...base, currency: "JPY", pricePerFish: "15" }).priceMinor).toBe(15);
  });

  it("names the field for bad input", () => {
    const r = batchFormSchema.safeParse({ ...base, pricePerFish: "1", countAvailable: "12.5", sellBy: "2030-02-01", currency: "ZZZ" });
    expect(r.success).toBe(false);
    const paths = r.success ? [] : r.error.issues.map((i) => i.path.join("."));
    expect(paths).toEqual(expect.arrayContaining(["countAvailable", "currency"]));
    const dates = batchFormSchema.safeParse({ ...base, pricePerFish: "1", sellBy: "2030-02-01" });
    expect(dates.success ? [] : dates.error.issues.map((i) => i.path.join("."))).toEqual(["sellBy"]);
  });

  it("refuses a malformed currency code as a field issue, not a crash (found by tests/e2e/fuzz.spec.ts)", () => {
    // ECMA-402 (Intl.NumberFormat) throws a RangeError for a currency that is not 3 ASCII letters; the price
    // check must not reach it. "ZZZ" is well-formed for Intl, so only the ISO 4217 list check refuses it.
    for (const currency of ["", "ðãâ", "12", "zmw ", "ZMWX"]) {
      const r = batchFormSchema.safeParse({ ...base, pricePerFish: "1.50", currency });
      expect(r.success, currency).toBe(false);
      expect(r.success ? [] : r.error.issues.map((i) => i.path.join(".")), currency).toEqual(["currency"]);
    }
  });
});

describe("reserving and listing", () => {
  it("takes whole fish only", () => {
    expect(reserveSchema.safeParse({ batchId: "b", count: "0", handoverMethod: "pickup" }).success).toBe(false);
    expect(reserveSchema.safeParse({ batchId: "b", count: "2.5", handoverMethod: "pickup" }).success).toBe(false);
    expect(reserveSchema.parse({ batchId: "b", count: " 40 ", handoverMethod: "delivery" }).count).toBe(40);
  });

  it("fills list defaults and bounds the page size", () => {
    expect(reservationListQuerySchema.parse({})).toMatchObject({ as: "farmer", state: "all", sort: "requestedAt", dir: "desc", page: 1, pageSize: 10 });
    expect(reservationListQuerySchema.safeParse({ pageSize: "1000" }).success).toBe(false);
  });
});
