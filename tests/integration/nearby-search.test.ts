import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { referenceDestination } from "@/lib/geo/geographiclib.test-helper";
import { useTempDatabase } from "../support/temp-db";

let cleanup: () => void;
let db: typeof import("@/db/client").db;
let schema: typeof import("@/db/schema");
let search: typeof import("@/lib/listings/search");
let q: typeof import("@/lib/validations/search");

const CENTER = { lat: -15.4167, lng: 28.2833 };

type Spec = { lat: number; lng: number; kind: "hatchery" | "builder"; verified?: boolean; species?: number; tanks?: number; trust?: number };

async function addListing(spec: Spec): Promise<{ id: number; userId: string }> {
  const userId = randomUUID();
  await db.insert(schema.user).values({ id: userId, name: "x", email: `${userId}@example.test` });
  await db.insert(schema.profile).values({ userId, displayName: `P ${userId.slice(0, 4)}`, region: "Lusaka", lat: spec.lat, lng: spec.lng });
  const [row] = await db
    .insert(schema.listing)
    .values({
      userId,
      kind: spec.kind,
      displayName: "x",
      region: "Lusaka",
      lat: spec.lat,
      lng: spec.lng,
      verified: spec.verified ?? true,
      speciesMask: spec.species ?? 0,
      tankTypeMask: spec.tanks ?? 0,
      trustScore: spec.trust ?? 0,
    })
    .returning({ id: schema.listing.id });
  if (!row) throw new Error("insert failed");
  return { id: row.id, userId };
}

const query = (over: Record<string, unknown>) => q.nearbyQuerySchema.parse({ lat: CENTER.lat, lng: CENTER.lng, ...over });

beforeAll(async () => {
  ({ cleanup } = await useTempDatabase());
  ({ db } = await import("@/db/client"));
  schema = await import("@/db/schema");
  search = await import("@/lib/listings/search");
  q = await import("@/lib/validations/search");
});
afterAll(() => cleanup());

describe("nearby search against a migrated database with the R*Tree index", () => {
  it("puts the radius edge exactly: 1 m inside is in, 1 m outside is out", async () => {
    // Points at exact geodesic distances from GeographicLib's direct problem (Karney 2013).
    const inside = referenceDestination(CENTER.lat, CENTER.lng, 37, 10_000 - 1);
    const outside = referenceDestination(CENTER.lat, CENTER.lng, 217, 10_000 + 1);
    const a = await addListing({ ...inside, kind: "builder", tanks: 1 });
    const b = await addListing({ ...outside, kind: "builder", tanks: 1 });
    const page = await search.searchNearby(query({ radiusKm: 10 }));
    const ids = page.items.map((i) => i.listingId);
    expect(ids).toContain(a.id);
    expect(ids).not.toContain(b.id);
    expect(page.items.find((i) => i.listingId === a.id)?.distanceM).toBeCloseTo(9_999, 2);
  });

  it("combines filters: kind, verified, species, tank type and fingerlings ready now", async () => {
    const near = (k: number) => referenceDestination(CENTER.lat, CENTER.lng, k * 40, 20_000 + k * 100);
    const catfishReady = await addListing({ ...near(1), kind: "hatchery", species: 2 });
    const catfishNotReady = await addListing({ ...near(2), kind: "hatchery", species: 2 });
    const tilapiaOnly = await addListing({ ...near(3), kind: "hatchery", species: 1 });
    const unverified = await addListing({ ...near(4), kind: "hatchery", species: 3, verified: false });
    const concreteBuilder = await addListing({ ...near(5), kind: "builder", tanks: 2 });
    const now = new Date("2026-12-01T12:00:00Z");
    for (const [owner, from, to] of [
      [catfishReady, "2026-11-20", "2026-12-20"],
      [catfishNotReady, "2027-01-05", "2027-02-01"],
    ] as const) {
      await db.insert(schema.hatchery).values({ userId: owner.userId, species: ["catfish"] });
      await db.insert(schema.batch).values({
        id: randomUUID(), hatcheryId: owner.userId, species: "catfish", meanWeightG: 5, meanLengthCm: 7, countTotal: 500, countAvailable: 500,
        priceMinor: 150, currency: "ZMW", readyFrom: new Date(from), sellBy: new Date(to),
      });
    }
    const ids = async (over: Record<string, unknown>) =>
      (await search.searchNearby(query({ radiusKm: 30, limit: 100, ...over }), { now })).items.map((i) => i.listingId);

    expect(await ids({ kind: "hatchery", species: ["catfish"] })).toEqual(expect.arrayContaining([catfishReady.id, catfishNotReady.id, unverified.id]));
    expect(await ids({ kind: "hatchery", species: ["catfish"] })).not.toContain(tilapiaOnly.id);
    expect(await ids({ kind: "hatchery", species: ["catfish"], verified: "true" })).not.toContain(unverified.id);
    expect(await ids({ readyNow: "true" })).toEqual([catfishReady.id]);
    const concrete = await ids({ tankType: ["concrete"] });
    expect(concrete).toContain(concreteBuilder.id);
    expect(concrete).not.toContain(tilapiaOnly.id);
    expect(await ids({ tankType: ["earthen"] })).not.toContain(concreteBuilder.id);
  });

  it("pages by cursor with no duplicates or gaps, in distance order, and agrees with a full scan", async () => {
    for (let k = 0; k < 57; k++) {
      const p = referenceDestination(CENTER.lat, CENTER.lng, (k * 137) % 360, 40_000 + ((k * 7919) % 9000));
      await addListing({ ...p, kind: k % 2 ? "builder" : "hatchery", trust: (k % 5) / 5 });
    }
    for (const sort of ["distance", "trust"] as const) {
      const full = await search.searchNearby(query({ radiusKm: 60, limit: 100, sort }));
      const scan = await search.searchNearby(query({ radiusKm: 60, limit: 100, sort }), { strategy: "scan" });
      expect(scan.items.map((i) => i.listingId)).toEqual(full.items.map((i) => i.listingId));
      const seen: number[] = [];
      let cursor: string | undefined;
      let pages = 0;
      do {
        const page = await search.searchNearby(query({ radiusKm: 60, limit: 7, sort, ...(cursor ? { cursor } : {}) }));
        seen.push(...page.items.map((i) => i.listingId));
        cursor = page.nextCursor ?? undefined;
        pages++;
      } while (cursor && pages < 50);
      expect(new Set(seen).size).toBe(seen.length);
      expect(seen).toEqual(full.items.map((i) => i.listingId));
      expect(full.nextCursor).toBeNull();
    }
    const byDistance = (await search.searchNearby(query({ radiusKm: 60, limit: 100 }))).items.map((i) => i.distanceM);
    expect(byDistance).toEqual([...byDistance].sort((a, b) => a - b));
  });

  it("gives exactly the full scan's pages for random searches (both orders, any page size)", async () => {
    const fc = (await import("fast-check")).default;
    // Dense and sparse parts: 300 points scattered up to 150 km from the centre, trust in fifths so ties happen.
    for (let k = 0; k < 300; k++) {
      const p = referenceDestination(CENTER.lat, CENTER.lng, (k * 97) % 360, 500 + ((k * k * 7919) % 150_000));
      await addListing({ ...p, kind: k % 3 ? "builder" : "hatchery", trust: (k % 5) / 5, species: 1 + (k % 3), tanks: 1 + (k % 7) });
    }
    async function all(input: Record<string, unknown>, strategy: "index" | "scan"): Promise<number[]> {
      const out: number[] = [];
      let cursor: string | undefined;
      for (let pages = 0; pages < 200; pages++) {
        const page = await search.searchNearby(q.nearbyQuerySchema.parse({ ...input, ...(cursor ? { cursor } : {}) }), { strategy });
        out.push(...page.items.map((i) => i.listingId));
        if (!page.nextCursor) break;
        cursor = page.nextCursor;
      }
      return out;
    }
    await fc.assert(
      fc.asyncProperty(
        fc.double({ min: -0.8, max: 0.8, noNaN: true }),
        fc.double({ min: -0.8, max: 0.8, noNaN: true }),
        fc.integer({ min: 1, max: 200 }),
        fc.constantFrom("distance", "trust"),
        fc.integer({ min: 1, max: 40 }),
        fc.constantFrom("all", "builder", "hatchery"),
        async (dLat, dLng, radiusKm, sort, limit, kind) => {
          const input = { lat: CENTER.lat + dLat, lng: CENTER.lng + dLng, radiusKm, sort, limit, kind };
          expect(await all(input, "index")).toEqual(await all(input, "scan"));
        },
      ),
      { numRuns: 60 },
    );
  });

  it("finds points across the antimeridian", async () => {
    const west = await addListing({ lat: -17.7, lng: 179.95, kind: "builder" });
    const east = await addListing({ lat: -17.7, lng: -179.95, kind: "builder" });
    const page = await search.searchNearby(q.nearbyQuerySchema.parse({ lat: -17.7, lng: 179.99, radiusKm: 20 }));
    expect(page.items.map((i) => i.listingId)).toEqual(expect.arrayContaining([west.id, east.id]));
  });

  it("refuses bad parameters with a message naming the field", () => {
    const bad = (input: Record<string, unknown>) => q.nearbyQuerySchema.safeParse(input).error?.issues.map((i) => i.path.join("."));
    expect(bad({ lat: "abc", lng: 28 })).toEqual(["lat"]);
    expect(bad({ lat: -15, lng: 28, radiusKm: "0" })).toEqual(["radiusKm"]);
    expect(bad({ lat: -15, lng: 28, radiusKm: "501" })).toEqual(["radiusKm"]);
    expect(bad({ lat: -15, lng: 200 })).toEqual(["lng"]);
    expect(bad({ lat: -15, lng: 28, kind: "shop" })).toEqual(["kind"]);
    expect(bad({ lat: -15, lng: 28, tankType: ["plastic"] })?.[0]).toMatch(/^tankType/);
    expect(bad({ lat: -15, lng: 28, limit: "1000" })).toEqual(["limit"]);
  });

  it("refuses a cursor that was not made by the same search", async () => {
    await expect(search.searchNearby(query({ cursor: "not-a-cursor" }))).rejects.toThrow(/cursor/);
    const forDistance = Buffer.from(JSON.stringify({ s: "distance", k: [1, 2] })).toString("base64url");
    await expect(search.searchNearby(query({ sort: "trust", cursor: forDistance }))).rejects.toThrow(/cursor/);
  });
});
