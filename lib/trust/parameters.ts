// Every number that shapes a provider's trust score, in one place, each with its reason.
// These are Shoal's own choices (not published values); change them here and nowhere else.

export type TrustParameters = {
  readonly positiveMinStars: number;
  readonly confidence: number;
  readonly minReviewsForRating: number;
  readonly displayPrior: { readonly mean: number; readonly weight: number };
  readonly reviewEffect: { readonly upAtLowerBound: number; readonly downBelowLowerBound: number };
  readonly verifiedBonus: number;
  readonly responseTime: {
    readonly fastHours: number;
    readonly fastBonus: number;
    readonly slowHours: number;
    readonly slowPenalty: number;
  };
  readonly completion: { readonly targetRate: number; readonly penaltyWeight: number };
  readonly disputes: { readonly penaltyPerRate: number; readonly maxPenalty: number };
  readonly survival: {
    readonly expectedMean: number;
    readonly priorWeight: number;
    readonly bonus: number;
    readonly penaltyWeight: number;
    readonly maxPenalty: number;
  };
};

export const TRUST_PARAMETERS: TrustParameters = {
  // A review of 4 or 5 stars counts as positive; 3 stars means "it was all right", which should
  // not lift a provider that a newcomer is about to pay a large deposit.
  positiveMinStars: 4,
  // Two-sided 95 %, the level Miller (2009) uses (z = 1.96): strict enough that luck with a few
  // reviews does not win, loose enough that a real record of 20-30 jobs shows.
  confidence: 0.95,
  // Below 5 reviews one bad review moves the mean by most of a star, so a provider shows "new"
  // with its counts instead of a rating that would mislead in either direction.
  minReviewsForRating: 5,
  // Displayed stars are pulled towards 3.5 with the weight of 5 reviews: a short record of
  // 5-star reviews (often friends and family) shows as good, not as a perfect 5.0, and one early
  // 1-star review does not sink a new provider. Display only: ranking uses the Wilson bound.
  displayPrior: { mean: 3.5, weight: 5 },
  // How the reviews reason is labelled: a lower bound of 0.7 means at least 70 % of customers
  // are happy at 95 % confidence; below 0.4 fewer than half may be.
  reviewEffect: { upAtLowerBound: 0.7, downBelowLowerBound: 0.4 },
  // Shoal has checked identity and premises: worth a small lift, never enough to outrank a
  // provider with a real record (5 % of the distance to a perfect score).
  verifiedBonus: 0.05,
  // Farmers with sick fish or a leaking tank need answers the same day. Replying within 12 h
  // earns a small lift; a median over 3 days costs a little, as it leaves a buyer stranded.
  responseTime: { fastHours: 12, fastBonus: 0.02, slowHours: 72, slowPenalty: 0.05 },
  // Accepted jobs that ended unfinished. Judged on the Wilson upper bound of the completion
  // rate (the benefit of the doubt), so one cancelled job among few does not punish; below 90 %
  // the score drops by half the shortfall.
  completion: { targetRate: 0.9, penaltyWeight: 0.5 },
  // Disputes the provider lost, as a share of accepted jobs: 1 in 20 costs 10 %, 1 in 5 costs
  // 40 %; capped at 60 % so the score still separates bad from worse.
  disputes: { penaltyPerRate: 2, maxPenalty: 0.6 },
  // Hatcheries: the mean of farmers' 7-day survival reports, damped towards 90 % with the weight
  // of 3 reports so one unlucky batch (transport, the farmer's own water) does not decide it.
  // 90 % is our expectation for healthy fingerlings handled with care, not a published figure
  // (REFERENCE-VALUES §3 has no sourced 7-day survival rate). Meeting it earns a small lift;
  // falling short costs half the shortfall, capped at 50 %.
  survival: { expectedMean: 0.9, priorWeight: 3, bonus: 0.03, penaltyWeight: 0.5, maxPenalty: 0.5 },
};
