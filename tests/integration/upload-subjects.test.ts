// What the upload endpoints (app/api/v1/uploads/presign and /complete) decide beyond the bytes: who may add a photo
// to which object, and how many each object holds (lib/storage/upload-kinds.ts declares the limits). Against a
// migrated temp database and s3rver; the photos are PNGs drawn here with sharp and PUT to the presigned URL as a
// browser would.
import { randomUUID } from "node:crypto";
import { eq } from "drizzle-orm";
import sharp from "sharp";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { addPerson, requestForm, useJobsEnvironment, type Stand } from "./jobs-fixtures";

let stand: Stand;
let uploads: typeof import("@/lib/uploads/upload-service");
let kinds: typeof import("@/lib/storage/upload-kinds");
let requests: typeof import("@/lib/requests/request-service");
let requestSchema: typeof import("@/lib/validations/tank-requests");

beforeAll(async () => {
  stand = await useJobsEnvironment();
  uploads = await import("@/lib/uploads/upload-service");
  kinds = await import("@/lib/storage/upload-kinds");
  requests = await import("@/lib/requests/request-service");
  requestSchema = await import("@/lib/validations/tank-requests");
});
afterAll(async () => stand.close());

async function png(seed: number): Promise<Buffer> {
  return sharp({ create: { width: 200, height: 160, channels: 3, background: { r: seed % 255, g: 120, b: 90 } } }).png().toBuffer();
}

type Who = { id: string; roles: ("farmer" | "builder" | "hatchery" | "admin")[] };

/** presign → PUT → complete, as the uploader does. */
async function upload(who: Who, kind: "site-photo" | "portfolio" | "completion-photo", subjectId: string, seed = 1) {
  const bytes = await png(seed);
  const presigned = await uploads.presignForSubject(who, { kind, subjectId, contentType: "image/png", contentLength: bytes.length });
  const put = await fetch(presigned.url, { method: "PUT", headers: presigned.headers, body: new Uint8Array(bytes) });
  expect(put.status).toBe(200);
  return { presigned, done: await uploads.completeForSubject(who, { kind, subjectId, uploadId: presigned.uploadId }) };
}

async function imageRows(kind: string, subjectId: string) {
  const { db } = await import("@/db/client");
  const { image } = await import("@/db/schema");
  return (await db.select().from(image).where(eq(image.subjectId, subjectId))).filter((r) => r.kind === kind);
}

describe("site photos: the farmer's own request, drafts included", () => {
  it("stores a photo for a request not posted yet, and the posted request shows it", async () => {
    const farmer = await addPerson({ roles: ["farmer"], at: { lat: -15, lng: 28 } });
    const form = requestForm({ lat: -15, lng: 28 });
    const { done } = await upload({ id: farmer.id, roles: ["farmer"] }, "site-photo", form.id ?? "");
    // The widest served variant of a 200 × 160 photo is the 160 px one: 160 × 128 (same 5:4 ratio).
    expect(done).toMatchObject({ kind: "site-photo", ownerId: farmer.id, width: 160, height: 128, widths: [160] });
    await requests.postTankRequest(farmer.id, requestSchema.tankRequestFormSchema.parse(form));
    const view = await (await import("@/lib/requests/request-views")).farmerRequestView(farmer.id, form.id ?? "");
    expect(view?.sitePhotos.map((p) => p.id)).toEqual([done.imageId]);
  });

  it("refuses another farmer's request, and any account whose role may not upload site photos", async () => {
    const owner = await addPerson({ roles: ["farmer"], at: { lat: -15, lng: 28 } });
    const other = await addPerson({ roles: ["farmer"], at: { lat: -15, lng: 28 } });
    const builder = await addPerson({ roles: ["builder"], at: { lat: -15, lng: 28 } });
    const form = requestForm({ lat: -15, lng: 28 });
    await requests.postTankRequest(owner.id, requestSchema.tankRequestFormSchema.parse(form));
    const input = { kind: "site-photo" as const, subjectId: form.id ?? "", contentType: "image/png", contentLength: 1000 };
    await expect(uploads.presignForSubject({ id: other.id, roles: ["farmer"] }, input)).rejects.toThrow("This tank request is not yours.");
    await expect(uploads.presignForSubject({ id: builder.id, roles: ["builder"] }, input)).rejects.toThrow("Your account cannot upload site photos.");
    await expect(uploads.completeForSubject({ id: other.id, roles: ["farmer"] }, { kind: "site-photo", subjectId: form.id ?? "", uploadId: randomUUID() })).rejects.toThrow("not yours");
  });

  it("holds at most the declared count, checked at presign and again at completion", async () => {
    const farmer = await addPerson({ roles: ["farmer"], at: { lat: -15, lng: 28 } });
    const who: Who = { id: farmer.id, roles: ["farmer"] };
    const subjectId = randomUUID();
    const max = kinds.UPLOAD_KINDS["site-photo"].maxCount;
    for (let i = 0; i < max - 1; i++) await upload(who, "site-photo", subjectId, i);
    // Two presigns handed out while one place is left: both are allowed, only the first to finish is kept.
    const bytes = await png(99);
    const p1 = await uploads.presignForSubject(who, { kind: "site-photo", subjectId, contentType: "image/png", contentLength: bytes.length });
    const p2 = await uploads.presignForSubject(who, { kind: "site-photo", subjectId, contentType: "image/png", contentLength: bytes.length });
    for (const p of [p1, p2]) await fetch(p.url, { method: "PUT", headers: p.headers, body: new Uint8Array(bytes) });
    await uploads.completeForSubject(who, { kind: "site-photo", subjectId, uploadId: p1.uploadId });
    await expect(uploads.completeForSubject(who, { kind: "site-photo", subjectId, uploadId: p2.uploadId })).rejects.toThrow(`at most ${max} site photos`);
    expect(await imageRows("site-photo", subjectId)).toHaveLength(max);
    await expect(uploads.presignForSubject(who, { kind: "site-photo", subjectId, contentType: "image/png", contentLength: 100 })).rejects.toThrow(`at most ${max} site photos`);
  });

  it("answers a double submit with the same image, stored once", async () => {
    const farmer = await addPerson({ roles: ["farmer"], at: { lat: -15, lng: 28 } });
    const who: Who = { id: farmer.id, roles: ["farmer"] };
    const subjectId = randomUUID();
    const { presigned, done } = await upload(who, "site-photo", subjectId);
    const again = await uploads.completeForSubject(who, { kind: "site-photo", subjectId, uploadId: presigned.uploadId });
    expect(again.imageId).toBe(done.imageId);
    expect(await imageRows("site-photo", subjectId)).toHaveLength(1);
    // The same upload id from someone else is refused, and changes nothing.
    const other = await addPerson({ roles: ["farmer"] });
    await expect(uploads.completeForSubject({ id: other.id, roles: ["farmer"] }, { kind: "site-photo", subjectId, uploadId: presigned.uploadId })).rejects.toThrow("another account");
  });
});

describe("completion photos: only the job's builder, only while on site", () => {
  it("lets the builder add photos on site and refuses everyone else and every other moment", async () => {
    const { db } = await import("@/db/client");
    const { job } = await import("@/db/schema-jobs");
    const quotes = await import("@/lib/quotes/quote-service");
    const jobs = await import("@/lib/jobs/job-service");
    const { payDeposit } = await import("@/lib/jobs/job-deposit");
    const { quoteFormSchema } = await import("@/lib/validations/quotes");
    const site = { lat: -10, lng: 30 };
    const farmer = await addPerson({ roles: ["farmer"], at: site });
    const builder = await addPerson({ roles: ["builder"], at: { lat: -10.05, lng: 30 }, radiusKm: 30 });
    const rival = await addPerson({ roles: ["builder"], at: { lat: -10.05, lng: 30 }, radiusKm: 30 });
    const form = requestForm(site);
    await requests.postTankRequest(farmer.id, requestSchema.tankRequestFormSchema.parse(form));
    const q = await quotes.sendQuote(builder.id, form.id ?? "", quoteFormSchema.parse({ scope: "turnkey", note: "", lines: [{ kind: "labour", description: "Build", quantity: "1", unitPrice: "800" }] }));
    const { jobId } = await quotes.acceptQuote(farmer.id, q.quoteId, 1);
    const me: Who = { id: builder.id, roles: ["builder"] };
    const input = { kind: "completion-photo" as const, subjectId: jobId, contentType: "image/png", contentLength: 1000 };

    await expect(uploads.presignForSubject(me, input)).rejects.toThrow("while the job is on site");
    await payDeposit(farmer.id, jobId, "pm_card_visa");
    await jobs.actOnJob(jobId, me, { type: "arrive" });
    await expect(uploads.presignForSubject({ id: rival.id, roles: ["builder"] }, input)).rejects.toThrow("Only the builder of this job");
    await expect(uploads.presignForSubject({ id: farmer.id, roles: ["farmer"] }, input)).rejects.toThrow("Your account cannot upload completion photos.");
    await expect(uploads.presignForSubject(me, { ...input, subjectId: randomUUID() })).rejects.toThrow("No job with this id.");

    const { done } = await upload(me, "completion-photo", jobId, 7);
    expect((await db.select().from(job).where(eq(job.id, jobId)))[0]?.state).toBe("on_site");
    await jobs.actOnJob(jobId, me, { type: "mark_built" });
    // Built: the evidence is fixed.
    await expect(uploads.presignForSubject(me, input)).rejects.toThrow("while the job is on site");
    expect((await imageRows("completion-photo", jobId)).map((r) => r.id)).toEqual([done.imageId]);
  });
});

describe("portfolio photos", () => {
  it("lets a builder add to a draft item and its own items, never another builder's", async () => {
    const builder = await addPerson({ roles: ["builder"], at: { lat: -12, lng: 28 } });
    const other = await addPerson({ roles: ["builder"], at: { lat: -12, lng: 28 } });
    const portfolio = await import("@/lib/portfolio/portfolio-service");
    const { portfolioItemFormSchema } = await import("@/lib/validations/portfolio");
    const id = randomUUID();
    const form = { id, tankType: "concrete", shape: "round", unit: "m", length: "", width: "", diameter: "4", depth: "1.2", lat: "-12.0123", lng: "28.0456", placeName: "Chongwe", completedOn: "2026-05-01", caption: "" };
    await expect(portfolio.addPortfolioItem(builder.id, portfolioItemFormSchema.parse(form))).rejects.toThrow("Add at least one photo");
    await upload({ id: builder.id, roles: ["builder"] }, "portfolio", id, 3);
    await portfolio.addPortfolioItem(builder.id, portfolioItemFormSchema.parse(form));
    await expect(uploads.presignForSubject({ id: other.id, roles: ["builder"] }, { kind: "portfolio", subjectId: id, contentType: "image/png", contentLength: 1000 })).rejects.toThrow("This portfolio item is not yours.");
    const [item] = await portfolio.listPortfolio(builder.id);
    expect(item?.photos).toHaveLength(1);
    // Stored rounded: never the typed point.
    expect(item?.approxPlace).not.toEqual({ lat: -12.0123, lng: 28.0456 });
  });
});
