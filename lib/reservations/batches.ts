import "server-only";
import { randomUUID } from "node:crypto";
import { and, desc, eq, inArray, sql } from "drizzle-orm";
import { db } from "@/db/client";
import { batch, hatchery } from "@/db/schema";
import { reservation } from "@/db/schema-reservations";
import { writeTransaction } from "@/db/write-transaction";
import { can, canManageBatch } from "@/lib/auth/permissions";
import type { BatchState, Species } from "@/lib/catalog";
import { DomainError, Forbidden, Invalid, NotFound } from "@/lib/errors";
import type { BatchFormValues } from "@/lib/validations/reservations";
import type { Caller } from "./records";

// A hatchery's batches: post, edit, pause, resume, close. The nearby search's "ready now" and the provider page
// read the batch table directly, so nothing else needs refreshing after a change.

export interface OwnBatch {
  id: string;
  species: Species;
  meanWeightG: number;
  meanLengthCm: number;
  countTotal: number;
  countAvailable: number;
  /** fish taken by reservations (requested up to handed over) */
  countReserved: number;
  priceMinor: number;
  currency: string;
  readyFrom: string;
  sellBy: string;
  delivery: "pickup" | "delivery" | "both";
  state: BatchState;
  openReservations: number;
}

/** Date-only form values as instants: ready from the start of the day, on sale to the end of the last one (UTC). */
function datesOf(values: Pick<BatchFormValues, "readyFrom" | "sellBy">): { readyFrom: Date; sellBy: Date } {
  return { readyFrom: new Date(`${values.readyFrom}T00:00:00.000Z`), sellBy: new Date(`${values.sellBy}T23:59:59.999Z`) };
}

function requireHatchery(caller: Caller): void {
  if (!can(caller, "batch:manage")) throw new Forbidden("Only a hatchery account manages batches.");
}

async function ownedBatch(caller: Caller, id: string) {
  const row = (await db.select().from(batch).where(eq(batch.id, id)).limit(1))[0];
  // Another hatchery's batch looks the same as no batch.
  if (!row || !canManageBatch(caller, row)) throw new NotFound("No such batch");
  return row;
}

export async function listOwnBatches(caller: Caller): Promise<OwnBatch[]> {
  requireHatchery(caller);
  const rows = await db
    .select()
    .from(batch)
    .where(eq(batch.hatcheryId, caller.id))
    .orderBy(sql`case ${batch.state} when 'open' then 0 when 'paused' then 1 else 2 end`, desc(batch.readyFrom));
  const open = rows.length
    ? await db
        .select({ batchId: reservation.batchId, n: sql<number>`count(*)` })
        .from(reservation)
        .where(and(inArray(reservation.batchId, rows.map((b) => b.id)), inArray(reservation.state, ["requested", "accepted", "deposit_held", "quarantine", "disputed"])))
        .groupBy(reservation.batchId)
    : [];
  const openBy = new Map(open.map((o) => [o.batchId, Number(o.n)]));
  return rows.map((b) => ({
    id: b.id,
    species: b.species,
    meanWeightG: b.meanWeightG,
    meanLengthCm: b.meanLengthCm,
    countTotal: b.countTotal,
    countAvailable: b.countAvailable,
    countReserved: b.countTotal - b.countAvailable,
    priceMinor: b.priceMinor,
    currency: b.currency,
    readyFrom: b.readyFrom.toISOString(),
    sellBy: b.sellBy.toISOString(),
    delivery: b.delivery,
    state: b.state,
    openReservations: openBy.get(b.id) ?? 0,
  }));
}

export async function getOwnBatch(caller: Caller, id: string): Promise<OwnBatch> {
  requireHatchery(caller);
  await ownedBatch(caller, id);
  const found = (await listOwnBatches(caller)).find((b) => b.id === id);
  if (!found) throw new NotFound("No such batch");
  return found;
}

function requireSellByAhead(values: BatchFormValues, now: Date): void {
  const { sellBy } = datesOf(values);
  if (sellBy.getTime() < now.getTime()) throw new Invalid("The last selling day has passed", { sellBy: ["Choose today or a later day"] });
}

export async function createBatch(caller: Caller, values: BatchFormValues, now = new Date()): Promise<OwnBatch> {
  requireHatchery(caller);
  requireSellByAhead(values, now);
  const id = randomUUID();
  await writeTransaction(db, async (tx) => {
    const h = (await tx.select({ id: hatchery.userId }).from(hatchery).where(eq(hatchery.userId, caller.id)).limit(1))[0];
    if (!h) throw new DomainError("Finish your hatchery profile before posting a batch.", 409, "no_hatchery_profile");
    await tx.insert(batch).values({
      id,
      hatcheryId: caller.id,
      species: values.species,
      meanWeightG: values.meanWeightG,
      meanLengthCm: values.meanLengthCm,
      countTotal: values.countAvailable,
      countAvailable: values.countAvailable,
      priceMinor: values.priceMinor,
      currency: values.currency,
      ...datesOf(values),
      delivery: values.delivery,
      state: "open",
    });
  });
  return getOwnBatch(caller, id);
}

/**
 * Edits a batch. The hatchery states how many fish are still on offer; fish already reserved stay reserved, so
 * the total becomes reserved + the new count, in one UPDATE that cannot race a reservation. Price and size changes
 * apply to new reservations only (each reservation keeps its own snapshot).
 */
export async function updateBatch(caller: Caller, id: string, values: BatchFormValues, now = new Date()): Promise<OwnBatch> {
  requireHatchery(caller);
  const current = await ownedBatch(caller, id);
  if (current.state === "closed") throw new DomainError("A closed batch cannot be changed.", 409, "batch_closed");
  requireSellByAhead(values, now);
  await writeTransaction(db, async (tx) => {
    await tx
      .update(batch)
      .set({
        species: values.species,
        meanWeightG: values.meanWeightG,
        meanLengthCm: values.meanLengthCm,
        countTotal: sql`${batch.countTotal} - ${batch.countAvailable} + ${values.countAvailable}`,
        countAvailable: values.countAvailable,
        priceMinor: values.priceMinor,
        currency: values.currency,
        ...datesOf(values),
        delivery: values.delivery,
      })
      .where(and(eq(batch.id, id), eq(batch.hatcheryId, caller.id), inArray(batch.state, ["open", "paused"])));
  });
  return getOwnBatch(caller, id);
}

const NEXT_STATE: Record<"pause" | "resume" | "close", { from: BatchState[]; to: BatchState }> = {
  pause: { from: ["open"], to: "paused" },
  resume: { from: ["paused"], to: "open" },
  close: { from: ["open", "paused"], to: "closed" },
};

/** Pause (no new reservations), resume, or close for good. Reservations already made carry on either way. */
export async function setBatchState(caller: Caller, id: string, action: "pause" | "resume" | "close"): Promise<OwnBatch> {
  requireHatchery(caller);
  const current = await ownedBatch(caller, id);
  const rule = NEXT_STATE[action];
  if (!rule.from.includes(current.state)) throw new DomainError(`A ${current.state} batch cannot be ${action === "resume" ? "resumed" : `${action}d`}.`, 409, "illegal_transition");
  const done = await writeTransaction(db, (tx) =>
    tx
      .update(batch)
      .set({ state: rule.to })
      .where(and(eq(batch.id, id), inArray(batch.state, rule.from)))
      .returning({ id: batch.id }),
  );
  if (done.length === 0) throw new DomainError("The batch changed meanwhile. Reload and try again.", 409, "conflict");
  return getOwnBatch(caller, id);
}
