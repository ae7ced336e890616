// Who may open what: every page and route handler under app/, with the status each
// kind of visitor gets. The matrix spec checks every cell against the running app
// and fails when a route file exists that this table does not list.

export const VISITORS = ["signedOut", "farmer", "hatchery", "builder", "admin"] as const;
export type Visitor = (typeof VISITORS)[number];

type Expect = number | Partial<Record<Visitor, number>> & { default: number };

export type AccessRow = {
  /** The route as in app/ (route groups removed), e.g. /api/v1/me or /dev/outbox/[id]. */
  route: string;
  method: "GET" | "POST" | "PUT" | "DELETE";
  /** The concrete URL requested; {hatcheryId} and {builderId} stand for the demo providers' ids. */
  url: string;
  body?: unknown;
  expect: Expect;
};

const ALL_200 = 200;
const SIGNED_IN_PAGE = { default: 200, signedOut: 307 };
const roleOnlyPage = (who: Visitor) => ({ default: 403, signedOut: 307, [who]: 200 });
const roleOnlyApi = (who: Visitor, ok = 200) => ({ default: 403, signedOut: 401, [who]: ok });

export const ACCESS_TABLE: AccessRow[] = [
  // Public pages
  { route: "/", method: "GET", url: "/", expect: ALL_200 },
  { route: "/safety", method: "GET", url: "/safety", expect: ALL_200 },
  { route: "/map", method: "GET", url: "/map?lat=-15.4&lng=28.3&radiusKm=50", expect: ALL_200 },
  { route: "/providers/[id]", method: "GET", url: "/providers/{hatcheryId}", expect: ALL_200 },
  { route: "/sign-in", method: "GET", url: "/sign-in", expect: ALL_200 },
  { route: "/sign-up", method: "GET", url: "/sign-up", expect: ALL_200 },
  { route: "/check-email", method: "GET", url: "/check-email?email=a%40b.test", expect: ALL_200 },
  { route: "/forgot-password", method: "GET", url: "/forgot-password", expect: ALL_200 },
  { route: "/reset-password", method: "GET", url: "/reset-password?token=nope", expect: ALL_200 },
  { route: "/dev/outbox", method: "GET", url: "/dev/outbox", expect: ALL_200 },
  { route: "/dev/outbox/[id]", method: "GET", url: "/dev/outbox/00000000-0000-0000-0000-000000000000", expect: 404 },
  { route: "/planner", method: "GET", url: "/planner", expect: ALL_200 },
  // A saved plan is readable by anyone with its link; a link to no plan is 404 for everyone.
  { route: "/plans/[id]", method: "GET", url: "/plans/00000000-0000-4000-8000-000000000000", expect: 404 },
  // Signed-in pages
  { route: "/dashboard", method: "GET", url: "/dashboard", expect: SIGNED_IN_PAGE },
  { route: "/onboarding", method: "GET", url: "/onboarding", expect: SIGNED_IN_PAGE },
  { route: "/admin", method: "GET", url: "/admin", expect: roleOnlyPage("admin") },
  { route: "/hatchery", method: "GET", url: "/hatchery", expect: roleOnlyPage("hatchery") },
  { route: "/builder", method: "GET", url: "/builder", expect: roleOnlyPage("builder") },
  // Route handlers
  { route: "/api/health", method: "GET", url: "/api/health", expect: ALL_200 },
  { route: "/api/auth/[...all]", method: "GET", url: "/api/auth/get-session", expect: ALL_200 },
  { route: "/api/images/[id]/[file]", method: "GET", url: "/api/images/00000000-0000-0000-0000-000000000000/320.webp", expect: 404 },
  { route: "/api/v1/me", method: "GET", url: "/api/v1/me", expect: { default: 200, signedOut: 401 } },
  // An empty body: signed-in users get 400 (the field named), nobody's profile changes.
  { route: "/api/v1/onboarding", method: "POST", url: "/api/v1/onboarding", body: {}, expect: { default: 400, signedOut: 401 } },
  { route: "/api/v1/listings/nearby", method: "GET", url: "/api/v1/listings/nearby?lat=-15.4&lng=28.3&radiusKm=50", expect: ALL_200 },
  { route: "/api/v1/providers/[id]", method: "GET", url: "/api/v1/providers/{hatcheryId}", expect: ALL_200 },
  // Owner (or admin) only; an empty body then gets 400 with the fields named, so nothing changes.
  { route: "/api/v1/providers/[id]/hatchery", method: "PUT", url: "/api/v1/providers/{hatcheryId}/hatchery", body: {}, expect: { default: 403, signedOut: 401, hatchery: 400, admin: 400 } },
  { route: "/api/v1/providers/[id]/builder", method: "PUT", url: "/api/v1/providers/{builderId}/builder", body: {}, expect: { default: 403, signedOut: 401, builder: 400, admin: 400 } },
  // The planner API. Estimating is open to all; an empty body is a 400 naming the field, never a 500.
  { route: "/api/plans/estimate", method: "POST", url: "/api/plans/estimate", body: {}, expect: 400 },
  { route: "/api/v1/plans", method: "GET", url: "/api/v1/plans", expect: roleOnlyApi("farmer") },
  { route: "/api/v1/plans", method: "POST", url: "/api/v1/plans", body: {}, expect: roleOnlyApi("farmer", 400) },
  { route: "/api/v1/plans/[id]", method: "GET", url: "/api/v1/plans/00000000-0000-4000-8000-000000000000", expect: 404 },
  // Changing a plan needs a farmer (PUT) or any account (DELETE), then ownership: a missing plan is 404.
  { route: "/api/v1/plans/[id]", method: "PUT", url: "/api/v1/plans/00000000-0000-4000-8000-000000000000", body: {}, expect: roleOnlyApi("farmer", 400) },
  { route: "/api/v1/plans/[id]", method: "DELETE", url: "/api/v1/plans/00000000-0000-4000-8000-000000000000", expect: { default: 404, signedOut: 401 } },
  {
    route: "/api/v1/admin/providers/[id]/verification",
    method: "POST",
    url: "/api/v1/admin/providers/no-such-provider/verification",
    body: { decision: "verified" },
    expect: roleOnlyApi("admin", 404),
  },
];

export function expected(row: AccessRow, who: Visitor): number {
  if (typeof row.expect === "number") return row.expect;
  return row.expect[who] ?? row.expect.default;
}
