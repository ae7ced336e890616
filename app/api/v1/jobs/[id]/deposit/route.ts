import { NextResponse } from "next/server";
import { parseWith, readJson, withApi } from "@/lib/api/handler";
import { requireApiPermission } from "@/lib/auth/session";
import { DomainError } from "@/lib/errors";
import { payDeposit } from "@/lib/jobs/job-deposit";
import { depositSchema } from "@/lib/validations/jobs";

/** The farmer pays the job's deposit; Shoal holds it until the farmer confirms the finished tank. */
export const POST = withApi(async (request, { params }: { params: Promise<{ id: string }> }) => {
  const { id } = await params;
  const user = await requireApiPermission(request, "tank-request:post");
  const input = parseWith(depositSchema, await readJson(request));
  const result = await payDeposit(user.id, id, input.paymentMethod);
  // A declined card is the payer's to fix (another card), not a server fault: 402 with the processor's words.
  if (!result.ok) throw new DomainError(result.message, 402, "payment_declined");
  return NextResponse.json({ id, deposit: "held" });
});
