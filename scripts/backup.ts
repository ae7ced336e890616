import { backupDatabase, restoreDatabase } from "../lib/ops/backup";
import { loadDotEnv } from "./load-env";

// npm run backup                 → data/backups/shoal-<time>.db, while the app runs
// npm run backup -- --restore F  → puts backup F in place (stop the app first)
loadDotEnv();
const url = process.env.DATABASE_URL ?? "file:./data/shoal.db";
const restoreAt = process.argv.indexOf("--restore");

async function main(): Promise<void> {
  if (restoreAt >= 0) {
    const file = process.argv[restoreAt + 1];
    if (!file) throw new Error("--restore needs the backup file");
    await restoreDatabase(file, url);
    console.log(`restored ${file} to ${url}`);
    return;
  }
  const stamp = new Date().toISOString().replace(/[:.]/g, "-");
  const { path, integrity } = await backupDatabase(url, `data/backups/shoal-${stamp}.db`);
  console.log(`backup written to ${path} (integrity: ${integrity})`);
}

main().catch((error: unknown) => {
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
});
