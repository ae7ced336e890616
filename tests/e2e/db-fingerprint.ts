import type { Client } from "@libsql/client";
import { createHash } from "node:crypto";

// Tells a spec whether a request stored anything: a read-only look at the e2e server's SQLite file (see
// e2eDatabase() in reservation-support.ts). `PRAGMA data_version` changes whenever another connection commits
// (sqlite.org/pragma.html#pragma_data_version), so most checks cost one query; only after a commit are the tables
// hashed to see which ones changed.

// Bookkeeping a refused request may rightly write: attempt counters (better-auth's and ours) and the stored answer
// to an Idempotency-Key, which is there so that a retry gets the same refusal back.
const NOT_CONTENT = new Set(["rate_limit", "api_rate_limit", "api_idempotency_key", "__drizzle_migrations"]);

type Fingerprint = Map<string, string>;

function cell(value: unknown): unknown {
  if (value instanceof ArrayBuffer) return Buffer.from(value).toString("hex");
  if (typeof value === "bigint") return value.toString();
  return value;
}

async function fingerprint(db: Client): Promise<Fingerprint> {
  const tables = await db.execute("select name from sqlite_master where type = 'table' and name not like 'sqlite_%' order by name");
  const out: Fingerprint = new Map();
  for (const t of tables.rows) {
    const name = String(t.name);
    if (NOT_CONTENT.has(name)) continue;
    const rows = await db.execute(`select * from "${name.replaceAll('"', '""')}" order by rowid`).catch(() => db.execute(`select * from "${name.replaceAll('"', '""')}"`));
    const hash = createHash("sha256");
    for (const row of rows.rows) hash.update(JSON.stringify(Array.from(row as ArrayLike<unknown>, cell)));
    out.set(name, `${rows.rows.length}:${hash.digest("hex")}`);
  }
  return out;
}

async function dataVersion(db: Client): Promise<number> {
  const r = await db.execute("pragma data_version");
  return Number(r.rows[0]?.[0] ?? -1);
}

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

export class DbTracker {
  private version = -1;
  private print: Fingerprint = new Map();

  constructor(private readonly db: Client) {}

  async start(): Promise<void> {
    this.version = await dataVersion(this.db);
    this.print = await fingerprint(this.db);
  }

  /** The tables whose rows differ from the last look (row count and a hash of every row), and takes a new look. */
  async changedTables(): Promise<string[]> {
    const version = await dataVersion(this.db);
    if (version === this.version) return [];
    const next = await fingerprint(this.db);
    const changed = [...new Set([...this.print.keys(), ...next.keys()])].filter((t) => this.print.get(t) !== next.get(t));
    this.version = version;
    this.print = next;
    return changed;
  }

  /**
   * After a request that was allowed to write: waits until the server has stopped committing (e-mail is queued in
   * the outbox and sent just after the reply), so that later writes are not blamed on the next request.
   */
  async settle(quietMs = 300, maxMs = 5000): Promise<void> {
    const until = Date.now() + maxMs;
    let version = await dataVersion(this.db);
    for (;;) {
      await sleep(quietMs);
      const now = await dataVersion(this.db);
      if (now === version || Date.now() > until) break;
      version = now;
    }
    await this.changedTables();
  }
}
