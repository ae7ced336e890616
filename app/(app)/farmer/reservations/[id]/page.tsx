import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { ReservationFacts } from "@/components/reservations/reservation-facts";
import { ReservationStatus } from "@/components/reservations/status-badge";
import { ReservationHistory, ReservationSteps } from "@/components/reservations/reservation-timeline";
import { ReviewPrompt } from "@/components/reviews/review-prompt";
import { Card, PageHeading } from "@/components/ui/card";
import { requirePagePermission } from "@/lib/auth/session";
import { NotFound } from "@/lib/errors";
import { formatMoney } from "@/lib/money/money";
import { formatDateTime } from "@/lib/reservations/labels";
import { RESERVATION_PARAMETERS } from "@/lib/reservations/parameters";
import { getReservationDetail, type ReservationDetail } from "@/lib/reservations/queries";
import { getReviewEligibility } from "@/lib/reviews/eligibility";
import { getReviewForSubject } from "@/lib/reviews/queries";
import { CancelReservationButton } from "../_components/cancel-button";
import { PayForm } from "../_components/pay-form";
import { QuarantinePanel } from "../_components/quarantine-panel-lazy";

export const metadata: Metadata = { title: "Your reservation" };

const DAY_MS = 86_400_000;

function lead(r: ReservationDetail, now: Date): string {
  switch (r.state) {
    case "requested":
      return `${r.hatchery.name} has until ${formatDateTime(r.deadlines.acceptBy)} to answer. The fish are set aside for you until then.`;
    case "accepted":
      return r.deadlines.payBy ? `Accepted. Pay the deposit by ${formatDateTime(r.deadlines.payBy)} to keep the fish.` : "Accepted. Pay the deposit to keep the fish.";
    case "deposit_held":
      return `Shoal holds your deposit. Arrange the ${r.handoverMethod === "pickup" ? "collection" : "delivery"} with ${r.hatchery.name}.`;
    case "quarantine": {
      const day = r.handedOverAt ? Math.floor((now.getTime() - Date.parse(r.handedOverAt)) / DAY_MS) + 1 : 1;
      const week = RESERVATION_PARAMETERS.quarantineDays.value;
      return day <= week ? `Quarantine week: day ${day} of ${week}.` : `The quarantine week is over: report how many survived${r.deadlines.autoReleaseAt ? ` before ${formatDateTime(r.deadlines.autoReleaseAt)}` : ""}.`;
    }
    case "released":
      return r.hold ? `Done. ${formatMoney(r.hold.releasedMinor, r.currency)} went to the hatchery${r.hold.returnedMinor > 0 ? ` and ${formatMoney(r.hold.returnedMinor, r.currency)} came back to you` : ""}.` : "Done.";
    case "disputed":
      return "You opened a dispute. A Shoal administrator will decide; the deposit stays frozen until then.";
    case "refunded":
      return "The deposit was given back to you in full.";
    case "lapsed":
      return "This reservation lapsed: the next step was not taken in time. Nothing was charged.";
    case "declined":
      return "The hatchery could not take this reservation. Nothing was charged.";
    case "cancelled":
      return "Cancelled. Any deposit was given back in full.";
  }
}

export default async function FarmerReservationPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await requirePagePermission("reservation:create", `/farmer/reservations/${id}`);
  let r: ReservationDetail;
  try {
    r = await getReservationDetail(user, id);
  } catch (error) {
    if (error instanceof NotFound) notFound();
    throw error;
  }
  if (r.viewerRole !== "farmer") notFound();
  const now = new Date();
  // The hatchery review is offered once the survival report has released the deposit (day 7), or explained in a dispute.
  const reviewable = r.state === "released" || r.state === "disputed";
  const [review, eligibility] = reviewable ? await Promise.all([getReviewForSubject("reservation", r.id, user.id), getReviewEligibility(user.id, "reservation", r.id)]) : [null, null];
  const handedOver = r.handedOverCount ?? r.count;
  const reportNotYet = r.notYet.find((n) => n.action === "report_survival")?.message ?? null;
  return (
    <div className="space-y-4">
      <p className="text-sm">
        <Link href="/farmer/reservations" className="font-medium text-lagoon-700 underline underline-offset-2">
          ← Your reservations
        </Link>
      </p>
      <PageHeading title={`${r.count.toLocaleString("en")} ${r.speciesLabel} from ${r.hatchery.name}`} lead={lead(r, now)}>
        <ReservationStatus state={r.state} />
      </PageHeading>
      <Card>
        <ReservationSteps reservation={r} />
      </Card>
      <div className="grid grid-cols-1 gap-4 md:grid-cols-[minmax(0,1fr)_22rem]">
        <div className="space-y-4">
          {r.allowed.includes("pay") ? (
            <Card>
              <h2 className="mb-3 text-lg font-semibold">Pay the deposit</h2>
              <PayForm reservationId={r.id} depositMinor={r.depositMinor} currency={r.currency} lastDecline={r.lastDecline?.message ?? null} />
            </Card>
          ) : null}
          {r.state === "quarantine" ? (
            <Card>
              <h2 className="mb-3 text-lg font-semibold">Your first week with the fish</h2>
              <QuarantinePanel
                reservationId={r.id}
                handedOverCount={r.handedOverCount ?? r.count}
                checks={r.quarantineChecks}
                canCheck={r.allowed.includes("check")}
                canReport={r.allowed.includes("report_survival")}
                reportNotYet={reportNotYet ? `${reportNotYet}${r.deadlines.survivalReportFrom ? ` (from ${formatDateTime(r.deadlines.survivalReportFrom)})` : ""}.` : null}
                canDispute={r.allowed.includes("dispute")}
              />
            </Card>
          ) : null}
          {reviewable ? (
            <div className="grid gap-4 lg:grid-cols-2">
              {r.survivedCount !== null ? (
                <Card>
                  <h2 className="text-lg font-semibold">Your day-7 report</h2>
                  <p className="mt-2 font-display text-3xl font-semibold text-silt-950" data-testid="survival-figure">
                    {handedOver > 0 ? `${Math.round((r.survivedCount / handedOver) * 100)}%` : "—"}
                  </p>
                  <p className="text-sm text-silt-700">
                    {r.survivedCount.toLocaleString("en")} of {handedOver.toLocaleString("en")} fish alive after the first week. This figure counts towards {r.hatchery.name}&apos;s survival record.
                  </p>
                </Card>
              ) : null}
              <ReviewPrompt review={review} eligibility={eligibility} formHref={`/farmer/reservations/${r.id}/review`} providerName={r.hatchery.name} about="the fish" />
            </div>
          ) : null}
          <Card>
            <h2 className="mb-3 text-lg font-semibold">Reservation</h2>
            <ReservationFacts reservation={r} />
            {r.allowed.includes("cancel") ? (
              <div className="mt-4 border-t border-silt-100 pt-3">
                <CancelReservationButton reservationId={r.id} />
              </div>
            ) : null}
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
