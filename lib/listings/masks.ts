import { SPECIES, TANK_TYPES, type Species, type TankType } from "@/lib/catalog";

// Species and tank types are stored as bit sets on a listing so one indexed row can
// answer "builds concrete" or "sells catfish" with a single AND.
export const SPECIES_BIT: Record<Species, number> = { tilapia: 1, catfish: 2 };
export const TANK_TYPE_BIT: Record<TankType, number> = { tarpaulin: 1, concrete: 2, earthen: 4 };

export function speciesMask(species: readonly Species[]): number {
  return species.reduce((m, s) => m | SPECIES_BIT[s], 0);
}
export function tankTypeMask(types: readonly TankType[]): number {
  return types.reduce((m, t) => m | TANK_TYPE_BIT[t], 0);
}
export function speciesFromMask(mask: number): Species[] {
  return SPECIES.filter((s) => (mask & SPECIES_BIT[s]) !== 0);
}
export function tankTypesFromMask(mask: number): TankType[] {
  return TANK_TYPES.filter((t) => (mask & TANK_TYPE_BIT[t]) !== 0);
}
