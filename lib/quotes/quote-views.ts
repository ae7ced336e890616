import "server-only";
import { and, asc, count, eq, inArray } from "drizzle-orm";
import { db } from "@/db/client";
import { image, profile } from "@/db/schema";
import { job, portfolioItem, quote, quoteLine, quoteVersion } from "@/db/schema-jobs";
import type { QuoteLineKind } from "@/lib/jobs/quote";
import type { QuoteState } from "@/lib/jobs/vocabulary";
import type { ShownImage } from "@/lib/uploads/images";

/* Quotes as the farmer compares them and the builder reviews them: small typed objects, never raw rows. */

/** What a farmer can judge a builder by today (a trust score comes later): the check, finished jobs, the portfolio. */
export type BuilderCard = { id: string; name: string; region: string; verified: boolean; jobsCompleted: number; portfolioCount: number; avatar: ShownImage | null };

export type QuoteLineView = { kind: QuoteLineKind; description: string; quantity: number; unitPriceMinor: number; totalMinor: number; included: boolean };

export type QuoteVersionView = {
  version: number;
  sentAt: string;
  currency: string;
  farmerSuppliesMaterials: boolean;
  note: string;
  travelDistanceM: number;
  travelRatePerKmMinor: number;
  baseFeeMinor: number;
  subtotalMinor: number;
  totalMinor: number;
  depositMinor: number;
  excludedMaterialsMinor: number;
  lines: QuoteLineView[];
};

export type QuoteView = { id: string; requestId: string; state: QuoteState; builder: BuilderCard; current: QuoteVersionView; versionCount: number; firstSentAt: string };

export async function builderCards(ids: readonly string[]): Promise<Map<string, BuilderCard>> {
  const unique = [...new Set(ids)];
  if (unique.length === 0) return new Map();
  const profiles = await db
    .select({ id: profile.userId, name: profile.displayName, region: profile.region, state: profile.verificationState, avatarId: profile.avatarImageId })
    .from(profile)
    .where(inArray(profile.userId, unique));
  const completed = await db.select({ id: job.builderId, n: count() }).from(job).where(and(inArray(job.builderId, unique), eq(job.state, "completed"))).groupBy(job.builderId);
  const items = await db.select({ id: portfolioItem.builderId, n: count() }).from(portfolioItem).where(inArray(portfolioItem.builderId, unique)).groupBy(portfolioItem.builderId);
  const avatarIds = profiles.flatMap((p) => (p.avatarId ? [p.avatarId] : []));
  const avatars = avatarIds.length
    ? await db.select({ id: image.id, widths: image.widths, width: image.width, height: image.height, alt: image.alt }).from(image).where(inArray(image.id, avatarIds))
    : [];
  const byId = <T extends { id: string }>(rows: T[]) => new Map(rows.map((r) => [r.id, r]));
  const done = byId(completed);
  const shown = byId(items);
  const pics = byId(avatars);
  return new Map(
    profiles.map((p) => [
      p.id,
      { id: p.id, name: p.name, region: p.region, verified: p.state === "verified", jobsCompleted: done.get(p.id)?.n ?? 0, portfolioCount: shown.get(p.id)?.n ?? 0, avatar: p.avatarId ? (pics.get(p.avatarId) ?? null) : null },
    ]),
  );
}

async function versionViews(keys: readonly { quoteId: string; version: number }[]): Promise<Map<string, QuoteVersionView>> {
  const out = new Map<string, QuoteVersionView>();
  const ids = [...new Set(keys.map((k) => k.quoteId))];
  if (ids.length === 0) return out;
  const wanted = new Set(keys.map((k) => `${k.quoteId}:${k.version}`));
  const versions = await db.select().from(quoteVersion).where(inArray(quoteVersion.quoteId, ids));
  const lines = await db.select().from(quoteLine).where(inArray(quoteLine.quoteId, ids)).orderBy(asc(quoteLine.position));
  for (const v of versions) {
    const key = `${v.quoteId}:${v.version}`;
    if (!wanted.has(key)) continue;
    out.set(key, {
      version: v.version,
      sentAt: v.createdAt.toISOString(),
      currency: v.currency,
      farmerSuppliesMaterials: v.farmerSuppliesMaterials,
      note: v.note,
      travelDistanceM: v.travelDistanceM,
      travelRatePerKmMinor: v.travelRatePerKmMinor,
      baseFeeMinor: v.baseFeeMinor,
      subtotalMinor: v.subtotalMinor,
      totalMinor: v.totalMinor,
      depositMinor: v.depositMinor,
      excludedMaterialsMinor: v.excludedMaterialsMinor,
      lines: lines
        .filter((l) => l.quoteId === v.quoteId && l.version === v.version)
        .map((l) => ({ kind: l.kind, description: l.description, quantity: l.quantity, unitPriceMinor: l.unitPriceMinor, totalMinor: l.totalMinor, included: l.included })),
    });
  }
  return out;
}

/** Quotes on a request in the given states, cheapest first, each at its current version. */
export async function quotesForRequest(requestId: string, states: readonly QuoteState[], builderId?: string): Promise<QuoteView[]> {
  const rows = await db
    .select()
    .from(quote)
    .where(and(eq(quote.requestId, requestId), inArray(quote.state, [...states]), builderId ? eq(quote.builderId, builderId) : undefined));
  const versions = await versionViews(rows.map((r) => ({ quoteId: r.id, version: r.currentVersion })));
  const cards = await builderCards(rows.map((r) => r.builderId));
  const out: QuoteView[] = [];
  for (const r of rows) {
    const current = versions.get(`${r.id}:${r.currentVersion}`);
    const builder = cards.get(r.builderId);
    if (!current || !builder) continue;
    out.push({ id: r.id, requestId: r.requestId, state: r.state, builder, current, versionCount: r.currentVersion, firstSentAt: r.createdAt.toISOString() });
  }
  return out.sort((a, b) => a.current.totalMinor - b.current.totalMinor);
}

/** Every version of one quote, newest first (a revision never rewrites an earlier one). */
export async function quoteHistory(quoteId: string): Promise<QuoteVersionView[]> {
  const rows = await db.select({ version: quoteVersion.version }).from(quoteVersion).where(eq(quoteVersion.quoteId, quoteId));
  const views = await versionViews(rows.map((r) => ({ quoteId, version: r.version })));
  return [...views.values()].sort((a, b) => b.version - a.version);
}

/** One version of a quote (the accepted one, for a job). */
export async function quoteVersionView(quoteId: string, version: number): Promise<QuoteVersionView | null> {
  return (await versionViews([{ quoteId, version }])).get(`${quoteId}:${version}`) ?? null;
}
