import "server-only";
import { createClient, type Client } from "@libsql/client";
import { drizzle, type LibSQLDatabase } from "drizzle-orm/libsql";
import { mkdirSync } from "node:fs";
import { dirname, resolve } from "node:path";
import { env } from "@/lib/env";
import { allSchema as schema } from "./all-schema";

export type Database = LibSQLDatabase<typeof schema>;

// Next's dev server reloads modules; keep one client per process outside production.
const globalForDb = globalThis as unknown as { shoalDb?: { client: Client; db: Database } };

function open(): { client: Client; db: Database } {
  if (env.DATABASE_URL.startsWith("file:") && !env.DATABASE_URL.includes(":memory:")) {
    // A fresh checkout has no data/ folder yet; the build and first start must not fail on it.
    mkdirSync(dirname(resolve(env.DATABASE_URL.slice("file:".length))), { recursive: true });
  }
  const client = createClient({
    url: env.DATABASE_URL,
    authToken: env.DATABASE_AUTH_TOKEN,
    // Busy timeout for local files: concurrent writers wait instead of failing with SQLITE_BUSY.
    timeout: 5000,
  });
  return { client, db: drizzle(client, { schema }) };
}

const opened = globalForDb.shoalDb ?? open();
if (env.NODE_ENV !== "production") globalForDb.shoalDb = opened;

export const dbClient = opened.client;
export const db = opened.db;
