import Link from "next/link";
import { HelpfulButton } from "@/components/reviews/helpful-button";
import { ReplyForm } from "@/components/reviews/reply-form";
import { ReportReview } from "@/components/reviews/report-review";
import { Stars } from "@/components/reviews/stars";
import { ASPECT_LABELS, REVIEW_ASPECTS, type AspectKey, type PublicReview } from "@/lib/reviews/types";

export function reviewDate(iso: string): string {
  return new Date(iso).toLocaleDateString("en-GB", { day: "numeric", month: "short", year: "numeric", timeZone: "UTC" });
}

type Props = {
  review: PublicReview;
  providerName: string;
  /** signed-out visitors see how to take part instead of the buttons */
  signInHref: string | null;
};

/**
 * One review as anyone sees it. Everything the author or provider wrote is rendered as React text (escaped), never
 * as HTML, and keeps its line breaks through CSS rather than by turning them into markup.
 */
export function ReviewItem({ review: r, providerName, signInHref }: Props) {
  const titleId = `review-${r.id}-title`;
  const aspects = (REVIEW_ASPECTS[r.role] as readonly AspectKey[]).filter((a) => typeof r.aspects[a] === "number");
  return (
    <article id={`review-${r.id}`} aria-labelledby={titleId} className="scroll-mt-20 space-y-3 py-5" data-testid="review">
      <header className="flex flex-wrap items-start justify-between gap-x-4 gap-y-1">
        <div className="min-w-0">
          <h3 id={titleId} className="flex flex-wrap items-center gap-x-2 text-base font-semibold text-silt-950">
            <Stars value={r.stars} size="md" label={`${r.stars} of 5 stars from ${r.authorName}`} />
            <span aria-hidden="true">{r.authorName}</span>
          </h3>
          <p className="text-xs text-silt-600">
            {r.subjectLabel} · <time dateTime={r.createdAt}>{reviewDate(r.createdAt)}</time>
            {r.editedAt ? <> · changed <time dateTime={r.editedAt}>{reviewDate(r.editedAt)}</time></> : null}
          </p>
        </div>
      </header>

      {aspects.length ? (
        <dl className="flex flex-wrap gap-x-5 gap-y-1 text-xs text-silt-700">
          {aspects.map((a) => (
            <div key={a} className="flex items-center gap-1.5">
              <dt>{ASPECT_LABELS[a]}</dt>
              <dd className="flex items-center gap-1">
                <Stars value={r.aspects[a] ?? 0} />
                <span aria-hidden="true" className="tabular-nums">{r.aspects[a]}</span>
              </dd>
            </div>
          ))}
        </dl>
      ) : null}

      <p className="whitespace-pre-line break-words text-silt-800" data-testid="review-body">
        {r.body}
      </p>

      {r.photos.length ? (
        <ul className="grid grid-cols-3 gap-2 sm:grid-cols-6" aria-label={`Photos from ${r.authorName}`}>
          {r.photos.map((p, i) => (
            <li key={p.imageId}>
              <a href={p.src} className="block overflow-hidden rounded-lg border border-silt-200">
                <img src={p.src} srcSet={p.srcSet} sizes="(min-width: 640px) 120px, 30vw" width={p.width} height={p.height} alt={p.alt || `Photo ${i + 1} from ${r.authorName}`} loading="lazy" decoding="async" className="aspect-square h-auto w-full object-cover" />
              </a>
            </li>
          ))}
        </ul>
      ) : null}

      {r.reply ? (
        <div className="rounded-lg border-l-4 border-lagoon-300 bg-lagoon-50 px-3 py-2" data-testid="review-reply">
          <p className="text-xs font-semibold text-lagoon-800">
            Reply from {providerName} · <time dateTime={r.reply.createdAt}>{reviewDate(r.reply.createdAt)}</time>
          </p>
          <p className="mt-1 whitespace-pre-line break-words text-sm text-silt-800">{r.reply.body}</p>
        </div>
      ) : null}

      <div className="flex flex-wrap items-center gap-2">
        {signInHref ? (
          <p className="text-sm text-silt-600">
            {r.helpfulCount > 0 ? `${r.helpfulCount} found this helpful · ` : ""}
            <Link href={signInHref} className="font-medium text-lagoon-700 underline underline-offset-2">
              Sign in to mark it helpful<span className="sr-only"> or report it</span>
            </Link>
          </p>
        ) : r.viewer.canMarkHelpful ? (
          <HelpfulButton reviewId={r.id} count={r.helpfulCount} marked={r.viewer.markedHelpful} />
        ) : (
          // The author and the reviewed provider cannot vote on it; they see the count.
          <p className="text-sm text-silt-600">
            {r.viewer.isAuthor ? "Your review" : "About you"}
            {r.helpfulCount > 0 ? ` · ${r.helpfulCount} found it helpful` : ""}
          </p>
        )}
        {r.viewer.canReport || r.viewer.reported ? <ReportReview reviewId={r.id} authorName={r.authorName} alreadyReported={r.viewer.reported} /> : null}
      </div>
      {r.viewer.canReply && !r.reply ? <ReplyForm reviewId={r.id} authorName={r.authorName} /> : null}
    </article>
  );
}
