import { priceQuote, type PricedQuote, type QuoteInput } from "@/lib/jobs/quote";
import { minorDigits } from "@/lib/money/money";
import type { QuoteFormOutput } from "@/lib/validations/quotes";
import { parseDecimal } from "@/lib/validations/tank-size";

/*
 * From what a builder typed to a priced quote (lib/jobs/quote.ts). Amounts are decimal strings in the builder's
 * currency; they become integer minor units by the currency's ISO 4217 exponent, read digit by digit so no binary
 * fraction can move a price by a minor unit.
 */

/** "450.5" in ZMW (2 digits) → 45 050; null when the text has more decimals than the currency has. */
export function amountToMinor(text: string, currency: string): number | null {
  const match = /^(\d+)(?:[.,](\d+))?$/.exec(text.trim());
  if (!match) return null;
  const digits = minorDigits(currency);
  const whole = match[1] ?? "0";
  const fraction = match[2] ?? "";
  if (fraction.length > digits) return null;
  const minor = Number(whole + fraction.padEnd(digits, "0"));
  return Number.isSafeInteger(minor) ? minor : null;
}

/** Minor units back to the text a form shows: 45 050 in ZMW → "450.50"; 1200 in JPY → "1200". */
export function minorToAmount(minor: number, currency: string): string {
  const digits = minorDigits(currency);
  if (digits === 0) return String(minor);
  const text = String(minor).padStart(digits + 1, "0");
  return `${text.slice(0, -digits)}.${text.slice(-digits)}`;
}

export type BuilderTerms = { currency: string; baseFeeMinor: number; travelRatePerKmMinor: number };

export type PricingResult = { ok: true; input: QuoteInput; priced: PricedQuote } | { ok: false; fieldErrors: Record<string, string[]> };

/**
 * Prices a quote form for a site `distanceM` away (straight line from the builder's base). Travel is always the
 * computed line: distance × the builder's rate per km, never a typed amount.
 */
export function priceQuoteForm(form: QuoteFormOutput, terms: BuilderTerms, distanceM: number): PricingResult {
  const fieldErrors: Record<string, string[]> = {};
  const digits = minorDigits(terms.currency);
  const lines = form.lines.map((line, i) => {
    const unitPriceMinor = amountToMinor(line.unitPrice, terms.currency);
    if (unitPriceMinor === null) {
      fieldErrors[`lines.${i}.unitPrice`] = [digits === 0 ? `${terms.currency} has no decimals: enter a whole amount` : `${terms.currency} has ${digits} decimals at most`];
    }
    return { kind: line.kind, description: line.description, quantity: parseDecimal(line.quantity), unitPriceMinor: unitPriceMinor ?? 0 };
  });
  if (Object.keys(fieldErrors).length) return { ok: false, fieldErrors };
  const input: QuoteInput = {
    currency: terms.currency,
    lines,
    travel: terms.travelRatePerKmMinor > 0 ? { distanceM, ratePerKmMinor: terms.travelRatePerKmMinor } : null,
    baseServiceFeeMinor: terms.baseFeeMinor,
    farmerSuppliesMaterials: form.scope === "farmer_supplies_materials",
  };
  return { ok: true, input, priced: priceQuote(input) };
}
