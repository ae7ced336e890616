import { DEFAULT_WATER_CHANGE, TANK_TYPES, type TankType } from "./choices";
import type { PlanInput } from "@/lib/validations/planner";
import { planAssumptions } from "./assumptions";
import { planCautions } from "./cautions";
import { amortisationPerCycleMinor, breakEvenPricePerKgMinor, costBreakdown, DEFAULT_TANK_LIFE_YEARS, priceOf, resolveBuildCost } from "./costs";
import { harvestTiming, runCycle, type SpeciesRun } from "./cycle";
import { feedingClassFor } from "./feeding";
import { floorAreaM2, linerSheet, waterVolumeM3 } from "./geometry";
import { weightAfterDays } from "./growth";
import { baseLoad } from "./loads";
import { pumpingEnergyKWh, waterPumpedPerCycle } from "./pumping";
import { SPECIES_NAMES, speciesInTank, speciesShares, type FishSpecies } from "./species";
import {
  TANK_BIOMASS_LIMIT_KG_PER_M3,
  carryingCapacityFish,
  densityBasisFor,
  fingerlingsToOrder,
  occupancy,
  pondFishPerM2,
  splitBySpecies,
  type CarryingTank,
} from "./stocking";
import { cubicMetresToLitres } from "./units";
import type { CostFigures, CycleFigures, EconomicsFigures, PlanEstimate, SpeciesFigures, StockingFigures, TankComparisonRow, TankFigures, WaterFigures } from "./plan-estimate";
import { planWarnings } from "./warnings";

/*
 * The one entry point of the planner: estimatePlan(input) → PlanEstimate (shape in plan-estimate.ts). Pure and
 * synchronous, so the page runs it live in the browser and POST /api/plans/estimate runs it on the server.
 */

type CoreEstimate = Omit<PlanEstimate, "tankComparison">;

function tankFigures(input: PlanInput): TankFigures {
  const { tank } = input;
  const fullHeightM = tank.waterDepthM + tank.freeboardM;
  const volume = waterVolumeM3(tank.dimensions, tank.waterDepthM);
  const load = baseLoad(volume, tank.waterDepthM);
  return {
    type: tank.type,
    shape: tank.dimensions.shape,
    floorAreaM2: floorAreaM2(tank.dimensions),
    waterDepthM: tank.waterDepthM,
    fullHeightM,
    waterVolumeM3: volume,
    waterVolumeLitres: cubicMetresToLitres(volume),
    waterMassKg: load.waterMassKg,
    waterMassTonnes: load.waterMassTonnes,
    waterWeightKN: load.waterWeightKN,
    basePressureKPa: load.basePressureKPa,
    linerSheet: tank.type === "tarpaulin" ? linerSheet(tank.dimensions, fullHeightM) : null,
  };
}

/** Weight each species reaches by its harvest day: needed before stocking, since the limit is on harvest biomass. */
function carryingTank(input: PlanInput, tank: TankFigures, shares: Record<FishSpecies, number>): CarryingTank {
  const entry = (s: FishSpecies) => {
    const stock = input[s];
    const { harvestDay } = harvestTiming(s, stock.stockingWeightG, stock.targetHarvestWeightG, input.waterTemperatureC);
    const reached = Math.min(stock.targetHarvestWeightG, weightAfterDays(s, stock.stockingWeightG, harvestDay, input.waterTemperatureC));
    return { share: shares[s], harvestWeightG: reached, targetHarvestWeightG: stock.targetHarvestWeightG };
  };
  return {
    tankType: input.tank.type,
    waterVolumeM3: tank.waterVolumeM3,
    surfaceAreaM2: tank.floorAreaM2,
    growOutSurvival: input.growOutSurvivalFraction,
    species: { tilapia: entry("tilapia"), catfish: entry("catfish") },
  };
}

function densityLimitOf(input: PlanInput, species: FishSpecies): SpeciesFigures["densityLimit"] {
  if (densityBasisFor(input.tank.type) === "fish-per-m2") return { value: pondFishPerM2(species, input[species].targetHarvestWeightG), unit: "fish/m²" };
  return { value: TANK_BIOMASS_LIMIT_KG_PER_M3[species], unit: "kg/m³" };
}

function densityLimitText(input: PlanInput, inTank: readonly FishSpecies[]): string {
  return inTank
    .map((s) => {
      const limit = densityLimitOf(input, s);
      return `${limit.value.toFixed(limit.unit === "kg/m³" ? 0 : 1)} ${limit.unit} for ${SPECIES_NAMES[s]}`;
    })
    .join(", ");
}

function feedingClassesUsed(runs: readonly SpeciesRun[]): Record<FishSpecies, number[]> {
  const used: Record<FishSpecies, number[]> = { tilapia: [], catfish: [] };
  for (const run of runs) {
    const bounds = new Set(run.days.slice(0, -1).map((d) => feedingClassFor(run.harvest.species, d.meanWeightG).upToG));
    used[run.harvest.species] = [...bounds];
  }
  return used;
}

function speciesFigures(input: PlanInput, run: SpeciesRun): SpeciesFigures {
  const h = run.harvest;
  const stock = input[h.species];
  const fishToOrder = fingerlingsToOrder(h.fishStocked, input.quarantineSurvivalFraction);
  return {
    species: h.species,
    name: SPECIES_NAMES[h.species],
    fishStocked: h.fishStocked,
    fishToOrder,
    fishHarvested: Math.round(h.fishHarvestedExpected),
    stockingWeightG: h.stockingWeightG,
    targetHarvestWeightG: stock.targetHarvestWeightG,
    harvestWeightG: h.harvestWeightG,
    daysToHarvest: h.daysToHarvest,
    harvestDay: h.harvestDay,
    reachesTarget: h.reachesTarget,
    stockedBiomassKg: h.stockedBiomassKg,
    harvestKg: h.harvestBiomassKg,
    biomassGainKg: h.biomassGainKg,
    feedKg: h.feedKg,
    fcr: h.fcr,
    densityLimit: densityLimitOf(input, h.species),
    fingerlingsMinor: priceOf(fishToOrder, stock.fingerlingPriceMinor),
    revenueMinor: priceOf(h.harvestBiomassKg, stock.salePricePerKgMinor),
  };
}

const sum = <T>(items: readonly T[], pick: (item: T) => number) => items.reduce((total, item) => total + pick(item), 0);

function waterFigures(input: PlanInput, tank: TankFigures, cycleDays: number): WaterFigures {
  const pumped = waterPumpedPerCycle(tank.waterVolumeM3, input.waterChange, cycleDays);
  return {
    intervalDays: input.waterChange.intervalDays,
    fractionExchanged: input.waterChange.fractionExchanged,
    changesPerCycle: pumped.changes,
    initialFillM3: pumped.initialFillM3,
    pumpedM3: pumped.totalM3,
    pumpedLitres: cubicMetresToLitres(pumped.totalM3),
    pumpHeadM: input.pump.headM,
    pumpEfficiency: input.pump.efficiencyFraction,
    energyKWh: pumpingEnergyKWh(pumped.totalM3, input.pump.headM, input.pump.efficiencyFraction),
  };
}

function costFigures(input: PlanInput, tank: TankFigures, species: readonly SpeciesFigures[], cycle: CycleFigures, water: WaterFigures): CostFigures {
  const build = resolveBuildCost({ type: input.tank.type, dimensions: input.tank.dimensions, fullHeightM: tank.fullHeightM, currency: input.currency, overrideMinor: input.tank.buildCostOverrideMinor });
  const lifeYears = input.tank.lifeYears ?? DEFAULT_TANK_LIFE_YEARS[input.tank.type];
  const breakdown = costBreakdown({
    tankAmortisationMinor: build.minor === null ? 0 : amortisationPerCycleMinor(build.minor, lifeYears, cycle.cycleDays),
    fingerlingsMinor: sum(species, (s) => s.fingerlingsMinor),
    feedMinor: priceOf(cycle.feedKg, input.feedPricePerKgMinor),
    electricityMinor: priceOf(water.energyKWh, input.pump.electricityTariffPerKWhMinor),
    labourMinor: input.labourCostPerCycleMinor,
  });
  return { ...breakdown, currency: input.currency, buildCostMinor: build.minor, buildCostSource: build.source, lifeYears };
}

function estimateCore(input: PlanInput): CoreEstimate {
  const tank = tankFigures(input);
  const shares = speciesShares(input);
  const inTank = speciesInTank(shares);

  const carrying = carryingTank(input, tank, shares);
  const capacityFish = carryingCapacityFish(carrying);
  const fishStocked = input.fishToStock ?? capacityFish;
  const counts = splitBySpecies(fishStocked, shares);

  const cycleRun = runCycle({
    species: inTank.map((s) => ({ species: s, fishStocked: counts[s], stockingWeightG: input[s].stockingWeightG, targetHarvestWeightG: input[s].targetHarvestWeightG, fcr: input[s].fcr })),
    temperatureC: input.waterTemperatureC,
    growOutSurvival: input.growOutSurvivalFraction,
  });
  const species = cycleRun.species.map((run) => speciesFigures(input, run));
  const cycle: CycleFigures = {
    cycleDays: cycleRun.cycleDays,
    cycleWeeks: cycleRun.cycleDays / 7,
    harvestKg: sum(species, (s) => s.harvestKg),
    stockedBiomassKg: sum(species, (s) => s.stockedBiomassKg),
    biomassGainKg: sum(species, (s) => s.biomassGainKg),
    feedKg: sum(species, (s) => s.feedKg),
  };

  const water = waterFigures(input, tank, cycle.cycleDays);
  const costs = costFigures(input, tank, species, cycle, water);
  const revenueMinor = sum(species, (s) => s.revenueMinor);
  const economics: EconomicsFigures = {
    currency: input.currency,
    revenueMinor,
    marginMinor: revenueMinor - costs.totalMinor,
    breakEvenPricePerKgMinor: breakEvenPricePerKgMinor(costs.totalMinor, cycle.harvestKg),
  };

  const stocking: StockingFigures = {
    basis: densityBasisFor(input.tank.type),
    capacityFish,
    fishStocked,
    fishToOrder: sum(species, (s) => s.fishToOrder),
    occupancyFraction: occupancy(carrying, counts),
    harvestDensityKgPerM3: cycle.harvestKg / tank.waterVolumeM3,
    stockingDensityFishPerM2: fishStocked / tank.floorAreaM2,
  };

  return {
    currency: input.currency,
    tank,
    stocking,
    species,
    cycle,
    water,
    costs,
    economics,
    weekly: [...cycleRun.weekly],
    warnings: planWarnings({
      input,
      speciesInTank: inTank,
      runs: cycleRun.species,
      capacityFish,
      fishStocked,
      densityLimitText: densityLimitText(input, inTank),
      marginMinor: economics.marginMinor,
      buildCostKnown: costs.buildCostMinor !== null,
    }),
    cautions: planCautions({
      tankType: input.tank.type,
      waterDepthM: input.tank.waterDepthM,
      pumpHeadM: input.pump.headM,
      pumpedM3: water.pumpedM3,
      waterMassTonnes: tank.waterMassTonnes,
      basePressureKPa: tank.basePressureKPa,
    }),
    assumptions: planAssumptions({
      input,
      speciesInTank: inTank,
      feedingClassesUsed: feedingClassesUsed(cycleRun.species),
      lifeYears: costs.lifeYears,
      lifeFromInput: input.tank.lifeYears !== null && input.tank.lifeYears !== undefined,
      buildCostFromModel: costs.buildCostSource === "model",
    }),
  };
}

/**
 * The same tank size built as each type. The current type keeps every input; the others use their own default
 * water-change schedule and life, the build-cost model, and stock to their own capacity.
 */
export function variantFor(input: PlanInput, type: TankType): PlanInput {
  if (type === input.tank.type) return input;
  return {
    ...input,
    tank: { ...input.tank, type, buildCostOverrideMinor: null, lifeYears: null },
    waterChange: { ...DEFAULT_WATER_CHANGE[type] },
    fishToStock: null,
  };
}

function comparisonRow(estimate: CoreEstimate, isCurrent: boolean): TankComparisonRow {
  return {
    type: estimate.tank.type,
    isCurrent,
    buildCostMinor: estimate.costs.buildCostMinor,
    buildCostSource: estimate.costs.buildCostSource,
    lifeYears: estimate.costs.lifeYears,
    amortisationPerCycleMinor: estimate.costs.tankAmortisationMinor,
    runningCostPerCycleMinor: estimate.costs.runningMinor,
    cycleCostMinor: estimate.costs.totalMinor,
    fishStocked: estimate.stocking.fishStocked,
    harvestKg: estimate.cycle.harvestKg,
    energyKWh: estimate.water.energyKWh,
    marginMinor: estimate.economics.marginMinor,
  };
}

/** Every figure of the planner for one plan. Pure: the page runs it live in the browser and the API runs it on the server. */
export function estimatePlan(input: PlanInput): PlanEstimate {
  const core = estimateCore(input);
  const tankComparison = TANK_TYPES.map((type) => comparisonRow(type === input.tank.type ? core : estimateCore(variantFor(input, type)), type === input.tank.type));
  return { ...core, tankComparison };
}
