import { describe, expect, it } from "vitest";
import { onboardingSchema, phoneSchema } from "./profile";

describe("phone numbers in E.164 form", () => {
  // ITU-T Recommendation E.164: a leading +, a country code that does not start with 0, at most 15 digits in all.
  it("accepts international numbers and strips what people type between digits", () => {
    expect(phoneSchema.parse("+260 97 123 4567")).toBe("+260971234567");
    expect(phoneSchema.parse("+44 (20) 7946-0958")).toBe("+442079460958");
    expect(phoneSchema.parse("+1.415.555.0100")).toBe("+14155550100");
  });
  it("refuses local forms, a leading zero country code and over-long numbers", () => {
    for (const bad of ["0971234567", "+0971234567", "+2609712345678901", "260971234567", "+26097abc4567"]) {
      expect(phoneSchema.safeParse(bad).success, bad).toBe(false);
    }
  });
});

describe("onboarding input", () => {
  const base = { displayName: "Kafue Tanks", region: "Lusaka" };
  it("lets a farmer skip phone and location", () => {
    expect(onboardingSchema.safeParse({ ...base, roles: ["farmer"] }).success).toBe(true);
  });
  it("requires a provider's phone and location, naming the fields", () => {
    const r = onboardingSchema.safeParse({ ...base, roles: ["builder"] });
    expect(r.success).toBe(false);
    const paths = r.error?.issues.map((i) => i.path.join("."));
    expect(paths).toEqual(expect.arrayContaining(["phone", "lat"]));
  });
  it("refuses admin as a self-chosen role and out-of-range coordinates", () => {
    expect(onboardingSchema.safeParse({ ...base, roles: ["admin"] }).success).toBe(false);
    const r = onboardingSchema.safeParse({ ...base, roles: ["hatchery"], phone: "+260971234567", lat: -91, lng: 181 });
    expect(r.error?.issues.map((i) => i.path.join("."))).toEqual(expect.arrayContaining(["lat", "lng"]));
  });
  it("needs both coordinates or neither", () => {
    expect(onboardingSchema.safeParse({ ...base, roles: ["farmer"], lat: -15 }).success).toBe(false);
  });
});
