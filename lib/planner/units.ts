/**
 * Unit conversion at the edges: the planner computes in SI, the form may take feet or gallons.
 * Exact definitions, so a 6 ft × 10 ft tank is exactly 1.8288 m × 3.048 m.
 */

/** 1 in = 25.4 mm exactly (international yard of 1 July 1959: NBS Circular 572 addendum, 1960; REFERENCE-VALUES 10.1). */
export const METRES_PER_INCH = 0.0254;
/** 1 ft = yd/3 = 0.3048 m exactly (REFERENCE-VALUES 10.2). */
export const METRES_PER_FOOT = 0.3048;
/** US gallon = 231 in³ exactly = 231 × (0.254 dm)³ = 3.785 411 784 L (NIST Handbook 44 App. C; REFERENCE-VALUES 10.3). */
export const LITRES_PER_US_GALLON = 231 * 0.254 ** 3;
/** Imperial gallon = 4.546 09 L exactly (NIST Handbook 44 App. C as quoted; REFERENCE-VALUES 10.4). */
export const LITRES_PER_IMPERIAL_GALLON = 4.54609;
/** 1 lb = 0.453 592 37 kg exactly (1959 agreement; REFERENCE-VALUES 10.6). */
export const KILOGRAMS_PER_POUND = 0.45359237;
export const LITRES_PER_CUBIC_METRE = 1000;

/** Multiplies by 3048 then divides by 10⁴ so whole feet land on the nearest double to the exact decimal (6 ft → 1.8288). */
export function feetToMetres(feet: number): number {
  return (feet * 3048) / 10_000;
}

export function metresToFeet(metres: number): number {
  return (metres * 10_000) / 3048;
}

export function inchesToMetres(inches: number): number {
  return (inches * 254) / 10_000;
}

export function cubicMetresToLitres(cubicMetres: number): number {
  return cubicMetres * LITRES_PER_CUBIC_METRE;
}

export function litresToCubicMetres(litres: number): number {
  return litres / LITRES_PER_CUBIC_METRE;
}

export function usGallonsToLitres(gallons: number): number {
  return gallons * LITRES_PER_US_GALLON;
}

export function litresToUsGallons(litres: number): number {
  return litres / LITRES_PER_US_GALLON;
}

export function imperialGallonsToLitres(gallons: number): number {
  return gallons * LITRES_PER_IMPERIAL_GALLON;
}

export function litresToImperialGallons(litres: number): number {
  return litres / LITRES_PER_IMPERIAL_GALLON;
}

export function poundsToKilograms(pounds: number): number {
  return pounds * KILOGRAMS_PER_POUND;
}

/** Tank-culture texts quote biomass in lb per US gallon (SRAC 282); the planner works in kg/m³. */
export function poundsPerUsGallonToKilogramsPerCubicMetre(lbPerGallon: number): number {
  return (poundsToKilograms(lbPerGallon) / LITRES_PER_US_GALLON) * LITRES_PER_CUBIC_METRE;
}
