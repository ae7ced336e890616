import "server-only";
import { inArray } from "drizzle-orm";
import { dbClient, db } from "@/db/client";
import { listing } from "@/db/schema";
import type { ListingKind } from "@/lib/catalog";
import { boundingBox } from "@/lib/geo/bounding-box";
import { distanceMeters } from "@/lib/geo/distance";
import { Invalid } from "@/lib/errors";
import type { TrustBadge } from "@/lib/reviews/types";
import type { NearbyQuery } from "@/lib/validations/search";
import { speciesFromMask, speciesMask, tankTypeMask, tankTypesFromMask } from "./masks";
import { chordSquared, metersFromChordSquared, SPHERICAL_RELATIVE_ERROR as EPS, unitVector } from "./sphere";

export type NearbyItem = {
  listingId: number;
  providerId: string;
  kind: ListingKind;
  displayName: string;
  region: string;
  lat: number;
  lng: number;
  verified: boolean;
  species: string[];
  tankTypes: string[];
  serviceRadiusKm: number;
  avatarImageId: string | null;
  trustScore: number;
  /** the badge a card or map popup shows, read from the listing row (written with the score by refreshListings) */
  trust: TrustBadge;
  distanceM: number;
  distanceKm: number;
};

export type NearbyPage = { items: NearbyItem[]; nextCursor: string | null };

/** "index": R*Tree boxes grown outward until a page is certain. "scan": every listing, exact (the benchmark's comparison). */
export type SearchStrategy = "index" | "scan";

type Candidate = { id: number; distanceM: number; trust: number };
type Cursor = Candidate;

// How the search works (index strategy):
// 1. The R*Tree box of a radius contains every point within it (lib/geo/bounding-box.ts).
// 2. In SQL, a chord on the mean sphere bounds the ellipsoidal distance within ±0.6 %
//    (lib/listings/sphere.ts), so rows that cannot be inside are dropped before they reach JS.
// 3. In JS, the exact WGS84 distance decides membership and order.
// For "nearest first" the radius grows from small until it holds a full page: the cost
// follows the page, not the area searched. "Most trusted first" must see the whole area.

function filterSql(q: NearbyQuery, now: number): { where: string[]; args: (number | string)[] } {
  const where: string[] = [];
  const args: (number | string)[] = [];
  if (q.kind !== "all") where.push(`r.kind = ${q.kind === "hatchery" ? 1 : 2}`);
  if (q.verified) where.push("r.verified = 1");
  if (q.species.length) {
    where.push("(r.species_mask & ?) != 0");
    args.push(speciesMask(q.species));
  }
  if (q.tankType.length) {
    where.push("(r.tank_type_mask & ?) != 0");
    args.push(tankTypeMask(q.tankType));
  }
  if (q.readyNow) {
    where.push(
      "r.kind = 1 AND EXISTS (SELECT 1 FROM batch b WHERE b.hatchery_id = r.user_id AND b.state = 'open' AND b.count_available > 0 AND b.ready_from <= ? AND b.sell_by >= ?)",
    );
    args.push(now, now);
  }
  return { where, args };
}

type Bounds = { outerM: number; innerM: number; order: "distance" | "trust"; limit: number; afterTrust?: number };

/** One SQL pass: rows in the box of `outerM` whose spherical distance could put them between innerM and outerM. */
type Row = { id: number; lat: number; lng: number; trust: number; d2: number };

/**
 * One SQL pass per longitude range of the box. `cutoff` is the earliest (in the pass's
 * order) last row among the ranges that hit the limit: rows after it may be unseen.
 */
async function fetchRows(q: NearbyQuery, b: Bounds, now: number): Promise<{ rows: Row[]; cutoff: Row | null }> {
  const center = { lat: q.lat, lng: q.lng };
  const u = unitVector(center);
  const { where, args } = filterSql(q, now);
  const d2 = "((r.x - ?) * (r.x - ?) + (r.y - ?) * (r.y - ?) + (r.z - ?) * (r.z - ?))";
  const d2Args = [u.x, u.x, u.y, u.y, u.z, u.z];
  const box = boundingBox(center, b.outerM);
  const rows: Row[] = [];
  let cutoff: Row | null = null;
  for (const range of box.lngRanges) {
    const conditions = [
      "r.min_lat >= ? AND r.max_lat <= ? AND r.min_lng >= ? AND r.max_lng <= ?",
      `${d2} <= ?`,
      ...(b.innerM > 0 ? [`${d2} >= ?`] : []),
      ...(b.afterTrust !== undefined ? ["r.trust <= ?"] : []),
      ...where,
    ];
    const sqlArgs = [
      ...d2Args,
      box.minLat,
      box.maxLat,
      range.minLng,
      range.maxLng,
      ...d2Args,
      chordSquared(b.outerM / (1 - EPS)),
      ...(b.innerM > 0 ? [...d2Args, chordSquared(b.innerM / (1 + EPS))] : []),
      ...(b.afterTrust !== undefined ? [b.afterTrust] : []),
      ...args,
    ];
    const order = b.order === "distance" ? "d2, r.id" : "r.trust DESC, d2, r.id";
    const result = await dbClient.execute({
      sql: `SELECT r.id, r.lat, r.lng, r.trust, ${d2} AS d2 FROM listing_rtree r WHERE ${conditions.join(" AND ")} ORDER BY ${order} LIMIT ?`,
      args: [...sqlArgs, b.limit],
    });
    const part = result.rows.map((row) => ({ id: Number(row[0]), lat: Number(row[1]), lng: Number(row[2]), trust: Number(row[3]), d2: Number(row[4]) }));
    rows.push(...part);
    const last = part.at(-1);
    if (part.length >= b.limit && last && (!cutoff || last.trust > cutoff.trust || (last.trust === cutoff.trust && last.d2 < cutoff.d2))) cutoff = last;
  }
  return { rows, cutoff };
}

const byDistance = (a: Candidate, b: Candidate) => a.distanceM - b.distanceM || a.id - b.id;
const byTrust = (a: Candidate, b: Candidate) => b.trust - a.trust || a.distanceM - b.distanceM || a.id - b.id;

/** Exact distances for the rows, keeping those inside `radiusM` and after the cursor. */
function exact(q: NearbyQuery, rows: { id: number; lat: number; lng: number; trust: number }[], radiusM: number, after: Cursor | null, cmp: (a: Candidate, b: Candidate) => number): Candidate[] {
  const center = { lat: q.lat, lng: q.lng };
  const seen = new Set<number>();
  const out: Candidate[] = [];
  for (const row of rows) {
    if (seen.has(row.id)) continue;
    seen.add(row.id);
    const c = { id: row.id, distanceM: distanceMeters(center, row), trust: row.trust };
    if (c.distanceM <= radiusM && (!after || cmp(c, after) > 0)) out.push(c);
  }
  return out.sort(cmp);
}

const FIRST_RING_M = 3_000;

async function nearestPage(q: NearbyQuery, after: Cursor | null, now: number): Promise<Candidate[]> {
  const radiusM = q.radiusKm * 1000;
  const need = q.limit + 1;
  const innerM = after ? after.distanceM : 0;
  let ringM = Math.min(radiusM, Math.max(FIRST_RING_M, innerM * 1.1 + FIRST_RING_M));
  for (;;) {
    // Everything with an exact distance ≤ ringM is among these rows, so the first `need` found are the first overall.
    const { rows } = await fetchRows(q, { outerM: ringM, innerM, order: "distance", limit: 1_000_000 }, now);
    const found = exact(q, rows, ringM, after, byDistance);
    if (found.length >= need || ringM >= radiusM) return found.slice(0, need);
    // Grow by the shortfall (area ∝ r²), at least ×1.5 and at most ×4 per step.
    const grow = Math.min(4, Math.max(1.5, 1.2 * Math.sqrt(need / Math.max(found.length, 1))));
    ringM = Math.min(radiusM, Math.max(ringM * grow, innerM + FIRST_RING_M));
  }
}

async function trustedPage(q: NearbyQuery, after: Cursor | null, now: number): Promise<Candidate[]> {
  const radiusM = q.radiusKm * 1000;
  const need = q.limit + 1;
  for (let limit = need * 4; ; limit *= 4) {
    const { rows, cutoff } = await fetchRows(q, { outerM: radiusM, innerM: 0, order: "trust", limit, afterTrust: after?.trust }, now);
    const found = exact(q, rows, radiusM, after, byTrust);
    if (!cutoff) return found.slice(0, need);
    // Rows come by trust, then spherical distance: an unseen row has lower trust than the cutoff, or
    // equal trust and a spherical distance at least the cutoff's, so an exact one at least (1 − ε) of it.
    const unseenFrom = metersFromChordSquared(cutoff.d2) * (1 - EPS);
    const safe = found.filter((c) => c.trust > cutoff.trust || (c.trust === cutoff.trust && c.distanceM < unseenFrom));
    if (safe.length >= need) return safe.slice(0, need);
  }
}

async function scanPage(q: NearbyQuery, after: Cursor | null, now: number): Promise<Candidate[]> {
  const { where, args } = filterSql(q, now);
  const result = await dbClient.execute({ sql: `SELECT r.id, r.lat, r.lng, r.trust FROM listing_rtree r${where.length ? ` WHERE ${where.join(" AND ")}` : ""}`, args });
  const rows = result.rows.map((row) => ({ id: Number(row[0]), lat: Number(row[1]), lng: Number(row[2]), trust: Number(row[3]) }));
  return exact(q, rows, q.radiusKm * 1000, after, q.sort === "trust" ? byTrust : byDistance).slice(0, q.limit + 1);
}

function encodeCursor(q: NearbyQuery, c: Candidate): string {
  const key = q.sort === "trust" ? [c.trust, c.distanceM, c.id] : [c.distanceM, c.id];
  return Buffer.from(JSON.stringify({ s: q.sort, k: key })).toString("base64url");
}

function decodeCursor(q: NearbyQuery): Cursor | null {
  if (!q.cursor) return null;
  try {
    const parsed = JSON.parse(Buffer.from(q.cursor, "base64url").toString("utf8")) as { s?: unknown; k?: unknown };
    const k = parsed.k;
    if (parsed.s !== q.sort || !Array.isArray(k) || !k.every((n) => typeof n === "number" && Number.isFinite(n) && n >= 0)) throw new Error("shape");
    const [a, b, c] = k as number[];
    if (q.sort === "trust" && k.length === 3 && a !== undefined && b !== undefined && c !== undefined) return { trust: a, distanceM: b, id: c };
    if (q.sort === "distance" && k.length === 2 && a !== undefined && b !== undefined) return { trust: 0, distanceM: a, id: b };
    throw new Error("length");
  } catch {
    throw new Invalid("cursor: not a cursor from this search (start again without it)", { cursor: ["Not a cursor from this search"] });
  }
}

/** Listings within the radius, exactly, nearest (or most trusted) first, one page at a time. */
export async function searchNearby(q: NearbyQuery, options: { strategy?: SearchStrategy; now?: Date } = {}): Promise<NearbyPage> {
  const now = (options.now ?? new Date()).getTime();
  const after = decodeCursor(q);
  const found =
    options.strategy === "scan" ? await scanPage(q, after, now) : q.sort === "trust" ? await trustedPage(q, after, now) : await nearestPage(q, after, now);
  const page = found.slice(0, q.limit);
  const last = page.at(-1);
  const rows = page.length ? await db.select().from(listing).where(inArray(listing.id, page.map((c) => c.id))) : [];
  const byId = new Map(rows.map((r) => [r.id, r]));
  const items: NearbyItem[] = [];
  for (const c of page) {
    const r = byId.get(c.id);
    if (!r) continue; // removed between the two reads
    items.push({
      listingId: r.id,
      providerId: r.userId,
      kind: r.kind,
      displayName: r.displayName,
      region: r.region,
      lat: r.lat,
      lng: r.lng,
      verified: r.verified,
      species: speciesFromMask(r.speciesMask),
      tankTypes: tankTypesFromMask(r.tankTypeMask),
      serviceRadiusKm: r.serviceRadiusKm,
      avatarImageId: r.avatarImageId,
      trustScore: r.trustScore,
      trust: { isNew: r.trustIsNew, displayRating: r.trustRating, reviews: r.trustReviews, jobsCompleted: r.trustJobsCompleted, verified: r.verified },
      distanceM: c.distanceM,
      distanceKm: Math.round(c.distanceM / 100) / 10,
    });
  }
  return { items, nextCursor: found.length > q.limit && last ? encodeCursor(q, last) : null };
}
