import { describe, expect, it } from "vitest";
import { shortPersonName } from "./subjects";

// The reviews contract: authors show as "Given-name S.", never the full surname or the e-mail.
describe("shortPersonName", () => {
  it("keeps the given name and the surname's initial", () => {
    expect(shortPersonName("Chanda Mwale")).toBe("Chanda M.");
    expect(shortPersonName("  Mary   Jane  Banda ")).toBe("Mary B.");
    expect(shortPersonName("thandiwe phiri")).toBe("thandiwe P.");
  });

  it("shows a single name as it is, and nothing as 'A farmer'", () => {
    expect(shortPersonName("Mutale")).toBe("Mutale");
    expect(shortPersonName("   ")).toBe("A farmer");
  });
});
