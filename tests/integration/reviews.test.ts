// Reviews and trust against a migrated temp database with the mail, payments and S3 stand-ins (issue 7): every guard
// refuses with nothing stored, edits keep their history, a hidden review stops counting, and the trust score and
// badge on the listing rows follow each change. Jobs and reservations are taken to their end through the real
// services, so the hooks that recompute trust and ask for a review are the ones the app runs.
// Oracles: the rules (one review per finished job, no self-review, 14-day edit window…) and
// lib/trust/compose-trust.ts, which has its own tests against published values (REFERENCE-VALUES 8).
import { randomUUID } from "node:crypto";
import { and, eq } from "drizzle-orm";
import sharp from "sharp";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Role } from "@/lib/catalog";
import { addPerson, mailSubjects, requestForm, useJobsEnvironment, type Stand } from "./jobs-fixtures";

let stand: Stand;
let dbm: typeof import("@/db/client");
let core: typeof import("@/db/schema");
let jobTables: typeof import("@/db/schema-jobs");
let rv: typeof import("@/db/schema-reviews");
let service: typeof import("@/lib/reviews/review-service");
let queries: typeof import("@/lib/reviews/queries");
let eligibility: typeof import("@/lib/reviews/eligibility");
let trustStats: typeof import("@/lib/trust/trust-stats");
let compose: typeof import("@/lib/trust/compose-trust");
let uploads: typeof import("@/lib/uploads/upload-service");
let schemas: typeof import("@/lib/validations/reviews");

beforeAll(async () => {
  stand = await useJobsEnvironment();
  dbm = await import("@/db/client");
  core = await import("@/db/schema");
  jobTables = await import("@/db/schema-jobs");
  rv = await import("@/db/schema-reviews");
  service = await import("@/lib/reviews/review-service");
  queries = await import("@/lib/reviews/queries");
  eligibility = await import("@/lib/reviews/eligibility");
  trustStats = await import("@/lib/trust/trust-stats");
  compose = await import("@/lib/trust/compose-trust");
  uploads = await import("@/lib/uploads/upload-service");
  schemas = await import("@/lib/validations/reviews");
});
afterAll(async () => stand.close());

const SITE = { lat: -15.42, lng: 28.31 };
const DAY = 86_400_000;
type Who = { id: string; email: string; roles: Role[] };

async function person(roles: Role[], at: { lat: number; lng: number } | null = SITE): Promise<Who> {
  const p = await addPerson({ roles, at });
  return { ...p, roles };
}

/** A builder near the site, with its listing built (as onboarding does). */
async function builderNearby(): Promise<Who> {
  const b = await person(["builder"], { lat: SITE.lat + 0.02, lng: SITE.lng + 0.01 });
  const { refreshListings } = await import("@/lib/listings/sync");
  await refreshListings(dbm.db, b.id);
  return b;
}

/** A job taken through request → quote → acceptance → deposit → on site → built; `end` decides the rest. */
async function jobFor(farmer: Who, builder: Who, end: "built" | "completed" | "disputed" | "resolved_for_farmer" = "completed"): Promise<string> {
  const requests = await import("@/lib/requests/request-service");
  const requestSchema = await import("@/lib/validations/tank-requests");
  const quotes = await import("@/lib/quotes/quote-service");
  const quoteSchema = await import("@/lib/validations/quotes");
  const deposits = await import("@/lib/jobs/job-deposit");
  const jobs = await import("@/lib/jobs/job-service");
  const posted = await requests.postTankRequest(farmer.id, requestSchema.tankRequestFormSchema.parse(requestForm(SITE)));
  const q = await quotes.sendQuote(builder.id, posted.id, quoteSchema.quoteFormSchema.parse({ scope: "turnkey", note: "", lines: [{ kind: "labour", description: "Build", quantity: "1", unitPrice: "800" }] }));
  const { jobId } = await quotes.acceptQuote(farmer.id, q.quoteId, 1);
  expect(await deposits.payDeposit(farmer.id, jobId, "pm_card_visa")).toEqual({ ok: true });
  await jobs.actOnJob(jobId, builder, { type: "arrive" });
  const imageId = randomUUID();
  await dbm.db.insert(core.image).values({ id: imageId, ownerId: builder.id, kind: "completion-photo", keyPrefix: `images/${imageId}`, widths: [160], width: 160, height: 120, subjectId: jobId });
  await jobs.actOnJob(jobId, builder, { type: "mark_built" });
  if (end === "built") return jobId;
  if (end === "completed") {
    await jobs.actOnJob(jobId, farmer, { type: "confirm" });
    return jobId;
  }
  await jobs.actOnJob(jobId, farmer, { type: "dispute", reason: "The liner leaks at one corner" });
  if (end === "disputed") return jobId;
  const admin = await person(["admin"], null);
  await jobs.actOnJob(jobId, admin, { type: "resolve", outcome: "for_farmer", note: "Photos show the leak" });
  return jobId;
}

const builderReview = (jobId: string, stars = 5, extra: Partial<Record<string, unknown>> = {}) =>
  schemas.createReviewSchema.parse({
    subjectKind: "job",
    subjectId: jobId,
    stars,
    aspects: { workmanship: stars, timeliness: 4, communication: 5 },
    body: "Level base, tidy liner, and they explained how to drain it.",
    ...extra,
  });

async function reviewsOf(subjectId: string) {
  return dbm.db.select().from(rv.review).where(eq(rv.review.subjectId, subjectId));
}

async function listingOf(userId: string, kind: "builder" | "hatchery") {
  const [row] = await dbm.db.select().from(core.listing).where(and(eq(core.listing.userId, userId), eq(core.listing.kind, kind)));
  return row;
}

/** Expects the promise to fail with this HTTP status (lib/errors.ts DomainError). */
async function refused(promise: Promise<unknown>, status: number): Promise<{ code: string; message: string; fieldErrors?: Record<string, string[]> }> {
  const error = await promise.then(
    () => null,
    (e: unknown) => e,
  );
  const { DomainError } = await import("@/lib/errors");
  expect(error, "expected a refusal").toBeInstanceOf(DomainError);
  if (!(error instanceof DomainError)) throw new Error("unreachable");
  expect(error.status, error.message).toBe(status);
  return { code: error.code, message: error.message, fieldErrors: error.fieldErrors };
}

describe("who may review what: each guard refuses and stores nothing", () => {
  it("refuses a review before the job is completed, and of another farmer's job", async () => {
    const [farmer, other, builder] = [await person(["farmer"]), await person(["farmer"]), await builderNearby()];
    const jobId = await jobFor(farmer, builder, "built");
    expect((await refused(service.createReview(farmer, builderReview(jobId)), 409)).code).toBe("not_finished");
    expect(await eligibility.getReviewEligibility(farmer.id, "job", jobId)).toMatchObject({ eligible: false, reason: "not_finished" });
    await refused(service.createReview(other, builderReview(jobId)), 403);
    await refused(service.createReview(farmer, builderReview(randomUUID())), 404);
    expect(await reviewsOf(jobId)).toHaveLength(0);
  });

  it("takes one review per completed job: a second is refused, by the service and by the database", async () => {
    const [farmer, builder] = [await person(["farmer"]), await builderNearby()];
    const jobId = await jobFor(farmer, builder);
    const first = await service.createReview(farmer, builderReview(jobId, 5));
    expect(first).toMatchObject({ stars: 5, role: "builder", providerUserId: builder.id, aspects: { workmanship: 5, timeliness: 4, communication: 5 } });
    expect((await refused(service.createReview(farmer, builderReview(jobId, 1)), 409)).code).toBe("already_reviewed");
    expect(await eligibility.getReviewEligibility(farmer.id, "job", jobId)).toMatchObject({ eligible: false, reason: "already_reviewed", existingReviewId: first.id });
    // Straight into the table, past the service: the unique (subject_kind, subject_id) index refuses it.
    const [row] = await reviewsOf(jobId);
    if (!row) throw new Error("no review");
    await expect(dbm.db.insert(rv.review).values({ ...row, id: randomUUID() })).rejects.toThrow();
    const stored = await reviewsOf(jobId);
    expect(stored.map((r) => r.stars)).toEqual([5]);
  });

  it("refuses a review of one's own business, whichever role it acts in", async () => {
    // One account that farms and builds: a job of its own (the quote flow would not allow it; the guard must not either).
    const both = await person(["farmer", "builder"]);
    const requestId = randomUUID();
    const jobId = randomUUID();
    const quoteId = randomUUID();
    await dbm.db.insert(jobTables.tankRequest).values({ id: requestId, farmerId: both.id, tankType: "tarpaulin", shape: "rectangular", lengthM: 3, widthM: 2, depthM: 1, siteLat: SITE.lat, siteLng: SITE.lng, readiness: "level_slab", waterSource: "mains", power: "grid", wantedBy: new Date(), state: "awarded" });
    await dbm.db.insert(jobTables.quote).values({ id: quoteId, requestId, builderId: both.id, state: "accepted" });
    await dbm.db.insert(jobTables.job).values({ id: jobId, requestId, quoteId, quoteVersion: 1, farmerId: both.id, builderId: both.id, state: "completed", currency: "ZMW", totalMinor: 100_000, depositMinor: 30_000 });
    expect((await refused(service.createReview(both, builderReview(jobId)), 403)).code).toBe("forbidden");
    expect(await eligibility.getReviewEligibility(both.id, "job", jobId)).toMatchObject({ eligible: false, reason: "own_business" });
    expect(await reviewsOf(jobId)).toHaveLength(0);
    // The database's CHECK (author_id <> provider_id) holds even past the service.
    await expect(
      dbm.db.insert(rv.review).values({ id: randomUUID(), subjectKind: "job", subjectId: jobId, role: "builder", authorId: both.id, providerId: both.id, stars: 5, body: "Reviewing my own work here", subjectLabel: "x" }),
    ).rejects.toThrow();
  });

  it("refuses a review while the job is disputed, and takes it once the dispute is settled", async () => {
    const [farmer, builder] = [await person(["farmer"]), await builderNearby()];
    const disputed = await jobFor(farmer, builder, "disputed");
    expect((await refused(service.createReview(farmer, builderReview(disputed, 2)), 409)).code).toBe("disputed");
    expect(await reviewsOf(disputed)).toHaveLength(0);
    const settled = await jobFor(farmer, builder, "resolved_for_farmer");
    await expect(service.createReview(farmer, builderReview(settled, 2))).resolves.toMatchObject({ stars: 2 });
    // A dispute decided wholly for the farmer is a dispute the builder lost (lib/trust/trust-stats.ts).
    const stats = await trustStats.gatherTrustStats(dbm.db, builder.id, "builder");
    expect(stats).toMatchObject({ disputesLost: 1, jobsCompleted: 1, jobsAccepted: 1 });
  });

  it("refuses stars outside 1..5 and aspects of the other kind of provider, naming the field", async () => {
    const [farmer, builder] = [await person(["farmer"]), await builderNearby()];
    const jobId = await jobFor(farmer, builder);
    expect(schemas.createReviewSchema.safeParse({ subjectKind: "job", subjectId: jobId, stars: 6, body: "Ten chars or more" }).success).toBe(false);
    const wrongAspect = schemas.createReviewSchema.parse({ subjectKind: "job", subjectId: jobId, stars: 4, aspects: { fish_health: 4 }, body: "Good work overall here" });
    const refusal = await refused(service.createReview(farmer, wrongAspect), 400);
    expect(Object.keys(refusal.fieldErrors ?? {})).toEqual(expect.arrayContaining(["aspects.fish_health", "aspects.workmanship"]));
    // The database's CHECK keeps stars in range even past the service.
    await expect(
      dbm.db.insert(rv.review).values({ id: randomUUID(), subjectKind: "job", subjectId: jobId, role: "builder", authorId: farmer.id, providerId: builder.id, stars: 0, body: "Zero stars is not a rating", subjectLabel: "x" }),
    ).rejects.toThrow();
    expect(await reviewsOf(jobId)).toHaveLength(0);
  });
});

describe("editing: the author only, within 14 days, with the history kept", () => {
  it("keeps the replaced version, bumps the version and shows the edit", async () => {
    const [farmer, builder] = [await person(["farmer"]), await builderNearby()];
    const jobId = await jobFor(farmer, builder);
    const writtenAt = new Date();
    const created = await service.createReview(farmer, builderReview(jobId, 3), writtenAt);
    const editedAt = new Date(writtenAt.getTime() + 2 * DAY);
    const edited = await service.editReview(farmer, created.id, schemas.editReviewSchema.parse({ stars: 5, body: "They came back and fixed the outlet the same week." }), editedAt);
    expect(edited).toMatchObject({ stars: 5, body: "They came back and fixed the outlet the same week.", editedAt: editedAt.toISOString(), aspects: { workmanship: 3, timeliness: 4, communication: 5 } });
    const history = await dbm.db.select().from(rv.reviewRevision).where(eq(rv.reviewRevision.reviewId, created.id));
    expect(history).toHaveLength(1);
    expect(history[0]).toMatchObject({ version: 1, stars: 3, body: "Level base, tidy liner, and they explained how to drain it.", aspects: { workmanship: 3, timeliness: 4, communication: 5 }, photoIds: [] });
    expect(history[0]?.writtenAt.getTime()).toBe(writtenAt.getTime());
    const [row] = await reviewsOf(jobId);
    expect(row?.version).toBe(2);
  });

  it("refuses an edit after 14 days, by another farmer, or by the provider, and changes nothing", async () => {
    const [farmer, other, builder] = [await person(["farmer"]), await person(["farmer"]), await builderNearby()];
    const jobId = await jobFor(farmer, builder);
    const writtenAt = new Date(Date.now() - 20 * DAY);
    const created = await service.createReview(farmer, builderReview(jobId, 2), writtenAt);
    const change = schemas.editReviewSchema.parse({ stars: 5 });
    // REVIEW_LIMITS.editDays = 14 (the issue): 14 days less a minute is still open, 14 days on it is closed.
    const justBefore = new Date(writtenAt.getTime() + 14 * DAY - 60_000);
    const at14 = new Date(writtenAt.getTime() + 14 * DAY);
    expect((await refused(service.editReview(farmer, created.id, change, at14), 409)).code).toBe("edit_window_closed");
    await refused(service.editReview(other, created.id, change, justBefore), 403);
    await refused(service.editReview(builder, created.id, change, justBefore), 403);
    const [row] = await reviewsOf(jobId);
    expect(row).toMatchObject({ stars: 2, version: 1, editedAt: null });
    expect(await dbm.db.select().from(rv.reviewRevision).where(eq(rv.reviewRevision.reviewId, created.id))).toHaveLength(0);
    await expect(service.editReview(farmer, created.id, change, justBefore)).resolves.toMatchObject({ stars: 5 });
  });

  it("offers no way to delete a review: the review route has no DELETE handler", async () => {
    const route = await import("@/app/api/v1/reviews/[id]/route");
    expect(Object.keys(route)).toEqual(["PATCH"]);
  });
});

describe("replies, reports, helpful marks and moderation", () => {
  it("lets the provider reply once, mails the author, and refuses a second reply or anyone else's", async () => {
    const [farmer, builder, stranger] = [await person(["farmer"]), await builderNearby(), await builderNearby()];
    const jobId = await jobFor(farmer, builder);
    const created = await service.createReview(farmer, builderReview(jobId, 4));
    expect(await mailSubjects(stand.mailUrl, builder.email)).toContain("New review: 4 stars out of 5");
    await refused(service.replyToReview(stranger, created.id, { body: "Not my customer at all" }), 403);
    await refused(service.replyToReview(farmer, created.id, { body: "Replying to myself here" }), 403);
    const replied = await service.replyToReview(builder, created.id, { body: "Thank you, and good luck with the first harvest." });
    expect(replied.reply?.body).toBe("Thank you, and good luck with the first harvest.");
    expect((await refused(service.replyToReview(builder, created.id, { body: "A second try at answering" }), 409)).code).toBe("already_replied");
    expect(await dbm.db.select().from(rv.reviewReply).where(eq(rv.reviewReply.reviewId, created.id))).toHaveLength(1);
    expect(await mailSubjects(stand.mailUrl, farmer.email)).toContain(`Person ${builder.id.slice(0, 4)} replied to your review`);
  });

  it("counts helpful marks once per person, lets them be taken back, and keeps the author and provider out", async () => {
    const [farmer, builder, a, b] = [await person(["farmer"]), await builderNearby(), await person(["farmer"]), await person(["hatchery"])];
    const jobId = await jobFor(farmer, builder);
    const created = await service.createReview(farmer, builderReview(jobId));
    expect(await service.setHelpful(a, created.id, true)).toEqual({ helpfulCount: 1, markedHelpful: true });
    expect(await service.setHelpful(a, created.id, true)).toEqual({ helpfulCount: 1, markedHelpful: true });
    expect(await service.setHelpful(b, created.id, true)).toEqual({ helpfulCount: 2, markedHelpful: true });
    expect(await service.setHelpful(a, created.id, false)).toEqual({ helpfulCount: 1, markedHelpful: false });
    await refused(service.setHelpful(farmer, created.id, true), 403);
    await refused(service.setHelpful(builder, created.id, true), 403);
    const [row] = await reviewsOf(jobId);
    expect(row?.helpfulCount).toBe(1);
  });

  it("takes one report per person to the queue; hiding the review drops it from lists and from trust, with an audit row", async () => {
    const [farmer, builder, reader, admin] = [await person(["farmer"]), await builderNearby(), await person(["farmer"]), await person(["admin"], null)];
    const kept = await service.createReview(farmer, builderReview(await jobFor(farmer, builder), 5));
    const reported = await service.createReview(farmer, builderReview(await jobFor(farmer, builder), 1, { body: "Useless people, never hire them, they are thieves." }));
    await refused(service.reportReview(farmer, reported.id, { reason: "abusive", details: null }), 403);
    const { reportId } = await service.reportReview(builder, reported.id, { reason: "abusive", details: "Calls us thieves" });
    expect((await refused(service.reportReview(builder, reported.id, { reason: "spam", details: null }), 409)).code).toBe("already_reported");
    await service.reportReview(reader, reported.id, { reason: "false", details: null });
    const queue = (await queries.listModerationReports()).filter((r) => r.reviewId === reported.id);
    expect(queue.map((r) => r.reason)).toEqual(["abusive", "false"]);
    expect(queue[0]).toMatchObject({ id: reportId, details: "Calls us thieves", review: { stars: 1, hidden: false } });

    const before = await listingOf(builder.id, "builder");
    expect(before?.trustReviews).toBe(2);
    await refused(service.decideReport(farmer, reportId, { decision: "hide", note: "Abusive words" }), 403);
    await service.decideReport(admin, reportId, { decision: "hide", note: "Insults, no facts" });
    await refused(service.decideReport(admin, reportId, { decision: "keep", note: "Second thoughts" }), 409);

    // Out of the list and the trust counts; the other open report closed with it; the decision is in the audit log.
    const page = await queries.listProviderReviews(builder.id, "builder", { sort: "newest" }, null);
    expect(page.items.map((r) => r.id)).toEqual([kept.id]);
    expect(page.starCounts).toEqual({ 1: 0, 2: 0, 3: 0, 4: 0, 5: 1 });
    const after = await listingOf(builder.id, "builder");
    expect(after?.trustReviews).toBe(1);
    const stats = await trustStats.gatherTrustStats(dbm.db, builder.id, "builder");
    expect(stats.stars).toEqual({ 1: 0, 2: 0, 3: 0, 4: 0, 5: 1 });
    expect(after?.trustScore).toBe(compose.composeTrust(stats).score);
    expect((await queries.listModerationReports()).some((r) => r.reviewId === reported.id)).toBe(false);
    const audit = await dbm.db.select().from(core.auditLog).where(and(eq(core.auditLog.subjectType, "review"), eq(core.auditLog.subjectId, reported.id)));
    expect(audit).toHaveLength(1);
    expect(audit[0]).toMatchObject({ actorId: admin.id, action: "review.hide", detail: { reportId, note: "Insults, no facts" } });
    // The author still sees it, marked hidden, and can no longer change it.
    const [hiddenRow] = await dbm.db.select().from(rv.review).where(eq(rv.review.id, reported.id));
    expect(await queries.getReviewForSubject("job", hiddenRow?.subjectId ?? "", farmer.id)).toMatchObject({ hidden: true, viewer: { canEdit: false } });
    expect(await queries.getReviewForSubject("job", hiddenRow?.subjectId ?? "", reader.id)).toBeNull();
    expect((await refused(service.editReview(farmer, reported.id, schemas.editReviewSchema.parse({ stars: 2 })), 409)).code).toBe("hidden");
  });
});

describe("trust on the listing rows", () => {
  it("writes the score and badge from what happened, and moves them when a review arrives", async () => {
    const [farmer, builder] = [await person(["farmer"]), await builderNearby()];
    const fresh = await listingOf(builder.id, "builder");
    expect(fresh).toMatchObject({ trustReviews: 0, trustJobsCompleted: 0, trustIsNew: true, trustRating: null });

    const jobId = await jobFor(farmer, builder);
    // The job's completion recomputed the builder's record and asked the farmer for a review.
    const done = await listingOf(builder.id, "builder");
    expect(done).toMatchObject({ trustReviews: 0, trustJobsCompleted: 1 });
    expect(await mailSubjects(stand.mailUrl, farmer.email)).toContain(`How did it go with Person ${builder.id.slice(0, 4)}?`);

    await service.createReview(farmer, builderReview(jobId, 5));
    const stats = await trustStats.gatherTrustStats(dbm.db, builder.id, "builder");
    // What the test did, counted by hand: one 5-star review, one job accepted and completed, a quote sent seconds
    // after the request, verified by addPerson.
    expect(stats).toMatchObject({ stars: { 1: 0, 2: 0, 3: 0, 4: 0, 5: 1 }, jobsCompleted: 1, jobsAccepted: 1, disputesLost: 0, verified: true });
    expect(stats.medianResponseHours).not.toBeNull();
    expect(stats.medianResponseHours ?? 99).toBeLessThan(1);
    const summary = compose.composeTrust(stats);
    const reviewed = await listingOf(builder.id, "builder");
    expect(reviewed).toMatchObject({ trustReviews: 1, trustJobsCompleted: 1, trustIsNew: true, trustRating: null, verified: true });
    expect(reviewed?.trustScore).toBe(summary.score);
    expect(reviewed?.trustScore).toBeGreaterThan(done?.trustScore ?? 1);

    // The nearby search carries the same badge on each item, read from the row.
    const { searchNearby } = await import("@/lib/listings/search");
    const { nearbyQuerySchema } = await import("@/lib/validations/search");
    const page = await searchNearby(nearbyQuerySchema.parse({ lat: String(SITE.lat), lng: String(SITE.lng), radiusKm: "10", kind: "builder", sort: "trust", limit: "100" }));
    const item = page.items.find((i) => i.providerId === builder.id);
    expect(item?.trust).toEqual({ isNew: true, displayRating: null, reviews: 1, jobsCompleted: 1, verified: true });
    const { getTrustBadges } = await import("@/lib/trust/provider-trust");
    expect((await getTrustBadges([{ providerUserId: builder.id, role: "builder" }])).get(`${builder.id}:builder`)).toEqual(item?.trust);
  });

  it("shows a rating from the 5th review, with the damped mean of TRUST_PARAMETERS.displayPrior", async () => {
    const [builder] = [await builderNearby()];
    const { TRUST_PARAMETERS } = await import("@/lib/trust/parameters");
    const stars = [5, 4, 5, 5, 3];
    for (const [k, s] of stars.entries()) {
      const farmer = await person(["farmer"]);
      await service.createReview(farmer, builderReview(await jobFor(farmer, builder), s));
      expect((await listingOf(builder.id, "builder"))?.trustIsNew, `after review ${k + 1}`).toBe(k + 1 < TRUST_PARAMETERS.minReviewsForRating);
    }
    // IMDb form WR = (v·R + m·C)/(v + m) (REFERENCE-VALUES 8.5) with v = 5, R = 22/5, and the stated prior.
    const { mean: C, weight: m } = TRUST_PARAMETERS.displayPrior;
    const expected = (22 + m * C) / (5 + m);
    expect((await listingOf(builder.id, "builder"))?.trustRating).toBeCloseTo(expected, 12);
  });
});

describe("hatchery reviews: only after the reservation is released, beside the survival report", () => {
  it("refuses during quarantine, asks for a review on release, and counts the survival report", async () => {
    const reservations = await import("@/lib/reservations/service");
    const farmer = await person(["farmer"]);
    const hatchery = await person(["hatchery"], { lat: SITE.lat - 0.02, lng: SITE.lng });
    await dbm.db.insert(core.hatchery).values({ userId: hatchery.id, species: ["tilapia"], delivers: false });
    const { refreshListings } = await import("@/lib/listings/sync");
    await refreshListings(dbm.db, hatchery.id);
    const t0 = new Date(Date.now() - 10 * DAY);
    const batchId = randomUUID();
    await dbm.db.insert(core.batch).values({ id: batchId, hatcheryId: hatchery.id, species: "tilapia", meanWeightG: 5, meanLengthCm: 6, countTotal: 1000, countAvailable: 1000, priceMinor: 150, currency: "ZMW", readyFrom: new Date(t0.getTime() - DAY), sellBy: new Date(t0.getTime() + 30 * DAY), delivery: "pickup" });
    const r = await reservations.createReservation(farmer, { batchId, count: 200, handoverMethod: "pickup" }, t0);
    await reservations.actOnReservation(hatchery, r.id, { action: "accept" }, new Date(t0.getTime() + 3_600_000));
    const paid = await reservations.payDeposit(farmer, r.id, "pm_card_visa", "attempt-1", new Date(t0.getTime() + 2 * 3_600_000));
    expect(paid.ok).toBe(true);
    await reservations.actOnReservation(hatchery, r.id, { action: "hand_over", count: 200 }, new Date(t0.getTime() + DAY));
    const review = schemas.createReviewSchema.parse({ subjectKind: "reservation", subjectId: r.id, stars: 4, aspects: { fish_health: 4, count_as_promised: 5, size_as_promised: 4 }, body: "Lively fish, counted together at collection." });
    expect((await refused(service.createReview(farmer, review), 409)).code).toBe("not_finished");

    // Day 8 after hand-over (RESERVATION_PARAMETERS.quarantineDays = 7): 180 of 200 alive releases the hold.
    await reservations.actOnReservation(farmer, r.id, { action: "report_survival", survived: 180 }, new Date(t0.getTime() + 9 * DAY));
    expect(await mailSubjects(stand.mailUrl, farmer.email)).toContain(`How did it go with Person ${hatchery.id.slice(0, 4)}?`);
    const stats = await trustStats.gatherTrustStats(dbm.db, hatchery.id, "hatchery");
    // Accepted one hour after the request (the clock this test set): the hatchery's response time.
    expect(stats).toMatchObject({ jobsCompleted: 1, jobsAccepted: 1, disputesLost: 0, medianResponseHours: 1, survivalReports: [{ fishHandedOver: 200, fishSurvived: 180 }] });
    expect((await listingOf(hatchery.id, "hatchery"))?.trustJobsCompleted).toBe(1);
    const reason = compose.composeTrust(stats).reasons.find((x) => x.code === "survival");
    expect(reason?.detail).toBe("90% on average, from 1 farmer's report");

    const created = await service.createReview(farmer, review);
    expect(created).toMatchObject({ role: "hatchery", subjectLabel: "Nile tilapia · 200 fingerlings", aspects: { fish_health: 4, count_as_promised: 5, size_as_promised: 4 } });
    expect((await listingOf(hatchery.id, "hatchery"))?.trustReviews).toBe(1);
  });
});

describe("review photos: uploaded for the job before the review exists, attached exactly as listed", () => {
  async function uploadPhoto(who: Who, subjectId: string, seed: number): Promise<string> {
    const bytes = await sharp({ create: { width: 200, height: 160, channels: 3, background: { r: seed * 40, g: 120, b: 90 } } }).png().toBuffer();
    const presigned = await uploads.presignForSubject(who, { kind: "review-photo", subjectId, contentType: "image/png", contentLength: bytes.length });
    const put = await fetch(presigned.url, { method: "PUT", headers: presigned.headers, body: new Uint8Array(bytes) });
    expect(put.status).toBe(200);
    return (await uploads.completeForSubject(who, { kind: "review-photo", subjectId, uploadId: presigned.uploadId })).imageId;
  }

  it("lets only the job's farmer upload, attaches the listed photos and deletes the ones taken back", async () => {
    const [farmer, other, builder] = [await person(["farmer"]), await person(["farmer"]), await builderNearby()];
    const unfinished = await jobFor(farmer, builder, "built");
    await refused(uploads.presignForSubject(farmer, { kind: "review-photo", subjectId: unfinished, contentType: "image/png", contentLength: 1000 }), 409);
    const jobId = await jobFor(farmer, builder);
    await refused(uploads.presignForSubject(other, { kind: "review-photo", subjectId: jobId, contentType: "image/png", contentLength: 1000 }), 403);
    const [a, b, c] = [await uploadPhoto(farmer, jobId, 1), await uploadPhoto(farmer, jobId, 2), await uploadPhoto(farmer, jobId, 3)];
    // A photo of someone else's upload cannot be attached.
    await refused(service.createReview(farmer, builderReview(jobId, 5, { photoIds: [a, randomUUID()] })), 400);
    const created = await service.createReview(farmer, builderReview(jobId, 5, { photoIds: [b, a] }));
    expect(created.photos.map((p) => p.imageId)).toEqual([b, a]);
    expect(created.photos[0]?.srcSet).toContain(`/api/images/${b}/160.webp 160w`);
    // c was uploaded but left out: gone. Then an edit takes a back: gone too, and the history remembers [b, a].
    const imageIds = async () => (await dbm.db.select({ id: core.image.id }).from(core.image).where(and(eq(core.image.kind, "review-photo"), eq(core.image.subjectId, jobId)))).map((r) => r.id).sort();
    expect(await imageIds()).toEqual([a, b].sort());
    const edited = await service.editReview(farmer, created.id, schemas.editReviewSchema.parse({ photoIds: [b] }));
    expect(edited.photos.map((p) => p.imageId)).toEqual([b]);
    expect(await imageIds()).toEqual([b]);
    const [revision] = await dbm.db.select().from(rv.reviewRevision).where(eq(rv.reviewRevision.reviewId, created.id));
    expect(revision?.photoIds).toEqual([b, a]);
    expect(await imageIds()).not.toContain(c);
  });
});

describe("listing reviews: sort, filters and paging", () => {
  it("pages through newest and most-helpful orders without gaps or repeats, and filters by stars and aspect", async () => {
    const builder = await builderNearby();
    const base = Date.now() - 30 * DAY;
    const made: { id: string; stars: number; at: number; helpful: number; authorId: string }[] = [];
    const voters = [await person(["farmer"]), await person(["farmer"]), await person(["farmer"])];
    const plan = [5, 3, 4, 5, 1, 4, 5];
    for (const [k, stars] of plan.entries()) {
      const farmer = await person(["farmer"]);
      const jobId = await jobFor(farmer, builder);
      const at = base + k * DAY;
      const r = await service.createReview(farmer, builderReview(jobId, stars, { aspects: { workmanship: stars, timeliness: k % 2 ? 2 : 5, communication: 4 } }), new Date(at));
      const helpful = k % 3;
      for (const v of voters.slice(0, helpful)) await service.setHelpful(v, r.id, true);
      made.push({ id: r.id, stars, at, helpful, authorId: farmer.id });
    }
    async function all(q: Omit<import("@/lib/reviews/queries").ProviderReviewQuery, "cursor">) {
      const seen: string[] = [];
      let cursor: string | null = null;
      for (let guard = 0; guard < 20; guard++) {
        const page: import("@/lib/reviews/types").ReviewPage = await queries.listProviderReviews(builder.id, "builder", { ...q, cursor, limit: 3 }, null);
        seen.push(...page.items.map((i) => i.id));
        cursor = page.nextCursor;
        if (!cursor) return { seen, total: page.total };
      }
      throw new Error("paging did not end");
    }
    const newest = await all({ sort: "newest" });
    expect(newest.seen).toEqual([...made].sort((x, y) => y.at - x.at).map((m) => m.id));
    expect(newest.total).toBe(7);
    const helpful = await all({ sort: "helpful" });
    expect(helpful.seen).toEqual([...made].sort((x, y) => y.helpful - x.helpful || y.at - x.at).map((m) => m.id));
    const fives = await all({ sort: "newest", stars: 5 });
    expect(fives.seen).toEqual(made.filter((m) => m.stars === 5).sort((x, y) => y.at - x.at).map((m) => m.id));
    expect(fives.total).toBe(3);
    const punctual = await all({ sort: "newest", aspect: "timeliness", minAspectStars: 4 });
    expect(punctual.seen).toEqual(made.filter((_, k) => k % 2 === 0).sort((x, y) => y.at - x.at).map((m) => m.id));

    const page = await queries.listProviderReviews(builder.id, "builder", { sort: "newest" }, null);
    expect(page.starCounts).toEqual({ 1: 1, 2: 0, 3: 1, 4: 2, 5: 3 });
    // Means worked by hand: workmanship = the overall stars, 27/7; timeliness 5,2,5,2,5,2,5 → 26/7; communication 4.
    expect(page.aspectMeans.workmanship?.mean).toBeCloseTo(27 / 7, 12);
    expect(page.aspectMeans.timeliness?.mean).toBeCloseTo(26 / 7, 12);
    expect(page.aspectMeans.communication).toEqual({ mean: 4, count: 7 });
    // "Given-name S.": addPerson names everyone "Person <first 4 of the id>", so the initial is the id's first character.
    const newestAuthor = made.at(-1)?.authorId ?? "";
    expect(page.items[0]?.authorName).toBe(`Person ${newestAuthor.charAt(0).toUpperCase()}.`);
    await refused(queries.listProviderReviews(builder.id, "builder", { sort: "newest", aspect: "fish_health" }, null), 400);
    await refused(queries.listProviderReviews(builder.id, "builder", { sort: "helpful", cursor: "not-a-cursor" }, null), 400);
  });
});

describe("the JSON API answers a bad body with 400 and the field named", () => {
  it("POST /api/v1/reviews, PATCH /api/v1/reviews/{id} and POST …/reply", async () => {
    const { hashPassword } = await import("better-auth/crypto");
    const farmer = await person(["farmer"]);
    await dbm.db.insert(core.account).values({ id: randomUUID(), accountId: farmer.id, providerId: "credential", userId: farmer.id, password: await hashPassword("review-test-password") });
    const { auth } = await import("@/lib/auth/auth");
    const signedIn = await auth.api.signInEmail({ body: { email: farmer.email, password: "review-test-password" }, asResponse: true });
    const cookie = (signedIn.headers.getSetCookie?.() ?? [signedIn.headers.get("set-cookie") ?? ""]).map((c) => c.split(";")[0]).join("; ");
    expect(cookie).toContain("session_token");
    const call = async (handler: (request: Request, context: { params: Promise<{ id: string }> }) => Promise<Response>, method: string, path: string, body: unknown) => {
      const response = await handler(new Request(`http://127.0.0.1:3000${path}`, { method, headers: { cookie, "content-type": "application/json", origin: "http://127.0.0.1:3000" }, body: JSON.stringify(body) }), { params: Promise.resolve({ id: randomUUID() }) });
      return { status: response.status, body: (await response.json()) as { error?: { fieldErrors?: Record<string, string[]> } } };
    };
    const create = await import("@/app/api/v1/reviews/route");
    const one = await call(create.POST, "POST", "/api/v1/reviews", { subjectKind: "job", subjectId: randomUUID(), stars: 7, body: "short" });
    expect(one.status).toBe(400);
    expect(Object.keys(one.body.error?.fieldErrors ?? {})).toEqual(expect.arrayContaining(["stars", "body"]));
    const edit = await import("@/app/api/v1/reviews/[id]/route");
    const two = await call(edit.PATCH, "PATCH", `/api/v1/reviews/${randomUUID()}`, { aspects: { workmanship: 0 } });
    expect(two.status).toBe(400);
    expect(Object.keys(two.body.error?.fieldErrors ?? {})).toContain("aspects.workmanship");
    // A farmer has no reply permission: 403 before the body is read.
    const reply = await import("@/app/api/v1/reviews/[id]/reply/route");
    expect((await call(reply.POST, "POST", `/api/v1/reviews/${randomUUID()}/reply`, {})).status).toBe(403);
    // Signed out: 401.
    const anonymous = await create.POST(new Request("http://127.0.0.1:3000/api/v1/reviews", { method: "POST", body: "{}" }), {});
    expect(anonymous.status).toBe(401);
  });
});
