import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { defaultPlanInput, planInputSchema, type PlanInput } from "@/lib/validations/planner";
import { acceptedPlanInput, numberLeaves, type NumberLeaf } from "./plan-input-arbitrary";
import { feetToMetres } from "./units";

/** The words each field's messages must carry, so a refusal names the field. */
const FIELD_LABELS: Record<string, string> = {
  "tank.dimensions.lengthM": "Tank length",
  "tank.dimensions.widthM": "Tank width",
  "tank.dimensions.diameterM": "Tank diameter",
  "tank.waterDepthM": "Water depth",
  "tank.freeboardM": "Freeboard",
  "tank.buildCostOverrideMinor": "Tank build cost",
  "tank.lifeYears": "Tank life",
  "tilapia.stockingWeightG": "Tilapia stocking weight",
  "tilapia.targetHarvestWeightG": "Tilapia target harvest weight",
  "tilapia.fingerlingPriceMinor": "Tilapia fingerling price",
  "tilapia.salePricePerKgMinor": "Tilapia sale price per kg",
  "tilapia.fcr": "Tilapia FCR",
  "catfish.stockingWeightG": "Catfish stocking weight",
  "catfish.targetHarvestWeightG": "Catfish target harvest weight",
  "catfish.fingerlingPriceMinor": "Catfish fingerling price",
  "catfish.salePricePerKgMinor": "Catfish sale price per kg",
  "catfish.fcr": "Catfish FCR",
  tilapiaShareOfFishFraction: "Tilapia share of the fish",
  fishToStock: "Fish to stock",
  growOutSurvivalFraction: "Grow-out survival",
  quarantineSurvivalFraction: "Quarantine survival",
  waterTemperatureC: "Water temperature",
  feedPricePerKgMinor: "Feed price per kg",
  "waterChange.intervalDays": "Water-change interval",
  "waterChange.fractionExchanged": "Share of water exchanged",
  "pump.headM": "Pump head",
  "pump.efficiencyFraction": "Pump efficiency",
  "pump.electricityTariffPerKWhMinor": "Electricity tariff per kWh",
  labourCostPerCycleMinor: "Labour cost per cycle",
};

const leaves = numberLeaves();

/** A copy of the default plan with one number replaced, on the right branch of the tank-shape union. */
function withValue(leaf: NumberLeaf, value: unknown): unknown {
  const plan: Record<string, unknown> = structuredClone(defaultPlanInput);
  if (leaf.branch["tank.dimensions"] === "round") (plan.tank as Record<string, unknown>).dimensions = { shape: "round", diameterM: 2 };
  let target = plan;
  for (const key of leaf.path.slice(0, -1)) target = target[key] as Record<string, unknown>;
  const field = leaf.path[leaf.path.length - 1] ?? "";
  target[field] = value;
  // Keep the cross-field rule (target above stocking weight) out of the way of the one number under test.
  if (field === "targetHarvestWeightG") target.stockingWeightG = 0.5;
  return plan;
}

function issuesAt(input: unknown, path: string): string[] {
  const result = planInputSchema.safeParse(input);
  if (result.success) return [];
  return result.error.issues.filter((issue) => issue.path.join(".") === path).map((issue) => issue.message);
}

describe("planInputSchema accepts the defaults", () => {
  it("parses the default plan unchanged", () => {
    expect(planInputSchema.parse(defaultPlanInput)).toEqual(defaultPlanInput);
  });

  it("the default tank is 6 ft × 10 ft, converted with 1 ft = 0.3048 m", () => {
    // NBS 1959 foot (REFERENCE-VALUES 10.2).
    expect(defaultPlanInput.tank.dimensions).toEqual({ shape: "rectangular", lengthM: feetToMetres(10), widthM: feetToMetres(6) });
    expect(defaultPlanInput.currency).toBe("ZMW");
  });

  it("accepts a round tank with no length or width, and leaves the overrides out", () => {
    const round: Record<string, unknown> = structuredClone(defaultPlanInput);
    round.tank = { ...defaultPlanInput.tank, dimensions: { shape: "round", diameterM: 3 }, buildCostOverrideMinor: undefined, lifeYears: undefined };
    delete round.fishToStock;
    expect(planInputSchema.safeParse(round).success).toBe(true);
  });
});

describe("planInputSchema refuses out-of-range input, naming the field", () => {
  it("has a label for every bounded number in the schema", () => {
    expect(leaves.map((l) => l.path.join(".")).sort()).toEqual(Object.keys(FIELD_LABELS).sort());
  });

  it.each(leaves.map((leaf) => [leaf.path.join("."), leaf] as const))("%s: below the minimum, above the maximum, not a number", (path, leaf) => {
    const label = FIELD_LABELS[path] ?? "(missing label)";
    const span = leaf.maximum - leaf.minimum;
    for (const bad of [leaf.minimum - Math.max(1e-6, span * 1e-3), leaf.maximum + Math.max(1e-6, span * 1e-3)]) {
      // A bad value may break a second rule too (a whole number, target above stocking); every message names the field.
      const messages = issuesAt(withValue(leaf, bad), path);
      expect(messages[0], `${path} = ${bad}`).toMatch(new RegExp(`^${label} must be between`));
      for (const message of messages) expect(message).toContain(label);
    }
    expect(issuesAt(withValue(leaf, "3"), path)).toEqual([`${label} must be a number`]);
    expect(issuesAt(withValue(leaf, Number.POSITIVE_INFINITY), path)[0]).toContain(label);
    expect(issuesAt(withValue(leaf, Number.NaN), path)[0]).toContain(label);
    // Both ends are allowed.
    expect(issuesAt(withValue(leaf, leaf.minimum), path)).toEqual([]);
    expect(issuesAt(withValue(leaf, leaf.maximum), path)).toEqual([]);
  });

  it("states the unit in the range message, e.g. water depth in metres", () => {
    const leaf = leaves.find((l) => l.path.join(".") === "tank.waterDepthM");
    expect(leaf).toBeDefined();
    if (leaf) expect(issuesAt(withValue(leaf, 5), "tank.waterDepthM")).toEqual(["Water depth must be between 0.2 and 3 m"]);
  });

  it("refuses fractions of a whole-number field", () => {
    for (const leaf of leaves.filter((l) => l.integer)) {
      const path = leaf.path.join(".");
      expect(issuesAt(withValue(leaf, leaf.minimum + 0.5), path)).toEqual([`${FIELD_LABELS[path]} must be a whole number`]);
    }
  });

  it("any number outside a field's range is refused with that field's name", () => {
    fc.assert(
      fc.property(fc.constantFrom(...leaves), fc.boolean(), fc.double({ min: 1e-6, max: 1e9, noNaN: true }), (leaf, below, step) => {
        const bad = below ? leaf.minimum - step : leaf.maximum + step;
        fc.pre(bad < leaf.minimum || bad > leaf.maximum); // a tiny step can vanish next to 10¹²
        const path = leaf.path.join(".");
        const messages = issuesAt(withValue(leaf, bad), path);
        expect(messages.length).toBeGreaterThan(0);
        expect(messages[0]).toContain(FIELD_LABELS[path]);
      }),
      { numRuns: 200 },
    );
  });
});

describe("planInputSchema: choices and cross-field rules", () => {
  const refused = (patch: (plan: Record<string, unknown>) => void, path: string) => {
    const plan: Record<string, unknown> = structuredClone(defaultPlanInput);
    patch(plan);
    return issuesAt(plan, path);
  };

  it("names the field for a bad choice or a bad currency code", () => {
    expect(refused((p) => ((p.tank as Record<string, unknown>).type = "glass"), "tank.type")).toEqual(["Tank type must be one of: tarpaulin, concrete, earthen"]);
    expect(refused((p) => (p.species = "carp"), "species")).toEqual(["Species must be one of: tilapia, catfish, both"]);
    expect(refused((p) => ((p.tank as Record<string, unknown>).dimensions = { shape: "oval" }), "tank.dimensions.shape")).toEqual(["Tank shape must be one of: rectangular, round"]);
    expect(refused((p) => ((p.tank as Record<string, unknown>).linerColour = "pink"), "tank.linerColour")[0]).toContain("Liner colour");
    expect(refused((p) => ((p.tank as Record<string, unknown>).sunExposure = "night"), "tank.sunExposure")[0]).toContain("Sun exposure");
    expect(refused((p) => (p.catfishShadeProvided = "yes"), "catfishShadeProvided")[0]).toContain("Shade for catfish");
    // ISO 4217 alphabetic codes are three capital letters.
    for (const code of ["zmw", "ZM", "ZMWK", "Z1W"]) expect(refused((p) => (p.currency = code), "currency")[0]).toContain("ISO 4217");
  });

  it("a round tank needs its diameter, a rectangular one its length and width", () => {
    expect(refused((p) => ((p.tank as Record<string, unknown>).dimensions = { shape: "round" }), "tank.dimensions.diameterM")[0]).toContain("Tank diameter");
    expect(refused((p) => ((p.tank as Record<string, unknown>).dimensions = { shape: "rectangular", lengthM: 2 }), "tank.dimensions.widthM")[0]).toContain("Tank width");
  });

  it("the target harvest weight must exceed the stocking weight, for the species in the tank only", () => {
    const heavyStart = (species: PlanInput["species"], fish: "tilapia" | "catfish") => (p: Record<string, unknown>) => {
      p.species = species;
      (p[fish] as Record<string, unknown>).stockingWeightG = 400;
      (p[fish] as Record<string, unknown>).targetHarvestWeightG = 300;
    };
    expect(refused(heavyStart("tilapia", "tilapia"), "tilapia.targetHarvestWeightG")).toEqual(["Tilapia target harvest weight must be more than its stocking weight"]);
    expect(refused(heavyStart("both", "catfish"), "catfish.targetHarvestWeightG")).toEqual(["Catfish target harvest weight must be more than its stocking weight"]);
    expect(refused(heavyStart("tilapia", "catfish"), "catfish.targetHarvestWeightG")).toEqual([]);
  });

  it("a missing group is refused by name", () => {
    expect(refused((p) => delete p.pump, "pump")[0]).toContain("Pump");
    expect(refused((p) => delete p.tank, "tank")[0]).toContain("Tank");
  });

  it("everything drawn from the schema's own bounds parses back to itself", () => {
    fc.assert(
      fc.property(acceptedPlanInput, (plan) => {
        expect(planInputSchema.parse(plan)).toEqual(plan);
      }),
      { numRuns: 100 },
    );
  });
});
