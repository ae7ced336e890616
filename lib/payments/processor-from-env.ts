import "server-only";
import { env } from "@/lib/env";
import type { PaymentProcessor } from "./processor";
import { StripePaymentProcessor } from "./stripe-processor";

let processorInstance: PaymentProcessor | undefined;

/** The processor named by the environment (the Stripe SDK, pointed at STRIPE_API_BASE). */
export function paymentProcessor(): PaymentProcessor {
  processorInstance ??= new StripePaymentProcessor({ secretKey: env.STRIPE_SECRET_KEY, apiBase: env.STRIPE_API_BASE, webhookSecret: env.STRIPE_WEBHOOK_SECRET });
  return processorInstance;
}
