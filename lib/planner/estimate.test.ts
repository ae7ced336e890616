import { describe, expect, it } from "vitest";
import { defaultPlanInput, type PlanInput } from "@/lib/validations/planner";
import { estimatePlan } from "./estimate";

/*
 * The default plan worked by hand (the same arithmetic is written out in the planner's README section). Every expected
 * figure below is computed here from the published inputs, not copied from the function's output.
 */
describe("worked plan: the default 6 ft × 10 ft tarpaulin tank of tilapia", () => {
  const e = estimatePlan(defaultPlanInput);
  const volume = 1.8288 * 3.048 * 1; // m³ (6 ft = 1.8288 m, 10 ft = 3.048 m: NBS 1959)
  const limit = ((0.25 * 0.45359237) / 3.785411784) * 1000; // kg/m³, 0.25 lb/US gal (SRAC 282 text, REFERENCE-VALUES 1.7)
  const stocked = Math.floor((limit * volume) / (0.85 * 0.35)); // survivors × 350 g within the limit
  const ordered = Math.ceil(stocked / 0.95);
  // Growth (growth.ts calibration on REFERENCE-VALUES 3.4 and 3.5): nursery to 50 g, grow-out beyond.
  const kNursery = (Math.cbrt(50) - 1) / 84;
  const kGrowOut = (Math.cbrt(360) - Math.cbrt(50)) / ((10 * 365.25) / 12 - (Math.cbrt(50) - Math.cbrt(3)) / kNursery);
  const days = (Math.cbrt(50) - Math.cbrt(10)) / kNursery + (Math.cbrt(350) - Math.cbrt(50)) / kGrowOut;
  const harvestKg = stocked * 0.85 * 0.35;
  const feedKg = 1.5 * (harvestKg - stocked * 0.01);
  const pumpedM3 = (1 + Math.floor(Math.ceil(days) / 7)) * volume;
  const kWh = (1000 * 9.80665 * pumpedM3 * 5) / 0.4 / 3.6e6;
  const linerM2 = (3.048 + 2 * 1.6) * (1.8288 + 2 * 1.6);
  const build = Math.round(30_000 * linerM2);
  const amortisation = Math.round((build * Math.ceil(days)) / (5 * 365.25));
  const total = amortisation + ordered * 150 + Math.round(feedKg * 1800) + Math.round(kWh * 150) + 150_000;
  const revenue = Math.round(harvestKg * 6000);

  it("tank and loads", () => {
    expect(e.tank.waterVolumeM3).toBeCloseTo(5.5741824, 10);
    expect(e.tank.waterVolumeLitres).toBeCloseTo(5574.1824, 7);
    expect(e.tank.waterMassTonnes).toBeCloseTo(5.5741824, 10);
    expect(e.tank.basePressureKPa).toBeCloseTo(9.80665, 10);
    expect(e.tank.linerSheet?.areaM2).toBeCloseTo(linerM2, 10);
  });

  it("stocking, order and growth", () => {
    expect(stocked).toBe(561);
    expect(e.stocking.fishStocked).toBe(stocked);
    expect(e.stocking.fishToOrder).toBe(ordered);
    expect(ordered).toBe(591);
    expect(e.species[0]?.daysToHarvest).toBeCloseTo(days, 8);
    expect(e.cycle.cycleDays).toBe(Math.ceil(days));
    expect(e.cycle.cycleDays).toBe(278);
    expect(e.species[0]?.harvestWeightG).toBe(350);
  });

  it("harvest, feed, water and electricity", () => {
    expect(e.cycle.harvestKg).toBeCloseTo(harvestKg, 9);
    expect(e.cycle.feedKg).toBeCloseTo(feedKg, 9);
    expect(e.water.pumpedM3).toBeCloseTo(pumpedM3, 9);
    expect(e.water.energyKWh).toBeCloseTo(kWh, 9);
  });

  it("money", () => {
    expect(e.costs.buildCostMinor).toBe(build);
    expect(e.costs.tankAmortisationMinor).toBe(amortisation);
    expect(e.costs.fingerlingsMinor).toBe(ordered * 150);
    expect(e.costs.totalMinor).toBe(total);
    expect(e.economics.revenueMinor).toBe(revenue);
    expect(e.economics.marginMinor).toBe(revenue - total);
    expect(e.economics.breakEvenPricePerKgMinor).toBe(Math.ceil(total / harvestKg));
  });
});

const variants: [string, PlanInput][] = [
  ["default tilapia tank", defaultPlanInput],
  ["catfish in a round concrete tank", { ...defaultPlanInput, species: "catfish", catfishShadeProvided: true, tank: { ...defaultPlanInput.tank, type: "concrete", dimensions: { shape: "round", diameterM: 3 } } }],
  ["both species in an earthen pond", { ...defaultPlanInput, species: "both", tilapia: { ...defaultPlanInput.tilapia, stockingWeightG: 40 }, tank: { ...defaultPlanInput.tank, type: "earthen", dimensions: { shape: "rectangular", lengthM: 20, widthM: 15 } } }],
  ["over-stocked cool tank", { ...defaultPlanInput, fishToStock: 900, waterTemperatureC: 21 }],
];

describe.each(variants)("consistency: %s", (_name, input) => {
  const e = estimatePlan(input);

  it("feed total ÷ biomass gain equals the FCR used, species by species", () => {
    for (const s of e.species) {
      expect(s.biomassGainKg).toBeGreaterThan(0);
      expect(s.feedKg / s.biomassGainKg).toBeCloseTo(input[s.species].fcr, 10);
    }
  });

  it("the week-by-week feed adds up to the total, and the series ends at the harvest", () => {
    const weeklyFeed = e.weekly.reduce((sum, w) => sum + w.feedKg, 0);
    expect(weeklyFeed).toBeCloseTo(e.cycle.feedKg, 8);
    expect(e.weekly[0]?.biomassKg).toBeCloseTo(e.cycle.stockedBiomassKg, 9);
    expect(e.weekly[e.weekly.length - 1]?.day).toBe(e.cycle.cycleDays);
    if (e.species.length === 1) expect(e.weekly[e.weekly.length - 1]?.biomassKg).toBeCloseTo(e.cycle.harvestKg, 9);
  });

  it("fish ordered × quarantine survival ≥ fish stocked", () => {
    for (const s of e.species) expect(s.fishToOrder * input.quarantineSurvivalFraction).toBeGreaterThanOrEqual(s.fishStocked);
  });

  it("the cost lines add up, margin = revenue − cost, and the break-even price just covers the cost", () => {
    const c = e.costs;
    expect(c.totalMinor).toBe(c.tankAmortisationMinor + c.fingerlingsMinor + c.feedMinor + c.electricityMinor + c.labourMinor);
    expect(e.economics.marginMinor).toBe(e.economics.revenueMinor - c.totalMinor);
    const breakEven = e.economics.breakEvenPricePerKgMinor ?? 0;
    expect(breakEven * e.cycle.harvestKg).toBeGreaterThanOrEqual(c.totalMinor - 1e-6);
    expect((breakEven - 1) * e.cycle.harvestKg).toBeLessThan(c.totalMinor);
  });

  it("the capacity stocked keeps within the density limit", () => {
    if (input.fishToStock === null || input.fishToStock === undefined) expect(e.stocking.occupancyFraction).toBeLessThanOrEqual(1);
  });
});

describe("doubling the volume doubles the capacity while the density limit holds", () => {
  it("tanks: twice the length or twice the depth carries twice the fish (to one fish of rounding)", () => {
    const one = estimatePlan(defaultPlanInput);
    const longer = estimatePlan({ ...defaultPlanInput, tank: { ...defaultPlanInput.tank, dimensions: { shape: "rectangular", lengthM: 2 * 3.048, widthM: 1.8288 } } });
    const deeper = estimatePlan({ ...defaultPlanInput, tank: { ...defaultPlanInput.tank, waterDepthM: 2 } });
    for (const two of [longer, deeper]) {
      expect(two.tank.waterVolumeM3).toBeCloseTo(2 * one.tank.waterVolumeM3, 10);
      expect(two.stocking.capacityFish - 2 * one.stocking.capacityFish).toBeGreaterThanOrEqual(0);
      expect(two.stocking.capacityFish - 2 * one.stocking.capacityFish).toBeLessThanOrEqual(1);
      expect(two.cycle.harvestKg / two.tank.waterVolumeM3).toBeLessThanOrEqual(one.species[0]?.densityLimit.value ?? 0);
    }
  });

  it("ponds are limited per m² of surface, so a deeper pond carries no more fish", () => {
    const pond: PlanInput = { ...defaultPlanInput, tank: { ...defaultPlanInput.tank, type: "earthen", dimensions: { shape: "rectangular", lengthM: 10, widthM: 10 } } };
    const deeper = estimatePlan({ ...pond, tank: { ...pond.tank, waterDepthM: 2 } });
    expect(estimatePlan(pond).stocking.capacityFish).toBe(200); // 100 m² × 2/m² (Duodu et al. 2020, REFERENCE-VALUES 1.11)
    expect(deeper.stocking.capacityFish).toBe(200);
  });
});

describe("comparison of tank types for the same size", () => {
  const sizes: PlanInput["tank"]["dimensions"][] = [
    { shape: "rectangular", lengthM: 3.048, widthM: 1.8288 },
    { shape: "rectangular", lengthM: 1, widthM: 1 },
    { shape: "rectangular", lengthM: 5, widthM: 4 },
    { shape: "rectangular", lengthM: 30, widthM: 20 },
    { shape: "round", diameterM: 2 },
    { shape: "round", diameterM: 6 },
  ];

  it("tarpaulin costs less to build than concrete, concrete less than an excavated pond (common practice)", () => {
    for (const dimensions of sizes) {
      const rows = estimatePlan({ ...defaultPlanInput, tank: { ...defaultPlanInput.tank, dimensions } }).tankComparison;
      const cost = (type: string) => rows.find((r) => r.type === type)?.buildCostMinor ?? Number.NaN;
      expect(cost("tarpaulin"), JSON.stringify(dimensions)).toBeLessThan(cost("concrete"));
      expect(cost("concrete"), JSON.stringify(dimensions)).toBeLessThan(cost("earthen"));
    }
  });

  it("has one row per type, marks the current one, and that row repeats the main figures", () => {
    const e = estimatePlan({ ...defaultPlanInput, fishToStock: 300, tank: { ...defaultPlanInput.tank, lifeYears: 7 } });
    expect(e.tankComparison.map((r) => r.type)).toEqual(["tarpaulin", "concrete", "earthen"]);
    const current = e.tankComparison.filter((r) => r.isCurrent);
    expect(current).toHaveLength(1);
    expect(current[0]).toMatchObject({ type: "tarpaulin", lifeYears: 7, fishStocked: 300, cycleCostMinor: e.costs.totalMinor, marginMinor: e.economics.marginMinor });
    const concrete = e.tankComparison.find((r) => r.type === "concrete");
    expect(concrete?.lifeYears).toBe(20);
    expect(concrete?.fishStocked).toBe(estimatePlan({ ...defaultPlanInput, tank: { ...defaultPlanInput.tank, type: "concrete" } }).stocking.capacityFish);
  });

  it("an earthen pond exchanges less water than a tank by default, so pumps less", () => {
    const rows = estimatePlan(defaultPlanInput).tankComparison;
    const energy = (type: string) => rows.find((r) => r.type === type)?.energyKWh ?? Number.NaN;
    expect(energy("earthen")).toBeLessThan(energy("concrete"));
  });

  it("a build-cost override replaces the model; another currency without one leaves the build cost unknown", () => {
    const quoted = estimatePlan({ ...defaultPlanInput, tank: { ...defaultPlanInput.tank, buildCostOverrideMinor: 500_000 } });
    expect(quoted.costs).toMatchObject({ buildCostMinor: 500_000, buildCostSource: "override" });
    const usd = estimatePlan({ ...defaultPlanInput, currency: "USD" });
    expect(usd.costs).toMatchObject({ buildCostMinor: null, buildCostSource: "unknown", tankAmortisationMinor: 0 });
    expect(usd.tankComparison.every((r) => r.buildCostMinor === null)).toBe(true);
  });
});

describe("edge cases", () => {
  it("zero fish: every quantity 0, break-even null, nothing NaN", () => {
    const e = estimatePlan({ ...defaultPlanInput, fishToStock: 0 });
    expect(e.cycle.harvestKg).toBe(0);
    expect(e.cycle.feedKg).toBe(0);
    expect(e.stocking.fishToOrder).toBe(0);
    expect(e.costs.feedMinor + e.costs.fingerlingsMinor).toBe(0);
    expect(e.economics.revenueMinor).toBe(0);
    expect(e.economics.breakEvenPricePerKgMinor).toBeNull();
    expect(e.weekly.every((w) => w.biomassKg === 0 && w.feedKg === 0)).toBe(true);
  });

  it("a pond too small for one fish stocks none", () => {
    const e = estimatePlan({ ...defaultPlanInput, tank: { ...defaultPlanInput.tank, type: "earthen", dimensions: { shape: "rectangular", lengthM: 0.3, widthM: 0.3 } } });
    expect(e.stocking.capacityFish).toBe(0);
    expect(e.warnings.map((w) => w.code)).toContain("no-fish");
  });

  it("both species: each is harvested on its own day, the cycle ends with the later one", () => {
    const e = estimatePlan({ ...defaultPlanInput, species: "both", tilapia: { ...defaultPlanInput.tilapia, stockingWeightG: 40 } });
    const [tilapia, catfish] = e.species;
    expect(tilapia?.species).toBe("tilapia");
    expect(catfish?.species).toBe("catfish");
    expect(e.cycle.cycleDays).toBe(Math.max(tilapia?.harvestDay ?? 0, catfish?.harvestDay ?? 0));
    expect((tilapia?.fishStocked ?? 0) + (catfish?.fishStocked ?? 0)).toBe(e.stocking.fishStocked);
    expect(tilapia?.fishStocked).toBe(Math.round(e.stocking.fishStocked * 0.8));
    const afterTilapia = e.weekly.filter((w) => w.day > (tilapia?.harvestDay ?? 0) + 7);
    expect(afterTilapia.every((w) => w.meanWeightG.tilapia === null)).toBe(true);
  });

  it("lists the assumptions used with a source and confidence, and the catfish tank limit as from memory", () => {
    const e = estimatePlan({ ...defaultPlanInput, species: "catfish", catfishShadeProvided: true });
    for (const a of e.assumptions) {
      expect(a.source.length).toBeGreaterThan(10);
      expect(["published", "common practice", "from memory", "demo default"]).toContain(a.confidence);
    }
    expect(e.assumptions.find((a) => a.key === "tank-limit-catfish")?.confidence).toBe("from memory");
    expect(new Set(e.assumptions.map((a) => a.key)).size).toBe(e.assumptions.length);
  });
});
