import "server-only";
import { and, desc, eq, inArray } from "drizzle-orm";
import { alias } from "drizzle-orm/sqlite-core";
import { db } from "@/db/client";
import { profile } from "@/db/schema";
import { job, jobEvent, tankRequest } from "@/db/schema-jobs";
import { reservation, reservationHistory } from "@/db/schema-reservations";
import { SPECIES_LABEL, type Species } from "@/lib/catalog";
import { tankTitle, type StoredSize } from "@/lib/requests/format";
import { reservationReference } from "@/lib/reservations/labels";

// What the admin's dispute queue shows: every open dispute over a deposit, oldest first, with both
// sides' names and phones (an admin calls them before deciding), the farmer's reason and the money.

export type DisputeParty = { id: string; name: string; phone: string | null };

type DisputeBase = {
  id: string;
  reference: string;
  title: string;
  farmer: DisputeParty;
  provider: DisputeParty;
  currency: string;
  depositMinor: number;
  openedAt: string;
  reason: string | null;
};

export type ReservationDispute = DisputeBase & { kind: "reservation"; count: number; handedOverCount: number | null; survivedCount: number | null };
export type JobDispute = DisputeBase & { kind: "job"; totalMinor: number };
export type OpenDispute = ReservationDispute | JobDispute;

const farmerProfile = alias(profile, "farmer_profile");
const providerProfile = alias(profile, "provider_profile");

function party(id: string, name: string | null, phone: string | null): DisputeParty {
  return { id, name: name ?? "(no profile)", phone };
}

function reasonOf(detail: Record<string, unknown> | null | undefined): string | null {
  const reason = detail?.reason;
  return typeof reason === "string" && reason.trim() ? reason : null;
}

async function reservationDisputes(): Promise<ReservationDispute[]> {
  const rows = await db
    .select({ r: reservation, farmerName: farmerProfile.displayName, farmerPhone: farmerProfile.phone, providerName: providerProfile.displayName, providerPhone: providerProfile.phone })
    .from(reservation)
    .leftJoin(farmerProfile, eq(farmerProfile.userId, reservation.farmerId))
    .leftJoin(providerProfile, eq(providerProfile.userId, reservation.hatcheryId))
    .where(eq(reservation.state, "disputed"));
  if (rows.length === 0) return [];
  const opened = await db
    .select({ reservationId: reservationHistory.reservationId, at: reservationHistory.at, detail: reservationHistory.detail })
    .from(reservationHistory)
    .where(and(inArray(reservationHistory.reservationId, rows.map((row) => row.r.id)), eq(reservationHistory.event, "dispute")))
    .orderBy(desc(reservationHistory.id));
  return rows.map(({ r, ...names }) => {
    const event = opened.find((o) => o.reservationId === r.id);
    return {
      kind: "reservation",
      id: r.id,
      reference: reservationReference(r.id),
      title: `${SPECIES_LABEL[r.species as Species] ?? r.species} · ${r.count.toLocaleString("en")} fingerlings`,
      farmer: party(r.farmerId, names.farmerName, names.farmerPhone),
      provider: party(r.hatcheryId, names.providerName, names.providerPhone),
      currency: r.currency,
      depositMinor: r.depositMinor,
      openedAt: (event?.at ?? r.updatedAt).toISOString(),
      reason: reasonOf(event?.detail),
      count: r.count,
      handedOverCount: r.handedOverCount,
      survivedCount: r.survivedCount,
    };
  });
}

async function jobDisputes(): Promise<JobDispute[]> {
  const rows = await db
    .select({ j: job, t: tankRequest, farmerName: farmerProfile.displayName, farmerPhone: farmerProfile.phone, providerName: providerProfile.displayName, providerPhone: providerProfile.phone })
    .from(job)
    .innerJoin(tankRequest, eq(tankRequest.id, job.requestId))
    .leftJoin(farmerProfile, eq(farmerProfile.userId, job.farmerId))
    .leftJoin(providerProfile, eq(providerProfile.userId, job.builderId))
    .where(eq(job.state, "disputed"));
  if (rows.length === 0) return [];
  const opened = await db
    .select({ jobId: jobEvent.jobId, at: jobEvent.createdAt, detail: jobEvent.detail })
    .from(jobEvent)
    .where(and(inArray(jobEvent.jobId, rows.map((row) => row.j.id)), eq(jobEvent.event, "dispute")))
    .orderBy(desc(jobEvent.id));
  return rows.map(({ j, t, ...names }) => {
    const event = opened.find((o) => o.jobId === j.id);
    const size: StoredSize = { shape: t.shape, lengthM: t.lengthM, widthM: t.widthM, diameterM: t.diameterM, depthM: t.depthM, sizeUnit: t.sizeUnit };
    const title = tankTitle(t.tankType, size);
    return {
      kind: "job",
      id: j.id,
      reference: `J-${j.id.slice(0, 8).toUpperCase()}`,
      title: title.charAt(0).toUpperCase() + title.slice(1),
      farmer: party(j.farmerId, names.farmerName, names.farmerPhone),
      provider: party(j.builderId, names.providerName, names.providerPhone),
      currency: j.currency,
      depositMinor: j.depositMinor,
      totalMinor: j.totalMinor,
      openedAt: (event?.at ?? j.updatedAt).toISOString(),
      reason: reasonOf(event?.detail),
    };
  });
}

/** Every open dispute, the longest-waiting first. */
export async function listOpenDisputes(): Promise<OpenDispute[]> {
  const all: OpenDispute[] = [...(await reservationDisputes()), ...(await jobDisputes())];
  return all.sort((a, b) => a.openedAt.localeCompare(b.openedAt) || a.id.localeCompare(b.id));
}

/** How many disputes wait for a decision (the dashboard's and the admin menu's count). */
export async function countOpenDisputes(): Promise<number> {
  const [r, j] = await Promise.all([
    db.$count(reservation, eq(reservation.state, "disputed")),
    db.$count(job, eq(job.state, "disputed")),
  ]);
  return r + j;
}

