import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { composeTrust, rankByTrust, type StarCounts, type TrustStats } from "./compose-trust";
import { TRUST_PARAMETERS } from "./parameters";
import { wilsonLowerBound } from "./wilson";

const noStars: StarCounts = { 1: 0, 2: 0, 3: 0, 4: 0, 5: 0 };

const plain: TrustStats = {
  stars: noStars,
  jobsCompleted: 0,
  jobsAccepted: 0,
  disputesLost: 0,
  medianResponseHours: null,
  verified: false,
};

const starCounts = fc.record({
  1: fc.nat(20),
  2: fc.nat(20),
  3: fc.nat(30),
  4: fc.nat(60),
  5: fc.nat(120),
});

const survivalReport = fc
  .integer({ min: 1, max: 2000 })
  .chain((handedOver) =>
    fc.record({ fishHandedOver: fc.constant(handedOver), fishSurvived: fc.integer({ min: 0, max: handedOver }) }),
  );

const trustStats: fc.Arbitrary<TrustStats> = fc.nat(200).chain((accepted) =>
  fc.record({
    stars: starCounts,
    jobsAccepted: fc.constant(accepted),
    jobsCompleted: fc.integer({ min: 0, max: accepted }),
    disputesLost: fc.integer({ min: 0, max: accepted }),
    medianResponseHours: fc.option(fc.integer({ min: 0, max: 400 }).map((h) => h / 2), { nil: null }),
    verified: fc.boolean(),
    survivalReports: fc.option(fc.array(survivalReport, { maxLength: 12 }), { nil: undefined }),
  }),
);

const score = (stats: TrustStats) => composeTrust(stats).score;

describe("composeTrust: more positive evidence never lowers the score", () => {
  it("another 4- or 5-star review", () => {
    fc.assert(
      fc.property(trustStats, fc.constantFrom(4 as const, 5 as const), (stats, star) => {
        const more = { ...stats, stars: { ...stats.stars, [star]: stats.stars[star] + 1 } };
        return score(more) >= score(stats);
      }),
      { numRuns: 500 },
    );
  });

  it("another completed job (accepted and completed)", () => {
    fc.assert(
      fc.property(trustStats, (stats) => {
        const more = { ...stats, jobsAccepted: stats.jobsAccepted + 1, jobsCompleted: stats.jobsCompleted + 1 };
        return score(more) >= score(stats);
      }),
      { numRuns: 500 },
    );
  });

  it("an unfinished accepted job turning into a completed one", () => {
    fc.assert(
      fc.property(trustStats, (stats) => {
        fc.pre(stats.jobsCompleted < stats.jobsAccepted);
        return score({ ...stats, jobsCompleted: stats.jobsCompleted + 1 }) >= score(stats);
      }),
      { numRuns: 500 },
    );
  });

  it("a report of every fish alive after 7 days", () => {
    fc.assert(
      fc.property(trustStats, fc.integer({ min: 1, max: 2000 }), (stats, fish) => {
        const reports = stats.survivalReports ?? [];
        const more = { ...stats, survivalReports: [...reports, { fishHandedOver: fish, fishSurvived: fish }] };
        return score(more) >= score({ ...stats, survivalReports: reports });
      }),
      { numRuns: 500 },
    );
  });

  it("a faster median reply", () => {
    fc.assert(
      fc.property(trustStats, fc.integer({ min: 0, max: 400 }), fc.integer({ min: 0, max: 400 }), (stats, a, b) => {
        const [fast, slow] = a <= b ? [a / 2, b / 2] : [b / 2, a / 2];
        return score({ ...stats, medianResponseHours: fast }) >= score({ ...stats, medianResponseHours: slow });
      }),
      { numRuns: 500 },
    );
  });

  it("several good things at once: a completed job that also brings a 5-star review", () => {
    fc.assert(
      fc.property(trustStats, (stats) => {
        const more = { ...stats, stars: { ...stats.stars, 5: stats.stars[5] + 1 }, jobsAccepted: stats.jobsAccepted + 1, jobsCompleted: stats.jobsCompleted + 1 };
        return score(more) >= score(stats);
      }),
      { numRuns: 500 },
    );
  });

  it("becoming verified", () => {
    fc.assert(
      fc.property(trustStats, (stats) => score({ ...stats, verified: true }) >= score({ ...stats, verified: false })),
      { numRuns: 300 },
    );
  });
});

describe("composeTrust: negative evidence never raises the score", () => {
  it("another 1-, 2- or 3-star review", () => {
    fc.assert(
      fc.property(trustStats, fc.constantFrom(1 as const, 2 as const, 3 as const), (stats, star) => {
        const more = { ...stats, stars: { ...stats.stars, [star]: stats.stars[star] + 1 } };
        return score(more) <= score(stats);
      }),
      { numRuns: 500 },
    );
  });

  it("another dispute lost", () => {
    fc.assert(
      fc.property(trustStats, (stats) => {
        fc.pre(stats.disputesLost < stats.jobsAccepted);
        return score({ ...stats, disputesLost: stats.disputesLost + 1 }) <= score(stats);
      }),
      { numRuns: 500 },
    );
  });

  it("the score always stays within [0, 1]", () => {
    fc.assert(
      fc.property(trustStats, (stats) => {
        const s = score(stats);
        return s >= 0 && s <= 1;
      }),
      { numRuns: 500 },
    );
  });
});

describe("ranking by trust", () => {
  it("orders by score and keeps the input order for ties", () => {
    fc.assert(
      fc.property(fc.array(fc.nat(3), { minLength: 2, maxLength: 30 }), (kinds) => {
        // Only four distinct providers, so most of the list are ties.
        const templates: TrustStats[] = [
          plain,
          { ...plain, stars: { ...noStars, 5: 3 } },
          { ...plain, stars: { ...noStars, 4: 10, 5: 30 }, jobsAccepted: 40, jobsCompleted: 40 },
          { ...plain, stars: { ...noStars, 1: 5, 5: 5 }, verified: true },
        ];
        const items = kinds.map((kind, index) => ({ index, stats: templates[kind] ?? plain }));
        const ranked = rankByTrust(items, (item) => composeTrust(item.stats));
        for (let i = 1; i < ranked.length; i++) {
          const before = ranked[i - 1];
          const after = ranked[i];
          if (before === undefined || after === undefined) return false;
          const a = score(before.stats);
          const b = score(after.stats);
          if (a < b) return false;
          if (a === b && before.index > after.index) return false;
        }
        return ranked.length === items.length;
      }),
    );
  });

  it("ties keep their input order whatever that order is (a stable sort, e.g. nearest first)", () => {
    const same: TrustStats = { ...plain, stars: { ...noStars, 4: 3, 5: 9 }, jobsAccepted: 12, jobsCompleted: 12 };
    fc.assert(
      fc.property(fc.array(fc.boolean(), { minLength: 2, maxLength: 25 }), (better) => {
        // Every item is `same` except a few better ones; the `same` ones must come out in their given order.
        const items = better.map((b, index) => ({ index, stats: b ? { ...same, verified: true } : same }));
        const ranked = rankByTrust(items, (item) => composeTrust(item.stats));
        const tiedOrder = ranked.filter((i) => !better[i.index]).map((i) => i.index);
        const firstTied = ranked.findIndex((i) => !better[i.index]);
        const lastBetter = ranked.map((i) => better[i.index]).lastIndexOf(true);
        return tiedOrder.every((v, k) => k === 0 || (tiedOrder[k - 1] ?? -1) < v) && (lastBetter === -1 || firstTied === -1 || lastBetter < firstTied);
      }),
    );
  });

  it("gives identical stats identical scores", () => {
    fc.assert(fc.property(trustStats, (stats) => score(stats) === score(structuredClone(stats))));
  });

  it("three 5-star reviews do not outrank a hundred reviews averaging 4.8", () => {
    // Every way to make 100 reviews average exactly 4.8 (at least 90 of them are then 4-5 stars).
    const hundredAt48 = fc
      .record({ one: fc.nat(5), two: fc.nat(5), three: fc.nat(10) })
      .map(({ one, two, three }) => {
        const rest = 100 - one - two - three;
        const five = 480 - (one + 2 * two + 3 * three) - 4 * rest;
        return { 1: one, 2: two, 3: three, 4: rest - five, 5: five };
      })
      .filter((s) => s[4] >= 0 && s[5] >= 0);
    fc.assert(
      fc.property(hundredAt48, (stars) => {
        const total = stars[1] + stars[2] + stars[3] + stars[4] + stars[5];
        const mean = (stars[1] + 2 * stars[2] + 3 * stars[3] + 4 * stars[4] + 5 * stars[5]) / total;
        expect(total).toBe(100);
        expect(mean).toBeCloseTo(4.8, 12);
        const established = { ...plain, stars, jobsAccepted: 100, jobsCompleted: 100 };
        const newcomer = { ...plain, stars: { ...noStars, 5: 3 }, jobsAccepted: 3, jobsCompleted: 3 };
        // Same circumstances, and even with every lift for the newcomer and none for the other.
        const boosted = { ...newcomer, verified: true, medianResponseHours: 1, survivalReports: [] };
        return score(established) > score(newcomer) && score(established) > score(boosted);
      }),
    );
  });
});

describe("the 'new' threshold", () => {
  it(`below ${TRUST_PARAMETERS.minReviewsForRating} reviews a provider is new and shows counts, not a rating`, () => {
    fc.assert(
      fc.property(trustStats, (stats) => {
        const summary = composeTrust(stats);
        const total = Object.values(stats.stars).reduce((s, n) => s + n, 0);
        const expectNew = total < TRUST_PARAMETERS.minReviewsForRating;
        return (
          summary.isNew === expectNew &&
          (summary.displayRating === null) === expectNew &&
          summary.counts.reviews === total &&
          summary.counts.jobsCompleted === stats.jobsCompleted
        );
      }),
      { numRuns: 500 },
    );
  });

  it("below the threshold no record, however good, shows a rating", () => {
    fc.assert(
      fc.property(trustStats, fc.integer({ min: 0, max: TRUST_PARAMETERS.minReviewsForRating - 1 }), (stats, fives) => {
        const summary = composeTrust({ ...stats, stars: { ...noStars, 5: fives }, verified: true, medianResponseHours: 0 });
        return summary.isNew && summary.displayRating === null && summary.reasons.find((r) => r.code === "rating")?.value === null;
      }),
    );
  });

  it("exactly at the threshold the rating appears", () => {
    const atThreshold = { ...plain, stars: { ...noStars, 5: TRUST_PARAMETERS.minReviewsForRating } };
    const below = { ...plain, stars: { ...noStars, 5: TRUST_PARAMETERS.minReviewsForRating - 1 } };
    expect(composeTrust(atThreshold).isNew).toBe(false);
    expect(composeTrust(below).isNew).toBe(true);
    expect(composeTrust(below).reasons.find((r) => r.code === "rating")?.detail).toMatch(/New on Shoal/);
  });
});

describe("score and rating values", () => {
  it("with nothing but reviews, the score is the Wilson lower bound of the 4-5 star share", () => {
    // 10 reviews, 8 positive: every other item is neutral, so no lift and no penalty.
    const stats = { ...plain, stars: { 1: 1, 2: 0, 3: 1, 4: 3, 5: 5 } };
    expect(score(stats)).toBe(wilsonLowerBound(8, 10));
  });

  it("displays the damped mean (IMDb form, REFERENCE-VALUES 8.5) with the stated prior", () => {
    const stats = { ...plain, stars: { ...noStars, 4: 4, 5: 6 } };
    const v = 10;
    const R = (4 * 4 + 6 * 5) / v;
    const { mean: C, weight: m } = TRUST_PARAMETERS.displayPrior;
    expect(composeTrust(stats).displayRating).toBeCloseTo((v / (v + m)) * R + (m / (v + m)) * C, 12);
  });
});

describe("reasons", () => {
  const reasonOf = (stats: TrustStats, code: string) => composeTrust(stats).reasons.find((r) => r.code === code);

  it("lists every item for a builder, and survival only for a hatchery", () => {
    const codes = composeTrust(plain).reasons.map((r) => r.code);
    expect(codes).toEqual([
      "reviews",
      "rating",
      "jobs_completed",
      "completion_rate",
      "disputes_lost",
      "response_time",
      "verification",
    ]);
    expect(composeTrust({ ...plain, survivalReports: [] }).reasons.map((r) => r.code)).toContain("survival");
  });

  it("marks an item 'down' exactly when it lowers the score, 'up' when it raises it", () => {
    const base: TrustStats = {
      ...plain,
      stars: { ...noStars, 4: 10, 5: 10 },
      jobsAccepted: 20,
      jobsCompleted: 20,
      medianResponseHours: 24,
    };
    const cases: [string, TrustStats][] = [
      ["disputes_lost", { ...base, disputesLost: 2 }],
      ["response_time", { ...base, medianResponseHours: 100 }],
      ["response_time", { ...base, medianResponseHours: 2 }],
      ["verification", { ...base, verified: true }],
      ["completion_rate", { ...base, jobsCompleted: 10 }],
      ["survival", { ...base, survivalReports: [{ fishHandedOver: 100, fishSurvived: 40 }] }],
      ["survival", { ...base, survivalReports: [{ fishHandedOver: 100, fishSurvived: 99 }] }],
    ];
    for (const [code, stats] of cases) {
      const effect = reasonOf(stats, code)?.effect;
      const moved = score(stats) - score(base);
      expect(effect, code).toBe(moved > 0 ? "up" : moved < 0 ? "down" : "neutral");
    }
    expect(reasonOf(base, "disputes_lost")?.effect).toBe("neutral");
    expect(reasonOf(base, "verification")?.effect).toBe("neutral");
  });

  it("says how many reports the survival mean comes from", () => {
    const stats = {
      ...plain,
      survivalReports: [
        { fishHandedOver: 100, fishSurvived: 90 },
        { fishHandedOver: 100, fishSurvived: 100 },
      ],
    };
    const reason = reasonOf(stats, "survival");
    expect(reason?.value).toBeCloseTo(0.95, 12);
    expect(reason?.detail).toBe("95% on average, from 2 farmers' reports");
    expect(composeTrust(stats).counts.survivalReports).toBe(2);
  });

  it("refuses impossible inputs", () => {
    expect(() => composeTrust({ ...plain, jobsCompleted: 2, jobsAccepted: 1 })).toThrow(RangeError);
    expect(() => composeTrust({ ...plain, stars: { ...noStars, 5: -1 } })).toThrow(RangeError);
    expect(() => composeTrust({ ...plain, medianResponseHours: -2 })).toThrow(RangeError);
  });
});
