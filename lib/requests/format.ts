import { TANK_TYPE_LABEL, type TankType } from "@/lib/catalog";
import type { SizeUnit } from "@/lib/jobs/vocabulary";
import { floorAreaM2, waterVolumeM3 } from "@/lib/planner/geometry";
import { metresToFeet } from "@/lib/planner/units";
import type { TankDimensions } from "@/lib/validations/planner";
import type { TankSize } from "@/lib/validations/tank-size";

/* How sizes and dates read on pages and in e-mails. Pure, for server and browser alike. */

export type StoredSize = {
  shape: "rectangular" | "round";
  lengthM: number | null;
  widthM: number | null;
  diameterM: number | null;
  depthM: number;
  sizeUnit: SizeUnit;
};

function inUnit(metres: number, unit: SizeUnit): string {
  const value = unit === "m" ? metres : metresToFeet(metres);
  return String(Number(value.toFixed(2)));
}

/** "3 × 2 m, 1.2 m deep" or "round, 10 ft across, 3 ft deep", in the unit the person typed. */
export function describeSize(size: StoredSize): string {
  const u = size.sizeUnit;
  const depth = `${inUnit(size.depthM, u)} ${u} deep`;
  if (size.shape === "round" && size.diameterM !== null) return `round, ${inUnit(size.diameterM, u)} ${u} across, ${depth}`;
  return `${inUnit(size.lengthM ?? 0, u)} × ${inUnit(size.widthM ?? 0, u)} ${u}, ${depth}`;
}

export function dimensionsOf(size: StoredSize): TankDimensions {
  if (size.shape === "round") return { shape: "round", diameterM: size.diameterM ?? 0 };
  return { shape: "rectangular", lengthM: size.lengthM ?? 0, widthM: size.widthM ?? 0 };
}

/** Inner floor area in m², the quantity a price sheet is per (lib/planner/geometry.ts). */
export function floorArea(size: StoredSize): number {
  return floorAreaM2(dimensionsOf(size));
}

/** Water held when full to the brim, m³. */
export function fullVolumeM3(size: StoredSize): number {
  return waterVolumeM3(dimensionsOf(size), size.depthM);
}

export function tankTitle(type: TankType, size: StoredSize): string {
  return `${TANK_TYPE_LABEL[type].toLowerCase()} tank, ${describeSize(size)}`;
}

/** "12 Mar 2027": dates are stored as UTC midnights. */
export function formatDay(at: Date | string): string {
  return new Date(at).toLocaleDateString("en-GB", { day: "numeric", month: "short", year: "numeric", timeZone: "UTC" });
}

/** A parsed size (lib/validations/tank-size.ts) in the stored shape, with the unused sides null. */
export function storedSizeOf(size: TankSize): StoredSize {
  return size.shape === "rectangular"
    ? { shape: "rectangular", lengthM: size.lengthM, widthM: size.widthM, diameterM: null, depthM: size.depthM, sizeUnit: size.sizeUnit }
    : { shape: "round", lengthM: null, widthM: null, diameterM: size.diameterM, depthM: size.depthM, sizeUnit: size.sizeUnit };
}
