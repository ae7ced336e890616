import { NextResponse } from "next/server";
import { withApi } from "@/lib/api/handler";
import { handlePaymentWebhook } from "@/lib/payments/webhook";

/** Signed processor events. The raw body is verified by the SDK; a bad signature is 400 and changes nothing. */
export const POST = withApi(async (request) => {
  const result = await handlePaymentWebhook(await request.text(), request.headers.get("stripe-signature"));
  if (result.status === 400) return NextResponse.json({ error: { code: "invalid_signature", message: result.error } }, { status: 400 });
  return NextResponse.json({ received: true, outcome: result.outcome });
});
