import { describe, expect, it } from "vitest";
import type { TankDimensions } from "@/lib/validations/planner";
import { cylinderVolume, floorAreaM2, innerSurfaceM2, LINER_FOLD_ALLOWANCE_M, linerSheet, perimeterM, rectangularVolume, waterVolumeM3 } from "./geometry";
import { cubicMetresToLitres, feetToMetres } from "./units";

const sixByTen: TankDimensions = { shape: "rectangular", lengthM: feetToMetres(10), widthM: feetToMetres(6) };

describe("tank volume against the MSD Veterinary Manual's worked examples", () => {
  it("rectangular: 30 × 12 × 20 cm = 7 200 mL = 7.2 L", () => {
    // MSD Veterinary Manual, "Formulae to calculate tank volumes" (REFERENCE-VALUES 7.5).
    expect(rectangularVolume(30, 12, 20)).toBe(7200);
    const m3 = waterVolumeM3({ shape: "rectangular", lengthM: 0.3, widthM: 0.12 }, 0.2);
    expect(cubicMetresToLitres(m3)).toBeCloseTo(7.2, 10);
  });

  it("cylindrical: r = 10 cm, depth 20 cm gives 6 283.18 mL", () => {
    // Same table (REFERENCE-VALUES 7.6); the table cuts the figure to two decimals, hence the 0.01 mL tolerance.
    expect(Math.abs(cylinderVolume(10, 20) - 6283.18)).toBeLessThan(0.01);
    const m3 = waterVolumeM3({ shape: "round", diameterM: 0.2 }, 0.2);
    expect(Math.abs(cubicMetresToLitres(m3) - 6.28318)).toBeLessThan(1e-5);
  });

  it("cylinder in feet: 10 ft across and 20 ft high holds about 1 570 ft³", () => {
    // eHow UK, "How to calculate the volume of a water tank" (REFERENCE-VALUES 7.7; Med): π·5²·20 ≈ 1 570.8.
    expect(Math.round(cylinderVolume(5, 20) / 10) * 10).toBe(1570);
    const m3 = waterVolumeM3({ shape: "round", diameterM: feetToMetres(10) }, feetToMetres(20));
    expect(m3 / feetToMetres(1) ** 3).toBeCloseTo(Math.PI * 25 * 20, 8);
  });
});

describe("exact arithmetic on the default tank", () => {
  it("6 ft × 10 ft at 1 m depth holds 1.8288 × 3.048 × 1 = 5.574 182 4 m³", () => {
    // Decimal product done by hand: 1.8288 × 3.048 = 5.5741824.
    expect(floorAreaM2(sixByTen)).toBeCloseTo(5.5741824, 12);
    expect(waterVolumeM3(sixByTen, 1)).toBeCloseTo(5.5741824, 12);
    expect(cubicMetresToLitres(waterVolumeM3(sixByTen, 1))).toBeCloseTo(5574.1824, 8);
  });

  it("perimeter and inner surface: 2(L + W) and floor + perimeter × height; π D for a round tank", () => {
    expect(perimeterM(sixByTen)).toBeCloseTo(2 * (3.048 + 1.8288), 12);
    expect(innerSurfaceM2(sixByTen, 1.3)).toBeCloseTo(5.5741824 + 9.7536 * 1.3, 12);
    expect(perimeterM({ shape: "round", diameterM: 2 })).toBeCloseTo(2 * Math.PI, 12);
    expect(floorAreaM2({ shape: "round", diameterM: 2 })).toBeCloseTo(Math.PI, 12);
  });

  it("volume is linear in each dimension: doubling the length doubles it, doubling a diameter quadruples it", () => {
    const long: TankDimensions = { shape: "rectangular", lengthM: 2 * feetToMetres(10), widthM: feetToMetres(6) };
    expect(waterVolumeM3(long, 1)).toBeCloseTo(2 * waterVolumeM3(sixByTen, 1), 12);
    expect(waterVolumeM3({ shape: "round", diameterM: 4 }, 1)).toBeCloseTo(4 * waterVolumeM3({ shape: "round", diameterM: 2 }, 1), 12);
  });
});

describe("liner sheet", () => {
  it("covers floor plus walls to full height plus the fold allowance on every edge", () => {
    // By hand: 3.048 + 2 × (1.3 + 0.3) = 6.248 m; 1.8288 + 3.2 = 5.0288 m.
    const sheet = linerSheet(sixByTen, 1.3);
    expect(LINER_FOLD_ALLOWANCE_M).toBe(0.3);
    expect(sheet.lengthM).toBeCloseTo(6.248, 12);
    expect(sheet.widthM).toBeCloseTo(5.0288, 12);
    expect(sheet.areaM2).toBeCloseTo(6.248 * 5.0288, 12);
  });

  it("a round tank takes a square sheet of D + 2(H + allowance)", () => {
    const sheet = linerSheet({ shape: "round", diameterM: 2 }, 1, 0.25);
    expect(sheet.lengthM).toBeCloseTo(4.5, 12);
    expect(sheet.widthM).toBeCloseTo(4.5, 12);
  });

  it("is never smaller than the surface it lines", () => {
    for (const dims of [sixByTen, { shape: "round", diameterM: 3 } as const, { shape: "rectangular", lengthM: 1, widthM: 8 } as const]) {
      for (const height of [0.2, 1, 2.5]) expect(linerSheet(dims, height).areaM2).toBeGreaterThan(innerSurfaceM2(dims, height));
    }
  });
});
