import type { PlanEstimate } from "@/lib/planner/plan-estimate";
import { approx, fixed, money, num } from "./format";

function Figure({ label, value, sub, testId, tone = "plain" }: { label: string; value: string; sub?: string; testId: string; tone?: "plain" | "good" | "bad" }) {
  const colour = tone === "bad" ? "text-clay-700" : tone === "good" ? "text-lagoon-800" : "text-silt-950";
  return (
    <div className="break-inside-avoid rounded-lg border border-silt-200 bg-white px-3 py-2.5">
      <dt className="text-xs font-medium text-silt-600">{label}</dt>
      <dd className={`font-display text-xl font-semibold tabular-nums ${colour}`} data-testid={testId}>
        {value}
      </dd>
      {sub ? <dd className="text-xs text-silt-700">{sub}</dd> : null}
    </div>
  );
}

/** The answers a newcomer looks for first, at a glance. */
export function PlanKeyFigures({ estimate }: { estimate: PlanEstimate }) {
  const { tank, stocking, cycle, water, costs, economics, species } = estimate;
  const c = estimate.currency;
  const harvested = species.reduce((n, s) => n + s.fishHarvested, 0);
  const weights = species.map((s) => `${num(s.harvestWeightG)} g`).join(" / ");
  return (
    <dl className="grid grid-cols-2 gap-2 sm:grid-cols-3 xl:grid-cols-4">
      <Figure label="Water" value={`${num(tank.waterVolumeM3, 2)} m³`} sub={`${num(tank.waterVolumeLitres)} litres`} testId="figure-volume" />
      <Figure label="Weight on the base" value={`${num(tank.waterMassTonnes, 2)} t`} sub={`${fixed(tank.basePressureKPa, 2)} kPa on the floor`} testId="figure-weight" />
      <Figure label="Fish to stock" value={num(stocking.fishStocked)} sub={`order ${num(stocking.fishToOrder)} fingerlings`} testId="figure-fish" />
      <Figure label="Days to harvest" value={num(cycle.cycleDays)} sub={`about ${num(cycle.cycleWeeks, 0)} weeks, ${weights || "no fish"}`} testId="figure-days" />
      <Figure label="Harvest" value={`${approx(cycle.harvestKg)} kg`} sub={`about ${num(harvested)} fish`} testId="figure-harvest" />
      <Figure label="Feed for the cycle" value={`${approx(cycle.feedKg)} kg`} sub={`FCR ${species.map((s) => num(s.fcr, 2)).join(" / ") || "–"}`} testId="figure-feed" />
      <Figure label="Water pumped" value={`${approx(water.pumpedM3)} m³`} sub={`${approx(water.energyKWh)} kWh of electricity`} testId="figure-pumped" />
      <Figure label="Cost of the cycle" value={money(costs.totalMinor, c)} sub={`running ${money(costs.runningMinor, c)}`} testId="figure-cost" />
      <Figure label="Revenue" value={money(economics.revenueMinor, c)} testId="figure-revenue" />
      <Figure
        label="Margin"
        value={money(economics.marginMinor, c)}
        sub={economics.breakEvenPricePerKgMinor === null ? "no harvest" : `break-even ${money(economics.breakEvenPricePerKgMinor, c)} per kg`}
        testId="figure-margin"
        tone={economics.marginMinor < 0 ? "bad" : "good"}
      />
    </dl>
  );
}
