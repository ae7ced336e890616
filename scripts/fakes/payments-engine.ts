// The payment-intent life cycle of the stand-in: create → confirm → capture / cancel → refund, with
// Stripe's state rules, object shapes (stripe 23.1.0 types) and the events each change emits.
// Every method works on the in-memory state synchronously; the server persists and delivers events.
import type Stripe from "stripe";
import type { FormObject } from "./stripe-form";
import {
  StripeApiError,
  invalidParam,
  mergeMetadata,
  optionalBoolean,
  optionalEnum,
  optionalInteger,
  optionalString,
  rejectUnknown,
  requiredInteger,
  requiredString,
  stringList,
} from "./stripe-params";
import {
  newId,
  snapshot,
  type EventRecord,
  type FakeEvent,
  type FakeEventType,
  type PaymentsState,
} from "./payments-store";

export interface RequestContext {
  requestId: string;
  idempotencyKey: string | null;
  apiVersion: string | null;
}

export interface EngineResult {
  status: number;
  body: unknown;
  events: EventRecord[];
}

// Stripe's test payment methods (docs.stripe.com/testing): these ids work in every test-mode account.
type TestCardOutcome =
  | { ok: true; brand: string; last4: string }
  | { ok: false; brand: string; last4: string; declineCode: string; message: string };
const TEST_PAYMENT_METHODS: Record<string, TestCardOutcome> = {
  pm_card_visa: { ok: true, brand: "visa", last4: "4242" },
  pm_card_visa_debit: { ok: true, brand: "visa", last4: "5556" },
  pm_card_mastercard: { ok: true, brand: "mastercard", last4: "4444" },
  pm_card_chargeDeclined: {
    ok: false,
    brand: "visa",
    last4: "0002",
    declineCode: "generic_decline",
    message: "Your card was declined.",
  },
  pm_card_chargeDeclinedInsufficientFunds: {
    ok: false,
    brand: "visa",
    last4: "9995",
    declineCode: "insufficient_funds",
    message: "Your card has insufficient funds.",
  },
};

// "The amount value supports up to eight digits" (PaymentIntentCreateParams.amount, stripe 23.1.0 types).
const MAX_AMOUNT = 99_999_999;
// ISO 4217 codes as the runtime's ICU data knows them; Stripe wants them lower-case.
const ISO_4217 = new Set(Intl.supportedValuesOf("currency").map((code) => code.toLowerCase()));

const CANCELABLE: readonly Stripe.PaymentIntent.Status[] = [
  "requires_payment_method",
  "requires_capture",
  "requires_confirmation",
  "requires_action",
  "processing",
];
const CONFIRMABLE: readonly Stripe.PaymentIntent.Status[] = ["requires_payment_method", "requires_confirmation"];

const CREATE_PARAMS = [
  "amount",
  "currency",
  "capture_method",
  "confirm",
  "payment_method",
  "allowed_payment_method_types",
  "metadata",
  "description",
  "receipt_email",
  "statement_descriptor",
  "statement_descriptor_suffix",
  "expand",
  "return_url",
  "error_on_requires_action",
  "off_session",
] as const;
const CONFIRM_PARAMS = ["payment_method", "expand", "return_url", "error_on_requires_action", "off_session", "receipt_email"] as const;
const CAPTURE_PARAMS = ["amount_to_capture", "metadata", "expand", "final_capture", "statement_descriptor"] as const;
const CANCEL_PARAMS = ["cancellation_reason", "expand"] as const;
const REFUND_PARAMS = ["payment_intent", "charge", "amount", "reason", "metadata", "expand"] as const;

function nowSeconds(): number {
  return Math.floor(Date.now() / 1000);
}

function unexpectedState(message: string, intent: Stripe.PaymentIntent): StripeApiError {
  // Refusals by state are raised after the endpoint began executing, so Stripe keeps them for replay.
  return new StripeApiError(400, {
    type: "invalid_request_error",
    code: "payment_intent_unexpected_state",
    message,
    doc_url: "https://stripe.com/docs/error-codes/payment-intent-unexpected-state",
    payment_intent: snapshot(intent),
  });
}

function noSuch(kind: string, id: string, param: string, status = 404): StripeApiError {
  return new StripeApiError(status, {
    type: "invalid_request_error",
    code: "resource_missing",
    message: `No such ${kind}: '${id}'`,
    param,
    doc_url: "https://stripe.com/docs/error-codes/resource-missing",
  });
}

export class PaymentsEngine {
  constructor(
    private readonly state: PaymentsState,
    private readonly webhookEnabled: boolean,
  ) {}

  // ---- reads ---------------------------------------------------------------------------------

  retrieveIntent(id: string, expand: string[]): unknown {
    return this.renderIntent(this.intent(id, "intent"), expand);
  }

  retrieveCharge(id: string): Stripe.Charge {
    const charge = this.state.charges[id];
    if (charge === undefined) throw noSuch("charge", id, "charge");
    return charge;
  }

  retrieveRefund(id: string): Stripe.Refund {
    const refund = this.state.refunds[id];
    if (refund === undefined) throw noSuch("refund", id, "refund");
    return refund;
  }

  // ---- payment intents -----------------------------------------------------------------------

  createIntent(params: FormObject, ctx: RequestContext): EngineResult {
    rejectUnknown(params, CREATE_PARAMS);
    const amount = requiredInteger(params, "amount");
    if (amount < 1) throw invalidParam("Amount must be at least 1.", "amount", "amount_too_small");
    if (amount > MAX_AMOUNT) throw invalidParam(`Amount must be no more than ${MAX_AMOUNT}.`, "amount", "amount_too_large");
    const currency = requiredString(params, "currency").toLowerCase();
    if (!ISO_4217.has(currency)) throw invalidParam(`Invalid currency: ${currency}.`, "currency", "invalid_currency");
    const captureMethod = optionalEnum(params, "capture_method", ["automatic", "automatic_async", "manual"] as const) ?? "automatic_async";
    const confirm = optionalBoolean(params, "confirm") ?? false;
    const paymentMethod = optionalString(params, "payment_method") ?? null;
    if (paymentMethod !== null) this.requireKnownPaymentMethod(paymentMethod);
    // API version 2026-10-28 names the list `allowed_payment_method_types` (PaymentIntentCreateParams in stripe 23.1.0).
    const types = stringList(params, "allowed_payment_method_types");
    const metadata = mergeMetadata({}, params);
    const expand = stringList(params, "expand");
    optionalBoolean(params, "error_on_requires_action");
    optionalBoolean(params, "off_session");

    const id = newId("pi");
    const intent: Stripe.PaymentIntent = {
      id,
      object: "payment_intent",
      allowed_payment_method_types: types.length > 0 ? (types as Stripe.PaymentIntent.AllowedPaymentMethodType[]) : null,
      amount,
      amount_capturable: 0,
      amount_received: 0,
      application: null,
      application_fee_amount: null,
      automatic_payment_methods: null,
      canceled_at: null,
      cancellation_reason: null,
      capture_method: captureMethod,
      client_secret: `${id}_secret_${newId("s").slice(2)}`,
      confirmation_method: "automatic",
      created: nowSeconds(),
      currency,
      customer: null,
      customer_account: null,
      description: optionalString(params, "description") ?? null,
      excluded_payment_method_types: null,
      last_payment_error: null,
      latest_charge: null,
      livemode: false,
      managed_payments: null,
      metadata,
      next_action: null,
      on_behalf_of: null,
      payment_method: paymentMethod,
      payment_method_configuration_details: null,
      payment_method_options: null,
      payment_method_types: types.length > 0 ? types : ["card"],
      payment_record: null,
      processing: null,
      receipt_email: optionalString(params, "receipt_email") ?? null,
      review: null,
      setup_future_usage: null,
      shipping: null,
      source: null,
      statement_descriptor: optionalString(params, "statement_descriptor") ?? null,
      statement_descriptor_suffix: optionalString(params, "statement_descriptor_suffix") ?? null,
      status: paymentMethod === null ? "requires_payment_method" : "requires_confirmation",
      transfer_group: null,
    };
    if (confirm && paymentMethod === null) {
      throw invalidParam(
        "You cannot confirm this PaymentIntent because it's missing a payment method. Pass `payment_method`.",
        "payment_method",
        "parameter_missing",
      );
    }
    this.state.intents[id] = intent;
    if (!confirm) return { status: 200, body: this.renderIntent(intent, expand), events: [] };
    return this.attempt(intent, ctx, expand);
  }

  confirmIntent(id: string, params: FormObject, ctx: RequestContext): EngineResult {
    rejectUnknown(params, CONFIRM_PARAMS);
    const intent = this.intent(id, "intent");
    const paymentMethod = optionalString(params, "payment_method");
    const expand = stringList(params, "expand");
    if (paymentMethod !== undefined) this.requireKnownPaymentMethod(paymentMethod);
    if (!CONFIRMABLE.includes(intent.status)) {
      throw unexpectedState(
        `You cannot confirm this PaymentIntent because it has a status of ${intent.status}. Only a PaymentIntent with one of the following statuses may be confirmed: ${CONFIRMABLE.join(", ")}.`,
        intent,
      );
    }
    if (paymentMethod !== undefined) intent.payment_method = paymentMethod;
    if (intent.payment_method === null) {
      throw invalidParam(
        "You cannot confirm this PaymentIntent because it's missing a payment method. Pass `payment_method`.",
        "payment_method",
        "parameter_missing",
      );
    }
    return this.attempt(intent, ctx, expand);
  }

  captureIntent(id: string, params: FormObject, ctx: RequestContext): EngineResult {
    rejectUnknown(params, CAPTURE_PARAMS);
    const intent = this.intent(id, "intent");
    const requested = optionalInteger(params, "amount_to_capture");
    const expand = stringList(params, "expand");
    optionalBoolean(params, "final_capture");
    if (intent.status !== "requires_capture") {
      throw unexpectedState(
        `This PaymentIntent could not be captured because it has a status of ${intent.status}. Only a PaymentIntent with one of the following statuses may be captured: requires_capture.`,
        intent,
      );
    }
    const amount = requested ?? intent.amount_capturable;
    if (amount < 1) throw invalidParam("The amount to capture must be at least 1.", "amount_to_capture", "amount_too_small");
    if (amount > intent.amount_capturable) {
      throw invalidParam(
        `The amount to capture (${amount}) is greater than the amount capturable (${intent.amount_capturable}) on this PaymentIntent.`,
        "amount_to_capture",
        "amount_too_large",
      );
    }
    const charge = this.latestCharge(intent);
    const previous = { status: intent.status, amount_capturable: intent.amount_capturable, amount_received: intent.amount_received };
    intent.metadata = mergeMetadata(intent.metadata, params);
    intent.status = "succeeded";
    intent.amount_capturable = 0;
    intent.amount_received = amount;
    // Simplification: the uncaptured remainder of a partial capture is simply released; it is not
    // reported in charge.amount_refunded, which here counts only refunds made through /v1/refunds.
    charge.captured = true;
    charge.amount_captured = amount;
    charge.metadata = { ...intent.metadata };
    const event = this.emit("payment_intent.succeeded", intent, previous, ctx, intent.id);
    return { status: 200, body: this.renderIntent(intent, expand), events: [event] };
  }

  cancelIntent(id: string, params: FormObject, ctx: RequestContext): EngineResult {
    rejectUnknown(params, CANCEL_PARAMS);
    const intent = this.intent(id, "intent");
    const reason = optionalEnum(params, "cancellation_reason", ["abandoned", "duplicate", "fraudulent", "requested_by_customer"] as const);
    const expand = stringList(params, "expand");
    if (!CANCELABLE.includes(intent.status)) {
      throw unexpectedState(
        `You cannot cancel this PaymentIntent because it has a status of ${intent.status}. Only a PaymentIntent with one of the following statuses may be canceled: ${CANCELABLE.join(", ")}.`,
        intent,
      );
    }
    const previous = { status: intent.status, amount_capturable: intent.amount_capturable, canceled_at: null, cancellation_reason: null };
    intent.status = "canceled";
    intent.amount_capturable = 0;
    intent.canceled_at = nowSeconds();
    intent.cancellation_reason = reason ?? null;
    const event = this.emit("payment_intent.canceled", intent, previous, ctx, intent.id);
    return { status: 200, body: this.renderIntent(intent, expand), events: [event] };
  }

  // ---- refunds -------------------------------------------------------------------------------

  createRefund(params: FormObject, ctx: RequestContext): EngineResult {
    rejectUnknown(params, REFUND_PARAMS);
    const intentId = optionalString(params, "payment_intent");
    const chargeId = optionalString(params, "charge");
    const requested = optionalInteger(params, "amount");
    const reason = optionalEnum(params, "reason", ["duplicate", "fraudulent", "requested_by_customer"] as const);
    const metadata = mergeMetadata({}, params);
    if (intentId === undefined && chargeId === undefined) {
      throw invalidParam("One of the following params should be provided for this request: payment_intent or charge.", "payment_intent", "parameter_missing");
    }
    let intent: Stripe.PaymentIntent;
    if (intentId !== undefined) {
      // A missing object named in a parameter is a 400, not a 404 (the URL itself exists).
      intent = this.intent(intentId, "payment_intent", 400);
    } else {
      const charge = this.state.charges[chargeId ?? ""];
      if (charge === undefined) throw noSuch("charge", chargeId ?? "", "charge", 400);
      intent = this.intent(typeof charge.payment_intent === "string" ? charge.payment_intent : "", "charge", 400);
    }
    if (intent.status !== "succeeded") {
      throw unexpectedState(
        `This PaymentIntent (${intent.id}) does not have a successful charge to refund; its status is ${intent.status}.`,
        intent,
      );
    }
    const charge = this.latestCharge(intent);
    const refundable = charge.amount_captured - charge.amount_refunded;
    if (refundable <= 0) {
      throw new StripeApiError(400, {
        type: "invalid_request_error",
        code: "charge_already_refunded",
        message: `Charge ${charge.id} has already been refunded.`,
        charge: charge.id,
        doc_url: "https://stripe.com/docs/error-codes/charge-already-refunded",
      });
    }
    const amount = requested ?? refundable;
    if (amount < 1) throw invalidParam("Refund amount must be at least 1.", "amount", "amount_too_small");
    if (amount > refundable) {
      throw invalidParam(
        `Refund amount (${amount}) is greater than unrefunded amount on charge (${refundable})`,
        "amount",
        "amount_too_large",
      );
    }
    const refund: Stripe.Refund = {
      id: newId("re"),
      object: "refund",
      amount,
      balance_transaction: null,
      charge: charge.id,
      created: nowSeconds(),
      currency: charge.currency,
      customer: null,
      customer_account: null,
      metadata,
      payment_intent: intent.id,
      payment_method: intent.payment_method === null || typeof intent.payment_method === "string" ? intent.payment_method : intent.payment_method.id,
      reason: reason ?? null,
      receipt_number: null,
      source_transfer_reversal: null,
      status: "succeeded",
      transfer_reversal: null,
    };
    this.state.refunds[refund.id] = refund;
    const previous = { amount_refunded: charge.amount_refunded, refunded: charge.refunded };
    charge.amount_refunded += amount;
    charge.refunded = charge.amount_refunded >= charge.amount_captured;
    const refunds = Object.values(this.state.refunds).filter((item) => item.charge === charge.id);
    charge.refunds = { object: "list", data: refunds.reverse(), has_more: false, url: `/v1/charges/${charge.id}/refunds` };
    const event = this.emit("charge.refunded", charge, previous, ctx, intent.id);
    return { status: 200, body: refund, events: [event] };
  }

  // ---- internals -----------------------------------------------------------------------------

  private intent(id: string, param: string, status = 404): Stripe.PaymentIntent {
    const intent = this.state.intents[id];
    if (intent === undefined) throw noSuch("payment_intent", id, param, status);
    return intent;
  }

  private latestCharge(intent: Stripe.PaymentIntent): Stripe.Charge {
    const id = typeof intent.latest_charge === "string" ? intent.latest_charge : intent.latest_charge?.id;
    const charge = id === undefined ? undefined : this.state.charges[id];
    if (charge === undefined) throw new Error(`payment intent ${intent.id} has no charge record`);
    return charge;
  }

  private requireKnownPaymentMethod(id: string): void {
    if (TEST_PAYMENT_METHODS[id] === undefined) {
      throw new StripeApiError(
        400,
        {
          type: "invalid_request_error",
          code: "resource_missing",
          message: `No such PaymentMethod: '${id}'; this stand-in knows ${Object.keys(TEST_PAYMENT_METHODS).join(", ")}`,
          param: "payment_method",
        },
        true,
      );
    }
  }

  /** One authorisation attempt with the intent's payment method: a charge that succeeds or is declined. */
  private attempt(intent: Stripe.PaymentIntent, ctx: RequestContext, expand: string[]): EngineResult {
    const paymentMethod = typeof intent.payment_method === "string" ? intent.payment_method : (intent.payment_method?.id ?? "");
    const outcome = TEST_PAYMENT_METHODS[paymentMethod];
    if (outcome === undefined) throw new Error(`unknown payment method ${paymentMethod} passed validation`);
    const charge = this.newCharge(intent, paymentMethod, outcome);
    this.state.charges[charge.id] = charge;
    intent.latest_charge = charge.id;
    const previousStatus = intent.status;

    if (!outcome.ok) {
      const error: Stripe.PaymentIntent.LastPaymentError = {
        type: "card_error",
        charge: charge.id,
        code: "card_declined",
        decline_code: outcome.declineCode,
        doc_url: "https://stripe.com/docs/error-codes/card-declined",
        message: outcome.message,
      };
      intent.status = "requires_payment_method";
      intent.last_payment_error = error;
      // After a failed attempt the intent wants a new payment method (docs.stripe.com/payments/paymentintents/lifecycle).
      intent.payment_method = null;
      const event = this.emit("payment_intent.payment_failed", intent, { status: previousStatus, last_payment_error: null }, ctx, intent.id);
      return {
        status: 402,
        body: {
          error: {
            type: "card_error",
            code: "card_declined",
            decline_code: outcome.declineCode,
            message: outcome.message,
            charge: charge.id,
            doc_url: "https://stripe.com/docs/error-codes/card-declined",
            payment_intent: snapshot(intent),
            request_log_url: `https://dashboard.stripe.com/test/logs/${ctx.requestId}`,
          },
        },
        events: [event],
      };
    }

    intent.last_payment_error = null;
    if (intent.capture_method === "manual") {
      intent.status = "requires_capture";
      intent.amount_capturable = intent.amount;
      const event = this.emit(
        "payment_intent.amount_capturable_updated",
        intent,
        { status: previousStatus, amount_capturable: 0 },
        ctx,
        intent.id,
      );
      return { status: 200, body: this.renderIntent(intent, expand), events: [event] };
    }
    intent.status = "succeeded";
    intent.amount_received = intent.amount;
    charge.captured = true;
    charge.amount_captured = intent.amount;
    const event = this.emit("payment_intent.succeeded", intent, { status: previousStatus, amount_received: 0 }, ctx, intent.id);
    return { status: 200, body: this.renderIntent(intent, expand), events: [event] };
  }

  private newCharge(intent: Stripe.PaymentIntent, paymentMethod: string, outcome: TestCardOutcome): Stripe.Charge {
    return {
      id: newId("ch"),
      object: "charge",
      amount: intent.amount,
      amount_captured: 0,
      amount_refunded: 0,
      application: null,
      application_fee: null,
      application_fee_amount: null,
      balance_transaction: null,
      billing_details: { address: null, email: null, name: null, phone: null, tax_id: null },
      calculated_statement_descriptor: intent.statement_descriptor,
      captured: false,
      created: nowSeconds(),
      currency: intent.currency,
      customer: null,
      description: intent.description,
      disputed: false,
      failure_balance_transaction: null,
      failure_code: outcome.ok ? null : "card_declined",
      failure_message: outcome.ok ? null : outcome.message,
      fraud_details: {},
      livemode: false,
      // Charges made by a payment intent carry its metadata (docs.stripe.com/api/charges/object#charge_object-metadata).
      metadata: { ...intent.metadata },
      on_behalf_of: null,
      outcome: null,
      paid: outcome.ok,
      payment_intent: intent.id,
      payment_method: paymentMethod,
      payment_method_details: null,
      receipt_email: intent.receipt_email,
      receipt_number: null,
      receipt_url: null,
      refunded: false,
      refunds: { object: "list", data: [], has_more: false, url: "" },
      review: null,
      shipping: null,
      source: null,
      source_transfer: null,
      statement_descriptor: intent.statement_descriptor,
      statement_descriptor_suffix: intent.statement_descriptor_suffix,
      status: outcome.ok ? "succeeded" : "failed",
      transfer_data: null,
      transfer_group: null,
    };
  }

  private emit(
    type: FakeEventType,
    object: Stripe.PaymentIntent | Stripe.Charge,
    previousAttributes: Record<string, unknown>,
    ctx: RequestContext,
    paymentIntent: string,
  ): EventRecord {
    const event: FakeEvent = {
      id: newId("evt"),
      object: "event",
      api_version: ctx.apiVersion,
      created: nowSeconds(),
      data: { object: snapshot(object), previous_attributes: previousAttributes },
      livemode: false,
      pending_webhooks: this.webhookEnabled ? 1 : 0,
      request: { id: ctx.requestId, idempotency_key: ctx.idempotencyKey },
      type,
    };
    const record: EventRecord = {
      event,
      paymentIntent,
      delivery: { attempts: 0, delivered: false, lastStatus: null, lastError: null, lastAttemptAt: null },
    };
    this.state.events.push(record);
    return record;
  }

  private renderIntent(intent: Stripe.PaymentIntent, expand: string[]): unknown {
    const copy = snapshot(intent);
    if (expand.includes("latest_charge") && typeof copy.latest_charge === "string") {
      copy.latest_charge = snapshot(this.state.charges[copy.latest_charge] ?? null);
    }
    return copy;
  }
}
