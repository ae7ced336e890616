import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { useTempDatabase } from "../support/temp-db";

let cleanup: () => void;
let db: typeof import("@/db/client").db;
let schema: typeof import("@/db/schema");
let onboarding: typeof import("@/lib/profiles/onboarding");
let verification: typeof import("@/lib/profiles/verification");

beforeAll(async () => {
  ({ cleanup } = await useTempDatabase());
  ({ db } = await import("@/db/client"));
  schema = await import("@/db/schema");
  onboarding = await import("@/lib/profiles/onboarding");
  verification = await import("@/lib/profiles/verification");
});
afterAll(() => cleanup());

async function newUser(): Promise<string> {
  const id = randomUUID();
  await db.insert(schema.user).values({ id, name: "T", email: `${id}@example.test`, emailVerified: true });
  return id;
}

async function rolesOf(id: string): Promise<string[]> {
  const { eq } = await import("drizzle-orm");
  const rows = await db.select({ role: schema.userRole.role }).from(schema.userRole).where(eq(schema.userRole.userId, id));
  return rows.map((r) => r.role).sort();
}

describe("onboarding and verification against a migrated database", () => {
  it("records roles as a union and makes a new provider wait for a check", async () => {
    const id = await newUser();
    await onboarding.completeOnboarding(id, { roles: ["farmer"], displayName: "Ama", region: "Lusaka" });
    expect(await rolesOf(id)).toEqual(["farmer"]);
    expect((await onboarding.getOwnProfile(id))?.verificationState).toBe("unverified");

    await onboarding.completeOnboarding(id, { roles: ["builder"], displayName: "Ama Tanks", region: "Lusaka", phone: "+260971112233", lat: -15.4, lng: 28.3 });
    expect(await rolesOf(id)).toEqual(["builder", "farmer"]);
    const profile = await onboarding.getOwnProfile(id);
    expect(profile).toMatchObject({ displayName: "Ama Tanks", phone: "+260971112233", verificationState: "pending" });
    expect(await verification.countPendingProviders()).toBe(1);
  });

  it("logs each admin decision and keeps a checked provider checked when a role is added", async () => {
    const admin = await newUser();
    const provider = await newUser();
    await onboarding.completeOnboarding(provider, { roles: ["hatchery"], displayName: "Fry", region: "Central", phone: "+260961112233", lat: -14.4, lng: 28.4 });
    await verification.decideVerification(admin, provider, "verified", "called and visited");
    expect((await onboarding.getOwnProfile(provider))?.verificationState).toBe("verified");
    const log = await db.select().from(schema.auditLog);
    expect(log.at(-1)).toMatchObject({ actorId: admin, action: "provider.verified", subjectId: provider, detail: { from: "pending", to: "verified", note: "called and visited" } });

    await onboarding.completeOnboarding(provider, { roles: ["builder"], displayName: "Fry", region: "Central", phone: "+260961112233", lat: -14.4, lng: 28.4 });
    expect((await onboarding.getOwnProfile(provider))?.verificationState).toBe("verified");
  });

  it("refuses a decision on someone who is not a provider, and changes nothing", async () => {
    const admin = await newUser();
    const farmer = await newUser();
    await onboarding.completeOnboarding(farmer, { roles: ["farmer"], displayName: "Bo", region: "Southern" });
    const before = (await db.select().from(schema.auditLog)).length;
    await expect(verification.decideVerification(admin, farmer, "verified", undefined)).rejects.toThrow("No provider");
    expect((await onboarding.getOwnProfile(farmer))?.verificationState).toBe("unverified");
    expect((await db.select().from(schema.auditLog)).length).toBe(before);
  });
});
