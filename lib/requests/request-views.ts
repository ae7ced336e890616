import "server-only";
import { and, between, count, desc, eq, inArray, ne } from "drizzle-orm";
import { db } from "@/db/client";
import { builder, builderPrice, plan, profile } from "@/db/schema";
import { job, quote, quoteVersion, tankRequest } from "@/db/schema-jobs";
import type { TankType } from "@/lib/catalog";
import { DomainError } from "@/lib/errors";
import { APPROXIMATE_PLACE_GRID_METERS, roundCoordinate } from "@/lib/geo/coordinates";
import type { JobRowState, PowerSource, QuoteState, RequestState, SiteReadiness, WaterSource } from "@/lib/jobs/vocabulary";
import { quoteContext, type QuoteContext } from "@/lib/quotes/quote-service";
import { quoteHistory, quotesForRequest, type QuoteVersionView, type QuoteView } from "@/lib/quotes/quote-views";
import { imagesOf, type ShownImage } from "@/lib/uploads/images";
import { floorArea, tankTitle, type StoredSize } from "./format";
import { latitudeBand, reachOf } from "./reach";

/* Tank requests as each side may see them. Builders never get the exact site before a job: a distance and a rounded place. */

type RequestRow = typeof tankRequest.$inferSelect;

export type RequestDetail = {
  id: string;
  tankType: TankType;
  size: StoredSize;
  title: string;
  floorAreaM2: number;
  readiness: SiteReadiness;
  waterSource: WaterSource;
  power: PowerSource;
  wantedBy: string;
  notes: string;
  state: RequestState;
  createdAt: string;
  plan: { id: string; name: string } | null;
  sitePhotos: ShownImage[];
};

const sizeOf = (r: RequestRow): StoredSize => ({ shape: r.shape, lengthM: r.lengthM, widthM: r.widthM, diameterM: r.diameterM, depthM: r.depthM, sizeUnit: r.sizeUnit });

async function detailOf(r: RequestRow): Promise<RequestDetail> {
  const size = sizeOf(r);
  const [attached] = r.planId ? await db.select({ id: plan.id, name: plan.name }).from(plan).where(eq(plan.id, r.planId)) : [];
  return {
    id: r.id,
    tankType: r.tankType,
    size,
    title: tankTitle(r.tankType, size),
    floorAreaM2: floorArea(size),
    readiness: r.readiness,
    waterSource: r.waterSource,
    power: r.power,
    wantedBy: r.wantedBy.toISOString(),
    notes: r.notes,
    state: r.state,
    createdAt: r.createdAt.toISOString(),
    plan: attached ?? null,
    sitePhotos: await imagesOf("site-photo", r.id, r.farmerId),
  };
}

export type FarmerRequestListItem = { id: string; title: string; state: RequestState; createdAt: string; wantedBy: string; openQuotes: number; jobState: JobRowState | null };

export async function listFarmerRequests(farmerId: string): Promise<FarmerRequestListItem[]> {
  const rows = await db.select().from(tankRequest).where(eq(tankRequest.farmerId, farmerId)).orderBy(desc(tankRequest.createdAt));
  const ids = rows.map((r) => r.id);
  const counts = ids.length ? await db.select({ id: quote.requestId, n: count() }).from(quote).where(and(inArray(quote.requestId, ids), eq(quote.state, "sent"))).groupBy(quote.requestId) : [];
  const jobs = ids.length ? await db.select({ id: job.requestId, state: job.state }).from(job).where(inArray(job.requestId, ids)) : [];
  return rows.map((r) => ({
    id: r.id,
    title: tankTitle(r.tankType, sizeOf(r)),
    state: r.state,
    createdAt: r.createdAt.toISOString(),
    wantedBy: r.wantedBy.toISOString(),
    openQuotes: counts.find((c) => c.id === r.id)?.n ?? 0,
    jobState: jobs.find((j) => j.id === r.id)?.state ?? null,
  }));
}

export type FarmerRequestView = RequestDetail & { site: { lat: number; lng: number }; quotes: QuoteView[]; closedQuotes: QuoteView[]; jobId: string | null };

/** The farmer's own request with every quote; null for anyone else's (the page answers 404). */
export async function farmerRequestView(farmerId: string, requestId: string): Promise<FarmerRequestView | null> {
  const [r] = await db.select().from(tankRequest).where(and(eq(tankRequest.id, requestId), eq(tankRequest.farmerId, farmerId)));
  if (!r) return null;
  const [j] = await db.select({ id: job.id }).from(job).where(eq(job.requestId, r.id));
  return {
    ...(await detailOf(r)),
    site: { lat: r.siteLat, lng: r.siteLng },
    quotes: await quotesForRequest(r.id, ["sent", "accepted"]),
    closedQuotes: await quotesForRequest(r.id, ["withdrawn", "declined"]),
    jobId: j?.id ?? null,
  };
}

export type NearbyRequest = { id: string; title: string; tankType: TankType; floorAreaM2: number; readiness: SiteReadiness; wantedBy: string; createdAt: string; distanceM: number; myQuote: QuoteState | null };

async function builderBase(builderId: string): Promise<{ lat: number; lng: number; radiusKm: number } | null> {
  const [b] = await db.select({ lat: profile.lat, lng: profile.lng, radiusKm: builder.serviceRadiusKm }).from(builder).innerJoin(profile, eq(profile.userId, builder.userId)).where(eq(builder.userId, builderId));
  return b && b.lat !== null && b.lng !== null ? { lat: b.lat, lng: b.lng, radiusKm: b.radiusKm } : null;
}

/** Open requests whose site is inside the builder's service radius, nearest first. */
export async function openRequestsForBuilder(builderId: string): Promise<{ base: boolean; radiusKm: number; requests: NearbyRequest[] }> {
  const base = await builderBase(builderId);
  if (!base) return { base: false, radiusKm: 0, requests: [] };
  const band = latitudeBand(base.radiusKm * 1000);
  const rows = await db
    .select()
    .from(tankRequest)
    .where(and(eq(tankRequest.state, "open"), between(tankRequest.siteLat, base.lat - band, base.lat + band), ne(tankRequest.farmerId, builderId)))
    .orderBy(desc(tankRequest.createdAt))
    .limit(500);
  const mine = rows.length ? await db.select({ requestId: quote.requestId, state: quote.state }).from(quote).where(and(eq(quote.builderId, builderId), inArray(quote.requestId, rows.map((r) => r.id)))) : [];
  const requests: NearbyRequest[] = [];
  for (const r of rows) {
    const reach = reachOf(base, base.radiusKm, { lat: r.siteLat, lng: r.siteLng });
    if (!reach.covered) continue;
    const size = sizeOf(r);
    requests.push({ id: r.id, title: tankTitle(r.tankType, size), tankType: r.tankType, floorAreaM2: floorArea(size), readiness: r.readiness, wantedBy: r.wantedBy.toISOString(), createdAt: r.createdAt.toISOString(), distanceM: reach.distanceM, myQuote: mine.find((m) => m.requestId === r.id)?.state ?? null });
  }
  return { base: true, radiusKm: base.radiusKm, requests: requests.sort((a, b) => a.distanceM - b.distanceM) };
}

export type BuilderRequestView = RequestDetail & {
  distanceM: number;
  /** the site rounded to about 1 km: enough to plan a visit, not to find the home */
  approxPlace: { lat: number; lng: number };
  region: string;
  context: QuoteContext;
  myQuote: QuoteView | null;
  history: QuoteVersionView[];
  priceRow: { materialsPerSqmMinor: number; labourPerSqmMinor: number } | null;
  jobId: string | null;
};

/**
 * A request as a builder sees it: while open and within reach, or once the builder has quoted on it. Null
 * otherwise (the page answers 404), so a builder cannot read requests outside their area by guessing ids.
 */
export async function builderRequestView(builderId: string, requestId: string): Promise<BuilderRequestView | null> {
  const [r] = await db.select().from(tankRequest).where(eq(tankRequest.id, requestId));
  if (!r || r.farmerId === builderId) return null;
  // A builder with no terms or no base point cannot quote, so sees nothing (quoteContext says why when quoting).
  const context = await quoteContext(db, builderId, { lat: r.siteLat, lng: r.siteLng }).catch((error: unknown) => {
    if (error instanceof DomainError) return null;
    throw error;
  });
  const [mine] = await quotesForRequest(r.id, ["sent", "accepted", "declined", "withdrawn"], builderId);
  if (!context || (!mine && !(r.state === "open" && context.covered))) return null;
  const [farmer] = await db.select({ region: profile.region }).from(profile).where(eq(profile.userId, r.farmerId));
  const [price] = await db.select({ materialsPerSqmMinor: builderPrice.materialsPerSqmMinor, labourPerSqmMinor: builderPrice.labourPerSqmMinor }).from(builderPrice).where(and(eq(builderPrice.builderId, builderId), eq(builderPrice.tankType, r.tankType)));
  const [j] = await db.select({ id: job.id }).from(job).where(and(eq(job.requestId, r.id), eq(job.builderId, builderId)));
  return {
    ...(await detailOf(r)),
    distanceM: context.distanceM,
    approxPlace: roundCoordinate({ lat: r.siteLat, lng: r.siteLng }, APPROXIMATE_PLACE_GRID_METERS),
    region: farmer?.region ?? "",
    context,
    myQuote: mine ?? null,
    history: mine ? await quoteHistory(mine.id) : [],
    priceRow: price ?? null,
    jobId: j?.id ?? null,
  };
}

export type BuilderQuoteListItem = { quoteId: string; requestId: string; title: string; state: QuoteState; totalMinor: number; currency: string; version: number; jobId: string | null };

/** The builder's quotes, newest first, with the job each accepted one became. */
export async function builderQuotes(builderId: string): Promise<BuilderQuoteListItem[]> {
  const rows = await db
    .select({ q: quote, r: tankRequest, totalMinor: quoteVersion.totalMinor, currency: quoteVersion.currency })
    .from(quote)
    .innerJoin(tankRequest, eq(tankRequest.id, quote.requestId))
    .innerJoin(quoteVersion, and(eq(quoteVersion.quoteId, quote.id), eq(quoteVersion.version, quote.currentVersion)))
    .where(eq(quote.builderId, builderId))
    .orderBy(desc(quote.updatedAt))
    .limit(100);
  const ids = rows.map((x) => x.q.id);
  const jobs = ids.length ? await db.select({ id: job.id, quoteId: job.quoteId }).from(job).where(inArray(job.quoteId, ids)) : [];
  return rows.map(({ q, r, totalMinor, currency }) => ({
    quoteId: q.id,
    requestId: r.id,
    title: tankTitle(r.tankType, sizeOf(r)),
    state: q.state,
    totalMinor,
    currency,
    version: q.currentVersion,
    jobId: jobs.find((j) => j.quoteId === q.id)?.id ?? null,
  }));
}

/** Whether the request exists and is this farmer's: a cheap check pages make before streaming (a real 404). */
export async function isFarmersRequest(farmerId: string, requestId: string): Promise<boolean> {
  const [r] = await db.select({ id: tankRequest.id }).from(tankRequest).where(and(eq(tankRequest.id, requestId), eq(tankRequest.farmerId, farmerId)));
  return Boolean(r);
}
