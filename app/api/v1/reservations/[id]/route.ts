import { NextResponse } from "next/server";
import { withApi } from "@/lib/api/handler";
import { requireApiPermission } from "@/lib/auth/session";
import { getReservationDetail } from "@/lib/reservations/queries";

/** One reservation, for its farmer, its hatchery or an admin (anyone else: 404). Both sides see the same history. */
export const GET = withApi(async (request, { params }: { params: Promise<{ id: string }> }) => {
  const user = await requireApiPermission(request, "reservation:view");
  return NextResponse.json({ reservation: await getReservationDetail(user, (await params).id) });
});
