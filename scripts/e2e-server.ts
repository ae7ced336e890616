import { rmSync } from "node:fs";
import { spawn } from "node:child_process";
import { E2E_BASE_URL, E2E_PORT, E2E_SERVICE_PORTS as P } from "../tests/e2e/ports";

// The server Playwright starts: the demo runner on test ports with a fresh data
// folder, so tests never touch the demo's database or outbox.
const dir = `data/e2e-${E2E_PORT}`;
rmSync(dir, { recursive: true, force: true });
const env = {
  ...process.env,
  APP_URL: E2E_BASE_URL,
  DATABASE_URL: `file:./${dir}/shoal.db`,
  S3_ENDPOINT: `http://127.0.0.1:${P.s3}`,
  S3_FAKE_PORT: String(P.s3),
  S3_FAKE_DATA: `./${dir}/s3`,
  RESEND_BASE_URL: `http://127.0.0.1:${P.mail}`,
  MAIL_FAKE_PORT: String(P.mail),
  MAIL_FAKE_DATA: `./${dir}/mail`,
  STRIPE_API_BASE: `http://127.0.0.1:${P.payments}`,
  PAYMENTS_FAKE_PORT: String(P.payments),
  PAYMENTS_FAKE_DATA: `./${dir}/payments`,
  PAYMENTS_WEBHOOK_URL: `http://127.0.0.1:${E2E_PORT}/api/webhooks/stripe`,
  DEV_OUTBOX: "true",
  // Every spec signs in from 127.0.0.1, so the per-address limits would refuse the suite itself after a
  // minute; the limits stay on, just wide enough for one test run.
  AUTH_SIGN_IN_PER_MINUTE: "1000",
  AUTH_SIGN_UP_PER_MINUTE: "200",
  NEXT_TELEMETRY_DISABLED: "1",
};
const child = spawn(process.execPath, ["node_modules/tsx/dist/cli.mjs", "scripts/demo.ts"], { stdio: "inherit", env });
const stop = () => child.kill("SIGTERM");
process.on("SIGINT", stop);
process.on("SIGTERM", stop);
child.on("exit", (code) => process.exit(code ?? 0));
