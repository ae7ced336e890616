import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { migrateDatabase } from "@/db/migrate";

/**
 * A fresh SQLite file migrated from scratch, exported as DATABASE_URL before any
 * module that opens the database is imported (import those dynamically after this).
 */
export async function useTempDatabase(): Promise<{ url: string; cleanup(): void }> {
  const dir = mkdtempSync(join(tmpdir(), "shoal-test-"));
  const url = `file:${join(dir, "test.db")}`;
  await migrateDatabase(url);
  process.env.DATABASE_URL = url;
  process.env.BETTER_AUTH_SECRET ??= "test-secret-test-secret-test-secret-0000";
  return { url, cleanup: () => rmSync(dir, { recursive: true, force: true }) };
}
