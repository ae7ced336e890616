import type { TankDimensions } from "@/lib/validations/planner";

/*
 * Inner geometry of a tank with vertical walls. An earthen pond is treated the same way: its sides are taken as vertical,
 * so a real pond with sloped sides holds somewhat less than the figure given here.
 */

/** V = l × w × h (MSD Veterinary Manual, "Formulae to calculate tank volumes"; REFERENCE-VALUES 7.5). */
export function rectangularVolume(length: number, width: number, height: number): number {
  return length * width * height;
}

/** V = π r² h (MSD Veterinary Manual, same table; REFERENCE-VALUES 7.6). */
export function cylinderVolume(radius: number, height: number): number {
  return Math.PI * radius * radius * height;
}

/** Inner floor area, which is also the water surface area, m². */
export function floorAreaM2(dimensions: TankDimensions): number {
  if (dimensions.shape === "rectangular") return dimensions.lengthM * dimensions.widthM;
  const radius = dimensions.diameterM / 2;
  return Math.PI * radius * radius;
}

/** Inner perimeter of the wall, m. */
export function perimeterM(dimensions: TankDimensions): number {
  if (dimensions.shape === "rectangular") return 2 * (dimensions.lengthM + dimensions.widthM);
  return Math.PI * dimensions.diameterM;
}

/** Volume of water held at the given depth, m³. */
export function waterVolumeM3(dimensions: TankDimensions, waterDepthM: number): number {
  if (dimensions.shape === "rectangular") return rectangularVolume(dimensions.lengthM, dimensions.widthM, waterDepthM);
  return cylinderVolume(dimensions.diameterM / 2, waterDepthM);
}

/** Floor plus walls up to the given height, m²: the surface a concrete tank is built and rendered over. */
export function innerSurfaceM2(dimensions: TankDimensions, wallHeightM: number): number {
  return floorAreaM2(dimensions) + perimeterM(dimensions) * wallHeightM;
}

export interface LinerSheet {
  /** Sheet size to buy, m (length ≥ width). */
  lengthM: number;
  widthM: number;
  areaM2: number;
  /** Wall height the sheet covers: water depth plus freeboard, m. */
  wallHeightM: number;
  /** Extra sheet on every edge to fold over the top rail and fasten, m. */
  foldAllowanceM: number;
}

/**
 * Fold-over allowance on each edge of a tarpaulin liner: enough to wrap the top rail and tie down.
 * Demo default (a product choice; no published figure was found).
 */
export const LINER_FOLD_ALLOWANCE_M = 0.3;

/**
 * One rectangular sheet laid in the tank without cutting: it covers the floor, runs up every wall to the full height
 * (water depth + freeboard), and leaves the fold allowance on each edge. Corners of a rectangular tank are folded
 * (not cut); a round tank takes a square sheet pleated round the wall.
 */
export function linerSheet(dimensions: TankDimensions, wallHeightM: number, foldAllowanceM = LINER_FOLD_ALLOWANCE_M): LinerSheet {
  const extra = 2 * (wallHeightM + foldAllowanceM);
  const [a, b] = dimensions.shape === "rectangular" ? [dimensions.lengthM, dimensions.widthM] : [dimensions.diameterM, dimensions.diameterM];
  const lengthM = Math.max(a, b) + extra;
  const widthM = Math.min(a, b) + extra;
  return { lengthM, widthM, areaM2: lengthM * widthM, wallHeightM, foldAllowanceM };
}
