import { expect, test } from "@playwright/test";
import { createHmac } from "node:crypto";
import { DEMO } from "./support";
import { apiAs, e2eDatabase, PAYMENTS_API, postBatch, STRIPE_SECRET } from "./reservation-support";

// Issue 4: "a bad signature is rejected and changes nothing; a replayed event changes nothing." Signatures are made
// here with node:crypto following Stripe's documented scheme (docs.stripe.com/webhooks#verify-manually:
// v1 = HMAC-SHA256 of "<timestamp>.<raw body>" with the endpoint secret, hex), independently of the app and the SDK.

const WEBHOOK_SECRET = process.env.STRIPE_WEBHOOK_SECRET || "whsec_local_shoal";

function sign(payload: string, secret: string, at = Math.floor(Date.now() / 1000)): string {
  return `t=${at},v1=${createHmac("sha256", secret).update(`${at}.${payload}`, "utf8").digest("hex")}`;
}

type EventRecord = { event: { id: string; type: string }; delivery: { delivered: boolean; lastStatus: number | null } };

async function snapshot(reservationId: string, holdId: string) {
  const db = e2eDatabase();
  try {
    const one = async (sql: string, args: string[] = []) => Number((await db.execute({ sql, args })).rows[0]?.n ?? -1);
    return {
      events: await one("select count(*) n from processed_webhook_event where hold_id = ?", [holdId]),
      ledger: await one("select count(*) n from ledger_entry where hold_id = ?", [holdId]),
      holdHistory: await one("select count(*) n from hold_history where hold_id = ?", [holdId]),
      reservationHistory: await one("select count(*) n from reservation_history where reservation_id = ?", [reservationId]),
      state: String((await db.execute({ sql: "select h.state || '/' || r.state s from deposit_hold h join reservation r on r.id = h.subject_id where h.id = ?", args: [holdId] })).rows[0]?.s),
    };
  } finally {
    db.close();
  }
}

test("webhooks: a bad signature is refused and changes nothing; a replayed event is acknowledged and changes nothing", async () => {
  const hatchery = await apiAs(DEMO.hatchery);
  const farmer = await apiAs(DEMO.farmer);
  const batchId = await postBatch(hatchery.ctx, 40, "7");
  const created = await farmer.ctx.post("/api/v1/reservations", { data: { batchId, count: 12, handoverMethod: "pickup" }, headers: { "idempotency-key": `webhook-spec-${batchId}` } });
  const reservationId = ((await created.json()) as { reservation: { id: string } }).reservation.id;
  expect((await hatchery.ctx.post(`/api/v1/reservations/${reservationId}/actions`, { data: { action: "accept" } })).status()).toBe(200);
  expect((await farmer.ctx.post(`/api/v1/reservations/${reservationId}/pay`, { data: { paymentMethod: "pm_card_visa" }, headers: { "idempotency-key": `webhook-spec-pay-${batchId}` } })).status()).toBe(200);

  const db = e2eDatabase();
  const holdRow = (await db.execute({ sql: "select id, processor_hold_id from deposit_hold where subject_id = ?", args: [reservationId] })).rows[0];
  db.close();
  const holdId = String(holdRow?.id);
  const intentId = String(holdRow?.processor_hold_id);

  // The stand-in delivered every event of this payment to the app, which answered 200 to each.
  let records: EventRecord[] = [];
  await expect
    .poll(async () => {
      const r = await fetch(`${PAYMENTS_API}/_fake/events?payment_intent=${intentId}`, { headers: { Authorization: `Bearer ${STRIPE_SECRET}` } });
      records = ((await r.json()) as { data: EventRecord[] }).data;
      return records.length > 0 && records.every((e) => e.delivery.lastStatus === 200);
    })
    .toBe(true);
  const record = records.find((e) => e.event.type === "payment_intent.amount_capturable_updated");
  const payload = JSON.stringify(record?.event, null, 2);
  const before = await snapshot(reservationId, holdId);
  expect(before.state).toBe("held/deposit_held");

  // Bad signatures: a wrong secret, a tampered body, no header. Each is 400 and nothing is recorded or moved.
  const post = (body: string, signature?: string) => hatchery.ctx.post("/api/webhooks/stripe", { data: body, headers: { "content-type": "application/json", ...(signature ? { "stripe-signature": signature } : {}) } });
  expect((await post(payload, sign(payload, "whsec_not_the_secret"))).status()).toBe(400);
  const tampered = payload.replace(/"amount_capturable": \d+/, '"amount_capturable": 1');
  expect((await post(tampered, sign(payload, WEBHOOK_SECRET))).status()).toBe(400);
  expect((await post(payload)).status()).toBe(400);
  expect(await snapshot(reservationId, holdId)).toEqual(before);

  // A replay, correctly signed: acknowledged (200, so the processor stops retrying) and nothing changes.
  const replay = await post(payload, sign(payload, WEBHOOK_SECRET));
  expect(replay.status()).toBe(200);
  expect(await replay.json()).toEqual({ received: true, outcome: "replayed" });
  // And the stand-in's own redelivery of the same event.
  const redeliver = await fetch(`${PAYMENTS_API}/_fake/events/${record?.event.id}/redeliver`, { method: "POST", headers: { Authorization: `Bearer ${STRIPE_SECRET}` } });
  expect(redeliver.status).toBe(202);
  await new Promise((r) => setTimeout(r, 500));
  expect(await snapshot(reservationId, holdId)).toEqual(before);

  await hatchery.ctx.dispose();
  await farmer.ctx.dispose();
});
