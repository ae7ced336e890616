import { spawn } from "node:child_process";
import { migrateDatabase } from "../db/migrate";
import { seedDemo } from "../db/seed";
import { loadDotEnv } from "./load-env";
import { startServices } from "./services";

// Starts the whole demo in one command: the stand-ins, the database (migrated and
// seeded when empty) and the built app. Ctrl-C stops everything.
async function main(): Promise<void> {
  loadDotEnv();
  const services = await startServices();
  const url = process.env.DATABASE_URL ?? "file:./data/shoal.db";
  await migrateDatabase(url, process.env.DATABASE_AUTH_TOKEN);
  const seeded = await seedDemo({ url, authToken: process.env.DATABASE_AUTH_TOKEN, onlyIfEmpty: true });
  if (seeded) console.log(seeded);

  const appUrl = new URL(process.env.APP_URL ?? "http://localhost:3000");
  const port = appUrl.port || "3000";
  const app = spawn(process.execPath, ["node_modules/next/dist/bin/next", "start", "-p", port], { stdio: "inherit", env: process.env });
  const sweeper = startSweepTimer(appUrl.origin);
  let stopping = false;
  const stop = async (code: number) => {
    if (stopping) return;
    stopping = true;
    clearInterval(sweeper);
    app.kill("SIGTERM");
    await services.close();
    process.exit(code);
  };
  app.on("exit", (code) => void stop(code ?? 0));
  process.on("SIGINT", () => void stop(0));
  process.on("SIGTERM", () => void stop(0));
  console.log(`\nShoal is starting on ${appUrl.origin} — demo accounts are listed in README.md.\n`);
}

// ---- Scheduled sweep (issue 4) ---------------------------------------------------------------------------------
// In production a cron calls POST /api/cron/sweep; here the demo runner does, every minute. The sweep lapses stale
// reservations, sends day-7 reminders, releases holds past their time and sends mail left over. It is safe to run
// twice at once, so an overlap with a slow earlier call does no harm.
const SWEEP_EVERY_MS = 60_000;
function startSweepTimer(origin: string): NodeJS.Timeout {
  const secret = process.env.CRON_SECRET || "cron_local_shoal_sweep"; // the default in lib/env.ts
  return setInterval(() => {
    fetch(`${origin}/api/cron/sweep`, { method: "POST", headers: { authorization: `Bearer ${secret}` } })
      .then(async (r) => {
        if (!r.ok) console.error(`[sweep] answered ${r.status}`);
      })
      .catch(() => undefined); // the app may still be starting or already stopping
  }, SWEEP_EVERY_MS);
}
// ---------------------------------------------------------------------------------------------------------------

main().catch((error: unknown) => {
  console.error(error);
  process.exit(1);
});
