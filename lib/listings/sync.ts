import { and, eq, notInArray } from "drizzle-orm";
import type { Database } from "@/db/client";
import { builder, builderPrice, hatchery, listing, profile, userRole } from "@/db/schema";
import { type ListingKind } from "@/lib/catalog";
import { APPROXIMATE_PLACE_GRID_METERS, roundCoordinate } from "@/lib/geo/coordinates";
import { computeTrust, trustColumns } from "@/lib/trust/trust-stats";
import { speciesMask, tankTypeMask } from "./masks";

type Tx = Parameters<Parameters<Database["transaction"]>[0]>[0];

// No server-only marker and no default client: the seed script calls this with its own connection.

/**
 * Rebuilds the listings of one provider from its profile and role tables: one per
 * provider role, with the public (rounded) point and the role's trust score and badge
 * (lib/trust/trust-stats.ts). Called after every change that a listing shows, trust
 * inputs included (reviews, finished jobs and reservations, verification); a provider
 * with no location or no provider role has none.
 */
export async function refreshListings(tx: Tx | Database, userId: string): Promise<void> {
  const prof = (await tx.select().from(profile).where(eq(profile.userId, userId)).limit(1))[0];
  const roles = (await tx.select({ role: userRole.role }).from(userRole).where(eq(userRole.userId, userId))).map((r) => r.role);
  const kinds: ListingKind[] = [];
  if (prof && prof.lat !== null && prof.lng !== null && prof.verificationState !== "rejected") {
    const point = prof.showApproximateLocation ? roundCoordinate({ lat: prof.lat, lng: prof.lng }, APPROXIMATE_PLACE_GRID_METERS) : { lat: prof.lat, lng: prof.lng };
    const common = {
      displayName: prof.displayName,
      region: prof.region,
      lat: point.lat,
      lng: point.lng,
      verified: prof.verificationState === "verified",
      avatarImageId: prof.avatarImageId,
    };
    if (roles.includes("hatchery")) {
      const h = (await tx.select().from(hatchery).where(eq(hatchery.userId, userId)).limit(1))[0];
      if (h) {
        kinds.push("hatchery");
        const trust = trustColumns(await computeTrust(tx, userId, "hatchery"));
        const values = { ...common, ...trust, speciesMask: speciesMask(h.species), tankTypeMask: 0, serviceRadiusKm: h.delivers ? h.deliveryRadiusKm : 0 };
        await tx.insert(listing).values({ userId, kind: "hatchery", ...values }).onConflictDoUpdate({ target: [listing.userId, listing.kind], set: values });
      }
    }
    if (roles.includes("builder")) {
      const b = (await tx.select().from(builder).where(eq(builder.userId, userId)).limit(1))[0];
      if (b) {
        kinds.push("builder");
        const types = (await tx.select({ t: builderPrice.tankType }).from(builderPrice).where(eq(builderPrice.builderId, userId))).map((r) => r.t);
        const trust = trustColumns(await computeTrust(tx, userId, "builder"));
        const values = { ...common, ...trust, speciesMask: 0, tankTypeMask: tankTypeMask(types), serviceRadiusKm: b.serviceRadiusKm };
        await tx.insert(listing).values({ userId, kind: "builder", ...values }).onConflictDoUpdate({ target: [listing.userId, listing.kind], set: values });
      }
    }
  }
  await tx.delete(listing).where(kinds.length ? and(eq(listing.userId, userId), notInArray(listing.kind, kinds)) : eq(listing.userId, userId));
}
