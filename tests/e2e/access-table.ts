// Who may open what: every page and route handler under app/, with the status each
// kind of visitor gets. The matrix spec checks every cell against the running app
// and fails when a route file exists that this table does not list.

export const VISITORS = ["signedOut", "farmer", "hatchery", "builder", "admin"] as const;
export type Visitor = (typeof VISITORS)[number];

type Expect = number | Partial<Record<Visitor, number>> & { default: number };

export type AccessRow = {
  /** The route as in app/ (route groups removed), e.g. /api/v1/me or /dev/outbox/[id]. */
  route: string;
  method: "GET" | "POST" | "PUT" | "PATCH" | "DELETE";
  /** The concrete URL requested; {hatcheryId} and {builderId} stand for the demo providers' ids. */
  url: string;
  body?: unknown;
  expect: Expect;
};

const ALL_200 = 200;
const SIGNED_IN_PAGE = { default: 200, signedOut: 307 };
const roleOnlyPage = (who: Visitor) => ({ default: 403, signedOut: 307, [who]: 200 });
const roleOnlyApi = (who: Visitor, ok = 200) => ({ default: 403, signedOut: 401, [who]: ok });
const NO_ID = "00000000-0000-4000-8000-000000000000";

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
  { route: "/admin/disputes", method: "GET", url: "/admin/disputes", expect: roleOnlyPage("admin") },
  { route: "/hatchery", method: "GET", url: "/hatchery", expect: roleOnlyPage("hatchery") },
  { route: "/builder", method: "GET", url: "/builder", expect: roleOnlyPage("builder") },
  { route: "/farmer/requests", method: "GET", url: "/farmer/requests", expect: roleOnlyPage("farmer") },
  { route: "/farmer/requests/new", method: "GET", url: "/farmer/requests/new", expect: roleOnlyPage("farmer") },
  { route: "/farmer/requests/[id]", method: "GET", url: "/farmer/requests/00000000-0000-4000-8000-000000000000", expect: { default: 403, signedOut: 307, farmer: 404 } },
  // The review form of a job: the farmer's own request only (issue 7).
  { route: "/farmer/requests/[id]/review", method: "GET", url: `/farmer/requests/${NO_ID}/review`, expect: { default: 403, signedOut: 307, farmer: 404 } },
  { route: "/builder/requests", method: "GET", url: "/builder/requests", expect: roleOnlyPage("builder") },
  { route: "/builder/requests/[id]", method: "GET", url: "/builder/requests/00000000-0000-4000-8000-000000000000", expect: { default: 403, signedOut: 307, builder: 404 } },
  { route: "/builder/jobs", method: "GET", url: "/builder/jobs", expect: roleOnlyPage("builder") },
  { route: "/builder/jobs/[id]", method: "GET", url: "/builder/jobs/00000000-0000-4000-8000-000000000000", expect: { default: 403, signedOut: 307, builder: 404 } },
  { route: "/builder/portfolio", method: "GET", url: "/builder/portfolio", expect: roleOnlyPage("builder") },
  // Route handlers
  { route: "/api/health", method: "GET", url: "/api/health", expect: ALL_200 },
  { route: "/icons/[size]", method: "GET", url: "/icons/192", expect: ALL_200 },
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
  // Tank requests, quotes, jobs and portfolios (issue 5). Ids that name nothing: the party gets 404, others their role's 403.
  { route: "/api/v1/tank-requests", method: "GET", url: "/api/v1/tank-requests", expect: roleOnlyApi("farmer") },
  { route: "/api/v1/tank-requests", method: "POST", url: "/api/v1/tank-requests", body: {}, expect: roleOnlyApi("farmer", 400) },
  { route: "/api/v1/tank-requests/nearby", method: "GET", url: "/api/v1/tank-requests/nearby", expect: roleOnlyApi("builder") },
  // Readable by its farmer and by builders within reach; a missing one is 404 for every signed-in account.
  { route: "/api/v1/tank-requests/[id]", method: "GET", url: "/api/v1/tank-requests/00000000-0000-4000-8000-000000000000", expect: { default: 404, signedOut: 401 } },
  { route: "/api/v1/tank-requests/[id]/close", method: "POST", url: "/api/v1/tank-requests/00000000-0000-4000-8000-000000000000/close", body: {}, expect: roleOnlyApi("farmer", 404) },
  { route: "/api/v1/tank-requests/[id]/quotes", method: "POST", url: "/api/v1/tank-requests/00000000-0000-4000-8000-000000000000/quotes", body: {}, expect: roleOnlyApi("builder", 400) },
  { route: "/api/v1/quotes/[id]", method: "PUT", url: "/api/v1/quotes/00000000-0000-4000-8000-000000000000", body: {}, expect: roleOnlyApi("builder", 400) },
  { route: "/api/v1/quotes/[id]/withdraw", method: "POST", url: "/api/v1/quotes/00000000-0000-4000-8000-000000000000/withdraw", body: {}, expect: roleOnlyApi("builder", 404) },
  { route: "/api/v1/quotes/[id]/accept", method: "POST", url: "/api/v1/quotes/00000000-0000-4000-8000-000000000000/accept", body: {}, expect: roleOnlyApi("farmer", 400) },
  { route: "/api/v1/jobs/[id]", method: "GET", url: "/api/v1/jobs/00000000-0000-4000-8000-000000000000", expect: { default: 404, signedOut: 401, hatchery: 403 } },
  { route: "/api/v1/jobs/[id]/deposit", method: "POST", url: "/api/v1/jobs/00000000-0000-4000-8000-000000000000/deposit", body: {}, expect: roleOnlyApi("farmer", 400) },
  { route: "/api/v1/jobs/[id]/events", method: "POST", url: "/api/v1/jobs/00000000-0000-4000-8000-000000000000/events", body: {}, expect: { default: 400, signedOut: 401, hatchery: 403 } },
  { route: "/api/v1/portfolio", method: "GET", url: "/api/v1/portfolio?builderId={builderId}", expect: ALL_200 },
  { route: "/api/v1/portfolio", method: "POST", url: "/api/v1/portfolio", body: {}, expect: roleOnlyApi("builder", 400) },
  { route: "/api/v1/portfolio/[id]", method: "DELETE", url: "/api/v1/portfolio/00000000-0000-4000-8000-000000000000", expect: roleOnlyApi("builder", 404) },
  // Every role may upload something; an empty body is a 400 naming the field before any object is looked at.
  { route: "/api/v1/uploads/presign", method: "POST", url: "/api/v1/uploads/presign", body: {}, expect: { default: 400, signedOut: 401 } },
  { route: "/api/v1/uploads/complete", method: "POST", url: "/api/v1/uploads/complete", body: {}, expect: { default: 400, signedOut: 401 } },
  {
    route: "/api/v1/admin/providers/[id]/verification",
    method: "POST",
    url: "/api/v1/admin/providers/no-such-provider/verification",
    body: { decision: "verified" },
    expect: roleOnlyApi("admin", 404),
  },
  // Batches and reservations (issue 4). Ids that name nothing: a permitted caller gets 404, nobody learns more.
  { route: "/hatchery/batches", method: "GET", url: "/hatchery/batches", expect: roleOnlyPage("hatchery") },
  { route: "/hatchery/batches/new", method: "GET", url: "/hatchery/batches/new", expect: roleOnlyPage("hatchery") },
  { route: "/hatchery/batches/[id]/edit", method: "GET", url: `/hatchery/batches/${NO_ID}/edit`, expect: { ...roleOnlyPage("hatchery"), hatchery: 404 } },
  { route: "/hatchery/reservations", method: "GET", url: "/hatchery/reservations", expect: roleOnlyPage("hatchery") },
  { route: "/hatchery/reservations/[id]", method: "GET", url: `/hatchery/reservations/${NO_ID}`, expect: { ...roleOnlyPage("hatchery"), hatchery: 404 } },
  { route: "/farmer/reservations", method: "GET", url: "/farmer/reservations", expect: roleOnlyPage("farmer") },
  { route: "/farmer/reservations/new", method: "GET", url: `/farmer/reservations/new?batch=${NO_ID}`, expect: { ...roleOnlyPage("farmer"), farmer: 404 } },
  { route: "/farmer/reservations/[id]", method: "GET", url: `/farmer/reservations/${NO_ID}`, expect: { ...roleOnlyPage("farmer"), farmer: 404 } },
  { route: "/farmer/reservations/[id]/review", method: "GET", url: `/farmer/reservations/${NO_ID}/review`, expect: { ...roleOnlyPage("farmer"), farmer: 404 } },
  { route: "/api/v1/batches", method: "GET", url: "/api/v1/batches", expect: roleOnlyApi("hatchery") },
  { route: "/api/v1/batches", method: "POST", url: "/api/v1/batches", body: {}, expect: roleOnlyApi("hatchery", 400) },
  { route: "/api/v1/batches/[id]", method: "GET", url: `/api/v1/batches/${NO_ID}`, expect: 404 },
  { route: "/api/v1/batches/[id]", method: "PUT", url: `/api/v1/batches/${NO_ID}`, body: {}, expect: roleOnlyApi("hatchery", 400) },
  { route: "/api/v1/batches/[id]/state", method: "POST", url: `/api/v1/batches/${NO_ID}/state`, body: {}, expect: roleOnlyApi("hatchery", 400) },
  // A farmer lists their own; `as=hatchery` is the hatchery's incoming list (another role gets 403 for each).
  { route: "/api/v1/reservations", method: "GET", url: "/api/v1/reservations", expect: roleOnlyApi("farmer") },
  { route: "/api/v1/reservations", method: "POST", url: "/api/v1/reservations", body: {}, expect: roleOnlyApi("farmer", 400) },
  { route: "/api/v1/reservations/[id]", method: "GET", url: `/api/v1/reservations/${NO_ID}`, expect: { default: 404, signedOut: 401, builder: 403 } },
  { route: "/api/v1/reservations/[id]/actions", method: "POST", url: `/api/v1/reservations/${NO_ID}/actions`, body: {}, expect: { default: 400, signedOut: 401, builder: 403 } },
  { route: "/api/v1/reservations/[id]/pay", method: "POST", url: `/api/v1/reservations/${NO_ID}/pay`, body: {}, expect: roleOnlyApi("farmer", 400) },
  { route: "/api/v1/reservations/export", method: "GET", url: "/api/v1/reservations/export", expect: roleOnlyApi("hatchery") },
  // Reviews (issue 7). Ids that name nothing and empty bodies: the permitted role gets 400 (field named) or 404, nothing is stored.
  { route: "/api/v1/reviews", method: "POST", url: "/api/v1/reviews", body: {}, expect: roleOnlyApi("farmer", 400) },
  { route: "/api/v1/reviews/[id]", method: "PATCH", url: `/api/v1/reviews/${NO_ID}`, body: {}, expect: roleOnlyApi("farmer", 400) },
  { route: "/api/v1/reviews/[id]/reply", method: "POST", url: `/api/v1/reviews/${NO_ID}/reply`, body: {}, expect: { default: 403, signedOut: 401, hatchery: 400, builder: 400 } },
  { route: "/api/v1/reviews/[id]/reports", method: "POST", url: `/api/v1/reviews/${NO_ID}/reports`, body: {}, expect: { default: 400, signedOut: 401 } },
  { route: "/api/v1/reviews/[id]/helpful", method: "PUT", url: `/api/v1/reviews/${NO_ID}/helpful`, expect: { default: 404, signedOut: 401 } },
  { route: "/api/v1/reviews/[id]/helpful", method: "DELETE", url: `/api/v1/reviews/${NO_ID}/helpful`, expect: { default: 404, signedOut: 401 } },
  { route: "/api/v1/providers/[id]/reviews", method: "GET", url: "/api/v1/providers/{hatcheryId}/reviews?role=hatchery&sort=helpful", expect: ALL_200 },
  { route: "/api/v1/admin/review-reports/[id]/decision", method: "POST", url: `/api/v1/admin/review-reports/${NO_ID}/decision`, body: {}, expect: roleOnlyApi("admin", 400) },
  // Machine-to-machine: a webhook without a valid signature and a sweep without the cron secret are refused for everyone.
  { route: "/api/webhooks/stripe", method: "POST", url: "/api/webhooks/stripe", body: {}, expect: 400 },
  { route: "/api/cron/sweep", method: "POST", url: "/api/cron/sweep", expect: 401 },
];

export function expected(row: AccessRow, who: Visitor): number {
  if (typeof row.expect === "number") return row.expect;
  return row.expect[who] ?? row.expect.default;
}
