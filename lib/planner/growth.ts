import { DAYS_PER_YEAR } from "./physics";
import type { FishSpecies } from "./species";

/*
 * Growth model: the cube-root (thermal-growth-coefficient) form. W^(1/3) rises linearly with time,
 *   W(t)^(1/3) = W0^(1/3) + k · f(T) · t,
 * where k is a growth coefficient (g^(1/3) per day) at a favourable temperature and f(T) in [0, 1] scales it down
 * away from the species' optimum. This is the TGC model (Iwama & Tautz 1981; Cho 1992 — from memory) with the
 * degree-days replaced by days at an effective temperature, because the published growth figures we calibrate on
 * (REFERENCE-VALUES section 3) do not state the water temperature they were reached at. We assume they were reached
 * near the optimum, i.e. f = 1 at calibration.
 *
 * Calibration (all arithmetic in the constants below, so the comments cannot drift from the code):
 * - Tilapia, nursery stage up to 50 g: 1 g to 50 g in 12 weeks (UVI nursery system; REFERENCE-VALUES 3.4).
 * - Tilapia, grow-out stage above 50 g: 3 g to 360 g in 10 months (Arredondo-Figueroa et al. 2015; REFERENCE-VALUES 3.5),
 *   with the 3 g → 50 g part of those 10 months run at the nursery coefficient and the rest fitted to the grow-out
 *   coefficient. That trial was a semi-intensive pond, so days to harvest lean long for a well-fed tank: the safe side
 *   for costing a cycle. One coefficient cannot fit both rows (the nursery grows far faster in cube-root terms).
 * - African catfish, one stage: 1 g to about 1 kg in 10 months under good practice (FAO AFFRIS "North African catfish:
 *   Growth"; REFERENCE-VALUES 3.1).
 */

export const DAYS_PER_MONTH = DAYS_PER_YEAR / 12;

export interface GrowthRow {
  fromG: number;
  toG: number;
  days: number;
  source: string;
}

export const GROWTH_CALIBRATION = {
  tilapiaNursery: { fromG: 1, toG: 50, days: 12 * 7, source: "UVI Agricultural Experiment Station, nursery system: 1 g to 50 g in 12 weeks (REFERENCE-VALUES 3.4)" },
  tilapiaGrowOut: { fromG: 3, toG: 360, days: 10 * DAYS_PER_MONTH, source: "Arredondo-Figueroa et al. 2015: 3 g to 360 g in 10 months, semi-intensive pond (REFERENCE-VALUES 3.5)" },
  catfish: { fromG: 1, toG: 1000, days: 10 * DAYS_PER_MONTH, source: "FAO AFFRIS North African catfish, Growth: 1 g to about 1 kg in 10 months (REFERENCE-VALUES 3.1)" },
} as const satisfies Record<string, GrowthRow>;

const cbrt = Math.cbrt;

/** Cube-root growth coefficient that takes a fish from `fromG` to `toG` in `days`, g^(1/3) per day. */
export function cubeRootCoefficient(fromG: number, toG: number, days: number): number {
  return (cbrt(toG) - cbrt(fromG)) / days;
}

export interface GrowthStage {
  /** The stage applies while the fish weighs less than this, g. */
  upToG: number;
  /** Cube root of upToG, kept so the day-by-day run does not recompute it. */
  upToRoot: number;
  /** g^(1/3) per day at a favourable temperature. */
  coefficient: number;
}

const TILAPIA_STAGE_BREAK_G = GROWTH_CALIBRATION.tilapiaNursery.toG;
const tilapiaNurseryK = cubeRootCoefficient(GROWTH_CALIBRATION.tilapiaNursery.fromG, GROWTH_CALIBRATION.tilapiaNursery.toG, GROWTH_CALIBRATION.tilapiaNursery.days);
const growOut = GROWTH_CALIBRATION.tilapiaGrowOut;
const growOutNurseryDays = (cbrt(TILAPIA_STAGE_BREAK_G) - cbrt(growOut.fromG)) / tilapiaNurseryK;
const tilapiaGrowOutK = cubeRootCoefficient(TILAPIA_STAGE_BREAK_G, growOut.toG, growOut.days - growOutNurseryDays);

export const GROWTH_STAGES: Readonly<Record<FishSpecies, readonly GrowthStage[]>> = {
  tilapia: [
    { upToG: TILAPIA_STAGE_BREAK_G, upToRoot: cbrt(TILAPIA_STAGE_BREAK_G), coefficient: tilapiaNurseryK },
    { upToG: Number.POSITIVE_INFINITY, upToRoot: Number.POSITIVE_INFINITY, coefficient: tilapiaGrowOutK },
  ],
  catfish: [
    {
      upToG: Number.POSITIVE_INFINITY,
      upToRoot: Number.POSITIVE_INFINITY,
      coefficient: cubeRootCoefficient(GROWTH_CALIBRATION.catfish.fromG, GROWTH_CALIBRATION.catfish.toG, GROWTH_CALIBRATION.catfish.days),
    },
  ],
};

/**
 * Growth factor f(T) as (°C, factor) points joined by straight lines; flat beyond the ends.
 * - Tilapia: 0 at 15 °C (most do not feed below 15 °C: NAFIS, REFERENCE-VALUES 4.1); 1 from 25 to 30 °C (optimum
 *   about 25 to 30 °C: El-Sayed, Tilapia Culture ch. 4, REFERENCE-VALUES 4.3); 0 at 40 °C (tolerated up to 40 °C with
 *   conditioning: REFERENCE-VALUES 4.2). The straight ramps between are a product choice.
 * - Catfish: 1 from 26 to 33 °C (acceptable range, best at 30 °C: REFERENCE-VALUES 4.9); 0 at 35 °C (upper tolerance:
 *   Teugels 1986 via REFERENCE-VALUES 4.10); 0 at 15 °C is from memory (no source seen for where catfish stop growing).
 */
export const TEMPERATURE_FACTOR_POINTS: Readonly<Record<FishSpecies, readonly (readonly [number, number])[]>> = {
  tilapia: [
    [15, 0],
    [25, 1],
    [30, 1],
    [40, 0],
  ],
  catfish: [
    [15, 0],
    [26, 1],
    [33, 1],
    [35, 0],
  ],
};

export function temperatureGrowthFactor(species: FishSpecies, temperatureC: number): number {
  const points = TEMPERATURE_FACTOR_POINTS[species];
  let previous: readonly [number, number] | undefined;
  for (const point of points) {
    if (temperatureC <= point[0]) {
      if (!previous) return point[1];
      const t = (temperatureC - previous[0]) / (point[0] - previous[0]);
      return previous[1] + t * (point[1] - previous[1]);
    }
    previous = point;
  }
  return previous ? previous[1] : 0;
}

/** Mean weight after `days` of growth from `startG`, g. */
export function weightAfterDays(species: FishSpecies, startG: number, days: number, temperatureC: number): number {
  const factor = temperatureGrowthFactor(species, temperatureC);
  if (days <= 0 || factor <= 0) return startG;
  let root = cbrt(startG);
  let daysLeft = days;
  for (const stage of GROWTH_STAGES[species]) {
    if (daysLeft <= 0) break;
    if (root >= stage.upToRoot) continue;
    const rate = stage.coefficient * factor;
    const daysInStage = (stage.upToRoot - root) / rate;
    if (daysInStage >= daysLeft) return (root + rate * daysLeft) ** 3;
    root = stage.upToRoot;
    daysLeft -= daysInStage;
  }
  return root ** 3;
}

/** Days of growth from `startG` to `targetG`; null when the fish cannot grow at this temperature. */
export function daysToReach(species: FishSpecies, startG: number, targetG: number, temperatureC: number): number | null {
  if (targetG <= startG) return 0;
  const factor = temperatureGrowthFactor(species, temperatureC);
  if (factor <= 0) return null;
  let root = cbrt(startG);
  const targetRoot = cbrt(targetG);
  let days = 0;
  for (const stage of GROWTH_STAGES[species]) {
    const stageEnd = Math.min(stage.upToRoot, targetRoot);
    if (root >= stageEnd) continue;
    days += (stageEnd - root) / (stage.coefficient * factor);
    root = stageEnd;
    if (root >= targetRoot) break;
  }
  return days;
}
