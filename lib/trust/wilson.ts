// Wilson score interval for a share of positive outcomes (E. B. Wilson, "Probable inference, the
// law of succession, and statistical inference", JASA 22:209-212, 1927), used for ranking as
// Evan Miller recommends in "How Not To Sort By Average Rating" (2009): the lower bound answers
// "given these reviews, the share of happy customers is at least this, with 95 % confidence",
// so a short perfect record ranks below a long, nearly perfect one.
import jStat from "jstat";

const quantiles = new Map<number, number>();

/**
 * z such that a standard normal variable falls within ±z with probability `confidence`
 * (1.959964 for 0.95), from jStat's inverse normal CDF. Cached: the ranking calls it per row.
 */
export function normalQuantileTwoSided(confidence: number): number {
  if (!(confidence > 0 && confidence < 1)) {
    throw new RangeError(`confidence must be between 0 and 1 (exclusive), got ${confidence}`);
  }
  let z = quantiles.get(confidence);
  if (z === undefined) {
    z = jStat.normal.inv(1 - (1 - confidence) / 2, 0, 1);
    quantiles.set(confidence, z);
  }
  return z;
}

function assertCounts(positive: number, total: number): void {
  if (!Number.isInteger(total) || total < 0) {
    throw new RangeError(`total must be a whole number ≥ 0, got ${total}`);
  }
  if (!Number.isInteger(positive) || positive < 0 || positive > total) {
    throw new RangeError(`positive must be a whole number between 0 and total (${total}), got ${positive}`);
  }
}

export type WilsonInterval = { readonly lower: number; readonly upper: number };

/**
 * Wilson score interval without continuity correction:
 * [p̂ + z²/(2n) ± z·√(p̂(1−p̂)/n + z²/(4n²))] / (1 + z²/n), with p̂ = positive/n.
 * With no observations it is the whole range [0, 1].
 */
export function wilsonInterval(positive: number, total: number, confidence = 0.95): WilsonInterval {
  assertCounts(positive, total);
  if (total === 0) return { lower: 0, upper: 1 };
  const z = normalQuantileTwoSided(confidence);
  const n = total;
  const p = positive / n;
  const z2 = z * z;
  const centre = p + z2 / (2 * n);
  const margin = z * Math.sqrt((p * (1 - p)) / n + z2 / (4 * n * n));
  const denominator = 1 + z2 / n;
  // At p̂ = 0 (or 1) the lower (upper) bound is exactly 0 (1); the formula leaves a rounding
  // residue there, which would rank "all negative" above "none".
  return {
    lower: positive === 0 ? 0 : Math.max(0, (centre - margin) / denominator),
    upper: positive === total ? 1 : Math.min(1, (centre + margin) / denominator),
  };
}

/** Lower bound of the Wilson score interval; 0 when there is nothing to go on. */
export function wilsonLowerBound(positive: number, total: number, confidence = 0.95): number {
  return wilsonInterval(positive, total, confidence).lower;
}
