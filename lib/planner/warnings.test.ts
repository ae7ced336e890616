import { describe, expect, it } from "vitest";
import { defaultPlanInput, type PlanInput } from "@/lib/validations/planner";
import { estimatePlan } from "./estimate";
import { planCautions } from "./cautions";
import { TEMPERATURE_RANGES, temperatureWarning } from "./warnings";

const plan = (patch: (p: PlanInput) => PlanInput) => estimatePlan(patch(structuredClone(defaultPlanInput)));
const codes = (p: PlanInput) => estimatePlan(p).warnings.map((w) => w.code);
const withTank = (p: PlanInput, tank: Partial<PlanInput["tank"]>): PlanInput => ({ ...p, tank: { ...p.tank, ...tank } });

describe("temperature warnings against the published ranges (REFERENCE-VALUES 4.x)", () => {
  it("tilapia: death below 12 °C is danger; below the 20 °C normal range a warning; 20 to 35 °C nothing", () => {
    // NAFIS (4.1): death below 12 °C, normal range from 20 °C. El-Sayed (4.3): normal development to 35 °C.
    expect(TEMPERATURE_RANGES.tilapia).toMatchObject({ survivalMinC: 12, normalMinC: 20, normalMaxC: 35 });
    expect(temperatureWarning("tilapia", 11)?.severity).toBe("danger");
    expect(temperatureWarning("tilapia", 16)?.severity).toBe("warning");
    expect(temperatureWarning("tilapia", 20)).toBeNull();
    expect(temperatureWarning("tilapia", 35)).toBeNull();
    expect(temperatureWarning("tilapia", 37)?.severity).toBe("warning");
  });

  it("catfish: outside 8 to 35 °C is danger; outside 26 to 33 °C a warning", () => {
    // Teugels 1986 via 4.10: tolerates 8 to 35 °C. mweafish (4.9): 26 to 33 °C acceptable.
    expect(temperatureWarning("catfish", 7)?.severity).toBe("danger");
    expect(temperatureWarning("catfish", 36)?.severity).toBe("danger");
    expect(temperatureWarning("catfish", 24)?.severity).toBe("warning");
    expect(temperatureWarning("catfish", 30)).toBeNull();
  });
});

describe("each warning fires when, and only when, it applies", () => {
  it("the default plan has no warnings", () => {
    expect(codes(defaultPlanInput)).toEqual([]);
  });

  it("over-density: one fish more than the tank carries", () => {
    const capacity = estimatePlan(defaultPlanInput).stocking.capacityFish;
    expect(codes({ ...defaultPlanInput, fishToStock: capacity })).not.toContain("over-density");
    const over = estimatePlan({ ...defaultPlanInput, fishToStock: capacity + 1 });
    expect(over.warnings.map((w) => w.code)).toContain("over-density");
    expect(over.stocking.occupancyFraction).toBeGreaterThan(1);
    expect(over.warnings.find((w) => w.code === "over-density")?.message).toContain(String(capacity));
  });

  it("tilapia no larger than the catfish they share a tank with will be eaten (common practice)", () => {
    const mixed = (tilapiaG: number, catfishG: number) =>
      codes({ ...defaultPlanInput, species: "both", catfishShadeProvided: true, tilapia: { ...defaultPlanInput.tilapia, stockingWeightG: tilapiaG }, catfish: { ...defaultPlanInput.catfish, stockingWeightG: catfishG } });
    expect(mixed(10, 10)).toContain("tilapia-with-larger-catfish");
    expect(mixed(5, 20)).toContain("tilapia-with-larger-catfish");
    const larger = mixed(30, 10);
    expect(larger).not.toContain("tilapia-with-larger-catfish");
    // Catfish grow faster (growth.ts calibration), so they catch up during the cycle.
    expect(larger).toContain("catfish-outgrow-tilapia");
    expect(codes({ ...defaultPlanInput, species: "tilapia", catfish: { ...defaultPlanInput.catfish, stockingWeightG: 500, targetHarvestWeightG: 1000 } })).not.toContain("tilapia-with-larger-catfish");
  });

  it("a black liner in full sun heats the water (common practice): tarpaulin only", () => {
    expect(codes(withTank(defaultPlanInput, { linerColour: "black", sunExposure: "full-sun" }))).toContain("black-liner-full-sun");
    expect(codes(withTank(defaultPlanInput, { linerColour: "black", sunExposure: "part-shade" }))).not.toContain("black-liner-full-sun");
    expect(codes(withTank(defaultPlanInput, { linerColour: "white", sunExposure: "full-sun" }))).not.toContain("black-liner-full-sun");
    expect(codes(withTank(defaultPlanInput, { type: "concrete", linerColour: "black", sunExposure: "full-sun" }))).not.toContain("black-liner-full-sun");
  });

  it("catfish without shade (common practice)", () => {
    const catfish: PlanInput = { ...defaultPlanInput, species: "catfish", catfishShadeProvided: false };
    expect(codes(catfish)).toContain("catfish-without-shade");
    expect(codes({ ...catfish, catfishShadeProvided: true })).not.toContain("catfish-without-shade");
    expect(codes(withTank(catfish, { sunExposure: "shade" }))).not.toContain("catfish-without-shade");
    expect(codes({ ...defaultPlanInput, catfishShadeProvided: false })).not.toContain("catfish-without-shade");
  });

  it("water temperature outside the range of a species in the tank", () => {
    expect(codes({ ...defaultPlanInput, waterTemperatureC: 18 })).toContain("temperature-outside-range");
    const both = estimatePlan({ ...defaultPlanInput, species: "both", catfishShadeProvided: true, tilapia: { ...defaultPlanInput.tilapia, stockingWeightG: 30 }, waterTemperatureC: 22 });
    expect(both.warnings.filter((w) => w.code === "temperature-outside-range").map((w) => w.species)).toEqual(["catfish"]);
  });

  it("a target not reached within two years, with finite figures for what is reached", () => {
    const cold = plan((p) => ({ ...p, waterTemperatureC: 14 }));
    expect(cold.warnings.map((w) => w.code)).toContain("target-not-reached");
    expect(cold.cycle.cycleDays).toBe(730);
    expect(cold.species[0]?.daysToHarvest).toBeNull();
    expect(cold.species[0]?.harvestWeightG).toBe(defaultPlanInput.tilapia.stockingWeightG);
  });

  it("no gain when losses outweigh growth; no fish; a loss-making plan; a build cost the model cannot price", () => {
    expect(codes({ ...defaultPlanInput, growOutSurvivalFraction: 0.1, tilapia: { ...defaultPlanInput.tilapia, stockingWeightG: 100, targetHarvestWeightG: 150 } })).toContain("no-biomass-gain");
    expect(codes({ ...defaultPlanInput, fishToStock: 0 })).toContain("no-fish");
    expect(codes({ ...defaultPlanInput, tilapia: { ...defaultPlanInput.tilapia, salePricePerKgMinor: 0 } })).toContain("loss-making");
    expect(codes({ ...defaultPlanInput, currency: "USD" })).toContain("build-cost-unknown");
    expect(codes({ ...defaultPlanInput, currency: "USD", tank: { ...defaultPlanInput.tank, buildCostOverrideMinor: 50_000 } })).not.toContain("build-cost-unknown");
  });
});

describe("cautions", () => {
  it("quote the computed water mass and base pressure for a tank", () => {
    const estimate = estimatePlan(defaultPlanInput);
    const base = estimate.cautions.find((c) => c.code === "base-must-carry-water");
    expect(base?.message).toContain("5.6 t"); // 5.574 t, by hand: 1.8288 × 3.048 × 1 m × 1000 kg/m³
    expect(base?.message).toContain("9.8 kPa"); // ρ g h = 9.80665 kPa
    expect(base?.message).toMatch(/qualified builder/);
    expect(estimate.cautions.map((c) => c.code)).toEqual(["children-deep-water", "electric-pump-near-water", "base-must-carry-water"]);
  });

  it("the pump caution needs a pump; the base caution is for built tanks, not earthen ponds", () => {
    const none = planCautions({ tankType: "earthen", waterDepthM: 1, pumpHeadM: 0, pumpedM3: 10, waterMassTonnes: 1, basePressureKPa: 9.8 });
    expect(none.map((c) => c.code)).toEqual(["children-deep-water"]);
    const pump = estimatePlan({ ...defaultPlanInput, pump: { ...defaultPlanInput.pump, headM: 0 } });
    expect(pump.cautions.map((c) => c.code)).not.toContain("electric-pump-near-water");
    const electric = estimatePlan(defaultPlanInput).cautions.find((c) => c.code === "electric-pump-near-water");
    expect(electric?.message).toMatch(/residual-current device/);
    expect(electric?.message).toMatch(/qualified electrician/);
  });
});
