import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { addPerson, startReservationWorld, type ReservationWorld } from "../support/reservation-world";

// A process killed after a reservation committed but before its API answer was stored leaves the Idempotency-Key
// claimed with no answer. The retry must neither hang on "still being processed" for ever nor take the fish twice:
// once the claim is stale, one retry takes it over and re-runs, and the re-run finds the reservation the first
// attempt wrote (its id is derived from the key). Counts are worked by hand beside each check.

let world: ReservationWorld;
let db: typeof import("@/db/client").db;
let schema: typeof import("@/db/schema");
let tables: typeof import("@/db/schema-reservations");
let service: typeof import("@/lib/reservations/service");
let batches: typeof import("@/lib/reservations/batches");
let validations: typeof import("@/lib/validations/reservations");
let idem: typeof import("@/lib/api/idempotency");
let orm: typeof import("drizzle-orm");

beforeAll(async () => {
  world = await startReservationWorld();
  ({ db } = await import("@/db/client"));
  schema = await import("@/db/schema");
  tables = await import("@/db/schema-reservations");
  service = await import("@/lib/reservations/service");
  batches = await import("@/lib/reservations/batches");
  validations = await import("@/lib/validations/reservations");
  idem = await import("@/lib/api/idempotency");
  orm = await import("drizzle-orm");
});
afterAll(async () => world.close());

const SCOPE = "reservations:create";
const T0 = new Date();
const day = (d: number) => new Date(T0.getTime() + d * 86_400_000).toISOString().slice(0, 10);

async function setting(count: number) {
  const hatchery = await addPerson(db, ["hatchery"], "Hatchery");
  const farmer = await addPerson(db, ["farmer"], "Farmer");
  const values = validations.batchFormSchema.parse({ species: "tilapia", meanWeightG: "5", meanLengthCm: "6", countAvailable: String(count), pricePerFish: "1.00", currency: "ZMW", readyFrom: day(0), sellBy: day(30), delivery: "both" });
  const b = await batches.createBatch(hatchery, values, T0);
  return { farmer, batchId: b.id };
}

async function available(batchId: string): Promise<number> {
  return (await db.select({ n: schema.batch.countAvailable }).from(schema.batch).where(orm.eq(schema.batch.id, batchId)))[0]?.n ?? Number.NaN;
}

function requestWith(key: string): Request {
  return new Request("http://127.0.0.1/api/v1/reservations", { method: "POST", headers: { "idempotency-key": key } });
}

/** The route's own call (the reservation's id comes from the key); a refusal thrown for withApi becomes its status. */
async function createVia(farmer: { id: string; roles: ("farmer" | "hatchery" | "admin")[] }, key: string, body: { batchId: string; count: number; handoverMethod: "pickup" }, now: Date): Promise<Response> {
  try {
    return await idem.withIdempotency(requestWith(key), farmer.id, SCOPE, body, async ({ stableId }) => ({ status: 201, body: { id: (await service.createReservation(farmer, body, now, { id: stableId })).id } }), now);
  } catch (error) {
    const status = (error as { status?: number }).status;
    if (typeof status !== "number") throw error;
    return Response.json({ error: (error as Error).message }, { status });
  }
}

/** What a kill -9 between the commit and the stored answer leaves behind: a claim without an answer. */
async function leaveUnansweredClaim(userId: string, key: string, body: unknown, at: Date) {
  const { createHash } = await import("node:crypto");
  const requestHash = createHash("sha256").update(JSON.stringify(body)).digest("hex");
  await db.insert(tables.apiIdempotencyKey).values({ userId, scope: SCOPE, key, requestHash, createdAt: at });
}

describe("an Idempotency-Key left claimed by a killed process", () => {
  it("derives a stable UUID-shaped id per user, scope and key", () => {
    const a = idem.stableIdFor("u1", SCOPE, "key-0001");
    expect(a).toMatch(/^[0-9a-f]{8}-[0-9a-f]{4}-8[0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/); // RFC 9562 §5.8 layout
    expect(idem.stableIdFor("u1", SCOPE, "key-0001")).toBe(a);
    expect(idem.stableIdFor("u2", SCOPE, "key-0001")).not.toBe(a);
    expect(idem.stableIdFor("u1", SCOPE, "key-0002")).not.toBe(a);
  });

  it("answers 409 while the claim is fresh, then lets one retry take it over and finds the reservation already written", async () => {
    const { farmer, batchId } = await setting(100);
    const key = `takeover-${batchId}`;
    const body = { batchId, count: 30, handoverMethod: "pickup" as const };
    // The first attempt committed its reservation (id from the key) and died before storing the answer.
    await service.createReservation(farmer, body, T0, { id: idem.stableIdFor(farmer.id, SCOPE, key) });
    await leaveUnansweredClaim(farmer.id, key, body, T0);
    expect(await available(batchId)).toBe(70); // 100 − 30

    const soon = new Date(T0.getTime() + idem.STALE_CLAIM_MS - 1);
    expect((await createVia(farmer, key, body, soon)).status).toBe(409);

    const later = new Date(T0.getTime() + idem.STALE_CLAIM_MS);
    const [first, second] = await Promise.all([createVia(farmer, key, body, later), createVia(farmer, key, body, later)]);
    const statuses = [first.status, second.status].sort();
    expect(statuses).toEqual([201, 409]); // one takes the claim over, the other is told to wait
    const winner = first.status === 201 ? first : second;
    expect(((await winner.json()) as { id: string }).id).toBe(idem.stableIdFor(farmer.id, SCOPE, key));
    expect(await available(batchId)).toBe(70); // nothing taken twice
    const rows = await db.select().from(tables.reservation).where(orm.eq(tables.reservation.batchId, batchId));
    expect(rows).toHaveLength(1);

    // And now the answer is stored: the next retry replays it.
    const replay = await createVia(farmer, key, body, new Date(later.getTime() + 1));
    expect(replay.status).toBe(201);
    expect(replay.headers.get("idempotent-replayed")).toBe("true");
  });

  it("re-runs for real when the killed attempt wrote nothing", async () => {
    const { farmer, batchId } = await setting(50);
    const key = `takeover-empty-${batchId}`;
    const body = { batchId, count: 20, handoverMethod: "pickup" as const };
    await leaveUnansweredClaim(farmer.id, key, body, T0);
    const r = await createVia(farmer, key, body, new Date(T0.getTime() + idem.STALE_CLAIM_MS + 5_000));
    expect(r.status).toBe(201);
    expect(await available(batchId)).toBe(30); // 50 − 20, taken once
  });

  it("refuses a derived id that belongs to another request's reservation", async () => {
    const { farmer, batchId } = await setting(50);
    const id = idem.stableIdFor(farmer.id, SCOPE, `other-${batchId}`);
    await service.createReservation(farmer, { batchId, count: 5, handoverMethod: "pickup" }, T0, { id });
    await expect(service.createReservation(farmer, { batchId, count: 6, handoverMethod: "pickup" }, T0, { id })).rejects.toMatchObject({ status: 409 });
    expect(await available(batchId)).toBe(45); // 50 − 5
  });
});
