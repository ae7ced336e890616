import "server-only";
import { eq, and } from "drizzle-orm";
import type { Database } from "@/db/client";
import { auditLog } from "@/db/schema";
import { depositHold, holdHistory, ledgerEntry, type DepositHoldRow, type HoldSubjectType } from "@/db/schema-reservations";
import type { WriteTx } from "@/db/write-transaction";
import { Conflict, DomainError, Forbidden, Invalid, NotFound } from "@/lib/errors";
import type { DepositHold, HoldActor, HoldEffect, HoldRefusal, HoldState } from "./hold-state";
import { entriesFor } from "./ledger";

// The database side of a deposit hold: reading rows into the pure machine's shape, and writing one move
// (state, ledger legs, history row, audit row) inside the caller's transaction. Used by holds.ts only.

/** Who moves a hold: the machine's role, and the signed-in user behind it (none for the system). */
export interface HoldCaller {
  role: HoldActor;
  userId?: string | null;
}

/** What callers see of a hold (never the payment method or the processor's ids). */
export interface HoldView {
  id: string;
  subjectType: HoldSubjectType;
  subjectId: string;
  payerId: string;
  payeeId: string;
  currency: string;
  amountMinor: number;
  state: HoldState;
  heldMinor: number;
  releasedMinor: number;
  returnedMinor: number;
  failure: { code: string; message: string } | null;
  authorizedAt: Date | null;
  /** when the authorisation was captured into Shoal's holding (see holds.ts on card-hold expiry) */
  capturedAt: Date | null;
  /** a processor call for this hold is queued or in flight */
  busy: boolean;
}

type Reader = Database | WriteTx;

export function viewOf(row: DepositHoldRow): HoldView {
  return {
    id: row.id,
    subjectType: row.subjectType,
    subjectId: row.subjectId,
    payerId: row.payerId,
    payeeId: row.payeeId,
    currency: row.currency,
    amountMinor: row.amountMinor,
    state: row.state,
    heldMinor: row.heldMinor,
    releasedMinor: row.releasedMinor,
    returnedMinor: row.returnedMinor,
    failure: row.failureCode ? { code: row.failureCode, message: row.failureMessage ?? "The payment was declined." } : null,
    authorizedAt: row.authorizedAt,
    capturedAt: row.capturedAt,
    busy: row.pendingOp !== null,
  };
}

export function machineOf(row: DepositHoldRow): DepositHold {
  return {
    holdId: row.id,
    currency: row.currency,
    amountMinor: row.amountMinor,
    state: row.state,
    heldMinor: row.heldMinor,
    releasedMinor: row.releasedMinor,
    returnedMinor: row.returnedMinor,
  };
}

export async function findHold(reader: Reader, holdId: string): Promise<DepositHoldRow | null> {
  return (await reader.select().from(depositHold).where(eq(depositHold.id, holdId)).limit(1))[0] ?? null;
}

export async function loadHold(reader: Reader, holdId: string): Promise<DepositHoldRow> {
  const row = await findHold(reader, holdId);
  if (!row) throw new NotFound("No such deposit hold");
  return row;
}

export function holdRefusalError(reason: HoldRefusal, message: string): DomainError {
  switch (reason) {
    case "forbidden_actor":
      return new Forbidden(message);
    case "illegal_transition":
      return new Conflict(message);
    case "amount_mismatch":
    case "currency_mismatch":
    case "invalid_amount":
      return new Invalid(message, { amountMinor: [message] });
  }
}

export type HoldHistoryEvent = (typeof holdHistory.$inferInsert)["event"];

/**
 * Writes one move of a hold, if nobody moved it since `row` was read (version check): the new state and amounts,
 * the balanced ledger legs of its ledger effects, a history row and an audit row, all in the caller's transaction.
 */
export async function commitHoldMove(
  tx: WriteTx,
  row: DepositHoldRow,
  move: {
    next: DepositHold;
    effects: readonly HoldEffect[];
    event: HoldHistoryEvent;
    caller: HoldCaller;
    at: Date;
    detail?: Record<string, unknown>;
    set?: Partial<Pick<DepositHoldRow, "processorHoldId" | "authorizedAt" | "capturedAt" | "pendingOp" | "failureCode" | "failureMessage">>;
  },
): Promise<DepositHoldRow> {
  const { next } = move;
  const updated = await tx
    .update(depositHold)
    .set({
      state: next.state,
      heldMinor: next.heldMinor,
      releasedMinor: next.releasedMinor,
      returnedMinor: next.returnedMinor,
      version: row.version + 1,
      ...move.set,
    })
    .where(and(eq(depositHold.id, row.id), eq(depositHold.version, row.version)))
    .returning();
  const after = updated[0];
  if (!after) throw new Conflict("The deposit changed while this was being done. Reload and try again.");
  const legs = move.effects.flatMap((effect) => (effect.kind === "ledger" ? entriesFor(effect.movement) : []));
  if (legs.length > 0) {
    // (movement_id, leg) is unique: a move replayed past the version check still cannot book the money twice.
    await tx.insert(ledgerEntry).values(legs.map((leg) => ({ ...leg, createdAt: move.at })));
  }
  const actorId = move.caller.userId ?? null;
  await tx.insert(holdHistory).values({ holdId: row.id, fromState: row.state, toState: next.state, event: move.event, actor: move.caller.role, actorId, at: move.at, detail: move.detail ?? null });
  await tx.insert(auditLog).values({
    actorId,
    action: `hold.${move.event}`,
    subjectType: "deposit_hold",
    subjectId: row.id,
    detail: {
      actor: move.caller.role,
      from: row.state,
      to: next.state,
      for: `${row.subjectType}:${row.subjectId}`,
      currency: row.currency,
      heldMinor: next.heldMinor,
      releasedMinor: next.releasedMinor,
      returnedMinor: next.returnedMinor,
      movements: legs.length > 0 ? [...new Set(legs.map((l) => l.movementId))] : [],
      ...move.detail,
    },
    createdAt: move.at,
  });
  return after;
}
