import { StarRow } from "@/components/reviews/stars";
import type { ReviewRole, TrustBadge as TrustBadgeData } from "@/lib/reviews/types";

function plural(n: number, one: string, many: string): string {
  return `${n.toLocaleString("en")} ${n === 1 ? one : many}`;
}

/** The sentence a screen reader hears for a badge; the visible badge is the same facts in short. */
export function trustBadgeText(badge: TrustBadgeData, role?: ReviewRole): string {
  const [one, many] = role === "hatchery" ? ["order", "orders"] : ["job", "jobs"];
  const rating = badge.displayRating === null || badge.isNew ? "New on Shoal" : `Rated ${badge.displayRating.toFixed(1)} out of 5`;
  return `${rating}, ${plural(badge.reviews, "review", "reviews")}, ${plural(badge.jobsCompleted, one, many)} completed on Shoal${badge.verified ? ", checked by Shoal" : ""}`;
}

/**
 * Rating and review count (or "New" with the counts while too few reviews exist), jobs (a hatchery: orders)
 * completed on Shoal and the verified mark. No hooks: it renders in server pages, list cards and map popups alike.
 */
export function TrustBadge({ badge, role, size = "sm", roleLabel, className = "" }: { badge: TrustBadgeData; role?: ReviewRole; size?: "sm" | "md"; roleLabel?: string; className?: string }) {
  const text = size === "md" ? "text-sm" : "text-xs";
  const rated = !badge.isNew && badge.displayRating !== null;
  return (
    <p className={`${text} text-silt-700 ${className}`} data-testid="trust-badge">
      <span className="sr-only">
        {roleLabel ? `${roleLabel}: ` : ""}
        {trustBadgeText(badge, role)}
      </span>
      <span aria-hidden="true" className="flex flex-wrap items-center gap-x-2 gap-y-1">
        {roleLabel ? <span className="font-medium text-silt-800">{roleLabel}</span> : null}
        {rated && badge.displayRating !== null ? (
          <span className="inline-flex items-center gap-1 rounded-full bg-reed-50 px-2 py-0.5 font-semibold text-reed-800 ring-1 ring-reed-200">
            <StarRow value={badge.displayRating} size={size === "md" ? "md" : "sm"} />
            {badge.displayRating.toFixed(1)}
          </span>
        ) : (
          <span className="rounded-full bg-reed-100 px-2 py-0.5 font-semibold text-reed-800">New</span>
        )}
        <span data-testid="trust-badge-reviews">{plural(badge.reviews, "review", "reviews")}</span>
        {/* The dot travels with the jobs, so a wrapped line never ends on a lone separator. */}
        <span className="whitespace-nowrap">·&nbsp;{role === "hatchery" ? plural(badge.jobsCompleted, "order", "orders") : plural(badge.jobsCompleted, "job", "jobs")} on Shoal</span>
        {badge.verified ? (
          <span className="inline-flex items-center gap-1 rounded-full bg-lagoon-100 px-2 py-0.5 font-medium text-lagoon-800">
            <svg viewBox="0 0 16 16" className="h-3 w-3" aria-hidden="true" focusable="false">
              <path d="M3 8.5l3 3 7-7" fill="none" stroke="currentColor" strokeWidth="2.2" strokeLinecap="round" strokeLinejoin="round" />
            </svg>
            Checked
          </span>
        ) : null}
      </span>
    </p>
  );
}
