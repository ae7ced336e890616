import type { Metadata } from "next";
import Link from "next/link";
import { ReservationStatus } from "@/components/reservations/status-badge";
import { ButtonLink } from "@/components/ui/button";
import { Card, PageHeading } from "@/components/ui/card";
import { requirePagePermission } from "@/lib/auth/session";
import { formatMoney } from "@/lib/money/money";
import { formatDateTime } from "@/lib/reservations/labels";
import { listReservations } from "@/lib/reservations/queries";
import { reservationListQuerySchema } from "@/lib/validations/reservations";

export const metadata: Metadata = { title: "Your reservations" };

export default async function FarmerReservationsPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const user = await requirePagePermission("reservation:create", "/farmer/reservations");
  const pageParam = (await searchParams).page;
  const query = reservationListQuerySchema.parse({ as: "farmer", sort: "attention", page: typeof pageParam === "string" ? pageParam : "1", pageSize: "20" });
  const page = await listReservations(user, query);
  return (
    <div>
      <PageHeading title="Your reservations" lead="Fingerlings you reserved. Those waiting for you (a deposit to pay, a survival report) come first.">
        <ButtonLink href="/map" variant="secondary">
          Find fingerlings
        </ButtonLink>
      </PageHeading>
      {page.rows.length === 0 ? (
        <Card>
          <p className="text-silt-700">No reservations yet. Find a hatchery near you on the map and reserve from one of its batches.</p>
        </Card>
      ) : (
        <ul className="space-y-3">
          {page.rows.map((r) => (
            <li key={r.id}>
              <Link href={`/farmer/reservations/${r.id}`} className="block rounded-card border border-silt-200 bg-white p-4 shadow-card hover:border-lagoon-300">
                <span className="flex flex-wrap items-start justify-between gap-2">
                  <span className="font-semibold text-silt-950">
                    {r.count.toLocaleString("en")} {r.speciesLabel} from {r.hatcheryName}
                  </span>
                  <ReservationStatus state={r.state} />
                </span>
                <span className="mt-1 block text-sm text-silt-700">
                  {formatMoney(r.totalMinor, r.currency)} · reserved {formatDateTime(r.requestedAt)} · {r.reference}
                </span>
              </Link>
            </li>
          ))}
        </ul>
      )}
      {page.pages > 1 ? (
        <nav className="mt-4 flex items-center justify-between text-sm" aria-label="Pages">
          <span className="text-silt-700">
            Page {page.page} of {page.pages}
          </span>
          <span className="flex gap-2">
            {page.page > 1 ? <ButtonLink href={`/farmer/reservations?page=${page.page - 1}`} variant="secondary">Previous</ButtonLink> : null}
            {page.page < page.pages ? <ButtonLink href={`/farmer/reservations?page=${page.page + 1}`} variant="secondary">Next</ButtonLink> : null}
          </span>
        </nav>
      ) : null}
    </div>
  );
}
