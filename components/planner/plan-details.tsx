import type { PlanEstimate } from "@/lib/planner/plan-estimate";
import { approx, fixed, lengthBoth, money, num, percent } from "./format";

function Rows({ rows }: { rows: [string, string][] }) {
  return (
    <dl className="divide-y divide-silt-100 text-sm">
      {rows.map(([k, v]) => (
        <div key={k} className="flex justify-between gap-4 py-1.5">
          <dt className="text-silt-700">{k}</dt>
          <dd className="text-right tabular-nums text-silt-900">{v}</dd>
        </div>
      ))}
    </dl>
  );
}

/** Tank, water and pumping figures. */
export function TankWaterDetails({ estimate }: { estimate: PlanEstimate }) {
  const { tank, water, stocking } = estimate;
  const rows: [string, string][] = [
    ["Floor area", `${approx(tank.floorAreaM2)} m²`],
    ["Wall height (water + freeboard)", lengthBoth(tank.fullHeightM)],
    ["Water volume", `${fixed(tank.waterVolumeM3, 2)} m³ = ${num(tank.waterVolumeLitres)} L`],
    ["Water mass", `${fixed(tank.waterMassTonnes, 2)} t (${num(tank.waterWeightKN, 1)} kN)`],
    ["Pressure on the base", `${fixed(tank.basePressureKPa, 2)} kPa`],
  ];
  if (tank.linerSheet) {
    const l = tank.linerSheet;
    rows.push(["Liner sheet to buy", `${num(l.lengthM, 2)} m × ${num(l.widthM, 2)} m (${num(l.areaM2, 1)} m²)`]);
  }
  rows.push(
    ["Water changes", `${percent(water.fractionExchanged)} every ${num(water.intervalDays)} days, ${num(water.changesPerCycle)} in the cycle`],
    ["Water pumped in the cycle", `${num(water.pumpedM3, 1)} m³ = ${num(water.pumpedLitres)} L (first fill ${num(water.initialFillM3, 1)} m³)`],
    ["Pump", `${num(water.pumpHeadM, 1)} m head at ${percent(water.pumpEfficiency)} efficiency`],
    ["Electricity for pumping", `${num(water.energyKWh, 2)} kWh`],
    ["Stocking density", `${num(stocking.stockingDensityFishPerM2, 1)} fish/m², ${num(stocking.harvestDensityKgPerM3, 1)} kg/m³ at harvest`],
    ["Load at harvest", `${percent(stocking.occupancyFraction)} of what the tank carries (${num(stocking.capacityFish)} fish)`],
  );
  return <Rows rows={rows} />;
}

/** One column per species in the tank. */
export function SpeciesTable({ estimate }: { estimate: PlanEstimate }) {
  const c = estimate.currency;
  if (!estimate.species.length) return <p className="text-sm text-silt-700">No fish in this plan.</p>;
  const lines: [string, (s: PlanEstimate["species"][number]) => string][] = [
    ["Fish stocked", (s) => num(s.fishStocked)],
    ["Fingerlings to order", (s) => num(s.fishToOrder)],
    ["Expected at harvest", (s) => `${num(s.fishHarvested)} fish`],
    ["Weight (g)", (s) => `${num(s.stockingWeightG, 1)} → ${num(s.harvestWeightG, 0)}`],
    ["Days to harvest", (s) => (s.daysToHarvest === null ? `not reached in ${num(s.harvestDay)} days` : num(s.harvestDay))],
    ["Harvest", (s) => `${num(s.harvestKg, 1)} kg`],
    ["Feed", (s) => `${num(s.feedKg, 1)} kg`],
    ["FCR", (s) => num(s.fcr, 2)],
    ["Stocking limit", (s) => `${num(s.densityLimit.value, 1)} ${s.densityLimit.unit}`],
    ["Fingerlings cost", (s) => money(s.fingerlingsMinor, c)],
    ["Sales", (s) => money(s.revenueMinor, c)],
  ];
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-sm">
        <thead>
          <tr className="text-left">
            <th scope="col" className="py-1.5 pr-3 font-medium text-silt-600">
              <span className="sr-only">Figure</span>
            </th>
            {estimate.species.map((s) => (
              <th key={s.species} scope="col" className="py-1.5 pl-3 text-right font-semibold text-silt-900">
                {s.name}
              </th>
            ))}
          </tr>
        </thead>
        <tbody className="divide-y divide-silt-100">
          {lines.map(([label, value]) => (
            <tr key={label}>
              <th scope="row" className="py-1.5 pr-3 text-left font-normal text-silt-700">
                {label}
              </th>
              {estimate.species.map((s) => (
                <td key={s.species} className="whitespace-nowrap py-1.5 pl-3 text-right tabular-nums text-silt-900">
                  {value(s)}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
