import autocannon from "autocannon";
import { spawn, type ChildProcess } from "node:child_process";
import { existsSync, rmSync } from "node:fs";
import { createServer } from "node:net";
import { cpus, loadavg } from "node:os";
import { migrateDatabase } from "../../db/migrate";
import { PLACES } from "../../lib/places/gazetteer";
import { seedBenchListings } from "./seed-bench";

// Nearby search over HTTP against a production build: 100 000 listings, 32
// connections, radii 10 / 50 / 200 km, the R*Tree strategy and a full scan in the
// same run. Loopback only; every load is bounded in time.
const LISTINGS = Number(process.env.BENCH_LISTINGS ?? 100_000);
const PORT = 3300;
const BASE = `http://127.0.0.1:${PORT}`;
const DIR = "data/bench";
const DB_URL = `file:./${DIR}/shoal.db`;
const SECONDS = Number(process.env.BENCH_SECONDS ?? 10);

/** Refuses to measure a server left over from another run. */
async function assertPortFree(port: number): Promise<void> {
  await new Promise<void>((resolve, reject) => {
    const probe = createServer().once("error", () => reject(new Error(`port ${port} is in use: stop the old server first`)));
    probe.listen(port, "127.0.0.1", () => probe.close(() => resolve()));
  });
}

async function waitFor(url: string, timeoutMs: number): Promise<void> {
  const end = Date.now() + timeoutMs;
  while (Date.now() < end) {
    try {
      if ((await fetch(url)).ok) return;
    } catch {
      // not up yet
    }
    await new Promise((r) => setTimeout(r, 300));
  }
  throw new Error(`server at ${url} did not start`);
}

type Row = { strategy: string; radiusKm: number; rps: number; p50: number; p95: number; p99: number; errors: number; non2xx: number; meanResults: number };

const inArea = new Map<number, number>();

type Strategy = "index" | "scan" | "health";

async function load(strategy: Strategy, radiusKm: number, connections = 32): Promise<Row> {
  // Each connection cycles through searches centred on the gazetteer's towns. "health" is the
  // cheapest route the app has (one `select 1`): the most requests/s this build can serve here.
  const paths =
    strategy === "health"
      ? ["/api/health"]
      : PLACES.slice(0, 20).map((p) => `/api/v1/listings/nearby?lat=${p.lat}&lng=${p.lng}&radiusKm=${radiusKm}&limit=20${strategy === "scan" ? "&strategy=scan" : ""}`);
  // How many listings each search area holds (paged through the index), for the table.
  let results = inArea.get(radiusKm) ?? 0;
  for (const place of inArea.has(radiusKm) || strategy === "health" ? [] : PLACES.slice(0, 20)) {
    let cursor: string | null = null;
    do {
      const page = (await (await fetch(`${BASE}/api/v1/listings/nearby?lat=${place.lat}&lng=${place.lng}&radiusKm=${radiusKm}&limit=100${cursor ? `&cursor=${cursor}` : ""}`)).json()) as { items: unknown[]; nextCursor: string | null };
      results += page.items.length;
      cursor = page.nextCursor;
    } while (cursor);
  }
  if (strategy !== "health") inArea.set(radiusKm, results);
  // autocannon reports no 95th percentile, so every response time is kept and ranked here.
  const times: number[] = [];
  const out = await new Promise<autocannon.Result>((resolve, reject) => {
    const instance = autocannon(
      {
        url: BASE,
        connections,
        duration: strategy === "scan" ? Math.max(3, Math.round(SECONDS / 2)) : SECONDS,
        requests: paths.map((path) => ({ method: "GET", path })),
      },
      (error, result) => (error ? reject(error) : resolve(result)),
    );
    instance.on("response", (_client, _status, _bytes, responseTime) => times.push(responseTime));
  });
  times.sort((a, b) => a - b);
  const pct = (p: number) => Number((times[Math.min(times.length - 1, Math.ceil((p / 100) * times.length) - 1)] ?? Number.NaN).toFixed(1));
  return {
    strategy: connections === 32 ? strategy : `${strategy}×${connections}`,
    radiusKm,
    rps: Math.round(out.requests.average),
    p50: pct(50),
    p95: pct(95),
    p99: pct(99),
    errors: out.errors,
    non2xx: out.non2xx,
    meanResults: strategy === "health" ? 0 : Math.round(results / paths.length),
  };
}

export async function benchNearby(): Promise<void> {
  const loadBefore = loadavg();
  if (!existsSync(`${DIR}/shoal.db`) || process.env.BENCH_RESEED === "1") {
    rmSync(DIR, { recursive: true, force: true });
    await migrateDatabase(DB_URL);
    const t = Date.now();
    await seedBenchListings(DB_URL, LISTINGS);
    console.log(`seeded ${LISTINGS.toLocaleString("en")} listings in ${((Date.now() - t) / 1000).toFixed(1)} s`);
  }
  await assertPortFree(PORT);
  const server: ChildProcess = spawn(process.execPath, ["node_modules/next/dist/bin/next", "start", "-p", String(PORT), "-H", "127.0.0.1"], {
    env: { ...process.env, DATABASE_URL: DB_URL, SHOAL_BENCH: "true", APP_URL: BASE, NEXT_TELEMETRY_DISABLED: "1" },
    stdio: ["ignore", "ignore", "inherit"],
    detached: true,
  });
  try {
    await waitFor(`${BASE}/api/health`, 60_000);
    const rows: Row[] = [];
    for (const radiusKm of [10, 50, 200]) {
      rows.push(await load("index", radiusKm));
      rows.push(await load("scan", radiusKm));
    }
    // What the machine allows: the same search on one connection (the time one request takes
    // when nothing queues), and the empty health route on 32 connections (the framework's ceiling).
    const single = await load("index", 50, 1);
    const ceiling = await load("health", 0);
    console.log(`\nLoad average before the run (1, 5, 15 min): ${loadBefore.map((l) => l.toFixed(2)).join(", ")} on ${cpus().length} cores`);
    console.log(`Nearby search, ${LISTINGS.toLocaleString("en")} listings, 32 connections, ${SECONDS} s per index run (budget: p95 ≤ 25 ms and ≥ 20× the full scan)`);
    console.log("radius  strategy  in area  req/s    p50 ms  p95 ms  p99 ms  errors  non-2xx  speed-up  budget");
    for (const radiusKm of [10, 50, 200]) {
      const idx = rows.find((r) => r.radiusKm === radiusKm && r.strategy === "index");
      const scan = rows.find((r) => r.radiusKm === radiusKm && r.strategy === "scan");
      if (!idx || !scan) continue;
      const speedUp = idx.rps / Math.max(scan.rps, 1);
      for (const r of [idx, scan]) {
        const verdict = r.strategy === "index" ? (r.p95 <= 25 && speedUp >= 20 ? "met" : "MISSED") : "";
        console.log(
          `${String(radiusKm).padStart(4)} km  ${r.strategy.padEnd(8)}  ${String(r.meanResults).padStart(7)}  ${String(r.rps).padStart(6)}  ${String(r.p50).padStart(6)}  ${String(r.p95).padStart(6)}  ${String(r.p99).padStart(6)}  ${String(r.errors).padStart(6)}  ${String(r.non2xx).padStart(7)}  ${r.strategy === "index" ? `${speedUp.toFixed(1)}×`.padStart(8) : "".padStart(8)}  ${verdict}`,
        );
      }
    }
    for (const r of [single, ceiling]) {
      console.log(
        `${r.strategy === "health" ? "   —   " : `${String(r.radiusKm).padStart(4)} km`}  ${r.strategy.padEnd(8)}  ${"".padStart(7)}  ${String(r.rps).padStart(6)}  ${String(r.p50).padStart(6)}  ${String(r.p95).padStart(6)}  ${String(r.p99).padStart(6)}  ${String(r.errors).padStart(6)}  ${String(r.non2xx).padStart(7)}`,
      );
    }
    // Little's law: with 32 requests always in flight, the mean time in the system is
    // 32 ÷ throughput, so no route can average under 32 ÷ (the health route's req/s) here.
    const floorMs = (32 / Math.max(ceiling.rps, 1)) * 1000;
    console.log(
      `One search alone takes ${single.p50} ms (p50) / ${single.p95} ms (p95) on 1 connection. ` +
        `The empty health route tops out at ${ceiling.rps} req/s, so 32 connections wait at least ` +
        `${floorMs.toFixed(1)} ms on average (Little's law: L = λW) before any search work is done.`,
    );
  } finally {
    try {
      if (server.pid) process.kill(-server.pid, "SIGTERM");
    } catch {
      // already gone
    }
  }
}
