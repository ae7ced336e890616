import { createClient, type Client, type Row } from "@libsql/client";
import {
  acknowledgementProblems,
  holdProblems,
  stockProblems,
  type Acknowledgement,
  type BatchStock,
  type FoundReservation,
  type HoldAmounts,
  type ProcessorRecord,
  type ReservationStock,
} from "../../lib/ops/invariants";
import { LEDGER_ACCOUNTS, type LedgerAccount, type LedgerEntry, type LedgerMovementKind } from "../../lib/payments/ledger";

// Reads the database file straight (the server may be dead or alive: WAL lets a reader in either way) and runs the
// invariants of lib/ops/invariants.ts on what it finds.

const MOVEMENTS: readonly LedgerMovementKind[] = ["hold", "release", "refund", "fee"];

function account(v: unknown): LedgerAccount {
  const found = LEDGER_ACCOUNTS.find((a) => a === v);
  if (!found) throw new Error(`unknown ledger account ${String(v)}`);
  return found;
}

function movement(v: unknown): LedgerMovementKind {
  const found = MOVEMENTS.find((m) => m === v);
  if (!found) throw new Error(`unknown ledger movement ${String(v)}`);
  return found;
}

export interface HoldRow extends HoldAmounts {
  subjectType: string;
  subjectId: string;
  amountMinor: number;
  processorHoldId: string | null;
  queuedAt: number | null;
}

export interface DbState {
  integrity: string;
  journalMode: string;
  batches: BatchStock[];
  reservations: Map<string, FoundReservation>;
  stock: ReservationStock[];
  holds: HoldRow[];
  entries: LedgerEntry[];
  /** Idempotency keys claimed by a request that never finished (cut off by a crash) */
  unfinishedKeys: number;
  /** reviews written, and those whose stored helpful count is not the number of helpful marks (null: no reviews table) */
  reviews: { count: number; helpfulDrift: string[] } | null;
}

export function openDb(url: string): Client {
  return createClient({ url, timeout: 5000 });
}

const str = (r: Row, k: string) => String(r[k]);
const num = (r: Row, k: string) => Number(r[k]);

export async function readState(db: Client): Promise<DbState> {
  const integrity = (await db.execute("PRAGMA integrity_check")).rows.map((r) => String(r[0])).join("; ");
  const journalMode = String((await db.execute("PRAGMA journal_mode")).rows[0]?.[0] ?? "");
  const batches = (await db.execute("select id, count_total, count_available from batch")).rows.map((r) => ({ id: str(r, "id"), countTotal: num(r, "count_total"), countAvailable: num(r, "count_available") }));
  const holds: HoldRow[] = (
    await db.execute("select id, subject_type, subject_id, currency, state, amount_minor, held_minor, released_minor, processor_hold_id, pending_op from deposit_hold")
  ).rows.map((r) => {
    const op = r.pending_op === null ? null : (JSON.parse(String(r.pending_op)) as { queuedAt: string });
    return {
      id: str(r, "id"),
      subjectType: str(r, "subject_type"),
      subjectId: str(r, "subject_id"),
      currency: str(r, "currency"),
      state: str(r, "state"),
      amountMinor: num(r, "amount_minor"),
      heldMinor: num(r, "held_minor"),
      releasedMinor: num(r, "released_minor"),
      processorHoldId: r.processor_hold_id === null ? null : str(r, "processor_hold_id"),
      queuedAt: op ? Date.parse(op.queuedAt) : null,
    };
  });
  const holdsOf = new Map<string, HoldRow[]>();
  for (const h of holds) if (h.subjectType === "reservation") holdsOf.set(h.subjectId, [...(holdsOf.get(h.subjectId) ?? []), h]);
  const reservations = new Map<string, FoundReservation>();
  const stock: ReservationStock[] = [];
  for (const r of (await db.execute("select id, farmer_id, batch_id, count, state, stock_returned_at, deposit_minor from reservation")).rows) {
    const id = str(r, "id");
    const found: FoundReservation = {
      id,
      farmerId: str(r, "farmer_id"),
      batchId: str(r, "batch_id"),
      count: num(r, "count"),
      state: str(r, "state"),
      stockReturned: r.stock_returned_at !== null,
      depositMinor: num(r, "deposit_minor"),
      holds: (holdsOf.get(id) ?? []).map((h) => ({ state: h.state, heldMinor: h.heldMinor, queued: h.queuedAt !== null })),
    };
    reservations.set(id, found);
    stock.push({ batchId: found.batchId, count: found.count, stockReturned: found.stockReturned });
  }
  const entries = (await db.execute("select movement_id, hold_id, movement, leg, account, currency, amount_minor from ledger_entry order by id")).rows.map((r) => ({
    movementId: str(r, "movement_id"),
    holdId: str(r, "hold_id"),
    movement: movement(r.movement),
    leg: num(r, "leg"),
    account: account(r.account),
    currency: str(r, "currency"),
    amountMinor: num(r, "amount_minor"),
  }));
  const unfinishedKeys = Number((await db.execute("select count(*) as n from api_idempotency_key where completed_at is null")).rows[0]?.n ?? 0);
  const hasReviews = (await db.execute("select 1 from sqlite_master where type = 'table' and name = 'review_helpful'")).rows.length > 0;
  const reviews = hasReviews
    ? {
        count: Number((await db.execute("select count(*) as n from review")).rows[0]?.n ?? 0),
        helpfulDrift: (await db.execute("select r.id from review r where r.helpful_count <> (select count(*) from review_helpful h where h.review_id = r.id)")).rows.map((r) => String(r.id)),
      }
    : null;
  return { integrity, journalMode, batches, reservations, stock, holds, entries, unfinishedKeys, reviews };
}

export interface Verdict {
  problems: string[];
  figures: { batches: number; reservations: number; holds: number; legs: number; reviews: number | null; pendingHolds: number; queuedHolds: number; acknowledged: number; found: number; lost: number };
}

/** Every invariant on one reading; `processor` adds the processor's records of settled holds. */
export function judge(state: DbState, acks: readonly Acknowledgement[], processor?: ReadonlyMap<string, ProcessorRecord>): Verdict {
  const problems: string[] = [];
  if (state.integrity !== "ok") problems.push(`PRAGMA integrity_check: ${state.integrity}`);
  if (state.journalMode.toLowerCase() !== "wal") problems.push(`journal_mode is ${state.journalMode}, not wal`);
  for (const p of stockProblems(state.batches, state.stock)) problems.push(`stock: ${JSON.stringify(p)}`);
  for (const p of holdProblems(state.holds, state.entries, processor)) problems.push(`money: ${JSON.stringify(p)}`);
  // The stored count that "most helpful" sorts on is kept with the marks in one transaction (lib/reviews/review-service.ts).
  for (const id of state.reviews?.helpfulDrift ?? []) problems.push(`reviews: helpful_count of review ${id} is not its number of helpful marks`);
  const ackProblems = acknowledgementProblems(acks, state.reservations);
  for (const p of ackProblems) problems.push(`acknowledged: ${JSON.stringify(p)}`);
  const lost = ackProblems.filter((p) => p.kind === "lost").length;
  return {
    problems,
    figures: {
      batches: state.batches.length,
      reservations: state.reservations.size,
      holds: state.holds.length,
      legs: state.entries.length,
      reviews: state.reviews?.count ?? null,
      pendingHolds: state.holds.filter((h) => h.state === "pending").length,
      queuedHolds: state.holds.filter((h) => h.queuedAt !== null).length,
      acknowledged: acks.length,
      found: acks.length - lost,
      lost,
    },
  };
}

/** Reads the file once with a fresh connection (the first one after a crash also recovers the WAL) and judges it. */
export async function checkDatabase(url: string, acks: readonly Acknowledgement[], processor?: ReadonlyMap<string, ProcessorRecord>): Promise<Verdict & { state: DbState }> {
  const db = openDb(url);
  try {
    const state = await readState(db);
    return { ...judge(state, acks, processor), state };
  } finally {
    db.close();
  }
}
