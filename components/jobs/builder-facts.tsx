import Link from "next/link";
import { TrustBadge } from "@/components/trust/trust-badge";
import { ResponsiveImage } from "@/components/upload/responsive-image";
import type { BuilderCard } from "@/lib/quotes/quote-views";
import type { TrustBadge as TrustBadgeData } from "@/lib/reviews/types";

/** What a farmer can judge a builder by: the trust badge (or the Shoal check and jobs finished here), the portfolio. */
export function BuilderFacts({ builder, distance, trust }: { builder: BuilderCard; distance?: string; trust?: TrustBadgeData }) {
  return (
    <div className="flex items-start gap-3">
      {builder.avatar ? (
        <ResponsiveImage {...builder.avatar} sizes="48px" className="h-12 w-12 shrink-0 rounded-xl object-cover" />
      ) : (
        <span className="h-12 w-12 shrink-0 rounded-xl bg-reed-100" aria-hidden="true" />
      )}
      <div className="min-w-0 space-y-1">
        <p className="font-semibold text-silt-950">{builder.name}</p>
        {trust ? (
          <TrustBadge badge={trust} role="builder" />
        ) : (
          <p className="flex flex-wrap gap-1.5 text-xs">
            {builder.verified ? (
              <span className="rounded-full bg-lagoon-100 px-2 py-0.5 font-medium text-lagoon-800">Checked by Shoal</span>
            ) : (
              <span className="rounded-full bg-silt-200 px-2 py-0.5 font-medium text-silt-700">Not checked yet</span>
            )}
            <span className="rounded-full bg-silt-100 px-2 py-0.5 text-silt-700">
              {builder.jobsCompleted} {builder.jobsCompleted === 1 ? "job" : "jobs"} done through Shoal
            </span>
          </p>
        )}
        <p className="text-xs text-silt-600">
          {distance ? `${distance} from your site · ` : ""}
          <Link href={`/providers/${builder.id}#reviews`} className="font-medium text-lagoon-700 underline underline-offset-2">
            Reviews<span className="sr-only"> of {builder.name}</span>
          </Link>
          {" · "}
          <Link href={`/providers/${builder.id}#finished-tanks`} className="font-medium text-lagoon-700 underline underline-offset-2">
            Portfolio ({builder.portfolioCount} {builder.portfolioCount === 1 ? "tank" : "tanks"})
          </Link>
        </p>
      </div>
    </div>
  );
}
