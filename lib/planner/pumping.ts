import type { WaterChangeSchedule } from "@/lib/validations/planner";
import { FRESH_WATER_DENSITY_KG_PER_M3, JOULES_PER_KWH, STANDARD_GRAVITY_M_PER_S2 } from "./physics";

/** Hydraulic power given to the water, W: P_h = ρ g Q H (Engineering ToolBox, "Pump power"; REFERENCE-VALUES 7.1). */
export function hydraulicPowerW(flowM3PerS: number, headM: number, density = FRESH_WATER_DENSITY_KG_PER_M3, gravity = STANDARD_GRAVITY_M_PER_S2): number {
  return density * gravity * flowM3PerS * headM;
}

/** Power the pump draws, W: P = ρ g Q H / η (same source). η is taken wire-to-water, so this is what the meter sees. */
export function pumpInputPowerW(flowM3PerS: number, headM: number, efficiency: number, gravity = STANDARD_GRAVITY_M_PER_S2): number {
  return hydraulicPowerW(flowM3PerS, headM, FRESH_WATER_DENSITY_KG_PER_M3, gravity) / efficiency;
}

/** Head a pump must add to raise pressure by Δp, m: H = Δp / (ρ g) (Engineering ToolBox worked example, REFERENCE-VALUES 7.2). */
export function headForPressureRiseM(pressureRisePa: number, density = FRESH_WATER_DENSITY_KG_PER_M3, gravity = STANDARD_GRAVITY_M_PER_S2): number {
  return pressureRisePa / (density * gravity);
}

/** Energy = power × time; 1 kWh = 3.6 MJ (Fraenkel, FAO Irrigation and Drainage Paper 43, §2.1.1; REFERENCE-VALUES 7.4). */
export function energyKWh(powerW: number, hours: number): number {
  return (powerW * hours * 3600) / JOULES_PER_KWH;
}

/**
 * Electricity to lift a volume V through head H: E = ρ g V H / η. It is P = ρ g Q H / η times the running time V / Q,
 * so the pump's flow rate cancels out and is not needed.
 */
export function pumpingEnergyKWh(volumeM3: number, headM: number, efficiency: number): number {
  return (FRESH_WATER_DENSITY_KG_PER_M3 * STANDARD_GRAVITY_M_PER_S2 * volumeM3 * headM) / efficiency / JOULES_PER_KWH;
}

export interface WaterPumped {
  /** Whole-volume fill at stocking, m³. */
  initialFillM3: number;
  /** Water changes that fall inside the cycle (one every interval, none on day 0). */
  changes: number;
  exchangedM3: number;
  totalM3: number;
}

/**
 * Water pumped over a cycle: the first fill plus each scheduled change. Evaporation top-ups and seepage are not counted
 * (they depend on climate and soil), so an earthen pond's figure is a floor, not an estimate of all water it needs.
 */
export function waterPumpedPerCycle(volumeM3: number, schedule: WaterChangeSchedule, cycleDays: number): WaterPumped {
  const changes = Math.floor(Math.max(0, cycleDays) / schedule.intervalDays);
  const exchangedM3 = changes * schedule.fractionExchanged * volumeM3;
  return { initialFillM3: volumeM3, changes, exchangedM3, totalM3: volumeM3 + exchangedM3 };
}
