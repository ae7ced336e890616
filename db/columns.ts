import { sql } from "drizzle-orm";
import { integer } from "drizzle-orm/sqlite-core";

// Timestamp columns shared by every schema file: milliseconds since the epoch, set by SQLite.
const nowMs = sql`(cast(unixepoch('subsecond') * 1000 as integer))`;

export const createdAt = () => integer("created_at", { mode: "timestamp_ms" }).notNull().default(nowMs);

export const updatedAt = () =>
  integer("updated_at", { mode: "timestamp_ms" })
    .notNull()
    .default(nowMs)
    .$onUpdate(() => new Date());
