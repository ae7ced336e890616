// The provider page's review filters live in its URL, so a filtered list can be shared, reloaded and used
// without JavaScript (plain links and a GET form). Reading is lenient: a wrong or stale value is dropped, never an
// error page, because these URLs are typed, shortened and forwarded by people.

import { REVIEW_ASPECTS, REVIEW_SORTS, type AspectKey, type ReviewRole, type ReviewSort } from "./types";

export type ReviewFilters = {
  role: ReviewRole;
  sort: ReviewSort;
  stars: 1 | 2 | 3 | 4 | 5 | null;
  aspect: AspectKey | null;
  minAspectStars: 1 | 2 | 3 | 4 | 5 | null;
  cursor: string | null;
};

export type SearchParamsRecord = Record<string, string | string[] | undefined>;

function first(value: string | string[] | undefined): string | undefined {
  return Array.isArray(value) ? value[0] : value;
}

function starValue(raw: string | undefined): ReviewFilters["stars"] {
  if (raw === undefined || !/^[1-5]$/.test(raw)) return null;
  return Number(raw) as 1 | 2 | 3 | 4 | 5;
}

// The API refuses cursors past 200 characters; one that long, or with spaces or control characters, was not made by us.
const CURSOR = /^[\x21-\x7e]{1,200}$/;

/** The filters in `params`, for a provider with `roles` (the first is shown when none is named). */
export function parseReviewFilters(params: SearchParamsRecord, roles: readonly ReviewRole[]): ReviewFilters | null {
  const fallback = roles[0];
  if (fallback === undefined) return null;
  const rawRole = first(params.role);
  const role = roles.find((r) => r === rawRole) ?? fallback;
  const rawSort = first(params.sort);
  const sort = REVIEW_SORTS.find((s) => s === rawSort) ?? "newest";
  const rawAspect = first(params.aspect);
  // An aspect of the other role (a link kept from the hatchery tab) does not apply here.
  const aspect = (REVIEW_ASPECTS[role] as readonly AspectKey[]).find((a) => a === rawAspect) ?? null;
  const rawCursor = first(params.cursor);
  return {
    role,
    sort,
    stars: starValue(first(params.stars)),
    aspect,
    minAspectStars: aspect ? starValue(first(params.minAspectStars)) : null,
    cursor: rawCursor !== undefined && CURSOR.test(rawCursor) ? rawCursor : null,
  };
}

/**
 * The query string for `filters` with `change` applied. Defaults are left out so the plain page stays the plain
 * URL; any change other than paging starts again from the first page.
 */
export function reviewFiltersQuery(filters: ReviewFilters, change: Partial<ReviewFilters> = {}, defaultRole?: ReviewRole): string {
  const next: ReviewFilters = { ...filters, ...change };
  if (!("cursor" in change)) next.cursor = null;
  if (next.aspect === null) next.minAspectStars = null;
  const params = new URLSearchParams();
  if (next.role !== defaultRole) params.set("role", next.role);
  if (next.sort !== "newest") params.set("sort", next.sort);
  if (next.stars !== null) params.set("stars", String(next.stars));
  if (next.aspect !== null) params.set("aspect", next.aspect);
  if (next.minAspectStars !== null) params.set("minAspectStars", String(next.minAspectStars));
  if (next.cursor !== null) params.set("cursor", next.cursor);
  const query = params.toString();
  return query ? `?${query}` : "";
}
