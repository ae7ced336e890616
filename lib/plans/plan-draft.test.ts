import { describe, expect, it } from "vitest";
import { defaultPlanInput, planInputSchema, type PlanInput } from "@/lib/validations/planner";
import { schemaBounds, type NumberFieldPath } from "./draft-fields";
import { draftErrors } from "./draft-messages";
import { draftToCandidate, inputToDraft, parseTypedNumber, planDraftSchema, suggestPlanName, withLengthUnit, withNumber, type PlanDraft } from "./plan-draft";

function parse(draft: PlanDraft) {
  return planInputSchema.safeParse(draftToCandidate(draft));
}

function withText(draft: PlanDraft, changes: Partial<PlanDraft["numbers"]>): PlanDraft {
  let out = draft;
  for (const [path, text] of Object.entries(changes)) out = withNumber(out, path as NumberFieldPath, text ?? "");
  return out;
}

describe("the planner form converts at its edge", () => {
  it("a 10 ft × 6 ft tank typed in feet is 3.048 m × 1.8288 m (1 ft = 0.3048 m exactly: NBS 1959 international foot, REFERENCE-VALUES 10.2)", () => {
    const draft = withText({ ...inputToDraft(defaultPlanInput, "ft") }, { "tank.dimensions.lengthM": "10", "tank.dimensions.widthM": "6", "tank.waterDepthM": "3" });
    const parsed = parse(draft);
    expect(parsed.success).toBe(true);
    if (!parsed.success || parsed.data.tank.dimensions.shape !== "rectangular") throw new Error("expected a rectangular tank");
    expect(parsed.data.tank.dimensions.lengthM).toBe(3.048);
    expect(parsed.data.tank.dimensions.widthM).toBe(1.8288);
    // 3 ft = 0.9144 m, the yard (NBS 1959 definition: 1 yd = 0.9144 m).
    expect(parsed.data.tank.waterDepthM).toBeCloseTo(0.9144, 12);
  });

  it("prices typed in kwacha become ngwee: ZMW has 2 minor digits, JPY none (ISO 4217 minor-unit column)", () => {
    const zmw = parse(withText(inputToDraft(defaultPlanInput), { feedPricePerKgMinor: "18.5" }));
    expect(zmw.success && zmw.data.feedPricePerKgMinor).toBe(1850);
    const jpy = parse({ ...withText(inputToDraft(defaultPlanInput), { feedPricePerKgMinor: "250" }), currency: "JPY" });
    expect(jpy.success && jpy.data.feedPricePerKgMinor).toBe(250);
  });

  it("shares typed in % become fractions (85 % = 0.85)", () => {
    const parsed = parse(withText(inputToDraft(defaultPlanInput), { growOutSurvivalFraction: "85", "pump.efficiencyFraction": "40" }));
    expect(parsed.success && parsed.data.growOutSurvivalFraction).toBe(0.85);
    expect(parsed.success && parsed.data.pump.efficiencyFraction).toBe(0.4);
  });

  it("the default plan survives a trip through the form unchanged, in metres and in feet", () => {
    for (const unit of ["m", "ft"] as const) {
      const parsed = parse(inputToDraft(defaultPlanInput, unit));
      expect(parsed.success).toBe(true);
      if (!parsed.success) return;
      const back: PlanInput = parsed.data;
      expect(back.tank.dimensions).toEqual(defaultPlanInput.tank.dimensions);
      expect({ ...back, tank: { ...back.tank, dimensions: null } }).toEqual({ ...defaultPlanInput, tank: { ...defaultPlanInput.tank, dimensions: null } });
    }
  });

  it("switching the unit rewrites the lengths: 3.048 m shows as 10 ft and back", () => {
    const metres = inputToDraft(defaultPlanInput, "m");
    expect(metres.numbers["tank.dimensions.lengthM"]).toBe("3.048");
    const feet = withLengthUnit(metres, "ft");
    expect(feet.numbers["tank.dimensions.lengthM"]).toBe("10");
    expect(feet.numbers["tank.dimensions.widthM"]).toBe("6");
    // 1 m = 1 / 0.3048 ft = 3.28084 ft (exact definition above), shown to four decimals.
    expect(feet.numbers["tank.waterDepthM"]).toBe("3.2808");
    expect(withLengthUnit(feet, "m").numbers["tank.waterDepthM"]).toBe("1");
    // The rounded text does not move the figures: the exact metres are kept until the field is retyped.
    const parsed = parse(feet);
    expect(parsed.success && parsed.data.tank.waterDepthM).toBe(1);
    const retyped = parse(withText(feet, { "tank.waterDepthM": "3.2808" }));
    expect(retyped.success && retyped.data.tank.waterDepthM).toBeCloseTo(3.2808 * 0.3048, 12);
    // Only lengths change: a pump head stays in metres, a price stays as typed.
    expect(feet.numbers["pump.headM"]).toBe(metres.numbers["pump.headM"]);
  });

  it("reads what people type: spaces, thousands commas and a decimal comma", () => {
    expect(parseTypedNumber(" 1 500 ")).toBe(1500);
    expect(parseTypedNumber("1,500")).toBe(1500);
    expect(parseTypedNumber("0,85")).toBe(0.85);
    expect(parseTypedNumber("2,5")).toBe(2.5);
    expect(parseTypedNumber("")).toBeNull();
    expect(parseTypedNumber("ten")).toBeNaN();
    expect(parseTypedNumber("1.2.3")).toBeNaN();
  });
});

describe("form messages name the field in the units shown", () => {
  it("the schema's range is read from planInputSchema (water depth 0.2 to 3 m, as lib/validations/planner.ts declares)", () => {
    expect(schemaBounds("tank.waterDepthM")).toEqual({ min: 0.2, max: 3, whole: false });
    expect(schemaBounds("waterChange.intervalDays")).toMatchObject({ min: 1, max: 365, whole: true });
  });

  it("a depth out of range in feet is stated in feet: 0.2 m = 0.66 ft, 3 m = 9.84 ft (÷ 0.3048)", () => {
    const draft = withText(inputToDraft(defaultPlanInput, "ft"), { "tank.waterDepthM": "20" });
    const parsed = parse(draft);
    expect(parsed.success).toBe(false);
    if (parsed.success) return;
    expect(draftErrors(draft, parsed.error.issues, "K")["tank.waterDepthM"]).toBe("Water depth must be between 0.66 and 9.84 ft");
  });

  it("a survival out of range is stated in %, a price in K, an empty field asks for it", () => {
    const draft = withText(inputToDraft(defaultPlanInput), { growOutSurvivalFraction: "120", feedPricePerKgMinor: "-1", "pump.headM": "" });
    const parsed = parse(draft);
    expect(parsed.success).toBe(false);
    if (parsed.success) return;
    const errors = draftErrors(draft, parsed.error.issues, "K");
    expect(errors.growOutSurvivalFraction).toBe("Grow-out survival must be between 10 and 100 %");
    expect(errors.feedPricePerKgMinor).toBe("Feed price per kg must be between K0 and K1,000,000");
    expect(errors["pump.headM"]).toBe("Enter the pump head (height lifted)");
  });

  it("a rule between fields keeps the schema's own words", () => {
    const draft = withText(inputToDraft(defaultPlanInput), { "tilapia.targetHarvestWeightG": "5" });
    const parsed = parse(draft);
    if (parsed.success) throw new Error("expected a refusal");
    expect(draftErrors(draft, parsed.error.issues, "K")["tilapia.targetHarvestWeightG"]).toBe("Tilapia target harvest weight must be more than its stocking weight");
  });
});

describe("drafts kept on the device", () => {
  it("a stored draft is checked before use, and a tampered one refused", () => {
    const draft = inputToDraft(defaultPlanInput);
    expect(planDraftSchema.safeParse(JSON.parse(JSON.stringify(draft))).success).toBe(true);
    expect(planDraftSchema.safeParse({ ...draft, tankType: "glass" }).success).toBe(false);
    expect(planDraftSchema.safeParse({ ...draft, numbers: { ...draft.numbers, "tank.waterDepthM": 1 } }).success).toBe(false);
  });

  it("suggests a name from the tank and the fish", () => {
    expect(suggestPlanName(defaultPlanInput)).toBe("Tarpaulin tank 3.05 m × 1.83 m, Nile tilapia");
  });
});
