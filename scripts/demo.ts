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
  let stopping = false;
  const stop = async (code: number) => {
    if (stopping) return;
    stopping = true;
    app.kill("SIGTERM");
    await services.close();
    process.exit(code);
  };
  app.on("exit", (code) => void stop(code ?? 0));
  process.on("SIGINT", () => void stop(0));
  process.on("SIGTERM", () => void stop(0));
  console.log(`\nShoal is starting on ${appUrl.origin} — demo accounts are listed in README.md.\n`);
}

main().catch((error: unknown) => {
  console.error(error);
  process.exit(1);
});
