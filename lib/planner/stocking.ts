import type { TankType } from "@/lib/validations/planner";
import { FISH_SPECIES, type FishSpecies } from "./species";
import { poundsPerUsGallonToKilogramsPerCubicMetre } from "./units";

/*
 * How many fish a tank can carry. Tanks (tarpaulin, concrete) are limited by standing biomass per cubic metre at harvest;
 * earthen ponds by fish per square metre of water surface, as the pond handbooks give them.
 */

/**
 * Tilapia in tanks with aeration only: maximum biomass about 0.25 lb/US gal, i.e. 30 kg/m³ ("Tank culture of tilapia",
 * SRAC 282 text at tilapia-farming.com, part 3; REFERENCE-VALUES 1.7). Converted exactly here (29.96 kg/m³).
 * The figure assumes the tank is aerated; without aeration stock fewer.
 */
export const TILAPIA_TANK_LIMIT_KG_PER_M3 = poundsPerUsGallonToKilogramsPerCubicMetre(0.25);

/**
 * African catfish in tanks: a product choice, from memory. No FAO or SRAC figure in kg/m³ was found (REFERENCE-VALUES §1 Gap).
 * Catfish breathe air and intensive tank farms with frequent water exchange report standing crops well above 100 kg/m³
 * (from memory); with one water change a week we stay at 50 kg/m³, under twice the aerated tilapia figure.
 */
export const CATFISH_TANK_LIMIT_KG_PER_M3 = 50;

export const TANK_BIOMASS_LIMIT_KG_PER_M3: Readonly<Record<FishSpecies, number>> = {
  tilapia: TILAPIA_TANK_LIMIT_KG_PER_M3,
  catfish: CATFISH_TANK_LIMIT_KG_PER_M3,
};

/**
 * Nile tilapia, earthen pond, fed: 2 fish/m² (Duodu, Boateng & Edziyie 2020, 2/m² of 25.4 g fed 3 % BW, REFERENCE-VALUES 1.11;
 * Arredondo-Figueroa et al. 2015, 2.04/m², 1.14; within the 1 to 3/m² of Gindaba et al. 2017, 1.12). Higher densities
 * (5 to 15/m², 1.13) are intensive ponds with more inputs than the planner assumes.
 */
export const TILAPIA_POND_FISH_PER_M2 = 2;

/**
 * African catfish, earthen pond: 2 to 10 fingerlings/m²; 2/m² gives about 500 g and 10/m² about 200 g after 6 months
 * (de Graaf & Janssen, FAO Fisheries Technical Paper 362, §6.1, citing Micha 1976; REFERENCE-VALUES 1.1). The planner
 * reads the density off the target weight on the straight line through those two points, clamped to 2 to 10/m².
 */
export const CATFISH_POND_DENSITY_POINTS = [
  { harvestWeightG: 200, fishPerM2: 10 },
  { harvestWeightG: 500, fishPerM2: 2 },
] as const;

export function catfishPondFishPerM2(targetHarvestWeightG: number): number {
  const [heavyStock, lightStock] = CATFISH_POND_DENSITY_POINTS;
  const t = (targetHarvestWeightG - heavyStock.harvestWeightG) / (lightStock.harvestWeightG - heavyStock.harvestWeightG);
  const density = heavyStock.fishPerM2 + t * (lightStock.fishPerM2 - heavyStock.fishPerM2);
  return Math.min(heavyStock.fishPerM2, Math.max(lightStock.fishPerM2, density));
}

export function pondFishPerM2(species: FishSpecies, targetHarvestWeightG: number): number {
  return species === "tilapia" ? TILAPIA_POND_FISH_PER_M2 : catfishPondFishPerM2(targetHarvestWeightG);
}

export type DensityBasis = "kg-per-m3" | "fish-per-m2";

export function densityBasisFor(tankType: TankType): DensityBasis {
  return tankType === "earthen" ? "fish-per-m2" : "kg-per-m3";
}

export interface StockingSpeciesInput {
  share: number;
  harvestWeightG: number;
  targetHarvestWeightG: number;
}

export interface CarryingTank {
  tankType: TankType;
  waterVolumeM3: number;
  surfaceAreaM2: number;
  growOutSurvival: number;
  species: Readonly<Record<FishSpecies, StockingSpeciesInput>>;
}

/**
 * Share of the tank's carrying limit used by ONE stocked fish of a species, so that a mix is within the limit when the
 * sum over the fish is at most 1. In a tank: (survival × harvest weight) ÷ (limit kg/m³ × volume). In a pond: 1 ÷ (fish/m² × area).
 */
export function loadPerFish(tank: CarryingTank, species: FishSpecies): number {
  const stock = tank.species[species];
  if (densityBasisFor(tank.tankType) === "fish-per-m2") {
    const capacity = pondFishPerM2(species, stock.targetHarvestWeightG) * tank.surfaceAreaM2;
    return capacity > 0 ? 1 / capacity : Number.POSITIVE_INFINITY;
  }
  const carriedKg = TANK_BIOMASS_LIMIT_KG_PER_M3[species] * tank.waterVolumeM3;
  const harvestKgPerFish = (tank.growOutSurvival * stock.harvestWeightG) / 1000;
  return carriedKg > 0 ? harvestKgPerFish / carriedKg : Number.POSITIVE_INFINITY;
}

/** Whole fish per species for a total, rounding the tilapia share and giving the rest to catfish. */
export function splitBySpecies(total: number, shares: Readonly<Record<FishSpecies, number>>): Record<FishSpecies, number> {
  const tilapia = shares.catfish <= 0 ? total : shares.tilapia <= 0 ? 0 : Math.round(total * shares.tilapia);
  return { tilapia, catfish: total - tilapia };
}

/** Load at harvest as a share of what the tank carries: 1 means at the limit. */
export function occupancy(tank: CarryingTank, counts: Readonly<Record<FishSpecies, number>>): number {
  return FISH_SPECIES.reduce((sum, species) => (counts[species] > 0 ? sum + counts[species] * loadPerFish(tank, species) : sum), 0);
}

/** Largest number of fish to stock, split by the shares, that keeps the load at harvest within the tank's limit. */
export function carryingCapacityFish(tank: CarryingTank): number {
  const shares = { tilapia: tank.species.tilapia.share, catfish: tank.species.catfish.share };
  const perFish = FISH_SPECIES.reduce((sum, species) => (shares[species] > 0 ? sum + shares[species] * loadPerFish(tank, species) : sum), 0);
  if (!(perFish > 0) || !Number.isFinite(perFish)) return 0;
  // Rounding the split can move the load by one fish either way; settle on the exact largest whole number.
  const fits = (n: number) => occupancy(tank, splitBySpecies(n, shares)) <= 1 + 1e-12;
  let n = Math.floor(1 / perFish + 1e-9);
  while (n > 0 && !fits(n)) n -= 1;
  while (fits(n + 1)) n += 1;
  return n;
}

/**
 * Fingerlings to buy so that, after quarantine losses, at least `stocked` fish go into the tank: ceil(stocked ÷ survival).
 * The small tolerance stops floating-point noise (19 ÷ 0.95 = 20.000000000000004) from ordering one fish too many.
 */
export function fingerlingsToOrder(stocked: number, quarantineSurvival: number): number {
  if (stocked <= 0) return 0;
  let order = Math.ceil(stocked / quarantineSurvival - 1e-9);
  while (order * quarantineSurvival < stocked - 1e-9) order += 1;
  return order;
}
