import { describe, expect, it } from "vitest";
import { defaultPlanInput } from "@/lib/validations/planner";
import { INPUT_DEFAULT_SOURCES } from "./assumptions";
import { estimatePlan } from "./estimate";

describe("sources of the defaults", () => {
  it("every key names a field of the plan input, so the form can show it beside that field", () => {
    for (const key of Object.keys(INPUT_DEFAULT_SOURCES)) {
      let node: unknown = defaultPlanInput;
      for (const part of key.split(".")) {
        expect(node && typeof node === "object" && part in node, key).toBe(true);
        node = (node as Record<string, unknown>)[part];
      }
    }
  });

  it("every price default is marked as a demo default", () => {
    for (const [key, { confidence }] of Object.entries(INPUT_DEFAULT_SOURCES)) if (/Minor$/.test(key)) expect(confidence, key).toBe("demo default");
  });

  it("the estimate lists the assumptions it used for the tank type and species in play", () => {
    const tank = estimatePlan(defaultPlanInput).assumptions.map((a) => a.key);
    expect(tank).toContain("tank-limit-tilapia");
    expect(tank).toContain("liner-fold-allowance");
    expect(tank).not.toContain("pond-density-tilapia");
    const pond = estimatePlan({ ...defaultPlanInput, species: "both", tank: { ...defaultPlanInput.tank, type: "earthen" } }).assumptions.map((a) => a.key);
    expect(pond).toEqual(expect.arrayContaining(["pond-density-tilapia", "pond-density-catfish", "pond-sides"]));
    expect(pond).not.toContain("liner-fold-allowance");
  });
});
