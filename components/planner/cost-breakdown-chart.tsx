import type { CostFigures, EconomicsFigures } from "@/lib/planner/plan-estimate";
import { money, num } from "./format";
import { ShareBar } from "./share-bar";

const LINES = [
  { key: "tankAmortisationMinor", label: "Tank, spread over its life", className: "fill-silt-500", swatch: "bg-silt-500" },
  { key: "fingerlingsMinor", label: "Fingerlings", className: "fill-lagoon-400", swatch: "bg-lagoon-400" },
  { key: "feedMinor", label: "Feed", className: "fill-reed-400", swatch: "bg-reed-400" },
  { key: "electricityMinor", label: "Electricity for pumping", className: "fill-clay-500", swatch: "bg-clay-500" },
  { key: "labourMinor", label: "Labour", className: "fill-lagoon-800", swatch: "bg-lagoon-800" },
] as const;

/** The cycle's cost line by line against the revenue, on one scale, so the margin shows as the gap between the two. */
export function CostBreakdownChart({ costs, economics }: { costs: CostFigures; economics: EconomicsFigures }) {
  const scale = Math.max(costs.totalMinor, economics.revenueMinor, 1);
  const c = costs.currency;
  return (
    <div className="space-y-3" data-testid="chart-costs" data-total={costs.totalMinor}>
      <ul className="space-y-2.5">
        {LINES.map((line) => {
          const value = costs[line.key];
          return (
            <li key={line.key} className="break-inside-avoid">
              <div className="flex items-baseline justify-between gap-3 text-sm">
                <span className="flex items-center gap-2 text-silt-800">
                  <span aria-hidden className={`inline-block h-3 w-3 rounded-sm ${line.swatch} [-webkit-print-color-adjust:exact] [print-color-adjust:exact]`} />
                  {line.label}
                </span>
                <span className="tabular-nums text-silt-900">
                  {money(value, c)} <span className="text-silt-600">({costs.totalMinor > 0 ? num((value / costs.totalMinor) * 100, 0) : 0} %)</span>
                </span>
              </div>
              <ShareBar parts={[{ value, className: line.className }]} scale={scale} />
            </li>
          );
        })}
      </ul>
      <div className="border-t border-silt-200 pt-3">
        <div className="flex justify-between text-sm font-semibold">
          <span>Cost of the cycle</span>
          <span className="tabular-nums">{money(costs.totalMinor, c)}</span>
        </div>
        <ShareBar parts={LINES.map((l) => ({ value: costs[l.key], className: l.className }))} scale={scale} label={`Cost of the cycle ${money(costs.totalMinor, c)}`} />
        <div className="mt-2 flex justify-between text-sm font-semibold">
          <span>Revenue from the harvest</span>
          <span className="tabular-nums">{money(economics.revenueMinor, c)}</span>
        </div>
        <ShareBar parts={[{ value: economics.revenueMinor, className: "fill-lagoon-600" }]} scale={scale} label={`Revenue ${money(economics.revenueMinor, c)}`} />
      </div>
    </div>
  );
}
