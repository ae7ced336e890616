import type { Metadata } from "next";
import { Suspense } from "react";
import { PageSkeleton } from "@/components/ui/page-skeleton";
import { notFound } from "next/navigation";
import { JobActionsPanel } from "@/components/jobs/job-actions-panel";
import { JobTimeline } from "@/components/jobs/job-timeline";
import { PhotoStrip } from "@/components/jobs/photo-strip";
import { QuoteLines } from "@/components/jobs/quote-lines";
import { RefreshingUploader } from "@/components/jobs/refreshing-uploader";
import { ButtonLink } from "@/components/ui/button";
import { Card, PageHeading } from "@/components/ui/card";
import { requirePagePermission, type CurrentUser } from "@/lib/auth/session";
import { jobPartyRole, jobView, type JobView } from "@/lib/jobs/job-views";
import { formatMoney } from "@/lib/money/money";

export const metadata: Metadata = { title: "Job" };

type Props = { params: Promise<{ id: string }> };

function depositLine(job: JobView): string {
  const money = (m: number) => formatMoney(m, job.currency);
  if (!job.hold) return `Waiting for the farmer's deposit of ${money(job.depositMinor)}. Do not buy materials before it is held.`;
  if (job.hold.state === "held") return `Deposit of ${money(job.hold.heldMinor)} held by Shoal; it is paid to you when the farmer confirms.`;
  if (job.hold.state === "released" || job.hold.state === "partially_released") return `${money(job.hold.releasedMinor)} released to you.`;
  if (job.hold.state === "frozen") return `Deposit of ${money(job.hold.heldMinor)} frozen during the dispute.`;
  return `Deposit: ${job.hold.state}.`;
}

// The cheap party check runs before anything streams (a real 404 for anyone else's job); the rest loads in Suspense.
export default async function BuilderJobPage({ params }: Props) {
  const { id } = await params;
  const user = await requirePagePermission("tank-request:quote", `/builder/jobs/${id}`);
  if ((await jobPartyRole(id, user)) !== "builder") notFound();
  return (
    <Suspense fallback={<PageSkeleton />}>
      <BuilderJob user={user} id={id} />
    </Suspense>
  );
}

async function BuilderJob({ user, id }: { user: CurrentUser; id: string }) {
  const job = await jobView(id, user);
  if (!job || job.viewerRole !== "builder") notFound();
  const onSite = job.state === "on_site";
  return (
    <div className="space-y-6">
      <PageHeading title={`Job: ${job.title}`} lead={`For ${job.farmer.name}`}>
        <ButtonLink href="/builder/jobs" variant="secondary">
          All jobs
        </ButtonLink>
      </PageHeading>
      <div className="grid gap-6 lg:grid-cols-[1fr_20rem]">
        <div className="min-w-0 space-y-4">
          <Card className="space-y-3">
            <div className="flex flex-wrap items-baseline justify-between gap-2">
              <h2 className="text-lg font-semibold">Where it stands</h2>
              <p className="rounded-full bg-lagoon-100 px-3 py-1 text-sm font-semibold text-lagoon-800" data-testid="job-state">{job.stateLabel}</p>
            </div>
            <p className="text-sm text-silt-800" data-testid="deposit-state">{depositLine(job)}</p>
            <JobActionsPanel jobId={job.id} buttons={job.buttons} photoHint={`Add at least ${job.minCompletionPhotos} photo of the finished tank first; the farmer confirms against it.`} />
          </Card>
          <Card className="space-y-3">
            <h2 className="text-lg font-semibold">Completion photos</h2>
            <PhotoStrip photos={job.completionPhotos} label="Completion photo" empty={onSite ? "No photos yet." : "Photos are added while you are on site."} />
            {onSite ? <RefreshingUploader kind="completion-photo" subjectId={job.id} existingCount={job.completionPhotos.length} label="Add photos of the finished tank" /> : null}
          </Card>
          <Card>
            <h2 className="mb-3 text-lg font-semibold">The accepted quote</h2>
            <QuoteLines quote={job.quote} />
          </Card>
        </div>
        <aside className="space-y-4">
          <Card className="space-y-2 text-sm">
            <h2 className="font-semibold">The site</h2>
            {!job.site ? (
              <p className="text-silt-700">The exact site and the farmer&apos;s phone are shown once the deposit is held.</p>
            ) : (
              <>
                <p>
                  {job.site.lat.toFixed(5)}, {job.site.lng.toFixed(5)} ({job.farmer.region})
                </p>
                <a className="font-medium text-lagoon-700 underline underline-offset-2" href={`geo:${job.site.lat},${job.site.lng}`}>
                  Open in a maps app
                </a>
                {job.farmer.phone ? (
                  <p>
                    Farmer: <a href={`tel:${job.farmer.phone}`} className="font-medium text-lagoon-700 underline underline-offset-2">{job.farmer.phone}</a>
                  </p>
                ) : null}
              </>
            )}
          </Card>
          <Card>
            <h2 className="mb-3 font-semibold">Progress</h2>
            <JobTimeline entries={job.timeline} />
          </Card>
        </aside>
      </div>
    </div>
  );
}
