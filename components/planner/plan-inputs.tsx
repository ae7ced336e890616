import { SPECIES_NAMES } from "@/lib/planner/species";
import type { PlanInput } from "@/lib/validations/planner";
import { lengthBoth, money, num, percent } from "./format";
import { LINER_LABEL, SUN_LABEL, TANK_TYPE_LABEL } from "./labels";

/** What the plan was worked out from, in words: for a printed or shared plan, where the form is not shown. */
export function PlanInputs({ input }: { input: PlanInput }) {
  const c = input.currency;
  const d = input.tank.dimensions;
  const inTank = input.species === "both" ? (["tilapia", "catfish"] as const) : ([input.species] as const);
  const rows: [string, string][] = [
    ["Tank", `${TANK_TYPE_LABEL[input.tank.type]}, ${d.shape === "round" ? `round, ${lengthBoth(d.diameterM)} across` : `${lengthBoth(d.lengthM)} × ${lengthBoth(d.widthM)}`}`],
    ["Water depth and freeboard", `${lengthBoth(input.tank.waterDepthM)} + ${lengthBoth(input.tank.freeboardM)}`],
    ["Site", `${input.tank.type === "tarpaulin" ? `${LINER_LABEL[input.tank.linerColour]} liner, ` : ""}${SUN_LABEL[input.tank.sunExposure].toLowerCase()}`],
    ["Build cost", input.tank.buildCostOverrideMinor == null ? "planner's estimate" : money(input.tank.buildCostOverrideMinor, c)],
    ["Tank life", input.tank.lifeYears == null ? "planner's default" : `${num(input.tank.lifeYears, 1)} years`],
  ];
  for (const s of inTank) {
    const stock = input[s];
    rows.push([
      SPECIES_NAMES[s],
      `${num(stock.stockingWeightG, 1)} g → ${num(stock.targetHarvestWeightG)} g, fingerlings ${money(stock.fingerlingPriceMinor, c)} each, sold at ${money(stock.salePricePerKgMinor, c)}/kg, FCR ${num(stock.fcr, 2)}`,
    ]);
  }
  if (input.species === "both") rows.push(["Tilapia share of the fish", percent(input.tilapiaShareOfFishFraction)]);
  if (inTank.some((s) => s === "catfish")) rows.push(["Shade for catfish", input.catfishShadeProvided ? "yes" : "no"]);
  rows.push(
    ["Fish to stock", input.fishToStock == null ? "as many as the tank carries" : num(input.fishToStock)],
    ["Survival", `${percent(input.quarantineSurvivalFraction)} in quarantine, ${percent(input.growOutSurvivalFraction)} in grow-out`],
    ["Water temperature", `${num(input.waterTemperatureC, 1)} °C`],
    ["Feed price", `${money(input.feedPricePerKgMinor, c)} per kg`],
    ["Water changes", `${percent(input.waterChange.fractionExchanged)} every ${num(input.waterChange.intervalDays)} days`],
    ["Pump", `${num(input.pump.headM, 1)} m head, ${percent(input.pump.efficiencyFraction)} efficient, electricity ${money(input.pump.electricityTariffPerKWhMinor, c)}/kWh`],
    ["Labour", `${money(input.labourCostPerCycleMinor, c)} per cycle`],
  );
  return (
    <dl className="grid gap-x-6 text-sm sm:grid-cols-2" data-testid="plan-inputs">
      {rows.map(([k, v]) => (
        <div key={k} className="break-inside-avoid border-b border-silt-100 py-1.5">
          <dt className="text-xs text-silt-600">{k}</dt>
          <dd className="text-silt-900">{v}</dd>
        </div>
      ))}
    </dl>
  );
}
