import { describe, expect, it } from "vitest";
import {
  KILOGRAMS_PER_POUND,
  LITRES_PER_IMPERIAL_GALLON,
  LITRES_PER_US_GALLON,
  cubicMetresToLitres,
  feetToMetres,
  imperialGallonsToLitres,
  inchesToMetres,
  litresToImperialGallons,
  litresToUsGallons,
  metresToFeet,
  poundsPerUsGallonToKilogramsPerCubicMetre,
  poundsToKilograms,
  usGallonsToLitres,
} from "./units";

describe("lengths", () => {
  it("1 ft = 0.3048 m exactly, so the common 6 ft × 10 ft tank is 1.8288 m × 3.048 m", () => {
    // NBS Circular 572 addendum (1960): 1 yd = 0.9144 m exactly, 1 ft = yd/3 (REFERENCE-VALUES 10.1, 10.2).
    expect(feetToMetres(1)).toBe(0.3048);
    expect(feetToMetres(6)).toBe(1.8288);
    expect(feetToMetres(10)).toBe(3.048);
    expect(feetToMetres(3)).toBe(0.9144);
  });

  it("1 in = 25.4 mm exactly and 12 in make a foot", () => {
    // Same 1959 agreement (REFERENCE-VALUES 10.1).
    expect(inchesToMetres(1)).toBe(0.0254);
    expect(inchesToMetres(12)).toBe(feetToMetres(1));
  });

  it("converts metres back to feet", () => {
    expect(metresToFeet(0.3048)).toBe(1);
    expect(metresToFeet(3.048)).toBe(10);
    expect(metresToFeet(feetToMetres(7.25))).toBeCloseTo(7.25, 12);
  });
});

describe("volumes and masses", () => {
  it("US gallon = 231 in³ = 3.785 411 784 L exactly", () => {
    // NIST Handbook 44 App. C (REFERENCE-VALUES 10.3); 231 in³ computed from the inch, not copied.
    expect(LITRES_PER_US_GALLON).toBeCloseTo(3.785411784, 12);
    expect(usGallonsToLitres(1)).toBeCloseTo(3.785411784, 12);
    const cubicInchLitres = (inchesToMetres(1) * 10) ** 3;
    expect(usGallonsToLitres(1)).toBeCloseTo(231 * cubicInchLitres, 12);
    expect(litresToUsGallons(3.785411784)).toBeCloseTo(1, 12);
  });

  it("the MSD Veterinary Manual's 1 gal ≈ 3.785 L and 1 ft³ ≈ 7.481 gal", () => {
    // MSD Veterinary Manual, "Formulae to calculate tank volumes" (REFERENCE-VALUES 7.6, 10.6).
    expect(usGallonsToLitres(1)).toBeCloseTo(3.785, 3);
    const cubicFootLitres = cubicMetresToLitres(feetToMetres(1) ** 3);
    expect(litresToUsGallons(cubicFootLitres)).toBeCloseTo(7.481, 3);
  });

  it("imperial gallon = 4.546 09 L exactly", () => {
    // NIST Handbook 44 App. C as quoted (REFERENCE-VALUES 10.4).
    expect(LITRES_PER_IMPERIAL_GALLON).toBe(4.54609);
    expect(imperialGallonsToLitres(10)).toBeCloseTo(45.4609, 12);
    expect(litresToImperialGallons(4.54609)).toBeCloseTo(1, 12);
  });

  it("1 lb = 0.453 592 37 kg exactly", () => {
    // 1959 agreement (REFERENCE-VALUES 10.6).
    expect(KILOGRAMS_PER_POUND).toBe(0.45359237);
    expect(poundsToKilograms(100)).toBeCloseTo(45.359237, 12);
  });

  it("reproduces the tank-culture text's own lb/gal → kg/m³ conversions", () => {
    // "Tank culture of tilapia" (SRAC 282 text, REFERENCE-VALUES 1.7, 1.8): 0.25 lb/gal (30 kg/m³), 0.5 to 0.6 lb/gal (60 to 72 kg/m³),
    // 0.75 to 1.0 lb/gal (90 to 120 kg/m³). The source rounds, so the check allows 0.5 %.
    const rows: [number, number][] = [
      [0.25, 30],
      [0.5, 60],
      [0.6, 72],
      [0.75, 90],
      [1.0, 120],
    ];
    for (const [lbPerGal, kgPerM3] of rows) {
      expect(Math.abs(poundsPerUsGallonToKilogramsPerCubicMetre(lbPerGal) / kgPerM3 - 1)).toBeLessThan(0.005);
    }
  });
});
