import type { Client } from "@libsql/client";
import { randomUUID } from "node:crypto";
import { eq, inArray } from "drizzle-orm";
import { drizzle } from "drizzle-orm/libsql";
import Stripe from "stripe";
import type { Species } from "../lib/catalog";
import { holdTransition, newHold, type DepositHold, type HoldEvent } from "../lib/payments/hold-state";
import { entriesFor } from "../lib/payments/ledger";
import { requestReservation, transition, type Reservation, type ReservationActor, type ReservationEvent } from "../lib/reservations/state";
import * as core from "./schema";
import * as tables from "./schema-reservations";
import { rng } from "./seed-random";

// Demo batches and reservations (issue 4). Open batches for every seeded hatchery, dated from today so some are
// ready now and some soon, and reservations in each state for the demo farmer and the demo hatchery. Every state
// is reached through the pure machines, so history rows, stock, holds and ledger legs agree as the app would write
// them; held money is authorised (and captured where released) at the payments stand-in, so the ledger matches the
// processor's records. Prices are invented demo figures in ZMW, in the range small hatcheries advertise (from memory).

type Db = ReturnType<typeof drizzle<typeof core & typeof tables>>;

const DAY = 86_400_000;
const HOUR = 3_600_000;

/** Size classes offered, with an invented price per fish in ngwee (ZMW minor units). */
const OFFERS: Record<Species, { g: number; cm: number; priceMinor: number }[]> = {
  tilapia: [
    { g: 1, cm: 3.5, priceMinor: 80 },
    { g: 5, cm: 6, priceMinor: 150 },
    { g: 10, cm: 8, priceMinor: 220 },
  ],
  catfish: [
    { g: 3, cm: 7, priceMinor: 120 },
    { g: 10, cm: 11, priceMinor: 250 },
  ],
};


function stripeFromEnv(): Stripe | null {
  const base = process.env.STRIPE_API_BASE ?? "http://127.0.0.1:4620";
  const key = process.env.STRIPE_SECRET_KEY ?? "sk_test_local_shoal";
  try {
    const url = new URL(base);
    return new Stripe(key, { host: url.hostname, port: url.port || (url.protocol === "https:" ? "443" : "80"), protocol: url.protocol === "http:" ? "http" : "https", maxNetworkRetries: 1, telemetry: false });
  } catch {
    return null;
  }
}

interface Seeded {
  batchId: string;
  hatcheryId: string;
  species: Species;
  g: number;
  cm: number;
  priceMinor: number;
}

async function seedBatches(db: Db, hatcheries: { userId: string; species: Species[] }[], now: Date, rand: () => number): Promise<Seeded[]> {
  const out: Seeded[] = [];
  for (const [i, h] of hatcheries.entries()) {
    for (const species of h.species) {
      const offers = OFFERS[species];
      const count = 1 + Math.floor(rand() * offers.length);
      for (let k = 0; k < count; k++) {
        const offer = offers[(i + k) % offers.length];
        if (!offer) continue;
        // About half the batches are ready now; the rest within three weeks.
        const readyInDays = rand() < 0.5 ? -Math.floor(rand() * 5) : 4 + Math.floor(rand() * 18);
        const readyFrom = new Date(now.getTime() + readyInDays * DAY);
        readyFrom.setUTCHours(0, 0, 0, 0);
        const sellBy = new Date(readyFrom.getTime() + (21 + Math.floor(rand() * 20)) * DAY - 1);
        const total = (2 + Math.floor(rand() * 18)) * 250; // counted out in lots of 250 (common practice)
        const id = randomUUID();
        await db.insert(core.batch).values({
          id,
          hatcheryId: h.userId,
          species,
          meanWeightG: offer.g,
          meanLengthCm: offer.cm,
          countTotal: total,
          countAvailable: total,
          priceMinor: offer.priceMinor,
          currency: "ZMW",
          readyFrom,
          sellBy,
          delivery: (["pickup", "both", "delivery"] as const)[Math.floor(rand() * 3)] ?? "pickup",
          state: "open",
        });
        out.push({ batchId: id, hatcheryId: h.userId, species, g: offer.g, cm: offer.cm, priceMinor: offer.priceMinor });
      }
    }
  }
  return out;
}

type Step = { event: ReservationEvent; actor: ReservationActor; at: Date };

/** One reservation taken through `steps` with the pure machine, written as the service writes it. */
async function seedReservation(db: Db, stripe: Stripe | null, b: Seeded, farmerId: string, count: number, requestedAt: Date, steps: Step[]): Promise<boolean> {
  const id = randomUUID();
  const farmer: ReservationActor = { role: "farmer", userId: farmerId };
  const [row] = await db.select().from(core.batch).where(eq(core.batch.id, b.batchId));
  if (!row) return false;
  const first = requestReservation({ farmerId, hatcheryId: b.hatcheryId, count, availableCount: row.countAvailable, pricePerFishMinor: b.priceMinor, currency: "ZMW" }, { actor: farmer, now: requestedAt });
  if (!first.ok) return false;
  const needsMoney = steps.some((s) => s.event.type === "pay_deposit");
  if (needsMoney && !stripe) return false;

  let r: Reservation = first.next;
  const history: (typeof tables.reservationHistory.$inferInsert)[] = [{ reservationId: id, fromState: null, toState: "requested", event: "request", actorId: farmerId, actorRole: "farmer", at: requestedAt, detail: { count } }];
  let stockBack = false;
  let hold: DepositHold | null = null;
  let holdRow: typeof tables.depositHold.$inferInsert | null = null;
  const legs: ReturnType<typeof entriesFor> = [];
  const holdHistory: (typeof tables.holdHistory.$inferInsert)[] = [];
  const firstLapse = first.effects.find((e) => e.kind === "schedule" && e.event === "lapse");
  let lapseAt: Date | null = firstLapse?.kind === "schedule" ? firstLapse.at : null;
  let remindAt: Date | null = null;
  let autoReleaseAt: Date | null = null;

  const holdMove = async (event: HoldEvent, actor: "farmer" | "provider" | "admin" | "system", at: Date) => {
    if (!hold || !holdRow) throw new Error("no hold to move");
    const t = holdTransition(hold, event, actor);
    if (!t.ok) throw new Error(t.message);
    for (const effect of t.effects) {
      if (effect.kind === "ledger") legs.push(...entriesFor(effect.movement));
      if (effect.kind === "processor" && stripe && holdRow.processorHoldId) {
        if (effect.call === "release") await stripe.paymentIntents.capture(holdRow.processorHoldId, { amount_to_capture: effect.amountMinor }, { idempotencyKey: `seed-capture:${hold.holdId}` });
        else await stripe.paymentIntents.cancel(holdRow.processorHoldId, {}, { idempotencyKey: `seed-cancel:${hold.holdId}` });
      }
    }
    holdHistory.push({ holdId: hold.holdId, fromState: hold.state, toState: t.next.state, event: event.type, actor, at });
    hold = t.next;
  };

  for (const step of steps) {
    const t = transition(r, step.event, { actor: step.actor, now: step.at });
    if (!t.ok) throw new Error(`seed: ${t.message}`);
    if (step.event.type === "pay_deposit" && stripe) {
      const holdId = randomUUID();
      const intent = await stripe.paymentIntents.create(
        { amount: r.depositMinor, currency: "zmw", capture_method: "manual", confirm: true, payment_method: "pm_card_visa", allowed_payment_method_types: ["card"], metadata: { reference: holdId } },
        { idempotencyKey: `seed-hold:${holdId}` },
      );
      hold = newHold({ holdId, currency: "ZMW", amountMinor: r.depositMinor });
      holdRow = { id: holdId, subjectType: "reservation", subjectId: id, payerId: farmerId, payeeId: b.hatcheryId, currency: "ZMW", amountMinor: r.depositMinor, state: "pending", processor: "stripe", processorHoldId: intent.id, paymentMethod: "pm_card_visa", idempotencyKey: `seed:${holdId}`, authorizedAt: step.at };
      holdHistory.push({ holdId, fromState: null, toState: "pending", event: "open", actor: "farmer", actorId: farmerId, at: step.at });
      await holdMove({ type: "authorize", amountMinor: r.depositMinor, currency: "ZMW" }, "system", step.at);
    }
    for (const effect of t.effects) {
      if (effect.kind === "return_stock") stockBack = true;
      if (effect.kind === "hold") await holdMove(effect.event, effect.actor, step.at);
      if (effect.kind === "schedule") {
        if (effect.event === "lapse") lapseAt = effect.at;
        if (effect.event === "remind_survival") remindAt = effect.at;
        if (effect.event === "auto_release") autoReleaseAt = effect.at;
      }
    }
    history.push({ reservationId: id, fromState: r.state, toState: t.next.state, event: step.event.type, actorId: step.actor.role === "system" ? null : step.actor.userId, actorRole: step.actor.role, at: step.at, detail: "count" in step.event ? { count: step.event.count } : "survived" in step.event ? { survived: step.event.survived } : {} });
    r = t.next;
  }

  const open = r.state === "requested" || r.state === "accepted";
  const final = ["released", "cancelled", "declined", "lapsed", "refunded"].includes(r.state);
  await db.transaction(async (tx) => {
    await tx
      .update(core.batch)
      .set({ countAvailable: stockBack ? row.countAvailable : row.countAvailable - count })
      .where(eq(core.batch.id, b.batchId));
    await tx.insert(tables.reservation).values({
      id,
      batchId: b.batchId,
      farmerId,
      hatcheryId: b.hatcheryId,
      state: r.state,
      count,
      species: b.species,
      meanWeightG: b.g,
      meanLengthCm: b.cm,
      pricePerFishMinor: b.priceMinor,
      currency: "ZMW",
      totalMinor: count * b.priceMinor,
      depositMinor: r.depositMinor,
      handoverMethod: "pickup",
      requestedAt,
      acceptedAt: r.acceptedAt,
      depositHeldAt: r.depositHeldAt,
      handedOverAt: r.handedOverAt,
      handedOverCount: r.handedOverCount,
      survivalReminderSentAt: r.survivalReminderSentAt,
      survivedCount: r.survivedCount,
      closedAt: final ? (steps.at(-1)?.at ?? requestedAt) : null,
      lapseAt: open ? lapseAt : null,
      remindAt: r.state === "quarantine" ? remindAt : null,
      autoReleaseAt: r.state === "quarantine" ? autoReleaseAt : null,
      stockReturnedAt: stockBack ? (steps.at(-1)?.at ?? requestedAt) : null,
      version: steps.length,
    });
    await tx.insert(tables.reservationHistory).values(history);
    if (hold && holdRow) {
      const h: DepositHold = hold;
      await tx.insert(tables.depositHold).values({ ...holdRow, state: h.state, heldMinor: h.heldMinor, releasedMinor: h.releasedMinor, returnedMinor: h.returnedMinor });
      await tx.insert(tables.holdHistory).values(holdHistory);
      if (legs.length) await tx.insert(tables.ledgerEntry).values(legs);
    }
  });
  return true;
}

/** Seeds batches for every hatchery and the demo reservations; returns a one-line summary. */
export async function seedReservations(client: Client, demo: { farmerEmail: string; hatcheryEmail: string }, now = new Date()): Promise<string> {
  const db = drizzle(client, { schema: { ...core, ...tables } });
  const rand = rng(20261204);
  const hatcheries = await db.select({ userId: core.hatchery.userId, species: core.hatchery.species }).from(core.hatchery);
  const seeded = await seedBatches(db, hatcheries, now, rand);

  const people = await db.select({ id: core.user.id, email: core.user.email }).from(core.user).where(inArray(core.user.email, [demo.farmerEmail, demo.hatcheryEmail]));
  const farmerId = people.find((p) => p.email === demo.farmerEmail)?.id;
  const hatcheryId = people.find((p) => p.email === demo.hatcheryEmail)?.id;
  if (!farmerId || !hatcheryId) return `seeded ${seeded.length} batches`;
  const own = seeded.filter((b) => b.hatcheryId === hatcheryId);
  const [main, second] = [own[0], own[1] ?? own[0]];
  if (!main || !second) return `seeded ${seeded.length} batches`;
  // The demo hatchery's first two batches are large and ready now, so every demo reservation fits.
  const readyNow = new Date(now.getTime() - 2 * DAY);
  readyNow.setUTCHours(0, 0, 0, 0);
  await db
    .update(core.batch)
    .set({ countTotal: 6_000, countAvailable: 6_000, readyFrom: readyNow, sellBy: new Date(readyNow.getTime() + 45 * DAY - 1), delivery: "both" })
    .where(inArray(core.batch.id, [main.batchId, second.batchId]));
  const others = (await db.select({ id: core.userRole.userId }).from(core.userRole).where(eq(core.userRole.role, "farmer"))).map((r) => r.id).filter((id) => id !== farmerId && !own.some((b) => b.hatcheryId === id));

  const stripe = stripeFromEnv();
  const ago = (hours: number) => new Date(now.getTime() - hours * HOUR);
  const F: ReservationActor = { role: "farmer", userId: farmerId };
  const H: ReservationActor = { role: "hatchery", userId: hatcheryId };
  const S: ReservationActor = { role: "system" };
  const plans: { b: Seeded; farmer: string; count: number; at: Date; steps: Step[] }[] = [
    // The demo farmer: one of each stage of the path.
    { b: main, farmer: farmerId, count: 500, at: ago(3), steps: [] },
    { b: second, farmer: farmerId, count: 250, at: ago(30), steps: [{ event: { type: "accept" }, actor: H, at: ago(26) }] },
    { b: main, farmer: farmerId, count: 300, at: ago(72), steps: [{ event: { type: "accept" }, actor: H, at: ago(70) }, { event: { type: "pay_deposit", heldMinor: 300 * main.priceMinor, currency: "ZMW" }, actor: F, at: ago(69) }] },
    {
      b: main,
      farmer: farmerId,
      count: 400,
      at: ago(24 * 6),
      steps: [
        { event: { type: "accept" }, actor: H, at: ago(24 * 6 - 2) },
        { event: { type: "pay_deposit", heldMinor: 400 * main.priceMinor, currency: "ZMW" }, actor: F, at: ago(24 * 6 - 3) },
        { event: { type: "hand_over", count: 390 }, actor: H, at: ago(24 * 3) },
      ],
    },
    {
      b: second,
      farmer: farmerId,
      count: 200,
      at: ago(24 * 20),
      steps: [
        { event: { type: "accept" }, actor: H, at: ago(24 * 20 - 5) },
        { event: { type: "pay_deposit", heldMinor: 200 * second.priceMinor, currency: "ZMW" }, actor: F, at: ago(24 * 20 - 6) },
        { event: { type: "hand_over", count: 200 }, actor: H, at: ago(24 * 16) },
        { event: { type: "report_survival", survived: 188 }, actor: F, at: ago(24 * 9) },
      ],
    },
    { b: second, farmer: farmerId, count: 150, at: ago(24 * 12), steps: [{ event: { type: "lapse" }, actor: S, at: ago(24 * 10) }] },
  ];
  // Other farmers' requests, so the hatchery's table has something to sort, filter and page.
  for (const [k, other] of others.slice(0, 12).entries()) {
    const b = k % 2 === 0 ? main : second;
    const at = ago(2 + k * 3);
    const steps: Step[] = k % 4 === 1 ? [{ event: { type: "accept" }, actor: H, at: ago(1 + k * 3) }] : k % 4 === 3 ? [{ event: { type: "decline" }, actor: H, at: ago(1 + k * 3) }] : [];
    plans.push({ b, farmer: other, count: 50 + ((k * 37) % 9) * 25, at, steps });
  }
  let made = 0;
  let skipped = 0;
  for (const p of plans) {
    try {
      if (await seedReservation(db, stripe, p.b, p.farmer, p.count, p.at, p.steps)) made += 1;
      else skipped += 1;
    } catch (err) {
      skipped += 1;
      console.warn(`[seed] reservation skipped: ${err instanceof Error ? err.message : String(err)}`);
    }
  }
  return `seeded ${seeded.length} batches and ${made} reservations${skipped ? ` (${skipped} skipped: is the payments stand-in running?)` : ""}`;
}
