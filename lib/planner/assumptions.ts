import type { PlanInput, TankType } from "@/lib/validations/planner";
import { MAX_CYCLE_DAYS } from "./cycle";
import { BUILD_COST_MODEL, BUILD_COST_MODEL_CURRENCY } from "./costs";
import { FEEDING_TABLES } from "./feeding";
import { LINER_FOLD_ALLOWANCE_M } from "./geometry";
import { GROWTH_CALIBRATION, GROWTH_STAGES, temperatureGrowthFactor } from "./growth";
import { FRESH_WATER_DENSITY_KG_PER_M3, STANDARD_GRAVITY_M_PER_S2 } from "./physics";
import { SPECIES_NAMES, type FishSpecies } from "./species";
import { TANK_BIOMASS_LIMIT_KG_PER_M3, pondFishPerM2 } from "./stocking";

/** How far to trust a value: read in a published source, general trade practice, recalled but not checked, or made up for the demo. */
export type Confidence = "published" | "common practice" | "from memory" | "demo default";

export interface Assumption {
  key: string;
  label: string;
  value: number | string;
  unit: string;
  source: string;
  confidence: Confidence;
}

export interface DefaultSource {
  source: string;
  confidence: Confidence;
}

/**
 * Where each default in `defaultPlanInput` comes from, keyed by the field's path, for the form to show beside the field.
 * Prices are demo defaults the user must replace with their own.
 */
export const INPUT_DEFAULT_SOURCES: Readonly<Record<string, DefaultSource>> = {
  "tank.dimensions": { source: "6 ft × 10 ft (1.8288 m × 3.048 m), a common small tarpaulin tank size", confidence: "common practice" },
  "tank.waterDepthM": { source: "About 1 m of water in a small tank", confidence: "demo default" },
  "tank.freeboardM": { source: "0.3 m of wall above the water to stop fish jumping out and rain overflowing", confidence: "demo default" },
  "tank.lifeYears": { source: "Service life by tank type (lib/planner/costs.ts), from memory", confidence: "from memory" },
  "tank.buildCostOverrideMinor": { source: "Planner build-cost model in ZMW (lib/planner/costs.ts); replace with a builder's quote", confidence: "demo default" },
  "tilapia.stockingWeightG": { source: "10 g all-male fingerlings, a usual size to buy for grow-out", confidence: "demo default" },
  "tilapia.targetHarvestWeightG": { source: "350 g, near the 360 g harvest of Arredondo-Figueroa et al. 2015 (REFERENCE-VALUES 3.5)", confidence: "published" },
  "tilapia.fcr": { source: "1.5, within the published 1.1 to 1.9 (REFERENCE-VALUES 2.6, 2.7, 1.10), above pond figures because a tank has no natural food", confidence: "demo default" },
  "catfish.stockingWeightG": { source: "10 g fingerlings", confidence: "demo default" },
  "catfish.targetHarvestWeightG": { source: "About 1 kg, the 10-month farm weight in FAO AFFRIS (REFERENCE-VALUES 3.1)", confidence: "published" },
  "catfish.fcr": { source: "1.3; FCR 1.1 is reported for some farm-made feeds in Uganda (FAO AFFRIS, REFERENCE-VALUES 2.12)", confidence: "demo default" },
  tilapiaShareOfFishFraction: { source: "8 tilapia in 10 fish when both species share a tank", confidence: "demo default" },
  growOutSurvivalFraction: { source: "85 %; 87 % over 10 months in a pond (Arredondo-Figueroa et al. 2015, REFERENCE-VALUES 3.5)", confidence: "published" },
  quarantineSurvivalFraction: { source: "95 %; no farm-level source gives quarantine losses (REFERENCE-VALUES §6 Gap)", confidence: "demo default" },
  waterTemperatureC: { source: "26 °C, inside the normal range of both species (REFERENCE-VALUES 4.1, 4.9)", confidence: "demo default" },
  catfishShadeProvided: { source: "Off, so a catfish plan asks about shade", confidence: "demo default" },
  waterChange: { source: "A full change every week for a tank with no soil; an earthen pond a tenth a week", confidence: "common practice" },
  "pump.headM": { source: "5 m lift from a well or reservoir to the tank rim", confidence: "demo default" },
  "pump.efficiencyFraction": { source: "40 % wire-to-water for a small electric pump", confidence: "from memory" },
  "pump.electricityTariffPerKWhMinor": { source: "ZMW 1.50 per kWh, a demo price: enter your tariff", confidence: "demo default" },
  feedPricePerKgMinor: { source: "ZMW 18 per kg of pellets, a demo price: enter yours", confidence: "demo default" },
  "tilapia.fingerlingPriceMinor": { source: "ZMW 1.50 per fingerling, a demo price: enter the hatchery's", confidence: "demo default" },
  "catfish.fingerlingPriceMinor": { source: "ZMW 2.50 per fingerling, a demo price: enter the hatchery's", confidence: "demo default" },
  "tilapia.salePricePerKgMinor": { source: "ZMW 60 per kg, a demo price: enter your market's", confidence: "demo default" },
  "catfish.salePricePerKgMinor": { source: "ZMW 45 per kg, a demo price: enter your market's", confidence: "demo default" },
  labourCostPerCycleMinor: { source: "ZMW 1 500 per cycle, a demo figure", confidence: "demo default" },
};

export interface AssumptionContext {
  input: PlanInput;
  speciesInTank: readonly FishSpecies[];
  /** Feeding-table rows (upper bound, g) each species passed through during the cycle. */
  feedingClassesUsed: Readonly<Record<FishSpecies, readonly number[]>>;
  lifeYears: number;
  lifeFromInput: boolean;
  buildCostFromModel: boolean;
}

function physicsAssumptions(): Assumption[] {
  return [
    { key: "water-density", label: "Density of fresh water", value: FRESH_WATER_DENSITY_KG_PER_M3, unit: "kg/m³", source: "Round figure for fresh water, as in the Engineering ToolBox pump examples (REFERENCE-VALUES 7.1)", confidence: "published" },
    { key: "gravity", label: "Acceleration of gravity", value: STANDARD_GRAVITY_M_PER_S2, unit: "m/s²", source: "Standard gravity, exact by definition (3rd CGPM, 1901)", confidence: "published" },
    { key: "pump-energy", label: "Pumping energy", value: "E = ρ g V H / η", unit: "kWh", source: "P = ρ g Q H / η (Engineering ToolBox, REFERENCE-VALUES 7.1) times running time V/Q; 1 kWh = 3.6 MJ (FAO I&D Paper 43, 7.4)", confidence: "published" },
    { key: "water-pumped", label: "Water pumped", value: "first fill + each scheduled change", unit: "m³", source: "Evaporation top-ups and seepage are not counted (product choice)", confidence: "demo default" },
  ];
}

function stockingAssumptions(ctx: AssumptionContext): Assumption[] {
  const out: Assumption[] = [];
  for (const species of ctx.speciesInTank) {
    const name = SPECIES_NAMES[species];
    if (ctx.input.tank.type === "earthen") {
      const perM2 = pondFishPerM2(species, ctx.input[species].targetHarvestWeightG);
      out.push({
        key: `pond-density-${species}`,
        label: `${name} per m² of pond`,
        value: perM2,
        unit: "fish/m²",
        source:
          species === "tilapia"
            ? "2/m² fed (Duodu et al. 2020, REFERENCE-VALUES 1.11; Arredondo-Figueroa et al. 2015, 1.14)"
            : "2/m² for about 500 g to 10/m² for about 200 g, read off the target weight (FAO Fisheries Technical Paper 362 §6.1, REFERENCE-VALUES 1.1)",
        confidence: "published",
      });
    } else {
      out.push({
        key: `tank-limit-${species}`,
        label: `Most ${name} biomass a tank carries at harvest`,
        value: TANK_BIOMASS_LIMIT_KG_PER_M3[species],
        unit: "kg/m³",
        source:
          species === "tilapia"
            ? "0.25 lb/US gal in aerated tanks (Tank culture of tilapia, SRAC 282 text; REFERENCE-VALUES 1.7); assumes the tank is aerated"
            : "Product choice: no FAO or SRAC figure found for catfish in tanks (REFERENCE-VALUES §1 Gap); a conservative value for weekly water changes",
        confidence: species === "tilapia" ? "published" : "from memory",
      });
    }
  }
  out.push(
    { key: "survival-pattern", label: "Grow-out losses", value: "spread evenly over the cycle", unit: "", source: "Constant daily loss rate (product choice); survival is the user's figure", confidence: "demo default" },
    { key: "quarantine", label: "Quarantine losses", value: "before stocking", unit: "", source: "Fingerlings are ordered to cover quarantine losses; quarantine days are not counted in the grow-out (30 days is an adequate import standard: REFERENCE-VALUES 6.1)", confidence: "demo default" },
  );
  return out;
}

function growthAssumptions(ctx: AssumptionContext): Assumption[] {
  const out: Assumption[] = [];
  const calibrationOf: Record<FishSpecies, string> = {
    tilapia: `${GROWTH_CALIBRATION.tilapiaNursery.source}; ${GROWTH_CALIBRATION.tilapiaGrowOut.source}`,
    catfish: GROWTH_CALIBRATION.catfish.source,
  };
  for (const species of ctx.speciesInTank) {
    const name = SPECIES_NAMES[species];
    GROWTH_STAGES[species].forEach((stage, index) => {
      const stageName = GROWTH_STAGES[species].length > 1 ? (index === 0 ? ` below ${stage.upToG} g` : " above the nursery stage") : "";
      out.push({
        key: `growth-coefficient-${species}-${index}`,
        label: `${name} cube-root growth coefficient${stageName}`,
        value: stage.coefficient,
        unit: "g^(1/3)/day",
        source: `W^(1/3) grows linearly in time (TGC form), calibrated on ${calibrationOf[species]}`,
        confidence: "published",
      });
    });
    out.push({
      key: `temperature-factor-${species}`,
      label: `${name} growth at ${ctx.input.waterTemperatureC} °C, share of the calibrated rate`,
      value: temperatureGrowthFactor(species, ctx.input.waterTemperatureC),
      unit: "fraction",
      source: "Straight ramps between published temperature limits (REFERENCE-VALUES 4.1 to 4.3, 4.9, 4.10); the ramps are a product choice, catfish growth stopping at 15 °C is from memory",
      confidence: "demo default",
    });
  }
  out.push({ key: "max-cycle", label: "Longest cycle considered", value: MAX_CYCLE_DAYS, unit: "days", source: "Product choice: two years", confidence: "demo default" });
  return out;
}

function feedingAssumptions(ctx: AssumptionContext): Assumption[] {
  const out: Assumption[] = [];
  for (const species of ctx.speciesInTank) {
    for (const row of FEEDING_TABLES[species]) {
      if (!ctx.feedingClassesUsed[species].includes(row.upToG)) continue;
      const size = Number.isFinite(row.upToG) ? `under ${row.upToG} g` : "from the last class up";
      out.push({
        key: `feeding-rate-${species}-${Number.isFinite(row.upToG) ? row.upToG : "max"}`,
        label: `${SPECIES_NAMES[species]} daily ration, ${size}`,
        value: row.percentBodyWeightPerDay,
        unit: "% body weight/day",
        source: row.source,
        confidence: row.source.startsWith("From memory") ? "from memory" : "published",
      });
    }
  }
  out.push({
    key: "feed-scaled-to-fcr",
    label: "Feed total",
    value: "FCR × (harvest biomass − stocked biomass)",
    unit: "kg",
    source: "The table sets the week-by-week pattern; the cycle total is scaled to the FCR entered (see lib/planner/feeding.ts)",
    confidence: "common practice",
  });
  return out;
}

function tankAssumptions(ctx: AssumptionContext): Assumption[] {
  const type: TankType = ctx.input.tank.type;
  const out: Assumption[] = [];
  if (type === "tarpaulin") {
    out.push({ key: "liner-fold-allowance", label: "Liner fold-over allowance on each edge", value: LINER_FOLD_ALLOWANCE_M, unit: "m", source: "Product choice: enough to wrap the top rail; one sheet, corners folded not cut", confidence: "demo default" });
  }
  if (type === "earthen") {
    out.push({ key: "pond-sides", label: "Pond sides", value: "vertical", unit: "", source: "Simplification: a pond with sloped sides holds less water than shown", confidence: "demo default" });
  }
  if (ctx.buildCostFromModel) {
    const rates = BUILD_COST_MODEL[type];
    const rate = "perM2LinerMinor" in rates ? `${rates.perM2LinerMinor} per m² of liner` : "perM2SurfaceMinor" in rates ? `${rates.fixedMinor} + ${rates.perM2SurfaceMinor} per m² of floor and walls` : `${rates.fixedMinor} + ${rates.perM3ExcavatedMinor} per m³ dug`;
    out.push({ key: "build-cost-model", label: `Build cost of a ${type} tank`, value: rate, unit: `${BUILD_COST_MODEL_CURRENCY} minor units`, source: "Demo build-cost model (lib/planner/costs.ts): replace with a builder's quote", confidence: "demo default" });
  }
  if (!ctx.lifeFromInput) {
    out.push({ key: "tank-life", label: `Life of a ${type} tank`, value: ctx.lifeYears, unit: "years", source: "Typical service life by tank type", confidence: "from memory" });
  }
  return out;
}

export function planAssumptions(ctx: AssumptionContext): Assumption[] {
  return [...physicsAssumptions(), ...stockingAssumptions(ctx), ...growthAssumptions(ctx), ...feedingAssumptions(ctx), ...tankAssumptions(ctx)];
}
