import { randomUUID } from "node:crypto";
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { startMailServer, type RunningMailServer } from "@/scripts/fakes/mail-server";
import { startPaymentsServer, type RunningPaymentsServer } from "@/scripts/fakes/payments-server";
import { startWebhookReceiver, type WebhookReceiver } from "@/scripts/fakes/webhook-receiver";
import { useTempDatabase } from "./temp-db";

// A temporary database migrated from scratch, the payments stand-in (real Stripe SDK on a random port, webhooks
// delivered to a recording receiver) and the mail stand-in, with the environment pointed at them before any app
// module is imported. Import app modules dynamically after `startReservationWorld()`.

export const STRIPE_SECRET = "sk_test_reservation_world";
export const STRIPE_WEBHOOK_SECRET = "whsec_reservation_world_test";

export interface ReservationWorld {
  payments: RunningPaymentsServer;
  mail: RunningMailServer;
  webhooks: WebhookReceiver;
  close(): Promise<void>;
}

export async function startReservationWorld(): Promise<ReservationWorld> {
  const db = await useTempDatabase();
  const dir = mkdtempSync(join(tmpdir(), "shoal-world-"));
  const webhooks = await startWebhookReceiver();
  const payments = await startPaymentsServer({
    port: 0,
    dataDir: join(dir, "payments"),
    secretKey: STRIPE_SECRET,
    webhookSecret: STRIPE_WEBHOOK_SECRET,
    webhookUrl: webhooks.url,
    webhookRetryDelaysMs: [],
  });
  const mail = await startMailServer({ port: 0, dataDir: join(dir, "mail") });
  Object.assign(process.env, {
    STRIPE_SECRET_KEY: STRIPE_SECRET,
    STRIPE_WEBHOOK_SECRET,
    STRIPE_API_BASE: payments.url,
    RESEND_BASE_URL: mail.url,
    RESEND_API_KEY: "re_world_test",
    APP_URL: "http://localhost:3999",
  });
  return {
    payments,
    mail,
    webhooks,
    close: async () => {
      await Promise.allSettled([payments.close(), mail.close(), webhooks.close()]);
      db.cleanup();
      rmSync(dir, { recursive: true, force: true });
    },
  };
}

type Db = typeof import("@/db/client").db;

/** A user with a profile and the given roles; a hatchery also gets its hatchery row. */
export async function addPerson(db: Db, roles: ("farmer" | "hatchery" | "admin")[], name = "Test person"): Promise<{ id: string; roles: typeof roles }> {
  const schema = await import("@/db/schema");
  const id = randomUUID();
  await db.insert(schema.user).values({ id, name, email: `${id}@example.test`, emailVerified: true });
  for (const role of roles) await db.insert(schema.userRole).values({ userId: id, role });
  await db.insert(schema.profile).values({ userId: id, displayName: name, region: "Lusaka", phone: "+260971234567", lat: -15.4, lng: 28.3, onboardedAt: new Date() });
  if (roles.includes("hatchery")) await db.insert(schema.hatchery).values({ userId: id, species: ["tilapia"], delivers: false, deliveryRadiusKm: 0 });
  return { id, roles };
}

/** The stand-in's record of a payment intent, read with the secret key as the SDK would. */
export async function standInIntent(world: ReservationWorld, intentId: string): Promise<{ amount: number; amount_capturable: number; amount_received: number; status: string; latest_charge: { amount_refunded: number } | null }> {
  const res = await fetch(`${world.payments.url}/v1/payment_intents/${intentId}?expand[]=latest_charge`, { headers: { Authorization: `Bearer ${STRIPE_SECRET}` } });
  if (!res.ok) throw new Error(`stand-in answered ${res.status}`);
  return (await res.json()) as { amount: number; amount_capturable: number; amount_received: number; status: string; latest_charge: { amount_refunded: number } | null };
}

export async function standInMailTo(world: ReservationWorld, to: string): Promise<{ subject: string }[]> {
  const res = await fetch(`${world.mail.url}/emails?to=${encodeURIComponent(to)}&limit=100`, { headers: { Authorization: "Bearer re_world_test" } });
  return ((await res.json()) as { data: { subject: string }[] }).data;
}
