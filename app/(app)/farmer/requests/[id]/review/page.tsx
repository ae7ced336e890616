import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { ReviewFormPage } from "@/components/reviews/review-form-page";
import { requirePagePermission } from "@/lib/auth/session";
import { farmerRequestView, isFarmersRequest } from "@/lib/requests/request-views";

export const metadata: Metadata = { title: "Review the builder" };

// The segment's layout has already required a farmer; the request must be this farmer's, and have a job.
export default async function ReviewJobPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await requirePagePermission("review:write", `/farmer/requests/${id}/review`);
  if (!(await isFarmersRequest(user.id, id))) notFound();
  const request = await farmerRequestView(user.id, id);
  if (!request?.jobId) notFound();
  return <ReviewFormPage userId={user.id} subjectKind="job" subjectId={request.jobId} backHref={`/farmer/requests/${id}`} backLabel="Back to the job" />;
}
