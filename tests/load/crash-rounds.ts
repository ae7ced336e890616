import { randomUUID } from "node:crypto";
import { STALE_CLAIM_MS } from "../../lib/api/stale-claim";
import { acknowledgementProblems, type Acknowledgement, type AcknowledgedStep, type FoundReservation, type ProcessorRecord } from "../../lib/ops/invariants";
import type { Account, SeededBatch } from "./accounts";
import { checkDatabase, openDb, type DbState, type Verdict } from "./db-state";
import type { AppServer } from "./server";

// Crash rounds: workers take reservations through create → accept → pay the deposit (through the payments stand-in
// and its webhooks) → sometimes cancel, and record every step the server acknowledged. At a random moment mid-load
// the server's whole process group gets SIGKILL. Then: the file is checked as the crash left it (PRAGMA
// integrity_check, stock, ledger, every acknowledged step present), the server restarts on the same file, every
// acknowledged create and payment is retried with its Idempotency-Key (it must answer the first answer again and
// take nothing twice), the sweep runs, and everything is checked again.

export interface CrashWorld {
  server: AppServer;
  dbUrl: string;
  farmers: readonly Account[];
  hatcheries: readonly Account[];
  batches: readonly SeededBatch[];
  rand: () => number;
  cronSecret: string;
  /** every acknowledged reservation so far (the mixed load's too), checked after every round */
  acks: Map<string, Acknowledgement>;
  workers: number;
}

type Outcome = { kind: "answer"; status: number; body: unknown; replayed: boolean } | { kind: "not_delivered" } | { kind: "in_doubt"; error: string };

interface StepTally {
  sent: number;
  acknowledged: number;
  refused: number;
  inDoubt: number;
  notDelivered: number;
  unexpected: string[];
}

interface Flow {
  farmer: Account;
  hatchery: Account;
  batch: SeededBatch;
  count: number;
  createKey: string;
  createBody: string;
  payKey: string;
  payBody: string;
  reservationId: string | null;
  /** the create was sent and no answer came */
  createInDoubt: boolean;
  paid: boolean;
  payInDoubt: boolean;
}

export interface RoundFigures {
  round: number;
  killAfterS: number;
  killedPids: number[];
  steps: Record<AcknowledgedStep, StepTally>;
  acknowledgedThisRound: number;
  /** reservations of this round with at least one acknowledged step, and of those how many the database shows as the client saw them */
  roundReservations: { acknowledged: number; foundAfterCrash: number; foundAfterRestart: number };
  restartS: number;
  replays: { verified: number; refused: number; wrong: string[] };
  doubtful: { creates: number; committedLater: number; stuckKeys: number; stuckWritten: number; other: number };
  afterCrash: Verdict & { state: DbState };
  afterSweep: Verdict & { state: DbState };
  sweep: unknown;
}

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** One HTTP call; a refused connection never reached the server, any other failure leaves the request in doubt. */
async function call(base: string, method: "GET" | "POST", path: string, init: { cookie?: string; body?: string; key?: string; bearer?: string } = {}): Promise<Outcome> {
  const headers: Record<string, string> = { origin: base };
  if (init.cookie) headers.cookie = init.cookie;
  if (init.body !== undefined) headers["content-type"] = "application/json";
  if (init.key) headers["idempotency-key"] = init.key;
  if (init.bearer) headers.authorization = `Bearer ${init.bearer}`;
  try {
    const res = await fetch(`${base}${path}`, { method, headers, body: init.body, signal: AbortSignal.timeout(30_000) });
    const text = await res.text();
    let body: unknown = text;
    try {
      body = text ? JSON.parse(text) : null;
    } catch {
      // not JSON: keep the text
    }
    return { kind: "answer", status: res.status, body, replayed: res.headers.get("idempotent-replayed") === "true" };
  } catch (err) {
    const cause = err instanceof Error && err.cause instanceof Error ? err.cause : null;
    const code = cause && "code" in cause ? String(cause.code) : "";
    if (code === "ECONNREFUSED") return { kind: "not_delivered" };
    return { kind: "in_doubt", error: code || (err instanceof Error ? err.name : String(err)) };
  }
}

function reservationOf(body: unknown): { id: string; state: string } | null {
  if (typeof body !== "object" || body === null || !("reservation" in body)) return null;
  const r = body.reservation;
  if (typeof r !== "object" || r === null || !("id" in r) || !("state" in r)) return null;
  return { id: String(r.id), state: String(r.state) };
}

function emptySteps(): Record<AcknowledgedStep, StepTally> {
  const t = (): StepTally => ({ sent: 0, acknowledged: 0, refused: 0, inDoubt: 0, notDelivered: 0, unexpected: [] });
  return { created: t(), accepted: t(), paid: t(), cancelled: t() };
}

/** The processor's records of the holds it can be asked about (the stand-in speaks Stripe's API: GET a payment intent). */
export async function processorRecords(apiBase: string, secretKey: string, holds: readonly { id: string; processorHoldId: string | null }[]): Promise<Map<string, ProcessorRecord>> {
  const out = new Map<string, ProcessorRecord>();
  for (const h of holds) {
    if (!h.processorHoldId) continue;
    const res = await fetch(`${apiBase}/v1/payment_intents/${h.processorHoldId}?expand[]=latest_charge`, { headers: { authorization: `Bearer ${secretKey}` } });
    if (!res.ok) throw new Error(`the payments stand-in answered ${res.status} for ${h.processorHoldId}`);
    const intent = (await res.json()) as { amount_capturable: number; amount_received: number; latest_charge: { amount_refunded: number } | null };
    out.set(h.id, { amountCapturable: intent.amount_capturable, amountReceived: intent.amount_received, amountRefunded: intent.latest_charge?.amount_refunded ?? 0 });
  }
  return out;
}

export async function runCrashRound(world: CrashWorld, round: number): Promise<RoundFigures> {
  const { server, rand } = world;
  const base = server.base;
  const steps = emptySteps();
  const flows: Flow[] = [];
  let stopping = false;
  const pick = <T>(xs: readonly T[]): T => {
    const x = xs[Math.floor(rand() * xs.length)];
    if (x === undefined) throw new Error("nothing to pick from");
    return x;
  };

  /** Sends one step; tallies it; returns the answer or null when there was none. */
  async function step(name: AcknowledgedStep, flow: Flow, send: () => Promise<Outcome>, ok: number, refusals: readonly number[]): Promise<Extract<Outcome, { kind: "answer" }> | "in_doubt" | null> {
    // Think time between a worker's requests: keeps each farmer's requests modest (reservation creates are limited
    // per account, lib/api/rate-limit.ts) however fast the server answers, so the kill still lands mid-load.
    await sleep(100 + rand() * 300);
    if (stopping) return null;
    const t = steps[name];
    t.sent += 1;
    const out = await send();
    if (out.kind === "not_delivered") {
      t.notDelivered += 1;
      return null;
    }
    if (out.kind === "in_doubt") {
      t.inDoubt += 1;
      const ack = flow.reservationId ? world.acks.get(flow.reservationId) : undefined;
      if (ack) ack.inDoubt = name;
      return "in_doubt";
    }
    if (out.status === ok) t.acknowledged += 1;
    else if (refusals.includes(out.status)) t.refused += 1;
    else t.unexpected.push(`${name} answered ${out.status}: ${JSON.stringify(out.body).slice(0, 200)}`);
    return out;
  }

  async function worker(): Promise<void> {
    while (!stopping) {
      const batch = pick(world.batches);
      const hatchery = world.hatcheries.find((h) => h.id === batch.hatcheryId);
      if (!hatchery) throw new Error(`no signed-in hatchery for batch ${batch.id}`);
      const count = 1 + Math.floor(rand() * 20);
      const flow: Flow = {
        farmer: pick(world.farmers),
        hatchery,
        batch,
        count,
        createKey: `crash-${round}-${randomUUID()}`,
        createBody: JSON.stringify({ batchId: batch.id, count, handoverMethod: batch.handoverMethod }),
        payKey: `crash-pay-${round}-${randomUUID()}`,
        // One payment in ten uses the stand-in's declined test card: a 402 and a failed hold, never money held.
        payBody: JSON.stringify({ paymentMethod: rand() < 0.1 ? "pm_card_chargeDeclined" : "pm_card_visa" }),
        reservationId: null,
        createInDoubt: false,
        paid: false,
        payInDoubt: false,
      };
      flows.push(flow);
      const created = await step("created", flow, () => call(base, "POST", "/api/v1/reservations", { cookie: flow.farmer.cookie, body: flow.createBody, key: flow.createKey }), 201, [409, 429]);
      if (created === "in_doubt") flow.createInDoubt = true;
      if (!created || created === "in_doubt" || created.status !== 201) continue;
      const r = reservationOf(created.body);
      if (!r) {
        steps.created.unexpected.push(`create answered 201 without a reservation: ${JSON.stringify(created.body).slice(0, 200)}`);
        continue;
      }
      flow.reservationId = r.id;
      world.acks.set(r.id, { reservationId: r.id, farmerId: flow.farmer.id, batchId: batch.id, count, step: "created", inDoubt: null });
      const ack = world.acks.get(r.id);
      if (!ack) continue;

      const accepted = await step("accepted", flow, () => call(base, "POST", `/api/v1/reservations/${r.id}/actions`, { cookie: hatchery.cookie, body: JSON.stringify({ action: "accept" }) }), 200, [409, 429]);
      if (!accepted || accepted === "in_doubt" || accepted.status !== 200) continue;
      ack.step = "accepted";

      const paid = await step("paid", flow, () => call(base, "POST", `/api/v1/reservations/${r.id}/pay`, { cookie: flow.farmer.cookie, body: flow.payBody, key: flow.payKey }), 200, [402, 409, 429]);
      if (paid === "in_doubt") flow.payInDoubt = true;
      if (!paid || paid === "in_doubt" || paid.status !== 200) continue;
      if (reservationOf(paid.body)?.state !== "deposit_held") {
        steps.paid.unexpected.push(`pay answered 200 but the reservation is ${reservationOf(paid.body)?.state}`);
        continue;
      }
      ack.step = "paid";
      flow.paid = true;

      if (rand() < 0.3) {
        const cancelled = await step("cancelled", flow, () => call(base, "POST", `/api/v1/reservations/${r.id}/actions`, { cookie: flow.farmer.cookie, body: JSON.stringify({ action: "cancel" }) }), 200, [409, 429]);
        if (!cancelled || cancelled === "in_doubt" || cancelled.status !== 200) continue;
        ack.step = "cancelled";
      }
    }
  }

  const before = world.acks.size;
  const existing = await (async () => {
    const db = openDb(world.dbUrl);
    try {
      return new Set((await db.execute("select id from reservation")).rows.map((r) => String(r.id)));
    } finally {
      db.close();
    }
  })();
  const started = Date.now();
  const running = Array.from({ length: world.workers }, () => worker());
  // Kill at a random moment once the load is going: after at least three acknowledged payments (or 15 s), plus
  // a random 0.5–4 s more.
  while (steps.paid.acknowledged < 3 && Date.now() - started < 15_000) await sleep(50);
  await sleep(500 + rand() * 3_500);
  const killAfterS = (Date.now() - started) / 1000;
  stopping = true;
  const killedPids = await server.kill9();
  const killedAt = Date.now();
  const settled = await Promise.allSettled(running);
  for (const s of settled) if (s.status === "rejected") throw s.reason;

  // What the client saw succeed before the kill (retries after the restart add to the acknowledgements later).
  const roundIds = new Set(flows.flatMap((f) => (f.reservationId ? [f.reservationId] : [])));
  const afterCrash = await checkDatabase(world.dbUrl, [...world.acks.values()]);
  const restartS = await server.start();

  // Retries after the crash: an acknowledged create or payment answers its first answer again, marked replayed.
  const replays = { verified: 0, refused: 0, wrong: [] as string[] };
  const doubtful = { creates: 0, committedLater: 0, stuckKeys: 0, stuckWritten: 0, other: 0 };
  const stuck: Flow[] = [];
  for (const flow of flows) {
    if (flow.reservationId) {
      const again = await call(base, "POST", "/api/v1/reservations", { cookie: flow.farmer.cookie, body: flow.createBody, key: flow.createKey });
      if (again.kind !== "answer") replays.wrong.push(`retried create got no answer`);
      else if (again.status === 429) replays.refused += 1;
      else if (again.status === 201 && again.replayed && reservationOf(again.body)?.id === flow.reservationId) replays.verified += 1;
      else replays.wrong.push(`retried create of ${flow.reservationId} answered ${again.status}${again.replayed ? " (replayed)" : ""} ${JSON.stringify(again.body).slice(0, 160)}`);
    } else if (flow.createInDoubt) {
      // Cut off by the crash: the same key either runs now (nothing had been written), gives the answer it had,
      // or is stuck as "still being processed" (claimed, never finished: see the report).
      doubtful.creates += 1;
      const again = await call(base, "POST", "/api/v1/reservations", { cookie: flow.farmer.cookie, body: flow.createBody, key: flow.createKey });
      const r = again.kind === "answer" && again.status === 201 ? reservationOf(again.body) : null;
      if (r) {
        doubtful.committedLater += 1;
        flow.reservationId = r.id;
        world.acks.set(r.id, { reservationId: r.id, farmerId: flow.farmer.id, batchId: flow.batch.id, count: flow.count, step: "created", inDoubt: null });
      } else if (again.kind === "answer" && again.status === 409) {
        // Claimed by the killed process and never answered: retried below, once the claim is stale.
        stuck.push(flow);
      }
      else doubtful.other += 1;
    }
    if (flow.paid && flow.reservationId) {
      const again = await call(base, "POST", `/api/v1/reservations/${flow.reservationId}/pay`, { cookie: flow.farmer.cookie, body: flow.payBody, key: flow.payKey });
      if (again.kind !== "answer") replays.wrong.push(`retried payment got no answer`);
      else if (again.status === 429) replays.refused += 1;
      else if (again.status === 200 && again.replayed) replays.verified += 1;
      else replays.wrong.push(`retried payment of ${flow.reservationId} answered ${again.status}${again.replayed ? " (replayed)" : ""}`);
    }
  }

  // A claim left by the killed process is taken over once it is STALE_CLAIM_MS old (lib/api/idempotency.ts), and
  // the re-run finds the reservation if the first attempt had written it (its id comes from the key). After that
  // wait no key may still be stuck.
  if (stuck.length > 0) {
    await sleep(Math.max(0, STALE_CLAIM_MS + 1_000 - (Date.now() - killedAt)));
    for (const flow of stuck) {
      const again = await call(base, "POST", "/api/v1/reservations", { cookie: flow.farmer.cookie, body: flow.createBody, key: flow.createKey });
      const r = again.kind === "answer" && again.status === 201 ? reservationOf(again.body) : null;
      if (r) {
        doubtful.committedLater += 1;
        flow.reservationId = r.id;
        world.acks.set(r.id, { reservationId: r.id, farmerId: flow.farmer.id, batchId: flow.batch.id, count: flow.count, step: "created", inDoubt: null });
      } else {
        doubtful.stuckKeys += 1;
        replays.wrong.push(`a create cut off by the kill still answers ${again.kind === "answer" ? again.status : again.kind} after its claim went stale`);
      }
    }
  }
  const swept = await call(base, "POST", "/api/cron/sweep", { bearer: world.cronSecret });
  if (swept.kind !== "answer" || swept.status !== 200) throw new Error(`the sweep after restart failed: ${JSON.stringify(swept)}`);
  const afterSweep = await checkDatabase(world.dbUrl, [...world.acks.values()]);
  // A stuck key whose reservation was written anyway: an unacknowledged reservation of that farmer, batch and count.
  const unacknowledged = [...afterSweep.state.reservations.values()].filter((r) => !world.acks.has(r.id) && !existing.has(r.id));
  for (const flow of stuck) if (unacknowledged.some((r) => r.farmerId === flow.farmer.id && r.batchId === flow.batch.id && r.count === flow.count)) doubtful.stuckWritten += 1;
  const roundAcks = [...roundIds].map((id) => world.acks.get(id)).filter((a): a is Acknowledgement => a !== undefined);
  const missing = (found: ReadonlyMap<string, FoundReservation>) => new Set(acknowledgementProblems(roundAcks, found).map((p) => p.reservationId)).size;
  return {
    round,
    killAfterS,
    killedPids,
    steps,
    acknowledgedThisRound: world.acks.size - before,
    roundReservations: { acknowledged: roundAcks.length, foundAfterCrash: roundAcks.length - missing(afterCrash.state.reservations), foundAfterRestart: roundAcks.length - missing(afterSweep.state.reservations) },
    restartS,
    replays,
    doubtful,
    afterCrash,
    afterSweep,
    sweep: swept.body,
  };
}

/** One line per round and step; returns the failures. */
export function reportRound(f: RoundFigures): string[] {
  const failures: string[] = [];
  console.log(
    `\nCrash round ${f.round}: SIGKILL to process group [${f.killedPids.join(", ")}] ${f.killAfterS.toFixed(1)} s into the load; restarted in ${f.restartS.toFixed(1)} s on the same file`,
  );
  const acknowledgedRequests = Object.values(f.steps).reduce((n, t) => n + t.acknowledged, 0);
  const r = f.roundReservations;
  console.log(
    `acknowledged before the kill: ${acknowledgedRequests} requests on ${r.acknowledged} reservations; found as the client saw them: ${r.foundAfterCrash} in the file the crash left, ${r.foundAfterRestart} after restart and sweep; lost ${r.acknowledged - Math.min(r.foundAfterCrash, r.foundAfterRestart)}`,
  );
  if (r.foundAfterCrash !== r.acknowledged || r.foundAfterRestart !== r.acknowledged) failures.push(`round ${f.round}: ${r.acknowledged - Math.min(r.foundAfterCrash, r.foundAfterRestart)} acknowledged reservations lost or not as the client saw them`);
  console.log("step        sent  acknowledged  refused  in doubt  not delivered");
  for (const [name, t] of Object.entries(f.steps)) {
    console.log(`${name.padEnd(10)}  ${String(t.sent).padStart(4)}  ${String(t.acknowledged).padStart(12)}  ${String(t.refused).padStart(7)}  ${String(t.inDoubt).padStart(8)}  ${String(t.notDelivered).padStart(13)}`);
    for (const u of t.unexpected) failures.push(`round ${f.round}: ${u}`);
  }
  const c = f.afterCrash.figures;
  const s = f.afterSweep.figures;
  console.log(
    `as the crash left the file: integrity ${f.afterCrash.state.integrity}, journal ${f.afterCrash.state.journalMode}; acknowledged reservations (all runs) ${c.acknowledged}, found ${c.found}, lost ${c.lost}; ${c.pendingHolds} holds pending, ${c.queuedHolds} with a queued processor call; ${f.afterCrash.problems.length} problems`,
  );
  console.log(
    `after restart: ${f.replays.verified} retries of acknowledged creates and payments answered their first answer (replayed), ${f.replays.refused} refused 429, ${f.replays.wrong.length} wrong; ` +
      `${f.doubtful.creates} creates in doubt: ${f.doubtful.committedLater} done on retry, ${f.doubtful.stuckKeys} keys stuck "still being processed" (${f.doubtful.stuckWritten} of them with the reservation written), ${f.doubtful.other} other`,
  );
  console.log(`after the sweep ${JSON.stringify(f.sweep)}: acknowledged ${s.acknowledged}, found ${s.found}, lost ${s.lost}; ${s.pendingHolds} holds pending, ${s.queuedHolds} queued; ${f.afterSweep.problems.length} problems`);
  for (const p of f.afterCrash.problems) failures.push(`round ${f.round}, as the crash left it: ${p}`);
  for (const p of f.afterSweep.problems) failures.push(`round ${f.round}, after the sweep: ${p}`);
  for (const w of f.replays.wrong) failures.push(`round ${f.round}: ${w}`);
  if (f.steps.paid.acknowledged === 0) failures.push(`round ${f.round}: no payment was acknowledged before the kill, so the round tested little`);
  return failures;
}
