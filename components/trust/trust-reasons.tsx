import type { TrustEffect, TrustReason, TrustSummary } from "@/lib/trust/compose-trust";
import { StarRow } from "@/components/reviews/stars";

// Each effect says in words what it did, so colour is never the only signal (WCAG 1.4.1).
const EFFECT: Record<TrustEffect, { text: string; className: string; mark: string }> = {
  up: { text: "Raises the score", className: "bg-lagoon-100 px-2 text-lagoon-800", mark: "▲" },
  down: { text: "Lowers the score", className: "bg-clay-100 px-2 text-clay-700", mark: "▼" },
  neutral: { text: "No lift or penalty", className: "text-silt-600", mark: "" },
};

// The review record is what the score is built on, even when it sits between the marks that lift or lower it;
// the displayed rating is for reading only and never orders anything.
function effectText(reason: TrustReason): string {
  if (reason.effect !== "neutral") return EFFECT[reason.effect].text;
  if (reason.code === "reviews") return "The base of the score";
  if (reason.code === "rating") return "For reading only";
  return EFFECT.neutral.text;
}

function EffectChip({ reason }: { reason: TrustReason }) {
  const e = EFFECT[reason.effect];
  return (
    <span className={`inline-flex shrink-0 items-center gap-1 self-start rounded-full py-0.5 text-xs font-medium ${e.className}`}>
      {e.mark ? <span aria-hidden="true">{e.mark}</span> : null}
      {effectText(reason)}
    </span>
  );
}

function Reason({ reason }: { reason: TrustReason }) {
  return (
    <li className="flex flex-col gap-1 py-2.5 sm:flex-row sm:items-start sm:justify-between sm:gap-3" data-testid={`trust-reason-${reason.code}`}>
      <div className="min-w-0">
        <p className="text-sm font-semibold text-silt-900">{reason.label}</p>
        <p className="text-sm text-silt-700">{reason.detail}</p>
      </div>
      <EffectChip reason={reason} />
    </li>
  );
}

/**
 * "How this score is made": the headline (rating or New with counts) and every reason composeTrust gave, with
 * what it did to the ranking. The score itself is never shown as a number: it only orders the map.
 */
export function TrustReasons({ summary, role, headingId }: { summary: TrustSummary; role: "builder" | "hatchery"; headingId: string }) {
  const { counts } = summary;
  return (
    <div className="space-y-3">
      <div className="flex flex-wrap items-center gap-x-4 gap-y-2">
        {summary.displayRating !== null ? (
          <p className="flex items-center gap-2">
            <span className="font-display text-3xl font-semibold text-silt-950">{summary.displayRating.toFixed(1)}</span>
            <StarRow value={summary.displayRating} size="md" />
            <span className="sr-only">out of 5</span>
          </p>
        ) : (
          <p className="rounded-full bg-reed-100 px-3 py-1 text-sm font-semibold text-reed-800">New on Shoal</p>
        )}
        <p className="text-sm text-silt-700">
          {counts.reviews} {counts.reviews === 1 ? "review" : "reviews"} · {counts.jobsCompleted} {role === "hatchery" ? (counts.jobsCompleted === 1 ? "order" : "orders") : counts.jobsCompleted === 1 ? "job" : "jobs"} completed on Shoal
          {counts.survivalReports > 0 ? ` · ${counts.survivalReports} survival ${counts.survivalReports === 1 ? "report" : "reports"}` : ""}
        </p>
      </div>
      <ul className="divide-y divide-silt-100 border-y border-silt-100" aria-labelledby={headingId}>
        {summary.reasons.map((r) => (
          <Reason key={r.code} reason={r} />
        ))}
      </ul>
    </div>
  );
}
