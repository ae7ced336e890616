import { parseWith, withApi } from "@/lib/api/handler";
import { requireApiPermission } from "@/lib/auth/session";
import { exportReservationsCsv } from "@/lib/reservations/queries";
import { reservationListQuerySchema } from "@/lib/validations/reservations";

/** The hatchery's reservations as CSV (RFC 4180), with the table's filters and sort, every page. */
export const GET = withApi(async (request) => {
  const user = await requireApiPermission(request, "reservation:export");
  const query = parseWith(reservationListQuerySchema, { ...Object.fromEntries(new URL(request.url).searchParams), as: "hatchery" });
  const csv = await exportReservationsCsv(user, query);
  const day = new Date().toISOString().slice(0, 10);
  return new Response(csv, {
    headers: { "content-type": "text/csv; charset=utf-8", "content-disposition": `attachment; filename="shoal-reservations-${day}.csv"`, "cache-control": "no-store" },
  });
});
