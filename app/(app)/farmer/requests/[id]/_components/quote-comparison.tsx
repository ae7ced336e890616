import Link from "next/link";
import { BuilderFacts } from "@/components/jobs/builder-facts";
import { QuoteLines } from "@/components/jobs/quote-lines";
import { Card } from "@/components/ui/card";
import { formatMoney } from "@/lib/money/money";
import type { QuoteView } from "@/lib/quotes/quote-views";
import { formatDistance } from "@/lib/requests/reach";
import { trustKey, type TrustBadge } from "@/lib/reviews/types";
import { AcceptQuote } from "./accept-quote";

/** Quotes side by side: a short table of what differs, then each quote's lines. Cheapest first. */
export function QuoteComparison({ quotes, canAccept, badges }: { quotes: QuoteView[]; canAccept: boolean; badges?: ReadonlyMap<string, TrustBadge> }) {
  const money = (q: QuoteView, minor: number) => formatMoney(minor, q.current.currency);
  const badgeOf = (q: QuoteView) => badges?.get(trustKey(q.builder.id, "builder"));
  const rows: [string, (q: QuoteView) => React.ReactNode][] = [
    ["Total", (q) => <strong className="tabular-nums">{money(q, q.current.totalMinor)}</strong>],
    ["Deposit (held)", (q) => <span className="tabular-nums">{money(q, q.current.depositMinor)}</span>],
    ["Materials", (q) => (q.current.farmerSuppliesMaterials ? "You supply" : "Included")],
    ["Distance, straight line", (q) => formatDistance(q.current.travelDistanceM)],
    ["Travel", (q) => <span className="tabular-nums">{money(q, q.current.lines.filter((l) => l.kind === "travel").reduce((s, l) => s + l.totalMinor, 0))}</span>],
    ["Checked by Shoal", (q) => (q.builder.verified ? "Yes" : "Not yet")],
    ["Jobs done here", (q) => String(q.builder.jobsCompleted)],
    [
      "Reviews",
      (q) => {
        const b = badgeOf(q);
        if (!b) return "—";
        return b.isNew || b.displayRating === null ? `New (${b.reviews})` : `${b.displayRating.toFixed(1)} of 5 (${b.reviews})`;
      },
    ],
    [
      "Portfolio",
      (q) => (
        <Link href={`/providers/${q.builder.id}#finished-tanks`} className="text-lagoon-700 underline underline-offset-2">
          {q.builder.portfolioCount} {q.builder.portfolioCount === 1 ? "tank" : "tanks"}
        </Link>
      ),
    ],
  ];
  return (
    <section aria-labelledby="compare-heading" className="space-y-4">
      <h2 id="compare-heading" className="text-xl font-semibold text-silt-950">
        {quotes.length === 1 ? "One quote so far" : `${quotes.length} quotes side by side`}
      </h2>
      <div className="overflow-x-auto rounded-card border border-silt-200 bg-white">
        {/* Two quotes fit a phone side by side; more scroll sideways with the labels kept in view. */}
        <table className={`w-full text-left text-sm ${quotes.length > 2 ? "min-w-[36rem]" : ""}`} data-testid="quote-comparison">
          <thead>
            <tr className="border-b border-silt-200 bg-silt-50">
              <th scope="col" className="sticky left-0 bg-silt-50 p-2 font-medium text-silt-600 sm:p-2.5">
                <span className="sr-only">What</span>
              </th>
              {quotes.map((q) => (
                <th key={q.id} scope="col" className="p-2 font-semibold text-silt-950 sm:p-2.5">
                  {q.builder.name}
                  {q.versionCount > 1 ? <span className="block text-xs font-normal text-silt-600">revised (version {q.versionCount})</span> : null}
                </th>
              ))}
            </tr>
          </thead>
          <tbody className="divide-y divide-silt-100">
            {rows.map(([label, cell]) => (
              <tr key={label}>
                <th scope="row" className="sticky left-0 w-[7.5rem] bg-white p-2 font-medium text-silt-600 sm:w-auto sm:p-2.5">{label}</th>
                {quotes.map((q) => (
                  <td key={q.id} className="p-2 sm:p-2.5">{cell(q)}</td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <div className="grid gap-4 lg:grid-cols-2">
        {quotes.map((q) => (
          <Card key={q.id} className="space-y-4">
            <BuilderFacts builder={q.builder} distance={formatDistance(q.current.travelDistanceM)} trust={badgeOf(q)} />
            <QuoteLines quote={q.current} />
            {canAccept && q.state === "sent" ? <AcceptQuote quoteId={q.id} version={q.current.version} builderName={q.builder.name} deposit={money(q, q.current.depositMinor)} /> : null}
            {q.state === "accepted" ? <p className="rounded-lg bg-lagoon-50 p-2 text-sm font-medium text-lagoon-800">You accepted this quote.</p> : null}
          </Card>
        ))}
      </div>
    </section>
  );
}
