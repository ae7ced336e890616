// StripePaymentProcessor through the official `stripe` SDK against the local stand-in on a random port.
// Expected behaviour is Stripe's documented one: docs.stripe.com/payments/place-a-hold-on-a-payment-method
// (manual capture), docs.stripe.com/api/idempotent_requests, docs.stripe.com/webhooks#verify-manually and
// the test payment methods of docs.stripe.com/testing.
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import Stripe from "stripe";
import { afterAll, beforeAll, beforeEach, describe, expect, it } from "vitest";
import { startPaymentsServer, type RunningPaymentsServer } from "@/scripts/fakes/payments-server";
import { startWebhookReceiver, type ReceivedDelivery, type WebhookReceiver } from "@/scripts/fakes/webhook-receiver";
import { PaymentError, type PaymentEvent } from "./processor";
import { StripePaymentProcessor } from "./stripe-processor";

const SECRET_KEY = "sk_test_shoal_processor";
const WEBHOOK_SECRET = "whsec_shoal_processor_test";
let dataDir: string;
let server: RunningPaymentsServer;
let receiver: WebhookReceiver;
let processor: StripePaymentProcessor;
let keyCounter = 0;

function key(label: string): string {
  keyCounter += 1;
  return `${label}-${keyCounter}-${Date.now()}`;
}

interface FakeEventRecord {
  event: { id: string; type: string };
  paymentIntent: string;
}

async function fakeEvents(paymentIntent?: string): Promise<FakeEventRecord[]> {
  const query = paymentIntent === undefined ? "" : `?payment_intent=${paymentIntent}`;
  const res = await fetch(`${server.url}/_fake/events${query}`, { headers: { Authorization: `Bearer ${SECRET_KEY}` } });
  return ((await res.json()) as { data: FakeEventRecord[] }).data;
}

/** Webhook deliveries for one hold, verified and decoded by the processor, in arrival order. */
async function deliveredEventsFor(holdId: string, count: number): Promise<PaymentEvent[]> {
  const parsed = async () =>
    Promise.all(receiver.deliveries.map((delivery) => processor.parseWebhook(delivery.rawBody, delivery.signature)));
  const forHold = (events: PaymentEvent[]) => events.filter((event) => event.type !== "ignored" && event.holdId === holdId);
  const deadline = Date.now() + 5_000;
  for (;;) {
    const events = forHold(await parsed());
    if (events.length >= count || Date.now() > deadline) return events;
    await new Promise((resolveWait) => setTimeout(resolveWait, 20));
  }
}

async function expectPaymentError(promise: Promise<unknown>, code: PaymentError["code"]): Promise<void> {
  const err = await promise.then(
    () => null,
    (caught: unknown) => caught,
  );
  expect(err).toBeInstanceOf(PaymentError);
  expect((err as PaymentError).code).toBe(code);
}

beforeAll(async () => {
  dataDir = mkdtempSync(join(tmpdir(), "payments-processor-"));
  receiver = await startWebhookReceiver();
  server = await startPaymentsServer({
    port: 0,
    dataDir,
    secretKey: SECRET_KEY,
    webhookSecret: WEBHOOK_SECRET,
    webhookUrl: receiver.url,
    webhookRetryDelaysMs: [50, 100],
  });
  processor = new StripePaymentProcessor({ secretKey: SECRET_KEY, apiBase: server.url, webhookSecret: WEBHOOK_SECRET });
});

afterAll(async () => {
  await server.close();
  await receiver.close();
  rmSync(dataDir, { recursive: true, force: true });
});

beforeEach(() => {
  receiver.deliveries.length = 0;
});

// A deposit of USD 60.00 for 150 fingerlings; USD has two decimal places, so 6000 minor units (ISO 4217).
const deposit = { amountMinor: 6000, currency: "USD", paymentMethod: "pm_card_visa" } as const;

describe("StripePaymentProcessor against the payments stand-in", () => {
  it("holds a deposit and releases it in full, with signed webhooks for both steps", async () => {
    const held = await processor.holdDeposit({ ...deposit, reference: "res_hold_release", idempotencyKey: key("hold") });
    expect(held.ok).toBe(true);
    if (!held.ok) return;
    // Manual capture: a confirmed intent waits in requires_capture with the whole amount capturable (Stripe docs, place a hold).
    expect(held.hold).toMatchObject({ status: "held", heldMinor: 6000, releasedMinor: 0, currency: "USD", reference: "res_hold_release" });

    const released = await processor.release({ holdId: held.hold.holdId, idempotencyKey: key("release") });
    expect(released).toMatchObject({ status: "released", heldMinor: 0, releasedMinor: 6000, refundedMinor: 0 });
    expect(await processor.retrieve(held.hold.holdId)).toEqual(released);

    const events = await deliveredEventsFor(held.hold.holdId, 2);
    expect(events.map((event) => event.type)).toEqual(["hold.authorized", "hold.released"]);
    expect(events[0]).toMatchObject({ heldMinor: 6000, reference: "res_hold_release", currency: "USD" });
    expect(events[1]).toMatchObject({ releasedMinor: 6000 });
  });

  it("holds and then returns a deposit (cancel)", async () => {
    const held = await processor.holdDeposit({ ...deposit, reference: "res_cancel", idempotencyKey: key("hold") });
    if (!held.ok) throw new Error("hold failed");
    const canceled = await processor.cancelHold({ holdId: held.hold.holdId, idempotencyKey: key("cancel"), reason: "requested_by_customer" });
    expect(canceled).toMatchObject({ status: "canceled", heldMinor: 0, releasedMinor: 0 });
    const events = await deliveredEventsFor(held.hold.holdId, 2);
    expect(events.map((event) => event.type)).toEqual(["hold.authorized", "hold.canceled"]);
  });

  it("releases part of a hold, refunds part, then the rest, and refuses a refund past that", async () => {
    const held = await processor.holdDeposit({ ...deposit, reference: "res_refund", idempotencyKey: key("hold") });
    if (!held.ok) throw new Error("hold failed");
    // Capturing less than authorised is allowed via amount_to_capture ≤ amount_capturable (Stripe API, capture a PaymentIntent).
    const released = await processor.release({ holdId: held.hold.holdId, amountMinor: 4000, idempotencyKey: key("release") });
    expect(released).toMatchObject({ status: "released", releasedMinor: 4000, heldMinor: 0 });

    const partial = await processor.refund({ holdId: held.hold.holdId, amountMinor: 1500, idempotencyKey: key("refund") });
    expect(partial).toMatchObject({ amountMinor: 1500, currency: "USD" });
    expect(partial.refundId).toMatch(/^re_/);
    expect(partial.hold).toMatchObject({ status: "released", refundedMinor: 1500 });

    // Without an amount, Stripe refunds whatever is left of the charge: 4000 − 1500 = 2500.
    const rest = await processor.refund({ holdId: held.hold.holdId, idempotencyKey: key("refund") });
    expect(rest.amountMinor).toBe(2500);
    expect(rest.hold).toMatchObject({ status: "refunded", refundedMinor: 4000 });

    await expectPaymentError(processor.refund({ holdId: held.hold.holdId, amountMinor: 1, idempotencyKey: key("refund") }), "invalid_state");

    const events = await deliveredEventsFor(held.hold.holdId, 4);
    expect(events.map((event) => event.type)).toEqual(["hold.authorized", "hold.released", "hold.refunded", "hold.refunded"]);
    // charge.refunded carries the running total refunded on the charge (Stripe API, the charge object).
    expect(events.slice(2).map((event) => (event.type === "hold.refunded" ? event.refundedMinor : -1))).toEqual([1500, 4000]);
  });

  it("reports a declined card as a value, with the decline code, and a failure webhook", async () => {
    // pm_card_chargeDeclined and pm_card_chargeDeclinedInsufficientFunds are Stripe's test decline cards (docs.stripe.com/testing).
    const declined = await processor.holdDeposit({ ...deposit, paymentMethod: "pm_card_chargeDeclined", reference: "res_declined", idempotencyKey: key("hold") });
    expect(declined).toMatchObject({ ok: false, reason: "declined", declineCode: "generic_decline" });
    if (declined.ok || declined.hold === null) throw new Error("expected a declined hold");
    expect(declined.hold).toMatchObject({ status: "failed", heldMinor: 0, failure: { code: "generic_decline" } });

    const poor = await processor.holdDeposit({ ...deposit, paymentMethod: "pm_card_chargeDeclinedInsufficientFunds", reference: "res_poor", idempotencyKey: key("hold") });
    expect(poor).toMatchObject({ ok: false, declineCode: "insufficient_funds" });

    const events = await deliveredEventsFor(declined.hold.holdId, 1);
    expect(events).toHaveLength(1);
    expect(events[0]).toMatchObject({ type: "hold.failed", failure: { code: "generic_decline" } });
    // A declined hold cannot be released.
    await expectPaymentError(processor.release({ holdId: declined.hold.holdId, idempotencyKey: key("release") }), "invalid_state");
  });

  it("replays a retried call with the same idempotency key: same intent, nothing new created", async () => {
    const holdKey = key("hold");
    const first = await processor.holdDeposit({ ...deposit, reference: "res_replay", idempotencyKey: holdKey });
    if (!first.ok) throw new Error("hold failed");
    const authorisedBefore = (await fakeEvents()).filter((record) => record.event.type === "payment_intent.amount_capturable_updated").length;

    const second = await processor.holdDeposit({ ...deposit, reference: "res_replay", idempotencyKey: holdKey });
    expect(second).toEqual(first);
    const authorisedAfter = (await fakeEvents()).filter((record) => record.event.type === "payment_intent.amount_capturable_updated").length;
    expect(authorisedAfter).toBe(authorisedBefore);

    const releaseKey = key("release");
    const released = await processor.release({ holdId: first.hold.holdId, idempotencyKey: releaseKey });
    const again = await processor.release({ holdId: first.hold.holdId, idempotencyKey: releaseKey });
    expect(again).toEqual(released);
    const forIntent = await fakeEvents(first.hold.holdId);
    expect(forIntent.map((record) => record.event.type).sort()).toEqual(["payment_intent.amount_capturable_updated", "payment_intent.succeeded"]);
  });

  it("refuses a reused idempotency key with different parameters", async () => {
    const holdKey = key("hold");
    const first = await processor.holdDeposit({ ...deposit, reference: "res_mismatch", idempotencyKey: holdKey });
    expect(first.ok).toBe(true);
    await expectPaymentError(
      processor.holdDeposit({ ...deposit, amountMinor: 6001, reference: "res_mismatch", idempotencyKey: holdKey }),
      "idempotency_conflict",
    );
  });

  it("refuses illegal moves with invalid_state and out-of-range amounts with invalid_request", async () => {
    const held = await processor.holdDeposit({ ...deposit, reference: "res_illegal", idempotencyKey: key("hold") });
    if (!held.ok) throw new Error("hold failed");
    const holdId = held.hold.holdId;
    // Refund needs a captured payment; release cannot exceed what is held.
    await expectPaymentError(processor.refund({ holdId, idempotencyKey: key("refund") }), "invalid_state");
    await expectPaymentError(processor.release({ holdId, amountMinor: 6001, idempotencyKey: key("release") }), "invalid_request");
    await processor.cancelHold({ holdId, idempotencyKey: key("cancel") });
    // Only requires_capture may be captured; a canceled intent cannot be canceled again (Stripe API, cancel/capture).
    await expectPaymentError(processor.release({ holdId, idempotencyKey: key("release") }), "invalid_state");
    await expectPaymentError(processor.cancelHold({ holdId, idempotencyKey: key("cancel") }), "invalid_state");

    const other = await processor.holdDeposit({ ...deposit, reference: "res_illegal_2", idempotencyKey: key("hold") });
    if (!other.ok) throw new Error("hold failed");
    await processor.release({ holdId: other.hold.holdId, idempotencyKey: key("release") });
    await expectPaymentError(processor.release({ holdId: other.hold.holdId, idempotencyKey: key("release") }), "invalid_state");
    await expectPaymentError(processor.cancelHold({ holdId: other.hold.holdId, idempotencyKey: key("cancel") }), "invalid_state");

    await expectPaymentError(processor.retrieve("pi_doesnotexist000000000000"), "not_found");
    await expectPaymentError(processor.holdDeposit({ ...deposit, amountMinor: 0, reference: "x", idempotencyKey: key("hold") }), "invalid_request");
    await expectPaymentError(processor.holdDeposit({ ...deposit, currency: "US", reference: "x", idempotencyKey: key("hold") }), "invalid_request");
  });

  it("accepts a webhook signed with the secret and rejects bad, tampered, stale or missing signatures", async () => {
    const held = await processor.holdDeposit({ ...deposit, reference: "res_webhook", idempotencyKey: key("hold") });
    if (!held.ok) throw new Error("hold failed");
    const mine = (list: ReceivedDelivery[]) => list.find((item) => item.rawBody.includes(held.hold.holdId));
    const delivery = mine(await receiver.waitFor((list) => mine(list) !== undefined));
    if (delivery === undefined) throw new Error("no delivery");
    await expect(processor.parseWebhook(delivery.rawBody, delivery.signature)).resolves.toMatchObject({
      type: "hold.authorized",
      holdId: held.hold.holdId,
    });
    // Bytes work as well as text (Next's route handlers can hand over either).
    await expect(processor.parseWebhook(new TextEncoder().encode(delivery.rawBody), delivery.signature)).resolves.toMatchObject({
      type: "hold.authorized",
    });

    // Headers built by the SDK's own test helper: an independent implementation of the same scheme.
    const sign = (secret: string, payload: string, timestamp?: number) =>
      Stripe.webhooks.generateTestHeaderString({ payload, secret, ...(timestamp === undefined ? {} : { timestamp }) });
    await expect(processor.parseWebhook(delivery.rawBody, sign(WEBHOOK_SECRET, delivery.rawBody))).resolves.toMatchObject({
      type: "hold.authorized",
    });
    await expectPaymentError(processor.parseWebhook(delivery.rawBody, sign("whsec_someone_else", delivery.rawBody)), "invalid_signature");
    const tampered = delivery.rawBody.replace('"amount_capturable": 6000', '"amount_capturable": 600000');
    expect(tampered).not.toBe(delivery.rawBody);
    await expectPaymentError(processor.parseWebhook(tampered, delivery.signature), "invalid_signature");
    // The SDK's default tolerance is 300 s (Webhooks.js DEFAULT_TOLERANCE); ten minutes old is refused.
    const stale = sign(WEBHOOK_SECRET, delivery.rawBody, Math.floor(Date.now() / 1000) - 600);
    await expectPaymentError(processor.parseWebhook(delivery.rawBody, stale), "invalid_signature");
    await expectPaymentError(processor.parseWebhook(delivery.rawBody, undefined), "invalid_signature");
    await expectPaymentError(processor.parseWebhook(delivery.rawBody, "t=1,v0=abc"), "invalid_signature");
  });

  it("fails with authentication for a wrong secret key and refuses an api base with a path", async () => {
    const wrong = new StripePaymentProcessor({ secretKey: "sk_test_not_ours", apiBase: server.url, webhookSecret: WEBHOOK_SECRET, maxNetworkRetries: 0 });
    await expectPaymentError(wrong.retrieve("pi_whatever"), "authentication");
    expect(() => new StripePaymentProcessor({ secretKey: SECRET_KEY, apiBase: `${server.url}/v1`, webhookSecret: WEBHOOK_SECRET })).toThrow(PaymentError);
  });
});
