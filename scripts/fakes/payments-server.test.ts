// The payments stand-in at the HTTP level, mostly through the official `stripe` SDK (23.1.0): what the SDK
// sends must be understood, and what comes back must be what the SDK turns into the documented objects
// and error classes. Stripe behaviour referred to: docs.stripe.com/api/idempotent_requests,
// docs.stripe.com/api/errors, docs.stripe.com/webhooks (signatures, retries), docs.stripe.com/testing.
import { mkdtempSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import Stripe from "stripe";
import { afterAll, afterEach, beforeAll, describe, expect, it } from "vitest";
import { startPaymentsServer, type RunningPaymentsServer } from "./payments-server";
import { signPayload } from "./webhook-sender";
import { startWebhookReceiver, type WebhookReceiver } from "./webhook-receiver";

const SECRET_KEY = "sk_test_shoal_fake_server";
const WEBHOOK_SECRET = "whsec_shoal_fake_server";
const cleanups: (() => Promise<void>)[] = [];

afterEach(async () => {
  while (cleanups.length > 0) await cleanups.pop()?.();
});

async function start(options: { webhookUrl?: string; dataDir?: string } = {}) {
  const dataDir = options.dataDir ?? mkdtempSync(join(tmpdir(), "payments-fake-"));
  const server = await startPaymentsServer({
    port: 0,
    dataDir,
    secretKey: SECRET_KEY,
    webhookSecret: WEBHOOK_SECRET,
    ...(options.webhookUrl === undefined ? {} : { webhookUrl: options.webhookUrl }),
    webhookRetryDelaysMs: [30, 60, 90],
  });
  const url = new URL(server.url);
  const stripe = new Stripe(SECRET_KEY, { host: url.hostname, port: url.port, protocol: "http", telemetry: false, maxNetworkRetries: 0 });
  let closed = false;
  const close = async () => {
    if (closed) return;
    closed = true;
    await server.close();
  };
  cleanups.push(async () => {
    await close();
    if (options.dataDir === undefined) rmSync(dataDir, { recursive: true, force: true });
  });
  return { server, stripe, dataDir, close };
}

async function receiver(respond?: (index: number) => number): Promise<WebhookReceiver> {
  const started = await startWebhookReceiver(respond);
  cleanups.push(() => started.close());
  return started;
}

function caught(promise: Promise<unknown>): Promise<unknown> {
  return promise.then(
    () => null,
    (err: unknown) => err,
  );
}

const holdParams = {
  amount: 2500,
  currency: "kes",
  capture_method: "manual",
  confirm: true,
  payment_method: "pm_card_visa",
  metadata: { reference: "res_42", batch: "batch_7" },
} as const;

describe("payments stand-in over HTTP", () => {
  it("answers a request without a key, or with a wrong key, with 401 in Stripe's error shape", async () => {
    const { server } = await start();
    const res = await fetch(`${server.url}/v1/payment_intents/pi_x`);
    expect(res.status).toBe(401);
    const body = (await res.json()) as { error: { type: string; message: string } };
    // Stripe's error envelope: { error: { type, message, code?, param? } } (docs.stripe.com/api/errors).
    expect(body.error.type).toBe("invalid_request_error");
    expect(body.error.message).toContain("API key");

    const url = new URL(server.url);
    const wrong = new Stripe("sk_test_wrong_key_123", { host: url.hostname, port: url.port, protocol: "http", maxNetworkRetries: 0 });
    const err = await caught(wrong.paymentIntents.retrieve("pi_x"));
    expect(err).toBeInstanceOf(Stripe.errors.StripeAuthenticationError);
  });

  it("decodes the SDK's form encoding: nested metadata, booleans, integers; lower-cases the currency", async () => {
    const { stripe } = await start();
    const intent = await stripe.paymentIntents.create({ ...holdParams, currency: "KES" });
    expect(intent).toMatchObject({
      object: "payment_intent",
      amount: 2500,
      currency: "kes", // Stripe reports ISO 4217 codes in lower case (PaymentIntent.currency)
      capture_method: "manual",
      status: "requires_capture",
      amount_capturable: 2500,
      metadata: { reference: "res_42", batch: "batch_7" },
    });
    expect(intent.id).toMatch(/^pi_[A-Za-z0-9]{24}$/);
    expect(intent.client_secret).toMatch(new RegExp(`^${intent.id}_secret_`));

    const retrieved = await stripe.paymentIntents.retrieve(intent.id, { expand: ["latest_charge"] });
    const charge = retrieved.latest_charge as Stripe.Charge;
    expect(charge).toMatchObject({ object: "charge", amount: 2500, captured: false, paid: true, payment_intent: intent.id });
    expect(charge.metadata).toEqual({ reference: "res_42", batch: "batch_7" });
  });

  it("refuses unknown parameters, bad currencies and bad amounts with 400 invalid_request_error", async () => {
    const { stripe, server } = await start();
    const unknown = await fetch(`${server.url}/v1/payment_intents`, {
      method: "POST",
      headers: { Authorization: `Bearer ${SECRET_KEY}`, "Content-Type": "application/x-www-form-urlencoded" },
      body: "amount=100&currency=usd&colour=blue",
    });
    expect(unknown.status).toBe(400);
    expect(await unknown.json()).toMatchObject({ error: { type: "invalid_request_error", code: "parameter_unknown", param: "colour" } });

    // "ABC" is not in ISO 4217; the runtime's Intl currency list is the reference.
    expect(Intl.supportedValuesOf("currency")).not.toContain("ABC");
    const badCurrency = await caught(stripe.paymentIntents.create({ amount: 100, currency: "abc" }));
    expect(badCurrency).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect((badCurrency as Stripe.errors.StripeInvalidRequestError).param).toBe("currency");

    // Up to eight digits (PaymentIntentCreateParams.amount in the SDK's types): 99,999,999 passes, 100,000,000 does not.
    await expect(stripe.paymentIntents.create({ amount: 99_999_999, currency: "usd" })).resolves.toMatchObject({ status: "requires_payment_method" });
    const tooLarge = await caught(stripe.paymentIntents.create({ amount: 100_000_000, currency: "usd" }));
    expect((tooLarge as Stripe.errors.StripeInvalidRequestError).code).toBe("amount_too_large");
  });

  it("replays an idempotent request, refuses a changed one, and does not remember refusals made during validation", async () => {
    const { stripe, server } = await start();
    const first = await stripe.paymentIntents.create(holdParams, { idempotencyKey: "idem-1" });
    const replay = await stripe.paymentIntents.create(holdParams, { idempotencyKey: "idem-1" });
    expect(replay.id).toBe(first.id);
    expect(replay.lastResponse.headers["idempotent-replayed"]).toBe("true");

    const changed = await caught(stripe.paymentIntents.create({ ...holdParams, amount: 2600 }, { idempotencyKey: "idem-1" }));
    expect(changed).toBeInstanceOf(Stripe.errors.StripeIdempotencyError);

    const otherEndpoint = await caught(stripe.refunds.create({ payment_intent: first.id }, { idempotencyKey: "idem-1" }));
    expect(otherEndpoint).toBeInstanceOf(Stripe.errors.StripeIdempotencyError);

    // A request refused while its parameters were validated leaves no result behind, so the key can be used again.
    const invalid = await fetch(`${server.url}/v1/payment_intents`, {
      method: "POST",
      headers: { Authorization: `Bearer ${SECRET_KEY}`, "Idempotency-Key": "idem-2" },
      body: "amount=abc&currency=usd",
    });
    expect(invalid.status).toBe(400);
    await expect(stripe.paymentIntents.create({ amount: 100, currency: "usd" }, { idempotencyKey: "idem-2" })).resolves.toMatchObject({ amount: 100 });
  });

  it("serves concurrent requests with one idempotency key as one request", async () => {
    const { stripe, server } = await start();
    const results = await Promise.all(Array.from({ length: 8 }, () => stripe.paymentIntents.create(holdParams, { idempotencyKey: "race-1" })));
    expect(new Set(results.map((intent) => intent.id)).size).toBe(1);
    const listed = await fetch(`${server.url}/_fake/events`, { headers: { Authorization: `Bearer ${SECRET_KEY}` } });
    expect(((await listed.json()) as { data: unknown[] }).data).toHaveLength(1);
  });

  it("declines pm_card_chargeDeclined with a 402 card_error and replays the same decline for the same key", async () => {
    const { stripe } = await start();
    const params = { ...holdParams, payment_method: "pm_card_chargeDeclined" };
    const err = await caught(stripe.paymentIntents.create(params, { idempotencyKey: "decline-1" }));
    expect(err).toBeInstanceOf(Stripe.errors.StripeCardError);
    const card = err as Stripe.errors.StripeCardError;
    expect(card.statusCode).toBe(402);
    expect(card.code).toBe("card_declined");
    expect(card.decline_code).toBe("generic_decline");
    expect(card.payment_intent?.status).toBe("requires_payment_method");
    expect(card.payment_intent?.last_payment_error?.decline_code).toBe("generic_decline");

    const again = (await caught(stripe.paymentIntents.create(params, { idempotencyKey: "decline-1" }))) as Stripe.errors.StripeCardError;
    expect(again.payment_intent?.id).toBe(card.payment_intent?.id);

    // The intent may be confirmed again with another card (docs.stripe.com/payments/paymentintents/lifecycle).
    const retried = await stripe.paymentIntents.confirm(card.payment_intent?.id ?? "", { payment_method: "pm_card_visa" });
    expect(retried).toMatchObject({ status: "requires_capture", last_payment_error: null });
  });

  it("refuses illegal transitions with payment_intent_unexpected_state", async () => {
    const { stripe } = await start();
    const intent = await stripe.paymentIntents.create(holdParams);
    await stripe.paymentIntents.cancel(intent.id, { cancellation_reason: "abandoned" });
    const capture = (await caught(stripe.paymentIntents.capture(intent.id))) as Stripe.errors.StripeInvalidRequestError;
    expect(capture).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect(capture.code).toBe("payment_intent_unexpected_state");
    const refund = (await caught(stripe.refunds.create({ payment_intent: intent.id }))) as Stripe.errors.StripeInvalidRequestError;
    expect(refund.code).toBe("payment_intent_unexpected_state");
    const confirm = (await caught(stripe.paymentIntents.confirm(intent.id))) as Stripe.errors.StripeInvalidRequestError;
    expect(confirm.code).toBe("payment_intent_unexpected_state");
    const missing = (await caught(stripe.paymentIntents.retrieve("pi_missing"))) as Stripe.errors.StripeInvalidRequestError;
    expect(missing.statusCode).toBe(404);
    expect(missing.code).toBe("resource_missing");
  });

  it("keeps intents and idempotency records across a restart on the same data folder", async () => {
    const dataDir = mkdtempSync(join(tmpdir(), "payments-fake-restart-"));
    cleanups.push(async () => rmSync(dataDir, { recursive: true, force: true }));
    const first = await start({ dataDir });
    const intent = await first.stripe.paymentIntents.create(holdParams, { idempotencyKey: "restart-1" });
    await first.close();
    // The state file is whole JSON after every write (written to a temp file, then renamed).
    const onDisk = JSON.parse(readFileSync(join(dataDir, "state.json"), "utf8")) as { intents: Record<string, unknown> };
    expect(Object.keys(onDisk.intents)).toContain(intent.id);

    const second = await start({ dataDir });
    await expect(second.stripe.paymentIntents.retrieve(intent.id)).resolves.toMatchObject({ status: "requires_capture" });
    const replay = await second.stripe.paymentIntents.create(holdParams, { idempotencyKey: "restart-1" });
    expect(replay.id).toBe(intent.id);
    await expect(second.stripe.paymentIntents.capture(intent.id)).resolves.toMatchObject({ status: "succeeded", amount_received: 2500 });
  });

  it("signs webhooks so that stripe.webhooks.constructEvent accepts them, and retries until a 2xx", async () => {
    // The receiver fails the first two deliveries: Stripe retries non-2xx answers with backoff.
    const hook = await receiver((index) => (index < 2 ? 500 : 200));
    const { stripe, server } = await start({ webhookUrl: hook.url });
    const intent = await stripe.paymentIntents.create(holdParams, { idempotencyKey: "hook-1" });
    const deliveries = await hook.waitFor((list) => list.some((item) => item.answered === 200));
    expect(deliveries.map((item) => item.answered)).toEqual([500, 500, 200]);

    for (const delivery of deliveries) {
      const event = stripe.webhooks.constructEvent(delivery.rawBody, delivery.signature ?? "", WEBHOOK_SECRET);
      expect(event.type).toBe("payment_intent.amount_capturable_updated");
      if (event.type !== "payment_intent.amount_capturable_updated") continue;
      expect(event.data.object.id).toBe(intent.id);
      expect(event.data.object.amount_capturable).toBe(2500);
      expect(event.request).toEqual({ id: expect.stringMatching(/^req_/), idempotency_key: "hook-1" });
    }
    expect(() => stripe.webhooks.constructEvent(deliveries[0]?.rawBody ?? "", deliveries[0]?.signature ?? "", "whsec_wrong")).toThrow(
      Stripe.errors.StripeSignatureVerificationError,
    );

    const listed = await fetch(`${server.url}/_fake/events?payment_intent=${intent.id}`, { headers: { Authorization: `Bearer ${SECRET_KEY}` } });
    const records = ((await listed.json()) as { data: { event: { id: string }; delivery: { attempts: number; delivered: boolean; lastStatus: number } }[] }).data;
    expect(records).toHaveLength(1);
    expect(records[0]?.delivery).toMatchObject({ attempts: 3, delivered: true, lastStatus: 200 });

    // The same event through Stripe's own events API.
    const retrieved = await stripe.events.retrieve(records[0]?.event.id ?? "");
    expect(retrieved.type).toBe("payment_intent.amount_capturable_updated");
  });

  it("gives up after the configured retries and can redeliver an event by hand", async () => {
    let healthy = false;
    const hook = await receiver(() => (healthy ? 200 : 503));
    const { stripe, server } = await start({ webhookUrl: hook.url });
    const intent = await stripe.paymentIntents.create(holdParams);
    // Retry delays are [30, 60, 90] ms here: one attempt plus three retries, then the stand-in gives up.
    await hook.waitFor((list) => list.length >= 4);
    await new Promise((resolveWait) => setTimeout(resolveWait, 300));
    expect(hook.deliveries).toHaveLength(4);

    const auth = { Authorization: `Bearer ${SECRET_KEY}` };
    const listed = (await (await fetch(`${server.url}/_fake/events?payment_intent=${intent.id}`, { headers: auth })).json()) as {
      data: { event: { id: string }; delivery: { attempts: number; delivered: boolean; lastStatus: number } }[];
    };
    expect(listed.data).toHaveLength(1);
    const record = listed.data[0];
    expect(record?.delivery).toMatchObject({ attempts: 4, delivered: false, lastStatus: 503 });

    healthy = true;
    const redeliver = await fetch(`${server.url}/_fake/events/${record?.event.id}/redeliver`, { method: "POST", headers: auth });
    expect(redeliver.status).toBe(202);
    const after = await hook.waitFor((list) => list.length === 5);
    const resent = after[4];
    // A resend carries the same event (same id and body) under a fresh signature.
    expect(resent?.rawBody).toBe(after[0]?.rawBody);
    expect(stripe.webhooks.constructEvent(resent?.rawBody ?? "", resent?.signature ?? "", WEBHOOK_SECRET).id).toBe(record?.event.id);
  });

  it("produces the same Stripe-Signature header as the SDK's own test helper", () => {
    const payload = JSON.stringify({ id: "evt_test", object: "event" }, null, 2);
    const timestamp = 1_767_225_600;
    expect(signPayload(payload, WEBHOOK_SECRET, timestamp)).toBe(
      Stripe.webhooks.generateTestHeaderString({ payload, secret: WEBHOOK_SECRET, timestamp }),
    );
  });
});
