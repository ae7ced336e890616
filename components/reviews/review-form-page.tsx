import Link from "next/link";
import { ReviewForm } from "@/components/reviews/review-form";
import { Card, PageHeading } from "@/components/ui/card";
import { getPublicProvider } from "@/lib/listings/provider";
import { getReviewEligibility } from "@/lib/reviews/eligibility";
import { getReviewForEdit, getReviewForSubject } from "@/lib/reviews/queries";
import type { ReviewSubjectKind } from "@/lib/reviews/types";

function day(iso: string): string {
  return new Date(iso).toLocaleDateString("en-GB", { day: "numeric", month: "short", year: "numeric", timeZone: "UTC" });
}

type Props = {
  userId: string;
  subjectKind: ReviewSubjectKind;
  subjectId: string;
  /** the job or reservation page: the way back, and where the form goes once stored */
  backHref: string;
  backLabel: string;
};

/**
 * The body of both review pages (job and reservation): the form to write a review, the same form filled in to change
 * it within the edit window, or why neither is possible now.
 */
export async function ReviewFormPage({ userId, subjectKind, subjectId, backHref, backLabel }: Props) {
  const back = (
    <p className="text-sm">
      <Link href={backHref} className="font-medium text-lagoon-700 underline underline-offset-2">
        ← {backLabel}
      </Link>
    </p>
  );
  const own = await getReviewForSubject(subjectKind, subjectId, userId);
  if (own) {
    const edit = await getReviewForEdit(own.id, userId);
    const role = own.role;
    const name = (await getPublicProvider(own.providerUserId))?.displayName ?? (role === "builder" ? "the builder" : "the hatchery");
    if (!edit || !edit.canEdit || own.hidden) {
      return (
        <div className="mx-auto max-w-2xl space-y-4">
          {back}
          <PageHeading title="Your review" lead={own.subjectLabel} />
          <Card>
            <p className="text-silt-700">
              {own.hidden ? "Shoal hid this review after a report, so it can no longer be changed." : "The days for changing this review are over. It stays as you left it."}
            </p>
          </Card>
        </div>
      );
    }
    return (
      <div className="mx-auto max-w-2xl space-y-4">
        {back}
        <PageHeading title="Change your review" lead={`${own.subjectLabel}. You can change it until ${day(edit.editableUntil)}; the earlier version is kept by Shoal.`} />
        <Card>
          <ReviewForm role={role} subjectKind={subjectKind} subjectId={subjectId} providerName={name} returnTo={backHref} existing={edit.review} />
        </Card>
      </div>
    );
  }

  const eligibility = await getReviewEligibility(userId, subjectKind, subjectId);
  if (!eligibility.eligible) {
    return (
      <div className="mx-auto max-w-2xl space-y-4">
        {back}
        <PageHeading title="Write a review" />
        <Card>
          <p className="text-silt-700" data-testid="review-refusal">
            {eligibility.message}
          </p>
        </Card>
      </div>
    );
  }
  return (
    <div className="mx-auto max-w-2xl space-y-4">
      {back}
      <PageHeading title={`Review ${eligibility.providerName}`} lead={eligibility.subjectLabel} />
      <Card>
        <ReviewForm role={eligibility.role} subjectKind={subjectKind} subjectId={subjectId} providerName={eligibility.providerName} returnTo={backHref} />
      </Card>
    </div>
  );
}
