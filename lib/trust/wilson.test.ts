import fc from "fast-check";
import jStat from "jstat";
import { describe, expect, it } from "vitest";
import { normalQuantileTwoSided, wilsonInterval, wilsonLowerBound } from "./wilson";

// REFERENCE-VALUES 8.7: z(0.975) = 1.959963984540054 (scipy.stats.norm.ppf(0.975)).
const Z_SCIPY = 1.959963984540054;

/** REFERENCE-VALUES 8.1 written out literally (Evan Miller 2009; E. B. Wilson 1927). */
function millerFormula(positive: number, negative: number, z: number): number {
  const n = positive + negative;
  const p = positive / n;
  return (p + (z * z) / (2 * n) - z * Math.sqrt((p * (1 - p)) / n + (z * z) / (4 * n * n))) / (1 + (z * z) / n);
}

describe("normal quantile from jStat", () => {
  it("z for 95 % two-sided matches scipy to 1e-12 (REFERENCE-VALUES 8.7)", () => {
    expect(Math.abs(normalQuantileTwoSided(0.95) - Z_SCIPY)).toBeLessThan(1e-12);
  });

  it("rounds to the 1.960 printed in the HELM standard normal table (workbook 39.1)", () => {
    expect(normalQuantileTwoSided(0.95).toFixed(3)).toBe("1.960");
  });

  it("refuses a confidence outside (0, 1)", () => {
    expect(() => normalQuantileTwoSided(1)).toThrow(RangeError);
    expect(() => normalQuantileTwoSided(0)).toThrow(RangeError);
  });
});

describe("wilsonLowerBound against REFERENCE-VALUES 8.3 (computed with z = 1.959963984540054)", () => {
  // The published values have 6 decimals; with z from jStat rather than 1.96 the only difference
  // left is that rounding, so 1e-6 is used instead of the 1e-5 that 8.4 allows for z = 1.96.
  const TOLERANCE = 1e-6;

  it("600 positive of 1000 → 0.569309", () => {
    expect(Math.abs(wilsonLowerBound(600, 1000) - 0.569309)).toBeLessThanOrEqual(TOLERANCE);
  });

  it("2 positive of 2 → 0.342380", () => {
    expect(Math.abs(wilsonLowerBound(2, 2) - 0.34238)).toBeLessThanOrEqual(TOLERANCE);
  });

  it("1 positive of 1 → 0.206549", () => {
    expect(Math.abs(wilsonLowerBound(1, 1) - 0.206549)).toBeLessThanOrEqual(TOLERANCE);
  });

  it.each([1, 2, 10, 1000])("0 positive of %i → 0", (n) => {
    expect(wilsonLowerBound(0, n)).toBe(0);
  });

  it("is 0 with no reviews at all", () => {
    expect(wilsonLowerBound(0, 0)).toBe(0);
  });

  it("equals the 8.1 formula on random counts", () => {
    fc.assert(
      fc.property(fc.nat(5000), fc.nat(5000), (positive, negative) => {
        fc.pre(positive + negative > 0);
        const expected = Math.max(0, millerFormula(positive, negative, Z_SCIPY));
        return Math.abs(wilsonLowerBound(positive, positive + negative) - expected) < 1e-12;
      }),
    );
  });
});

describe("wilsonLowerBound ranks as Miller (2009) argues it should (REFERENCE-VALUES 8.2)", () => {
  it("100 up / 1 down ranks above 2 up / 0 down (the average-rating mistake)", () => {
    expect(wilsonLowerBound(100, 101)).toBeGreaterThan(wilsonLowerBound(2, 2));
  });

  it("600 up / 400 down ranks above 5500 up / 4500 down (the net-score mistake)", () => {
    expect(wilsonLowerBound(600, 1000)).toBeGreaterThan(wilsonLowerBound(5500, 10000));
  });
});

describe("wilsonInterval properties", () => {
  it("another positive never lowers the bound; another negative never raises it", () => {
    fc.assert(
      fc.property(fc.nat(3000), fc.nat(3000), (positive, negative) => {
        const n = positive + negative;
        const now = wilsonLowerBound(positive, n);
        return wilsonLowerBound(positive + 1, n + 1) >= now && wilsonLowerBound(positive, n + 1) <= now;
      }),
    );
  });

  it("contains the observed share and stays within [0, 1]", () => {
    fc.assert(
      fc.property(fc.nat(3000), fc.nat(3000), (positive, negative) => {
        fc.pre(positive + negative > 0);
        const { lower, upper } = wilsonInterval(positive, positive + negative);
        const share = positive / (positive + negative);
        return lower >= 0 && upper <= 1 && lower <= share && share <= upper;
      }),
    );
  });

  it("a higher confidence gives a lower bound that is no higher", () => {
    expect(wilsonLowerBound(40, 50, 0.99)).toBeLessThan(wilsonLowerBound(40, 50, 0.95));
  });

  it("refuses impossible counts", () => {
    expect(() => wilsonLowerBound(3, 2)).toThrow(RangeError);
    expect(() => wilsonLowerBound(-1, 2)).toThrow(RangeError);
    expect(() => wilsonLowerBound(1.5, 2)).toThrow(RangeError);
  });
});

describe("wilsonInterval against E. B. Wilson, 'Probable inference…', JASA 22:209-212 (1927)", () => {
  // Wilson's step: take the standard deviation of the TRUE rate, (pq/n)^½, not the observed one, so the limits of p
  // are the two roots of (p − p₀)² = λ²·p(1 − p)/n (REFERENCE-VALUES 8.1 gives the solved form; this checks the
  // bounds against the equation itself, not against the same closed form).
  it("each bound is a root of Wilson's equation (p − p₀)² = λ²·p(1 − p)/n", () => {
    const z = normalQuantileTwoSided(0.95);
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 4000 }), fc.integer({ min: 1, max: 4000 }), (positive, negative) => {
        const n = positive + negative;
        const p0 = positive / n;
        const { lower, upper } = wilsonInterval(positive, n);
        const residual = (p: number) => (p - p0) ** 2 - (z * z * p * (1 - p)) / n;
        return Math.abs(residual(lower)) < 1e-12 && Math.abs(residual(upper)) < 1e-12 && lower < p0 && p0 < upper;
      }),
    );
  });

  it("with λ = 2 the interval is centred on (k + 2)/(n + 4), Wilson's 'add two successes and two failures'", () => {
    // λ = 2 exactly: confidence = 2Φ(2) − 1, with Φ from jStat (0.9544997…).
    const confidence = 2 * jStat.normal.cdf(2, 0, 1) - 1;
    expect(Math.abs(normalQuantileTwoSided(confidence) - 2)).toBeLessThan(1e-9);
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 2000 }), fc.integer({ min: 1, max: 2000 }), (k, failures) => {
        const n = k + failures;
        const { lower, upper } = wilsonInterval(k, n, confidence);
        return Math.abs((lower + upper) / 2 - (k + 2) / (n + 4)) < 1e-9;
      }),
    );
  });
});
