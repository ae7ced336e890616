import { NextResponse } from "next/server";
import { parseWith, readJson, withApi } from "@/lib/api/handler";
import { requireApiPermission } from "@/lib/auth/session";
import { getReservationDetail } from "@/lib/reservations/queries";
import { actOnReservation } from "@/lib/reservations/service";
import { reservationActionSchema } from "@/lib/validations/reservations";

/** Moves a reservation: accept, decline, cancel, hand_over, report_survival, dispute, check, and the admin's resolve_dispute and refund. */
export const POST = withApi(async (request, { params }: { params: Promise<{ id: string }> }) => {
  const user = await requireApiPermission(request, "reservation:view");
  const { id } = await params;
  const action = parseWith(reservationActionSchema, await readJson(request));
  await actOnReservation(user, id, action);
  return NextResponse.json({ reservation: await getReservationDetail(user, id) });
});
