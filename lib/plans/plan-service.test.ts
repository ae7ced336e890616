import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { estimatePlan } from "@/lib/planner/estimate";
import { defaultPlanInput, savePlanSchema, type PlanInput } from "@/lib/validations/planner";
import { useTempDatabase } from "@/tests/support/temp-db";

// Runs against a SQLite file migrated from scratch (db/migrations, including 0003_plans), never a mock of Drizzle.
let cleanup: () => void;
let db: typeof import("@/db/client").db;
let schema: typeof import("@/db/schema");
let plans: typeof import("./plan-service");

beforeAll(async () => {
  ({ cleanup } = await useTempDatabase());
  ({ db } = await import("@/db/client"));
  schema = await import("@/db/schema");
  plans = await import("./plan-service");
});
afterAll(() => cleanup());

async function newFarmer(): Promise<{ id: string; roles: ["farmer"] }> {
  const id = randomUUID();
  await db.insert(schema.user).values({ id, name: "F", email: `${id}@example.test`, emailVerified: true });
  return { id, roles: ["farmer"] };
}

const catfishPlan: PlanInput = {
  ...defaultPlanInput,
  species: "catfish",
  tank: { ...defaultPlanInput.tank, type: "concrete", dimensions: { shape: "round", diameterM: 3 }, buildCostOverrideMinor: 1_200_000, lifeYears: 15 },
};

describe("saved plans against a migrated database", () => {
  it("stores a plan and gives it back exactly, with the same figures", async () => {
    const farmer = await newFarmer();
    const saved = await plans.createPlan(farmer.id, { name: "Round concrete", input: catfishPlan });
    expect(saved.id).toMatch(/^[0-9a-f-]{36}$/);
    const read = await plans.getPlan(saved.id, null);
    expect(read).toMatchObject({ id: saved.id, name: "Round concrete", ownedByViewer: false });
    expect(read.input).toEqual(catfishPlan);
    // The reopened plan gives the same estimate: the stored JSON loses nothing the planner reads.
    expect(estimatePlan(read.input)).toEqual(estimatePlan(catfishPlan));
    expect((await plans.getPlan(saved.id, farmer.id)).ownedByViewer).toBe(true);
  });

  it("lists only the owner's plans, the latest change first", async () => {
    const a = await newFarmer();
    const b = await newFarmer();
    const first = await plans.createPlan(a.id, { name: "First", input: defaultPlanInput });
    await new Promise((r) => setTimeout(r, 5));
    await plans.createPlan(a.id, { name: "Second", input: defaultPlanInput });
    await plans.createPlan(b.id, { name: "Not mine", input: defaultPlanInput });
    expect((await plans.listOwnPlans(a.id)).map((p) => p.name)).toEqual(["Second", "First"]);
    await new Promise((r) => setTimeout(r, 5));
    await plans.updatePlan(a, first.id, { name: "First, changed", input: catfishPlan });
    const listed = await plans.listOwnPlans(a.id);
    expect(listed.map((p) => p.name)).toEqual(["First, changed", "Second"]);
    expect(Object.keys(listed[0] ?? {}).sort()).toEqual(["createdAt", "id", "name", "updatedAt"]);
  });

  it("lets only the owner change or delete a plan: another farmer is refused and nothing changes", async () => {
    const owner = await newFarmer();
    const other = await newFarmer();
    const saved = await plans.createPlan(owner.id, { name: "Mine", input: defaultPlanInput });
    await expect(plans.updatePlan(other, saved.id, { name: "Taken", input: catfishPlan })).rejects.toMatchObject({ status: 403 });
    await expect(plans.deletePlan(other, saved.id)).rejects.toMatchObject({ status: 403 });
    await expect(plans.deletePlan(null, saved.id)).rejects.toMatchObject({ status: 403 });
    expect((await plans.getPlan(saved.id, null)).name).toBe("Mine");

    const updated = await plans.updatePlan(owner, saved.id, { name: "Mine, bigger", input: catfishPlan });
    expect(updated).toMatchObject({ name: "Mine, bigger", ownedByViewer: true, input: catfishPlan });
    expect(Date.parse(updated.updatedAt)).toBeGreaterThanOrEqual(Date.parse(saved.updatedAt));

    await plans.deletePlan(owner, saved.id);
    expect(await plans.findPlan(saved.id, owner.id)).toBeNull();
  });

  it("answers not found for a missing or malformed id", async () => {
    const owner = await newFarmer();
    await expect(plans.getPlan(randomUUID(), null)).rejects.toMatchObject({ status: 404 });
    await expect(plans.getPlan("not-a-uuid'; drop table plan;--", null)).rejects.toMatchObject({ status: 404 });
    await expect(plans.updatePlan(owner, randomUUID(), { name: "x", input: defaultPlanInput })).rejects.toMatchObject({ status: 404 });
    await expect(plans.deletePlan(owner, randomUUID())).rejects.toMatchObject({ status: 404 });
  });

  it("deletes a farmer's plans with their account (ON DELETE CASCADE in migration 0003)", async () => {
    const owner = await newFarmer();
    const saved = await plans.createPlan(owner.id, { name: "Goes too", input: defaultPlanInput });
    const { eq } = await import("drizzle-orm");
    await db.delete(schema.user).where(eq(schema.user.id, owner.id));
    expect(await plans.findPlan(saved.id, null)).toBeNull();
  });
});

describe("savePlanSchema", () => {
  it("needs a name and a valid input, naming the field it refuses", () => {
    const noName = savePlanSchema.safeParse({ name: "  ", input: defaultPlanInput });
    expect(noName.success).toBe(false);
    expect(noName.error?.issues[0]).toMatchObject({ path: ["name"], message: "Plan name is required" });
    const badDepth = savePlanSchema.safeParse({ name: "Deep", input: { ...defaultPlanInput, tank: { ...defaultPlanInput.tank, waterDepthM: 9 } } });
    expect(badDepth.error?.issues[0]).toMatchObject({ path: ["input", "tank", "waterDepthM"], message: "Water depth must be between 0.2 and 3 m" });
  });
});
