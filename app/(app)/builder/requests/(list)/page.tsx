import type { Metadata } from "next";
import Link from "next/link";
import { Card, PageHeading } from "@/components/ui/card";
import { requirePagePermission } from "@/lib/auth/session";
import { SITE_READINESS_LABEL } from "@/lib/jobs/vocabulary";
import { formatMoney } from "@/lib/money/money";
import { formatDay } from "@/lib/requests/format";
import { formatDistance } from "@/lib/requests/reach";
import { builderQuotes, openRequestsForBuilder } from "@/lib/requests/request-views";

export const metadata: Metadata = { title: "Tank requests near you" };

const QUOTE_STATE_TEXT = { sent: "Quote sent", withdrawn: "Withdrawn", accepted: "Accepted", declined: "Not chosen" } as const;

export default async function BuilderRequestsPage() {
  const user = await requirePagePermission("tank-request:quote", "/builder/requests");
  const [near, mine] = await Promise.all([openRequestsForBuilder(user.id), builderQuotes(user.id)]);
  return (
    <div className="mx-auto max-w-4xl space-y-6">
      <PageHeading
        title="Tank requests near you"
        lead={near.base ? `Open requests whose site is within your ${near.radiusKm} km service radius, nearest first. Distances are straight-line from your base.` : undefined}
      />
      {!near.base ? (
        <Card>
          <p className="text-silt-700">
            Add your base location to your <Link href="/onboarding" className="font-medium text-lagoon-700 underline underline-offset-2">profile</Link> first: requests reach you by the distance from it.
          </p>
        </Card>
      ) : near.requests.length === 0 ? (
        <Card>
          <p className="text-silt-700">No open requests within {near.radiusKm} km right now. New ones come to you by e-mail.</p>
        </Card>
      ) : (
        <ul className="space-y-3" aria-label="Open requests within reach">
          {near.requests.map((r) => (
            <li key={r.id}>
              <Card className="flex flex-wrap items-center justify-between gap-3">
                <div className="min-w-0">
                  <Link href={`/builder/requests/${r.id}`} className="font-semibold text-lagoon-800 underline-offset-2 first-letter:uppercase hover:underline">
                    {r.title}
                  </Link>
                  <p className="text-sm text-silt-600">
                    {SITE_READINESS_LABEL[r.readiness]} · {r.floorAreaM2.toFixed(1)} m² floor · wanted by {formatDay(r.wantedBy)}
                  </p>
                </div>
                <div className="text-right">
                  <p className="font-semibold tabular-nums text-silt-900" data-testid="request-distance">{formatDistance(r.distanceM)}</p>
                  <p className="text-xs text-silt-600">{r.myQuote ? QUOTE_STATE_TEXT[r.myQuote] : "Not quoted yet"}</p>
                </div>
              </Card>
            </li>
          ))}
        </ul>
      )}
      {mine.length ? (
        <section aria-labelledby="mine-heading" className="space-y-3">
          <h2 id="mine-heading" className="text-xl font-semibold">Your quotes</h2>
          <ul className="divide-y divide-silt-100 rounded-card border border-silt-200 bg-white">
            {mine.map((q) => (
              <li key={q.quoteId} className="flex flex-wrap items-center justify-between gap-2 p-3 text-sm">
                <Link href={q.jobId ? `/builder/jobs/${q.jobId}` : `/builder/requests/${q.requestId}`} className="font-medium text-lagoon-800 underline-offset-2 first-letter:uppercase hover:underline">
                  {q.title}
                </Link>
                <span className="text-silt-700">
                  {formatMoney(q.totalMinor, q.currency)} · {QUOTE_STATE_TEXT[q.state]}
                  {q.version > 1 ? ` · version ${q.version}` : ""}
                </span>
              </li>
            ))}
          </ul>
        </section>
      ) : null}
    </div>
  );
}
