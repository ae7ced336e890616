import { createClient } from "@libsql/client";
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { migrateDatabase } from "@/db/migrate";
import { backupDatabase, integrityOf, restoreDatabase } from "@/lib/ops/backup";

const dir = mkdtempSync(join(tmpdir(), "shoal-backup-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe("backup and restore", () => {
  it("copies a consistent database while another connection keeps writing, and restores it", async () => {
    const url = `file:${join(dir, "live.db")}`;
    await migrateDatabase(url);
    const writer = createClient({ url, timeout: 10_000 });
    await writer.execute("CREATE TABLE probe (n INTEGER NOT NULL)");
    await writer.execute("INSERT INTO probe VALUES (0)");
    // Writes go on while the backup runs; each transaction inserts a pair (n, -n), so a torn copy would show an even count or a non-zero sum.
    let stop = false;
    const writes = (async () => {
      let i = 1;
      while (!stop) {
        await writer.batch([{ sql: "INSERT INTO probe VALUES (?)", args: [i] }, { sql: "INSERT INTO probe VALUES (?)", args: [-i] }], "write");
        i++;
        await new Promise((r) => setImmediate(r)); // let the timer and the backup's own calls run
      }
      return i;
    })();
    await new Promise((r) => setTimeout(r, 50));
    const { path, integrity } = await backupDatabase(url, join(dir, "copy.db"));
    stop = true;
    const pairs = await writes;
    expect(pairs).toBeGreaterThan(5); // writing really went on around the backup
    expect(integrity).toBe("ok");

    const copy = createClient({ url: `file:${path}` });
    const copied = Number((await copy.execute("SELECT count(*), sum(n) FROM probe")).rows[0]?.[0]);
    const sum = Number((await copy.execute("SELECT sum(n) FROM probe")).rows[0]?.[0]);
    copy.close();
    expect(copied % 2).toBe(1); // the first row plus whole pairs only
    expect(sum).toBe(0);

    // Restore into a fresh place and read it back.
    const restoredUrl = `file:${join(dir, "restored.db")}`;
    await restoreDatabase(path, restoredUrl);
    expect(await integrityOf(restoredUrl)).toBe("ok");
    const restored = createClient({ url: restoredUrl });
    expect(Number((await restored.execute("SELECT count(*) FROM probe")).rows[0]?.[0])).toBe(copied);
    expect(Number((await restored.execute("SELECT count(*) FROM __drizzle_migrations")).rows[0]?.[0])).toBeGreaterThan(0);
    restored.close();
    writer.close();
  });

  it("refuses to restore a damaged backup and leaves the database alone", async () => {
    const url = `file:${join(dir, "keep.db")}`;
    await migrateDatabase(url);
    const bad = join(dir, "bad.db");
    const { writeFileSync } = await import("node:fs");
    writeFileSync(bad, "this is not a database");
    await expect(restoreDatabase(bad, url)).rejects.toThrow();
    expect(await integrityOf(url)).toBe("ok");
  });
});
