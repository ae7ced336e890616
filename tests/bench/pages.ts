import { createClient } from "@libsql/client";
import { chromium, type Browser, type BrowserContext, type CDPSession, type Page } from "@playwright/test";
import { spawn } from "node:child_process";
import { existsSync, mkdirSync, rmSync, writeFileSync } from "node:fs";
import { createServer } from "node:net";
import { loadavg } from "node:os";
import { join } from "node:path";
import { migrateDatabase } from "../../db/migrate";
import { DEMO_ACCOUNTS, DEMO_PASSWORD, seedDemo } from "../../db/seed";
import { startServices } from "../../scripts/services";
import { FirstLoadReader, type FirstLoad } from "./first-load";

// Page figures on a phone profile: each page loaded cold 5 times in Debian's chromium
// with a 390×844 viewport, 4× CPU slowdown and "Slow 4G" network emulation through the
// Chrome DevTools Protocol; the median is printed beside the budget.
// Slow 4G as Lighthouse defines it (from memory): 150 ms RTT, 1.6 Mbit/s down, 750 kbit/s up.
const NETWORK = { offline: false, latency: 150, downloadThroughput: (1.6 * 1024 * 1024) / 8, uploadThroughput: (750 * 1024) / 8 };
const PORT = 3310;
const BASE = `http://localhost:${PORT}`;
const RUNS = Number(process.env.BENCH_PAGE_RUNS ?? 5);
const SETTLE_MS = Number(process.env.BENCH_SETTLE_MS ?? 500);
const DIST_DIR = process.env.NEXT_DIST_DIR ?? ".next";
const VIEWPORT = { width: 390, height: 844 };
const DPR = 2;
/**
 * Budgets of issue 9 (DESIGN.md "Performance"): first-load JS on a page without a map, LCP and CLS as the
 * Core Web Vitals "good" thresholds (web.dev, from memory: LCP ≤ 2.5 s, CLS ≤ 0.1), and no image more than
 * twice the pixels it is drawn at.
 */
const BUDGET = { js: 130 * 1024, lcp: 2500, cls: 0.1, imageRatio: 2 };

export type Role = keyof typeof DEMO_ACCOUNTS;
/** Ids read from the seeded database, for pages whose address names a record. */
export type SeededIds = { hatcheryId: string; builderId: string; reservationId: string; jobRequestId: string };
export type PageSpec = {
  name: string;
  url: string | ((ids: SeededIds) => string);
  /** Signed in as this demo account (through the auth API, in the bench's browser) before the cold loads. */
  as?: Role;
  /** A map view: the map library loads here by design, so the first-load JS budget does not apply. */
  map?: boolean;
};

type ImageCheck = { src: string; natural: number; drawn: number; ratio: number };
type Figures = { jsBytes: number; totalBytes: number; ttfb: number; fcp: number; lcp: number; cls: number; tbt: number; lcpWhat: string; byType: Record<string, number>; scripts: { path: string; bytes: number }[]; unfinished: number };
type Row = { spec: PageSpec; url: string; f: Omit<Figures, "scripts" | "unfinished" | "lcpWhat" | "byType">; lcpWhat: string; byType: Record<string, number>; build: FirstLoad; extraScripts: { path: string; bytes: number }[]; unfinished: number; images: ImageCheck[]; unloadedImages: number; load: number };

/** Refuses to measure a server left over from another run (someone else's bench uses the same fixed ports). */
async function assertPortFree(port: number): Promise<void> {
  await new Promise<void>((resolve, reject) => {
    const probe = createServer().once("error", () => reject(new Error(`port ${port} is in use: is another bench running? (pgrep -af tests/bench)`)));
    probe.listen(port, "127.0.0.1", () => probe.close(() => resolve()));
  });
}

async function measure(cdp: CDPSession, url: string, page: Page): Promise<Figures> {
  const sizes = new Map<string, { bytes: number; type: string; url: string }>();
  const onResponse = (e: { requestId: string; type?: string; response: { url: string } }) => sizes.set(e.requestId, { bytes: 0, type: e.type ?? "", url: e.response.url });
  const finished = new Set<string>();
  const onFinished = (e: { requestId: string; encodedDataLength: number }) => {
    finished.add(e.requestId);
    const s = sizes.get(e.requestId);
    if (s) s.bytes = e.encodedDataLength;
  };
  const onFailed = (e: { requestId: string }) => finished.add(e.requestId);
  cdp.on("Network.responseReceived", onResponse);
  cdp.on("Network.loadingFinished", onFinished);
  cdp.on("Network.loadingFailed", onFailed);
  await cdp.send("Network.clearBrowserCache");
  await page.addInitScript(() => {
    const w = window as unknown as { __lcp: number; __cls: number; __tbt: number; __lcpWhat: string };
    w.__lcp = 0;
    w.__lcpWhat = "";
    w.__cls = 0;
    w.__tbt = 0;
    new PerformanceObserver((l) => {
      for (const e of l.getEntries() as (PerformanceEntry & { element?: Element | null; url?: string })[]) {
        w.__lcp = e.startTime;
        const el = e.element;
        w.__lcpWhat = e.url ? `img ${new URL(e.url).pathname}` : el ? `${el.tagName.toLowerCase()} "${(el.textContent ?? "").trim().slice(0, 40)}"` : "";
      }
    }).observe({ type: "largest-contentful-paint", buffered: true });
    new PerformanceObserver((l) => {
      for (const e of l.getEntries() as (PerformanceEntry & { value: number; hadRecentInput: boolean })[]) if (!e.hadRecentInput) w.__cls += e.value;
    }).observe({ type: "layout-shift", buffered: true });
    // Total blocking time: the part of each long task beyond 50 ms.
    new PerformanceObserver((l) => {
      for (const e of l.getEntries()) w.__tbt += Math.max(0, e.duration - 50);
    }).observe({ type: "longtask", buffered: true });
  });
  const response = await page.goto(BASE + url, { waitUntil: "networkidle", timeout: 120_000 });
  if (!response || response.status() !== 200 || new URL(page.url()).pathname !== new URL(BASE + url).pathname) {
    throw new Error(`${url} answered ${response?.status() ?? "nothing"} at ${page.url()}: the bench measures the page itself, not a redirect or an error`);
  }
  // BENCH_SETTLE_MS waits longer, to see what a page fetches after it went quiet (Link prefetches, lazy parts).
  await page.waitForTimeout(SETTLE_MS);
  const m = await page.evaluate(() => {
    const w = window as unknown as { __lcp: number; __cls: number; __tbt: number; __lcpWhat: string };
    // Time to first byte and first contentful paint, to tell a slow server from a slow page when LCP is late.
    const nav = performance.getEntriesByType("navigation")[0] as PerformanceNavigationTiming | undefined;
    const fcp = performance.getEntriesByName("first-contentful-paint")[0]?.startTime ?? 0;
    return { lcp: w.__lcp, cls: w.__cls, tbt: w.__tbt, lcpWhat: w.__lcpWhat, ttfb: nav?.responseStart ?? 0, fcp };
  });
  cdp.off("Network.responseReceived", onResponse);
  cdp.off("Network.loadingFinished", onFinished);
  cdp.off("Network.loadingFailed", onFailed);
  let jsBytes = 0;
  let totalBytes = 0;
  const byType: Record<string, number> = {};
  const scripts: { path: string; bytes: number }[] = [];
  for (const s of sizes.values()) {
    totalBytes += s.bytes;
    byType[s.type] = (byType[s.type] ?? 0) + s.bytes;
    if (s.type === "Script") {
      jsBytes += s.bytes;
      scripts.push({ path: decodeURIComponent(new URL(s.url).pathname), bytes: s.bytes });
    }
  }
  // Responses still arriving when the page went quiet (none, if networkidle did its job).
  const unfinished = [...sizes.keys()].filter((id) => !finished.has(id)).length;
  return { jsBytes, totalBytes, ...m, byType, scripts, unfinished };
}

/**
 * Every <img> on the page once lazy ones have loaded: its intrinsic width against the device pixels it is drawn
 * at (CSS width × devicePixelRatio). With object-fit: cover the picture is drawn wider than its box when its
 * aspect is wider, so the drawn width is the larger of the box width and box height × aspect.
 */
async function checkImages(page: Page): Promise<{ images: ImageCheck[]; unloaded: number }> {
  await page.evaluate(async () => {
    for (let y = 0; y < document.body.scrollHeight; y += window.innerHeight / 2) {
      window.scrollTo(0, y);
      await new Promise((r) => setTimeout(r, 150));
    }
  });
  await page.waitForLoadState("networkidle").catch(() => undefined);
  await page.evaluate(() => Promise.all([...document.images].map((img) => (img.complete ? undefined : img.decode().catch(() => undefined)))));
  return page.evaluate(async () => {
    const images: { src: string; natural: number; drawn: number; ratio: number }[] = [];
    let unloaded = 0;
    for (const img of document.images) {
      const box = img.getBoundingClientRect();
      if (box.width === 0 || box.height === 0) continue;
      if (!img.naturalWidth) {
        unloaded += 1;
        continue;
      }
      // naturalWidth of a srcset image is divided by the density the browser picked (HTML Standard, "current
      // pixel density"); the file's own pixel width is what a copy without srcset reports. It is in the cache already.
      const probe = new Image();
      probe.src = img.currentSrc || img.src;
      await probe.decode().catch(() => undefined);
      const natural = probe.naturalWidth || img.naturalWidth;
      const aspect = probe.naturalWidth && probe.naturalHeight ? probe.naturalWidth / probe.naturalHeight : img.naturalWidth / img.naturalHeight;
      const cover = getComputedStyle(img).objectFit === "cover";
      const drawnCss = cover ? Math.max(box.width, box.height * aspect) : box.width;
      const drawn = drawnCss * window.devicePixelRatio;
      images.push({ src: new URL(img.currentSrc || img.src).pathname, natural, drawn: Math.round(drawn), ratio: natural / drawn });
    }
    return { images, unloaded };
  });
}

const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)] ?? Number.NaN;
};

async function seededIds(url: string): Promise<SeededIds> {
  const client = createClient({ url });
  const one = async (sql: string, args: string[]): Promise<string | undefined> => {
    const r = await client.execute({ sql, args });
    const v = r.rows[0]?.[0];
    return typeof v === "string" ? v : undefined;
  };
  try {
    const idOf = async (email: string) => {
      const id = await one("SELECT id FROM user WHERE email = ?", [email]);
      if (!id) throw new Error(`seed has no ${email}`);
      return id;
    };
    const farmer = await idOf(DEMO_ACCOUNTS.farmer);
    // The reservation in its quarantine week: the farmer's page with the most on it (survival report and dispute forms).
    const reservationId =
      (await one("SELECT id FROM reservation WHERE farmer_id = ? AND state = 'quarantine' ORDER BY requested_at DESC LIMIT 1", [farmer])) ??
      (await one("SELECT id FROM reservation WHERE farmer_id = ? ORDER BY requested_at DESC LIMIT 1", [farmer]));
    if (!reservationId) throw new Error("seed has no reservation of the demo farmer");
    // A job still under way if there is one: its page has the farmer's actions on it.
    const jobRequestId = (await one("SELECT request_id FROM job WHERE farmer_id = ? ORDER BY state IN ('completed', 'resolved', 'cancelled'), rowid DESC LIMIT 1", [farmer])) ?? "";
    return { hatcheryId: await idOf(DEMO_ACCOUNTS.hatchery), builderId: await idOf(DEMO_ACCOUNTS.builder), reservationId, jobRequestId };
  } finally {
    client.close();
  }
}

/** Signs in through the auth API inside a browser context of the bench, so the session cookie is the browser's own. */
async function signedInState(browser: Browser, role: Role): Promise<Awaited<ReturnType<BrowserContext["storageState"]>>> {
  const context = await browser.newContext();
  try {
    const r = await context.request.post(`${BASE}/api/auth/sign-in/email`, { data: { email: DEMO_ACCOUNTS[role], password: DEMO_PASSWORD }, headers: { origin: BASE } });
    if (r.status() !== 200) throw new Error(`sign-in as ${role} answered ${r.status()}`);
    return await context.storageState();
  } finally {
    await context.close();
  }
}

/**
 * The demo farmer's seeded request has two quotes and no job yet: accept the first, as the farmer would, so the
 * job page has a job (awaiting its deposit) to show.
 */
async function ensureFarmerJob(browser: Browser, dbUrl: string, state: Awaited<ReturnType<BrowserContext["storageState"]>>): Promise<string> {
  const client = createClient({ url: dbUrl });
  try {
    const r = await client.execute({
      sql: "SELECT q.id, q.current_version FROM quote q JOIN tank_request t ON t.id = q.request_id JOIN user u ON u.id = t.farmer_id WHERE u.email = ? AND q.state = 'sent' LIMIT 1",
      args: [DEMO_ACCOUNTS.farmer],
    });
    const row = r.rows[0];
    if (!row) throw new Error("the demo farmer has no job and no quote to accept");
    const context = await browser.newContext({ storageState: state });
    try {
      const res = await context.request.post(`${BASE}/api/v1/quotes/${String(row[0])}/accept`, { data: { version: Number(row[1]) }, headers: { origin: BASE } });
      if (!res.ok()) throw new Error(`accepting a quote answered ${res.status()}: ${await res.text()}`);
    } finally {
      await context.close();
    }
    const job = await client.execute({ sql: "SELECT request_id FROM job WHERE quote_id = ?", args: [String(row[0])] });
    const id = job.rows[0]?.[0];
    if (typeof id !== "string") throw new Error("accepted quote made no job");
    return id;
  } finally {
    client.close();
  }
}

const kb = (b: number) => `${(b / 1024).toFixed(1)}`;
const verdict = (ok: boolean) => (ok ? "met" : "MISSED");

function printTable(rows: Row[], loadBefore: number[]): void {
  console.log(
    `\nPages on a phone (${VIEWPORT.width}×${VIEWPORT.height} @${DPR}x, 4× CPU slowdown, Slow 4G), median of ${RUNS} cold loads; build ${DIST_DIR}; load average before ${loadBefore.map((l) => l.toFixed(2)).join(" ")}`,
  );
  console.log("JS build = first-load chunks from the build manifests, gzip -9 (node zlib); JS net = Script bytes on the wire as `next start` serves them (gzip), incl. chunks loaded after hydration.");
  const header = ["page", "JS build KB", "≤130", "JS net KB", "all KB", "TTFB ms", "FCP ms", "LCP ms", "≤2500", "CLS", "≤0.1", "TBT ms", "img max×", "≤2", "load1"];
  const widths = [16, 11, 8, 9, 8, 7, 7, 7, 7, 6, 7, 7, 9, 7, 6];
  const line = (cells: string[]) => cells.map((c, i) => (i === 0 ? c.padEnd(widths[i] ?? 8) : c.padStart(widths[i] ?? 8))).join(" ");
  console.log(line(header));
  for (const r of rows) {
    const worst = r.images.reduce((m, i) => Math.max(m, i.ratio), 0);
    console.log(
      line([
        r.spec.name,
        kb(r.build.bytes),
        r.spec.map ? "map" : verdict(r.build.bytes <= BUDGET.js),
        kb(r.f.jsBytes),
        kb(r.f.totalBytes),
        String(Math.round(r.f.ttfb)),
        String(Math.round(r.f.fcp)),
        String(Math.round(r.f.lcp)),
        verdict(r.f.lcp <= BUDGET.lcp),
        r.f.cls.toFixed(3),
        verdict(r.f.cls <= BUDGET.cls),
        String(Math.round(r.f.tbt)),
        r.images.length ? worst.toFixed(2) : "none",
        verdict(worst <= BUDGET.imageRatio),
        r.load.toFixed(2),
      ]),
    );
  }
  const framework = rows[0]?.build.frameworkBytes;
  if (framework !== undefined) console.log(`Framework chunks every page starts with (React, Next runtime): ${kb(framework)} KB gzip -9.`);
  for (const r of rows) {
    if (r.extraScripts.length) console.log(`${r.spec.name}: scripts beyond the first-load set: ${r.extraScripts.map((s) => `${s.path} (${kb(s.bytes)} KB)`).join(", ")}`);
    if (r.lcpWhat) console.log(`${r.spec.name}: largest contentful paint is ${r.lcpWhat}`);
    if (r.unfinished) console.log(`${r.spec.name}: up to ${r.unfinished} response(s) had not finished when the page went quiet (not counted)`);
    for (const i of r.images.filter((i) => i.ratio > BUDGET.imageRatio)) console.log(`${r.spec.name}: image ${i.src} is ${i.natural} px wide, drawn at ${i.drawn} device px (${i.ratio.toFixed(2)}×)`);
    if (r.unloadedImages) console.log(`${r.spec.name}: ${r.unloadedImages} image(s) did not load`);
  }
}

export async function benchPages(pages: PageSpec[]): Promise<void> {
  if (!existsSync(join(DIST_DIR, "BUILD_ID"))) throw new Error(`no production build in ${DIST_DIR}: run \`npm run build\` with the same NEXT_DIST_DIR first`);
  const only = process.env.BENCH_PAGES?.split(",").map((s) => s.trim());
  const selected = only ? pages.filter((p) => only.includes(p.name)) : pages;
  await assertPortFree(PORT);
  const reader = new FirstLoadReader(DIST_DIR);
  const dir = "data/bench-pages";
  rmSync(dir, { recursive: true, force: true });
  mkdirSync(dir, { recursive: true });
  const env = {
    ...process.env,
    // next start reads distDir from next.config.ts, which reads NEXT_DIST_DIR.
    NEXT_DIST_DIR: DIST_DIR,
    APP_URL: BASE,
    DATABASE_URL: `file:./${dir}/shoal.db`,
    S3_ENDPOINT: "http://127.0.0.1:4581",
    S3_FAKE_PORT: "4581",
    S3_FAKE_DATA: `./${dir}/s3`,
    RESEND_BASE_URL: "http://127.0.0.1:4582",
    MAIL_FAKE_PORT: "4582",
    MAIL_FAKE_DATA: `./${dir}/mail`,
    STRIPE_API_BASE: "http://127.0.0.1:4583",
    PAYMENTS_FAKE_PORT: "4583",
    PAYMENTS_FAKE_DATA: `./${dir}/payments`,
    NEXT_TELEMETRY_DISABLED: "1",
  };
  Object.assign(process.env, env);
  const services = await startServices();
  await migrateDatabase(env.DATABASE_URL);
  await seedDemo({ url: env.DATABASE_URL, onlyIfEmpty: true });
  const ids = await seededIds(env.DATABASE_URL);
  const server = spawn(process.execPath, ["node_modules/next/dist/bin/next", "start", "-p", String(PORT)], { env, stdio: ["ignore", "ignore", "inherit"], detached: true });
  const browser = await chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
    args: ["--no-sandbox", "--disable-gpu", "--disable-background-networking", "--disable-component-update", "--disable-sync", "--no-first-run", "--disable-quic"],
  });
  try {
    let up = false;
    for (let i = 0; i < 120 && !up; i++) {
      try {
        up = (await fetch(`${BASE}/api/health`)).ok;
      } catch {
        // starting
      }
      if (!up) await new Promise((r) => setTimeout(r, 500));
    }
    if (!up) throw new Error(`next start on ${PORT} did not answer`);
    const states = new Map<Role, Awaited<ReturnType<typeof signedInState>>>();
    for (const role of new Set(selected.flatMap((p) => (p.as ? [p.as] : [])))) states.set(role, await signedInState(browser, role));
    const farmerState = states.get("farmer");
    if (!ids.jobRequestId && farmerState) ids.jobRequestId = await ensureFarmerJob(browser, env.DATABASE_URL, farmerState);

    const loadBefore = loadavg();
    const rows: Row[] = [];
    for (const spec of selected) {
      const url = typeof spec.url === "string" ? spec.url : spec.url(ids);
      const build = reader.forUrl(url);
      const runs: Figures[] = [];
      let images: { images: ImageCheck[]; unloaded: number } = { images: [], unloaded: 0 };
      const loads: number[] = [];
      for (let i = 0; i < RUNS; i++) {
        loads.push(loadavg()[0] ?? 0);
        const context = await browser.newContext({ viewport: VIEWPORT, deviceScaleFactor: DPR, isMobile: true, hasTouch: true, storageState: spec.as ? states.get(spec.as) : undefined });
        const page = await context.newPage();
        const cdp = await context.newCDPSession(page);
        await cdp.send("Network.enable");
        await cdp.send("Network.emulateNetworkConditions", NETWORK);
        await cdp.send("Emulation.setCPUThrottlingRate", { rate: 4 });
        runs.push(await measure(cdp, url, page));
        // After the figures are taken, so scrolling (which loads lazy images) does not change them.
        if (i === RUNS - 1) images = await checkImages(page);
        await context.close();
      }
      const inBuild = new Set(build.files.map((f) => `/_next/${f.file}`));
      const lastRun = runs[runs.length - 1];
      const extraScripts = (lastRun?.scripts ?? []).filter((s) => !inBuild.has(s.path));
      rows.push({
        spec,
        url,
        f: { jsBytes: median(runs.map((r) => r.jsBytes)), totalBytes: median(runs.map((r) => r.totalBytes)), ttfb: median(runs.map((r) => r.ttfb)), fcp: median(runs.map((r) => r.fcp)), lcp: median(runs.map((r) => r.lcp)), cls: median(runs.map((r) => r.cls)), tbt: median(runs.map((r) => r.tbt)) },
        build,
        lcpWhat: lastRun?.lcpWhat ?? "",
        byType: lastRun?.byType ?? {},
        extraScripts,
        unfinished: Math.max(...runs.map((r) => r.unfinished)),
        images: images.images,
        unloadedImages: images.unloaded,
        load: median(loads),
      });
    }
    printTable(rows, loadBefore);
    // The figures as JSON too (BENCH_PAGES_OUT to keep them elsewhere), to compare two builds without reading the table by eye.
    writeFileSync(process.env.BENCH_PAGES_OUT ?? join(dir, "figures.json"), JSON.stringify(rows.map((r) => ({ name: r.spec.name, url: r.url, route: r.build.route, firstLoadJs: r.build.bytes, files: r.build.files, ...r.f, lcpWhat: r.lcpWhat, bytesByType: r.byType, extraScripts: r.extraScripts, unfinished: r.unfinished, images: r.images, load: r.load })), null, 2));
  } finally {
    await browser.close();
    try {
      if (server.pid) process.kill(-server.pid, "SIGTERM");
    } catch {
      // already gone
    }
    await services.close();
  }
}
