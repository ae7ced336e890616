import "server-only";
import { z } from "zod";

// The only reader of process.env. Every value has the embedded default that the
// demo uses (SQLite file, s3rver, the local mail and payment stand-ins); a
// deployment changes URLs and keys only.
const boolish = z
  .enum(["true", "false", "1", "0"])
  .transform((v) => v === "true" || v === "1");

const envSchema = z.object({
  NODE_ENV: z.enum(["development", "production", "test"]).default("development"),
  APP_URL: z.url().default("http://localhost:3000"),
  DATABASE_URL: z.string().min(1).default("file:./data/shoal.db"),
  DATABASE_AUTH_TOKEN: z.string().optional(),
  BETTER_AUTH_SECRET: z.string().min(32, "BETTER_AUTH_SECRET must be at least 32 characters"),
  MAIL_FROM: z.string().min(3).default("Shoal <hello@shoal.local>"),
  RESEND_API_KEY: z.string().min(1).default("re_local_dev_key"),
  RESEND_BASE_URL: z.url().default("http://127.0.0.1:4610"),
  DEV_OUTBOX: boolish.default(false),
  S3_ENDPOINT: z.url().default("http://127.0.0.1:4569"),
  S3_PUBLIC_ENDPOINT: z.url().optional(),
  S3_REGION: z.string().min(1).default("us-east-1"),
  S3_BUCKET: z.string().min(3).default("shoal-images"),
  S3_ACCESS_KEY_ID: z.string().min(1).default("S3RVER"),
  S3_SECRET_ACCESS_KEY: z.string().min(1).default("S3RVER"),
  S3_FORCE_PATH_STYLE: boolish.default(true),
  STRIPE_SECRET_KEY: z.string().min(1).default("sk_test_local_shoal"),
  STRIPE_API_BASE: z.url().default("http://127.0.0.1:4620"),
  STRIPE_WEBHOOK_SECRET: z.string().min(1).default("whsec_local_shoal"),
  // Shared secret of the scheduled sweep (POST /api/cron/sweep with "Authorization: Bearer <secret>").
  CRON_SECRET: z.string().min(16, "CRON_SECRET must be at least 16 characters").default("cron_local_shoal_sweep"),
  MAP_STYLE_URL: z.url().optional(),
  // Sign-in and sign-up attempts allowed per client address per minute (better-auth's database store). The
  // end-to-end run raises them: its whole suite signs in from one address, 127.0.0.1.
  AUTH_SIGN_IN_PER_MINUTE: z.coerce.number().int().min(1).max(100_000).default(30),
  AUTH_SIGN_UP_PER_MINUTE: z.coerce.number().int().min(1).max(100_000).default(20),
  // Enables the full-scan search strategy that the benchmark compares against. Never in production.
  SHOAL_BENCH: boolish.default(false),
  DEFAULT_CURRENCY: z.string().regex(/^[A-Z]{3}$/, "ISO 4217 code").default("ZMW"),
});

export type Env = z.infer<typeof envSchema>;

function readEnv(): Env {
  // An empty value (KEY= in .env) means "use the default", as for an unset one.
  const present = Object.fromEntries(Object.entries(process.env).filter(([, v]) => v !== ""));
  const parsed = envSchema.safeParse(present);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join(".")}: ${i.message}`);
    throw new Error(`Invalid environment (see .env.example):\n${lines.join("\n")}`);
  }
  return parsed.data;
}

export const env: Env = readEnv();
