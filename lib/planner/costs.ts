import type { TankDimensions, TankType } from "@/lib/validations/planner";
import { floorAreaM2, innerSurfaceM2, linerSheet } from "./geometry";
import { DAYS_PER_YEAR } from "./physics";

/*
 * Money is kept in whole minor currency units (ngwee, cents). Each cost line is rounded once, to the nearest unit,
 * and the total is the sum of the rounded lines so the breakdown always adds up.
 */

/**
 * Build-cost model: DEMO DEFAULTS in ZMW ngwee, made up to be plausible for Zambia and to keep the common-practice order
 * tarpaulin < concrete < excavated earthen pond at small-farm sizes. Not quotes: a builder's quote replaces them (the
 * plan's build-cost override). For another currency the model has no prices, so the build cost must be entered.
 * - tarpaulin: per m² of liner sheet (sheet, frame share and fittings);
 * - concrete: a fixed part (slab edge, outlet plumbing) plus per m² of floor and walls to full height;
 * - earthen: a fixed part (mobilisation, inlet and outlet) plus per m³ dug to full depth (digging, dyke shaping, compaction).
 */
export const BUILD_COST_MODEL_CURRENCY = "ZMW";
export const BUILD_COST_MODEL = {
  tarpaulin: { fixedMinor: 0, perM2LinerMinor: 30_000 },
  concrete: { fixedMinor: 300_000, perM2SurfaceMinor: 90_000 },
  earthen: { fixedMinor: 1_000_000, perM3ExcavatedMinor: 150_000 },
} as const;

/**
 * Service life by tank type, years: from memory (no source seen). PVC tarpaulin liners in the sun last a few years;
 * rendered block or concrete tanks and maintained earthen ponds last decades.
 */
export const DEFAULT_TANK_LIFE_YEARS: Readonly<Record<TankType, number>> = { tarpaulin: 5, concrete: 20, earthen: 20 };

export function modelBuildCostMinor(type: TankType, dimensions: TankDimensions, fullHeightM: number): number {
  if (type === "tarpaulin") return Math.round(BUILD_COST_MODEL.tarpaulin.fixedMinor + BUILD_COST_MODEL.tarpaulin.perM2LinerMinor * linerSheet(dimensions, fullHeightM).areaM2);
  if (type === "concrete") return Math.round(BUILD_COST_MODEL.concrete.fixedMinor + BUILD_COST_MODEL.concrete.perM2SurfaceMinor * innerSurfaceM2(dimensions, fullHeightM));
  return Math.round(BUILD_COST_MODEL.earthen.fixedMinor + BUILD_COST_MODEL.earthen.perM3ExcavatedMinor * floorAreaM2(dimensions) * fullHeightM);
}

export type BuildCostSource = "override" | "model" | "unknown";

export interface BuildCost {
  /** null when it is unknown (no override and the model has no prices in this currency). */
  minor: number | null;
  source: BuildCostSource;
}

export function resolveBuildCost(args: {
  type: TankType;
  dimensions: TankDimensions;
  fullHeightM: number;
  currency: string;
  overrideMinor: number | null | undefined;
}): BuildCost {
  if (args.overrideMinor !== null && args.overrideMinor !== undefined) return { minor: args.overrideMinor, source: "override" };
  if (args.currency !== BUILD_COST_MODEL_CURRENCY) return { minor: null, source: "unknown" };
  return { minor: modelBuildCostMinor(args.type, args.dimensions, args.fullHeightM), source: "model" };
}

/** Straight-line share of the build cost used up by one cycle: cost × cycle days ÷ (life in days). */
export function amortisationPerCycleMinor(buildCostMinor: number, lifeYears: number, cycleDays: number): number {
  return Math.round((buildCostMinor * cycleDays) / (lifeYears * DAYS_PER_YEAR));
}

/** Quantity × unit price, rounded to whole minor units; never negative for the non-negative inputs the planner passes. */
export function priceOf(quantity: number, unitPriceMinor: number): number {
  return Math.round(Math.max(0, quantity) * unitPriceMinor);
}

export interface CostBreakdown {
  tankAmortisationMinor: number;
  fingerlingsMinor: number;
  feedMinor: number;
  electricityMinor: number;
  labourMinor: number;
  totalMinor: number;
  /** Everything but the tank's amortisation: what a cycle costs to run. */
  runningMinor: number;
}

export function costBreakdown(lines: Omit<CostBreakdown, "totalMinor" | "runningMinor">): CostBreakdown {
  const runningMinor = lines.fingerlingsMinor + lines.feedMinor + lines.electricityMinor + lines.labourMinor;
  return { ...lines, runningMinor, totalMinor: runningMinor + lines.tankAmortisationMinor };
}

/** Lowest whole price per kg at which the harvest pays for the cycle; null when nothing is harvested. */
export function breakEvenPricePerKgMinor(totalCostMinor: number, harvestKg: number): number | null {
  if (!(harvestKg > 0)) return null;
  return Math.max(0, Math.ceil(totalCostMinor / harvestKg - 1e-9));
}
