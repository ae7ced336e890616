import "server-only";
import { inArray } from "drizzle-orm";
import { dbClient, db } from "@/db/client";
import { listing } from "@/db/schema";
import { type ListingKind } from "@/lib/catalog";
import { boundingBox } from "@/lib/geo/bounding-box";
import { distanceMeters } from "@/lib/geo/distance";
import { Invalid } from "@/lib/errors";
import type { NearbyQuery } from "@/lib/validations/search";
import { speciesFromMask, speciesMask, tankTypeMask, tankTypesFromMask } from "./masks";

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
  distanceM: number;
  distanceKm: number;
};

export type NearbyPage = { items: NearbyItem[]; nextCursor: string | null; total: number };

type Candidate = { id: number; distanceM: number; trust: number };

/** "index" uses the R*Tree box pre-filter; "scan" reads every listing (kept for the benchmark's comparison). */
export type SearchStrategy = "index" | "scan";

function filterSql(q: NearbyQuery, now: number): { where: string[]; args: (number | string)[] } {
  const where: string[] = [];
  const args: (number | string)[] = [];
  if (q.kind !== "all") {
    where.push("l.kind = ?");
    args.push(q.kind);
  }
  if (q.verified) where.push("l.verified = 1");
  if (q.species.length) {
    where.push("(l.species_mask & ?) != 0");
    args.push(speciesMask(q.species));
  }
  if (q.tankType.length) {
    where.push("(l.tank_type_mask & ?) != 0");
    args.push(tankTypeMask(q.tankType));
  }
  if (q.readyNow) {
    where.push(
      "l.kind = 'hatchery' AND EXISTS (SELECT 1 FROM batch b WHERE b.hatchery_id = l.user_id AND b.state = 'open' AND b.count_available > 0 AND b.ready_from <= ? AND b.sell_by >= ?)",
    );
    args.push(now, now);
  }
  return { where, args };
}

async function candidates(q: NearbyQuery, strategy: SearchStrategy, now: number): Promise<Candidate[]> {
  const center = { lat: q.lat, lng: q.lng };
  const radiusM = q.radiusKm * 1000;
  const { where, args } = filterSql(q, now);
  const statements: { sql: string; args: (number | string)[] }[] = [];
  if (strategy === "index") {
    const box = boundingBox(center, radiusM);
    for (const range of box.lngRanges) {
      statements.push({
        sql: `SELECT l.id, l.lat, l.lng, l.trust_score FROM listing_rtree r JOIN listing l ON l.id = r.id
              WHERE r.min_lat >= ? AND r.max_lat <= ? AND r.min_lng >= ? AND r.max_lng <= ?${where.length ? ` AND ${where.join(" AND ")}` : ""}`,
        args: [box.minLat, box.maxLat, range.minLng, range.maxLng, ...args],
      });
    }
  } else {
    statements.push({ sql: `SELECT l.id, l.lat, l.lng, l.trust_score FROM listing l${where.length ? ` WHERE ${where.join(" AND ")}` : ""}`, args });
  }
  const out: Candidate[] = [];
  const seen = new Set<number>();
  for (const stmt of statements) {
    const result = await dbClient.execute(stmt);
    for (const row of result.rows) {
      const id = Number(row[0]);
      if (seen.has(id)) continue;
      seen.add(id);
      // Exact after the pre-filter: the box only narrows, the ellipsoidal distance decides.
      const d = distanceMeters(center, { lat: Number(row[1]), lng: Number(row[2]) });
      if (d <= radiusM) out.push({ id, distanceM: d, trust: Number(row[3]) });
    }
  }
  return out;
}

type CursorKey = [number, number] | [number, number, number];

function compare(q: NearbyQuery): (a: Candidate, b: Candidate) => number {
  return q.sort === "trust"
    ? (a, b) => b.trust - a.trust || a.distanceM - b.distanceM || a.id - b.id
    : (a, b) => a.distanceM - b.distanceM || a.id - b.id;
}

function keyOf(q: NearbyQuery, c: Candidate): CursorKey {
  return q.sort === "trust" ? [c.trust, c.distanceM, c.id] : [c.distanceM, c.id];
}

function encodeCursor(q: NearbyQuery, key: CursorKey): string {
  return Buffer.from(JSON.stringify({ s: q.sort, k: key })).toString("base64url");
}

function decodeCursor(q: NearbyQuery): Candidate | null {
  if (!q.cursor) return null;
  try {
    const parsed = JSON.parse(Buffer.from(q.cursor, "base64url").toString("utf8")) as { s?: unknown; k?: unknown };
    const k = parsed.k;
    if (parsed.s !== q.sort || !Array.isArray(k) || !k.every((n) => typeof n === "number" && Number.isFinite(n))) throw new Error("shape");
    const nums = k as number[];
    if (q.sort === "trust" && nums.length === 3) return { trust: nums[0] as number, distanceM: nums[1] as number, id: nums[2] as number };
    if (q.sort === "distance" && nums.length === 2) return { trust: 0, distanceM: nums[0] as number, id: nums[1] as number };
    throw new Error("length");
  } catch {
    throw new Invalid("cursor: not a cursor from this search (start again without it)", { cursor: ["Not a cursor from this search"] });
  }
}

/** Listings within the radius, exactly, sorted by distance (or trust), one page at a time. */
export async function searchNearby(q: NearbyQuery, options: { strategy?: SearchStrategy; now?: Date } = {}): Promise<NearbyPage> {
  const now = (options.now ?? new Date()).getTime();
  const all = await candidates(q, options.strategy ?? "index", now);
  const cmp = compare(q);
  all.sort(cmp);
  const after = decodeCursor(q);
  const start = after ? all.findIndex((c) => cmp(c, after) > 0) : 0;
  const slice = start < 0 ? [] : all.slice(start, start + q.limit);
  const last = slice.at(-1);
  const hasMore = start >= 0 && start + q.limit < all.length;
  const rows = slice.length ? await db.select().from(listing).where(inArray(listing.id, slice.map((c) => c.id))) : [];
  const byId = new Map(rows.map((r) => [r.id, r]));
  const items: NearbyItem[] = [];
  for (const c of slice) {
    const r = byId.get(c.id);
    if (!r) continue; // deleted between the two reads
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
      distanceM: c.distanceM,
      distanceKm: Math.round(c.distanceM / 100) / 10,
    });
  }
  return { items, nextCursor: hasMore && last ? encodeCursor(q, keyOf(q, last)) : null, total: all.length };
}
