import { createClient } from "@libsql/client";
import { drizzle } from "drizzle-orm/libsql";
import { migrate } from "drizzle-orm/libsql/migrator";
import { mkdirSync } from "node:fs";
import { dirname, resolve } from "node:path";
import { fileURLToPath } from "node:url";

const migrationsFolder = resolve(dirname(fileURLToPath(import.meta.url)), "migrations");

/** Applies every pending migration; used on start, by the seed and by database tests. */
export async function migrateDatabase(url: string, authToken?: string): Promise<void> {
  if (url.startsWith("file:")) {
    const path = url.slice("file:".length);
    if (path && !path.startsWith(":")) mkdirSync(dirname(resolve(path)), { recursive: true });
  }
  const client = createClient({ url, authToken, timeout: 5000 });
  try {
    if (url.startsWith("file:") && !url.includes(":memory:")) {
      // WAL lets readers go on while one writer commits; the setting is stored in the file.
      await client.execute("PRAGMA journal_mode=WAL");
    }
    await migrate(drizzle(client), { migrationsFolder });
  } finally {
    client.close();
  }
}

if (process.argv[1] && resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  const url = process.env.DATABASE_URL ?? "file:./data/shoal.db";
  migrateDatabase(url, process.env.DATABASE_AUTH_TOKEN)
    .then(() => console.log(`migrations applied to ${url}`))
    .catch((error: unknown) => {
      console.error(error);
      process.exit(1);
    });
}
