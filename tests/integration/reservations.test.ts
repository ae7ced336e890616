import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { addPerson, standInIntent, standInMailTo, startReservationWorld, type ReservationWorld } from "../support/reservation-world";

// Reservations through the services on a migrated temporary database, with the real Stripe SDK against the
// payments stand-in and the mail stand-in. The oracle is issue 4's flow and rules; amounts are worked by hand
// in the comments (ZMW has 2 minor digits, ISO 4217).

let world: ReservationWorld;
let db: typeof import("@/db/client").db;
let schema: typeof import("@/db/schema");
let tables: typeof import("@/db/schema-reservations");
let service: typeof import("@/lib/reservations/service");
let batches: typeof import("@/lib/reservations/batches");
let queries: typeof import("@/lib/reservations/queries");
let sweeper: typeof import("@/lib/reservations/sweep");
let validations: typeof import("@/lib/validations/reservations");
let orm: typeof import("drizzle-orm");

const HOUR = 3_600_000;
const DAY = 24 * HOUR;
const T0 = new Date();

beforeAll(async () => {
  world = await startReservationWorld();
  ({ db } = await import("@/db/client"));
  schema = await import("@/db/schema");
  tables = await import("@/db/schema-reservations");
  service = await import("@/lib/reservations/service");
  batches = await import("@/lib/reservations/batches");
  queries = await import("@/lib/reservations/queries");
  sweeper = await import("@/lib/reservations/sweep");
  validations = await import("@/lib/validations/reservations");
  orm = await import("drizzle-orm");
});
afterAll(async () => world.close());

const day = (offsetDays: number) => new Date(T0.getTime() + offsetDays * DAY).toISOString().slice(0, 10);

async function postBatch(hatchery: { id: string; roles: ("farmer" | "hatchery" | "admin")[] }, count: number, price = "1.50") {
  const values = validations.batchFormSchema.parse({ species: "tilapia", meanWeightG: "5", meanLengthCm: "6", countAvailable: String(count), pricePerFish: price, currency: "ZMW", readyFrom: day(0), sellBy: day(60), delivery: "both" });
  return batches.createBatch(hatchery, values, T0);
}

async function available(batchId: string): Promise<number> {
  const row = (await db.select({ n: schema.batch.countAvailable }).from(schema.batch).where(orm.eq(schema.batch.id, batchId)))[0];
  return row?.n ?? Number.NaN;
}

async function historyOf(reservationId: string) {
  return db.select().from(tables.reservationHistory).where(orm.eq(tables.reservationHistory.reservationId, reservationId)).orderBy(tables.reservationHistory.id);
}

async function countHistory(event: "lapse" | "remind_survival" | "auto_release"): Promise<number> {
  return (await db.select().from(tables.reservationHistory).where(orm.eq(tables.reservationHistory.event, event))).length;
}

async function ledgerOf(holdId: string) {
  return db.select().from(tables.ledgerEntry).where(orm.eq(tables.ledgerEntry.holdId, holdId)).orderBy(tables.ledgerEntry.id);
}

describe("a reservation from request to release", () => {
  it("moves along the issue's path, one history row per move, the same history for both sides, and the money settles pro rata", async () => {
    const farmer = await addPerson(db, ["farmer"], "Mwila Banda");
    const hatchery = await addPerson(db, ["hatchery"], "Green Reed Hatchery");
    const b = await postBatch(hatchery, 300);
    const r = await service.createReservation(farmer, { batchId: b.id, count: 100, handoverMethod: "pickup" }, T0);
    // 100 fish × ZMW 1.50 = ZMW 150.00 = 15 000 ngwee, all of it held (depositShareBasisPoints 10 000).
    expect(r).toMatchObject({ state: "requested", totalMinor: 15_000, depositMinor: 15_000, pricePerFishMinor: 150, currency: "ZMW" });
    expect(await available(b.id)).toBe(200);

    const at = (h: number) => new Date(T0.getTime() + h * HOUR);
    await service.actOnReservation(hatchery, r.id, { action: "accept" }, at(1));
    const paid = await service.payDeposit(farmer, r.id, "pm_card_visa", "attempt-1", at(2));
    expect(paid.ok).toBe(true);
    await service.actOnReservation(hatchery, r.id, { action: "hand_over", count: 95 }, at(24));
    // Too early: survival is reported from day 7 after hand-over.
    await expect(service.actOnReservation(farmer, r.id, { action: "report_survival", survived: 90 }, at(24 + 6 * 24))).rejects.toMatchObject({ status: 409, code: "too_early" });
    const released = await service.actOnReservation(farmer, r.id, { action: "report_survival", survived: 90 }, at(24 + 7 * 24));
    expect(released).toMatchObject({ state: "released", handedOverCount: 95, survivedCount: 90 });

    const history = await historyOf(r.id);
    expect(history.map((h) => [h.event, h.fromState, h.toState, h.actorRole])).toEqual([
      ["request", null, "requested", "farmer"],
      ["accept", "requested", "accepted", "hatchery"],
      ["pay_deposit", "accepted", "deposit_held", "farmer"],
      ["hand_over", "deposit_held", "quarantine", "hatchery"],
      ["report_survival", "quarantine", "released", "farmer"],
    ]);
    const seenByFarmer = await queries.getReservationDetail(farmer, r.id, at(400));
    const seenByHatchery = await queries.getReservationDetail(hatchery, r.id, at(400));
    expect(seenByFarmer.history).toEqual(seenByHatchery.history);

    // Pro rata, rounded down: 15 000 × 95 / 100 = 14 250 to the hatchery, 750 back to the farmer.
    const [hold] = await db.select().from(tables.depositHold).where(orm.eq(tables.depositHold.subjectId, r.id));
    expect(hold).toMatchObject({ state: "partially_released", releasedMinor: 14_250, returnedMinor: 750, heldMinor: 0 });
    const legs = await ledgerOf(hold?.id ?? "");
    expect(legs.reduce((sum, l) => sum + l.amountMinor, 0)).toBe(0);
    expect(legs.filter((l) => l.account === "provider_payable").reduce((s, l) => s + l.amountMinor, 0)).toBe(14_250);
    const intent = await standInIntent(world, hold?.processorHoldId ?? "");
    expect(intent).toMatchObject({ status: "succeeded", amount: 15_000, amount_received: 14_250, amount_capturable: 0 });

    // Each step that needs the other side mailed them, through the mail stand-in.
    const farmerEmail = `${farmer.id}@example.test`;
    const hatcheryEmail = `${hatchery.id}@example.test`;
    const farmerSubjects = (await standInMailTo(world, farmerEmail)).map((m) => m.subject);
    const hatcherySubjects = (await standInMailTo(world, hatcheryEmail)).map((m) => m.subject);
    expect(hatcherySubjects.some((s) => s.startsWith("New reservation"))).toBe(true);
    expect(farmerSubjects.some((s) => s.includes("accepted your reservation"))).toBe(true);
    expect(hatcherySubjects.some((s) => s.startsWith("Deposit paid"))).toBe(true);
    expect(farmerSubjects.some((s) => s.startsWith("Your fish were handed over"))).toBe(true);
    expect(farmerSubjects.some((s) => s.startsWith("Deposit released"))).toBe(true);
    expect(hatcherySubjects.some((s) => s.startsWith("Deposit released"))).toBe(true);
  });

  it("shows a declined card, keeps the reservation accepted and takes a second card", async () => {
    const farmer = await addPerson(db, ["farmer"]);
    const hatchery = await addPerson(db, ["hatchery"]);
    const b = await postBatch(hatchery, 50);
    const r = await service.createReservation(farmer, { batchId: b.id, count: 10, handoverMethod: "pickup" }, T0);
    await service.actOnReservation(hatchery, r.id, { action: "accept" }, T0);
    const declined = await service.payDeposit(farmer, r.id, "pm_card_chargeDeclinedInsufficientFunds", "a1", T0);
    expect(declined).toMatchObject({ ok: false, declineCode: "insufficient_funds" });
    const detail = await queries.getReservationDetail(farmer, r.id, T0);
    expect(detail.state).toBe("accepted");
    expect(detail.lastDecline?.message).toMatch(/insufficient funds/i);
    // A retry of the declined attempt (same key) replays the decline; it does not charge.
    expect((await service.payDeposit(farmer, r.id, "pm_card_chargeDeclinedInsufficientFunds", "a1", T0)).ok).toBe(false);
    expect((await service.payDeposit(farmer, r.id, "pm_card_visa", "a2", T0)).ok).toBe(true);
    const holds = await db.select().from(tables.depositHold).where(orm.eq(tables.depositHold.subjectId, r.id));
    expect(holds.map((h) => h.state).sort()).toEqual(["failed", "held"]);
    expect((await queries.getReservationDetail(farmer, r.id, T0)).lastDecline).toBeNull();
  });

  it("refuses illegal and foreign moves and writes nothing for them", async () => {
    const farmer = await addPerson(db, ["farmer"]);
    const other = await addPerson(db, ["farmer"]);
    const hatchery = await addPerson(db, ["hatchery"]);
    const b = await postBatch(hatchery, 20);
    const r = await service.createReservation(farmer, { batchId: b.id, count: 5, handoverMethod: "pickup" }, T0);
    const before = await historyOf(r.id);
    await expect(service.actOnReservation(farmer, r.id, { action: "accept" }, T0)).rejects.toMatchObject({ status: 403 });
    await expect(service.actOnReservation(other, r.id, { action: "cancel" }, T0)).rejects.toMatchObject({ status: 404 });
    await expect(service.actOnReservation(hatchery, r.id, { action: "hand_over", count: 5 }, T0)).rejects.toMatchObject({ status: 409, code: "illegal_transition" });
    await expect(service.payDeposit(farmer, r.id, "pm_card_visa", "early", T0)).rejects.toMatchObject({ status: 409 });
    // Asking for more fish than are left is refused with the reason, and takes none.
    await expect(service.createReservation(other, { batchId: b.id, count: 16, handoverMethod: "pickup" }, T0)).rejects.toMatchObject({ status: 409, code: "not_enough_stock", message: "Only 15 fish are available, not 16" });
    // A hatchery cannot reserve its own fish (hatchery accounts may farm too).
    const both = await addPerson(db, ["hatchery", "farmer"]);
    const own = await postBatch(both, 10);
    await expect(service.createReservation(both, { batchId: own.id, count: 1, handoverMethod: "pickup" }, T0)).rejects.toMatchObject({ status: 400 });
    expect(await historyOf(r.id)).toEqual(before);
    expect(await available(b.id)).toBe(15);
    expect(await db.select().from(tables.depositHold).where(orm.eq(tables.depositHold.subjectId, r.id))).toEqual([]);
  });

  it("gives stock back exactly once, whichever way the reservation ends", async () => {
    const farmer = await addPerson(db, ["farmer"]);
    const hatchery = await addPerson(db, ["hatchery"]);
    const b = await postBatch(hatchery, 40);
    const declined = await service.createReservation(farmer, { batchId: b.id, count: 10, handoverMethod: "pickup" }, T0);
    const cancelled = await service.createReservation(farmer, { batchId: b.id, count: 10, handoverMethod: "pickup" }, T0);
    expect(await available(b.id)).toBe(20);
    await service.actOnReservation(hatchery, declined.id, { action: "decline" }, T0);
    await expect(service.actOnReservation(farmer, declined.id, { action: "cancel" }, T0)).rejects.toMatchObject({ status: 409 });
    await service.actOnReservation(hatchery, cancelled.id, { action: "accept" }, T0);
    await service.payDeposit(farmer, cancelled.id, "pm_card_visa", "k", T0);
    await service.actOnReservation(farmer, cancelled.id, { action: "cancel" }, T0);
    expect(await available(b.id)).toBe(40);
    // The cancelled deposit was an authorisation only: it was cancelled at the processor, not captured and refunded.
    const [hold] = await db.select().from(tables.depositHold).where(orm.eq(tables.depositHold.subjectId, cancelled.id));
    expect(hold?.state).toBe("refunded");
    expect(await standInIntent(world, hold?.processorHoldId ?? "")).toMatchObject({ status: "canceled", amount_received: 0 });
  });
});

describe("the sweep", () => {
  it("run twice at once lapses, reminds and releases each reservation once", async () => {
    const farmer = await addPerson(db, ["farmer"]);
    const hatchery = await addPerson(db, ["hatchery"]);
    const b = await postBatch(hatchery, 1_000);
    const stale = await Promise.all(Array.from({ length: 6 }, () => service.createReservation(farmer, { batchId: b.id, count: 7, handoverMethod: "pickup" }, T0)));
    const quarantined = [];
    for (let i = 0; i < 4; i++) {
      const r = await service.createReservation(farmer, { batchId: b.id, count: 20, handoverMethod: "pickup" }, T0);
      await service.actOnReservation(hatchery, r.id, { action: "accept" }, T0);
      await service.payDeposit(farmer, r.id, "pm_card_visa", `s${i}`, T0);
      await service.actOnReservation(hatchery, r.id, { action: "hand_over", count: 20 }, T0);
      quarantined.push(r);
    }
    const [firstHeld] = quarantined;
    expect(await available(b.id)).toBe(1_000 - 6 * 7 - 4 * 20);

    // 49 hours on: the six requests are past their 48-hour answer window; nothing else is due.
    // (Other tests' reservations share this database, so the sweeps' counts are compared with the rows written.)
    const at49h = new Date(T0.getTime() + 49 * HOUR);
    const lapsesBefore = await countHistory("lapse");
    const [a, c] = await Promise.all([sweeper.sweep(at49h), sweeper.sweep(at49h)]);
    expect(a.lapsed + c.lapsed).toBe((await countHistory("lapse")) - lapsesBefore);
    expect(await available(b.id)).toBe(1_000 - 4 * 20);

    // 15 days on: the day-7 reminder and the 14-day automatic release, once each.
    const at15d = new Date(T0.getTime() + 15 * DAY);
    const remindersBefore = await countHistory("remind_survival");
    const releasesBefore = await countHistory("auto_release");
    const [d, e] = await Promise.all([sweeper.sweep(at15d), sweeper.sweep(at15d)]);
    expect(d.reminded + e.reminded).toBe((await countHistory("remind_survival")) - remindersBefore);
    expect(d.released + e.released).toBe((await countHistory("auto_release")) - releasesBefore);
    for (const r of stale) expect((await historyOf(r.id)).filter((h) => h.event === "lapse")).toHaveLength(1);
    for (const r of quarantined) {
      const events = (await historyOf(r.id)).map((h) => h.event);
      expect(events.filter((x) => x === "remind_survival")).toHaveLength(1);
      expect(events.filter((x) => x === "auto_release")).toHaveLength(1);
      const [hold] = await db.select().from(tables.depositHold).where(orm.eq(tables.depositHold.subjectId, r.id));
      const legs = await ledgerOf(hold?.id ?? "");
      expect(new Set(legs.map((l) => l.movementId)).size).toBe(2); // held once, released once
      // 20 fish × 150 ngwee = 3 000, all released; the stand-in captured it once.
      expect(await standInIntent(world, hold?.processorHoldId ?? "")).toMatchObject({ amount_received: 3_000 });
    }
    // The reminder and the release each mailed once (one outbox row per move, template and recipient).
    const outbox = await db.select().from(tables.mailOutbox).where(orm.eq(tables.mailOutbox.subjectId, firstHeld?.id ?? ""));
    expect(outbox.filter((m) => m.template === "reservation-survival-reminder")).toHaveLength(1);
    expect(outbox.filter((m) => m.template === "reservation-released")).toHaveLength(2);
    expect(outbox.every((m) => m.sentAt !== null)).toBe(true);
  });

  it("captures a deposit still held after five days into Shoal's holding, and settles it from there", async () => {
    const farmer = await addPerson(db, ["farmer"]);
    const hatchery = await addPerson(db, ["hatchery"]);
    const b = await postBatch(hatchery, 100);
    const r = await service.createReservation(farmer, { batchId: b.id, count: 40, handoverMethod: "pickup" }, T0);
    await service.actOnReservation(hatchery, r.id, { action: "accept" }, T0);
    await service.payDeposit(farmer, r.id, "pm_card_visa", "long", T0);
    const sixDays = new Date(T0.getTime() + 6 * DAY);
    const safekeptBefore = await db.select().from(tables.holdHistory).where(orm.eq(tables.holdHistory.event, "safekeep"));
    const [x, y] = await Promise.all([sweeper.sweep(sixDays), sweeper.sweep(sixDays)]);
    const safekeptAfter = await db.select().from(tables.holdHistory).where(orm.eq(tables.holdHistory.event, "safekeep"));
    expect(x.holds.safekept + y.holds.safekept).toBe(safekeptAfter.length - safekeptBefore.length);
    const [hold] = await db.select().from(tables.depositHold).where(orm.eq(tables.depositHold.subjectId, r.id));
    expect(safekeptAfter.filter((h) => h.holdId === hold?.id)).toHaveLength(1);
    expect(hold?.capturedAt).not.toBeNull();
    expect(hold?.state).toBe("held");
    // 40 × 150 = 6 000 captured into holding; the ledger still shows it held (no movement at safekeeping).
    expect(await standInIntent(world, hold?.processorHoldId ?? "")).toMatchObject({ status: "succeeded", amount_received: 6_000 });
    expect(new Set((await ledgerOf(hold?.id ?? "")).map((l) => l.movement))).toEqual(new Set(["hold"]));
    // Hand over 30 of 40, report on day 7: 6 000 × 30 / 40 = 4 500 to the hatchery, 1 500 refunded to the card.
    await service.actOnReservation(hatchery, r.id, { action: "hand_over", count: 30 }, sixDays);
    await service.actOnReservation(farmer, r.id, { action: "report_survival", survived: 30 }, new Date(sixDays.getTime() + 7 * DAY));
    const intent = await standInIntent(world, hold?.processorHoldId ?? "");
    expect(intent.amount_received - (intent.latest_charge?.amount_refunded ?? 0)).toBe(4_500);
    const legs = await ledgerOf(hold?.id ?? "");
    expect(legs.filter((l) => l.account === "provider_payable").reduce((s, l) => s + l.amountMinor, 0)).toBe(4_500);
    expect(legs.reduce((s, l) => s + l.amountMinor, 0)).toBe(0);
  });
});
