import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { parseReviewFilters, reviewFiltersQuery, type ReviewFilters, type SearchParamsRecord } from "./review-filters";
import { REVIEW_ASPECTS } from "./types";

// The reference for every URL here is the platform's WHATWG URL parser (URL Standard §6, URLSearchParams, and the
// application/x-www-form-urlencoded serializer of §5.2), not our own code: a query we build must survive a real
// browser's parse, exactly as a link click or a GET form would send it.
function viaBrowserUrl(query: string): SearchParamsRecord {
  const url = new URL(`https://shoal.test/providers/p${query}#reviews`);
  const out: SearchParamsRecord = {};
  for (const key of new Set(url.searchParams.keys())) {
    const all = url.searchParams.getAll(key);
    out[key] = all.length === 1 ? all[0] : all;
  }
  return out;
}

const BOTH = ["builder", "hatchery"] as const;
const star = fc.constantFrom<1 | 2 | 3 | 4 | 5 | null>(null, 1, 2, 3, 4, 5);
const filters: fc.Arbitrary<ReviewFilters> = fc.constantFrom(...BOTH).chain((role) =>
  fc.record({
    role: fc.constant(role),
    sort: fc.constantFrom("newest" as const, "helpful" as const),
    stars: star,
    aspect: fc.constantFrom(null, ...REVIEW_ASPECTS[role]),
    minAspectStars: star,
    // any visible ASCII, including the characters the form encoding must escape (+ = & # % /)
    cursor: fc.option(fc.stringMatching(/^[\x21-\x7e]{1,40}$/), { nil: null }),
  }).map((f) => ({ ...f, minAspectStars: f.aspect === null ? null : f.minAspectStars })),
);

describe("review filters in the URL", () => {
  it("a query we build reads back to the same filters through the WHATWG URL parser", () => {
    fc.assert(
      fc.property(filters, (f) => {
        const query = reviewFiltersQuery(f, { cursor: f.cursor }, "builder");
        expect(parseReviewFilters(viaBrowserUrl(query), BOTH)).toEqual(f);
      }),
    );
  });

  it("characters with a meaning in a query are escaped as the form-urlencoded serializer does (URL Standard §5.2)", () => {
    const f = parseReviewFilters({}, BOTH);
    if (!f) throw new Error("a provider with roles has filters");
    const query = reviewFiltersQuery(f, { cursor: "a+b=c&d#e" }, "builder");
    // "+" → %2B, "=" → %3D, "&" → %26, "#" → %23: the cursor cannot leak into another parameter or the fragment.
    expect(query).toBe("?cursor=a%2Bb%3Dc%26d%23e");
  });

  it("the plain page is the plain URL: defaults are left out", () => {
    const f = parseReviewFilters({}, BOTH);
    if (!f) throw new Error("a provider with roles has filters");
    expect(f).toEqual({ role: "builder", sort: "newest", stars: null, aspect: null, minAspectStars: null, cursor: null });
    expect(reviewFiltersQuery(f, {}, "builder")).toBe("");
  });

  it("drops values that do not apply instead of failing: stars out of range, unknown sort, another role's aspect", () => {
    const parsed = parseReviewFilters(viaBrowserUrl("?role=builder&sort=best&stars=6&aspect=fish_health&minAspectStars=4"), BOTH);
    expect(parsed).toEqual({ role: "builder", sort: "newest", stars: null, aspect: null, minAspectStars: null, cursor: null });
    // A role the provider does not hold falls back to the one it does.
    expect(parseReviewFilters(viaBrowserUrl("?role=hatchery&aspect=timeliness"), ["builder"])?.role).toBe("builder");
    expect(parseReviewFilters(viaBrowserUrl("?stars=4.5"), BOTH)?.stars).toBeNull();
    expect(parseReviewFilters({ cursor: "has space" }, BOTH)?.cursor).toBeNull();
    expect(parseReviewFilters({}, [])).toBeNull();
  });

  it("a repeated parameter counts once, the first as URLSearchParams.get would return", () => {
    expect(parseReviewFilters(viaBrowserUrl("?stars=2&stars=5"), BOTH)?.stars).toBe(2);
  });

  it("changing a filter starts again at the first page; paging keeps the rest", () => {
    const f: ReviewFilters = { role: "hatchery", sort: "helpful", stars: 4, aspect: "fish_health", minAspectStars: 3, cursor: "abc" };
    expect(reviewFiltersQuery(f, { stars: 5 }, "builder")).toBe("?role=hatchery&sort=helpful&stars=5&aspect=fish_health&minAspectStars=3");
    expect(reviewFiltersQuery(f, { cursor: "next" }, "builder")).toBe("?role=hatchery&sort=helpful&stars=4&aspect=fish_health&minAspectStars=3&cursor=next");
    // Clearing the aspect clears its threshold too.
    expect(reviewFiltersQuery(f, { aspect: null }, "builder")).toBe("?role=hatchery&sort=helpful&stars=4");
  });
});
