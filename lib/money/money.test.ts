import { describe, expect, it } from "vitest";
import { formatMoney, isCurrencyCode, minorDigits, toMajor, toMinor } from "./money";

describe("money in minor units", () => {
  // ISO 4217 minor-unit column (from memory, matches the Intl/CLDR data): JPY 0, USD 2, ZMW 2, BHD 3.
  it("reads the minor digits of a currency from ISO 4217 data", () => {
    expect(minorDigits("JPY")).toBe(0);
    expect(minorDigits("USD")).toBe(2);
    expect(minorDigits("ZMW")).toBe(2);
    expect(minorDigits("BHD")).toBe(3);
  });

  it("converts without binary floating-point drift", () => {
    expect(toMinor(1.005, "USD")).toBe(101); // 1.005 * 100 is 100.49999999999999 in IEEE 754 doubles
    expect(toMinor(0.1 + 0.2, "ZMW")).toBe(30);
    expect(toMinor(1234, "JPY")).toBe(1234);
    expect(toMinor(1.2345, "BHD")).toBe(1235);
    expect(toMajor(12_345, "ZMW")).toBe(123.45);
  });

  it("formats with Intl.NumberFormat", () => {
    // Expected strings built by Intl itself in another locale path, so the check is of our scaling, not of CLDR.
    expect(formatMoney(123_456, "USD", "en-US")).toBe(new Intl.NumberFormat("en-US", { style: "currency", currency: "USD" }).format(1234.56));
    expect(formatMoney(500, "JPY", "en-US")).toBe("¥500");
  });

  it("accepts only ISO 4217 codes", () => {
    expect(isCurrencyCode("ZMW")).toBe(true);
    expect(isCurrencyCode("zmw")).toBe(false);
    expect(isCurrencyCode("XYZQ")).toBe(false);
  });
});
