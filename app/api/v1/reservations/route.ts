import { NextResponse } from "next/server";
import { parseWith, readJson, withApi } from "@/lib/api/handler";
import { withIdempotency } from "@/lib/api/idempotency";
import { enforceRateLimit, RATE_LIMITS } from "@/lib/api/rate-limit";
import { requireApiPermission } from "@/lib/auth/session";
import { getReservationDetail, listReservations } from "@/lib/reservations/queries";
import { createReservation } from "@/lib/reservations/service";
import { reservationListQuerySchema, reserveSchema } from "@/lib/validations/reservations";

/** The caller's reservations: `as=farmer` (their own) or `as=hatchery` (incoming), filtered, sorted and paged. */
export const GET = withApi(async (request) => {
  const user = await requireApiPermission(request, "reservation:view");
  const query = parseWith(reservationListQuerySchema, Object.fromEntries(new URL(request.url).searchParams));
  return NextResponse.json(await listReservations(user, query));
});

/** A farmer reserves fish from a batch. Needs an Idempotency-Key: a retry never takes the fish twice. */
export const POST = withApi(async (request) => {
  const user = await requireApiPermission(request, "reservation:create");
  const body = await readJson(request);
  const input = parseWith(reserveSchema, body);
  // Counted before the idempotency key is claimed, so a refusal here is not stored as that key's answer.
  await enforceRateLimit(RATE_LIMITS.reservationCreate, user.id);
  return withIdempotency(request, user.id, "reservations:create", body, async ({ stableId }) => {
    const created = await createReservation(user, input, new Date(), { id: stableId });
    return { status: 201, body: { reservation: await getReservationDetail(user, created.id) } };
  });
});
