import { createHmac } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { addPerson, STRIPE_SECRET, STRIPE_WEBHOOK_SECRET, standInIntent, startReservationWorld, type ReservationWorld } from "../support/reservation-world";

// Processor webhooks through lib/payments/webhook.ts (what POST /api/webhooks/stripe runs), with deliveries made
// and signed by the payments stand-in. Forged signatures are made here with node:crypto after Stripe's documented
// scheme (docs.stripe.com/webhooks#verify-manually: v1 = HMAC-SHA256 of "<t>.<raw body>", hex).

let world: ReservationWorld;
let db: typeof import("@/db/client").db;
let tables: typeof import("@/db/schema-reservations");
let service: typeof import("@/lib/reservations/service");
let batches: typeof import("@/lib/reservations/batches");
let webhook: typeof import("@/lib/payments/webhook");
let validations: typeof import("@/lib/validations/reservations");
let ledger: typeof import("@/lib/payments/ledger");
let orm: typeof import("drizzle-orm");
let Stripe: typeof import("stripe").default;

beforeAll(async () => {
  world = await startReservationWorld();
  ({ db } = await import("@/db/client"));
  tables = await import("@/db/schema-reservations");
  service = await import("@/lib/reservations/service");
  batches = await import("@/lib/reservations/batches");
  webhook = await import("@/lib/payments/webhook");
  validations = await import("@/lib/validations/reservations");
  ledger = await import("@/lib/payments/ledger");
  orm = await import("drizzle-orm");
  Stripe = (await import("stripe")).default;
});
afterAll(async () => world.close());

const sign = (payload: string, secret: string) => {
  const t = Math.floor(Date.now() / 1000);
  return `t=${t},v1=${createHmac("sha256", secret).update(`${t}.${payload}`, "utf8").digest("hex")}`;
};

async function acceptedReservation(count: number) {
  const farmer = await addPerson(db, ["farmer"]);
  const hatchery = await addPerson(db, ["hatchery"]);
  const today = new Date().toISOString().slice(0, 10);
  const b = await batches.createBatch(hatchery, validations.batchFormSchema.parse({ species: "tilapia", meanWeightG: 2, meanLengthCm: 4, countAvailable: 100, pricePerFish: "0.90", currency: "ZMW", readyFrom: today, sellBy: "2099-01-01", delivery: "pickup" }));
  const r = await service.createReservation(farmer, { batchId: b.id, count, handoverMethod: "pickup" });
  await service.actOnReservation(hatchery, r.id, { action: "accept" });
  return { farmer, hatchery, r };
}

/** Everything a webhook could change, to compare before and after. */
async function everything() {
  const [events, holds, legs, holdHistory, reservations, history] = await Promise.all([
    db.select().from(tables.processedWebhookEvent),
    db.select().from(tables.depositHold),
    db.select().from(tables.ledgerEntry),
    db.select().from(tables.holdHistory),
    db.select().from(tables.reservation),
    db.select().from(tables.reservationHistory),
  ]);
  return { events, holds, legs, holdHistory, reservations, history };
}

async function deliveriesFor(intentId: string, atLeast: number) {
  const all = await world.webhooks.waitFor((ds) => ds.filter((d) => d.rawBody.includes(intentId)).length >= atLeast);
  return all.filter((d) => d.rawBody.includes(intentId));
}

describe("payment webhooks", () => {
  it("refuses a bad signature with 400 and changes nothing; a replayed event is 200 and changes nothing", async () => {
    const { farmer, r } = await acceptedReservation(20);
    await service.payDeposit(farmer, r.id, "pm_card_visa", "w1");
    const [hold] = await db.select().from(tables.depositHold).where(orm.eq(tables.depositHold.subjectId, r.id));
    const deliveries = await deliveriesFor(hold?.processorHoldId ?? "", 1);
    for (const d of deliveries) expect((await webhook.handlePaymentWebhook(d.rawBody, d.signature ?? null)).status).toBe(200);
    const before = await everything();

    const [first] = deliveries;
    if (!first) throw new Error("no delivery");
    expect(await webhook.handlePaymentWebhook(first.rawBody, sign(first.rawBody, "whsec_someone_else"))).toMatchObject({ status: 400 });
    expect(await webhook.handlePaymentWebhook(first.rawBody.replace(/"amount_capturable": \d+/, '"amount_capturable": 1'), first.signature ?? null)).toMatchObject({ status: 400 });
    expect(await webhook.handlePaymentWebhook(first.rawBody, null)).toMatchObject({ status: 400 });
    expect(await everything()).toEqual(before);

    for (const d of deliveries) expect(await webhook.handlePaymentWebhook(d.rawBody, sign(d.rawBody, STRIPE_WEBHOOK_SECRET))).toEqual({ status: 200, outcome: "replayed" });
    expect(await everything()).toEqual(before);
  });

  it("moves the reservation when only the webhook brings the authorisation (the response was lost)", async () => {
    const { farmer, hatchery, r } = await acceptedReservation(10);
    // A pending hold whose processor call answered nobody: made here directly with the SDK, as a lost response.
    const holdId = crypto.randomUUID();
    await db.insert(tables.depositHold).values({ id: holdId, subjectType: "reservation", subjectId: r.id, payerId: farmer.id, payeeId: hatchery.id, currency: "ZMW", amountMinor: 900, state: "pending", processor: "stripe", paymentMethod: "pm_card_visa", idempotencyKey: `lost-${holdId}` });
    const url = new URL(world.payments.url);
    const sdk = new Stripe(STRIPE_SECRET, { host: url.hostname, port: url.port, protocol: "http" });
    const intent = await sdk.paymentIntents.create({ amount: 900, currency: "zmw", capture_method: "manual", confirm: true, payment_method: "pm_card_visa", metadata: { reference: holdId } });
    const deliveries = await deliveriesFor(intent.id, 1);
    const outcomes = [];
    for (const d of deliveries) outcomes.push(await webhook.handlePaymentWebhook(d.rawBody, d.signature ?? null));
    expect(outcomes).toContainEqual({ status: 200, outcome: "applied" });
    const [after] = await db.select().from(tables.reservation).where(orm.eq(tables.reservation.id, r.id));
    expect(after?.state).toBe("deposit_held");
    const legs = await db.select().from(tables.ledgerEntry).where(orm.eq(tables.ledgerEntry.holdId, holdId));
    // 10 fish × 90 ngwee = 900 held: farmer_funds −900, platform_holding +900.
    expect(ledger.balances(legs).ZMW).toEqual({ farmer_funds: -900, platform_holding: 900, provider_payable: 0, platform_fee: 0 });
  });

  it("records an authorisation the network let lapse as expired, with the money back in the ledger", async () => {
    const { farmer, r } = await acceptedReservation(30);
    await service.payDeposit(farmer, r.id, "pm_card_visa", "lapse");
    const [hold] = await db.select().from(tables.depositHold).where(orm.eq(tables.depositHold.subjectId, r.id));
    const intentId = hold?.processorHoldId ?? "";
    const url = new URL(world.payments.url);
    // The stand-in has no clock for authorisations; cancelling behind the app's back stands in for the lapse.
    await new Stripe(STRIPE_SECRET, { host: url.hostname, port: url.port, protocol: "http" }).paymentIntents.cancel(intentId);
    for (const d of await deliveriesFor(intentId, 2)) await webhook.handlePaymentWebhook(d.rawBody, d.signature ?? null);
    const [after] = await db.select().from(tables.depositHold).where(orm.eq(tables.depositHold.id, hold?.id ?? ""));
    expect(after).toMatchObject({ state: "expired", heldMinor: 0, returnedMinor: 2_700 });
    const legs = await db.select().from(tables.ledgerEntry).where(orm.eq(tables.ledgerEntry.holdId, hold?.id ?? ""));
    expect(ledger.ledgerProblems(legs)).toEqual([]);
    expect(ledger.balances(legs).ZMW).toEqual({ farmer_funds: 0, platform_holding: 0, provider_payable: 0, platform_fee: 0 });
    expect(await standInIntent(world, intentId)).toMatchObject({ status: "canceled", amount_capturable: 0 });
  });
});
