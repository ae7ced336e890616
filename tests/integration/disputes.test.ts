// The admin's dispute queue and decisions, against a migrated temp database and the local Stripe-API stand-in:
// a disputed job shows in the queue with the farmer's reason; a split decision moves the frozen deposit in two
// parts that add up to it, and leaves an audit row with the admin's note. Amounts are worked by hand.
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { referenceDestination } from "@/lib/geo/geographiclib.test-helper";
import { addPerson, requestForm, useJobsEnvironment, type Stand } from "./jobs-fixtures";

let stand: Stand;
let requests: typeof import("@/lib/requests/request-service");
let quotes: typeof import("@/lib/quotes/quote-service");
let jobs: typeof import("@/lib/jobs/job-service");
let deposits: typeof import("@/lib/jobs/job-deposit");
let jobViews: typeof import("@/lib/jobs/job-views");
let queue: typeof import("@/lib/disputes/dispute-queue");
let requestSchema: typeof import("@/lib/validations/tank-requests");
let quoteSchema: typeof import("@/lib/validations/quotes");

beforeAll(async () => {
  stand = await useJobsEnvironment();
  requests = await import("@/lib/requests/request-service");
  quotes = await import("@/lib/quotes/quote-service");
  jobs = await import("@/lib/jobs/job-service");
  deposits = await import("@/lib/jobs/job-deposit");
  jobViews = await import("@/lib/jobs/job-views");
  queue = await import("@/lib/disputes/dispute-queue");
  requestSchema = await import("@/lib/validations/tank-requests");
  quoteSchema = await import("@/lib/validations/quotes");
});
afterAll(async () => stand.close());

const SITE = { lat: -15.4, lng: 28.3 };

async function disputedJob(reason: string) {
  const farmer = await addPerson({ roles: ["farmer"], at: SITE });
  const builder = await addPerson({ roles: ["builder"], at: referenceDestination(SITE.lat, SITE.lng, 90, 5_000), radiusKm: 30, ratePerKmMinor: 0, baseFeeMinor: 0 });
  const admin = await addPerson({ roles: ["admin"] });
  const posted = await requests.postTankRequest(farmer.id, requestSchema.tankRequestFormSchema.parse(requestForm(SITE)));
  const form = quoteSchema.quoteFormSchema.parse({ scope: "turnkey", note: "", lines: [{ kind: "labour", description: "Build", quantity: "1", unitPrice: "1000" }] });
  const sent = await quotes.sendQuote(builder.id, posted.id, form);
  const { jobId } = await quotes.acceptQuote(farmer.id, sent.quoteId, 1);
  await deposits.payDeposit(farmer.id, jobId, "pm_card_visa");
  await jobs.actOnJob(jobId, { id: builder.id, roles: ["builder"] }, { type: "arrive" });
  await jobs.actOnJob(jobId, { id: farmer.id, roles: ["farmer"] }, { type: "dispute", reason });
  return { farmer, builder, admin, jobId };
}

describe("dispute queue", () => {
  it("lists a disputed job with the farmer's reason, and a split decision empties it with an audit row", async () => {
    const { farmer, builder, admin, jobId } = await disputedJob("The frame bows out on the long side when the tank is half full");
    const listed = (await queue.listOpenDisputes()).find((d) => d.id === jobId);
    expect(listed).toMatchObject({ kind: "job", reason: "The frame bows out on the long side when the tank is half full", farmer: { id: farmer.id }, provider: { id: builder.id }, currency: "ZMW" });
    expect(await queue.countOpenDisputes()).toBeGreaterThanOrEqual(1);
    const deposit = listed?.depositMinor ?? 0;
    expect(deposit).toBeGreaterThan(0);

    // Split: a third of the deposit (rounded down to the ngwee) to the builder, the rest back to the farmer.
    const toBuilder = Math.floor(deposit / 3);
    await jobs.actOnJob(jobId, { id: admin.id, roles: ["admin"] }, { type: "resolve", outcome: "split", releaseMinor: toBuilder, note: "Called both; the frame needs a brace" });
    const view = await jobViews.jobView(jobId, { id: admin.id, roles: ["admin"] });
    expect(view?.state).toBe("resolved");
    expect(view?.hold).toMatchObject({ releasedMinor: toBuilder, returnedMinor: deposit - toBuilder });
    expect((await queue.listOpenDisputes()).some((d) => d.id === jobId)).toBe(false);

    const { db } = await import("@/db/client");
    const { auditLog } = await import("@/db/schema");
    const rows = await db.select().from(auditLog).where(eq(auditLog.subjectId, jobId));
    const decision = rows.find((r) => r.action === "job.resolve");
    expect(decision).toMatchObject({ actorId: admin.id, subjectType: "job", detail: { from: "disputed", to: "resolved", outcome: "split", releaseMinor: toBuilder, note: "Called both; the frame needs a brace" } });
  });

  it("refuses a decision from someone who is not an admin, and the dispute stays open", async () => {
    const { farmer, jobId } = await disputedJob("The liner was the wrong colour and already torn at a corner");
    await expect(jobs.actOnJob(jobId, { id: farmer.id, roles: ["farmer"] }, { type: "resolve", outcome: "for_farmer", note: "" })).rejects.toThrow();
    expect((await queue.listOpenDisputes()).some((d) => d.id === jobId)).toBe(true);
  });
});
