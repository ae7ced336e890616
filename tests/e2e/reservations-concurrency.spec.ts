import { expect, test } from "@playwright/test";
import { DEMO } from "./support";
import { apiAs, postBatch } from "./reservation-support";

// Issue 4: "200 concurrent reservations against one batch of 150 fish over HTTP: exactly 150 fish reserved in
// total, no batch below zero, every refused request told why." The requests go to the running production build
// all at once (Promise.all), each with its own Idempotency-Key, from one signed-in farmer. Then every reservation
// is cancelled twice at once, to show the stock comes back exactly once.
test("200 reservations at once for a batch of 150: exactly 150 taken, none below zero, each refusal says why", async () => {
  const hatchery = await apiAs(DEMO.hatchery);
  const farmer = await apiAs(DEMO.farmer);
  const batchId = await postBatch(hatchery.ctx, 150, "2.5");

  const started = Date.now();
  const answers = await Promise.all(
    Array.from({ length: 200 }, async (_, i) => {
      const r = await farmer.ctx.post("/api/v1/reservations", { data: { batchId, count: 1, handoverMethod: "pickup" }, headers: { "idempotency-key": `concurrency-${batchId}-${i}` } });
      return { status: r.status(), body: (await r.json()) as { reservation?: { id: string; count: number }; error?: { code: string; message: string } } };
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

  const batch = (await (await farmer.ctx.get(`/api/v1/batches/${batchId}`)).json()) as { batch: { countAvailable: number } };
  expect(batch.batch.countAvailable).toBe(0);
  const own = (await (await hatchery.ctx.get("/api/v1/batches")).json()) as { batches: { id: string; countAvailable: number; countReserved: number }[] };
  expect(own.batches.every((b) => b.countAvailable >= 0)).toBe(true);
  expect(own.batches.find((b) => b.id === batchId)).toMatchObject({ countAvailable: 0, countReserved: 150 });
  const listed = (await (await hatchery.ctx.get(`/api/v1/reservations?as=hatchery&batchId=${batchId}&pageSize=100`)).json()) as { total: number };
  expect(listed.total).toBe(150);

  // A retried request (same key, same body) gets the first answer again and takes nothing more.
  const first = answers.findIndex((a) => a.status === 201);
  const replay = await farmer.ctx.post("/api/v1/reservations", { data: { batchId, count: 1, handoverMethod: "pickup" }, headers: { "idempotency-key": `concurrency-${batchId}-${first}` } });
  expect(replay.status()).toBe(201);
  expect(replay.headers()["idempotent-replayed"]).toBe("true");
  expect(((await replay.json()) as { reservation: { id: string } }).reservation.id).toBe(answers[first]?.body.reservation?.id);
  const after = (await (await hatchery.ctx.get(`/api/v1/reservations?as=hatchery&batchId=${batchId}&pageSize=100`)).json()) as { total: number };
  expect(after.total).toBe(150);

  // The farmer cancels all 150, each cancel sent twice at the same moment (300 requests): each reservation is
  // cancelled once, the other request is refused, and the batch gets its 150 fish back exactly once.
  // (A fresh context: the first one's keep-alive sockets may have been closed by the server while idle.)
  const again = await apiAs(DEMO.farmer);
  const ids = taken.map((a) => a.body.reservation?.id ?? "");
  const cancelStarted = Date.now();
  const cancels = await Promise.all(
    [...ids, ...ids].map(async (id) => {
      const r = await again.ctx.post(`/api/v1/reservations/${id}/actions`, { data: { action: "cancel" } });
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
  const restored = (await (await farmer.ctx.get(`/api/v1/batches/${batchId}`)).json()) as { batch: { countAvailable: number } };
  expect(restored.batch.countAvailable).toBe(150);

  await hatchery.ctx.dispose();
  await farmer.ctx.dispose();
  await again.ctx.dispose();
});
