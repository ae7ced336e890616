import * as core from "./schema";
import * as jobs from "./schema-jobs";
import * as reservations from "./schema-reservations";
import * as reviews from "./schema-reviews";

/** Every table and relation, for drizzle's relational queries (db/client.ts, the seed). */
export const allSchema = { ...core, ...reservations, ...jobs, ...reviews };
