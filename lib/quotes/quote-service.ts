import "server-only";
import { randomUUID } from "node:crypto";
import { and, eq, inArray, ne } from "drizzle-orm";
import { db } from "@/db/client";
import { builder, profile } from "@/db/schema";
import { job, jobEvent, quote, quoteLine, quoteVersion, tankRequest } from "@/db/schema-jobs";
import { writeTransaction, type WriteTx } from "@/db/write-transaction";
import { Conflict, Forbidden, Invalid, NotFound } from "@/lib/errors";
import { appUrl, contactsOf, notify } from "@/lib/jobs/notify";
import { quoteAcceptedMail, quoteNotChosenMail, quoteReceivedMail, quoteWithdrawnMail } from "@/lib/mail/job-templates";
import { formatMoney } from "@/lib/money/money";
import { reachOf } from "@/lib/requests/reach";
import { afterQuoteSentInTx } from "@/lib/reviews/trust-hooks";
import type { QuoteFormOutput } from "@/lib/validations/quotes";
import { priceQuoteForm, type BuilderTerms } from "./quote-pricing";

/* Sending, revising, withdrawing and accepting quotes. Every change checks the caller is the party it belongs to. */

export type QuoteContext = BuilderTerms & { distanceM: number; covered: boolean; serviceRadiusKm: number };

type Reader = typeof db | WriteTx;

/** The builder's terms and straight-line distance to this site, as a quote would use them now. */
export async function quoteContext(reader: Reader, builderId: string, site: { lat: number; lng: number }): Promise<QuoteContext> {
  const [row] = await reader
    .select({ currency: builder.currency, baseFeeMinor: builder.baseFeeMinor, travelRatePerKmMinor: builder.travelRatePerKmMinor, serviceRadiusKm: builder.serviceRadiusKm, lat: profile.lat, lng: profile.lng, state: profile.verificationState })
    .from(builder)
    .innerJoin(profile, eq(profile.userId, builder.userId))
    .where(eq(builder.userId, builderId));
  if (!row) throw new NotFound("Set up your builder profile first");
  if (row.lat === null || row.lng === null) throw new Conflict("Add your base location to your profile first: travel is worked out from it");
  const reach = reachOf({ lat: row.lat, lng: row.lng }, row.serviceRadiusKm, site);
  return { ...row, distanceM: reach.distanceM, covered: reach.covered && row.state !== "rejected" };
}

async function writeVersion(tx: WriteTx, quoteId: string, version: number, form: QuoteFormOutput, ctx: QuoteContext): Promise<number> {
  const priced = priceQuoteForm(form, ctx, ctx.distanceM);
  if (!priced.ok) {
    const first = Object.entries(priced.fieldErrors)[0];
    throw new Invalid(first ? `${first[0]}: ${first[1][0]}` : "Check the lines", priced.fieldErrors);
  }
  const p = priced.priced;
  await tx.insert(quoteVersion).values({
    quoteId,
    version,
    currency: p.currency,
    farmerSuppliesMaterials: form.scope === "farmer_supplies_materials",
    note: form.note,
    travelDistanceM: Math.round(ctx.distanceM),
    travelRatePerKmMinor: ctx.travelRatePerKmMinor,
    baseFeeMinor: p.baseServiceFeeMinor,
    subtotalMinor: p.subtotalMinor,
    totalMinor: p.totalMinor,
    depositMinor: p.depositMinor,
    excludedMaterialsMinor: p.excludedMaterialsMinor,
  });
  await tx.insert(quoteLine).values(p.lines.map((l, position) => ({ quoteId, version, position, kind: l.kind, description: l.description, quantity: l.quantity, unitPriceMinor: l.unitPriceMinor, totalMinor: l.totalMinor, included: l.included })));
  return p.totalMinor;
}

async function openRequestFor(tx: WriteTx, requestId: string, builderId: string) {
  const [request] = await tx.select().from(tankRequest).where(eq(tankRequest.id, requestId));
  if (!request) throw new NotFound("No tank request with this id");
  if (request.farmerId === builderId) throw new Forbidden("You cannot quote on your own tank request");
  if (request.state !== "open") throw new Conflict("This request is no longer open for quotes");
  const ctx = await quoteContext(tx, builderId, { lat: request.siteLat, lng: request.siteLng });
  if (!ctx.covered) throw new Forbidden("This site is outside your service area");
  return { request, ctx };
}

async function tellFarmer(farmerId: string, builderId: string, requestId: string, quoteId: string, version: number, totalMinor: number, currency: string) {
  const contacts = await contactsOf([farmerId, builderId]);
  const to = contacts.get(farmerId);
  const builderName = contacts.get(builderId)?.name ?? "A builder";
  const mail = to ? quoteReceivedMail({ name: to.name, builder: builderName, total: formatMoney(totalMinor, currency), revised: version > 1, url: appUrl(`/farmer/requests/${requestId}`) }) : null;
  await notify(to, mail, `quote:${quoteId}:v${version}`);
}

/** A first quote (or a new one after withdrawing) on an open request within the builder's reach. */
export async function sendQuote(builderId: string, requestId: string, form: QuoteFormOutput): Promise<{ quoteId: string; version: number }> {
  const result = await writeTransaction(db, async (tx) => {
    const { request, ctx } = await openRequestFor(tx, requestId, builderId);
    const [existing] = await tx.select().from(quote).where(and(eq(quote.requestId, requestId), eq(quote.builderId, builderId)));
    if (existing && existing.state !== "withdrawn") throw new Conflict("You already quoted on this request: revise that quote instead");
    const quoteId = existing?.id ?? randomUUID();
    const version = existing ? existing.currentVersion + 1 : 1;
    if (existing) await tx.update(quote).set({ state: "sent", currentVersion: version }).where(eq(quote.id, quoteId));
    else await tx.insert(quote).values({ id: quoteId, requestId, builderId, state: "sent", currentVersion: version });
    const totalMinor = await writeVersion(tx, quoteId, version, form, ctx);
    // An answer to a request changes the builder's response time (lib/trust/trust-stats.ts).
    await afterQuoteSentInTx(tx, builderId);
    return { quoteId, version, totalMinor, currency: ctx.currency, farmerId: request.farmerId };
  });
  await tellFarmer(result.farmerId, builderId, requestId, result.quoteId, result.version, result.totalMinor, result.currency);
  return { quoteId: result.quoteId, version: result.version };
}

/** A new version of a sent quote; the earlier versions stay as they were. */
export async function reviseQuote(builderId: string, quoteId: string, form: QuoteFormOutput): Promise<{ quoteId: string; version: number }> {
  const result = await writeTransaction(db, async (tx) => {
    const [existing] = await tx.select().from(quote).where(eq(quote.id, quoteId));
    if (!existing) throw new NotFound("No quote with this id");
    if (existing.builderId !== builderId) throw new Forbidden("This quote is not yours");
    if (existing.state !== "sent") throw new Conflict(existing.state === "withdrawn" ? "This quote was withdrawn: send a new one" : "This quote can no longer change");
    const { request, ctx } = await openRequestFor(tx, existing.requestId, builderId);
    const version = existing.currentVersion + 1;
    // Conditional on the version read, so two revisions sent at once cannot both claim the same number.
    const moved = await tx.update(quote).set({ currentVersion: version }).where(and(eq(quote.id, quoteId), eq(quote.currentVersion, existing.currentVersion), eq(quote.state, "sent"))).returning({ id: quote.id });
    if (moved.length === 0) throw new Conflict("This quote changed meanwhile: reload and try again");
    const totalMinor = await writeVersion(tx, quoteId, version, form, ctx);
    return { version, totalMinor, currency: ctx.currency, farmerId: request.farmerId, requestId: request.id };
  });
  await tellFarmer(result.farmerId, builderId, result.requestId, quoteId, result.version, result.totalMinor, result.currency);
  return { quoteId, version: result.version };
}

export async function withdrawQuote(builderId: string, quoteId: string): Promise<void> {
  const result = await writeTransaction(db, async (tx) => {
    const [existing] = await tx.select({ builderId: quote.builderId, state: quote.state, version: quote.currentVersion, requestId: quote.requestId, farmerId: tankRequest.farmerId }).from(quote).innerJoin(tankRequest, eq(tankRequest.id, quote.requestId)).where(eq(quote.id, quoteId));
    if (!existing) throw new NotFound("No quote with this id");
    if (existing.builderId !== builderId) throw new Forbidden("This quote is not yours");
    if (existing.state !== "sent") throw new Conflict(existing.state === "accepted" ? "The farmer accepted this quote: it is a job now" : "This quote is not open");
    await tx.update(quote).set({ state: "withdrawn" }).where(and(eq(quote.id, quoteId), eq(quote.state, "sent")));
    return existing;
  });
  const contacts = await contactsOf([result.farmerId, builderId]);
  const to = contacts.get(result.farmerId);
  const mail = to ? quoteWithdrawnMail({ name: to.name, builder: contacts.get(builderId)?.name ?? "A builder", url: appUrl(`/farmer/requests/${result.requestId}`) }) : null;
  await notify(to, mail, `quote-withdrawn:${quoteId}:v${result.version}`);
}

/**
 * The farmer accepts the version they looked at (a quote revised meanwhile is refused, so nobody accepts a price
 * they did not see). The request becomes a job waiting for its deposit; every other open quote is declined.
 */
export async function acceptQuote(farmerId: string, quoteId: string, seenVersion: number): Promise<{ jobId: string }> {
  const result = await writeTransaction(db, async (tx) => {
    const [q] = await tx.select().from(quote).where(eq(quote.id, quoteId));
    if (!q) throw new NotFound("No quote with this id");
    const [request] = await tx.select().from(tankRequest).where(eq(tankRequest.id, q.requestId));
    if (!request) throw new NotFound("No tank request with this id");
    if (request.farmerId !== farmerId) throw new Forbidden("This tank request is not yours");
    if (request.state !== "open") throw new Conflict("You already chose a quote for this request, or closed it");
    if (q.state !== "sent") throw new Conflict("This quote is no longer open");
    if (q.currentVersion !== seenVersion) throw new Conflict("The builder revised this quote since you opened the page: look at it again before accepting");
    const [v] = await tx.select().from(quoteVersion).where(and(eq(quoteVersion.quoteId, quoteId), eq(quoteVersion.version, q.currentVersion)));
    if (!v) throw new Error(`quote ${quoteId} has no version ${q.currentVersion}`);

    const awarded = await tx.update(tankRequest).set({ state: "awarded" }).where(and(eq(tankRequest.id, request.id), eq(tankRequest.state, "open"))).returning({ id: tankRequest.id });
    if (awarded.length === 0) throw new Conflict("You already chose a quote for this request");
    await tx.update(quote).set({ state: "accepted" }).where(eq(quote.id, quoteId));
    const others = await tx.select({ id: quote.id, builderId: quote.builderId }).from(quote).where(and(eq(quote.requestId, request.id), ne(quote.id, quoteId), eq(quote.state, "sent")));
    if (others.length) await tx.update(quote).set({ state: "declined" }).where(inArray(quote.id, others.map((o) => o.id)));

    const jobId = randomUUID();
    await tx.insert(job).values({ id: jobId, requestId: request.id, quoteId, quoteVersion: v.version, farmerId, builderId: q.builderId, state: "awaiting_deposit", currency: v.currency, totalMinor: v.totalMinor, depositMinor: v.depositMinor });
    await tx.insert(jobEvent).values({ jobId, event: "accept_quote", fromState: null, toState: "awaiting_deposit", actorId: farmerId, actorRole: "farmer", detail: { quoteId, version: v.version, totalMinor: v.totalMinor } });
    return { jobId, builderId: q.builderId, others, v };
  });

  const contacts = await contactsOf([farmerId, result.builderId, ...result.others.map((o) => o.builderId)]);
  const winner = contacts.get(result.builderId);
  const money = (minor: number) => formatMoney(minor, result.v.currency);
  await notify(
    winner,
    winner ? quoteAcceptedMail({ name: winner.name, farmer: contacts.get(farmerId)?.name ?? "The farmer", total: money(result.v.totalMinor), deposit: money(result.v.depositMinor), url: appUrl(`/builder/jobs/${result.jobId}`) }) : null,
    `quote-accepted:${quoteId}`,
  );
  for (const o of result.others) {
    const to = contacts.get(o.builderId);
    await notify(to, to ? quoteNotChosenMail({ name: to.name, url: appUrl("/builder/requests") }) : null, `quote-not-chosen:${o.id}`);
  }
  return { jobId: result.jobId };
}
