import type { TankComparisonRow } from "@/lib/planner/plan-estimate";
import { money, num } from "./format";
import { TANK_TYPE_LABEL } from "./labels";
import { ShareBar } from "./share-bar";

/**
 * The same size built as each tank type: build cost, life and what a cycle costs (the tank's share plus running),
 * on one scale. Other types use their own default water changes and life, and stock to their own capacity.
 */
export function TankComparisonChart({ rows, currency }: { rows: readonly TankComparisonRow[]; currency: string }) {
  const scale = Math.max(1, ...rows.map((r) => r.cycleCostMinor));
  return (
    <div className="space-y-4" data-testid="chart-tank-types">
      <p className="flex flex-wrap gap-x-4 gap-y-1 text-xs text-silt-700">
        <span className="flex items-center gap-1.5">
          <span aria-hidden className="inline-block h-3 w-3 rounded-sm bg-silt-500 [-webkit-print-color-adjust:exact] [print-color-adjust:exact]" /> Tank, spread over its life
        </span>
        <span className="flex items-center gap-1.5">
          <span aria-hidden className="inline-block h-3 w-3 rounded-sm bg-reed-400 [-webkit-print-color-adjust:exact] [print-color-adjust:exact]" /> Running: fingerlings, feed, power, labour
        </span>
      </p>
      <ul className="space-y-4">
        {rows.map((r) => (
          <li key={r.type} className="break-inside-avoid" data-testid={`tank-type-${r.type}`}>
            <div className="flex flex-wrap items-baseline justify-between gap-x-3">
              <span className="font-semibold text-silt-900">
                {TANK_TYPE_LABEL[r.type]}
                {r.isCurrent ? <span className="ml-2 rounded-full bg-lagoon-100 px-2 py-0.5 text-xs font-medium text-lagoon-800">this plan</span> : null}
              </span>
              <span className="text-sm tabular-nums text-silt-800">{money(r.cycleCostMinor, currency)} a cycle</span>
            </div>
            <ShareBar
              parts={[
                { value: r.amortisationPerCycleMinor, className: "fill-silt-500" },
                { value: r.runningCostPerCycleMinor, className: "fill-reed-400" },
              ]}
              scale={scale}
              label={`${TANK_TYPE_LABEL[r.type]}: ${money(r.cycleCostMinor, currency)} a cycle`}
            />
            <dl className="mt-1.5 grid grid-cols-2 gap-x-4 gap-y-0.5 text-xs text-silt-700 sm:grid-cols-4">
              <div>
                <dt className="inline">Build: </dt>
                <dd className="inline tabular-nums text-silt-900">{r.buildCostMinor === null ? "enter a quote" : money(r.buildCostMinor, currency)}</dd>
              </div>
              <div>
                <dt className="inline">Life: </dt>
                <dd className="inline tabular-nums text-silt-900">{num(r.lifeYears, 1)} years</dd>
              </div>
              <div>
                <dt className="inline">Running: </dt>
                <dd className="inline tabular-nums text-silt-900">{money(r.runningCostPerCycleMinor, currency)}</dd>
              </div>
              <div>
                <dt className="inline">Margin: </dt>
                <dd className={`inline tabular-nums ${r.marginMinor < 0 ? "text-clay-700" : "text-silt-900"}`}>{money(r.marginMinor, currency)}</dd>
              </div>
              <div className="col-span-2 sm:col-span-4">
                <dt className="inline">Holds: </dt>
                <dd className="inline tabular-nums text-silt-900">
                  {num(r.fishStocked)} fish, {num(r.harvestKg, 0)} kg at harvest, {num(r.energyKWh, 1)} kWh of pumping
                </dd>
              </div>
            </dl>
          </li>
        ))}
      </ul>
    </div>
  );
}
