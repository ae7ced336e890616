import { describe, expect, it } from "vitest";
import { canChangePlan } from "./plan-access";

// The rule is the (issue 6: "PUT/DELETE owner only, 403 otherwise"), not a computation with an outside source.
describe("canChangePlan", () => {
  const plan = { ownerId: "farmer-1" };

  it("lets the owner change their plan", () => {
    expect(canChangePlan({ id: "farmer-1", roles: ["farmer"] }, plan)).toBe(true);
  });

  it("refuses another farmer, an admin and a signed-out visitor", () => {
    expect(canChangePlan({ id: "farmer-2", roles: ["farmer"] }, plan)).toBe(false);
    expect(canChangePlan({ id: "admin-1", roles: ["admin", "farmer"] }, plan)).toBe(false);
    expect(canChangePlan(null, plan)).toBe(false);
  });

  it("still lets the owner change it after their farmer role is gone (they may always delete their own data)", () => {
    expect(canChangePlan({ id: "farmer-1", roles: [] }, plan)).toBe(true);
  });
});
