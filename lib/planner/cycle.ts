import { dailyRationKg, feedForGainKg, feedingRatePercent } from "./feeding";
import { daysToReach, weightAfterDays } from "./growth";
import type { FishSpecies } from "./species";

/*
 * Day-by-day run of one grow-out cycle: growth, losses and feed, per species. Each species is harvested on the day it
 * reaches its target (a selective harvest when two species share a tank); the cycle ends with the last harvest.
 */

/**
 * Longest cycle the planner runs, days (two years). A product choice: beyond it the fish are treated as not reaching
 * the target, the figures are those at day 730, and a warning says so.
 */
export const MAX_CYCLE_DAYS = 730;

export interface CycleSpeciesInput {
  species: FishSpecies;
  fishStocked: number;
  stockingWeightG: number;
  targetHarvestWeightG: number;
  fcr: number;
}

export interface CycleInput {
  species: readonly CycleSpeciesInput[];
  temperatureC: number;
  growOutSurvival: number;
}

export interface SpeciesHarvest {
  species: FishSpecies;
  fishStocked: number;
  /** Days of growth to the target from the growth model; null when the target is not reached within MAX_CYCLE_DAYS. */
  daysToHarvest: number | null;
  /** Whole day of harvest (days to harvest rounded up, or MAX_CYCLE_DAYS). */
  harvestDay: number;
  reachesTarget: boolean;
  stockingWeightG: number;
  harvestWeightG: number;
  /** Expected survivors (fractional: an expectation, not a count). */
  fishHarvestedExpected: number;
  stockedBiomassKg: number;
  harvestBiomassKg: number;
  biomassGainKg: number;
  feedKg: number;
  fcr: number;
}

export interface SpeciesDay {
  day: number;
  meanWeightG: number;
  fishAlive: number;
  biomassKg: number;
  feedKg: number;
}

export interface SpeciesRun {
  harvest: SpeciesHarvest;
  /** Index d = the state at the start of day d, for d = 0 … harvestDay; feedKg is the feed given during day d (0 on harvest day). */
  days: readonly SpeciesDay[];
}

/** Harvest day and whether the target is reached inside the longest cycle. */
export function harvestTiming(species: FishSpecies, startG: number, targetG: number, temperatureC: number): { daysToHarvest: number | null; harvestDay: number } {
  const days = daysToReach(species, startG, targetG, temperatureC);
  if (days === null || days > MAX_CYCLE_DAYS) return { daysToHarvest: null, harvestDay: MAX_CYCLE_DAYS };
  return { daysToHarvest: days, harvestDay: Math.max(1, Math.ceil(days - 1e-9)) };
}

/** Fish alive after `day` days with losses spread evenly in proportion (constant daily hazard): N0 · S^(day/T). */
export function fishAlive(stocked: number, survival: number, day: number, harvestDay: number): number {
  if (harvestDay <= 0) return stocked;
  return stocked * survival ** (Math.min(day, harvestDay) / harvestDay);
}

export function runSpecies(input: CycleSpeciesInput, temperatureC: number, growOutSurvival: number): SpeciesRun {
  const { daysToHarvest, harvestDay } = harvestTiming(input.species, input.stockingWeightG, input.targetHarvestWeightG, temperatureC);
  const weightOn = (day: number) => Math.min(input.targetHarvestWeightG, weightAfterDays(input.species, input.stockingWeightG, day, temperatureC));

  const raw: SpeciesDay[] = [];
  let rawFeedKg = 0;
  for (let day = 0; day <= harvestDay; day += 1) {
    const meanWeightG = weightOn(day);
    const alive = fishAlive(input.fishStocked, growOutSurvival, day, harvestDay);
    const feedKg = day < harvestDay ? dailyRationKg(meanWeightG, feedingRatePercent(input.species, meanWeightG), alive) : 0;
    rawFeedKg += feedKg;
    raw.push({ day, meanWeightG, fishAlive: alive, biomassKg: (alive * meanWeightG) / 1000, feedKg });
  }

  const harvestWeightG = weightOn(harvestDay);
  const fishHarvestedExpected = fishAlive(input.fishStocked, growOutSurvival, harvestDay, harvestDay);
  const stockedBiomassKg = (input.fishStocked * input.stockingWeightG) / 1000;
  const harvestBiomassKg = (fishHarvestedExpected * harvestWeightG) / 1000;
  const biomassGainKg = harvestBiomassKg - stockedBiomassKg;
  const feedKg = feedForGainKg(input.fcr, biomassGainKg);
  // Scale the table-shaped rations so the cycle's feed matches the FCR exactly (see feeding.ts for why).
  const scale = rawFeedKg > 0 ? feedKg / rawFeedKg : 0;
  for (const d of raw) d.feedKg *= scale;

  return {
    harvest: {
      species: input.species,
      fishStocked: input.fishStocked,
      daysToHarvest,
      harvestDay,
      reachesTarget: daysToHarvest !== null,
      stockingWeightG: input.stockingWeightG,
      harvestWeightG,
      fishHarvestedExpected,
      stockedBiomassKg,
      harvestBiomassKg,
      biomassGainKg,
      feedKg,
      fcr: input.fcr,
    },
    days: raw,
  };
}

export interface WeeklyPoint {
  week: number;
  /** Day the point describes: end of the week, or the last harvest if it falls inside the week. */
  day: number;
  /** Mean weight per species, g; null once that species has been harvested or when it is not in the tank. */
  meanWeightG: Record<FishSpecies, number | null>;
  biomassKg: number;
  /** Feed given during the week (days 7(w−1) … 7w−1), kg; 0 for week 0. */
  feedKg: number;
}

export interface CycleRun {
  cycleDays: number;
  species: readonly SpeciesRun[];
  weekly: readonly WeeklyPoint[];
}

/** The state of a species at the given day, or null when it is out of the tank by then (harvested before the week began). */
function speciesPointAt(run: SpeciesRun, day: number, weekStart: number): SpeciesDay | null {
  if (weekStart >= run.harvest.harvestDay && day > 0) return null;
  return run.days[Math.min(day, run.harvest.harvestDay)] ?? null;
}

export function weeklySeries(runs: readonly SpeciesRun[], cycleDays: number): WeeklyPoint[] {
  const weeks = Math.ceil(cycleDays / 7);
  const points: WeeklyPoint[] = [];
  for (let week = 0; week <= weeks; week += 1) {
    const day = Math.min(week * 7, cycleDays);
    const weekStart = Math.max(0, (week - 1) * 7);
    const meanWeightG: Record<FishSpecies, number | null> = { tilapia: null, catfish: null };
    let biomassKg = 0;
    let feedKg = 0;
    for (const run of runs) {
      const point = speciesPointAt(run, day, weekStart);
      if (point) {
        meanWeightG[run.harvest.species] = point.meanWeightG;
        biomassKg += point.biomassKg;
      }
      if (week > 0) {
        for (let d = weekStart; d < Math.min(week * 7, run.harvest.harvestDay); d += 1) feedKg += run.days[d]?.feedKg ?? 0;
      }
    }
    points.push({ week, day, meanWeightG, biomassKg, feedKg });
  }
  return points;
}

export function runCycle(input: CycleInput): CycleRun {
  const species = input.species.map((s) => runSpecies(s, input.temperatureC, input.growOutSurvival));
  const cycleDays = species.reduce((longest, run) => Math.max(longest, run.harvest.harvestDay), 0);
  return { cycleDays, species, weekly: weeklySeries(species, cycleDays) };
}
