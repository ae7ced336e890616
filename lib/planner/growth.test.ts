import { describe, expect, it } from "vitest";
import { DAYS_PER_MONTH, GROWTH_STAGES, daysToReach, temperatureGrowthFactor, weightAfterDays } from "./growth";

const OPTIMUM_C = 28;
const TEN_MONTHS = 10 * DAYS_PER_MONTH;

describe("growth model against the published growth figures (REFERENCE-VALUES section 3)", () => {
  it("tilapia nursery: 1 g to 50 g in 12 weeks", () => {
    // UVI Agricultural Experiment Station, nursery system (REFERENCE-VALUES 3.4). A calibration row.
    expect(weightAfterDays("tilapia", 1, 84, OPTIMUM_C)).toBeCloseTo(50, 6);
  });

  it("tilapia pond grow-out: 3 g to 360 g in 10 months", () => {
    // Arredondo-Figueroa et al. 2015, Int. J. Animal & Vet. Adv. 8(1) (REFERENCE-VALUES 3.5). A calibration row.
    expect(weightAfterDays("tilapia", 3, TEN_MONTHS, OPTIMUM_C)).toBeCloseTo(360, 6);
    expect(daysToReach("tilapia", 3, 360, OPTIMUM_C)).toBeCloseTo(TEN_MONTHS, 6);
  });

  it("African catfish: 1 g to about 1 kg in 10 months", () => {
    // FAO AFFRIS, "North African catfish: Growth" (REFERENCE-VALUES 3.1). A calibration row.
    expect(weightAfterDays("catfish", 1, TEN_MONTHS, OPTIMUM_C)).toBeCloseTo(1000, 6);
  });

  it("catfish after 6 months land between the 200 g and 500 g of FAO's pond handbook (not a calibration row)", () => {
    // de Graaf & Janssen, FAO Fisheries Technical Paper 362, §6.1 (REFERENCE-VALUES 3.3): about 200 g (10/m²) to 500 g (2/m²)
    // after 6 months. The handbook gives no start weight here; we start from the 1 g fingerling of the AFFRIS row.
    const sixMonths = weightAfterDays("catfish", 1, 6 * DAYS_PER_MONTH, OPTIMUM_C);
    expect(sixMonths).toBeGreaterThan(200);
    expect(sixMonths).toBeLessThan(500);
  });

  it("one cube-root coefficient could not fit both tilapia rows, which is why the model has two stages", () => {
    // Checks the reason given in growth.ts: the single-stage fits of 3.4 and 3.5 differ by more than 50 %.
    const nursery = (Math.cbrt(50) - Math.cbrt(1)) / 84;
    const pond = (Math.cbrt(360) - Math.cbrt(3)) / TEN_MONTHS;
    expect(nursery / pond).toBeGreaterThan(1.5);
    expect(GROWTH_STAGES.tilapia).toHaveLength(2);
  });
});

describe("model behaviour", () => {
  it("daysToReach and weightAfterDays are inverse, across the nursery/grow-out break", () => {
    for (const [start, target] of [
      [0.5, 20],
      [10, 350],
      [60, 800],
    ] as const) {
      for (const species of ["tilapia", "catfish"] as const) {
        const days = daysToReach(species, start, target, 27);
        expect(days).not.toBeNull();
        expect(weightAfterDays(species, start, days ?? 0, 27)).toBeCloseTo(target, 6);
      }
    }
  });

  it("weight never falls and grows faster the nearer the temperature is to the optimum", () => {
    let previous = 0;
    for (let day = 0; day <= 400; day += 10) {
      const w = weightAfterDays("tilapia", 5, day, 27);
      expect(w).toBeGreaterThanOrEqual(previous);
      previous = w;
    }
    expect(weightAfterDays("tilapia", 5, 120, 20)).toBeLessThan(weightAfterDays("tilapia", 5, 120, 27));
    expect(weightAfterDays("catfish", 5, 120, 34)).toBeLessThan(weightAfterDays("catfish", 5, 120, 30));
  });

  it("no growth where the species stops feeding: the target is never reached", () => {
    expect(daysToReach("tilapia", 10, 350, 12)).toBeNull();
    expect(weightAfterDays("tilapia", 10, 300, 12)).toBe(10);
    expect(daysToReach("catfish", 10, 1000, 36)).toBeNull();
  });
});

describe("temperature factor against the published temperature limits", () => {
  it("tilapia: nothing at 15 °C, full rate from 25 to 30 °C", () => {
    // NAFIS (REFERENCE-VALUES 4.1): most do not feed below 15 °C. El-Sayed (4.3): optimum about 25 to 30 °C.
    expect(temperatureGrowthFactor("tilapia", 15)).toBe(0);
    expect(temperatureGrowthFactor("tilapia", 10)).toBe(0);
    expect(temperatureGrowthFactor("tilapia", 25)).toBe(1);
    expect(temperatureGrowthFactor("tilapia", 28)).toBe(1);
    expect(temperatureGrowthFactor("tilapia", 30)).toBe(1);
    expect(temperatureGrowthFactor("tilapia", 20)).toBeCloseTo(0.5, 12);
  });

  it("catfish: full rate over 26 to 33 °C (best at 30 °C), nothing at the 35 °C tolerance limit", () => {
    // mweafish (REFERENCE-VALUES 4.9): 26 to 33 °C acceptable, best at 30 °C. Teugels 1986 via 4.10: tolerates up to 35 °C.
    expect(temperatureGrowthFactor("catfish", 26)).toBe(1);
    expect(temperatureGrowthFactor("catfish", 30)).toBe(1);
    expect(temperatureGrowthFactor("catfish", 33)).toBe(1);
    expect(temperatureGrowthFactor("catfish", 35)).toBe(0);
    expect(temperatureGrowthFactor("catfish", 34)).toBeCloseTo(0.5, 12);
  });
});
