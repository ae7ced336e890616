import { Stars } from "@/components/reviews/stars";
import { ButtonLink } from "@/components/ui/button";
import { Card } from "@/components/ui/card";
import { REVIEW_LIMITS, type PublicReview, type ReviewEligibility } from "@/lib/reviews/types";

const DAY_MS = 86_400_000;

function day(iso: string | number): string {
  return new Date(iso).toLocaleDateString("en-GB", { day: "numeric", month: "short", year: "numeric", timeZone: "UTC" });
}

type Props = {
  /** the farmer's own review of this job or reservation, if written */
  review: PublicReview | null;
  eligibility: ReviewEligibility | null;
  /** the review form's page (also its edit mode) */
  formHref: string;
  providerName: string;
  /** e.g. "the tank" or "the fish": what the farmer is asked about */
  about: string;
};

/**
 * The entry point on the farmer's job or reservation page: "Write a review" once it may be written, "Your review"
 * with the edit link afterwards, and a word on why not yet while a dispute is open.
 */
export function ReviewPrompt({ review, eligibility, formHref, providerName, about }: Props) {
  if (review) {
    const until = Date.parse(review.createdAt) + REVIEW_LIMITS.editDays * DAY_MS;
    return (
      <Card className="space-y-2">
        <h2 className="text-lg font-semibold" id="your-review">
          Your review
        </h2>
        <p className="flex items-center gap-2 text-sm text-silt-700">
          <Stars value={review.stars} size="md" />
          <span aria-hidden="true">{review.stars} of 5</span> · {day(review.createdAt)}
        </p>
        <p className="line-clamp-3 whitespace-pre-line break-words text-sm text-silt-800" data-testid="your-review-body">
          {review.body}
        </p>
        {review.hidden ? (
          <p className="rounded-lg bg-clay-50 p-2 text-sm text-clay-700">Shoal hid this review after a report. Only you can still see it.</p>
        ) : review.viewer.canEdit ? (
          <div className="flex flex-wrap items-center gap-3">
            <ButtonLink href={formHref} variant="secondary">
              Change your review
            </ButtonLink>
            <p className="text-xs text-silt-600">You can change it until {day(until)}.</p>
          </div>
        ) : (
          <p className="text-xs text-silt-600">The {REVIEW_LIMITS.editDays} days for changes are over.</p>
        )}
        {review.reply ? (
          <div className="rounded-lg border-l-4 border-lagoon-300 bg-lagoon-50 px-3 py-2">
            <p className="text-xs font-semibold text-lagoon-800">{providerName} replied</p>
            <p className="mt-1 whitespace-pre-line break-words text-sm text-silt-800">{review.reply.body}</p>
          </div>
        ) : null}
      </Card>
    );
  }
  if (eligibility?.eligible) {
    return (
      <Card className="space-y-2 border-reed-200 bg-reed-50">
        <h2 className="text-lg font-semibold text-silt-950">How was it?</h2>
        <p className="text-sm text-silt-800">
          Tell other farmers about {about} from {providerName}. Your stars and words help them choose, and help good providers get found.
        </p>
        <ButtonLink href={formHref}>Write a review</ButtonLink>
      </Card>
    );
  }
  if (eligibility && eligibility.reason === "disputed") {
    return (
      <Card>
        <h2 className="text-lg font-semibold">Review</h2>
        <p className="mt-1 text-sm text-silt-700">{eligibility.message}</p>
      </Card>
    );
  }
  return null;
}
