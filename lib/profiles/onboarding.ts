import "server-only";
import { and, eq } from "drizzle-orm";
import { db } from "@/db/client";
import { builder, hatchery, profile, userRole } from "@/db/schema";
import { refreshListings } from "@/lib/listings/sync";
import type { OnboardingData } from "@/lib/validations/profile";

/**
 * Records the roles a user picked and their profile, in one transaction. Adding a
 * role later keeps the others; admin is never granted here.
 */
export async function completeOnboarding(userId: string, input: OnboardingData): Promise<void> {
  const now = new Date();
  await db.transaction(async (tx) => {
    for (const role of input.roles) {
      await tx.insert(userRole).values({ userId, role }).onConflictDoNothing();
    }
    const values = {
      displayName: input.displayName,
      region: input.region,
      phone: input.phone || null,
      lat: input.lat ?? null,
      lng: input.lng ?? null,
      about: input.about || null,
    };
    await tx
      .insert(profile)
      .values({ userId, ...values, onboardedAt: now })
      .onConflictDoUpdate({ target: profile.userId, set: { ...values, onboardedAt: now } });
    if (input.roles.includes("hatchery")) await tx.insert(hatchery).values({ userId }).onConflictDoNothing();
    if (input.roles.includes("builder")) await tx.insert(builder).values({ userId }).onConflictDoNothing();
    const providerNow = input.roles.some((r) => r === "hatchery" || r === "builder");
    if (providerNow) {
      // A new provider waits for an admin to check them; an already-checked one keeps its state.
      await tx
        .update(profile)
        .set({ verificationState: "pending" })
        .where(and(eq(profile.userId, userId), eq(profile.verificationState, "unverified")));
    }
    await refreshListings(tx, userId);
  });
}

export type OwnProfile = {
  displayName: string;
  region: string;
  phone: string | null;
  lat: number | null;
  lng: number | null;
  about: string | null;
  verificationState: string;
};

export async function getOwnProfile(userId: string): Promise<OwnProfile | null> {
  const rows = await db
    .select({
      displayName: profile.displayName,
      region: profile.region,
      phone: profile.phone,
      lat: profile.lat,
      lng: profile.lng,
      about: profile.about,
      verificationState: profile.verificationState,
    })
    .from(profile)
    .where(eq(profile.userId, userId))
    .limit(1);
  return rows[0] ?? null;
}
