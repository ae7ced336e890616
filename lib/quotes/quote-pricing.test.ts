import { describe, expect, it } from "vitest";
import { amountToMinor, minorToAmount, priceQuoteForm } from "./quote-pricing";

// Minor-unit exponents from ISO 4217's list (ZMW 2, JPY 0, BHD 3); amounts worked by hand beside each check.
describe("typed amounts to minor units, digit by digit", () => {
  it("scales by the currency's exponent without binary rounding", () => {
    expect(amountToMinor("450.5", "ZMW")).toBe(45_050);
    expect(amountToMinor("0.29", "ZMW")).toBe(29); // 0.29 × 100 is 28.999999999999996 in doubles
    expect(amountToMinor("1,25", "ZMW")).toBe(125); // a decimal comma, as many phones type it
    expect(amountToMinor("1200", "JPY")).toBe(1200);
    expect(amountToMinor("1.234", "BHD")).toBe(1234);
  });

  it("refuses more decimals than the currency has, and text that is not an amount", () => {
    expect(amountToMinor("10.005", "ZMW")).toBeNull();
    expect(amountToMinor("5.5", "JPY")).toBeNull();
    expect(amountToMinor("-5", "ZMW")).toBeNull();
    expect(amountToMinor("5e3", "ZMW")).toBeNull();
  });

  it("shows minor units back as the form types them", () => {
    expect(minorToAmount(45_050, "ZMW")).toBe("450.50");
    expect(minorToAmount(5, "ZMW")).toBe("0.05");
    expect(minorToAmount(1200, "JPY")).toBe("1200");
    expect(amountToMinor(minorToAmount(987_654_321, "BHD"), "BHD")).toBe(987_654_321);
  });
});

describe("a quote form priced for a site", () => {
  const terms = { currency: "ZMW", baseFeeMinor: 10_000, travelRatePerKmMinor: 1_250 };
  it("adds the travel line from the distance, never from a typed line", () => {
    const r = priceQuoteForm({ scope: "turnkey", note: "", lines: [{ kind: "labour", description: "Build", quantity: "2", unitPrice: "300" }] }, terms, 8_400.4);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    // 8 400 m (rounded to whole metres) × ZMW 12.50 / km = 105.00; labour 2 × 300.00 = 600.00; fee 100.00.
    expect(r.priced.travelMinor).toBe(10_500);
    expect(r.priced.totalMinor).toBe(80_500);
  });

  it("names the line whose price has too many decimals", () => {
    const r = priceQuoteForm({ scope: "turnkey", note: "", lines: [{ kind: "labour", description: "A", quantity: "1", unitPrice: "1" }, { kind: "other", description: "B", quantity: "1", unitPrice: "2.555" }] }, terms, 0);
    expect(r).toEqual({ ok: false, fieldErrors: { "lines.1.unitPrice": ["ZMW has 2 decimals at most"] } });
  });

  it("leaves the travel line out when the builder charges no travel", () => {
    const r = priceQuoteForm({ scope: "turnkey", note: "", lines: [{ kind: "labour", description: "A", quantity: "1", unitPrice: "1" }] }, { ...terms, travelRatePerKmMinor: 0 }, 5_000);
    expect(r.ok && r.priced.lines.map((l) => l.kind)).toEqual(["labour"]);
  });
});
