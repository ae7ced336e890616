import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { Card, PageHeading } from "@/components/ui/card";
import { requirePagePermission } from "@/lib/auth/session";
import { formatMoney } from "@/lib/money/money";
import { formatDate } from "@/lib/reservations/labels";
import { getReservableBatch } from "@/lib/reservations/queries";
import { ReserveForm } from "../_components/reserve-form";

export const metadata: Metadata = { title: "Reserve fingerlings" };

export default async function ReservePage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const batchId = (await searchParams).batch;
  const id = typeof batchId === "string" ? batchId : "";
  const user = await requirePagePermission("reservation:create", `/farmer/reservations/new?batch=${encodeURIComponent(id)}`);
  const batch = id ? await getReservableBatch(id) : null;
  if (!batch) notFound();
  return (
    <div className="mx-auto max-w-2xl space-y-4">
      <PageHeading title="Reserve fingerlings" lead={`From ${batch.hatcheryName}`} />
      <Card>
        <h2 className="text-lg font-semibold">
          {batch.speciesLabel}, about {batch.meanWeightG} g / {batch.meanLengthCm} cm
        </h2>
        <p className="mt-1 text-sm text-silt-700">
          {formatMoney(batch.priceMinor, batch.currency)} each · {batch.countAvailable.toLocaleString("en")} left · ready {formatDate(batch.readyFrom, "UTC")} · on sale until {formatDate(batch.sellBy, "UTC")}
        </p>
        <p className="mt-2 text-sm">
          <Link href={`/providers/${batch.hatcheryId}`} className="font-medium text-lagoon-700 underline underline-offset-2">
            About {batch.hatcheryName}
          </Link>
        </p>
      </Card>
      {batch.hatcheryId === user.id ? (
        <Card>
          <p className="text-silt-700">This is your own batch.</p>
        </Card>
      ) : batch.open ? (
        <ReserveForm batch={batch} />
      ) : (
        <Card>
          <p className="text-silt-700">{batch.state === "paused" ? "The hatchery has paused this batch: it takes no reservations for now." : "This batch takes no more reservations."}</p>
        </Card>
      )}
    </div>
  );
}
