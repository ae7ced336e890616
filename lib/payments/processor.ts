// The app's view of a payment processor: a deposit is *held* (authorised, not yet paid out), later
// *released* to the provider (captured), *returned* before release (hold cancelled) or *refunded* after.
// Card processors (Stripe) and, later, mobile-money processors implement this; callers never see an SDK.
//
// Money is an integer count of the currency's minor unit (ISO 4217 exponent, e.g. cents for USD, whole
// shillings for UGX) with an upper-case ISO 4217 code.

export type HoldStatus =
  /** created or awaiting the payer's action; nothing authorised yet */
  | "pending"
  /** authorised and held; can be released or returned */
  | "held"
  /** captured: the money is (or will be) paid out; partial refunds keep this status */
  | "released"
  /** released, then refunded in full */
  | "refunded"
  /** the hold was returned before release */
  | "canceled"
  /** the last authorisation attempt was declined */
  | "failed";

export interface HoldFailure {
  /** processor decline code, e.g. `insufficient_funds` */
  code: string;
  message: string;
}

export interface Hold {
  holdId: string;
  /** the app's own reference (e.g. the reservation id) given when the hold was made */
  reference: string | null;
  status: HoldStatus;
  currency: string;
  /** amount asked for when holding */
  amountMinor: number;
  /** still authorised and releasable */
  heldMinor: number;
  /** captured for the provider */
  releasedMinor: number;
  /** refunded to the payer after release */
  refundedMinor: number;
  failure: HoldFailure | null;
}

export interface HoldDepositInput {
  amountMinor: number;
  currency: string;
  reference: string;
  /** the same key for a retried call; a different call must use a different key */
  idempotencyKey: string;
  /** processor token for the payer's instrument (a card PaymentMethod id for Stripe) */
  paymentMethod: string;
  description?: string;
}

export type HoldDepositResult =
  | { ok: true; hold: Hold }
  | { ok: false; reason: "declined"; declineCode: string | null; message: string; hold: Hold | null };

export interface ReleaseInput {
  holdId: string;
  /** release less than held; the rest goes back to the payer */
  amountMinor?: number;
  idempotencyKey: string;
}

export interface CancelHoldInput {
  holdId: string;
  idempotencyKey: string;
  reason?: "requested_by_customer" | "abandoned" | "duplicate" | "fraudulent";
}

export interface RefundInput {
  holdId: string;
  /** refund part of what was released; all that is left when omitted */
  amountMinor?: number;
  idempotencyKey: string;
  reason?: "requested_by_customer" | "duplicate" | "fraudulent";
}

export interface RefundResult {
  refundId: string;
  amountMinor: number;
  currency: string;
  hold: Hold;
}

interface PaymentEventBase {
  /** the processor's event id: store it to ignore a replayed delivery */
  eventId: string;
  holdId: string;
  reference: string | null;
  currency: string;
  occurredAt: Date;
}

export type PaymentEvent =
  | (PaymentEventBase & { type: "hold.authorized"; heldMinor: number })
  | (PaymentEventBase & { type: "hold.released"; releasedMinor: number })
  | (PaymentEventBase & { type: "hold.canceled" })
  | (PaymentEventBase & { type: "hold.failed"; failure: HoldFailure | null })
  | (PaymentEventBase & { type: "hold.refunded"; refundedMinor: number; releasedMinor: number })
  /** a correctly signed event the app has no use for; acknowledge it and move on */
  | { type: "ignored"; eventId: string; processorType: string };

export type PaymentErrorCode =
  /** the move is not allowed from the hold's current state (e.g. release after cancel) */
  | "invalid_state"
  | "not_found"
  /** an idempotency key was reused for a different call */
  | "idempotency_conflict"
  | "invalid_request"
  | "authentication"
  /** a webhook whose signature, timestamp or body does not verify */
  | "invalid_signature"
  /** the processor could not be reached or failed; safe to retry with the same idempotency key */
  | "unavailable";

export class PaymentError extends Error {
  constructor(
    readonly code: PaymentErrorCode,
    message: string,
    options?: { cause?: unknown },
  ) {
    super(message, options);
    this.name = "PaymentError";
  }
}

export interface PaymentProcessor {
  readonly name: string;
  holdDeposit(input: HoldDepositInput): Promise<HoldDepositResult>;
  release(input: ReleaseInput): Promise<Hold>;
  cancelHold(input: CancelHoldInput): Promise<Hold>;
  refund(input: RefundInput): Promise<RefundResult>;
  retrieve(holdId: string): Promise<Hold>;
  /** Verifies and decodes a webhook delivery; throws PaymentError("invalid_signature") when it does not verify. */
  parseWebhook(rawBody: string | Uint8Array, signatureHeader: string | null | undefined): Promise<PaymentEvent>;
}
