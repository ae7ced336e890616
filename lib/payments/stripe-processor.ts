import "server-only";
// PaymentProcessor over the official `stripe` SDK. A hold is a PaymentIntent with capture_method=manual:
// authorise = held, capture = released, cancel = returned, refund after capture. The SDK is pointed at
// `apiBase`, so the same code talks to api.stripe.com or to the local stand-in (scripts/fakes/payments-server.ts).
import Stripe from "stripe";
import {
  PaymentError,
  type CancelHoldInput,
  type Hold,
  type HoldDepositInput,
  type HoldDepositResult,
  type HoldFailure,
  type HoldStatus,
  type PaymentEvent,
  type PaymentProcessor,
  type RefundInput,
  type RefundResult,
  type ReleaseInput,
} from "./processor";

export interface StripeProcessorOptions {
  secretKey: string;
  /** e.g. https://api.stripe.com or http://127.0.0.1:4620; only protocol, host and port are used */
  apiBase: string;
  webhookSecret: string;
  /** the SDK retries connection errors, 409s and 5xx with the same idempotency key; default 2 */
  maxNetworkRetries?: number;
  timeoutMs?: number;
  /** oldest signature timestamp accepted, in seconds; the SDK's default is 300 */
  webhookToleranceSec?: number;
}

// Stripe allows idempotency keys of up to 255 characters (docs.stripe.com/api/idempotent_requests);
// we prepend the verb, so the caller's part must leave room for it.
const IDEMPOTENCY_KEY_MAX = 240;
// "The amount value supports up to eight digits" (PaymentIntentCreateParams.amount in stripe 23.1.0's types).
const MAX_AMOUNT_MINOR = 99_999_999;
// The API wants the expanded charge so a hold can report what was refunded.
const EXPAND = ["latest_charge"];

type IntentLike = Stripe.PaymentIntent;

function stripeConfigFromBase(apiBase: string): { host: string; port: string; protocol: "http" | "https" } {
  let url: URL;
  try {
    url = new URL(apiBase);
  } catch (err) {
    throw new PaymentError("invalid_request", `apiBase is not a URL: ${apiBase}`, { cause: err });
  }
  const protocol = url.protocol === "http:" ? "http" : url.protocol === "https:" ? "https" : null;
  if (protocol === null) throw new PaymentError("invalid_request", `apiBase must be http or https: ${apiBase}`);
  if (url.pathname !== "/" && url.pathname !== "") {
    // The SDK always requests /v1/...; a base path would be silently dropped.
    throw new PaymentError("invalid_request", `apiBase must not have a path: ${apiBase}`);
  }
  return { host: url.hostname, port: url.port || (protocol === "https" ? "443" : "80"), protocol };
}

function requireKey(key: string): void {
  if (key.length === 0 || key.length > IDEMPOTENCY_KEY_MAX) {
    throw new PaymentError("invalid_request", `idempotencyKey must be 1–${IDEMPOTENCY_KEY_MAX} characters`);
  }
}

function requireAmount(amount: number, name: string): void {
  if (!Number.isSafeInteger(amount) || amount < 1 || amount > MAX_AMOUNT_MINOR) {
    throw new PaymentError("invalid_request", `${name} must be an integer from 1 to ${MAX_AMOUNT_MINOR} minor units`);
  }
}

function chargeOf(intent: IntentLike): Stripe.Charge | null {
  return intent.latest_charge !== null && typeof intent.latest_charge === "object" ? intent.latest_charge : null;
}

function failureOf(intent: IntentLike): HoldFailure | null {
  const error = intent.last_payment_error;
  if (error === null) return null;
  return { code: error.decline_code ?? error.code ?? "card_error", message: error.message ?? "The payment was declined." };
}

function statusOf(intent: IntentLike, refundedMinor: number): HoldStatus {
  switch (intent.status) {
    case "requires_capture":
      return "held";
    case "succeeded":
      return intent.amount_received > 0 && refundedMinor >= intent.amount_received ? "refunded" : "released";
    case "canceled":
      return "canceled";
    case "requires_payment_method":
      return intent.last_payment_error === null ? "pending" : "failed";
    default:
      return "pending";
  }
}

/** The app-level hold for a PaymentIntent (its charge expanded when known). */
export function holdFromIntent(intent: IntentLike): Hold {
  const refundedMinor = chargeOf(intent)?.amount_refunded ?? 0;
  return {
    holdId: intent.id,
    reference: intent.metadata.reference ?? null,
    status: statusOf(intent, refundedMinor),
    currency: intent.currency.toUpperCase(),
    amountMinor: intent.amount,
    heldMinor: intent.amount_capturable,
    releasedMinor: intent.amount_received,
    refundedMinor,
    failure: failureOf(intent),
  };
}

function toPaymentError(err: unknown): PaymentError {
  if (err instanceof PaymentError) return err;
  const errors = Stripe.errors;
  if (err instanceof errors.StripeIdempotencyError) return new PaymentError("idempotency_conflict", err.message, { cause: err });
  if (err instanceof errors.StripeSignatureVerificationError) return new PaymentError("invalid_signature", err.message, { cause: err });
  if (err instanceof errors.StripeInvalidRequestError) {
    if (err.code === "resource_missing") return new PaymentError("not_found", err.message, { cause: err });
    if (err.code === "payment_intent_unexpected_state" || err.code === "charge_already_refunded") {
      return new PaymentError("invalid_state", err.message, { cause: err });
    }
    return new PaymentError("invalid_request", err.message, { cause: err });
  }
  if (err instanceof errors.StripeAuthenticationError || err instanceof errors.StripePermissionError) {
    return new PaymentError("authentication", err.message, { cause: err });
  }
  if (
    err instanceof errors.StripeConnectionError ||
    err instanceof errors.StripeAPIError ||
    err instanceof errors.StripeRateLimitError
  ) {
    return new PaymentError("unavailable", err.message, { cause: err });
  }
  return new PaymentError("unavailable", err instanceof Error ? err.message : String(err), { cause: err });
}

export class StripePaymentProcessor implements PaymentProcessor {
  readonly name = "stripe";
  private readonly stripe: Stripe;

  constructor(private readonly options: StripeProcessorOptions) {
    if (options.secretKey === "") throw new PaymentError("invalid_request", "secretKey is empty");
    if (options.webhookSecret === "") throw new PaymentError("invalid_request", "webhookSecret is empty");
    this.stripe = new Stripe(options.secretKey, {
      ...stripeConfigFromBase(options.apiBase),
      maxNetworkRetries: options.maxNetworkRetries ?? 2,
      timeout: options.timeoutMs ?? 20_000,
      telemetry: false,
      appInfo: { name: "shoal" },
    });
  }

  async holdDeposit(input: HoldDepositInput): Promise<HoldDepositResult> {
    requireAmount(input.amountMinor, "amountMinor");
    requireKey(input.idempotencyKey);
    if (!/^[A-Za-z]{3}$/.test(input.currency)) throw new PaymentError("invalid_request", `not an ISO 4217 code: ${input.currency}`);
    try {
      const intent = await this.stripe.paymentIntents.create(
        {
          amount: input.amountMinor,
          // Stripe takes ISO 4217 codes in lower case.
          currency: input.currency.toLowerCase(),
          capture_method: "manual",
          confirm: true,
          payment_method: input.paymentMethod,
          // Card only: a server-side confirm cannot follow a redirect-based method.
          allowed_payment_method_types: ["card"],
          metadata: { reference: input.reference },
          ...(input.description === undefined ? {} : { description: input.description }),
          expand: EXPAND,
        },
        { idempotencyKey: `hold:${input.idempotencyKey}` },
      );
      return { ok: true, hold: holdFromIntent(intent) };
    } catch (err) {
      if (err instanceof Stripe.errors.StripeCardError) {
        return {
          ok: false,
          reason: "declined",
          declineCode: err.decline_code ?? err.code ?? null,
          message: err.message,
          hold: err.payment_intent === undefined ? null : holdFromIntent(err.payment_intent),
        };
      }
      throw toPaymentError(err);
    }
  }

  async release(input: ReleaseInput): Promise<Hold> {
    requireKey(input.idempotencyKey);
    if (input.amountMinor !== undefined) requireAmount(input.amountMinor, "amountMinor");
    try {
      const intent = await this.stripe.paymentIntents.capture(
        input.holdId,
        { ...(input.amountMinor === undefined ? {} : { amount_to_capture: input.amountMinor }), expand: EXPAND },
        { idempotencyKey: `release:${input.idempotencyKey}` },
      );
      return holdFromIntent(intent);
    } catch (err) {
      throw toPaymentError(err);
    }
  }

  async cancelHold(input: CancelHoldInput): Promise<Hold> {
    requireKey(input.idempotencyKey);
    try {
      const intent = await this.stripe.paymentIntents.cancel(
        input.holdId,
        { ...(input.reason === undefined ? {} : { cancellation_reason: input.reason }), expand: EXPAND },
        { idempotencyKey: `cancel:${input.idempotencyKey}` },
      );
      return holdFromIntent(intent);
    } catch (err) {
      throw toPaymentError(err);
    }
  }

  async refund(input: RefundInput): Promise<RefundResult> {
    requireKey(input.idempotencyKey);
    if (input.amountMinor !== undefined) requireAmount(input.amountMinor, "amountMinor");
    try {
      const refund = await this.stripe.refunds.create(
        {
          payment_intent: input.holdId,
          ...(input.amountMinor === undefined ? {} : { amount: input.amountMinor }),
          ...(input.reason === undefined ? {} : { reason: input.reason }),
        },
        { idempotencyKey: `refund:${input.idempotencyKey}` },
      );
      const hold = await this.retrieve(input.holdId);
      return { refundId: refund.id, amountMinor: refund.amount, currency: refund.currency.toUpperCase(), hold };
    } catch (err) {
      throw toPaymentError(err);
    }
  }

  async retrieve(holdId: string): Promise<Hold> {
    try {
      return holdFromIntent(await this.stripe.paymentIntents.retrieve(holdId, { expand: EXPAND }));
    } catch (err) {
      throw toPaymentError(err);
    }
  }

  async parseWebhook(rawBody: string | Uint8Array, signatureHeader: string | null | undefined): Promise<PaymentEvent> {
    if (signatureHeader === null || signatureHeader === undefined || signatureHeader === "") {
      throw new PaymentError("invalid_signature", "missing Stripe-Signature header");
    }
    let event: Stripe.Event;
    try {
      // Verifies HMAC-SHA256 over `${t}.${rawBody}` and the timestamp tolerance (SDK Webhooks.js).
      event = this.stripe.webhooks.constructEvent(rawBody, signatureHeader, this.options.webhookSecret, this.options.webhookToleranceSec);
    } catch (err) {
      if (err instanceof Stripe.errors.StripeSignatureVerificationError) {
        throw new PaymentError("invalid_signature", err.message, { cause: err });
      }
      // A body that verifies but does not parse is not something Stripe sends: refuse it the same way.
      throw new PaymentError("invalid_signature", err instanceof Error ? err.message : String(err), { cause: err });
    }
    const occurredAt = new Date(event.created * 1000);
    const base = (intent: IntentLike) => ({
      eventId: event.id,
      holdId: intent.id,
      reference: intent.metadata.reference ?? null,
      currency: intent.currency.toUpperCase(),
      occurredAt,
    });
    switch (event.type) {
      case "payment_intent.amount_capturable_updated":
        return { type: "hold.authorized", ...base(event.data.object), heldMinor: event.data.object.amount_capturable };
      case "payment_intent.succeeded":
        return { type: "hold.released", ...base(event.data.object), releasedMinor: event.data.object.amount_received };
      case "payment_intent.canceled":
        return { type: "hold.canceled", ...base(event.data.object) };
      case "payment_intent.payment_failed":
        return { type: "hold.failed", ...base(event.data.object), failure: failureOf(event.data.object) };
      case "charge.refunded": {
        const charge = event.data.object;
        const intentId = typeof charge.payment_intent === "string" ? charge.payment_intent : charge.payment_intent?.id;
        // Releasing an uncaptured authorisation can surface as a refund of the charge; that is a cancel, not a refund.
        if (intentId === undefined || !charge.captured) return { type: "ignored", eventId: event.id, processorType: event.type };
        return {
          type: "hold.refunded",
          eventId: event.id,
          holdId: intentId,
          reference: charge.metadata.reference ?? null,
          currency: charge.currency.toUpperCase(),
          occurredAt,
          refundedMinor: charge.amount_refunded,
          releasedMinor: charge.amount_captured,
        };
      }
      default:
        return { type: "ignored", eventId: event.id, processorType: event.type };
    }
  }
}
