import { defineConfig } from "drizzle-kit";

export default defineConfig({
  dialect: "sqlite",
  schema: ["./db/schema.ts", "./db/schema-reservations.ts", "./db/schema-jobs.ts", "./db/schema-reviews.ts"],
  out: "./db/migrations",
  dbCredentials: { url: process.env.DATABASE_URL ?? "file:./data/shoal.db" },
});
