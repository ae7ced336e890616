import type { Metadata } from "next";
import { QueryProvider } from "@/components/query/query-provider";
import { ButtonLink } from "@/components/ui/button";
import { PageHeading } from "@/components/ui/card";
import { requirePagePermission } from "@/lib/auth/session";
import { ReservationTable } from "../_components/reservation-table";

export const metadata: Metadata = { title: "Reservations" };

export default async function HatcheryReservationsPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  await requirePagePermission("reservation:respond", "/hatchery/reservations");
  const batch = (await searchParams).batch;
  return (
    <div>
      <PageHeading title="Reservations" lead="Answer new requests within two days, then record each hand-over with the count you handed over.">
        <ButtonLink href="/hatchery/batches" variant="secondary">
          Your batches
        </ButtonLink>
      </PageHeading>
      <QueryProvider>
        <ReservationTable initialBatchId={typeof batch === "string" ? batch : null} />
      </QueryProvider>
    </div>
  );
}
