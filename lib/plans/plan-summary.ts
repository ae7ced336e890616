import type { PlanEstimate } from "@/lib/planner/plan-estimate";
import type { WarningCode } from "@/lib/planner/warnings";
import type { PlanInput } from "@/lib/validations/planner";

/**
 * The few figures another page needs to show a plan without re-running it: what a builder reads on a tank request
 * (type, size, water and its weight) and what the farmer expects from the cycle. Metres, m³, kg, tonnes, kPa, days,
 * minor currency units.
 */
export interface PlanSummary {
  tankType: PlanInput["tank"]["type"];
  dimensions: PlanInput["tank"]["dimensions"];
  waterDepthM: number;
  fullHeightM: number;
  waterVolumeM3: number;
  waterMassTonnes: number;
  basePressureKPa: number;
  species: PlanInput["species"];
  fishStocked: number;
  fishToOrder: number;
  cycleDays: number;
  harvestKg: number;
  currency: string;
  buildCostMinor: number | null;
  cycleCostMinor: number;
  revenueMinor: number;
  marginMinor: number;
  warningCodes: WarningCode[];
}

export function planSummary(input: PlanInput, estimate: PlanEstimate): PlanSummary {
  return {
    tankType: input.tank.type,
    dimensions: input.tank.dimensions,
    waterDepthM: estimate.tank.waterDepthM,
    fullHeightM: estimate.tank.fullHeightM,
    waterVolumeM3: estimate.tank.waterVolumeM3,
    waterMassTonnes: estimate.tank.waterMassTonnes,
    basePressureKPa: estimate.tank.basePressureKPa,
    species: input.species,
    fishStocked: estimate.stocking.fishStocked,
    fishToOrder: estimate.stocking.fishToOrder,
    cycleDays: estimate.cycle.cycleDays,
    harvestKg: estimate.cycle.harvestKg,
    currency: estimate.currency,
    buildCostMinor: estimate.costs.buildCostMinor,
    cycleCostMinor: estimate.costs.totalMinor,
    revenueMinor: estimate.economics.revenueMinor,
    marginMinor: estimate.economics.marginMinor,
    warningCodes: estimate.warnings.map((w) => w.code),
  };
}
