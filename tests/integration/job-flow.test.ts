// Quotes and a job from acceptance to the released deposit, against a migrated temp database, the local
// Stripe-API stand-in (scripts/fakes/payments-server.ts) and the mail stand-in. Distances come from GeographicLib
// (Karney 2013) and money is worked by hand beside each check.
import { randomUUID } from "node:crypto";
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { referenceDestination, referenceDistance } from "@/lib/geo/geographiclib.test-helper";
import { addPerson, mailSubjects, requestForm, useJobsEnvironment, type Stand } from "./jobs-fixtures";

let stand: Stand;
let requests: typeof import("@/lib/requests/request-service");
let views: typeof import("@/lib/requests/request-views");
let quotes: typeof import("@/lib/quotes/quote-service");
let jobs: typeof import("@/lib/jobs/job-service");
let deposits: typeof import("@/lib/jobs/job-deposit");
let jobViews: typeof import("@/lib/jobs/job-views");
let portfolio: typeof import("@/lib/portfolio/portfolio-service");
let holds: typeof import("@/lib/payments/holds");
let requestSchema: typeof import("@/lib/validations/tank-requests");
let quoteSchema: typeof import("@/lib/validations/quotes");

beforeAll(async () => {
  stand = await useJobsEnvironment();
  requests = await import("@/lib/requests/request-service");
  views = await import("@/lib/requests/request-views");
  quotes = await import("@/lib/quotes/quote-service");
  jobs = await import("@/lib/jobs/job-service");
  deposits = await import("@/lib/jobs/job-deposit");
  jobViews = await import("@/lib/jobs/job-views");
  portfolio = await import("@/lib/portfolio/portfolio-service");
  holds = await import("@/lib/payments/holds");
  requestSchema = await import("@/lib/validations/tank-requests");
  quoteSchema = await import("@/lib/validations/quotes");
});
afterAll(async () => stand.close());

const SITE = { lat: -15.4, lng: 28.3 };

async function setting() {
  const farmer = await addPerson({ roles: ["farmer"], at: SITE });
  const baseA = referenceDestination(SITE.lat, SITE.lng, 60, 12_345);
  const baseB = referenceDestination(SITE.lat, SITE.lng, 250, 20_000);
  // Builder A: ZMW 5.00 per km, base fee ZMW 199.97. Builder B: ZMW 10.00 per km, base fee ZMW 500.00.
  const a = await addPerson({ roles: ["builder"], at: baseA, radiusKm: 30, ratePerKmMinor: 500, baseFeeMinor: 19_997 });
  const b = await addPerson({ roles: ["builder"], at: baseB, radiusKm: 30, ratePerKmMinor: 1_000, baseFeeMinor: 50_000 });
  const form = requestForm(SITE);
  const posted = await requests.postTankRequest(farmer.id, requestSchema.tankRequestFormSchema.parse(form));
  return { farmer, a, b, baseA, baseB, requestId: posted.id };
}

const quoteForm = (scope: "turnkey" | "farmer_supplies_materials", lines: { kind: "materials" | "labour" | "other"; description: string; quantity: string; unitPrice: string }[]) =>
  quoteSchema.quoteFormSchema.parse({ scope, note: "", lines });

describe("quotes: travel from the straight-line distance, versions, and acceptance", () => {
  it("prices travel as distance × rate, keeps versions on revision and refuses a stale acceptance", async () => {
    const { farmer, a, baseA, requestId } = await setting();
    const sent = await quotes.sendQuote(
      a.id,
      requestId,
      quoteForm("turnkey", [
        { kind: "materials", description: "Liner and poles", quantity: "1", unitPrice: "1223.00" },
        { kind: "labour", description: "Two builders", quantity: "2.5", unitPrice: "300" },
      ]),
    );
    const view = await views.farmerRequestView(farmer.id, requestId);
    const q = view?.quotes.find((x) => x.id === sent.quoteId);
    // Travel: the site is 12 345 m from A's base (GeographicLib), 12.345 km × ZMW 5.00 = 61.725 → ZMW 61.73.
    expect(Math.round(referenceDistance(baseA.lat, baseA.lng, SITE.lat, SITE.lng))).toBe(12_345);
    expect(q?.current.travelDistanceM).toBe(12_345);
    expect(q?.current.lines.at(-1)).toMatchObject({ kind: "travel", totalMinor: 6_173, unitPriceMinor: 500 });
    // 1 223.00 + 2.5 × 300.00 = 1 973.00; + 61.73 travel = 2 034.73; + 199.97 base fee = 2 234.70; 30 % = 670.41.
    expect(q?.current.totalMinor).toBe(223_470);
    expect(q?.current.depositMinor).toBe(67_041);
    expect(await mailSubjects(stand.mailUrl, farmer.email)).toContain(`New quote from Person ${a.id.slice(0, 4)}`);

    // Farmer supplies materials: the material line stays, priced for reference, out of the total.
    const revised = await quotes.reviseQuote(
      a.id,
      sent.quoteId,
      quoteForm("farmer_supplies_materials", [
        { kind: "materials", description: "Liner and poles", quantity: "1", unitPrice: "1223" },
        { kind: "labour", description: "Two builders", quantity: "2.5", unitPrice: "300" },
      ]),
    );
    expect(revised.version).toBe(2);
    const after = (await views.farmerRequestView(farmer.id, requestId))?.quotes.find((x) => x.id === sent.quoteId);
    // 750.00 labour + 61.73 travel + 199.97 fee = 1 011.70; materials 1 223.00 excluded.
    expect(after?.current.totalMinor).toBe(101_170);
    expect(after?.current.excludedMaterialsMinor).toBe(122_300);
    const history = await (await import("@/lib/quotes/quote-views")).quoteHistory(sent.quoteId);
    expect(history.map((h) => [h.version, h.totalMinor])).toEqual([
      [2, 101_170],
      [1, 223_470],
    ]);

    await expect(quotes.acceptQuote(farmer.id, sent.quoteId, 1)).rejects.toThrow("revised");
    const other = await addPerson({ roles: ["farmer"], at: SITE });
    await expect(quotes.acceptQuote(other.id, sent.quoteId, 2)).rejects.toThrow("not yours");
  });

  it("refuses amounts finer than the currency's minor unit, and quotes from outside the area", async () => {
    const { a, requestId } = await setting();
    await expect(quotes.sendQuote(a.id, requestId, quoteForm("turnkey", [{ kind: "labour", description: "Work", quantity: "1", unitPrice: "10.005" }]))).rejects.toThrow("ZMW has 2 decimals at most");
    const far = await addPerson({ roles: ["builder"], at: referenceDestination(SITE.lat, SITE.lng, 0, 30_001), radiusKm: 30 });
    await expect(quotes.sendQuote(far.id, requestId, quoteForm("turnkey", [{ kind: "labour", description: "Work", quantity: "1", unitPrice: "10" }]))).rejects.toThrow("outside your service area");
  });
});

describe("a job from acceptance to the released deposit", () => {
  it("declines the other quote, holds the deposit, needs a photo to be built and releases on confirmation", async () => {
    const { farmer, a, b, requestId } = await setting();
    const qa = await quotes.sendQuote(a.id, requestId, quoteForm("turnkey", [{ kind: "labour", description: "Build", quantity: "1", unitPrice: "1000" }]));
    const qb = await quotes.sendQuote(b.id, requestId, quoteForm("turnkey", [{ kind: "labour", description: "Build", quantity: "1", unitPrice: "900" }]));
    const { jobId } = await quotes.acceptQuote(farmer.id, qa.quoteId, 1);

    const losing = (await views.farmerRequestView(farmer.id, requestId))?.closedQuotes.find((q) => q.id === qb.quoteId);
    expect(losing?.state).toBe("declined");
    expect(await mailSubjects(stand.mailUrl, b.email)).toContain("The farmer chose another quote");
    expect(await mailSubjects(stand.mailUrl, a.email)).toContain("Your quote was accepted");
    await expect(quotes.sendQuote(b.id, requestId, quoteForm("turnkey", [{ kind: "labour", description: "Again", quantity: "1", unitPrice: "1" }]))).rejects.toThrow();

    // A declined card leaves the job waiting; a good card holds the deposit and schedules it.
    expect(await deposits.payDeposit(farmer.id, jobId, "pm_card_chargeDeclined")).toEqual({ ok: false, message: "Your card was declined." });
    expect((await jobViews.jobView(jobId, { id: farmer.id, roles: ["farmer"] }))?.state).toBe("awaiting_deposit");
    expect(await deposits.payDeposit(farmer.id, jobId, "pm_card_visa")).toEqual({ ok: true });
    const scheduled = await jobViews.jobView(jobId, { id: a.id, roles: ["builder"] });
    // Total: 1 000.00 labour + travel (12.345 km × 5.00 = 61.73) + fee 199.97 = 1 261.70; 30 % = 378.51.
    expect(scheduled?.depositMinor).toBe(37_851);
    expect(scheduled).toMatchObject({ state: "scheduled", hold: { state: "held", heldMinor: 37_851 } });
    expect(await mailSubjects(stand.mailUrl, a.email)).toContain("The deposit is held: the job is booked");

    const builderUser = { id: a.id, roles: ["builder"] as const };
    await expect(jobs.actOnJob(jobId, { id: b.id, roles: ["builder"] }, { type: "arrive" })).rejects.toThrow("not yours");
    await jobs.actOnJob(jobId, builderUser, { type: "arrive" });
    await expect(jobs.actOnJob(jobId, builderUser, { type: "mark_built" })).rejects.toThrow("at least 1 photo");

    // A completion photo (the upload path has its own tests): an image row of the job, by its builder.
    const { db } = await import("@/db/client");
    const { image } = await import("@/db/schema");
    const imageId = randomUUID();
    await db.insert(image).values({ id: imageId, ownerId: a.id, kind: "completion-photo", keyPrefix: `images/${imageId}`, widths: [160], width: 160, height: 120, subjectId: jobId });
    await jobs.actOnJob(jobId, builderUser, { type: "mark_built" });
    await expect(jobs.actOnJob(jobId, builderUser, { type: "confirm" })).rejects.toThrow("not for the builder");
    await jobs.actOnJob(jobId, { id: farmer.id, roles: ["farmer"] }, { type: "confirm" });

    const done = await jobViews.jobView(jobId, { id: farmer.id, roles: ["farmer"] });
    expect(done?.state).toBe("completed");
    expect(done?.hold).toMatchObject({ state: "released", releasedMinor: 37_851, heldMinor: 0 });
    expect(done?.timeline.map((t) => t.event)).toEqual(["accept_quote", "deposit_held", "arrive", "mark_built", "confirm"]);

    // The ledger of the hold sums to zero (double entry, lib/payments/ledger.ts).
    const { ledgerEntry } = await import("@/db/schema-reservations");
    const [hold] = await holds.holdsForSubject("job", jobId);
    const legs = await db.select().from(ledgerEntry).where(eq(ledgerEntry.holdId, hold?.id ?? "none"));
    expect(legs.length).toBeGreaterThan(0);
    expect(legs.reduce((s, l) => s + l.amountMinor, 0)).toBe(0);

    // The tank is in the builder's portfolio with the mark, at a rounded place, with the completion photo.
    const items = await portfolio.listPortfolio(a.id);
    expect(items).toHaveLength(1);
    expect(items[0]).toMatchObject({ throughShoal: true, tankType: "tarpaulin", photos: [{ id: imageId }] });
    expect(items[0]?.approxPlace).not.toEqual(SITE);
    // Rounded to the ~1 km grid: within a cell's half-diagonal of the site (lib/geo/coordinates.ts).
    expect(referenceDistance(SITE.lat, SITE.lng, items[0]?.approxPlace.lat ?? 0, items[0]?.approxPlace.lng ?? 0)).toBeLessThan(800);
  });

  it("confirms itself through the sweep a week after being built, and releases the deposit", async () => {
    const { farmer, a, requestId } = await setting();
    const q = await quotes.sendQuote(a.id, requestId, quoteForm("turnkey", [{ kind: "labour", description: "Build", quantity: "1", unitPrice: "700" }]));
    const { jobId } = await quotes.acceptQuote(farmer.id, q.quoteId, 1);
    await deposits.payDeposit(farmer.id, jobId, "pm_card_mastercard");
    const me = { id: a.id, roles: ["builder"] as const };
    await jobs.actOnJob(jobId, me, { type: "arrive" });
    const { db } = await import("@/db/client");
    const { image } = await import("@/db/schema");
    const imageId = randomUUID();
    await db.insert(image).values({ id: imageId, ownerId: a.id, kind: "completion-photo", keyPrefix: `images/${imageId}`, widths: [160], width: 160, height: 120, subjectId: jobId });
    const builtAt = new Date();
    await jobs.actOnJob(jobId, me, { type: "mark_built" }, builtAt);
    const { sweepJobs } = await import("@/lib/jobs/job-sweep");
    const day = 24 * 3600 * 1000;
    // JOB_PARAMETERS.autoConfirmDays is 7 (a product choice): six days on nothing moves, eight days on it is confirmed.
    expect((await sweepJobs(new Date(builtAt.getTime() + 6 * day))).autoConfirmed).toBe(0);
    expect((await sweepJobs(new Date(builtAt.getTime() + 8 * day))).autoConfirmed).toBe(1);
    const done = await jobViews.jobView(jobId, { id: farmer.id, roles: ["farmer"] });
    expect(done).toMatchObject({ state: "completed", hold: { state: "released" } });
    expect(done?.timeline.at(-1)?.event).toBe("auto_confirm");
    // The farmer can no longer dispute once it confirmed itself.
    await expect(jobs.actOnJob(jobId, { id: farmer.id, roles: ["farmer"] }, { type: "dispute", reason: "Too late to complain" })).rejects.toThrow();
  });

  it("freezes the deposit on a dispute, and a call-off before the deposit closes the request", async () => {
    const first = await setting();
    const q = await quotes.sendQuote(first.a.id, first.requestId, quoteForm("turnkey", [{ kind: "labour", description: "Build", quantity: "1", unitPrice: "500" }]));
    const { jobId } = await quotes.acceptQuote(first.farmer.id, q.quoteId, 1);
    await deposits.payDeposit(first.farmer.id, jobId, "pm_card_visa");
    await jobs.actOnJob(jobId, { id: first.a.id, roles: ["builder"] }, { type: "arrive" });
    await expect(jobs.actOnJob(jobId, { id: first.farmer.id, roles: ["farmer"] }, { type: "dispute", reason: "The liner leaks at the seam" })).resolves.toBeUndefined();
    const disputed = await jobViews.jobView(jobId, { id: first.farmer.id, roles: ["farmer"] });
    expect(disputed).toMatchObject({ state: "disputed", hold: { state: "frozen" } });

    const second = await setting();
    const q2 = await quotes.sendQuote(second.a.id, second.requestId, quoteForm("turnkey", [{ kind: "labour", description: "Build", quantity: "1", unitPrice: "500" }]));
    const job2 = await quotes.acceptQuote(second.farmer.id, q2.quoteId, 1);
    await jobs.actOnJob(job2.jobId, { id: second.farmer.id, roles: ["farmer"] }, { type: "cancel", reason: "" });
    expect((await jobViews.jobView(job2.jobId, { id: second.farmer.id, roles: ["farmer"] }))?.state).toBe("cancelled");
    expect((await views.listFarmerRequests(second.farmer.id))[0]?.state).toBe("closed");
  });
});
