import Link from "next/link";
import { reviewDate } from "@/components/reviews/review-item";
import { Stars } from "@/components/reviews/stars";
import { REPORT_REASON_LABELS, type ModerationReport } from "@/lib/reviews/types";
import { ReportDecision } from "./report-decision";

/** Open reports, oldest first: the review as the public sees it, what the reporter said, and the decision. */
export function ModerationQueue({ reports }: { reports: readonly ModerationReport[] }) {
  if (reports.length === 0) {
    return <p className="rounded-card border border-dashed border-silt-300 p-8 text-center text-silt-600">No reported reviews.</p>;
  }
  return (
    <ul className="space-y-3" aria-label="Reported reviews" data-testid="moderation-queue">
      {reports.map((report) => {
        const r = report.review;
        return (
          <li key={report.id} className="grid gap-4 rounded-card border border-silt-200 bg-white p-4 md:grid-cols-[1fr_20rem]" data-testid="moderation-report">
            <div className="min-w-0 space-y-2">
              <p className="rounded-lg bg-reed-50 px-3 py-2 text-sm text-reed-900">
                <span className="font-semibold">{REPORT_REASON_LABELS[report.reason]}</span> · reported by {report.reporterName} on {reviewDate(report.createdAt)}
                {report.details ? <span className="mt-1 block whitespace-pre-line break-words text-silt-800">“{report.details}”</span> : null}
              </p>
              <p className="flex flex-wrap items-center gap-2 text-sm text-silt-700">
                <Stars value={r.stars} />
                <span>
                  {r.authorName} about{" "}
                  <Link href={`/providers/${r.providerUserId}#review-${r.id}`} className="font-medium text-lagoon-700 underline underline-offset-2">
                    {report.providerName}
                  </Link>{" "}
                  · {r.subjectLabel} · {reviewDate(r.createdAt)}
                </span>
              </p>
              <p className="whitespace-pre-line break-words text-silt-800" data-testid="moderation-review-body">
                {r.body}
              </p>
              {r.photos.length ? (
                <ul className="flex flex-wrap gap-2" aria-label="Photos in the review">
                  {r.photos.map((p, i) => (
                    <li key={p.imageId}>
                      <a href={p.src} className="block overflow-hidden rounded border border-silt-200">
                        <img src={p.src} srcSet={p.srcSet} sizes="80px" width={p.width} height={p.height} alt={p.alt || `Photo ${i + 1}`} loading="lazy" decoding="async" className="h-20 w-20 object-cover" />
                      </a>
                    </li>
                  ))}
                </ul>
              ) : null}
              {r.reply ? <p className="border-l-4 border-lagoon-300 pl-3 text-sm text-silt-700">Reply: {r.reply.body}</p> : null}
            </div>
            <ReportDecision reportId={report.id} authorName={r.authorName} />
          </li>
        );
      })}
    </ul>
  );
}
