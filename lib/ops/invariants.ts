import { balances, ledgerProblems, type LedgerEntry, type LedgerProblem } from "@/lib/payments/ledger";

/*
 * What must hold in the database whatever load or crash it went through, as pure checks over plain rows (the
 * load and crash test in tests/load/ reads the rows; these functions say what is wrong with them):
 * - stock: a batch never has fewer than 0 or more than its total on offer, and what is not on offer is exactly
 *   what live reservations hold (the fish of reservations whose stock was not given back);
 * - money: every hold's ledger legs pass ledgerProblems (double entry, each hold summing to zero) and agree with
 *   the hold's own amounts; where the processor's record is known, it holds as much as the ledger says;
 * - acknowledgements: every request a client saw succeed is in the database, in a state that agrees with it.
 */

export interface BatchStock {
  id: string;
  countTotal: number;
  countAvailable: number;
}

export interface ReservationStock {
  batchId: string;
  count: number;
  /** stock_returned_at is set: the fish went back to the batch */
  stockReturned: boolean;
}

export type StockProblem =
  | { kind: "below_zero"; batchId: string; countAvailable: number }
  | { kind: "above_total"; batchId: string; countAvailable: number; countTotal: number }
  | { kind: "stock_mismatch"; batchId: string; countTotal: number; countAvailable: number; heldByReservations: number };

export function stockProblems(batches: readonly BatchStock[], reservations: readonly ReservationStock[]): StockProblem[] {
  const held = new Map<string, number>();
  for (const r of reservations) if (!r.stockReturned) held.set(r.batchId, (held.get(r.batchId) ?? 0) + r.count);
  const problems: StockProblem[] = [];
  for (const b of batches) {
    if (b.countAvailable < 0) problems.push({ kind: "below_zero", batchId: b.id, countAvailable: b.countAvailable });
    if (b.countAvailable > b.countTotal) problems.push({ kind: "above_total", batchId: b.id, countAvailable: b.countAvailable, countTotal: b.countTotal });
    const heldByReservations = held.get(b.id) ?? 0;
    if (b.countTotal - b.countAvailable !== heldByReservations) problems.push({ kind: "stock_mismatch", batchId: b.id, countTotal: b.countTotal, countAvailable: b.countAvailable, heldByReservations });
  }
  return problems;
}

export interface HoldAmounts {
  id: string;
  currency: string;
  state: string;
  heldMinor: number;
  releasedMinor: number;
}

/** The processor's record of one payment, in the stand-in's (and Stripe's) payment-intent terms. */
export interface ProcessorRecord {
  amountCapturable: number;
  amountReceived: number;
  amountRefunded: number;
}

export type HoldProblem =
  | { kind: "ledger"; problem: LedgerProblem }
  | { kind: "orphan_legs"; holdId: string }
  | { kind: "holding_mismatch"; holdId: string; ledgerMinor: number; heldMinor: number }
  | { kind: "payable_mismatch"; holdId: string; ledgerMinor: number; releasedMinor: number }
  | { kind: "processor_mismatch"; holdId: string; processorMinor: number; ledgerMinor: number };

/**
 * Ledger problems of all holds (entries in the order they were written), plus each hold's balances against its
 * own columns: Shoal's holding account carries what the hold says is held, the provider's account what it says
 * was released. `processor` (hold id → record) adds the outside view: what the processor still has of the farmer's
 * money (authorised, or captured and not refunded) equals what the ledger says left the farmer's hands. Leave out
 * holds whose processor call may be between the processor and our write (pending holds, queued operations).
 */
export function holdProblems(holds: readonly HoldAmounts[], entries: readonly LedgerEntry[], processor: ReadonlyMap<string, ProcessorRecord> = new Map()): HoldProblem[] {
  const problems: HoldProblem[] = ledgerProblems(entries).map((problem) => ({ kind: "ledger" as const, problem }));
  const byHold = new Map<string, LedgerEntry[]>();
  for (const e of entries) {
    const list = byHold.get(e.holdId) ?? [];
    list.push(e);
    byHold.set(e.holdId, list);
  }
  const known = new Set(holds.map((h) => h.id));
  for (const holdId of byHold.keys()) if (!known.has(holdId)) problems.push({ kind: "orphan_legs", holdId });
  for (const h of holds) {
    const b = balances(byHold.get(h.id) ?? [])[h.currency];
    const holding = b?.platform_holding ?? 0;
    const payable = b?.provider_payable ?? 0;
    if (holding !== h.heldMinor) problems.push({ kind: "holding_mismatch", holdId: h.id, ledgerMinor: holding, heldMinor: h.heldMinor });
    if (payable !== h.releasedMinor) problems.push({ kind: "payable_mismatch", holdId: h.id, ledgerMinor: payable, releasedMinor: h.releasedMinor });
    const record = processor.get(h.id);
    if (record) {
      const processorMinor = record.amountCapturable + record.amountReceived - record.amountRefunded;
      if (processorMinor !== holding + payable) problems.push({ kind: "processor_mismatch", holdId: h.id, processorMinor, ledgerMinor: holding + payable });
    }
  }
  return problems;
}

/** The steps of a reservation a client can have seen succeed, in the order the load takes them. */
export const ACKNOWLEDGED_STEPS = ["created", "accepted", "paid", "cancelled"] as const;
export type AcknowledgedStep = (typeof ACKNOWLEDGED_STEPS)[number];

/** The reservation state each step leaves behind (lib/reservations/state.ts). */
const STATE_AFTER: Readonly<Record<AcknowledgedStep, string>> = { created: "requested", accepted: "accepted", paid: "deposit_held", cancelled: "cancelled" };

export interface Acknowledgement {
  reservationId: string;
  farmerId: string;
  batchId: string;
  count: number;
  /** the last step the client saw succeed */
  step: AcknowledgedStep;
  /** a later step the client sent and got no answer to (it may or may not have happened) */
  inDoubt: AcknowledgedStep | null;
}

export interface FoundReservation {
  id: string;
  farmerId: string;
  batchId: string;
  count: number;
  state: string;
  stockReturned: boolean;
  depositMinor: number;
  /** the reservation's holds, any state */
  holds: readonly { state: string; heldMinor: number; queued: boolean }[];
}

export type AcknowledgementProblem =
  | { kind: "lost"; reservationId: string; step: AcknowledgedStep }
  | { kind: "changed"; reservationId: string; field: "farmerId" | "batchId" | "count" }
  | { kind: "wrong_state"; reservationId: string; step: AcknowledgedStep; state: string; allowed: string[] }
  | { kind: "stock_not_returned"; reservationId: string }
  | { kind: "deposit_not_held"; reservationId: string; state: string };

/**
 * Each acknowledged step against what the database holds. The state must be the one the step left, or the one
 * the step in doubt would leave. A cancelled reservation has given its fish back; a deposit_held one has a hold
 * holding its whole deposit; an acknowledged payment of a reservation cancelled since has a hold that was refunded
 * or whose refund is queued for the processor.
 */
export function acknowledgementProblems(acks: readonly Acknowledgement[], found: ReadonlyMap<string, FoundReservation>): AcknowledgementProblem[] {
  const problems: AcknowledgementProblem[] = [];
  for (const a of acks) {
    const r = found.get(a.reservationId);
    if (!r) {
      problems.push({ kind: "lost", reservationId: a.reservationId, step: a.step });
      continue;
    }
    for (const field of ["farmerId", "batchId", "count"] as const) if (r[field] !== a[field]) problems.push({ kind: "changed", reservationId: a.reservationId, field });
    const allowed = [STATE_AFTER[a.step], ...(a.inDoubt ? [STATE_AFTER[a.inDoubt]] : [])];
    if (!allowed.includes(r.state)) problems.push({ kind: "wrong_state", reservationId: a.reservationId, step: a.step, state: r.state, allowed });
    if (r.state === "cancelled" && !r.stockReturned) problems.push({ kind: "stock_not_returned", reservationId: a.reservationId });
    const holding = r.holds.some((h) => h.state === "held" && h.heldMinor === r.depositMinor);
    if (r.state === "deposit_held" && !holding) problems.push({ kind: "deposit_not_held", reservationId: a.reservationId, state: r.state });
    if (a.step === "paid" && r.state === "cancelled" && !r.holds.some((h) => h.state === "refunded" || (h.state === "held" && h.queued))) {
      problems.push({ kind: "deposit_not_held", reservationId: a.reservationId, state: r.state });
    }
  }
  return problems;
}

/**
 * The p-th percentile of values sorted ascending by the nearest-rank method: the smallest value with at least p %
 * of the values at or below it (rank ⌈p/100 × n⌉). NaN for no values.
 */
export function nearestRank(sorted: readonly number[], p: number): number {
  if (sorted.length === 0) return Number.NaN;
  const rank = Math.max(1, Math.ceil((p / 100) * sorted.length));
  return sorted[Math.min(sorted.length, rank) - 1] ?? Number.NaN;
}
