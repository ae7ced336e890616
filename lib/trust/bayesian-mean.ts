// Damped ("Bayesian") mean for display: the item's own mean R from v ratings, pulled towards a
// prior mean C with the weight of m ratings: WR = (v·R + m·C) / (v + m). This is the IMDb Top 250
// "true Bayesian estimate" WR = v/(v+m)·R + m/(v+m)·C (REFERENCE-VALUES 8.5).

export type RatingTotals = { readonly sum: number; readonly count: number };
export type RatingPrior = { readonly mean: number; readonly weight: number };

// Array.isArray does not narrow a readonly array type, so the check is spelled as a type guard.
function isTotals(ratings: readonly number[] | RatingTotals): ratings is RatingTotals {
  return !Array.isArray(ratings);
}

function totalsOf(ratings: readonly number[] | RatingTotals): RatingTotals {
  if (isTotals(ratings)) return ratings;
  let sum = 0;
  for (const rating of ratings) {
    if (!Number.isFinite(rating)) throw new RangeError(`ratings must be finite numbers, got ${rating}`);
    sum += rating;
  }
  return { sum, count: ratings.length };
}

export function bayesianMean(ratings: readonly number[] | RatingTotals, prior: RatingPrior): number {
  const { sum, count } = totalsOf(ratings);
  if (!Number.isFinite(sum) || !Number.isFinite(count) || count < 0) {
    throw new RangeError(`ratings need a finite sum and a count ≥ 0, got sum ${sum}, count ${count}`);
  }
  if (!Number.isFinite(prior.mean) || !Number.isFinite(prior.weight) || prior.weight < 0) {
    throw new RangeError(`prior needs a finite mean and a weight ≥ 0, got ${prior.mean}, ${prior.weight}`);
  }
  if (count + prior.weight === 0) {
    throw new RangeError("bayesianMean needs at least one rating or a prior with weight > 0");
  }
  return (sum + prior.weight * prior.mean) / (count + prior.weight);
}
