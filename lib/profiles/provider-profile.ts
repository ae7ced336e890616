import "server-only";
import { eq } from "drizzle-orm";
import { db } from "@/db/client";
import { builder, builderPrice, hatchery } from "@/db/schema";
import { NotFound } from "@/lib/errors";
import { refreshListings } from "@/lib/listings/sync";
import type { BuilderProfileInput, HatcheryProfileInput } from "@/lib/validations/provider";

export async function getHatcheryProfile(userId: string): Promise<HatcheryProfileInput | null> {
  const row = (await db.select().from(hatchery).where(eq(hatchery.userId, userId)).limit(1))[0];
  return row ? { species: row.species, delivers: row.delivers, deliveryRadiusKm: row.deliveryRadiusKm } : null;
}

export async function saveHatcheryProfile(userId: string, input: HatcheryProfileInput): Promise<void> {
  await db.transaction(async (tx) => {
    const done = await tx
      .update(hatchery)
      .set({ species: input.species, delivers: input.delivers, deliveryRadiusKm: input.delivers ? input.deliveryRadiusKm : 0 })
      .where(eq(hatchery.userId, userId))
      .returning({ id: hatchery.userId });
    if (done.length === 0) throw new NotFound("Complete your profile as a hatchery first");
    await refreshListings(tx, userId);
  });
}

export async function getBuilderProfile(userId: string): Promise<BuilderProfileInput | null> {
  const row = (await db.select().from(builder).where(eq(builder.userId, userId)).limit(1))[0];
  if (!row) return null;
  const prices = await db
    .select({ tankType: builderPrice.tankType, materialsPerSqmMinor: builderPrice.materialsPerSqmMinor, labourPerSqmMinor: builderPrice.labourPerSqmMinor })
    .from(builderPrice)
    .where(eq(builderPrice.builderId, userId));
  return {
    serviceRadiusKm: row.serviceRadiusKm,
    currency: row.currency,
    baseFeeMinor: row.baseFeeMinor,
    travelRatePerKmMinor: row.travelRatePerKmMinor,
    prices,
  };
}

/** Replaces the builder's terms and whole price sheet in one transaction. */
export async function saveBuilderProfile(userId: string, input: BuilderProfileInput): Promise<void> {
  await db.transaction(async (tx) => {
    const done = await tx
      .update(builder)
      .set({
        serviceRadiusKm: input.serviceRadiusKm,
        currency: input.currency,
        baseFeeMinor: input.baseFeeMinor,
        travelRatePerKmMinor: input.travelRatePerKmMinor,
      })
      .where(eq(builder.userId, userId))
      .returning({ id: builder.userId });
    if (done.length === 0) throw new NotFound("Complete your profile as a builder first");
    await tx.delete(builderPrice).where(eq(builderPrice.builderId, userId));
    if (input.prices.length) await tx.insert(builderPrice).values(input.prices.map((p) => ({ builderId: userId, ...p })));
    await refreshListings(tx, userId);
  });
}
