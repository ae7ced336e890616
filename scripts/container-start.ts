import { spawn } from "node:child_process";
import { migrateDatabase } from "../db/migrate";
import { seedDemo } from "../db/seed";

// In a container the stand-ins run as their own services; this only migrates,
// seeds an empty database, and serves the app.
async function main(): Promise<void> {
  const url = process.env.DATABASE_URL ?? "file:./data/shoal.db";
  await migrateDatabase(url, process.env.DATABASE_AUTH_TOKEN);
  const summary = await seedDemo({ url, authToken: process.env.DATABASE_AUTH_TOKEN, onlyIfEmpty: true });
  if (summary) console.log(summary);
  const app = spawn(process.execPath, ["node_modules/next/dist/bin/next", "start", "-p", "3000"], { stdio: "inherit" });
  for (const signal of ["SIGINT", "SIGTERM"] as const) process.on(signal, () => app.kill(signal));
  app.on("exit", (code) => process.exit(code ?? 0));
}

main().catch((error: unknown) => {
  console.error(error);
  process.exit(1);
});
