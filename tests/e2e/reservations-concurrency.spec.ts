import { expect, request as newRequest, test } from "@playwright/test";
import { E2E_BASE_URL } from "./ports";
import { DEMO } from "./support";
import { apiAs, e2eDatabase, postBatch } from "./reservation-support";
import { seededAccounts } from "./seeded-accounts";

// Issue 4: "200 concurrent reservations against one batch of 150 fish over HTTP: exactly 150 fish reserved in
// total, no batch below zero, every refused request told why." The requests go to the running production build
// all at once (Promise.all), each with its own Idempotency-Key, from ten signed-in farmers (20 each). Then every
// reservation is cancelled twice at once, to show the stock comes back exactly once.
//
// Why ten farmers and not one: since issue 8 an account may make at most 30 reservations in 10 minutes
// (RATE_LIMITS.reservationCreate in lib/api/rate-limit.ts), which no farmer filling in the form comes near but 200
// from one account would cross. The race being tested is between requests for the same fish, whoever sends them;
// ten accounts × 20 keeps it whole and stays under the limit, which the end of the test checks was counted.
const FARMERS = 10;
const PER_FARMER = 20;

test("200 reservations at once for a batch of 150: exactly 150 taken, none below zero, each refusal says why", async () => {
  // Eleven sign-ins, 200 reservations and 300 cancels: on a loaded 2-core machine that alone can pass a minute.
  test.setTimeout(180_000);
  const hatchery = await apiAs(DEMO.hatchery);
  // Seeded farmers no other spec uses (the fuzz spec takes the first ones).
  const farmers: Awaited<ReturnType<typeof apiAs>>[] = [];
  for (const email of await seededAccounts("farmer", FARMERS, 5)) farmers.push(await apiAs(email));
  const batchId = await postBatch(hatchery.ctx, 150, "2.5");
  const farmerOf = (i: number) => farmers[i % FARMERS];

  const started = Date.now();
  const answers = await Promise.all(
    Array.from({ length: FARMERS * PER_FARMER }, async (_, i) => {
      const r = await farmerOf(i)?.ctx.post("/api/v1/reservations", { data: { batchId, count: 1, handoverMethod: "pickup" }, headers: { "idempotency-key": `concurrency-${batchId}-${i}` } });
      if (!r) throw new Error("no farmer");
      return { farmer: i % FARMERS, status: r.status(), body: (await r.json()) as { reservation?: { id: string; count: number }; error?: { code: string; message: string } } };
    }),
  );
  const elapsedMs = Date.now() - started;
  const taken = answers.filter((a) => a.status === 201);
  const refused = answers.filter((a) => a.status !== 201);
  test.info().annotations.push({ type: "figures", description: `200 requests in ${elapsedMs} ms: ${taken.length} taken, ${refused.length} refused` });
  console.log(`[concurrency] 200 requests in ${elapsedMs} ms: ${taken.length} reserved, ${refused.length} refused`);

  expect(taken.reduce((sum, a) => sum + (a.body.reservation?.count ?? 0), 0)).toBe(150);
  expect(new Set(taken.map((a) => a.body.reservation?.id)).size).toBe(150);
  expect(refused).toHaveLength(50);
  for (const a of refused) {
    expect(a.status).toBe(409);
    expect(a.body.error?.code).toBe("not_enough_stock");
    expect(a.body.error?.message).toMatch(/^Only 0 fish are available, not 1$/);
  }

  const batch = (await (await hatchery.ctx.get(`/api/v1/batches/${batchId}`)).json()) as { batch: { countAvailable: number } };
  expect(batch.batch.countAvailable).toBe(0);
  const own = (await (await hatchery.ctx.get("/api/v1/batches")).json()) as { batches: { id: string; countAvailable: number; countReserved: number }[] };
  expect(own.batches.every((b) => b.countAvailable >= 0)).toBe(true);
  expect(own.batches.find((b) => b.id === batchId)).toMatchObject({ countAvailable: 0, countReserved: 150 });
  const listed = (await (await hatchery.ctx.get(`/api/v1/reservations?as=hatchery&batchId=${batchId}&pageSize=100`)).json()) as { total: number };
  expect(listed.total).toBe(150);

  // A retried request (same key, same body) gets the first answer again and takes nothing more.
  const first = answers.findIndex((a) => a.status === 201);
  const replay = await farmerOf(first)?.ctx.post("/api/v1/reservations", { data: { batchId, count: 1, handoverMethod: "pickup" }, headers: { "idempotency-key": `concurrency-${batchId}-${first}` } });
  if (!replay) throw new Error("no farmer");
  expect(replay.status()).toBe(201);
  expect(replay.headers()["idempotent-replayed"]).toBe("true");
  expect(((await replay.json()) as { reservation: { id: string } }).reservation.id).toBe(answers[first]?.body.reservation?.id);
  const after = (await (await hatchery.ctx.get(`/api/v1/reservations?as=hatchery&batchId=${batchId}&pageSize=100`)).json()) as { total: number };
  expect(after.total).toBe(150);

  // The farmers cancel all 150, each cancel sent twice at the same moment (300 requests): each reservation is
  // cancelled once, the other request is refused, and the batch gets its 150 fish back exactly once.
  // (Fresh contexts with the same cookies: the first ones' keep-alive sockets may have been closed by the server while idle.)
  const again = await Promise.all(
    farmers.map(async (f) => newRequest.newContext({ baseURL: E2E_BASE_URL, extraHTTPHeaders: { origin: E2E_BASE_URL }, storageState: await f.ctx.storageState() })),
  );
  const cancelStarted = Date.now();
  const cancels = await Promise.all(
    [...taken, ...taken].map(async (a) => {
      const id = a.body.reservation?.id ?? "";
      const ctx = again[a.farmer];
      if (!ctx) throw new Error("no farmer");
      const r = await ctx.post(`/api/v1/reservations/${id}/actions`, { data: { action: "cancel" } });
      return { id, status: r.status(), code: r.ok() ? null : ((await r.json()) as { error: { code: string } }).error.code };
    }),
  );
  console.log(`[concurrency] 300 cancels of 150 reservations in ${Date.now() - cancelStarted} ms`);
  expect(cancels.filter((c) => c.status === 200)).toHaveLength(150);
  expect(new Set(cancels.filter((c) => c.status === 200).map((c) => c.id)).size).toBe(150);
  for (const c of cancels.filter((x) => x.status !== 200)) {
    expect(c.status).toBe(409);
    expect(["illegal_transition", "conflict"]).toContain(c.code);
  }
  const restored = (await (await hatchery.ctx.get(`/api/v1/batches/${batchId}`)).json()) as { batch: { countAvailable: number } };
  expect(restored.batch.countAvailable).toBe(150);

  // The limiter saw every one of those requests: 20 per farmer, 21 for the one that also sent the replay.
  const db = e2eDatabase();
  try {
    const counted = await db.execute({
      sql: `select key, count from api_rate_limit where key in (${farmers.map(() => "?").join(",")})`,
      args: farmers.map((f) => `reservation:create:${f.id}`),
    });
    const byKey = new Map(counted.rows.map((r) => [String(r.key), Number(r.count)]));
    farmers.forEach((f, i) => expect(byKey.get(`reservation:create:${f.id}`), `farmer ${i}`).toBe(PER_FARMER + (i === first % FARMERS ? 1 : 0)));
  } finally {
    db.close();
  }

  await hatchery.ctx.dispose();
  for (const f of farmers) await f.ctx.dispose();
  for (const ctx of again) await ctx.dispose();
});
