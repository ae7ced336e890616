import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { estimatePlan } from "./estimate";
import type { PlanEstimate } from "./plan-estimate";
import { acceptedPlanInput } from "./plan-input-arbitrary";

/** Figures that are differences, so may rightly be negative: a loss, or a harvest lighter than the fish stocked. */
const SIGNED = new Set(["marginMinor", "biomassGainKg"]);

function numbersIn(value: unknown, path: string, out: [string, number][]): [string, number][] {
  if (typeof value === "number") out.push([path, value]);
  else if (Array.isArray(value)) value.forEach((item, i) => numbersIn(item, `${path}[${i}]`, out));
  else if (value && typeof value === "object") for (const [key, child] of Object.entries(value)) numbersIn(child, path ? `${path}.${key}` : key, out);
  return out;
}

const lastKey = (path: string) => path.replace(/\[\d+\]$/, "").split(".").pop() ?? "";

/** Every figure that breaks a rule, as "path = value (rule)"; collected so one assertion reports them all. */
function badFigures(estimate: PlanEstimate): string[] {
  const bad: string[] = [];
  for (const [path, value] of numbersIn(estimate, "", [])) {
    const key = lastKey(path);
    if (!Number.isFinite(value)) bad.push(`${path} = ${value} (not finite)`);
    else if (value < 0 && !SIGNED.has(key)) bad.push(`${path} = ${value} (negative)`);
    else if (key.endsWith("Minor") && !Number.isInteger(value)) bad.push(`${path} = ${value} (not whole minor units)`);
  }
  for (const { message } of [...estimate.warnings, ...estimate.cautions]) if (/NaN|Infinity|undefined/.test(message)) bad.push(`message: ${message}`);
  return bad;
}

describe("estimatePlan on any input the schema accepts", () => {
  it("never throws, and gives finite, non-negative figures with whole minor units", () => {
    fc.assert(
      fc.property(acceptedPlanInput, (input) => {
        expect(badFigures(estimatePlan(input))).toEqual([]);
      }),
      { numRuns: 100 },
    );
  });

  it("keeps its own books: feed = FCR × gain, orders cover quarantine, capacity fits the limit, costs add up", () => {
    fc.assert(
      fc.property(acceptedPlanInput, (input) => {
        const e = estimatePlan(input);
        for (const s of e.species) {
          expect(s.feedKg).toBeCloseTo(input[s.species].fcr * Math.max(0, s.biomassGainKg), 6);
          expect(s.fishToOrder * input.quarantineSurvivalFraction).toBeGreaterThanOrEqual(s.fishStocked - 1e-6);
        }
        if (input.fishToStock === null || input.fishToStock === undefined) expect(e.stocking.occupancyFraction).toBeLessThanOrEqual(1 + 1e-9);
        const c = e.costs;
        expect(c.totalMinor).toBe(c.tankAmortisationMinor + c.fingerlingsMinor + c.feedMinor + c.electricityMinor + c.labourMinor);
        expect(e.economics.breakEvenPricePerKgMinor === null).toBe(!(e.cycle.harvestKg > 0));
        expect(e.tankComparison.filter((r) => r.isCurrent)).toHaveLength(1);
      }),
      { numRuns: 100 },
    );
  });
});
