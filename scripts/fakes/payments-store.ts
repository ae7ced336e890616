// Persisted state of the payments stand-in: one JSON file rewritten atomically after every change,
// so a restart (or a crash mid-write) keeps every intent, charge, refund, event and idempotency record.
import { randomBytes } from "node:crypto";
import { readFileSync } from "node:fs";
import type Stripe from "stripe";
import { writeFileAtomic } from "./http-helpers";

export type FakeEventType =
  | "payment_intent.amount_capturable_updated"
  | "payment_intent.succeeded"
  | "payment_intent.canceled"
  | "payment_intent.payment_failed"
  | "charge.refunded";

/** A Stripe event as delivered (the EventBase shape of stripe 23.1.0's types). */
export interface FakeEvent extends Omit<Stripe.EventBase, "data" | "type"> {
  type: FakeEventType;
  data: {
    object: Stripe.PaymentIntent | Stripe.Charge;
    previous_attributes?: Record<string, unknown>;
  };
}

export interface DeliveryRecord {
  attempts: number;
  delivered: boolean;
  lastStatus: number | null;
  lastError: string | null;
  lastAttemptAt: string | null;
}

export interface EventRecord {
  event: FakeEvent;
  /** The payment intent the event concerns, kept for filtering in GET /_fake/events. */
  paymentIntent: string;
  delivery: DeliveryRecord;
}

export interface IdempotencyRecord {
  method: string;
  path: string;
  paramsHash: string;
  status: number;
  body: string;
  createdAtMs: number;
}

export interface PaymentsState {
  version: 1;
  intents: Record<string, Stripe.PaymentIntent>;
  charges: Record<string, Stripe.Charge>;
  refunds: Record<string, Stripe.Refund>;
  events: EventRecord[];
  idempotency: Record<string, IdempotencyRecord>;
}

export function emptyState(): PaymentsState {
  return { version: 1, intents: {}, charges: {}, refunds: {}, events: [], idempotency: {} };
}

export function loadState(path: string): PaymentsState {
  let text: string;
  try {
    text = readFileSync(path, "utf8");
  } catch (err) {
    if ((err as NodeJS.ErrnoException).code === "ENOENT") return emptyState();
    throw err;
  }
  const parsed = JSON.parse(text) as PaymentsState;
  if (parsed.version !== 1) throw new Error(`unsupported payments state version in ${path}`);
  return parsed;
}

export function saveState(path: string, state: PaymentsState): void {
  writeFileAtomic(path, JSON.stringify(state));
}

const BASE62 = "0123456789ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz";

/** Stripe-style object id: a type prefix, an underscore and 24 base-62 characters. */
export function newId(prefix: string, length = 24): string {
  const bytes = randomBytes(length);
  let out = "";
  // 256 is not a multiple of 62, so this is very slightly biased; ids only need to be unique.
  for (const byte of bytes) out += BASE62[byte % 62];
  return `${prefix}_${out}`;
}

/** Deep copy for snapshots (event payloads must not change when the live object later does). */
export function snapshot<T>(value: T): T {
  return structuredClone(value);
}
