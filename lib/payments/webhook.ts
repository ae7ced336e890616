import "server-only";
import { settleHeldDeposit } from "@/lib/reservations/service";
import { applyPaymentEvent, type PaymentEventOutcome } from "./holds";
import { paymentProcessor } from "./processor-from-env";
import { PaymentError } from "./processor";

// A processor webhook delivery, end to end: verify the signature with the SDK (processor.parseWebhook), apply the
// event to its hold once (a replayed event id changes nothing), then let the hold's subject follow. A builder job
// adds its own line below when jobs take deposits.

export type WebhookResult = { status: 200; outcome: PaymentEventOutcome["outcome"] } | { status: 400; error: string };

export async function handlePaymentWebhook(rawBody: string, signature: string | null): Promise<WebhookResult> {
  let event;
  try {
    event = await paymentProcessor().parseWebhook(rawBody, signature);
  } catch (err) {
    if (err instanceof PaymentError && err.code === "invalid_signature") return { status: 400, error: "The signature does not verify." };
    throw err;
  }
  const result = await applyPaymentEvent(event);
  if (result.becameHeld && result.hold?.subjectType === "reservation") {
    await settleHeldDeposit(result.hold, { role: "system" });
  }
  return { status: 200, outcome: result.outcome };
}
