import { resolve } from "node:path";
import { fileURLToPath } from "node:url";
import { startMailServer } from "./fakes/mail-server";
import { startPaymentsServer } from "./fakes/payments-server";
import { startS3Server } from "./fakes/s3-server";
import { loadDotEnv } from "./load-env";

export type RunningServices = { close(): Promise<void> };

function twinOrigins(appUrl: string): string[] {
  const u = new URL(appUrl);
  const other = u.hostname === "localhost" ? "127.0.0.1" : u.hostname === "127.0.0.1" ? "localhost" : null;
  return other ? [u.origin, `${u.protocol}//${other}${u.port ? `:${u.port}` : ""}`] : [u.origin];
}

/** Starts the embedded stand-ins (S3, mail, payments) in this process, from the environment. */
export async function startServices(): Promise<RunningServices> {
  const e = process.env;
  const appUrl = e.APP_URL ?? "http://localhost:3000";
  const s3 = await startS3Server({
    port: Number(e.S3_FAKE_PORT ?? 4569),
    directory: resolve(e.S3_FAKE_DATA ?? "./data/s3"),
    bucket: e.S3_BUCKET ?? "shoal-images",
    allowedOrigins: twinOrigins(appUrl),
  });
  const mail = await startMailServer({ port: Number(e.MAIL_FAKE_PORT ?? 4610), dataDir: resolve(e.MAIL_FAKE_DATA ?? "./data/mail") });
  const payments = await startPaymentsServer({
    port: Number(e.PAYMENTS_FAKE_PORT ?? 4620),
    dataDir: resolve(e.PAYMENTS_FAKE_DATA ?? "./data/payments"),
    secretKey: e.STRIPE_SECRET_KEY ?? "sk_test_local_shoal",
    webhookSecret: e.STRIPE_WEBHOOK_SECRET ?? "whsec_local_shoal_webhook_secret",
    webhookUrl: e.PAYMENTS_WEBHOOK_URL ?? `${new URL(appUrl).origin}/api/webhooks/stripe`,
  });
  console.log(`[services] s3 ${s3.url} · mail ${mail.url} · payments ${payments.url}`);
  return {
    close: async () => {
      await Promise.allSettled([s3.close(), mail.close(), payments.close()]);
    },
  };
}

if (process.argv[1] && resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  loadDotEnv();
  startServices()
    .then((services) => {
      const stop = () => void services.close().then(() => process.exit(0));
      process.on("SIGINT", stop);
      process.on("SIGTERM", stop);
    })
    .catch((error: unknown) => {
      console.error(error);
      process.exit(1);
    });
}
