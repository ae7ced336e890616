import { spawnSync } from "node:child_process";
import { existsSync, mkdirSync, readFileSync } from "node:fs";

// The whole test suite, as README.md and .ci/run call it: unit and database tests
// (vitest), a production build, then end-to-end tests (Playwright in Debian's
// chromium). Ends with one line "N passed, N failed" for all suites together.

const CHROMIUM = process.env.CHROMIUM_PATH ?? "/usr/bin/chromium";

function run(cmd: string, args: string[], env: NodeJS.ProcessEnv = process.env): number {
  console.log(`\n$ ${cmd} ${args.join(" ")}`);
  const r = spawnSync(cmd, args, { stdio: "inherit", env });
  return r.status ?? 1;
}

function ensureChromium(): void {
  if (existsSync(CHROMIUM)) return;
  const isRoot = typeof process.getuid === "function" && process.getuid() === 0;
  if (isRoot && existsSync("/usr/bin/apt-get")) {
    console.log("chromium is missing: installing Debian's package");
    if (run("apt-get", ["update", "-qq"]) === 0 && run("apt-get", ["install", "-y", "-qq", "chromium"]) === 0 && existsSync(CHROMIUM)) return;
  }
  console.error(`chromium not found at ${CHROMIUM}. Install it with:\n  sudo apt-get update && sudo apt-get install -y chromium`);
  process.exit(1);
}

type Counts = { passed: number; failed: number; skipped: number };

function vitestCounts(file: string): Counts {
  if (!existsSync(file)) return { passed: 0, failed: 1, skipped: 0 };
  const j = JSON.parse(readFileSync(file, "utf8")) as { numPassedTests: number; numFailedTests: number; numPendingTests: number; numTodoTests: number };
  return { passed: j.numPassedTests, failed: j.numFailedTests, skipped: j.numPendingTests + j.numTodoTests };
}

function playwrightCounts(file: string): Counts {
  if (!existsSync(file)) return { passed: 0, failed: 1, skipped: 0 };
  const j = JSON.parse(readFileSync(file, "utf8")) as { stats: { expected: number; unexpected: number; flaky: number; skipped: number } };
  return { passed: j.stats.expected + j.stats.flaky, failed: j.stats.unexpected, skipped: j.stats.skipped };
}

ensureChromium();
mkdirSync("test-results", { recursive: true });
const env = { ...process.env, NEXT_TELEMETRY_DISABLED: "1" };
run("npx", ["tsx", "scripts/setup-env.ts"], env);
if (run("npx", ["tsx", "scripts/prepare-assets.ts"], env) !== 0) process.exit(1);

const unitStatus = run("npx", ["vitest", "run", "--reporter=default", "--reporter=json", "--outputFile=test-results/unit.json"], env);
const unit = vitestCounts("test-results/unit.json");

let e2e: Counts = { passed: 0, failed: 0, skipped: 0 };
let e2eStatus = 0;
const buildStatus = run("npm", ["run", "build"], env);
if (buildStatus === 0) {
  e2eStatus = run("npx", ["playwright", "test"], env);
  e2e = playwrightCounts("test-results/e2e.json");
} else {
  e2e.failed = 1; // the build itself failed: count it so the run cannot look green
}

const passed = unit.passed + e2e.passed;
const failed = unit.failed + e2e.failed + (unitStatus !== 0 && unit.failed === 0 ? 1 : 0) + (e2eStatus !== 0 && e2e.failed === 0 ? 1 : 0);
console.log(`\nunit: ${unit.passed} passed, ${unit.failed} failed · e2e: ${e2e.passed} passed, ${e2e.failed} failed${buildStatus ? " (build failed)" : ""}`);
const skipped = unit.skipped + e2e.skipped;
console.log(`${passed} passed, ${failed} failed${skipped ? `, ${skipped} skipped` : ""}`);
process.exit(failed > 0 ? 1 : 0);
