import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { ReservationFacts } from "@/components/reservations/reservation-facts";
import { ReservationStatus } from "@/components/reservations/status-badge";
import { ReservationHistory, ReservationSteps } from "@/components/reservations/reservation-timeline";
import { Card, PageHeading } from "@/components/ui/card";
import { requirePagePermission } from "@/lib/auth/session";
import { NotFound } from "@/lib/errors";
import { formatDateTime } from "@/lib/reservations/labels";
import { getReservationDetail, type ReservationDetail } from "@/lib/reservations/queries";
import { HatcheryActions } from "../_components/hatchery-actions";

export const metadata: Metadata = { title: "Reservation" };

function nextStepText(r: ReservationDetail): string {
  switch (r.state) {
    case "requested":
      return `Accept or decline by ${formatDateTime(r.deadlines.acceptBy)}; after that the request lapses and the fish go back on offer.`;
    case "accepted":
      return r.deadlines.payBy ? `Waiting for the farmer's deposit, due by ${formatDateTime(r.deadlines.payBy)}.` : "Waiting for the farmer's deposit.";
    case "deposit_held":
      return "The deposit is held. Hand the fish over as agreed and record how many you handed over.";
    case "quarantine":
      return r.deadlines.autoReleaseAt ? `The farmer's quarantine week. The deposit is released when they report survival, or automatically on ${formatDateTime(r.deadlines.autoReleaseAt)}.` : "The farmer's quarantine week.";
    case "disputed":
      return "The farmer opened a dispute. A Shoal administrator will decide; the deposit stays frozen until then.";
    default:
      return "This reservation is finished.";
  }
}

export default async function HatcheryReservationPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await requirePagePermission("reservation:respond", `/hatchery/reservations/${id}`);
  let r: ReservationDetail;
  try {
    r = await getReservationDetail(user, id);
  } catch (error) {
    if (error instanceof NotFound) notFound();
    throw error;
  }
  if (r.viewerRole !== "hatchery") notFound();
  return (
    <div className="space-y-4">
      <p className="text-sm">
        <Link href="/hatchery/reservations" className="font-medium text-lagoon-700 underline underline-offset-2">
          ← All reservations
        </Link>
      </p>
      <PageHeading title={`${r.farmer.name}: ${r.count.toLocaleString("en")} ${r.speciesLabel}`} lead={nextStepText(r)}>
        <ReservationStatus state={r.state} viewer="hatchery" />
      </PageHeading>
      <Card>
        <ReservationSteps reservation={r} />
      </Card>
      <div className="grid grid-cols-1 gap-4 md:grid-cols-[minmax(0,1fr)_22rem]">
        <div className="space-y-4">
          <Card>
            <h2 className="mb-3 text-lg font-semibold">Your next step</h2>
            <HatcheryActions reservationId={r.id} allowed={r.allowed} reserved={r.count} />
          </Card>
          <Card>
            <h2 className="mb-3 text-lg font-semibold">Reservation</h2>
            <ReservationFacts reservation={r} />
          </Card>
        </div>
        <Card className="md:self-start">
          <h2 className="mb-3 text-lg font-semibold">History</h2>
          <ReservationHistory reservation={r} />
        </Card>
      </div>
    </div>
  );
}
