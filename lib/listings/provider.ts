import "server-only";
import { and, asc, eq, gte, inArray } from "drizzle-orm";
import { cache } from "react";
import { db } from "@/db/client";
import { batch, builder, builderPrice, hatchery, image, listing, profile, userRole } from "@/db/schema";
import { TANK_TYPES, type Species, type TankType } from "@/lib/catalog";

export type PublicBatch = {
  id: string;
  species: Species;
  meanWeightG: number;
  meanLengthCm: number;
  countAvailable: number;
  priceMinor: number;
  currency: string;
  readyFrom: string;
  sellBy: string;
  delivery: string;
  readyNow: boolean;
};

export type PublicProvider = {
  id: string;
  displayName: string;
  region: string;
  about: string | null;
  phone: string | null;
  verified: boolean;
  avatar: { id: string; widths: number[]; width: number; height: number; alt: string } | null;
  /** The public point (rounded to about 1 km unless the provider chose otherwise). */
  point: { lat: number; lng: number } | null;
  hatchery: { species: Species[]; delivers: boolean; deliveryRadiusKm: number; batches: PublicBatch[] } | null;
  builder: {
    serviceRadiusKm: number;
    currency: string;
    baseFeeMinor: number;
    travelRatePerKmMinor: number;
    prices: { tankType: TankType; materialsPerSqmMinor: number; labourPerSqmMinor: number }[];
  } | null;
};

/** What anyone may see of a provider: never the e-mail, never the exact location unless shown by choice. */
async function loadPublicProvider(userId: string, now = new Date()): Promise<PublicProvider | null> {
  const [prof] = await db.select().from(profile).where(eq(profile.userId, userId)).limit(1);
  if (!prof) return null;
  const roles = (await db.select({ role: userRole.role }).from(userRole).where(eq(userRole.userId, userId))).map((r) => r.role);
  const listings = await db.select().from(listing).where(and(eq(listing.userId, userId), inArray(listing.kind, ["hatchery", "builder"])));
  if (!listings.length || !roles.some((r) => r === "hatchery" || r === "builder")) return null;
  const point = listings[0] ? { lat: listings[0].lat, lng: listings[0].lng } : null;

  let hatcheryPart: PublicProvider["hatchery"] = null;
  if (roles.includes("hatchery")) {
    const [h] = await db.select().from(hatchery).where(eq(hatchery.userId, userId)).limit(1);
    if (h) {
      const rows = await db
        .select()
        .from(batch)
        .where(and(eq(batch.hatcheryId, userId), eq(batch.state, "open"), gte(batch.sellBy, now)))
        .orderBy(asc(batch.readyFrom))
        .limit(20);
      hatcheryPart = {
        species: h.species,
        delivers: h.delivers,
        deliveryRadiusKm: h.deliveryRadiusKm,
        batches: rows.map((b) => ({
          id: b.id,
          species: b.species,
          meanWeightG: b.meanWeightG,
          meanLengthCm: b.meanLengthCm,
          countAvailable: b.countAvailable,
          priceMinor: b.priceMinor,
          currency: b.currency,
          readyFrom: b.readyFrom.toISOString(),
          sellBy: b.sellBy.toISOString(),
          delivery: b.delivery,
          readyNow: b.readyFrom <= now && b.countAvailable > 0,
        })),
      };
    }
  }
  let builderPart: PublicProvider["builder"] = null;
  if (roles.includes("builder")) {
    const [b] = await db.select().from(builder).where(eq(builder.userId, userId)).limit(1);
    if (b) {
      const prices = await db
        .select({ tankType: builderPrice.tankType, materialsPerSqmMinor: builderPrice.materialsPerSqmMinor, labourPerSqmMinor: builderPrice.labourPerSqmMinor })
        .from(builderPrice)
        .where(eq(builderPrice.builderId, userId));
      prices.sort((x, y) => TANK_TYPES.indexOf(x.tankType) - TANK_TYPES.indexOf(y.tankType));
      builderPart = { serviceRadiusKm: b.serviceRadiusKm, currency: b.currency, baseFeeMinor: b.baseFeeMinor, travelRatePerKmMinor: b.travelRatePerKmMinor, prices };
    }
  }
  return {
    id: userId,
    displayName: prof.displayName,
    region: prof.region,
    about: prof.about,
    phone: prof.phone,
    verified: prof.verificationState === "verified",
    avatar: prof.avatarImageId
      ? ((await db.select({ id: image.id, widths: image.widths, width: image.width, height: image.height, alt: image.alt }).from(image).where(eq(image.id, prof.avatarImageId)).limit(1))[0] ?? null)
      : null,
    point,
    hatchery: hatcheryPart,
    builder: builderPart,
  };
}

/** Per request: the provider page's metadata and body read the same record once. */
export const getPublicProvider = cache(loadPublicProvider);
