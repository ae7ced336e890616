import type { Metadata } from "next";
import { Suspense } from "react";
import { PageSkeleton } from "@/components/ui/page-skeleton";
import { notFound } from "next/navigation";
import { PhotoStrip } from "@/components/jobs/photo-strip";
import { ReviewPrompt } from "@/components/reviews/review-prompt";
import { RefreshingUploader } from "@/components/jobs/refreshing-uploader";
import { RequestFacts } from "@/components/jobs/request-facts";
import { ButtonLink } from "@/components/ui/button";
import { Card, PageHeading } from "@/components/ui/card";
import { requirePagePermission, type CurrentUser } from "@/lib/auth/session";
import { jobView } from "@/lib/jobs/job-views";
import { farmerRequestView, isFarmersRequest } from "@/lib/requests/request-views";
import { getReviewEligibility } from "@/lib/reviews/eligibility";
import { getReviewForSubject } from "@/lib/reviews/queries";
import { trustKey } from "@/lib/reviews/types";
import { getTrustBadges } from "@/lib/trust/provider-trust";
import { CloseRequest } from "./_components/close-request";
import { FarmerJob } from "./_components/farmer-job";
import { QuoteComparison } from "./_components/quote-comparison";

export const metadata: Metadata = { title: "Your tank request" };

type Props = { params: Promise<{ id: string }> };

// The cheap ownership check runs before anything streams, so a request that is not the farmer's is a real 404;
// the rest loads inside the Suspense boundary with the skeleton.
export default async function FarmerRequestPage({ params }: Props) {
  const { id } = await params;
  const user = await requirePagePermission("tank-request:post", `/farmer/requests/${id}`);
  if (!(await isFarmersRequest(user.id, id))) notFound();
  return (
    <Suspense fallback={<PageSkeleton />}>
      <FarmerRequest user={user} id={id} />
    </Suspense>
  );
}

async function FarmerRequest({ user, id }: { user: CurrentUser; id: string }) {
  const request = await farmerRequestView(user.id, id);
  if (!request) notFound();
  const job = request.jobId ? await jobView(request.jobId, user) : null;
  const builderIds = [...new Set([...request.quotes.map((q) => q.builder.id), ...(job ? [job.builder.id] : [])])];
  // A review is possible (or explained) only once the job has ended or is in dispute.
  const ended = job !== null && (job.state === "completed" || job.state === "resolved" || job.state === "disputed");
  const [badges, review, eligibility] = await Promise.all([
    getTrustBadges(builderIds.map((providerUserId) => ({ providerUserId, role: "builder" as const }))),
    job && ended ? getReviewForSubject("job", job.id, user.id) : null,
    job && ended ? getReviewEligibility(user.id, "job", job.id) : null,
  ]);
  const lead = request.state === "open" ? "Builders within reach of your site can quote until you accept one." : request.state === "closed" ? "This request is closed." : undefined;

  return (
    <div className="space-y-6">
      <PageHeading title={`Your ${request.title}`} lead={lead}>
        <ButtonLink href="/farmer/requests" variant="secondary">
          All requests
        </ButtonLink>
      </PageHeading>
      <div className="grid gap-6 lg:grid-cols-[1fr_20rem]">
        <div className="min-w-0 space-y-6">
          {job && ended ? <ReviewPrompt review={review} eligibility={eligibility} formHref={`/farmer/requests/${request.id}/review`} providerName={job.builder.name} about="the tank and the work" /> : null}
          {job ? <FarmerJob job={job} trust={badges.get(trustKey(job.builder.id, "builder"))} /> : null}
          {!job && request.quotes.length ? <QuoteComparison quotes={request.quotes} canAccept={request.state === "open"} badges={badges} /> : null}
          {!job && request.quotes.length === 0 && request.state === "open" ? (
            <Card>
              <h2 className="text-lg font-semibold">Waiting for quotes</h2>
              <p className="mt-1 text-sm text-silt-700">Builders whose service area covers your site were told by e-mail. Quotes appear here side by side as they come in.</p>
            </Card>
          ) : null}
          {request.closedQuotes.length ? (
            <p className="text-sm text-silt-600">
              Closed quotes: {request.closedQuotes.map((q) => `${q.builder.name} (${q.state === "withdrawn" ? "withdrawn by the builder" : "not chosen"})`).join(", ")}.
            </p>
          ) : null}
        </div>
        <aside className="space-y-4">
          <Card className="space-y-3">
            <h2 className="font-semibold">What you asked for</h2>
            <RequestFacts request={request} place={`${request.site.lat.toFixed(5)}, ${request.site.lng.toFixed(5)}`} />
            {request.state === "open" ? <CloseRequest requestId={request.id} /> : null}
          </Card>
          <Card className="space-y-3">
            <h2 className="font-semibold">Site photos</h2>
            <PhotoStrip photos={request.sitePhotos} label="Site photo" empty="No site photos." />
            {request.state === "open" ? <RefreshingUploader kind="site-photo" subjectId={request.id} existingCount={request.sitePhotos.length} label="Add site photos" /> : null}
          </Card>
        </aside>
      </div>
    </div>
  );
}
