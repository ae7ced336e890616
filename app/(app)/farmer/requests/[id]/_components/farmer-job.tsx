import { BuilderFacts } from "@/components/jobs/builder-facts";
import { JobActionsPanel } from "@/components/jobs/job-actions-panel";
import { JobTimeline } from "@/components/jobs/job-timeline";
import { PhotoStrip } from "@/components/jobs/photo-strip";
import { QuoteLines } from "@/components/jobs/quote-lines";
import { Card } from "@/components/ui/card";
import type { JobView } from "@/lib/jobs/job-views";
import type { TrustBadge } from "@/lib/reviews/types";
import { formatMoney } from "@/lib/money/money";
import { formatDay } from "@/lib/requests/format";
import { DepositForm } from "./deposit-form";

function depositText(job: JobView): string {
  const money = (m: number) => formatMoney(m, job.currency);
  const h = job.hold;
  if (!h) return `Deposit of ${money(job.depositMinor)} not paid yet.`;
  switch (h.state) {
    case "held":
      return `Deposit of ${money(h.heldMinor)} held by Shoal. The builder is paid when you confirm.`;
    case "frozen":
      return `Deposit of ${money(h.heldMinor)} frozen while the dispute is looked at.`;
    case "released":
      return `Deposit of ${money(h.releasedMinor)} released to the builder.`;
    case "partially_released":
      return `${money(h.releasedMinor)} released to the builder, ${money(h.returnedMinor)} returned to you.`;
    case "refunded":
    case "expired":
      return `Deposit of ${money(h.returnedMinor)} returned to you.`;
    default:
      return `Deposit: ${h.state}.`;
  }
}

/** The farmer's side of a job: where it is, the deposit, the completion photos, and what to do next. */
export function FarmerJob({ job, trust }: { job: JobView; trust?: TrustBadge }) {
  return (
    <section aria-labelledby="job-heading" className="space-y-4">
      <Card className="space-y-4">
        <div className="flex flex-wrap items-baseline justify-between gap-2">
          <h2 id="job-heading" className="text-xl font-semibold text-silt-950">Your job</h2>
          <p className="rounded-full bg-lagoon-100 px-3 py-1 text-sm font-semibold text-lagoon-800" data-testid="job-state">{job.stateLabel}</p>
        </div>
        <BuilderFacts builder={job.builder} trust={trust} />
        <p className="text-sm font-medium text-silt-800" data-testid="deposit-state">{depositText(job)}</p>
        {job.state === "awaiting_deposit" ? <DepositForm jobId={job.id} deposit={formatMoney(job.depositMinor, job.currency)} lastDecline={job.lastDecline} /> : null}
        {job.state === "built" && job.autoConfirmAt ? (
          <p className="rounded-lg border border-reed-200 bg-reed-50 p-3 text-sm text-reed-900">
            Fill the tank and watch the water level for a few days. Confirm when you are happy, or open a dispute. With no answer the job confirms itself on {formatDay(job.autoConfirmAt)}.
          </p>
        ) : null}
        <JobActionsPanel jobId={job.id} buttons={job.buttons} />
      </Card>
      <div className="grid gap-4 md:grid-cols-2">
        <Card>
          <h3 className="mb-3 font-semibold">Progress</h3>
          <JobTimeline entries={job.timeline} />
        </Card>
        <Card>
          <h3 className="mb-3 font-semibold">Completion photos</h3>
          <PhotoStrip photos={job.completionPhotos} label="Completion photo" empty="The builder adds photos of the finished tank before marking it built." />
        </Card>
      </div>
      <Card>
        <h3 className="mb-3 font-semibold">The accepted quote</h3>
        <QuoteLines quote={job.quote} />
      </Card>
    </section>
  );
}
