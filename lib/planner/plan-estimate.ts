import type { TankShape, TankType } from "@/lib/validations/planner";
import type { Assumption } from "./assumptions";
import type { PlanCaution } from "./cautions";
import type { BuildCostSource, CostBreakdown } from "./costs";
import type { WeeklyPoint } from "./cycle";
import type { LinerSheet } from "./geometry";
import type { FishSpecies } from "./species";
import type { DensityBasis } from "./stocking";
import type { PlanWarning } from "./warnings";

/* What estimatePlan returns. Units are in the names: M (metres), M2, M3, Kg, G (grams), KPa, KN, KWh, Minor (whole minor currency units). */

export interface TankFigures {
  type: TankType;
  shape: TankShape;
  floorAreaM2: number;
  waterDepthM: number;
  /** Water depth plus freeboard: the wall height, m. */
  fullHeightM: number;
  waterVolumeM3: number;
  waterVolumeLitres: number;
  waterMassKg: number;
  waterMassTonnes: number;
  waterWeightKN: number;
  basePressureKPa: number;
  /** Only for a tarpaulin tank. */
  linerSheet: LinerSheet | null;
}

export interface SpeciesFigures {
  species: FishSpecies;
  name: string;
  fishStocked: number;
  fishToOrder: number;
  /** Expected survivors at harvest, rounded to whole fish. */
  fishHarvested: number;
  stockingWeightG: number;
  targetHarvestWeightG: number;
  /** Weight reached at harvest: the target, or less when it is not reached within the longest cycle. */
  harvestWeightG: number;
  /** From the growth model; null when the target is not reached within the longest cycle. */
  daysToHarvest: number | null;
  harvestDay: number;
  reachesTarget: boolean;
  stockedBiomassKg: number;
  harvestKg: number;
  biomassGainKg: number;
  feedKg: number;
  fcr: number;
  /** The stocking limit used: kg/m³ at harvest for a tank, fish/m² for a pond. */
  densityLimit: { value: number; unit: "kg/m³" | "fish/m²" };
  fingerlingsMinor: number;
  revenueMinor: number;
}

export interface StockingFigures {
  basis: DensityBasis;
  /** Most fish the tank carries to harvest with the species mix entered. */
  capacityFish: number;
  fishStocked: number;
  fishToOrder: number;
  /** Load at harvest as a share of the limit (1 = at the limit; above 1 is over-density). */
  occupancyFraction: number;
  harvestDensityKgPerM3: number;
  stockingDensityFishPerM2: number;
}

export interface WaterFigures {
  intervalDays: number;
  fractionExchanged: number;
  changesPerCycle: number;
  initialFillM3: number;
  pumpedM3: number;
  pumpedLitres: number;
  pumpHeadM: number;
  pumpEfficiency: number;
  energyKWh: number;
}

export interface CycleFigures {
  /** From stocking to the last harvest, whole days. */
  cycleDays: number;
  cycleWeeks: number;
  harvestKg: number;
  stockedBiomassKg: number;
  biomassGainKg: number;
  feedKg: number;
}

export interface CostFigures extends CostBreakdown {
  currency: string;
  buildCostMinor: number | null;
  buildCostSource: BuildCostSource;
  lifeYears: number;
}

export interface EconomicsFigures {
  currency: string;
  revenueMinor: number;
  /** Revenue − total cost; negative for a loss. */
  marginMinor: number;
  /** Lowest whole price per kg that covers the cycle's cost; null when nothing is harvested. */
  breakEvenPricePerKgMinor: number | null;
}

export interface TankComparisonRow {
  type: TankType;
  isCurrent: boolean;
  buildCostMinor: number | null;
  buildCostSource: BuildCostSource;
  lifeYears: number;
  amortisationPerCycleMinor: number;
  runningCostPerCycleMinor: number;
  cycleCostMinor: number;
  fishStocked: number;
  harvestKg: number;
  energyKWh: number;
  marginMinor: number;
}

export interface PlanEstimate {
  currency: string;
  tank: TankFigures;
  stocking: StockingFigures;
  species: SpeciesFigures[];
  cycle: CycleFigures;
  water: WaterFigures;
  costs: CostFigures;
  economics: EconomicsFigures;
  weekly: WeeklyPoint[];
  tankComparison: TankComparisonRow[];
  warnings: PlanWarning[];
  cautions: PlanCaution[];
  assumptions: Assumption[];
}
