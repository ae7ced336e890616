import type { PlanInput } from "@/lib/validations/planner";
import type { SpeciesRun } from "./cycle";
import { SPECIES_NAMES, type FishSpecies } from "./species";

export type WarningSeverity = "info" | "warning" | "danger";

export type WarningCode =
  | "over-density"
  | "tilapia-with-larger-catfish"
  | "catfish-outgrow-tilapia"
  | "black-liner-full-sun"
  | "catfish-without-shade"
  | "temperature-outside-range"
  | "target-not-reached"
  | "no-biomass-gain"
  | "no-fish"
  | "loss-making"
  | "build-cost-unknown";

export interface PlanWarning {
  code: WarningCode;
  severity: WarningSeverity;
  message: string;
  species?: FishSpecies;
}

export interface TemperatureRange {
  /** Outside this the fish die or are severely stressed. */
  survivalMinC: number;
  survivalMaxC: number;
  /** The range the fish grow normally in. */
  normalMinC: number;
  normalMaxC: number;
  source: string;
}

export const TEMPERATURE_RANGES: Readonly<Record<FishSpecies, TemperatureRange>> = {
  tilapia: {
    survivalMinC: 12,
    survivalMaxC: 40,
    normalMinC: 20,
    normalMaxC: 35,
    source: "Death below 12 °C, normal range from 20 °C (Kenya NAFIS, REFERENCE-VALUES 4.1); normal development to 35 °C (El-Sayed, 4.3); tolerated to 40 °C with conditioning (4.2)",
  },
  catfish: {
    survivalMinC: 8,
    survivalMaxC: 35,
    normalMinC: 26,
    normalMaxC: 33,
    source: "Tolerates 8 to 35 °C (Teugels 1986 via REFERENCE-VALUES 4.10); 26 to 33 °C acceptable, best growth at 30 °C (REFERENCE-VALUES 4.9)",
  },
};

export function temperatureWarning(species: FishSpecies, temperatureC: number): PlanWarning | null {
  const range = TEMPERATURE_RANGES[species];
  const name = SPECIES_NAMES[species];
  if (temperatureC < range.survivalMinC || temperatureC > range.survivalMaxC) {
    return {
      code: "temperature-outside-range",
      severity: "danger",
      species,
      message: `${temperatureC} °C is outside what ${name} survive (${range.survivalMinC} to ${range.survivalMaxC} °C): expect deaths, not growth.`,
    };
  }
  if (temperatureC < range.normalMinC || temperatureC > range.normalMaxC) {
    return {
      code: "temperature-outside-range",
      severity: "warning",
      species,
      message: `${temperatureC} °C is outside the range ${name} grow well in (${range.normalMinC} to ${range.normalMaxC} °C): growth is slower and the fish are stressed.`,
    };
  }
  return null;
}

export interface WarningContext {
  input: PlanInput;
  speciesInTank: readonly FishSpecies[];
  runs: readonly SpeciesRun[];
  capacityFish: number;
  fishStocked: number;
  densityLimitText: string;
  marginMinor: number;
  buildCostKnown: boolean;
}

/** Catfish eat fish smaller than themselves (common practice): the first day, if any, both are in the tank and a catfish weighs at least as much as a tilapia. */
function firstDayCatfishCatchUp(runs: readonly SpeciesRun[]): number | null {
  const tilapia = runs.find((r) => r.harvest.species === "tilapia");
  const catfish = runs.find((r) => r.harvest.species === "catfish");
  if (!tilapia || !catfish) return null;
  const together = Math.min(tilapia.harvest.harvestDay, catfish.harvest.harvestDay);
  for (let day = 0; day <= together; day += 1) {
    const t = tilapia.days[day];
    const c = catfish.days[day];
    if (t && c && c.meanWeightG >= t.meanWeightG) return day;
  }
  return null;
}

function mixingWarnings(ctx: WarningContext): PlanWarning[] {
  if (!(ctx.speciesInTank.includes("tilapia") && ctx.speciesInTank.includes("catfish"))) return [];
  const { tilapia, catfish } = ctx.input;
  if (tilapia.stockingWeightG <= catfish.stockingWeightG) {
    return [
      {
        code: "tilapia-with-larger-catfish",
        severity: "danger",
        message: `Tilapia stocked at ${tilapia.stockingWeightG} g with catfish of ${catfish.stockingWeightG} g will be eaten: stock tilapia clearly larger than the catfish, or keep them apart (common practice).`,
      },
    ];
  }
  const day = firstDayCatfishCatchUp(ctx.runs);
  if (day === null) return [];
  return [
    {
      code: "catfish-outgrow-tilapia",
      severity: "warning",
      message: `Catfish grow faster: by about week ${Math.ceil(day / 7)} they are as heavy as the tilapia and start eating them. Harvest or separate the tilapia before then (common practice).`,
    },
  ];
}

function siteWarnings(ctx: WarningContext): PlanWarning[] {
  const { tank, catfishShadeProvided } = ctx.input;
  const out: PlanWarning[] = [];
  if (tank.type === "tarpaulin" && tank.linerColour === "black" && tank.sunExposure === "full-sun") {
    out.push({
      code: "black-liner-full-sun",
      severity: "warning",
      message: "A black liner in full sun heats the water: shade the tank or choose a lighter liner (common practice).",
    });
  }
  if (ctx.speciesInTank.includes("catfish") && !catfishShadeProvided && tank.sunExposure !== "shade") {
    out.push({
      code: "catfish-without-shade",
      severity: "warning",
      species: "catfish",
      message: "Catfish need shade or a cover over part of the tank; without it they are stressed and feed poorly (common practice).",
    });
  }
  return out;
}

function growthWarnings(ctx: WarningContext): PlanWarning[] {
  const out: PlanWarning[] = [];
  for (const species of ctx.speciesInTank) {
    const temperature = temperatureWarning(species, ctx.input.waterTemperatureC);
    if (temperature) out.push(temperature);
  }
  for (const { harvest } of ctx.runs) {
    const name = SPECIES_NAMES[harvest.species];
    if (!harvest.reachesTarget) {
      out.push({
        code: "target-not-reached",
        severity: "danger",
        species: harvest.species,
        message: `${name} do not reach ${ctx.input[harvest.species].targetHarvestWeightG} g within two years at ${ctx.input.waterTemperatureC} °C; the figures are for ${harvest.harvestWeightG.toFixed(0)} g after ${harvest.harvestDay} days.`,
      });
    }
    if (harvest.fishStocked > 0 && harvest.biomassGainKg <= 0) {
      out.push({
        code: "no-biomass-gain",
        severity: "warning",
        species: harvest.species,
        message: `With these losses the ${name} harvested weigh no more than the fingerlings stocked, so the plan cannot produce fish; raise survival or the target weight.`,
      });
    }
  }
  return out;
}

function stockingWarnings(ctx: WarningContext): PlanWarning[] {
  if (ctx.fishStocked === 0) {
    const why = ctx.capacityFish === 0 ? "This tank is too small to carry even one fish to the target weight." : "No fish are stocked.";
    return [{ code: "no-fish", severity: "info", message: `${why} The figures show the cost of the tank and labour alone.` }];
  }
  if (ctx.fishStocked > ctx.capacityFish) {
    return [
      {
        code: "over-density",
        severity: "danger",
        message: `${ctx.fishStocked} fish is more than this tank can carry to harvest (about ${ctx.capacityFish}; limit ${ctx.densityLimitText}). Expect poor water, slow growth and losses: stock fewer or harvest part-way.`,
      },
    ];
  }
  return [];
}

function moneyWarnings(ctx: WarningContext): PlanWarning[] {
  const out: PlanWarning[] = [];
  if (!ctx.buildCostKnown) {
    out.push({
      code: "build-cost-unknown",
      severity: "warning",
      message: `The planner's build-cost model is priced in ZMW only; enter your tank's build cost in ${ctx.input.currency} to include it.`,
    });
  }
  if (ctx.fishStocked > 0 && ctx.marginMinor < 0) {
    out.push({ code: "loss-making", severity: "warning", message: "At these prices the cycle loses money: see the break-even price per kg." });
  }
  return out;
}

export function planWarnings(ctx: WarningContext): PlanWarning[] {
  return [...stockingWarnings(ctx), ...mixingWarnings(ctx), ...siteWarnings(ctx), ...growthWarnings(ctx), ...moneyWarnings(ctx)];
}
