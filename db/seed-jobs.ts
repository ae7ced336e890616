// Demo data for tank requests, quotes and portfolios: finished tanks with pictures drawn here (SVG through sharp, no
// downloads) for every seeded builder, a few open requests near some builders, and one request of the demo farmer
// with two quotes to compare. Called from db/seed.ts once the people exist.
import { PutObjectCommand, type S3Client } from "@aws-sdk/client-s3";
import { randomUUID } from "node:crypto";
import { and, eq, inArray } from "drizzle-orm";
import type { LibSQLDatabase } from "drizzle-orm/libsql";
import sharp from "sharp";
import type { TankType } from "../lib/catalog";
import { APPROXIMATE_PLACE_GRID_METERS, roundCoordinate } from "../lib/geo/coordinates";
import { distanceMeters } from "../lib/geo/distance";
import { estimateFromPriceSheet, priceQuote } from "../lib/jobs/quote";
import { encodeVariants, variantKey, type Variant } from "../lib/storage/variants";
import type { allSchema } from "./all-schema";
import * as core from "./schema";
import * as jobs from "./schema-jobs";
import { TOWNS } from "./seed-data";
import { rng } from "./seed-random";

type SeedDb = LibSQLDatabase<typeof allSchema>;
type Point = { lat: number; lng: number };


/** A point `km` from `from` in a random direction (flat-earth step; fine for demo data at tens of km). */
function offset(from: Point, km: number, rand: () => number): Point {
  const theta = rand() * 2 * Math.PI;
  const dLat = (km * Math.cos(theta)) / 110.574;
  const dLng = (km * Math.sin(theta)) / (111.32 * Math.cos((from.lat * Math.PI) / 180));
  return { lat: Number((from.lat + dLat).toFixed(5)), lng: Number((from.lng + dLng).toFixed(5)) };
}

function nearestTown(p: Point): string {
  let best = TOWNS[0]?.name ?? "Lusaka";
  let bestD = Number.POSITIVE_INFINITY;
  for (const t of TOWNS) {
    const d = distanceMeters(p, t);
    if (d < bestD) [best, bestD] = [t.name, d];
  }
  return best;
}

const SKIES = [
  ["#bfe3f2", "#eaf6fb"],
  ["#f6d7a7", "#fbeedd"],
  ["#c9dff0", "#f1f7fb"],
] as const;

/** A finished tank as a simple picture: ground, sky, and the tank drawn for its type. */
function tankSvg(type: TankType, variant: number): string {
  const [skyTop, skyLow] = SKIES[variant % SKIES.length] ?? SKIES[0];
  const ground = variant % 2 ? "#b89a6a" : "#a8956b";
  const sky = `<defs><linearGradient id="s" x1="0" y1="0" x2="0" y2="1"><stop offset="0" stop-color="${skyTop}"/><stop offset="1" stop-color="${skyLow}"/></linearGradient></defs><rect width="1280" height="853" fill="url(#s)"/><circle cx="${1050 - variant * 90}" cy="150" r="60" fill="#fff3c4"/><rect y="520" width="1280" height="333" fill="${ground}"/>`;
  const bushes = [120, 300, 1100].map((x, i) => `<ellipse cx="${x + variant * 20}" cy="${525 - i * 4}" rx="${70 + i * 10}" ry="40" fill="#5f7f3a"/>`).join("");
  let tank: string;
  if (type === "tarpaulin") {
    // Liner first, then the timber frame in front of it: posts, a top rail and a mid rail.
    const posts = [322, 512, 702, 900].map((x) => `<rect x="${x}" y="372" width="24" height="242" fill="#7a4815"/>`).join("");
    tank = `<rect x="300" y="600" width="660" height="30" fill="#9a9482"/><path d="M330 400 H922 V610 H330Z" fill="#1f5fa8"/><path d="M330 400 H922 V430 H330Z" fill="#2f78c4"/><path d="M345 440 q80 -18 160 0 t160 0 t160 0" stroke="#7db6e8" stroke-width="8" fill="none"/>${posts}<rect x="316" y="386" width="614" height="16" fill="#8a5a1e"/><rect x="316" y="500" width="614" height="12" fill="#8a5a1e"/>`;
  } else if (type === "concrete") {
    tank = `<ellipse cx="640" cy="640" rx="360" ry="70" fill="#8c8a83"/><rect x="280" y="420" width="720" height="220" fill="#b9b6ad"/><ellipse cx="640" cy="420" rx="360" ry="70" fill="#d4d1c8"/><ellipse cx="640" cy="428" rx="325" ry="56" fill="#2e6f8f"/><path d="M330 440 q90 -20 180 0 t180 0 t180 0" stroke="#8fc3dc" stroke-width="7" fill="none"/><path d="M280 530 H1000" stroke="#a3a097" stroke-width="6"/>`;
  } else {
    tank = `<path d="M140 700 Q640 520 1140 700 Q640 840 140 700Z" fill="#6f8f45"/><path d="M210 700 Q640 575 1070 700 Q640 805 210 700Z" fill="#3a7d8c"/><path d="M360 690 q90 -15 180 0 t180 0 t180 0" stroke="#9ccfd8" stroke-width="7" fill="none"/><path d="M160 690 l-30 -60 M1120 690 l30 -60" stroke="#4f6b2c" stroke-width="10"/>`;
  }
  return `<svg xmlns="http://www.w3.org/2000/svg" width="1280" height="853" viewBox="0 0 1280 853">${sky}${bushes}${tank}</svg>`;
}

type Picture = { width: number; height: number; variants: Variant[] };

export type SeedJobsOptions = { db: SeedDb; s3: S3Client; bucket: string; demo: { farmer: string; builder: string; hatcheryBuilder: string } };

/** Seeds portfolios and requests; returns a one-line summary. */
export async function seedJobs({ db, s3, bucket, demo }: SeedJobsOptions): Promise<string> {
  const rand = rng(5_2026);
  const pictures = new Map<string, Picture>();
  async function picture(type: TankType, variant: number): Promise<Picture> {
    const key = `${type}:${variant}`;
    const cached = pictures.get(key);
    if (cached) return cached;
    const png = await sharp(Buffer.from(tankSvg(type, variant))).png().toBuffer();
    const drawn = await encodeVariants(png, [320, 640, 1280]);
    pictures.set(key, drawn);
    return drawn;
  }
  async function storeImage(ownerId: string, kind: string, subjectId: string, type: TankType, variant: number, alt: string): Promise<void> {
    const id = randomUUID();
    const pic = await picture(type, variant);
    for (const v of pic.variants) {
      await s3.send(new PutObjectCommand({ Bucket: bucket, Key: variantKey(id, v.width), Body: v.data, ContentType: "image/webp", CacheControl: "public, max-age=31536000, immutable" }));
    }
    const widest = pic.variants.reduce((a, b) => (b.width > a.width ? b : a));
    await db.insert(core.image).values({ id, ownerId, kind, keyPrefix: `images/${id}`, widths: pic.variants.map((v) => v.width), width: widest.width, height: widest.height, alt, subjectId });
  }

  const builders = await db
    .select({ id: core.builder.userId, lat: core.profile.lat, lng: core.profile.lng, radiusKm: core.builder.serviceRadiusKm, currency: core.builder.currency, baseFeeMinor: core.builder.baseFeeMinor, rate: core.builder.travelRatePerKmMinor })
    .from(core.builder)
    .innerJoin(core.profile, eq(core.profile.userId, core.builder.userId))
    .orderBy(core.builder.userId);
  const prices = await db.select().from(core.builderPrice);
  const typesOf = (id: string) => prices.filter((p) => p.builderId === id);

  // Portfolios: one to three finished tanks per builder, of the types each builds.
  let items = 0;
  for (const b of builders) {
    if (b.lat === null || b.lng === null) continue;
    const offered = typesOf(b.id);
    const count = 1 + Math.floor(rand() * 3);
    for (let k = 0; k < count; k++) {
      const row = offered[Math.floor(rand() * offered.length)];
      if (!row) continue;
      const place = offset({ lat: b.lat, lng: b.lng }, 3 + rand() * Math.min(b.radiusKm, 40), rand);
      const rounded = roundCoordinate(place, APPROXIMATE_PLACE_GRID_METERS);
      const round = row.tankType === "concrete" && rand() < 0.5;
      const id = randomUUID();
      // Whole numbers in the unit the builder would have typed: feet for some small tanks, metres otherwise.
      const inFeet = row.tankType === "tarpaulin" && rand() < 0.4;
      const unit = (n: number) => (inFeet ? (n * 3048) / 10_000 : n); // 1 ft = 0.3048 m exactly
      const length = row.tankType === "earthen" ? 10 + Math.round(rand() * 20) : inFeet ? 10 + 2 * Math.round(rand() * 5) : 3 + Math.round(rand() * 4);
      const width = Math.max(2, Math.round(length * (0.5 + rand() * 0.4)));
      await db.insert(jobs.portfolioItem).values({
        id,
        builderId: b.id,
        tankType: row.tankType,
        shape: round ? "round" : "rectangular",
        lengthM: round ? null : unit(length),
        widthM: round ? null : unit(width),
        diameterM: round ? 3 + Math.round(rand() * 3) : null,
        depthM: row.tankType === "earthen" ? 1.2 : inFeet ? unit(3) : 1,
        sizeUnit: inFeet ? "ft" : "m",
        placeName: nearestTown(place),
        approxLat: rounded.lat,
        approxLng: rounded.lng,
        completedOn: new Date(Date.UTC(2025, Math.floor(rand() * 12), 1 + Math.floor(rand() * 27))),
        caption: k === 0 ? "Levelled base, frame and liner fitted, filled and checked for leaks with the owner." : "",
      });
      await storeImage(b.id, "portfolio", id, row.tankType, Math.floor(rand() * 3), `Finished ${row.tankType} tank near ${nearestTown(place)}`);
      items++;
    }
  }

  // Open requests near the demo builder, from other farmers, and one of the demo farmer's with two quotes.
  const people = await db.select({ id: core.user.id, email: core.user.email }).from(core.user).where(inArray(core.user.email, [demo.farmer, demo.builder, demo.hatcheryBuilder]));
  const idOf = (email: string) => people.find((p) => p.email === email)?.id;
  const demoBuilder = builders.find((b) => b.id === idOf(demo.builder));
  const demoFarmer = idOf(demo.farmer);
  const farmers = await db.select({ id: core.userRole.userId }).from(core.userRole).where(and(eq(core.userRole.role, "farmer"))).limit(12);
  const others = farmers.map((f) => f.id).filter((id) => id !== demoFarmer && !builders.some((b) => b.id === id));
  let requests = 0;
  if (demoBuilder && demoBuilder.lat !== null && demoBuilder.lng !== null) {
    const base = { lat: demoBuilder.lat, lng: demoBuilder.lng };
    const wanted = (days: number) => new Date(Date.UTC(new Date().getUTCFullYear(), new Date().getUTCMonth(), new Date().getUTCDate() + days));
    const specs: { farmerId: string | undefined; type: TankType; km: number; readiness: "level_slab" | "compacted_ground" | "bare_ground"; notes: string }[] = [
      { farmerId: others[0], type: "tarpaulin", km: 6, readiness: "compacted_ground", notes: "Flat yard behind the house; a pickup can reach the site." },
      { farmerId: others[1], type: "concrete", km: 11, readiness: "bare_ground", notes: "Gentle slope; we can dig and level before you come." },
      { farmerId: others[2], type: "earthen", km: 15, readiness: "bare_ground", notes: "" },
    ];
    for (const s of specs) {
      if (!s.farmerId) continue;
      const site = offset(base, Math.min(s.km, demoBuilder.radiusKm * 0.6), rand);
      const earthen = s.type === "earthen";
      await db.insert(jobs.tankRequest).values({ id: randomUUID(), farmerId: s.farmerId, tankType: s.type, shape: "rectangular", lengthM: earthen ? 15 : 3.048, widthM: earthen ? 10 : 1.8288, depthM: earthen ? 1.2 : 0.9144, sizeUnit: earthen ? "m" : "ft", siteLat: site.lat, siteLng: site.lng, readiness: s.readiness, waterSource: "borehole", power: "solar", wantedBy: wanted(20 + requests * 9), notes: s.notes });
      requests++;
    }

    // The demo farmer's request, at a site within reach of two other builders who have quoted.
    const site = offset(base, 4, rand);
    const quoting = builders.filter((b) => b.id !== demoBuilder.id && b.id !== idOf(demo.hatcheryBuilder) && b.lat !== null && b.lng !== null && distanceMeters({ lat: b.lat, lng: b.lng }, site) <= b.radiusKm * 1000 && typesOf(b.id).some((p) => p.tankType === "tarpaulin"));
    if (demoFarmer && quoting.length >= 2) {
      const requestId = randomUUID();
      await db.insert(jobs.tankRequest).values({ id: requestId, farmerId: demoFarmer, tankType: "tarpaulin", shape: "rectangular", lengthM: 3.048, widthM: 1.8288, depthM: 0.9144, sizeUnit: "ft", siteLat: site.lat, siteLng: site.lng, readiness: "compacted_ground", waterSource: "mains", power: "grid", wantedBy: wanted(30), notes: "Next to the garden tap." });
      requests++;
      for (const [n, b] of quoting.slice(0, 2).entries()) {
        const row = typesOf(b.id).find((p) => p.tankType === "tarpaulin");
        if (!row || b.lat === null || b.lng === null) continue;
        const estimate = estimateFromPriceSheet(row, 3.048 * 1.8288);
        const distanceM = distanceMeters({ lat: b.lat, lng: b.lng }, site);
        const lines = n === 0 ? estimate.lines : [...estimate.lines, { kind: "other" as const, description: "Outlet pipe and valve", quantity: 1, unitPriceMinor: 18_000 }];
        const priced = priceQuote({ currency: b.currency, lines, travel: b.rate > 0 ? { distanceM, ratePerKmMinor: b.rate } : null, baseServiceFeeMinor: b.baseFeeMinor, farmerSuppliesMaterials: n === 1 });
        const quoteId = randomUUID();
        await db.insert(jobs.quote).values({ id: quoteId, requestId, builderId: b.id, state: "sent", currentVersion: 1 });
        await db.insert(jobs.quoteVersion).values({ quoteId, version: 1, currency: b.currency, farmerSuppliesMaterials: n === 1, note: n === 0 ? "I can start within two weeks; the liner comes from Lusaka." : "You buy the liner and poles; I bring tools and two hands.", travelDistanceM: Math.round(distanceM), travelRatePerKmMinor: b.rate, baseFeeMinor: priced.baseServiceFeeMinor, subtotalMinor: priced.subtotalMinor, totalMinor: priced.totalMinor, depositMinor: priced.depositMinor, excludedMaterialsMinor: priced.excludedMaterialsMinor });
        await db.insert(jobs.quoteLine).values(priced.lines.map((l, position) => ({ quoteId, version: 1, position, kind: l.kind, description: l.description, quantity: l.quantity, unitPriceMinor: l.unitPriceMinor, totalMinor: l.totalMinor, included: l.included })));
      }
    }
  }
  return `seeded ${items} finished tanks in builders' portfolios and ${requests} open tank requests`;
}
