import { chromium, type CDPSession } from "@playwright/test";
import { spawn } from "node:child_process";
import { rmSync } from "node:fs";
import { migrateDatabase } from "../../db/migrate";
import { seedDemo } from "../../db/seed";
import { startServices } from "../../scripts/services";

// Page figures on a phone profile: each page loaded cold 5 times in Debian's chromium
// with a 390×844 viewport, 4× CPU slowdown and "Slow 4G" network emulation through the
// Chrome DevTools Protocol; the median is printed beside the budget.
// Slow 4G as Lighthouse defines it (from memory): 150 ms RTT, 1.6 Mbit/s down, 750 kbit/s up.
const NETWORK = { offline: false, latency: 150, downloadThroughput: (1.6 * 1024 * 1024) / 8, uploadThroughput: (750 * 1024) / 8 };
const PORT = 3310;
const BASE = `http://localhost:${PORT}`;
const RUNS = Number(process.env.BENCH_PAGE_RUNS ?? 5);
const BUDGET = { js: 130 * 1024, lcp: 2500, cls: 0.1 };

type Figures = { jsBytes: number; totalBytes: number; lcp: number; cls: number; tbt: number };

async function measure(cdp: CDPSession, url: string, page: import("@playwright/test").Page): Promise<Figures> {
  const sizes = new Map<string, { bytes: number; type: string }>();
  const onResponse = (e: { requestId: string; type?: string }) => sizes.set(e.requestId, { bytes: 0, type: e.type ?? "" });
  const onFinished = (e: { requestId: string; encodedDataLength: number }) => {
    const s = sizes.get(e.requestId);
    if (s) s.bytes = e.encodedDataLength;
  };
  cdp.on("Network.responseReceived", onResponse);
  cdp.on("Network.loadingFinished", onFinished);
  await cdp.send("Network.clearBrowserCache");
  await page.addInitScript(() => {
    const w = window as unknown as { __lcp: number; __cls: number; __tbt: number };
    w.__lcp = 0;
    w.__cls = 0;
    w.__tbt = 0;
    new PerformanceObserver((l) => {
      for (const e of l.getEntries()) w.__lcp = e.startTime;
    }).observe({ type: "largest-contentful-paint", buffered: true });
    new PerformanceObserver((l) => {
      for (const e of l.getEntries() as (PerformanceEntry & { value: number; hadRecentInput: boolean })[]) if (!e.hadRecentInput) w.__cls += e.value;
    }).observe({ type: "layout-shift", buffered: true });
    // Total blocking time: the part of each long task beyond 50 ms.
    new PerformanceObserver((l) => {
      for (const e of l.getEntries()) w.__tbt += Math.max(0, e.duration - 50);
    }).observe({ type: "longtask", buffered: true });
  });
  await page.goto(BASE + url, { waitUntil: "networkidle", timeout: 120_000 });
  await page.waitForTimeout(500);
  const m = await page.evaluate(() => {
    const w = window as unknown as { __lcp: number; __cls: number; __tbt: number };
    return { lcp: w.__lcp, cls: w.__cls, tbt: w.__tbt };
  });
  cdp.off("Network.responseReceived", onResponse);
  cdp.off("Network.loadingFinished", onFinished);
  let jsBytes = 0;
  let totalBytes = 0;
  for (const s of sizes.values()) {
    totalBytes += s.bytes;
    if (s.type === "Script") jsBytes += s.bytes;
  }
  return { jsBytes, totalBytes, ...m };
}

const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)] ?? Number.NaN;
};

export async function benchPages(pages: { name: string; url: string; map?: boolean }[]): Promise<void> {
  const dir = "data/bench-pages";
  rmSync(dir, { recursive: true, force: true });
  const env = {
    ...process.env,
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
  const server = spawn(process.execPath, ["node_modules/next/dist/bin/next", "start", "-p", String(PORT)], { env, stdio: ["ignore", "ignore", "inherit"], detached: true });
  const browser = await chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
    args: ["--no-sandbox", "--disable-gpu", "--disable-background-networking", "--disable-component-update", "--disable-sync", "--no-first-run", "--disable-quic"],
  });
  try {
    for (let i = 0; i < 60; i++) {
      try {
        if ((await fetch(`${BASE}/api/health`)).ok) break;
      } catch {
        // starting
      }
      await new Promise((r) => setTimeout(r, 500));
    }
    const rows: { name: string; f: Figures }[] = [];
    for (const p of pages) {
      const runs: Figures[] = [];
      for (let i = 0; i < RUNS; i++) {
        const context = await browser.newContext({ viewport: { width: 390, height: 844 }, deviceScaleFactor: 2, isMobile: true, hasTouch: true });
        const page = await context.newPage();
        const cdp = await context.newCDPSession(page);
        await cdp.send("Network.enable");
        await cdp.send("Network.emulateNetworkConditions", NETWORK);
        await cdp.send("Emulation.setCPUThrottlingRate", { rate: 4 });
        runs.push(await measure(cdp, p.url, page));
        await context.close();
      }
      rows.push({ name: p.name, f: { jsBytes: median(runs.map((r) => r.jsBytes)), totalBytes: median(runs.map((r) => r.totalBytes)), lcp: median(runs.map((r) => r.lcp)), cls: median(runs.map((r) => r.cls)), tbt: median(runs.map((r) => r.tbt)) } });
    }
    const kb = (b: number) => `${(b / 1024).toFixed(1)} KB`;
    console.log(`\nPages on a phone (390×844, 4× CPU slowdown, Slow 4G), median of ${RUNS} cold loads`);
    console.log("page              JS (gz)    budget   all bytes   LCP ms  budget  CLS    budget  TBT ms");
    for (const { name, f } of rows) {
      const map = pages.find((p) => p.name === name)?.map;
      const jsOk = map ? "map page" : f.jsBytes <= BUDGET.js ? "met" : "MISSED";
      console.log(
        `${name.padEnd(16)}  ${kb(f.jsBytes).padStart(9)}  ${jsOk.padEnd(8)} ${kb(f.totalBytes).padStart(10)}  ${String(Math.round(f.lcp)).padStart(6)}  ${f.lcp <= BUDGET.lcp ? "met   " : "MISSED"}  ${f.cls.toFixed(3)}  ${f.cls <= BUDGET.cls ? "met   " : "MISSED"}  ${String(Math.round(f.tbt)).padStart(6)}`,
      );
    }
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
