import { randomUUID } from "node:crypto";
import type { Account, SeededBatch } from "./accounts";
import { openDb } from "./db-state";

// Reviewable reservations for the review writes of the mixed load. A farmer may review a reservation once it is
// released, a week after hand-over, so each one is taken through the API (create → accept → pay → hand over →
// report survival) with the week made to pass in between by moving the hand-over's clock back in the database:
// the same fixture as the end-to-end tests' backdateHandOver (tests/e2e/reservation-support.ts), not an app feature.

export interface ReviewSubject {
  farmer: Account;
  reservationId: string;
}

async function post(base: string, path: string, cookie: string, body: unknown, key?: string): Promise<{ status: number; body: unknown }> {
  const res = await fetch(`${base}${path}`, {
    method: "POST",
    headers: { origin: base, cookie, "content-type": "application/json", ...(key ? { "idempotency-key": key } : {}) },
    body: JSON.stringify(body),
    signal: AbortSignal.timeout(30_000),
  });
  return { status: res.status, body: await res.json() };
}

function idOf(body: unknown): string {
  if (typeof body === "object" && body !== null && "reservation" in body && typeof body.reservation === "object" && body.reservation !== null && "id" in body.reservation) return String(body.reservation.id);
  throw new Error(`no reservation in ${JSON.stringify(body).slice(0, 200)}`);
}

async function expectStatus(what: string, answer: Promise<{ status: number; body: unknown }>, status: number): Promise<unknown> {
  const a = await answer;
  if (a.status !== status) throw new Error(`preparing review subjects: ${what} answered ${a.status} ${JSON.stringify(a.body).slice(0, 200)}`);
  return a.body;
}

/** `perFarmer` released reservations for each farmer, from the hatcheries' batches; four at a time. */
export async function prepareReleasedReservations(base: string, dbUrl: string, farmers: readonly Account[], hatcheries: readonly Account[], batches: readonly SeededBatch[], perFarmer: number): Promise<ReviewSubject[]> {
  const jobs = farmers.flatMap((farmer, i) => Array.from({ length: perFarmer }, (_, k) => ({ farmer, batch: batches[(i * perFarmer + k) % batches.length] })));
  const out: ReviewSubject[] = [];
  const handedOver: ReviewSubject[] = [];
  const queue = [...jobs];
  const run = async () => {
    for (let job = queue.shift(); job; job = queue.shift()) {
      const { farmer, batch } = job;
      if (!batch) throw new Error("no batch for review subjects");
      const hatchery = hatcheries.find((h) => h.id === batch.hatcheryId);
      if (!hatchery) throw new Error(`no signed-in hatchery for batch ${batch.id}`);
      const id = idOf(await expectStatus("create", post(base, "/api/v1/reservations", farmer.cookie, { batchId: batch.id, count: 10, handoverMethod: batch.handoverMethod }, `review-subject-${randomUUID()}`), 201));
      await expectStatus("accept", post(base, `/api/v1/reservations/${id}/actions`, hatchery.cookie, { action: "accept" }), 200);
      await expectStatus("pay", post(base, `/api/v1/reservations/${id}/pay`, farmer.cookie, { paymentMethod: "pm_card_visa" }, `review-pay-${randomUUID()}`), 200);
      await expectStatus("hand over", post(base, `/api/v1/reservations/${id}/actions`, hatchery.cookie, { action: "hand_over", count: 10 }), 200);
      handedOver.push({ farmer, reservationId: id });
    }
  };
  await Promise.all(Array.from({ length: 4 }, run));
  // A week and a day later (the quarantine week: lib/reservations/parameters.ts quarantineDays).
  const db = openDb(dbUrl);
  const shift = 8 * 86_400_000;
  try {
    for (const s of handedOver) {
      await db.execute({ sql: "update reservation set handed_over_at = handed_over_at - ?, remind_at = remind_at - ?, auto_release_at = auto_release_at - ? where id = ?", args: [shift, shift, shift, s.reservationId] });
    }
  } finally {
    db.close();
  }
  for (const s of handedOver) {
    await expectStatus("report survival", post(base, `/api/v1/reservations/${s.reservationId}/actions`, s.farmer.cookie, { action: "report_survival", survived: 9 }), 200);
    out.push(s);
  }
  return out;
}
