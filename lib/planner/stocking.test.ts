import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  CATFISH_TANK_LIMIT_KG_PER_M3,
  TILAPIA_POND_FISH_PER_M2,
  TILAPIA_TANK_LIMIT_KG_PER_M3,
  carryingCapacityFish,
  catfishPondFishPerM2,
  fingerlingsToOrder,
  occupancy,
  splitBySpecies,
  type CarryingTank,
} from "./stocking";

function tank(overrides: Partial<CarryingTank> & { tilapiaShare?: number; harvestG?: number; catfishHarvestG?: number }): CarryingTank {
  const share = overrides.tilapiaShare ?? 1;
  return {
    tankType: overrides.tankType ?? "tarpaulin",
    waterVolumeM3: overrides.waterVolumeM3 ?? 10,
    surfaceAreaM2: overrides.surfaceAreaM2 ?? 10,
    growOutSurvival: overrides.growOutSurvival ?? 1,
    species: {
      tilapia: { share, harvestWeightG: overrides.harvestG ?? 500, targetHarvestWeightG: overrides.harvestG ?? 500 },
      catfish: { share: 1 - share, harvestWeightG: overrides.catfishHarvestG ?? 1000, targetHarvestWeightG: overrides.catfishHarvestG ?? 1000 },
    },
  };
}

describe("stocking densities against their sources", () => {
  it("tilapia in aerated tanks: about 0.25 lb/gal, i.e. 30 kg/m³", () => {
    // Tank culture of tilapia, SRAC 282 text (REFERENCE-VALUES 1.7).
    expect(TILAPIA_TANK_LIMIT_KG_PER_M3).toBeCloseTo(30, 0);
  });

  it("a 10 m³ tank of 500 g tilapia with no losses carries floor(29.96 × 10 / 0.5) = 599 fish", () => {
    // Arithmetic on the 1.7 limit: 0.25 lb/gal × 0.45359237 kg/lb ÷ 3.785411784 L/gal × 1000 L/m³ = 29.9566 kg/m³.
    expect(carryingCapacityFish(tank({}))).toBe(599);
  });

  it("tilapia in fed earthen ponds: 2/m², so a 100 m² pond takes 200 and the Mexican 4 900 m² pond about 10 000", () => {
    // Duodu et al. 2020 (REFERENCE-VALUES 1.11): 2 fish/m². Arredondo-Figueroa et al. 2015 (1.14): 10 000 in 4 900 m².
    expect(TILAPIA_POND_FISH_PER_M2).toBe(2);
    expect(carryingCapacityFish(tank({ tankType: "earthen", surfaceAreaM2: 100 }))).toBe(200);
    const mexican = carryingCapacityFish(tank({ tankType: "earthen", surfaceAreaM2: 4900 }));
    expect(Math.abs(mexican - 10_000) / 10_000).toBeLessThan(0.03);
    // Gindaba et al. 2017 (1.12) tried 1 to 3/m².
    expect(TILAPIA_POND_FISH_PER_M2).toBeGreaterThanOrEqual(1);
    expect(TILAPIA_POND_FISH_PER_M2).toBeLessThanOrEqual(3);
  });

  it("catfish in ponds: 2/m² for about 500 g, 10/m² for about 200 g, never outside 2 to 10/m²", () => {
    // de Graaf & Janssen, FAO Fisheries Technical Paper 362, §6.1, citing Micha 1976 (REFERENCE-VALUES 1.1).
    expect(catfishPondFishPerM2(500)).toBe(2);
    expect(catfishPondFishPerM2(200)).toBe(10);
    expect(catfishPondFishPerM2(1000)).toBe(2);
    expect(catfishPondFishPerM2(50)).toBe(10);
    expect(catfishPondFishPerM2(350)).toBeCloseTo(6, 12);
    // The extension leaflet's 2 to 5/m² for market fish (1.4, Med) lies inside the same band.
    expect(catfishPondFishPerM2(300)).toBeGreaterThanOrEqual(2);
  });

  it("catfish in tanks: the product choice is above the aerated tilapia figure but below the oxygenated one", () => {
    // From memory (REFERENCE-VALUES §1 Gap); bounded by 1.7 (30 kg/m³) and 1.8 (60 kg/m³ and more with oxygen).
    expect(CATFISH_TANK_LIMIT_KG_PER_M3).toBeGreaterThan(TILAPIA_TANK_LIMIT_KG_PER_M3);
    expect(CATFISH_TANK_LIMIT_KG_PER_M3).toBeLessThan(60);
  });
});

describe("capacity", () => {
  it("is the largest whole number within the limit", () => {
    for (const t of [tank({ growOutSurvival: 0.85, harvestG: 350 }), tank({ tilapiaShare: 0.7, waterVolumeM3: 3.3 }), tank({ tankType: "earthen", tilapiaShare: 0.4, catfishHarvestG: 300 })]) {
      const shares = { tilapia: t.species.tilapia.share, catfish: t.species.catfish.share };
      const n = carryingCapacityFish(t);
      expect(occupancy(t, splitBySpecies(n, shares))).toBeLessThanOrEqual(1 + 1e-12);
      expect(occupancy(t, splitBySpecies(n + 1, shares))).toBeGreaterThan(1);
    }
  });

  it("doubling the volume doubles a tank's capacity (to the fish), and doubling the area a pond's", () => {
    fc.assert(
      fc.property(fc.double({ min: 0.5, max: 500, noNaN: true }), fc.double({ min: 5, max: 3000, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true }), (volume, harvestG, share) => {
        const one = carryingCapacityFish(tank({ waterVolumeM3: volume, harvestG, tilapiaShare: share, growOutSurvival: 0.9 }));
        const two = carryingCapacityFish(tank({ waterVolumeM3: 2 * volume, harvestG, tilapiaShare: share, growOutSurvival: 0.9 }));
        // Whole fish: each capacity is within one fish of the exact (linear) value c·V, so
        // |c(2V) − 2·c(V)| ≤ 1 + 2·1 = 3 (a mixed tank's species split can use all of it).
        expect(Math.abs(two - 2 * one)).toBeLessThanOrEqual(3);
        const pond = carryingCapacityFish(tank({ tankType: "earthen", surfaceAreaM2: volume, harvestG, tilapiaShare: share }));
        const pond2 = carryingCapacityFish(tank({ tankType: "earthen", surfaceAreaM2: 2 * volume, harvestG, tilapiaShare: share }));
        expect(Math.abs(pond2 - 2 * pond)).toBeLessThanOrEqual(3);
      }),
    );
  });

  it("a species mix carries between what each species alone carries", () => {
    const tilapiaOnly = carryingCapacityFish(tank({ tilapiaShare: 1 }));
    const catfishOnly = carryingCapacityFish(tank({ tilapiaShare: 0 }));
    const mix = carryingCapacityFish(tank({ tilapiaShare: 0.5 }));
    expect(mix).toBeLessThanOrEqual(Math.max(tilapiaOnly, catfishOnly));
    expect(mix).toBeGreaterThanOrEqual(Math.min(tilapiaOnly, catfishOnly));
  });

  it("splitting keeps every fish", () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 1_000_000 }), fc.double({ min: 0, max: 1, noNaN: true }), (total, share) => {
        const split = splitBySpecies(total, { tilapia: share, catfish: 1 - share });
        expect(split.tilapia + split.catfish).toBe(total);
        expect(split.tilapia).toBeGreaterThanOrEqual(0);
        expect(split.catfish).toBeGreaterThanOrEqual(0);
      }),
    );
  });
});

describe("fingerlings to order", () => {
  it("covers quarantine losses with the fewest fish: ordered × survival ≥ stocked, one fewer would not", () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 2_000_000 }), fc.double({ min: 0.1, max: 1, noNaN: true }), (stocked, survival) => {
        const order = fingerlingsToOrder(stocked, survival);
        expect(order * survival).toBeGreaterThanOrEqual(stocked - 1e-6);
        if (stocked > 0) expect((order - 1) * survival).toBeLessThan(stocked);
      }),
    );
  });

  it("does not round 19 ÷ 0.95 = 20.000000000000004 up to 21", () => {
    expect(fingerlingsToOrder(19, 0.95)).toBe(20);
    expect(fingerlingsToOrder(561, 0.95)).toBe(591); // 561 / 0.95 = 590.53 → 591
  });
});
