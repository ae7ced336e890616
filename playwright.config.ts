import { defineConfig, devices } from "@playwright/test";

import { E2E_BASE_URL } from "./tests/e2e/ports";

// End-to-end tests drive a production build in Debian's chromium. The test server
// runs on its own ports with a fresh database and stand-in data under data/e2e.

const chromiumArgs = [
  "--no-sandbox",
  "--disable-gpu",
  "--disable-background-networking",
  "--disable-component-update",
  "--disable-sync",
  "--no-first-run",
  "--disable-quic",
];

export default defineConfig({
  testDir: "tests/e2e",
  outputDir: "test-results/e2e",
  fullyParallel: false,
  workers: 1,
  retries: 0,
  timeout: 60_000,
  expect: { timeout: 10_000 },
  reporter: process.env.CI ? [["list"], ["json", { outputFile: "test-results/e2e.json" }]] : [["list"], ["json", { outputFile: "test-results/e2e.json" }]],
  use: {
    baseURL: E2E_BASE_URL,
    trace: "retain-on-failure",
    screenshot: "only-on-failure",
    launchOptions: { executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium", args: chromiumArgs },
  },
  projects: [
    { name: "desktop", use: { ...devices["Desktop Chrome"], viewport: { width: 1280, height: 800 } } },
    { name: "phone", use: { ...devices["Pixel 7"], viewport: { width: 390, height: 844 } }, grep: /@phone/ },
  ],
  webServer: {
    command: "tsx scripts/e2e-server.ts",
    url: `${E2E_BASE_URL}/api/health`,
    timeout: 120_000,
    reuseExistingServer: false,
    stdout: "pipe",
    stderr: "pipe",
  },
});
