import "server-only";
import { and, asc, desc, eq, inArray, like, or, sql, type SQL } from "drizzle-orm";
import { alias } from "drizzle-orm/sqlite-core";
import { db } from "@/db/client";
import { batch, profile, user } from "@/db/schema";
import { depositHold, reservation, reservationHistory, type ReservationRow } from "@/db/schema-reservations";
import { can } from "@/lib/auth/permissions";
import { SPECIES_LABEL, type Species } from "@/lib/catalog";
import { Forbidden } from "@/lib/errors";
import { minorDigits, toMajor } from "@/lib/money/money";
import type { HoldState } from "@/lib/payments/hold-state";
import type { ReservationListQuery } from "@/lib/validations/reservations";
import { toCsv } from "./csv";
import { reservationReference, type HistoryEventName } from "./labels";
import { actorFor, loadReservation, machineOf, type Caller } from "./records";
import { reservationDeadlines, transition, type ReservationActor, type ReservationActorRole, type ReservationEvent, type ReservationState } from "./state";

// What the reservation pages and the CSV export read. Small typed objects with ISO dates, never raw rows or e-mails.

export type ReservationActionName = "accept" | "decline" | "cancel" | "hand_over" | "report_survival" | "dispute" | "resolve_dispute" | "refund" | "pay" | "check";

export interface ReservationHistoryItem {
  id: number;
  event: HistoryEventName;
  fromState: ReservationState | null;
  toState: ReservationState;
  actorRole: ReservationActorRole;
  actorName: string | null;
  at: string;
  detail: Record<string, unknown> | null;
}

export interface ReservationDetail {
  id: string;
  reference: string;
  state: ReservationState;
  viewerRole: "farmer" | "hatchery" | "admin";
  batchId: string;
  species: Species;
  speciesLabel: string;
  meanWeightG: number;
  meanLengthCm: number;
  count: number;
  pricePerFishMinor: number;
  currency: string;
  totalMinor: number;
  depositMinor: number;
  handoverMethod: "pickup" | "delivery";
  note: string | null;
  farmer: { id: string; name: string; phone: string | null };
  hatchery: { id: string; name: string; phone: string | null };
  requestedAt: string;
  acceptedAt: string | null;
  depositHeldAt: string | null;
  handedOverAt: string | null;
  handedOverCount: number | null;
  survivedCount: number | null;
  closedAt: string | null;
  deadlines: { acceptBy: string; payBy: string | null; survivalReportFrom: string | null; autoReleaseAt: string | null };
  history: ReservationHistoryItem[];
  hold: { state: HoldState; amountMinor: number; heldMinor: number; releasedMinor: number; returnedMinor: number; currency: string; busy: boolean } | null;
  /** the newest declined payment, if no payment succeeded after it */
  lastDecline: { message: string; at: string } | null;
  quarantineChecks: Record<string, string>;
  /** what the viewer may do now, as the machine decides */
  allowed: ReservationActionName[];
  /** moves the viewer will be able to make later, with the machine's reason why not yet */
  notYet: { action: ReservationActionName; message: string }[];
}

const iso = (d: Date | null) => (d ? d.toISOString() : null);

/** The candidate moves for a viewer, with sample payloads the machine can judge (counts at their maximum). */
function candidates(row: ReservationRow): [ReservationActionName, ReservationEvent][] {
  return [
    ["accept", { type: "accept" }],
    ["decline", { type: "decline" }],
    ["cancel", { type: "cancel" }],
    ["hand_over", { type: "hand_over", count: row.count }],
    ["report_survival", { type: "report_survival", survived: row.handedOverCount ?? 0 }],
    ["dispute", { type: "dispute" }],
    ["resolve_dispute", { type: "resolve_dispute", outcome: "for_farmer" }],
    ["refund", { type: "refund" }],
  ];
}

export function allowedMoves(row: ReservationRow, actor: ReservationActor, now: Date): { allowed: ReservationActionName[]; notYet: { action: ReservationActionName; message: string }[] } {
  const allowed: ReservationActionName[] = [];
  const notYet: { action: ReservationActionName; message: string }[] = [];
  for (const [name, event] of candidates(row)) {
    const r = transition(machineOf(row), event, { actor, now });
    if (r.ok) allowed.push(name);
    else if (r.reason === "too_early") notYet.push({ action: name, message: r.message });
  }
  if (actor.role === "farmer" && row.state === "accepted") allowed.push("pay");
  if (actor.role === "farmer" && row.state === "quarantine") allowed.push("check");
  return { allowed, notYet };
}

async function partyOf(userId: string): Promise<{ name: string; phone: string | null }> {
  const r = (await db.select({ name: user.name, displayName: profile.displayName, phone: profile.phone }).from(user).leftJoin(profile, eq(profile.userId, user.id)).where(eq(user.id, userId)).limit(1))[0];
  return { name: r?.displayName ?? r?.name ?? "Unknown", phone: r?.phone ?? null };
}

/** One reservation as its farmer, its hatchery or an admin sees it; anyone else gets a 404. */
export async function getReservationDetail(caller: Caller, id: string, now = new Date()): Promise<ReservationDetail> {
  const row = await loadReservation(db, id);
  const actor = actorFor(caller, row);
  const viewerRole = actor.role === "system" ? "admin" : actor.role;
  const [farmer, hatchery, historyRows, holds] = await Promise.all([
    partyOf(row.farmerId),
    partyOf(row.hatcheryId),
    db
      .select({ h: reservationHistory, actorName: sql<string | null>`coalesce(${profile.displayName}, ${user.name})` })
      .from(reservationHistory)
      .leftJoin(user, eq(user.id, reservationHistory.actorId))
      .leftJoin(profile, eq(profile.userId, reservationHistory.actorId))
      .where(eq(reservationHistory.reservationId, id))
      .orderBy(asc(reservationHistory.id)),
    db.select().from(depositHold).where(and(eq(depositHold.subjectType, "reservation"), eq(depositHold.subjectId, id))).orderBy(desc(depositHold.createdAt)),
  ]);
  const current = holds.find((h) => h.state !== "failed") ?? null;
  const newestFailed = holds.find((h) => h.state === "failed");
  const lastDecline = newestFailed && (!current || newestFailed.createdAt > current.createdAt) ? { message: newestFailed.failureMessage ?? "The payment was declined.", at: newestFailed.updatedAt.toISOString() } : null;
  const d = reservationDeadlines(machineOf(row));
  const phonesShared = row.acceptedAt !== null;
  const moves = allowedMoves(row, actor, now);
  return {
    id: row.id,
    reference: reservationReference(row.id),
    state: row.state,
    viewerRole,
    batchId: row.batchId,
    species: row.species as Species,
    speciesLabel: SPECIES_LABEL[row.species as Species] ?? row.species,
    meanWeightG: row.meanWeightG,
    meanLengthCm: row.meanLengthCm,
    count: row.count,
    pricePerFishMinor: row.pricePerFishMinor,
    currency: row.currency,
    totalMinor: row.totalMinor,
    depositMinor: row.depositMinor,
    handoverMethod: row.handoverMethod,
    note: row.note,
    farmer: { id: row.farmerId, name: farmer.name, phone: phonesShared || viewerRole === "admin" ? farmer.phone : null },
    hatchery: { id: row.hatcheryId, name: hatchery.name, phone: phonesShared || viewerRole === "admin" ? hatchery.phone : null },
    requestedAt: row.requestedAt.toISOString(),
    acceptedAt: iso(row.acceptedAt),
    depositHeldAt: iso(row.depositHeldAt),
    handedOverAt: iso(row.handedOverAt),
    handedOverCount: row.handedOverCount,
    survivedCount: row.survivedCount,
    closedAt: iso(row.closedAt),
    deadlines: { acceptBy: d.acceptBy.toISOString(), payBy: iso(d.payBy), survivalReportFrom: iso(d.survivalReportFrom), autoReleaseAt: iso(d.autoReleaseAt) },
    history: historyRows.map(({ h, actorName }) => ({
      id: h.id,
      event: h.event,
      fromState: h.fromState,
      toState: h.toState,
      actorRole: h.actorRole,
      actorName: h.actorRole === "system" ? null : actorName,
      at: h.at.toISOString(),
      detail: h.detail,
    })),
    hold: current ? { state: current.state, amountMinor: current.amountMinor, heldMinor: current.heldMinor, releasedMinor: current.releasedMinor, returnedMinor: current.returnedMinor, currency: current.currency, busy: current.pendingOp !== null } : null,
    lastDecline,
    quarantineChecks: row.quarantineChecks,
    allowed: moves.allowed,
    notYet: moves.notYet,
  };
}

// ---------------------------------------------------------------------------------------------------------------
// Lists and the CSV export
// ---------------------------------------------------------------------------------------------------------------

export interface ReservationSummary {
  id: string;
  reference: string;
  state: ReservationState;
  speciesLabel: string;
  meanWeightG: number;
  count: number;
  totalMinor: number;
  depositMinor: number;
  currency: string;
  handoverMethod: "pickup" | "delivery";
  requestedAt: string;
  farmerName: string;
  hatcheryName: string;
  batchId: string;
  handedOverCount: number | null;
  survivedCount: number | null;
  /** the next deadline the sweep acts on (lapse or automatic release) */
  nextDeadline: string | null;
  allowed: ReservationActionName[];
}

export interface ReservationPage {
  rows: ReservationSummary[];
  total: number;
  page: number;
  pageSize: number;
  pages: number;
}

const OPEN: ReservationState[] = ["requested", "accepted", "deposit_held", "quarantine", "disputed"];
const DONE: ReservationState[] = ["released", "cancelled", "declined", "lapsed", "refunded"];

const farmerProfile = alias(profile, "farmer_profile");
const hatcheryProfile = alias(profile, "hatchery_profile");

function whereFor(caller: Caller, query: ReservationListQuery): SQL | undefined {
  const side = query.as === "hatchery" ? reservation.hatcheryId : reservation.farmerId;
  const parts: (SQL | undefined)[] = [eq(side, caller.id)];
  if (query.state === "open") parts.push(inArray(reservation.state, OPEN));
  else if (query.state === "done") parts.push(inArray(reservation.state, DONE));
  else if (query.state !== "all") parts.push(eq(reservation.state, query.state));
  if (query.batchId) parts.push(eq(reservation.batchId, query.batchId));
  if (query.q) {
    const escaped = query.q.replace(/[\\%_]/g, (c) => `\\${c}`);
    const other = query.as === "hatchery" ? farmerProfile.displayName : hatcheryProfile.displayName;
    const byName = sql`${other} like ${`%${escaped}%`} escape '\\'`;
    // A reference is the id's first 8 hex digits (labels.ts), so a hex search also matches the start of the id.
    const hex = query.q.toLowerCase();
    parts.push(/^[0-9a-f]{1,8}$/.test(hex) ? or(byName, like(reservation.id, `${hex}%`)) : byName);
  }
  return and(...parts);
}

function orderFor(query: ReservationListQuery): SQL[] {
  if (query.sort === "attention") {
    // The farmer's order and the hatchery's differ: each side's own next step comes first.
    const first = query.as === "farmer" ? ["accepted", "quarantine", "disputed", "deposit_held", "requested"] : ["requested", "deposit_held", "disputed", "accepted", "quarantine"];
    const rank = sql.join(
      first.map((state, i) => sql`when ${state} then ${i}`),
      sql` `,
    );
    return [sql`case ${reservation.state} ${rank} else ${first.length} end`, desc(reservation.requestedAt), desc(reservation.id)];
  }
  const column = { requestedAt: reservation.requestedAt, count: reservation.count, state: reservation.state, total: reservation.totalMinor }[query.sort];
  const dir = query.dir === "asc" ? asc : desc;
  return [dir(column), dir(reservation.id)];
}

function requireSide(caller: Caller, query: ReservationListQuery): void {
  if (query.as === "hatchery" && !can(caller, "reservation:respond")) throw new Forbidden("Only a hatchery account sees incoming reservations.");
  if (query.as === "farmer" && !can(caller, "reservation:create")) throw new Forbidden("Only a farmer account has reservations of its own.");
}

async function selectRows(caller: Caller, query: ReservationListQuery, limit: number, offset: number) {
  return db
    .select({ r: reservation, farmerName: sql<string>`coalesce(${farmerProfile.displayName}, '')`, hatcheryName: sql<string>`coalesce(${hatcheryProfile.displayName}, '')` })
    .from(reservation)
    .leftJoin(farmerProfile, eq(farmerProfile.userId, reservation.farmerId))
    .leftJoin(hatcheryProfile, eq(hatcheryProfile.userId, reservation.hatcheryId))
    .where(whereFor(caller, query))
    .orderBy(...orderFor(query))
    .limit(limit)
    .offset(offset);
}

export async function listReservations(caller: Caller, query: ReservationListQuery, now = new Date()): Promise<ReservationPage> {
  requireSide(caller, query);
  const [countRow] = await db
    .select({ n: sql<number>`count(*)` })
    .from(reservation)
    .leftJoin(farmerProfile, eq(farmerProfile.userId, reservation.farmerId))
    .leftJoin(hatcheryProfile, eq(hatcheryProfile.userId, reservation.hatcheryId))
    .where(whereFor(caller, query));
  const total = Number(countRow?.n ?? 0);
  const pages = Math.max(1, Math.ceil(total / query.pageSize));
  const page = Math.min(query.page, pages);
  const rows = await selectRows(caller, query, query.pageSize, (page - 1) * query.pageSize);
  const actor: ReservationActor = query.as === "hatchery" ? { role: "hatchery", userId: caller.id } : { role: "farmer", userId: caller.id };
  return {
    rows: rows.map(({ r, farmerName, hatcheryName }) => ({
      id: r.id,
      reference: reservationReference(r.id),
      state: r.state,
      speciesLabel: SPECIES_LABEL[r.species as Species] ?? r.species,
      meanWeightG: r.meanWeightG,
      count: r.count,
      totalMinor: r.totalMinor,
      depositMinor: r.depositMinor,
      currency: r.currency,
      handoverMethod: r.handoverMethod,
      requestedAt: r.requestedAt.toISOString(),
      farmerName,
      hatcheryName,
      batchId: r.batchId,
      handedOverCount: r.handedOverCount,
      survivedCount: r.survivedCount,
      nextDeadline: iso(r.state === "quarantine" ? r.autoReleaseAt : r.lapseAt),
      allowed: allowedMoves(r, actor, now).allowed,
    })),
    total,
    page,
    pageSize: query.pageSize,
    pages,
  };
}

const CSV_HEADER = ["reference", "requested_at", "state", "farmer", "species", "mean_weight_g", "count", "price_per_fish", "total", "deposit", "currency", "handover", "handed_over", "survived"] as const;
const CSV_MAX_ROWS = 10_000;

/** The hatchery's reservations matching the table's filters and sort, all pages, as RFC 4180 CSV. */
export async function exportReservationsCsv(caller: Caller, query: ReservationListQuery): Promise<string> {
  if (!can(caller, "reservation:export")) throw new Forbidden("Only a hatchery account can export its reservations.");
  const q = { ...query, as: "hatchery" as const };
  const rows = await selectRows(caller, q, CSV_MAX_ROWS, 0);
  // Amounts in major units with the currency's own number of decimals (ISO 4217 minor unit), so a spreadsheet sums them.
  const major = (minor: number, currency: string) => Number(toMajor(minor, currency).toFixed(minorDigits(currency)));
  return toCsv(
    CSV_HEADER,
    rows.map(({ r, farmerName }) => [
      reservationReference(r.id),
      r.requestedAt.toISOString(),
      r.state,
      farmerName,
      SPECIES_LABEL[r.species as Species] ?? r.species,
      r.meanWeightG,
      r.count,
      major(r.pricePerFishMinor, r.currency),
      major(r.totalMinor, r.currency),
      major(r.depositMinor, r.currency),
      r.currency,
      r.handoverMethod,
      r.handedOverCount,
      r.survivedCount,
    ]),
  );
}

/** For the reserve form: an open batch with its hatchery's name, or null. */
export async function getReservableBatch(batchId: string, now = new Date()) {
  const row = (
    await db
      .select({ b: batch, hatcheryName: profile.displayName })
      .from(batch)
      .innerJoin(profile, eq(profile.userId, batch.hatcheryId))
      .where(eq(batch.id, batchId))
      .limit(1)
  )[0];
  if (!row) return null;
  const { b } = row;
  return {
    id: b.id,
    hatcheryId: b.hatcheryId,
    hatcheryName: row.hatcheryName,
    species: b.species,
    speciesLabel: SPECIES_LABEL[b.species],
    meanWeightG: b.meanWeightG,
    meanLengthCm: b.meanLengthCm,
    countAvailable: b.countAvailable,
    priceMinor: b.priceMinor,
    currency: b.currency,
    readyFrom: b.readyFrom.toISOString(),
    sellBy: b.sellBy.toISOString(),
    delivery: b.delivery,
    open: b.state === "open" && b.sellBy.getTime() >= now.getTime() && b.countAvailable > 0,
    state: b.state,
  };
}
export type ReservableBatch = NonNullable<Awaited<ReturnType<typeof getReservableBatch>>>;
