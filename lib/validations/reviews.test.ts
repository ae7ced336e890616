import { describe, expect, it } from "vitest";
import { REVIEW_LIMITS } from "@/lib/reviews/types";
import { createReviewSchema, editReviewSchema, providerReviewsQuerySchema, reportSchema, reviewFormSchema, reviewQueryFromParams } from "./reviews";

// The limits are the issue's (issue 7 and the reviews contract): 1–5 whole stars overall and per aspect, text of
// 10–2000 characters after trimming, at most 6 photos, a reply of 10–1000 characters.
const fieldsOf = (result: { success: boolean; error?: { issues: { path: PropertyKey[] }[] } }) => result.error?.issues.map((i) => i.path.join(".")) ?? [];

describe("review bodies", () => {
  const ok = { subjectKind: "job", subjectId: "0b6f3c1e-1d1a-4c44-9d7e-3c1f0d0e2a11", stars: 4, body: "Good, level base and a tidy liner." };

  it("takes whole stars 1 to 5 only", () => {
    for (const stars of [1, 5]) expect(createReviewSchema.safeParse({ ...ok, stars }).success).toBe(true);
    for (const stars of [0, 6, 4.5, "4"]) expect(fieldsOf(createReviewSchema.safeParse({ ...ok, stars }))).toEqual(["stars"]);
  });

  it("trims the text and takes 10 to 2000 characters", () => {
    expect(createReviewSchema.parse({ ...ok, body: "   Ten chars!   " }).body).toBe("Ten chars!");
    expect(fieldsOf(createReviewSchema.safeParse({ ...ok, body: "  too short  " }))).toEqual(["body"]);
    expect(createReviewSchema.safeParse({ ...ok, body: "x".repeat(REVIEW_LIMITS.bodyMax) }).success).toBe(true);
    expect(fieldsOf(createReviewSchema.safeParse({ ...ok, body: "x".repeat(REVIEW_LIMITS.bodyMax + 1) }))).toEqual(["body"]);
  });

  it("takes at most 6 photos and aspects Shoal knows", () => {
    const ids = (n: number) => Array.from({ length: n }, (_, k) => `photo-${k}`);
    expect(createReviewSchema.safeParse({ ...ok, photoIds: ids(6) }).success).toBe(true);
    expect(fieldsOf(createReviewSchema.safeParse({ ...ok, photoIds: ids(7) }))).toEqual(["photoIds"]);
    expect(fieldsOf(createReviewSchema.safeParse({ ...ok, aspects: { punctuality: 4 } }))[0]).toMatch(/^aspects/);
    expect(fieldsOf(createReviewSchema.safeParse({ ...ok, aspects: { workmanship: 0 } }))).toEqual(["aspects.workmanship"]);
  });

  it("the form for a role needs every aspect of that role", () => {
    const form = reviewFormSchema("hatchery");
    const base = { stars: 5, body: "Lively, even fingerlings.", photoIds: [] };
    expect(form.safeParse({ ...base, aspects: { fish_health: 5, count_as_promised: 5, size_as_promised: 4 } }).success).toBe(true);
    expect(fieldsOf(form.safeParse({ ...base, aspects: { fish_health: 5, count_as_promised: 5 } }))).toEqual(["aspects.size_as_promised"]);
  });

  it("an edit changes at least one thing; a report names a reason", () => {
    expect(editReviewSchema.safeParse({}).success).toBe(false);
    expect(editReviewSchema.safeParse({ stars: 3 }).success).toBe(true);
    expect(reportSchema.parse({ reason: "spam", details: "  " })).toEqual({ reason: "spam", details: null });
    expect(fieldsOf(reportSchema.safeParse({ reason: "rude" }))).toEqual(["reason"]);
  });
});

describe("the reviews list query", () => {
  it("reads the URL, leaving out cleared filters", () => {
    const q = providerReviewsQuerySchema.parse(reviewQueryFromParams(new URLSearchParams("role=builder&sort=helpful&stars=&aspect=timeliness&minAspectStars=4")));
    expect(q).toEqual({ role: "builder", sort: "helpful", aspect: "timeliness", minAspectStars: 4, limit: 10 });
    expect(fieldsOf(providerReviewsQuerySchema.safeParse({ role: "builder", stars: "6" }))).toEqual(["stars"]);
    expect(fieldsOf(providerReviewsQuerySchema.safeParse({ role: "shop" }))).toEqual(["role"]);
  });
});
