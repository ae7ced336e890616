import { describe, expect, it } from "vitest";
import { energyKWh, headForPressureRiseM, hydraulicPowerW, pumpInputPowerW, pumpingEnergyKWh, waterPumpedPerCycle } from "./pumping";

describe("hydraulic power P = ρ g Q H / η", () => {
  it("reproduces the Engineering ToolBox example: 1 L/s lifted 91.7 m takes 899.6 W", () => {
    // Engineering ToolBox, "Pump power" (REFERENCE-VALUES 7.2): P = 1000 · 1e-3 · 9.81 · 91.7 = 899.6 W (899.58 computed).
    expect(hydraulicPowerW(1e-3, 91.7, 1000, 9.81)).toBeCloseTo(899.577, 3);
    const head = headForPressureRiseM(9e5, 1000, 9.81);
    expect(hydraulicPowerW(1e-3, head, 1000, 9.81)).toBeCloseTo(900, 6); // the un-rounded head gives Δp · Q exactly
  });

  it("agrees with the m³/h form P_h (kW) = q ρ g h / 3.6 × 10⁶", () => {
    // Engineering ToolBox (REFERENCE-VALUES 7.1): q = 3.6 m³/h is 1 L/s.
    const kW = (3.6 * 1000 * 9.81 * 91.7) / 3.6e6;
    expect(hydraulicPowerW(1e-3, 91.7, 1000, 9.81) / 1000).toBeCloseTo(kW, 12);
  });

  it("divides by the efficiency for the power drawn", () => {
    expect(pumpInputPowerW(1e-3, 91.7, 0.5, 9.81)).toBeCloseTo(2 * 899.577, 3);
  });
});

describe("energy", () => {
  it("FAO: 5 kW for 6 h = 30 kWh, and 1 kWh = 3.6 MJ", () => {
    // Fraenkel, Water lifting, FAO Irrigation and Drainage Paper 43, §2.1.1 (REFERENCE-VALUES 7.4).
    expect(energyKWh(5000, 6)).toBe(30);
    expect(energyKWh(3.6e6 / 3600, 1)).toBe(1);
  });

  it("energy to lift a volume equals P = ρ g Q H / η times the running time V / Q, whatever the flow", () => {
    const volume = 222.967296;
    const head = 5;
    const efficiency = 0.4;
    for (const flow of [1e-4, 2e-3, 0.05]) {
      const hours = volume / flow / 3600;
      expect(pumpingEnergyKWh(volume, head, efficiency)).toBeCloseTo(energyKWh(pumpInputPowerW(flow, head, efficiency), hours), 9);
    }
    // By hand: 1000 × 9.80665 × 222.967296 × 5 / 0.4 / 3.6e6 = 7.5922 kWh.
    expect(pumpingEnergyKWh(volume, head, efficiency)).toBeCloseTo(7.59223, 5);
  });

  it("no head, no energy", () => {
    expect(pumpingEnergyKWh(100, 0, 0.4)).toBe(0);
  });
});

describe("water pumped over a cycle", () => {
  it("first fill plus one change per interval: 278 days, weekly full changes → 1 + 39 tank volumes", () => {
    const pumped = waterPumpedPerCycle(5.5741824, { intervalDays: 7, fractionExchanged: 1 }, 278);
    expect(pumped.changes).toBe(39);
    expect(pumped.totalM3).toBeCloseTo(40 * 5.5741824, 10);
  });

  it("a partial exchange pumps that fraction each time; an interval longer than the cycle pumps only the fill", () => {
    expect(waterPumpedPerCycle(100, { intervalDays: 7, fractionExchanged: 0.1 }, 70).totalM3).toBeCloseTo(100 + 10 * 10, 10);
    expect(waterPumpedPerCycle(100, { intervalDays: 365, fractionExchanged: 1 }, 200).totalM3).toBe(100);
  });
});
