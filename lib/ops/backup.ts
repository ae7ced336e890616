import { createClient } from "@libsql/client";
import { copyFileSync, existsSync, mkdirSync, renameSync, rmSync } from "node:fs";
import { dirname, resolve } from "node:path";

function filePath(url: string): string {
  if (!url.startsWith("file:") || url.includes(":memory:")) throw new Error("backups work on a SQLite file (DATABASE_URL=file:…); a libSQL server has its own");
  return resolve(url.slice("file:".length));
}

/**
 * A consistent copy of the live database: SQLite's VACUUM INTO writes a snapshot from
 * one read transaction, so the app can keep writing meanwhile (WAL mode).
 */
export async function backupDatabase(url: string, target: string): Promise<{ path: string; integrity: string }> {
  filePath(url);
  const out = resolve(target);
  mkdirSync(dirname(out), { recursive: true });
  if (existsSync(out)) throw new Error(`${out} exists already`);
  const client = createClient({ url, timeout: 10_000 });
  try {
    await client.execute({ sql: "VACUUM INTO ?", args: [out] });
  } finally {
    client.close();
  }
  return { path: out, integrity: await integrityOf(`file:${out}`) };
}

export async function integrityOf(url: string): Promise<string> {
  const client = createClient({ url });
  try {
    const r = await client.execute("PRAGMA integrity_check");
    return String(r.rows[0]?.[0] ?? "no answer");
  } finally {
    client.close();
  }
}

/**
 * Puts a backup in place of the database (the app must be stopped). The backup is
 * checked first; the current file is kept beside it as <name>.before-restore.
 */
export async function restoreDatabase(backup: string, url: string): Promise<void> {
  const source = resolve(backup);
  const integrity = await integrityOf(`file:${source}`);
  if (integrity !== "ok") throw new Error(`the backup fails its integrity check: ${integrity}`);
  const target = filePath(url);
  mkdirSync(dirname(target), { recursive: true });
  if (existsSync(target)) renameSync(target, `${target}.before-restore`);
  for (const side of ["-wal", "-shm"]) rmSync(`${target}${side}`, { force: true });
  copyFileSync(source, target);
}
