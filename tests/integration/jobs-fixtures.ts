// Test support for the tank request, quote, job and upload tests: people and places written straight into a
// temporary database (tests/support/temp-db.ts), and the local stand-ins for mail and payments on free ports.
import { randomUUID } from "node:crypto";
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import type { Role } from "@/lib/catalog";
import type { VerificationState } from "@/lib/catalog";
import { startMailServer } from "@/scripts/fakes/mail-server";
import { startPaymentsServer } from "@/scripts/fakes/payments-server";
import { startS3Server } from "@/scripts/fakes/s3-server";
import { useTempDatabase } from "../support/temp-db";

export type Stand = { mailUrl: string; close(): Promise<void> };

export const TEST_BUCKET = "shoal-test-jobs";

/**
 * A temp database plus the mail, payments and S3 stand-ins, exported through the environment before any app
 * module is imported (lib/env.ts reads it once). Import app modules dynamically after this resolves.
 */
export async function useJobsEnvironment(): Promise<Stand> {
  const db = await useTempDatabase();
  const dir = mkdtempSync(join(tmpdir(), "shoal-jobs-stand-"));
  const mail = await startMailServer({ port: 0, dataDir: join(dir, "mail") });
  const payments = await startPaymentsServer({ port: 0, dataDir: join(dir, "payments"), secretKey: "sk_test_jobs", webhookSecret: "whsec_test_jobs" });
  const s3 = await startS3Server({ port: 0, directory: join(dir, "s3"), bucket: TEST_BUCKET, allowedOrigins: ["http://127.0.0.1:3000"] });
  Object.assign(process.env, {
    RESEND_BASE_URL: mail.url,
    RESEND_API_KEY: "re_test_jobs",
    STRIPE_API_BASE: payments.url,
    STRIPE_SECRET_KEY: "sk_test_jobs",
    STRIPE_WEBHOOK_SECRET: "whsec_test_jobs",
    S3_ENDPOINT: s3.url,
    S3_BUCKET: TEST_BUCKET,
    S3_ACCESS_KEY_ID: "S3RVER",
    S3_SECRET_ACCESS_KEY: "S3RVER",
    APP_URL: "http://127.0.0.1:3000",
  });
  return {
    mailUrl: mail.url,
    close: async () => {
      await Promise.allSettled([mail.close(), payments.close(), s3.close()]);
      db.cleanup();
      rmSync(dir, { recursive: true, force: true });
    },
  };
}

/** Subjects of the mails the stand-in holds for one address. */
export async function mailSubjects(mailUrl: string, to: string): Promise<string[]> {
  const r = await fetch(`${mailUrl}/emails?to=${encodeURIComponent(to)}`, { headers: { authorization: "Bearer re_test_jobs" } });
  const body = (await r.json()) as { data: { subject: string }[] };
  return body.data.map((m) => m.subject);
}

type Point = { lat: number; lng: number };

export type PersonOptions = { roles: Role[]; at?: Point | null; state?: VerificationState; radiusKm?: number; ratePerKmMinor?: number; baseFeeMinor?: number; builderRow?: boolean };

/** A user with a profile; builders get terms and a tarpaulin price row. Returns the id and e-mail. */
export async function addPerson(options: PersonOptions): Promise<{ id: string; email: string }> {
  const { db } = await import("@/db/client");
  const s = await import("@/db/schema");
  const id = randomUUID();
  const email = `${id}@example.test`;
  await db.insert(s.user).values({ id, name: `Person ${id.slice(0, 4)}`, email, emailVerified: true });
  for (const role of options.roles) await db.insert(s.userRole).values({ userId: id, role });
  await db.insert(s.profile).values({
    userId: id,
    displayName: `Person ${id.slice(0, 4)}`,
    region: "Lusaka",
    lat: options.at?.lat ?? null,
    lng: options.at?.lng ?? null,
    verificationState: options.state ?? "verified",
    onboardedAt: new Date(),
  });
  if (options.builderRow ?? options.roles.includes("builder")) {
    await db.insert(s.builder).values({ userId: id, serviceRadiusKm: options.radiusKm ?? 30, currency: "ZMW", baseFeeMinor: options.baseFeeMinor ?? 50_000, travelRatePerKmMinor: options.ratePerKmMinor ?? 1_000 });
    await db.insert(s.builderPrice).values({ builderId: id, tankType: "tarpaulin", materialsPerSqmMinor: 35_000, labourPerSqmMinor: 15_000 });
  }
  return { id, email };
}

/** A request form as the browser sends it (strings as typed). */
export function requestForm(site: Point, overrides: Record<string, string> = {}): Record<string, string> {
  const inAMonth = new Date(Date.now() + 30 * 24 * 3600 * 1000).toISOString().slice(0, 10);
  return {
    id: randomUUID(),
    tankType: "tarpaulin",
    shape: "rectangular",
    unit: "m",
    length: "3",
    width: "2",
    diameter: "",
    depth: "1.2",
    lat: String(site.lat),
    lng: String(site.lng),
    readiness: "compacted_ground",
    waterSource: "borehole",
    power: "solar",
    wantedBy: inAMonth,
    planId: "",
    notes: "",
    ...overrides,
  };
}
