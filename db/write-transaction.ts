import type { Database } from "./client";

// Why this exists: @libsql/client's local-file driver runs every statement synchronously on one of a pool of
// connections, and a transaction starts with BEGIN IMMEDIATE. When two transactions of the same process overlap,
// the second BEGIN blocks the whole event loop in SQLite's busy handler while the first (which needs the event loop
// to reach its COMMIT) cannot finish: measured here, 50 overlapping transactions took 96 s and 49 failed with
// SQLITE_BUSY or TRANSACTION_ACTIVE. So write transactions in one process take turns through this queue, and each
// keeps to database work only (no network calls inside). Across processes or instances SQLite's own lock (and the
// conditional UPDATEs the callers use) still decide; this only stops a process from deadlocking itself.

export type WriteTx = Parameters<Parameters<Database["transaction"]>[0]>[0];

const queueHolder = globalThis as unknown as { shoalWriteQueue?: Promise<void> };

/** Runs `fn` in a database transaction once every earlier write transaction of this process has settled. */
export async function writeTransaction<T>(db: Database, fn: (tx: WriteTx) => Promise<T>): Promise<T> {
  const previous = queueHolder.shoalWriteQueue ?? Promise.resolve();
  let release: () => void = () => undefined;
  const mine = new Promise<void>((resolveTurn) => {
    release = resolveTurn;
  });
  queueHolder.shoalWriteQueue = previous.then(() => mine);
  await previous;
  try {
    return await db.transaction(fn);
  } finally {
    release();
  }
}
