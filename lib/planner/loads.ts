import { FRESH_WATER_DENSITY_KG_PER_M3, STANDARD_GRAVITY_M_PER_S2 } from "./physics";

/** Mass of water, kg: m = ρ V. */
export function waterMassKg(volumeM3: number, density = FRESH_WATER_DENSITY_KG_PER_M3): number {
  return density * volumeM3;
}

/** Hydrostatic pressure at depth h, Pa: p = ρ g h (gauge pressure, open tank). */
export function hydrostaticPressurePa(depthM: number, density = FRESH_WATER_DENSITY_KG_PER_M3, gravity = STANDARD_GRAVITY_M_PER_S2): number {
  return density * gravity * depthM;
}

export interface BaseLoad {
  waterMassKg: number;
  waterMassTonnes: number;
  /** Weight of the water, kN (m g). */
  waterWeightKN: number;
  /** Pressure of the water on the floor, kPa; with vertical walls it equals the weight spread over the floor. */
  basePressureKPa: number;
}

/** What the frame and base must carry when the tank is full to its water depth. */
export function baseLoad(volumeM3: number, waterDepthM: number): BaseLoad {
  const massKg = waterMassKg(volumeM3);
  return {
    waterMassKg: massKg,
    waterMassTonnes: massKg / 1000,
    waterWeightKN: (massKg * STANDARD_GRAVITY_M_PER_S2) / 1000,
    basePressureKPa: hydrostaticPressurePa(waterDepthM) / 1000,
  };
}
