import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { bayesianMean } from "./bayesian-mean";

describe("bayesianMean against the published worked example (REFERENCE-VALUES 8.6)", () => {
  // Math Stack Exchange, "Understanding the IMDb weighted rating function": votes 8, 8, 10, 5, 7, 8
  // with m = 1 and C = 8 give WR = 6/7·7.6667 + 1/7·8 = 7.714 (the post rounds to 7.7).
  it("votes 8, 8, 10, 5, 7, 8 with m = 1, C = 8 → 7.714", () => {
    expect(Math.abs(bayesianMean([8, 8, 10, 5, 7, 8], { mean: 8, weight: 1 }) - 7.714)).toBeLessThan(5e-4);
  });

  it("a single vote of 10 with the same prior → 9.0", () => {
    expect(bayesianMean([10], { mean: 8, weight: 1 })).toBeCloseTo(9.0, 12);
  });

  it("accepts totals instead of the list", () => {
    expect(bayesianMean({ sum: 46, count: 6 }, { mean: 8, weight: 1 })).toBe(
      bayesianMean([8, 8, 10, 5, 7, 8], { mean: 8, weight: 1 }),
    );
  });
});

describe("bayesianMean equals the IMDb form WR = v/(v+m)·R + m/(v+m)·C (REFERENCE-VALUES 8.5)", () => {
  it("on random ratings and priors", () => {
    fc.assert(
      fc.property(
        fc.array(fc.integer({ min: 1, max: 5 }), { minLength: 1, maxLength: 200 }),
        fc.integer({ min: 100, max: 500 }).map((c) => c / 100),
        fc.integer({ min: 0, max: 50 }),
        (ratings, C, m) => {
          const v = ratings.length;
          const R = ratings.reduce((s, r) => s + r, 0) / v;
          const expected = (v / (v + m)) * R + (m / (v + m)) * C;
          return Math.abs(bayesianMean(ratings, { mean: C, weight: m }) - expected) < 1e-12;
        },
      ),
    );
  });

  it("is the prior mean with no ratings, and the plain mean with weight 0", () => {
    expect(bayesianMean([], { mean: 3.5, weight: 5 })).toBe(3.5);
    expect(bayesianMean([4, 5], { mean: 3.5, weight: 0 })).toBe(4.5);
  });

  it("refuses an empty list with no prior weight, and a negative weight", () => {
    expect(() => bayesianMean([], { mean: 3.5, weight: 0 })).toThrow(RangeError);
    expect(() => bayesianMean([4], { mean: 3.5, weight: -1 })).toThrow(RangeError);
  });
});
