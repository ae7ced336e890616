import { describe, expect, it } from "vitest";
import { estimateFromPriceSheet, lineTotalMinor, priceQuote, travelMinor, type QuoteInput } from "./quote";

// Every expected amount below is worked by hand (the arithmetic sits beside it) and was checked with Python's
// decimal module, which rounds exactly; the rounding rule is half up on the final minor amount.

describe("line totals: quantity × unit price, half up to the minor unit", () => {
  it("rounds exact halves up and everything else to the nearest minor unit", () => {
    expect(lineTotalMinor(0.5, 1)).toBe(1); // 0.5 → 1
    expect(lineTotalMinor(1.5, 3)).toBe(5); // 4.5 → 5
    expect(lineTotalMinor(0.3333, 3)).toBe(1); // 0.9999 → 1
    expect(lineTotalMinor(2.5, 30_000)).toBe(75_000); // 2.5 days at ZMW 300.00
  });

  it("takes the quantity to 4 decimals first, so binary fractions do not move a line", () => {
    // 2.675 is stored as 2.67499999999999982… (the case the Python tutorial uses for round(2.675, 2) = 2.67);
    // as the builder typed it, 2.675 × 100 = 267.5 → 268.
    expect(lineTotalMinor(2.675, 100)).toBe(268);
    // 0.1 + 0.2 is 0.30000000000000004 in doubles; as a quantity it is 0.3, and 0.3 × 100 = 30.
    expect(lineTotalMinor(0.1 + 0.2, 100)).toBe(30);
    // 1.00005 → 1.0001 (half up at the 5th decimal), × 10 000 = 10 001.
    expect(lineTotalMinor(1.00005, 10_000)).toBe(10_001);
  });

  it("works the same in a currency without minor digits (JPY: minor unit = 1 yen)", () => {
    expect(lineTotalMinor(2.5, 1001)).toBe(2503); // 2 502.5 → 2 503
  });

  it("refuses quantities that are not positive and prices that are not whole minor units", () => {
    expect(() => lineTotalMinor(0, 100)).toThrow(RangeError);
    expect(() => lineTotalMinor(-1, 100)).toThrow(RangeError);
    expect(() => lineTotalMinor(Number.NaN, 100)).toThrow(RangeError);
    expect(() => lineTotalMinor(1, 10.5)).toThrow(RangeError);
    expect(() => lineTotalMinor(1, -1)).toThrow(RangeError);
  });
});

describe("travel: one-way metres × rate per km", () => {
  it("rounds the distance to whole metres, then the amount half up", () => {
    expect(travelMinor(12_345, 500)).toBe(6173); // 12.345 km × 5.00 = 61.725 → 61.73
    expect(travelMinor(1500, 333)).toBe(500); // 1.5 km × 3.33 = 4.995 → 5.00
    expect(travelMinor(999.4, 1000)).toBe(999); // 999 m × 10.00/km = 9.99
    expect(travelMinor(0, 1000)).toBe(0);
    expect(() => travelMinor(-1, 1000)).toThrow(RangeError);
  });
});

describe("a whole quote", () => {
  const input: QuoteInput = {
    currency: "ZMW",
    lines: [
      { kind: "materials", description: "Tarpaulin liner, 6 × 10 ft", quantity: 1, unitPriceMinor: 95_000 },
      { kind: "materials", description: "Timber poles", quantity: 6, unitPriceMinor: 4_550 },
      { kind: "labour", description: "Two builders", quantity: 2.5, unitPriceMinor: 30_000 },
      { kind: "other", description: "Outlet fittings", quantity: 1, unitPriceMinor: 12_345 },
    ],
    travel: { distanceM: 12_345, ratePerKmMinor: 500 },
    baseServiceFeeMinor: 19_997,
    farmerSuppliesMaterials: false,
  };

  it("adds the lines, the computed travel and the base fee, and holds 30 % as the deposit", () => {
    const q = priceQuote(input);
    // materials 950.00 + 6 × 45.50 = 950.00 + 273.00 = 1 223.00; labour 2.5 × 300.00 = 750.00; other 123.45;
    // travel 12.345 km × 5.00 = 61.725 → 61.73. Subtotal 2 158.18; + base fee 199.97 = 2 358.15.
    expect(q.materialsMinor).toBe(122_300);
    expect(q.labourMinor).toBe(75_000);
    expect(q.otherMinor).toBe(12_345);
    expect(q.travelMinor).toBe(6_173);
    expect(q.subtotalMinor).toBe(215_818);
    expect(q.totalMinor).toBe(235_815);
    // 30 % of 2 358.15 = 707.445 → 707.45 (half up); the balance is 2 358.15 − 707.45 = 1 650.70.
    expect(q.depositMinor).toBe(70_745);
    expect(q.balanceMinor).toBe(165_070);
    expect(q.excludedMaterialsMinor).toBe(0);
    expect(q.lines.at(-1)).toEqual({ kind: "travel", description: "Travel, 12.3 km", quantity: 12.345, unitPriceMinor: 500, totalMinor: 6_173, included: true });
  });

  it("leaves material lines out when the farmer supplies the materials, and still shows them", () => {
    const q = priceQuote({ ...input, farmerSuppliesMaterials: true });
    // 750.00 + 123.45 + 61.73 = 935.18; + 199.97 = 1 135.15; 30 % = 340.545 → 340.55; balance 1 135.15 − 340.55 = 794.60.
    expect(q.materialsMinor).toBe(0);
    expect(q.excludedMaterialsMinor).toBe(122_300);
    expect(q.subtotalMinor).toBe(93_518);
    expect(q.totalMinor).toBe(113_515);
    expect(q.depositMinor).toBe(34_055);
    expect(q.balanceMinor).toBe(79_460);
    expect(q.lines.filter((l) => !l.included).map((l) => [l.description, l.totalMinor])).toEqual([
      ["Tarpaulin liner, 6 × 10 ft", 95_000],
      ["Timber poles", 27_300],
    ]);
  });

  it("has no travel line when there is no distance to cover", () => {
    const q = priceQuote({ ...input, travel: null });
    expect(q.lines.some((l) => l.kind === "travel")).toBe(false);
    expect(q.totalMinor).toBe(235_815 - 6_173);
  });

  it("refuses a currency that is not ISO 4217 and a fee that is not whole minor units", () => {
    expect(() => priceQuote({ ...input, currency: "Kwacha" })).toThrow(RangeError);
    expect(() => priceQuote({ ...input, baseServiceFeeMinor: 0.5 })).toThrow(RangeError);
  });
});

describe("estimate from a builder's price sheet", () => {
  it("prices a 6 × 10 ft tarpaulin tank floor per m²", () => {
    // 1 ft = 0.3048 m exactly (REFERENCE-VALUES 10.2): 1.8288 m × 3.048 m = 5.5741824 m², priced as 5.5742 m².
    const e = estimateFromPriceSheet({ tankType: "tarpaulin", materialsPerSqmMinor: 18_000, labourPerSqmMinor: 6_550 }, 6 * 0.3048 * (10 * 0.3048));
    expect(e.floorAreaM2).toBe(5.5742);
    expect(e.materialsMinor).toBe(100_336); // 5.5742 × 180.00 = 1 003.356 → 1 003.36
    expect(e.labourMinor).toBe(36_511); // 5.5742 × 65.50 = 365.1101 → 365.11
    expect(e.lines.map((l) => [l.kind, l.quantity, l.unitPriceMinor])).toEqual([
      ["materials", 5.5742, 18_000],
      ["labour", 5.5742, 6_550],
    ]);
    // The starting lines price to the same amounts when put in a quote.
    const q = priceQuote({ currency: "ZMW", lines: e.lines, travel: null, baseServiceFeeMinor: 0, farmerSuppliesMaterials: false });
    expect(q.totalMinor).toBe(100_336 + 36_511);
  });

  it("prices a round tank of 3 m diameter", () => {
    // π r² (REFERENCE-VALUES 7.6) with r = 1.5 m: 7.068583… m², priced as 7.0686 m²; × 120.00 = 848.232 → 848.23.
    const e = estimateFromPriceSheet({ tankType: "concrete", materialsPerSqmMinor: 12_000, labourPerSqmMinor: 9_000 }, Math.PI * 1.5 ** 2);
    expect(e.floorAreaM2).toBe(7.0686);
    expect(e.materialsMinor).toBe(84_823);
    expect(e.labourMinor).toBe(63_617); // 7.0686 × 90.00 = 636.174 → 636.17
  });
});
