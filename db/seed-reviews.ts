// Demo reviews (issue 7), written ONLY on finished work: jobs completed through Shoal and reservations released
// after the first week. The earlier seed files leave almost no finished work, so this one first adds a history
// of it (tank requests, accepted quotes, completed jobs with their released deposits; past batches with released
// reservations and survival reports), every money move through the pure hold machine and the double-entry ledger
// so the books balance as the app would write them. Then: reviews on most of that work, replies, helpful marks and
// one report waiting in the moderation queue. Some providers end with enough reviews for a rating, the rest show
// "new". Finally every provider's listing (trust score and badge) is recomputed. All names, words and figures are
// invented; one transaction of multi-row inserts keeps it fast.
import { randomUUID } from "node:crypto";
import { eq, inArray } from "drizzle-orm";
import type { LibSQLDatabase } from "drizzle-orm/libsql";
import { SPECIES_LABEL, TANK_TYPE_LABEL, type Species, type TankType } from "../lib/catalog";
import { distanceMeters } from "../lib/geo/distance";
import { estimateFromPriceSheet, priceQuote } from "../lib/jobs/quote";
import { refreshListings } from "../lib/listings/sync";
import { holdTransition, newHold, type DepositHold, type HoldEvent } from "../lib/payments/hold-state";
import { entriesFor, type LedgerEntry } from "../lib/payments/ledger";
import { describeSize } from "../lib/requests/format";
import { requestReservation, transition, type Reservation, type ReservationActor, type ReservationEvent } from "../lib/reservations/state";
import type { AspectKey, ReviewRole } from "../lib/reviews/types";
import type { allSchema } from "./all-schema";
import * as core from "./schema";
import * as jobs from "./schema-jobs";
import * as money from "./schema-reservations";
import * as reviews from "./schema-reviews";
import { rng } from "./seed-random";

type SeedDb = LibSQLDatabase<typeof allSchema>;
type Point = { lat: number; lng: number };

const DAY = 86_400_000;
const HOUR = 3_600_000;

/**
 * Finished jobs per builder, in the order builders are listed by name (the demo builder first). At or above
 * TRUST_PARAMETERS.minReviewsForRating (5) reviews a provider shows a rating; below, "new" with its counts.
 */
const BUILDER_JOBS = [9, 12, 9, 7, 6, 3, 2, 1];
/** Released reservations per hatchery, likewise (the demo hatchery first). */
const HATCHERY_RESERVATIONS = [8, 10, 6, 6, 3, 1];
/** Share of each provider's finished work that gets a review (rounded), as not every farmer writes one. */
const REVIEW_SHARE = 0.85;

const WORDS = {
  builder: {
    good: [
      "The base was levelled properly and the liner sits without a single fold.",
      "They came on the day they promised and were done in two days.",
      "Showed me how to drain and refill, and left the yard cleaner than they found it.",
      "Sent a photo every evening, so I knew how it was going while I was at work.",
      "The final bill matched the quote to the ngwee.",
      "Strong frame; it has not moved since the first fill.",
    ],
    poor: [
      "Arrived a week later than agreed and did not call to say so.",
      "The frame needed tightening after the first fill.",
      "I had to chase them for news more than once.",
      "The outlet leaked at first; they came back, but only after three calls.",
    ],
    close: ["Would use them again for my next tank.", "Recommended for a first tank.", "Fair work for a fair price."],
  },
  hatchery: {
    good: [
      "The fingerlings were lively and even in size.",
      "The count was right: we counted them together at collection.",
      "Bagged with oxygen for the trip home, and very few losses in the first week.",
      "Clear advice on acclimatising and the first feeds.",
      "Ready on the day they said, no waiting.",
    ],
    poor: [
      "Sizes were mixed; a good part was smaller than promised.",
      "More losses in the first week than I expected.",
      "The count came up a few dozen short.",
      "I waited two hours at collection.",
    ],
    close: ["Will order my next batch here.", "Good fish for a fair price.", "Worth the drive."],
  },
} as const;

const REPLIES = [
  "Thank you for the kind words, and good luck with the first harvest.",
  "Thank you. We now phone on the day if we are running late, so nobody waits without news.",
  "Sorry to read this. Call us before your next order and we will go through transport and acclimatising together.",
  "Thanks for the fair review. Send us a photo when the fish reach table size!",
];

function pick<T>(items: readonly T[], rand: () => number): T {
  const item = items[Math.floor(rand() * items.length)];
  if (item === undefined) throw new Error("empty list");
  return item;
}

function offset(from: Point, km: number, rand: () => number): Point {
  const theta = rand() * 2 * Math.PI;
  const dLat = (km * Math.cos(theta)) / 110.574;
  const dLng = (km * Math.sin(theta)) / (111.32 * Math.cos((from.lat * Math.PI) / 180));
  return { lat: Number((from.lat + dLat).toFixed(5)), lng: Number((from.lng + dLng).toFixed(5)) };
}

/** Overall stars for a provider of this quality (0..1): mostly 4-5 for good ones, a spread for weaker ones. */
function starsFor(quality: number, rand: () => number): number {
  const r = rand();
  if (r < quality * 0.65) return 5;
  if (r < quality) return 4;
  if (r < quality + (1 - quality) * 0.5) return 3;
  return r < quality + (1 - quality) * 0.8 ? 2 : 1;
}

function bodyFor(role: ReviewRole, stars: number, rand: () => number): string {
  const w = WORDS[role];
  const parts: string[] = [];
  const good = stars >= 4 ? 2 : stars === 3 ? 1 : 0;
  const poor = stars >= 4 ? (rand() < 0.2 ? 1 : 0) : stars === 3 ? 1 : 2;
  const used = new Set<string>();
  const add = (list: readonly string[]) => {
    for (let tries = 0; tries < 5; tries++) {
      const s = pick(list, rand);
      if (!used.has(s)) {
        used.add(s);
        parts.push(s);
        return;
      }
    }
  };
  for (let i = 0; i < good; i++) add(w.good);
  for (let i = 0; i < poor; i++) add(w.poor);
  if (stars >= 4) add(w.close);
  return parts.join(" ");
}

function aspectsFor(role: ReviewRole, stars: number, rand: () => number): Partial<Record<AspectKey, number>> {
  const near = () => Math.min(5, Math.max(1, stars + (rand() < 0.25 ? -1 : rand() < 0.15 ? 1 : 0)));
  return role === "builder" ? { workmanship: near(), timeliness: near(), communication: near() } : { fish_health: near(), count_as_promised: near(), size_as_promised: near() };
}

type Rows = {
  requests: (typeof jobs.tankRequest.$inferInsert)[];
  quotes: (typeof jobs.quote.$inferInsert)[];
  versions: (typeof jobs.quoteVersion.$inferInsert)[];
  lines: (typeof jobs.quoteLine.$inferInsert)[];
  jobs: (typeof jobs.job.$inferInsert)[];
  jobEvents: (typeof jobs.jobEvent.$inferInsert)[];
  batches: (typeof core.batch.$inferInsert)[];
  reservations: (typeof money.reservation.$inferInsert)[];
  history: (typeof money.reservationHistory.$inferInsert)[];
  holds: (typeof money.depositHold.$inferInsert)[];
  holdHistory: (typeof money.holdHistory.$inferInsert)[];
  ledger: LedgerEntry[];
  reviews: (typeof reviews.review.$inferInsert)[];
  replies: (typeof reviews.reviewReply.$inferInsert)[];
  helpful: (typeof reviews.reviewHelpful.$inferInsert)[];
  reports: (typeof reviews.reviewReport.$inferInsert)[];
};

/** A deposit hold authorised and then released in full, as lib/payments writes it (no processor call: past demo money). */
function releasedHold(rows: Rows, subject: { type: "job" | "reservation"; id: string; payerId: string; payeeId: string }, amountMinor: number, releaseMinor: number, heldAt: Date, releasedAt: Date, releaseActor: "farmer" | "system"): string {
  const holdId = randomUUID();
  let hold: DepositHold = newHold({ holdId, currency: "ZMW", amountMinor });
  rows.holdHistory.push({ holdId, fromState: null, toState: "pending", event: "open", actor: "farmer", actorId: subject.payerId, at: heldAt });
  const move = (event: HoldEvent, actor: "farmer" | "system", at: Date) => {
    const t = holdTransition(hold, event, actor);
    if (!t.ok) throw new Error(`seed hold: ${t.message}`);
    for (const e of t.effects) if (e.kind === "ledger") rows.ledger.push(...entriesFor(e.movement));
    rows.holdHistory.push({ holdId, fromState: hold.state, toState: t.next.state, event: event.type, actor, at });
    hold = t.next;
  };
  move({ type: "authorize", amountMinor, currency: "ZMW" }, "system", heldAt);
  move({ type: "release", amountMinor: releaseMinor }, releaseActor, releasedAt);
  rows.holds.push({
    id: holdId,
    subjectType: subject.type,
    subjectId: subject.id,
    payerId: subject.payerId,
    payeeId: subject.payeeId,
    currency: "ZMW",
    amountMinor,
    state: hold.state,
    heldMinor: hold.heldMinor,
    releasedMinor: hold.releasedMinor,
    returnedMinor: hold.returnedMinor,
    processor: "seed",
    paymentMethod: "pm_card_visa",
    idempotencyKey: `seed:${holdId}`,
    authorizedAt: heldAt,
    createdAt: heldAt,
    updatedAt: releasedAt,
  });
  return holdId;
}

type Finished = { kind: "job" | "reservation"; id: string; role: ReviewRole; farmerId: string; providerId: string; finishedAt: Date; label: string; quality: number };

export async function seedReviews(db: SeedDb, demo: { farmer: string; builder: string; hatchery: string; hatcheryBuilder: string }, now = new Date()): Promise<string> {
  const rand = rng(20261207);
  const rows: Rows = { requests: [], quotes: [], versions: [], lines: [], jobs: [], jobEvents: [], batches: [], reservations: [], history: [], holds: [], holdHistory: [], ledger: [], reviews: [], replies: [], helpful: [], reports: [] };
  const finished: Finished[] = [];
  const ago = (days: number) => new Date(now.getTime() - days * DAY);

  const people = await db.select({ id: core.user.id, email: core.user.email }).from(core.user).where(inArray(core.user.email, [demo.farmer, demo.builder, demo.hatchery, demo.hatcheryBuilder]));
  const idOf = (email: string) => people.find((p) => p.email === email)?.id;
  const demoFarmer = idOf(demo.farmer);
  const providerIds = new Set((await db.select({ id: core.userRole.userId }).from(core.userRole).where(inArray(core.userRole.role, ["hatchery", "builder"]))).map((r) => r.id));
  // Reviewers: farmer accounts that are no provider; the demo farmer only gets the work set aside for it below.
  const farmers = (await db.select({ id: core.userRole.userId, name: core.profile.displayName }).from(core.userRole).innerJoin(core.profile, eq(core.profile.userId, core.userRole.userId)).where(eq(core.userRole.role, "farmer")))
    .filter((f) => !providerIds.has(f.id) && f.id !== demoFarmer)
    .sort((a, b) => a.name.localeCompare(b.name));
  if (farmers.length < 3 || !demoFarmer) return "seeded no reviews (the demo people are missing)";
  const someFarmer: string = demoFarmer;
  const farmerAt = (k: number): string => farmers[k % farmers.length]?.id ?? someFarmer;

  // ---------------------------------------------------------------------------------------------------------------
  // Builders: completed jobs
  // ---------------------------------------------------------------------------------------------------------------
  const builderRows = await db
    .select({ id: core.builder.userId, name: core.profile.displayName, lat: core.profile.lat, lng: core.profile.lng, state: core.profile.verificationState, currency: core.builder.currency, baseFeeMinor: core.builder.baseFeeMinor, rate: core.builder.travelRatePerKmMinor })
    .from(core.builder)
    .innerJoin(core.profile, eq(core.profile.userId, core.builder.userId));
  const prices = await db.select().from(core.builderPrice);
  const demoBuilder = idOf(demo.builder);
  const hatcheryBuilder = idOf(demo.hatcheryBuilder);
  const builders = builderRows
    .filter((b) => b.state !== "rejected" && b.lat !== null && b.lng !== null && b.id !== hatcheryBuilder)
    .sort((a, b) => (a.id === demoBuilder ? -1 : b.id === demoBuilder ? 1 : a.name.localeCompare(b.name)));
  // The account that is both a hatchery and a builder gets one finished job: a "new" builder beside its hatchery record.
  const hb = builderRows.find((b) => b.id === hatcheryBuilder);
  const builderPlan = builders.slice(0, BUILDER_JOBS.length).map((b, i) => ({ b, jobs: BUILDER_JOBS[i] ?? 0 }));
  if (hb) builderPlan.push({ b: hb, jobs: 1 });

  let jobCount = 0;
  for (const [i, { b, jobs: n }] of builderPlan.entries()) {
    if (b.lat === null || b.lng === null) continue;
    const sheet = prices.filter((p) => p.builderId === b.id);
    // One builder is plainly weaker, so the list shows a spread of ratings, not only the best.
    const quality = i === 3 ? 0.55 : 0.8 + rand() * 0.17;
    for (let k = 0; k < n; k++) {
      const row = sheet[Math.floor(rand() * sheet.length)];
      if (!row) continue;
      // The demo builder's last job belongs to the demo farmer and stays unreviewed: the demo of writing one.
      const farmerId: string = b.id === demoBuilder && k === n - 1 ? someFarmer : farmerAt(i * 7 + k * 3);
      const site = offset({ lat: b.lat, lng: b.lng }, 3 + rand() * 20, rand);
      const type: TankType = row.tankType;
      const length = type === "earthen" ? 10 + Math.round(rand() * 10) : 3 + Math.round(rand() * 3);
      const width = Math.max(2, Math.round(length * (0.5 + rand() * 0.3)));
      const size = { shape: "rectangular" as const, lengthM: length, widthM: width, diameterM: null, depthM: type === "earthen" ? 1.2 : 1, sizeUnit: "m" as const };
      const finishedAt = b.id === demoBuilder && k === n - 1 ? ago(2) : ago(12 + Math.floor(rand() * 200));
      const askedAt = new Date(finishedAt.getTime() - (20 + Math.floor(rand() * 20)) * DAY);
      // Answer times: most builders within a day, the weaker one slow.
      const quotedAt = new Date(askedAt.getTime() + (i === 3 ? 60 + rand() * 60 : 2 + rand() * 20) * HOUR);
      const acceptedAt = new Date(quotedAt.getTime() + (1 + rand() * 3) * DAY);
      const heldAt = new Date(acceptedAt.getTime() + 2 * HOUR);
      const onSiteAt = new Date(heldAt.getTime() + (3 + rand() * 7) * DAY);
      const builtAt = new Date(onSiteAt.getTime() + (1 + rand() * 3) * DAY);
      const doneAt = finishedAt.getTime() > builtAt.getTime() ? finishedAt : new Date(builtAt.getTime() + 6 * HOUR);

      const requestId = randomUUID();
      rows.requests.push({ id: requestId, farmerId, tankType: type, ...size, siteLat: site.lat, siteLng: site.lng, readiness: "compacted_ground", waterSource: "borehole", power: "solar", wantedBy: new Date(askedAt.getTime() + 30 * DAY), notes: "", state: "awarded", createdAt: askedAt, updatedAt: acceptedAt });
      const estimate = estimateFromPriceSheet(row, length * width);
      const distanceM = distanceMeters({ lat: b.lat, lng: b.lng }, site);
      const priced = priceQuote({ currency: b.currency, lines: estimate.lines, travel: b.rate > 0 ? { distanceM, ratePerKmMinor: b.rate } : null, baseServiceFeeMinor: b.baseFeeMinor, farmerSuppliesMaterials: false });
      const quoteId = randomUUID();
      rows.quotes.push({ id: quoteId, requestId, builderId: b.id, state: "accepted", currentVersion: 1, createdAt: quotedAt, updatedAt: acceptedAt });
      rows.versions.push({ quoteId, version: 1, currency: b.currency, farmerSuppliesMaterials: false, note: "", travelDistanceM: Math.round(distanceM), travelRatePerKmMinor: b.rate, baseFeeMinor: priced.baseServiceFeeMinor, subtotalMinor: priced.subtotalMinor, totalMinor: priced.totalMinor, depositMinor: priced.depositMinor, excludedMaterialsMinor: priced.excludedMaterialsMinor, createdAt: quotedAt });
      rows.lines.push(...priced.lines.map((l, position) => ({ quoteId, version: 1, position, kind: l.kind, description: l.description, quantity: l.quantity, unitPriceMinor: l.unitPriceMinor, totalMinor: l.totalMinor, included: l.included })));
      const jobId = randomUUID();
      const holdId = releasedHold(rows, { type: "job", id: jobId, payerId: farmerId, payeeId: b.id }, priced.depositMinor, priced.depositMinor, heldAt, doneAt, "farmer");
      rows.jobs.push({ id: jobId, requestId, quoteId, quoteVersion: 1, farmerId, builderId: b.id, state: "completed", currency: b.currency, totalMinor: priced.totalMinor, depositMinor: priced.depositMinor, holdId, onSiteAt, builtAt, completionPhotoCount: null, autoConfirmAt: new Date(builtAt.getTime() + 7 * DAY), createdAt: acceptedAt, updatedAt: doneAt });
      const event = (name: string, from: (typeof jobs.job.$inferInsert)["state"] | null, to: NonNullable<(typeof jobs.job.$inferInsert)["state"]>, actorId: string, actorRole: string, at: Date) =>
        rows.jobEvents.push({ jobId, event: name, fromState: from, toState: to, actorId, actorRole, detail: {}, createdAt: at });
      event("accept_quote", null, "awaiting_deposit", farmerId, "farmer", acceptedAt);
      event("deposit_held", "awaiting_deposit", "scheduled", farmerId, "farmer", heldAt);
      event("arrive", "scheduled", "on_site", b.id, "builder", onSiteAt);
      event("mark_built", "on_site", "built", b.id, "builder", builtAt);
      event("confirm", "built", "completed", farmerId, "farmer", doneAt);
      jobCount++;
      const label = `${TANK_TYPE_LABEL[type]} · ${describeSize(size)}`;
      if (farmerId !== demoFarmer) finished.push({ kind: "job", id: jobId, role: "builder", farmerId, providerId: b.id, finishedAt: doneAt, label, quality });
    }
  }

  // ---------------------------------------------------------------------------------------------------------------
  // Hatcheries: past batches with released reservations (through the reservation machine)
  // ---------------------------------------------------------------------------------------------------------------
  const hatcheryRows = await db
    .select({ id: core.hatchery.userId, name: core.profile.displayName, species: core.hatchery.species, state: core.profile.verificationState })
    .from(core.hatchery)
    .innerJoin(core.profile, eq(core.profile.userId, core.hatchery.userId));
  const demoHatchery = idOf(demo.hatchery);
  const hatcheries = hatcheryRows.filter((h) => h.state === "verified").sort((a, b) => (a.id === demoHatchery ? -1 : b.id === demoHatchery ? 1 : a.name.localeCompare(b.name)));
  let reservationCount = 0;
  for (const [i, h] of hatcheries.slice(0, HATCHERY_RESERVATIONS.length).entries()) {
    const n = HATCHERY_RESERVATIONS[i] ?? 0;
    const species: Species = h.species[0] ?? "tilapia";
    const priceMinor = species === "tilapia" ? 150 : 250;
    const quality = i === 2 ? 0.6 : 0.8 + rand() * 0.17;
    const plans = Array.from({ length: n }, (_, k) => ({ count: (2 + Math.floor(rand() * 6)) * 100, farmerId: farmerAt(i * 5 + k * 2 + 1), releasedDaysAgo: 10 + Math.floor(rand() * 150) }));
    const sold = plans.reduce((s, p) => s + p.count, 0);
    const batchId = randomUUID();
    const oldest = Math.max(...plans.map((p) => p.releasedDaysAgo)) + 20;
    // A past batch, sold out as far as these reservations go and then closed: the stock left is what nobody took.
    rows.batches.push({ id: batchId, hatcheryId: h.id, species, meanWeightG: 5, meanLengthCm: 6, countTotal: sold + 250, countAvailable: 250, priceMinor, currency: "ZMW", readyFrom: ago(oldest), sellBy: ago(oldest - 60), delivery: "pickup", state: "closed", createdAt: ago(oldest + 5) });
    for (const p of plans) {
      const id = randomUUID();
      const releasedAt = ago(p.releasedDaysAgo);
      const handedAt = new Date(releasedAt.getTime() - 8 * DAY);
      const requestedAt = new Date(handedAt.getTime() - (5 + rand() * 5) * DAY);
      const answeredAt = new Date(requestedAt.getTime() + (i === 2 ? 20 + rand() * 24 : 1 + rand() * 10) * HOUR);
      const paidAt = new Date(answeredAt.getTime() + 3 * HOUR);
      const farmer: ReservationActor = { role: "farmer", userId: p.farmerId };
      const hatchery: ReservationActor = { role: "hatchery", userId: h.id };
      const first = requestReservation({ farmerId: p.farmerId, hatcheryId: h.id, count: p.count, availableCount: p.count, pricePerFishMinor: priceMinor, currency: "ZMW" }, { actor: farmer, now: requestedAt });
      if (!first.ok) continue;
      const handedOver = p.count - (rand() < 0.3 ? 10 : 0);
      const survived = Math.round(handedOver * (quality > 0.7 ? 0.9 + rand() * 0.09 : 0.7 + rand() * 0.15));
      const steps: { event: ReservationEvent; actor: ReservationActor; at: Date }[] = [
        { event: { type: "accept" }, actor: hatchery, at: answeredAt },
        { event: { type: "pay_deposit", heldMinor: first.next.depositMinor, currency: "ZMW" }, actor: farmer, at: paidAt },
        { event: { type: "hand_over", count: handedOver }, actor: hatchery, at: handedAt },
        { event: { type: "report_survival", survived }, actor: farmer, at: releasedAt },
      ];
      let r: Reservation = first.next;
      rows.history.push({ reservationId: id, fromState: null, toState: "requested", event: "request", actorId: p.farmerId, actorRole: "farmer", at: requestedAt, detail: { count: p.count } });
      let releaseMinor = 0;
      for (const step of steps) {
        const t = transition(r, step.event, { actor: step.actor, now: step.at });
        if (!t.ok) throw new Error(`seed reservation: ${t.message}`);
        for (const e of t.effects) if (e.kind === "hold" && e.event.type === "release") releaseMinor = e.event.amountMinor;
        const detail = step.event.type === "hand_over" ? { count: step.event.count } : step.event.type === "report_survival" ? { survived: step.event.survived } : {};
        rows.history.push({ reservationId: id, fromState: r.state, toState: t.next.state, event: step.event.type, actorId: step.actor.role === "system" ? null : step.actor.userId, actorRole: step.actor.role, at: step.at, detail });
        r = t.next;
      }
      if (releaseMinor === 0) continue;
      releasedHold(rows, { type: "reservation", id, payerId: p.farmerId, payeeId: h.id }, r.depositMinor, releaseMinor, paidAt, releasedAt, "farmer");
      rows.reservations.push({
        id, batchId, farmerId: p.farmerId, hatcheryId: h.id, state: r.state, count: p.count, species, meanWeightG: 5, meanLengthCm: 6, pricePerFishMinor: priceMinor, currency: "ZMW", totalMinor: p.count * priceMinor, depositMinor: r.depositMinor, handoverMethod: "pickup",
        requestedAt, acceptedAt: r.acceptedAt, depositHeldAt: r.depositHeldAt, handedOverAt: r.handedOverAt, handedOverCount: r.handedOverCount, survivedCount: r.survivedCount, closedAt: releasedAt, version: steps.length, createdAt: requestedAt, updatedAt: releasedAt,
      });
      reservationCount++;
      finished.push({ kind: "reservation", id, role: "hatchery", farmerId: p.farmerId, providerId: h.id, finishedAt: releasedAt, label: `${SPECIES_LABEL[species]} · ${handedOver.toLocaleString("en")} fingerlings`, quality });
    }
  }

  // ---------------------------------------------------------------------------------------------------------------
  // Reviews, replies, helpful marks and one report
  // ---------------------------------------------------------------------------------------------------------------
  const byProvider = new Map<string, Finished[]>();
  for (const f of finished) byProvider.set(`${f.providerId}:${f.role}`, [...(byProvider.get(`${f.providerId}:${f.role}`) ?? []), f]);
  const toReview: Finished[] = [];
  for (const list of byProvider.values()) {
    const shuffled = list.map((f) => ({ f, key: rand() })).sort((a, b) => a.key - b.key);
    toReview.push(...shuffled.slice(0, Math.round(list.length * REVIEW_SHARE)).map((x) => x.f));
  }
  for (const f of toReview) {
    const stars = starsFor(f.quality, rand);
    const a = aspectsFor(f.role, stars, rand);
    const createdAt = new Date(f.finishedAt.getTime() + (0.2 + rand() * 4) * DAY);
    const reviewId = randomUUID();
    rows.reviews.push({
      id: reviewId, subjectKind: f.kind, subjectId: f.id, role: f.role, authorId: f.farmerId, providerId: f.providerId, stars,
      workmanship: a.workmanship ?? null, timeliness: a.timeliness ?? null, communication: a.communication ?? null, fishHealth: a.fish_health ?? null, countAsPromised: a.count_as_promised ?? null, sizeAsPromised: a.size_as_promised ?? null,
      body: bodyFor(f.role, stars, rand), subjectLabel: f.label, createdAt, updatedAt: createdAt,
    });
    if (rand() < 0.3) rows.replies.push({ id: randomUUID(), reviewId, authorId: f.providerId, body: pick(REPLIES, rand), createdAt: new Date(createdAt.getTime() + (2 + rand() * 40) * HOUR) });
    if (rand() < 0.35) {
      const voters = new Set<string>();
      const wanted = 1 + Math.floor(rand() * 4);
      for (let v = 0; v < wanted * 3 && voters.size < wanted; v++) {
        const voter = farmerAt(Math.floor(rand() * farmers.length));
        if (voter !== f.farmerId) voters.add(voter);
      }
      for (const userId of voters) rows.helpful.push({ reviewId, userId, createdAt: new Date(createdAt.getTime() + DAY) });
      const last = rows.reviews.at(-1);
      if (last) last.helpfulCount = voters.size;
    }
  }
  // One low review reported by the provider it is about, waiting for an admin: the moderation queue's demo.
  const reported = rows.reviews.find((r) => r.stars <= 2 && !rows.replies.some((p) => p.reviewId === r.id)) ?? rows.reviews.find((r) => r.stars <= 3);
  if (reported) {
    rows.reports.push({ id: randomUUID(), reviewId: reported.id, reporterId: reported.providerId, reason: "false", details: "We have no record of a short count on this order; the fish were counted in front of the customer.", createdAt: ago(1) });
  }

  await db.transaction(async (tx) => {
    const chunked = async <T>(values: T[], insert: (part: T[]) => Promise<unknown>) => {
      for (let i = 0; i < values.length; i += 200) await insert(values.slice(i, i + 200));
    };
    await chunked(rows.requests, (v) => tx.insert(jobs.tankRequest).values(v));
    await chunked(rows.quotes, (v) => tx.insert(jobs.quote).values(v));
    await chunked(rows.versions, (v) => tx.insert(jobs.quoteVersion).values(v));
    await chunked(rows.lines, (v) => tx.insert(jobs.quoteLine).values(v));
    await chunked(rows.jobs, (v) => tx.insert(jobs.job).values(v));
    await chunked(rows.jobEvents, (v) => tx.insert(jobs.jobEvent).values(v));
    await chunked(rows.batches, (v) => tx.insert(core.batch).values(v));
    await chunked(rows.reservations, (v) => tx.insert(money.reservation).values(v));
    await chunked(rows.history, (v) => tx.insert(money.reservationHistory).values(v));
    await chunked(rows.holds, (v) => tx.insert(money.depositHold).values(v));
    await chunked(rows.holdHistory, (v) => tx.insert(money.holdHistory).values(v));
    await chunked(rows.ledger, (v) => tx.insert(money.ledgerEntry).values(v));
    await chunked(rows.reviews, (v) => tx.insert(reviews.review).values(v));
    await chunked(rows.replies, (v) => tx.insert(reviews.reviewReply).values(v));
    await chunked(rows.helpful, (v) => tx.insert(reviews.reviewHelpful).values(v));
    await chunked(rows.reports, (v) => tx.insert(reviews.reviewReport).values(v));
    // Trust for every provider, now that its record exists (score and badge on the listing rows).
    for (const id of providerIds) await refreshListings(tx, id);
  });

  const perProvider = new Map<string, number>();
  for (const r of rows.reviews) perProvider.set(`${r.providerId}:${r.role}`, (perProvider.get(`${r.providerId}:${r.role}`) ?? 0) + 1);
  const listings = await db.select({ isNew: core.listing.trustIsNew }).from(core.listing);
  const rated = listings.filter((l) => !l.isNew).length;
  return `seeded ${jobCount} completed jobs, ${reservationCount} released reservations and ${rows.reviews.length} reviews (${rows.replies.length} replies, ${rows.helpful.length} helpful marks, ${rows.reports.length} report waiting); ${rated} provider listings show a rating, ${listings.length - rated} show "new"`;
}
