import "server-only";
import { and, desc, eq, inArray, sql } from "drizzle-orm";
import { db } from "@/db/client";
import { auditLog, profile, user, userRole } from "@/db/schema";
import { NotFound } from "@/lib/errors";
import { refreshListings } from "@/lib/listings/sync";

const providerIds = db
  .selectDistinct({ id: userRole.userId })
  .from(userRole)
  .where(inArray(userRole.role, ["hatchery", "builder"]));

export async function countPendingProviders(): Promise<number> {
  const rows = await db
    .select({ n: sql<number>`count(*)` })
    .from(profile)
    .where(and(eq(profile.verificationState, "pending"), inArray(profile.userId, providerIds)));
  return Number(rows[0]?.n ?? 0);
}

export type ProviderForReview = {
  userId: string;
  displayName: string;
  region: string;
  phone: string | null;
  roles: string[];
  verificationState: string;
  joinedAt: Date;
};

export async function listProvidersForReview(state: "pending" | "verified" | "rejected" | "all" = "pending"): Promise<ProviderForReview[]> {
  const rows = await db
    .select({
      userId: profile.userId,
      displayName: profile.displayName,
      region: profile.region,
      phone: profile.phone,
      verificationState: profile.verificationState,
      joinedAt: user.createdAt,
      roles: sql<string>`(select group_concat(role) from user_role where user_role.user_id = ${profile.userId})`,
    })
    .from(profile)
    .innerJoin(user, eq(user.id, profile.userId))
    .where(and(inArray(profile.userId, providerIds), state === "all" ? undefined : eq(profile.verificationState, state)))
    .orderBy(desc(user.createdAt))
    .limit(200);
  return rows.map((r) => ({ ...r, roles: (r.roles ?? "").split(",").filter(Boolean) }));
}

/** An admin's decision on a provider, recorded in the audit log in the same transaction. */
export async function decideVerification(adminId: string, providerId: string, decision: "verified" | "rejected", note: string | undefined): Promise<void> {
  await db.transaction(async (tx) => {
    const target = await tx
      .select({ state: profile.verificationState })
      .from(profile)
      .where(and(eq(profile.userId, providerId), inArray(profile.userId, providerIds)))
      .limit(1);
    const current = target[0];
    if (!current) throw new NotFound("No provider with that id");
    await tx.update(profile).set({ verificationState: decision }).where(eq(profile.userId, providerId));
    await tx.insert(auditLog).values({
      actorId: adminId,
      action: `provider.${decision}`,
      subjectType: "profile",
      subjectId: providerId,
      detail: { from: current.state, to: decision, note: note ?? null },
    });
    await refreshListings(tx, providerId);
  });
}
