import { describe, expect, it } from "vitest";
import { baseLoad, hydrostaticPressurePa, waterMassKg } from "./loads";
import { headForPressureRiseM } from "./pumping";

describe("hydrostatic pressure p = ρ g h", () => {
  it("1 m of fresh water presses 1000 × 9.806 65 × 1 = 9 806.65 Pa on the base", () => {
    // Exact arithmetic with ρ = 1000 kg/m³ and standard gravity 9.806 65 m/s² (exact by definition).
    expect(hydrostaticPressurePa(1)).toBeCloseTo(9806.65, 9);
    expect(hydrostaticPressurePa(2.5)).toBeCloseTo(24516.625, 9);
  });

  it("matches the Engineering ToolBox worked example: 9 × 10⁵ Pa is a 91.7 m column with g = 9.81", () => {
    // Engineering ToolBox, "Pump power" (REFERENCE-VALUES 7.2): h = 9e5 / (1000 · 9.81) = 91.7 m.
    expect(headForPressureRiseM(9e5, 1000, 9.81)).toBeCloseTo(91.74, 2);
    expect(hydrostaticPressurePa(headForPressureRiseM(9e5, 1000, 9.81), 1000, 9.81)).toBeCloseTo(9e5, 6);
  });
});

describe("what the base carries", () => {
  it("the default 6 ft × 10 ft tank at 1 m: 5.574 t of water, 9.81 kPa", () => {
    // m = ρ V = 1000 × 5.5741824 kg; p = ρ g h = 9.80665 kPa.
    const load = baseLoad(5.5741824, 1);
    expect(load.waterMassKg).toBeCloseTo(5574.1824, 8);
    expect(load.waterMassTonnes).toBeCloseTo(5.5741824, 10);
    expect(load.waterWeightKN).toBeCloseTo(5574.1824 * 9.80665 / 1000, 10);
    expect(load.basePressureKPa).toBeCloseTo(9.80665, 12);
  });

  it("with vertical walls the weight spread over the floor equals ρ g h", () => {
    const area = 3.7;
    const depth = 1.4;
    const load = baseLoad(area * depth, depth);
    expect(load.waterWeightKN / area).toBeCloseTo(load.basePressureKPa, 10);
  });

  it("mass is linear in volume", () => {
    expect(waterMassKg(2)).toBe(2000);
    expect(waterMassKg(0)).toBe(0);
  });
});
