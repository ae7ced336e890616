import "server-only";
import { randomUUID } from "node:crypto";
import { desc, eq } from "drizzle-orm";
import { db } from "@/db/client";
import { plan } from "@/db/schema";
import type { Actor } from "@/lib/auth/permissions";
import { Forbidden, NotFound } from "@/lib/errors";
import { planInputSchema, type PlanInput, type SavePlanInput } from "@/lib/validations/planner";
import { canChangePlan } from "./plan-access";

/* Saved runs of the planner. Reading needs only the link; changing needs the owner (checked here, not only in the route). */

export interface SavedPlan {
  id: string;
  name: string;
  input: PlanInput;
  /** ISO 8601. */
  createdAt: string;
  updatedAt: string;
  /** Whether the person asking saved it; the owner's id itself is never handed out. */
  ownedByViewer: boolean;
}

export interface PlanListItem {
  id: string;
  name: string;
  createdAt: string;
  updatedAt: string;
}

type PlanRow = typeof plan.$inferSelect;

// Plan ids are random UUIDs; anything else cannot name a plan, so it is simply not found.
const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

function toSavedPlan(row: PlanRow, viewerId: string | null): SavedPlan {
  // Stored input was parsed on the way in; parsing again on the way out catches a schema change the data has not followed.
  const parsed = planInputSchema.safeParse(row.input);
  if (!parsed.success) throw new Error(`Stored plan ${row.id} no longer matches the planner input: ${parsed.error.issues[0]?.message ?? "invalid"}`);
  return {
    id: row.id,
    name: row.name,
    input: parsed.data,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
    ownedByViewer: viewerId !== null && viewerId === row.ownerId,
  };
}

async function rowOf(id: string): Promise<PlanRow | null> {
  if (!UUID.test(id)) return null;
  return (await db.select().from(plan).where(eq(plan.id, id)).limit(1))[0] ?? null;
}

export async function createPlan(ownerId: string, data: SavePlanInput): Promise<SavedPlan> {
  const [row] = await db.insert(plan).values({ id: randomUUID(), ownerId, name: data.name, input: data.input }).returning();
  if (!row) throw new Error("Plan insert returned no row");
  return toSavedPlan(row, ownerId);
}

/** The plan behind a link, or null; pages call notFound() on null. */
export async function findPlan(id: string, viewerId: string | null): Promise<SavedPlan | null> {
  const row = await rowOf(id);
  return row ? toSavedPlan(row, viewerId) : null;
}

export async function getPlan(id: string, viewerId: string | null): Promise<SavedPlan> {
  const found = await findPlan(id, viewerId);
  if (!found) throw new NotFound("No plan with this id");
  return found;
}

/** The owner's plans, most recently changed first. */
export async function listOwnPlans(ownerId: string): Promise<PlanListItem[]> {
  const rows = await db
    .select({ id: plan.id, name: plan.name, createdAt: plan.createdAt, updatedAt: plan.updatedAt })
    .from(plan)
    .where(eq(plan.ownerId, ownerId))
    .orderBy(desc(plan.updatedAt), desc(plan.createdAt));
  return rows.map((r) => ({ id: r.id, name: r.name, createdAt: r.createdAt.toISOString(), updatedAt: r.updatedAt.toISOString() }));
}

async function ownedRow(actor: Actor, id: string): Promise<PlanRow> {
  const row = await rowOf(id);
  if (!row) throw new NotFound("No plan with this id");
  if (!canChangePlan(actor, row)) throw new Forbidden("Only the farmer who saved this plan can change or delete it");
  return row;
}

export async function updatePlan(actor: Actor, id: string, data: SavePlanInput): Promise<SavedPlan> {
  await ownedRow(actor, id);
  const [row] = await db.update(plan).set({ name: data.name, input: data.input }).where(eq(plan.id, id)).returning();
  if (!row) throw new NotFound("No plan with this id");
  return toSavedPlan(row, actor?.id ?? null);
}

export async function deletePlan(actor: Actor, id: string): Promise<void> {
  await ownedRow(actor, id);
  await db.delete(plan).where(eq(plan.id, id));
}
