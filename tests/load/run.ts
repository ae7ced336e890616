import { spawnSync } from "node:child_process";
import { randomBytes } from "node:crypto";
import { existsSync, mkdtempSync, rmSync } from "node:fs";
import { cpus, loadavg, tmpdir } from "node:os";
import { join } from "node:path";
import { migrateDatabase } from "../../db/migrate";
import { rng } from "../../db/seed-random";
import { seedDemo } from "../../db/seed";
import { loadDotEnv } from "../../scripts/load-env";
import { startServices, type RunningServices } from "../../scripts/services";
import { farmerEmails, hatcheryEmails, openBatches, signInAll } from "./accounts";
import { processorRecords, reportRound, runCrashRound } from "./crash-rounds";
import { checkDatabase, type Verdict } from "./db-state";
import { reportMixedLoad, runMixedLoad, type LoadWorld } from "./mixed-load";
import { prepareReleasedReservations } from "./review-subjects";
import { AppServer } from "./server";
import type { Acknowledgement } from "../../lib/ops/invariants";

// `npm run test:load`: the mixed load (LOAD_SECONDS, 60 by default) and the crash rounds (LOAD_CRASH_ROUNDS, 3)
// against a production build on its own port (LOAD_PORT, 3200; the stand-ins sit above it as in
// tests/e2e/ports.ts) with a fresh seeded database in a temporary folder. Reuses the build in NEXT_DIST_DIR
// (.next by default) and builds only when there is none. Exits non-zero on any 5xx, socket error, lost
// acknowledged write or broken invariant; LOAD_TIMEOUT_SECONDS (600) bounds the whole run.

const PORT = Number(process.env.LOAD_PORT ?? 3200);
const SECONDS = Number(process.env.LOAD_SECONDS ?? 60);
const ROUNDS = Number(process.env.LOAD_CRASH_ROUNDS ?? 3);
const SEED = Number(process.env.LOAD_SEED ?? Math.floor(Math.random() * 2 ** 31));
const TIMEOUT_S = Number(process.env.LOAD_TIMEOUT_SECONDS ?? 600);
const DIST = process.env.NEXT_DIST_DIR ?? ".next";
const FARMERS = 20;
const HATCHERIES = 4;

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

function ensureBuild(): void {
  if (existsSync(join(DIST, "BUILD_ID"))) return;
  console.log(`[load] no production build in ${DIST}: running npm run build once`);
  const r = spawnSync("npm", ["run", "build"], { stdio: "inherit", env: process.env });
  if (r.status !== 0 || !existsSync(join(DIST, "BUILD_ID"))) throw new Error("npm run build failed");
}

async function main(): Promise<number> {
  const t0 = Date.now();
  loadDotEnv();
  ensureBuild();
  const dir = mkdtempSync(join(tmpdir(), "shoal-load-"));
  const base = `http://127.0.0.1:${PORT}`;
  // The e2e scheme (tests/e2e/ports.ts): the stand-ins sit at fixed offsets above the app's port.
  const ports = { s3: PORT + 1471, mail: PORT + 1511, payments: PORT + 1521 };
  const dbUrl = `file:${join(dir, "shoal.db")}`;
  const secretKey = process.env.STRIPE_SECRET_KEY || "sk_test_local_shoal";
  const cronSecret = process.env.CRON_SECRET || "cron_local_shoal_sweep";
  const env: Record<string, string> = {
    APP_URL: base,
    DATABASE_URL: dbUrl,
    BETTER_AUTH_SECRET: process.env.BETTER_AUTH_SECRET || randomBytes(32).toString("base64url"),
    S3_ENDPOINT: `http://127.0.0.1:${ports.s3}`,
    S3_FAKE_PORT: String(ports.s3),
    S3_FAKE_DATA: join(dir, "s3"),
    RESEND_BASE_URL: `http://127.0.0.1:${ports.mail}`,
    MAIL_FAKE_PORT: String(ports.mail),
    MAIL_FAKE_DATA: join(dir, "mail"),
    STRIPE_API_BASE: `http://127.0.0.1:${ports.payments}`,
    STRIPE_SECRET_KEY: secretKey,
    STRIPE_WEBHOOK_SECRET: process.env.STRIPE_WEBHOOK_SECRET || "whsec_local_shoal_webhook_secret",
    PAYMENTS_FAKE_PORT: String(ports.payments),
    PAYMENTS_FAKE_DATA: join(dir, "payments"),
    PAYMENTS_WEBHOOK_URL: `${base}/api/webhooks/stripe`,
    CRON_SECRET: cronSecret,
    DEV_OUTBOX: "false",
    NEXT_TELEMETRY_DISABLED: "1",
    NEXT_DIST_DIR: DIST,
  };
  Object.assign(process.env, env);
  const server = new AppServer(PORT, { ...process.env, ...env }, join(dir, "server.log"));
  let services: RunningServices | null = null;
  const failures: string[] = [];
  const watchdog = setTimeout(() => {
    console.error(`\n[load] still running after ${TIMEOUT_S} s: stopping (LOAD_TIMEOUT_SECONDS)`);
    void server.kill9().finally(() => process.exit(1));
  }, TIMEOUT_S * 1000);
  const stop = () => void server.kill9().finally(() => process.exit(130));
  process.once("SIGINT", stop);
  process.once("SIGTERM", stop);

  try {
    console.log(`[load] seed ${SEED} (LOAD_SEED), data in ${dir}, server ${base}, build ${DIST}; load average ${loadavg().map((l) => l.toFixed(2)).join(", ")} on ${cpus().length} cores`);
    services = await startServices();
    await migrateDatabase(dbUrl);
    const seeded = await seedDemo({ url: dbUrl, onlyIfEmpty: true });
    console.log(`[load] ${seeded?.split("\n")[0] ?? "seeded"}`);
    console.log(`[load] server up in ${(await server.start()).toFixed(1)} s`);

    const rand = rng(SEED);
    const { openDb } = await import("./db-state");
    const db = openDb(dbUrl);
    const [farmerList, hatcheryList, batches, providers] = await Promise.all([
      farmerEmails(db, FARMERS),
      hatcheryEmails(db, HATCHERIES),
      openBatches(db),
      db.execute("select user_id, kind from listing order by user_id"),
    ]);
    db.close();
    const providerIds = [...new Set(providers.rows.map((r) => String(r.user_id)))];
    const ofKind = (kind: string) => [...new Set(providers.rows.filter((r) => r.kind === kind).map((r) => String(r.user_id)))];
    const signedIn = await signInAll(base, [...farmerList, ...hatcheryList]);
    const farmers = signedIn.slice(0, farmerList.length);
    const hatcheries = signedIn.slice(farmerList.length);
    console.log(`[load] signed in ${farmers.length} farmers and ${hatcheries.length} hatcheries; ${batches.length} open batches, ${providerIds.length} listed providers`);
    const ownBatches = (await (async () => {
      const d = openDb(dbUrl);
      try {
        return await openBatches(d, hatcheries.map((h) => h.id));
      } finally {
        d.close();
      }
    })()).filter((b) => b.countAvailable >= 200);

    const acks = new Map<string, Acknowledgement>();
    const world: LoadWorld = { base, farmers, providerIds, batches, rand, acks };
    // The reviews API joins the mix when this build has it: released reservations to review are made first.
    const probe = await fetch(`${base}/api/v1/providers/${ofKind("hatchery")[0] ?? ""}/reviews?role=hatchery`);
    if (probe.status === 200 && (probe.headers.get("content-type") ?? "").includes("json")) {
      const t = Date.now();
      const subjects = await prepareReleasedReservations(base, dbUrl, farmers, hatcheries, ownBatches, 1);
      world.reviews = { subjects, hatcheryIds: ofKind("hatchery"), builderIds: ofKind("builder") };
      console.log(`[load] reviews API found: ${subjects.length} released reservations made to review, in ${((Date.now() - t) / 1000).toFixed(1)} s`);
    } else {
      console.log(`[load] no reviews API in this build (GET …/reviews answered ${probe.status}): the mix runs without reviews`);
    }
    await probe.arrayBuffer().catch(() => undefined);
    const tallies = await runMixedLoad(world, SECONDS);
    const mixed = reportMixedLoad(tallies, SECONDS);
    failures.push(...mixed.failures);
    const afterLoad = await checkDatabase(dbUrl, [...acks.values()]);
    printVerdict("after the mixed load", afterLoad);
    failures.push(...afterLoad.problems.map((p) => `after the mixed load: ${p}`));

    const rounds = [];
    for (let round = 1; round <= ROUNDS; round++) {
      const f = await runCrashRound({ server, dbUrl, farmers, hatcheries, batches: ownBatches, rand, cronSecret, acks, workers: 6 }, round);
      rounds.push(f);
      failures.push(...reportRound(f));
    }

    // Queued processor calls cut off by a crash are retried by the sweep once they are 30 s old (hold-sweep.ts):
    // wait for that, sweep again, then compare every settled hold with the processor's own record.
    let final = await checkDatabase(dbUrl, [...acks.values()]);
    const queued = final.state.holds.map((h) => h.queuedAt).filter((q): q is number => q !== null);
    if (queued.length > 0) {
      const wait = Math.min(45_000, Math.max(...queued) + 31_000 - Date.now());
      console.log(`\n[load] ${queued.length} processor calls still queued: sweeping again in ${Math.max(0, Math.ceil(wait / 1000))} s`);
      if (wait > 0) await sleep(wait);
      const r = await fetch(`${base}/api/cron/sweep`, { method: "POST", headers: { authorization: `Bearer ${cronSecret}` } });
      if (r.status !== 200) failures.push(`the final sweep answered ${r.status}`);
      console.log(`[load] sweep: ${await r.text()}`);
      final = await checkDatabase(dbUrl, [...acks.values()]);
    }
    const settledHolds = final.state.holds.filter((h) => h.state !== "pending" && h.queuedAt === null);
    const processor = await processorRecords(env.STRIPE_API_BASE ?? "", secretKey, settledHolds);
    const last = await checkDatabase(dbUrl, [...acks.values()], processor);
    printVerdict(`at the end, ${processor.size} settled holds compared with the payments stand-in's records`, last);
    failures.push(...last.problems.map((p) => `at the end: ${p}`));
    if (last.figures.queuedHolds > 0) failures.push(`at the end: ${last.figures.queuedHolds} processor calls still queued after the sweep`);
    const serverErrors = server.unexpectedErrors();
    for (const line of serverErrors.slice(0, 20)) failures.push(`server log: ${line}`);

    const acknowledged = rounds.reduce((s, r) => s + r.acknowledgedThisRound, 0);
    const survived = rounds.filter((r) => r.afterCrash.problems.length === 0 && r.afterSweep.problems.length === 0 && r.replays.wrong.length === 0).length;
    console.log(`\nload: ${mixed.summary}`);
    console.log(
      `crash: ${survived}/${rounds.length} rounds survived; ${acknowledged} reservations acknowledged in the rounds (${acks.size} in all, mixed load included), found ${last.figures.found}, lost ${last.figures.lost}; ` +
        `${rounds.reduce((s, r) => s + r.replays.verified, 0)} retries after restart answered their first answer; ${last.figures.pendingHolds} holds still pending (left for the sweep's 10-minute retry)`,
    );
    console.log(`test:load took ${((Date.now() - t0) / 1000).toFixed(0)} s`);
  } catch (err) {
    failures.push(`the run stopped: ${err instanceof Error ? (err.stack ?? err.message) : String(err)}`);
  } finally {
    clearTimeout(watchdog);
    await server.stop();
    await services?.close();
  }
  if (failures.length > 0) {
    console.error(`\ntest:load FAILED (${failures.length}):`);
    for (const f of failures.slice(0, 60)) console.error(`  - ${f}`);
    console.error(`data and server log kept in ${dir}`);
    return 1;
  }
  rmSync(dir, { recursive: true, force: true });
  console.log("test:load passed");
  return 0;
}

function printVerdict(when: string, v: Verdict & { state: { integrity: string; journalMode: string } }): void {
  const f = v.figures;
  console.log(
    `\nInvariants ${when}: integrity ${v.state.integrity}, journal ${v.state.journalMode}; ${f.batches} batches, ${f.reservations} reservations, ${f.holds} holds, ${f.legs} ledger legs${f.reviews === null ? "" : `, ${f.reviews} reviews`}; ` +
      `acknowledged ${f.acknowledged}, found ${f.found}, lost ${f.lost}; ${v.problems.length === 0 ? "all hold" : `${v.problems.length} problems`}`,
  );
}

main().then(
  (code) => process.exit(code),
  (err: unknown) => {
    console.error(err);
    process.exit(1);
  },
);
