import { parseWith, readJson, withApi } from "@/lib/api/handler";
import { withIdempotency } from "@/lib/api/idempotency";
import { requireApiPermission } from "@/lib/auth/session";
import { getReservationDetail } from "@/lib/reservations/queries";
import { payDeposit } from "@/lib/reservations/service";
import { paySchema } from "@/lib/validations/reservations";

/** The farmer pays the deposit of an accepted reservation. A decline answers 402 with the processor's reason. */
export const POST = withApi(async (request, { params }: { params: Promise<{ id: string }> }) => {
  const user = await requireApiPermission(request, "reservation:pay");
  const { id } = await params;
  const body = await readJson(request);
  const { paymentMethod } = parseWith(paySchema, body);
  const key = request.headers.get("idempotency-key") ?? "";
  return withIdempotency(request, user.id, `reservations:pay:${id}`, body, async () => {
    const paid = await payDeposit(user, id, paymentMethod, key);
    const reservation = await getReservationDetail(user, id);
    if (paid.ok) return { status: 200, body: { reservation } };
    return { status: 402, body: { error: { code: "card_declined", message: paid.message, declineCode: paid.declineCode }, reservation } };
  });
});
