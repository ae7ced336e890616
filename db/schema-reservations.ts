// Tables for fingerling reservations, deposit holds and the ledger (issue 4: batches, reservations and the
// deposit hold). Kept apart from db/schema.ts, which holds the core tables (batch lives there).
//
// The vocabularies are spelled out here rather than imported: drizzle-kit loads this file without the app's
// path aliases, and the pure modules that own them import through "@/". The `satisfies` checks below fail the
// type check if a list here and its owner ever disagree.
import { sql } from "drizzle-orm";
import { check, index, integer, primaryKey, real, sqliteTable, text, uniqueIndex } from "drizzle-orm/sqlite-core";
import type { HoldActor, HoldEventType, HoldState } from "../lib/payments/hold-state";
import type { LedgerAccount, LedgerMovementKind } from "../lib/payments/ledger";
import type { ReservationActorRole, ReservationEventType, ReservationState } from "../lib/reservations/state";
import { createdAt, updatedAt } from "./columns";
import { batch, user } from "./schema";

const at = (name: string) => integer(name, { mode: "timestamp_ms" });

type Exactly<A, B> = [A] extends [B] ? ([B] extends [A] ? true : false) : false;
const exact = <T extends true>(value: T): T => value;

const RESERVATION_STATE_VALUES = ["requested", "accepted", "deposit_held", "quarantine", "released", "cancelled", "declined", "lapsed", "disputed", "refunded"] as const;
// History rows also record the creation ("request") and the checklist is not a state move, so it is not here.
const RESERVATION_HISTORY_EVENTS = [
  "request",
  "accept",
  "decline",
  "pay_deposit",
  "hand_over",
  "remind_survival",
  "report_survival",
  "auto_release",
  "cancel",
  "lapse",
  "dispute",
  "resolve_dispute",
  "refund",
] as const;
const RESERVATION_ACTOR_VALUES = ["farmer", "hatchery", "admin", "system"] as const;
const HOLD_STATE_VALUES = ["pending", "held", "frozen", "released", "partially_released", "refunded", "failed", "voided", "expired"] as const;
// "open" is the creation of the row; "safekeep" the capture into Shoal's holding before a card authorisation lapses.
const HOLD_HISTORY_EVENTS = ["open", "authorize", "fail", "void", "release", "refund", "freeze", "resolve", "expire", "safekeep"] as const;
const HOLD_ACTOR_VALUES = ["farmer", "provider", "admin", "system"] as const;
const LEDGER_ACCOUNT_VALUES = ["farmer_funds", "platform_holding", "provider_payable", "platform_fee"] as const;
const LEDGER_MOVEMENT_VALUES = ["hold", "release", "refund", "fee"] as const;
export const HOLD_SUBJECT_TYPES = ["reservation", "job"] as const;
export type HoldSubjectType = (typeof HOLD_SUBJECT_TYPES)[number];
export const HANDOVER_METHODS = ["pickup", "delivery"] as const;

exact<Exactly<(typeof RESERVATION_STATE_VALUES)[number], ReservationState>>(true);
exact<Exactly<Exclude<(typeof RESERVATION_HISTORY_EVENTS)[number], "request">, ReservationEventType>>(true);
exact<Exactly<(typeof RESERVATION_ACTOR_VALUES)[number], ReservationActorRole>>(true);
exact<Exactly<(typeof HOLD_STATE_VALUES)[number], HoldState>>(true);
exact<Exactly<Exclude<(typeof HOLD_HISTORY_EVENTS)[number], "open" | "safekeep">, HoldEventType>>(true);
exact<Exactly<(typeof HOLD_ACTOR_VALUES)[number], HoldActor>>(true);
exact<Exactly<(typeof LEDGER_ACCOUNT_VALUES)[number], LedgerAccount>>(true);
exact<Exactly<(typeof LEDGER_MOVEMENT_VALUES)[number], LedgerMovementKind>>(true);

// ---------------------------------------------------------------------------
// Reservations
// ---------------------------------------------------------------------------

/**
 * A farmer's claim on fish of one batch. Price, currency, count and what the fish were are a snapshot taken
 * when the request is made: a later edit of the batch must not change what was agreed.
 */
export const reservation = sqliteTable(
  "reservation",
  {
    id: text("id").primaryKey(),
    batchId: text("batch_id")
      .notNull()
      .references(() => batch.id, { onDelete: "restrict" }),
    farmerId: text("farmer_id")
      .notNull()
      .references(() => user.id, { onDelete: "restrict" }),
    hatcheryId: text("hatchery_id")
      .notNull()
      .references(() => user.id, { onDelete: "restrict" }),
    state: text("state", { enum: RESERVATION_STATE_VALUES }).notNull(),
    count: integer("count").notNull(),
    species: text("species").notNull(),
    meanWeightG: real("mean_weight_g").notNull(),
    meanLengthCm: real("mean_length_cm").notNull(),
    pricePerFishMinor: integer("price_per_fish_minor").notNull(),
    currency: text("currency").notNull(),
    totalMinor: integer("total_minor").notNull(),
    depositMinor: integer("deposit_minor").notNull(),
    handoverMethod: text("handover_method", { enum: HANDOVER_METHODS }).notNull(),
    note: text("note"),
    requestedAt: at("requested_at").notNull(),
    acceptedAt: at("accepted_at"),
    depositHeldAt: at("deposit_held_at"),
    handedOverAt: at("handed_over_at"),
    handedOverCount: integer("handed_over_count"),
    survivalReminderSentAt: at("survival_reminder_sent_at"),
    survivedCount: integer("survived_count"),
    closedAt: at("closed_at"),
    // What the sweep looks at (the machine's "schedule" effects): when to lapse, remind and release.
    lapseAt: at("lapse_at"),
    remindAt: at("remind_at"),
    autoReleaseAt: at("auto_release_at"),
    // Set once, by the move that gives the fish back; the conditional UPDATE on it is what makes that happen once.
    stockReturnedAt: at("stock_returned_at"),
    // The farmer's ticks on the quarantine checklist: item id → when ticked (ISO).
    quarantineChecks: text("quarantine_checks", { mode: "json" }).$type<Record<string, string>>().notNull().default(sql`'{}'`),
    // Bumped by every move; a move is written only if nobody moved the row since it was read.
    version: integer("version").notNull().default(0),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [
    index("reservation_farmer_idx").on(t.farmerId, t.requestedAt),
    index("reservation_hatchery_idx").on(t.hatcheryId, t.state, t.requestedAt),
    index("reservation_batch_idx").on(t.batchId),
    index("reservation_lapse_idx").on(t.state, t.lapseAt),
    index("reservation_release_idx").on(t.state, t.autoReleaseAt),
    check("reservation_count_positive", sql`${t.count} > 0`),
    check("reservation_amounts", sql`${t.totalMinor} = ${t.count} * ${t.pricePerFishMinor} AND ${t.depositMinor} > 0 AND ${t.depositMinor} <= ${t.totalMinor}`),
    check("reservation_handed_over_range", sql`${t.handedOverCount} IS NULL OR (${t.handedOverCount} >= 1 AND ${t.handedOverCount} <= ${t.count})`),
    check("reservation_survived_range", sql`${t.survivedCount} IS NULL OR (${t.survivedCount} >= 0 AND ${t.survivedCount} <= ${t.handedOverCount})`),
    check("reservation_not_own_fish", sql`${t.farmerId} <> ${t.hatcheryId}`),
  ],
);

/** One row per move of a reservation (and one for its creation): append-only, shown to both sides. */
export const reservationHistory = sqliteTable(
  "reservation_history",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    reservationId: text("reservation_id")
      .notNull()
      .references(() => reservation.id, { onDelete: "cascade" }),
    fromState: text("from_state", { enum: RESERVATION_STATE_VALUES }),
    toState: text("to_state", { enum: RESERVATION_STATE_VALUES }).notNull(),
    event: text("event", { enum: RESERVATION_HISTORY_EVENTS }).notNull(),
    actorId: text("actor_id").references(() => user.id, { onDelete: "set null" }),
    actorRole: text("actor_role", { enum: RESERVATION_ACTOR_VALUES }).notNull(),
    at: at("at").notNull(),
    detail: text("detail", { mode: "json" }).$type<Record<string, unknown>>(),
  },
  (t) => [index("reservation_history_idx").on(t.reservationId, t.id)],
);

// ---------------------------------------------------------------------------
// Deposit holds and the ledger (shared by reservations and builder jobs)
// ---------------------------------------------------------------------------

/** A queued processor call on a hold: written with the move that needs it, run (and retried) after commit. */
export type HoldPendingOp = {
  /** a hold-machine event with a processor call, or "safekeep": capture the whole authorisation into Shoal's holding */
  event:
    | { type: "release"; amountMinor: number }
    | { type: "refund" }
    | { type: "void" }
    | { type: "resolve"; outcome: "for_farmer" }
    | { type: "resolve"; outcome: "for_provider"; amountMinor: number }
    | { type: "safekeep" };
  actor: HoldActor;
  actorId: string | null;
  idempotencyKey: string;
  queuedAt: string;
};

export const depositHold = sqliteTable(
  "deposit_hold",
  {
    // Our id; also the processor's `reference` metadata, so a webhook can find the hold before we know its id.
    id: text("id").primaryKey(),
    subjectType: text("subject_type", { enum: HOLD_SUBJECT_TYPES }).notNull(),
    subjectId: text("subject_id").notNull(),
    payerId: text("payer_id")
      .notNull()
      .references(() => user.id, { onDelete: "restrict" }),
    payeeId: text("payee_id")
      .notNull()
      .references(() => user.id, { onDelete: "restrict" }),
    currency: text("currency").notNull(),
    amountMinor: integer("amount_minor").notNull(),
    state: text("state", { enum: HOLD_STATE_VALUES }).notNull(),
    heldMinor: integer("held_minor").notNull().default(0),
    releasedMinor: integer("released_minor").notNull().default(0),
    returnedMinor: integer("returned_minor").notNull().default(0),
    processor: text("processor").notNull(),
    processorHoldId: text("processor_hold_id"),
    paymentMethod: text("payment_method").notNull(),
    idempotencyKey: text("idempotency_key").notNull(),
    failureCode: text("failure_code"),
    failureMessage: text("failure_message"),
    authorizedAt: at("authorized_at"),
    // Set when the authorisation was captured into Shoal's holding before the card network could let it lapse.
    capturedAt: at("captured_at"),
    pendingOp: text("pending_op", { mode: "json" }).$type<HoldPendingOp>(),
    version: integer("version").notNull().default(0),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [
    uniqueIndex("deposit_hold_idempotency_idx").on(t.idempotencyKey),
    uniqueIndex("deposit_hold_processor_idx").on(t.processorHoldId),
    // At most one live hold per reservation or job: a second payment cannot start while one is open or held.
    uniqueIndex("deposit_hold_live_subject_idx")
      .on(t.subjectType, t.subjectId)
      .where(sql`state in ('pending', 'held', 'frozen')`),
    index("deposit_hold_subject_idx").on(t.subjectType, t.subjectId),
    check("deposit_hold_amount_positive", sql`${t.amountMinor} > 0`),
    check("deposit_hold_parts", sql`${t.heldMinor} >= 0 AND ${t.releasedMinor} >= 0 AND ${t.returnedMinor} >= 0 AND ${t.heldMinor} + ${t.releasedMinor} + ${t.returnedMinor} IN (0, ${t.amountMinor})`),
    check("deposit_hold_payer_payee", sql`${t.payerId} <> ${t.payeeId}`),
  ],
);

export const holdHistory = sqliteTable(
  "hold_history",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    holdId: text("hold_id")
      .notNull()
      .references(() => depositHold.id, { onDelete: "cascade" }),
    fromState: text("from_state", { enum: HOLD_STATE_VALUES }),
    toState: text("to_state", { enum: HOLD_STATE_VALUES }).notNull(),
    event: text("event", { enum: HOLD_HISTORY_EVENTS }).notNull(),
    actor: text("actor", { enum: HOLD_ACTOR_VALUES }).notNull(),
    actorId: text("actor_id").references(() => user.id, { onDelete: "set null" }),
    at: at("at").notNull(),
    detail: text("detail", { mode: "json" }).$type<Record<string, unknown>>(),
  },
  (t) => [index("hold_history_idx").on(t.holdId, t.id)],
);

/** Double-entry legs (lib/payments/ledger.ts). Append-only; (movement_id, leg) is unique so a replay cannot book twice. */
export const ledgerEntry = sqliteTable(
  "ledger_entry",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    movementId: text("movement_id").notNull(),
    holdId: text("hold_id")
      .notNull()
      .references(() => depositHold.id, { onDelete: "restrict" }),
    movement: text("movement", { enum: LEDGER_MOVEMENT_VALUES }).notNull(),
    leg: integer("leg").notNull(),
    account: text("account", { enum: LEDGER_ACCOUNT_VALUES }).notNull(),
    currency: text("currency").notNull(),
    amountMinor: integer("amount_minor").notNull(),
    createdAt: createdAt(),
  },
  (t) => [
    uniqueIndex("ledger_entry_movement_leg_idx").on(t.movementId, t.leg),
    index("ledger_entry_hold_idx").on(t.holdId),
    check("ledger_entry_amount_nonzero", sql`${t.amountMinor} <> 0`),
    check("ledger_entry_currency_code", sql`length(${t.currency}) = 3 AND ${t.currency} = upper(${t.currency})`),
  ],
);

/** Processor webhook events already handled: a replayed delivery finds its id here and changes nothing. */
export const processedWebhookEvent = sqliteTable("processed_webhook_event", {
  eventId: text("event_id").primaryKey(),
  processor: text("processor").notNull(),
  type: text("type").notNull(),
  holdId: text("hold_id"),
  outcome: text("outcome").notNull(),
  receivedAt: createdAt(),
});

/**
 * Idempotency keys of API calls that take stock or move money: a retried request (same key, same body, same
 * caller) gets the first answer again instead of acting twice. Kept in the database so several app instances agree.
 */
export const apiIdempotencyKey = sqliteTable(
  "api_idempotency_key",
  {
    userId: text("user_id")
      .notNull()
      .references(() => user.id, { onDelete: "cascade" }),
    scope: text("scope").notNull(),
    key: text("key").notNull(),
    requestHash: text("request_hash").notNull(),
    responseStatus: integer("response_status"),
    responseBody: text("response_body", { mode: "json" }).$type<unknown>(),
    createdAt: createdAt(),
    completedAt: at("completed_at"),
  },
  (t) => [primaryKey({ columns: [t.userId, t.scope, t.key] })],
);

/**
 * E-mails decided inside a transaction and sent after it commits (so a rolled-back move never mails anyone,
 * and a mail service that is down only delays the message: the sweep sends what is left).
 */
export const mailOutbox = sqliteTable(
  "mail_outbox",
  {
    id: text("id").primaryKey(),
    subjectType: text("subject_type").notNull(),
    subjectId: text("subject_id").notNull(),
    template: text("template").notNull(),
    // What the message says beyond the reservation itself (a reason, an outcome), fixed when it is queued.
    context: text("context", { mode: "json" }).$type<{ reason?: string | null; outcomeText?: string | null }>(),
    recipientId: text("recipient_id")
      .notNull()
      .references(() => user.id, { onDelete: "cascade" }),
    // One message per (move, template, recipient): a retried move cannot queue it twice.
    dedupeKey: text("dedupe_key").notNull(),
    attempts: integer("attempts").notNull().default(0),
    claimedAt: at("claimed_at"),
    sentAt: at("sent_at"),
    lastError: text("last_error"),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("mail_outbox_dedupe_idx").on(t.dedupeKey), index("mail_outbox_unsent_idx").on(t.sentAt, t.createdAt)],
);

export type ReservationRow = typeof reservation.$inferSelect;
export type DepositHoldRow = typeof depositHold.$inferSelect;
