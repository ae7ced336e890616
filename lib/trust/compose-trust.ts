// Composes what happened on Shoal into one trust score for ranking, a damped rating for display,
// and the list of reasons a farmer sees under "How this is worked out".
//
// score = (W + U·(1 − W)) · D, where W is the Wilson lower bound of the share of positive reviews,
// U = 1 − Π(1 − bonusᵢ) combines the small lifts and D = Π(1 − penaltyᵢ) the penalties. The score
// stays in [0, 1], rises with W, and a lift can never make up for a missing review record.

import { bayesianMean } from "./bayesian-mean";
import { TRUST_PARAMETERS, type TrustParameters } from "./parameters";
import { completionRate, disputeRate, survivalMean, type SurvivalReport } from "./rates";
import { wilsonInterval, wilsonLowerBound } from "./wilson";

/** Number of reviews with each overall star rating. */
export type StarCounts = {
  readonly 1: number;
  readonly 2: number;
  readonly 3: number;
  readonly 4: number;
  readonly 5: number;
};

export type TrustStats = {
  readonly stars: StarCounts;
  /** Jobs (or reservations, for a hatchery) completed through Shoal. */
  readonly jobsCompleted: number;
  /** Accepted jobs whose outcome is settled; see completionRate. */
  readonly jobsAccepted: number;
  readonly disputesLost: number;
  /** Median hours to the first reply to a farmer's message; null when nothing was measured yet. */
  readonly medianResponseHours: number | null;
  readonly verified: boolean;
  /** Hatcheries only: farmers' 7-day survival reports. Leave undefined for builders. */
  readonly survivalReports?: readonly SurvivalReport[];
};

export type TrustEffect = "up" | "down" | "neutral";

export type TrustReasonCode =
  | "reviews"
  | "rating"
  | "jobs_completed"
  | "completion_rate"
  | "disputes_lost"
  | "response_time"
  | "verification"
  | "survival";

export type TrustReason = {
  readonly code: TrustReasonCode;
  readonly label: string;
  readonly value: number | boolean | null;
  readonly detail: string;
  /** How this item moved the ranking score ("neutral" for items shown only for information). */
  readonly effect: TrustEffect;
};

export type TrustSummary = {
  /** 0..1, for ranking only; never shown as a number. */
  readonly score: number;
  /** Damped mean of the stars (1..5), or null while the provider is new. */
  readonly displayRating: number | null;
  /** Too few reviews for a rating: show "new" and the counts instead. */
  readonly isNew: boolean;
  readonly counts: {
    readonly reviews: number;
    readonly positiveReviews: number;
    readonly jobsCompleted: number;
    readonly survivalReports: number;
  };
  readonly reasons: readonly TrustReason[];
};

const STAR_VALUES = [1, 2, 3, 4, 5] as const;

function plural(n: number, one: string, many: string): string {
  return `${n} ${n === 1 ? one : many}`;
}

function percent(share: number): string {
  return `${Math.round(share * 100)}%`;
}

function hours(value: number): string {
  if (value < 1) return `${Math.max(1, Math.round(value * 60))} min`;
  if (value < 48) return plural(Math.round(value), "hour", "hours");
  return plural(Math.round(value / 24), "day", "days");
}

export function composeTrust(stats: TrustStats, parameters: TrustParameters = TRUST_PARAMETERS): TrustSummary {
  const p = parameters;
  const reasons: TrustReason[] = [];
  const bonuses: number[] = [];
  const penalties: number[] = [];

  // Reviews: the base of the score.
  let total = 0;
  let positive = 0;
  let starSum = 0;
  for (const star of STAR_VALUES) {
    const n = stats.stars[star];
    if (!Number.isInteger(n) || n < 0) throw new RangeError(`stars.${star} must be a whole number ≥ 0, got ${n}`);
    total += n;
    starSum += n * star;
    if (star >= p.positiveMinStars) positive += n;
  }
  const lowerBound = wilsonLowerBound(positive, total, p.confidence);
  const isNew = total < p.minReviewsForRating;
  reasons.push({
    code: "reviews",
    label: "Reviews",
    value: total,
    detail:
      total === 0
        ? "No reviews yet"
        : `${positive} of ${plural(total, "review", "reviews")} gave ${p.positiveMinStars} or 5 stars`,
    effect: isNew
      ? "neutral"
      : lowerBound >= p.reviewEffect.upAtLowerBound
        ? "up"
        : lowerBound < p.reviewEffect.downBelowLowerBound
          ? "down"
          : "neutral",
  });

  const displayRating = isNew ? null : bayesianMean({ sum: starSum, count: total }, p.displayPrior);
  reasons.push({
    code: "rating",
    label: "Rating",
    value: displayRating,
    detail:
      displayRating === null
        ? `New on Shoal: a rating shows from ${p.minReviewsForRating} reviews (${total} so far)`
        : `Average ${(starSum / total).toFixed(1)} from ${plural(total, "review", "reviews")}, ` +
          `shown as ${displayRating.toFixed(1)} after weighing in ${p.displayPrior.weight} ` +
          `middle ratings of ${p.displayPrior.mean}`,
    effect: "neutral",
  });

  reasons.push({
    code: "jobs_completed",
    label: "Jobs completed on Shoal",
    value: stats.jobsCompleted,
    detail: plural(stats.jobsCompleted, "job completed through Shoal", "jobs completed through Shoal"),
    effect: "neutral",
  });

  const completion = completionRate(stats.jobsCompleted, stats.jobsAccepted);
  if (completion.rate === null) {
    reasons.push({
      code: "completion_rate",
      label: "Jobs finished",
      value: null,
      detail: "No accepted jobs have ended yet",
      effect: "neutral",
    });
  } else {
    const optimistic = wilsonInterval(completion.count, completion.outOf, p.confidence).upper;
    const penalty = p.completion.penaltyWeight * Math.max(0, p.completion.targetRate - optimistic);
    if (penalty > 0) penalties.push(penalty);
    reasons.push({
      code: "completion_rate",
      label: "Jobs finished",
      value: completion.rate,
      detail: `${completion.count} of ${plural(completion.outOf, "accepted job", "accepted jobs")} completed (${percent(completion.rate)})`,
      effect: penalty > 0 ? "down" : "neutral",
    });
  }

  const disputes = disputeRate(stats.disputesLost, stats.jobsAccepted);
  const disputePenalty =
    disputes.rate === null ? 0 : Math.min(p.disputes.maxPenalty, p.disputes.penaltyPerRate * disputes.rate);
  if (disputePenalty > 0) penalties.push(disputePenalty);
  reasons.push({
    code: "disputes_lost",
    label: "Disputes lost",
    value: stats.disputesLost,
    detail:
      stats.disputesLost === 0
        ? "No disputes lost"
        : `${plural(stats.disputesLost, "dispute", "disputes")} lost in ${plural(stats.jobsAccepted, "job", "jobs")}`,
    effect: disputePenalty > 0 ? "down" : "neutral",
  });

  const response = stats.medianResponseHours;
  if (response !== null && (!Number.isFinite(response) || response < 0)) {
    throw new RangeError(`medianResponseHours must be a number ≥ 0 or null, got ${response}`);
  }
  let responseEffect: TrustEffect = "neutral";
  if (response !== null && response <= p.responseTime.fastHours) {
    bonuses.push(p.responseTime.fastBonus);
    responseEffect = "up";
  } else if (response !== null && response >= p.responseTime.slowHours) {
    penalties.push(p.responseTime.slowPenalty);
    responseEffect = "down";
  }
  reasons.push({
    code: "response_time",
    label: "Replies",
    value: response,
    detail: response === null ? "No replies measured yet" : `Usually replies within ${hours(response)}`,
    effect: responseEffect,
  });

  if (stats.verified) bonuses.push(p.verifiedBonus);
  reasons.push({
    code: "verification",
    label: "Verified by Shoal",
    value: stats.verified,
    detail: stats.verified ? "Identity and premises checked by Shoal" : "Not verified yet",
    effect: stats.verified ? "up" : "neutral",
  });

  let survivalCount = 0;
  if (stats.survivalReports !== undefined) {
    const survival = survivalMean(stats.survivalReports);
    survivalCount = survival.count;
    let effect: TrustEffect = "neutral";
    if (survival.mean !== null) {
      const s = p.survival;
      const damped = (survival.mean * survival.count + s.priorWeight * s.expectedMean) / (survival.count + s.priorWeight);
      if (damped >= s.expectedMean) {
        bonuses.push(s.bonus);
        effect = "up";
      } else {
        penalties.push(Math.min(s.maxPenalty, s.penaltyWeight * (s.expectedMean - damped)));
        effect = "down";
      }
    }
    reasons.push({
      code: "survival",
      label: "Fish alive after 7 days",
      value: survival.mean,
      detail:
        survival.mean === null
          ? "No survival reports yet"
          : `${percent(survival.mean)} on average, from ${plural(survival.count, "farmer's report", "farmers' reports")}`,
      effect,
    });
  }

  const lift = 1 - bonuses.reduce((keep, bonus) => keep * (1 - bonus), 1);
  const keep = penalties.reduce((kept, penalty) => kept * (1 - penalty), 1);
  const score = Math.min(1, Math.max(0, (lowerBound + lift * (1 - lowerBound)) * keep));

  return {
    score,
    displayRating,
    isNew,
    counts: { reviews: total, positiveReviews: positive, jobsCompleted: stats.jobsCompleted, survivalReports: survivalCount },
    reasons,
  };
}

/** Higher score first; equal scores compare equal so a stable sort keeps their order. */
export function compareTrust(a: TrustSummary, b: TrustSummary): number {
  return b.score - a.score;
}

/** Items ordered by trust, highest first; ties keep their input order (for example by distance). */
export function rankByTrust<T>(items: readonly T[], summaryOf: (item: T) => TrustSummary): T[] {
  return items
    .map((item, index) => ({ item, index, summary: summaryOf(item) }))
    .sort((x, y) => compareTrust(x.summary, y.summary) || x.index - y.index)
    .map(({ item }) => item);
}
