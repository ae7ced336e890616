// Tables for tank requests, quotes, jobs and portfolios. Kept apart from db/schema.ts.
export {};
