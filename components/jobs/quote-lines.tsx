import { formatMoney } from "@/lib/money/money";
import { formatDistance } from "@/lib/requests/reach";
import type { QuoteVersionView } from "@/lib/quotes/quote-views";

const KIND_LABEL = { materials: "Materials", labour: "Labour", travel: "Travel", other: "Other" } as const;

function quantity(q: number): string {
  return Number.isInteger(q) ? String(q) : String(Number(q.toFixed(4)));
}

/** A quote's lines and totals. The travel line says where its figure comes from. */
export function QuoteLines({ quote }: { quote: QuoteVersionView }) {
  const money = (minor: number) => formatMoney(minor, quote.currency);
  return (
    <div className="space-y-3">
      <p className="text-sm">
        <span className={`rounded-full px-2.5 py-0.5 text-xs font-semibold ${quote.farmerSuppliesMaterials ? "bg-reed-100 text-reed-800" : "bg-lagoon-100 text-lagoon-800"}`}>
          {quote.farmerSuppliesMaterials ? "You supply the materials" : "Turnkey: materials included"}
        </span>
      </p>
      <table className="w-full text-left text-sm">
        <caption className="sr-only">Quote lines</caption>
        <thead className="text-xs text-silt-600">
          <tr>
            <th scope="col" className="py-1.5 pr-2 font-medium">Line</th>
            <th scope="col" className="py-1.5 text-right font-medium">Amount</th>
          </tr>
        </thead>
        <tbody className="divide-y divide-silt-100 align-top">
          {quote.lines.map((l, i) => (
            <tr key={i} className={l.included ? "" : "text-silt-500"}>
              <td className="py-1.5 pr-2">
                <span className="block text-xs uppercase tracking-wide text-silt-500">{KIND_LABEL[l.kind]}</span>
                {l.kind === "travel" ? (
                  <span>
                    {formatDistance(quote.travelDistanceM)} straight-line × {money(l.unitPriceMinor)} per km
                  </span>
                ) : (
                  <span>
                    {l.description} · {quantity(l.quantity)} × {money(l.unitPriceMinor)}
                  </span>
                )}
                {l.included ? null : <span className="block text-xs font-medium text-reed-700">You supply this: not charged</span>}
              </td>
              <td className={`py-1.5 text-right tabular-nums ${l.included ? "" : "line-through"}`}>{money(l.totalMinor)}</td>
            </tr>
          ))}
          <tr>
            <td className="py-1.5 pr-2">Base service fee</td>
            <td className="py-1.5 text-right tabular-nums">{money(quote.baseFeeMinor)}</td>
          </tr>
        </tbody>
        <tfoot className="border-t-2 border-silt-200">
          <tr>
            <th scope="row" className="pt-2 pr-2 text-left font-semibold">Total</th>
            <td className="pt-2 text-right text-base font-semibold tabular-nums">{money(quote.totalMinor)}</td>
          </tr>
          <tr className="text-silt-700">
            <th scope="row" className="pr-2 text-left font-normal">Deposit held by Shoal when you accept (30 %)</th>
            <td className="text-right tabular-nums">{money(quote.depositMinor)}</td>
          </tr>
          <tr className="text-silt-700">
            <th scope="row" className="pr-2 text-left font-normal">Balance on completion</th>
            <td className="text-right tabular-nums">{money(quote.totalMinor - quote.depositMinor)}</td>
          </tr>
        </tfoot>
      </table>
      {quote.note ? <p className="whitespace-pre-line rounded-lg bg-silt-50 p-2.5 text-sm text-silt-700">{quote.note}</p> : null}
    </div>
  );
}
