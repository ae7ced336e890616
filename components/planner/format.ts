import { formatMoney } from "@/lib/money/money";
import { metresToFeet } from "@/lib/planner/units";

/*
 * Number formats of the planner's figures. Fixed locales ("en", and lib/money's "en-ZM" for money) so the server's HTML and the browser's render agree,
 * and figures read the same on every phone.
 */

const formats = new Map<string, Intl.NumberFormat>();

function numberFormat(min: number, max: number): Intl.NumberFormat {
  const key = `${min}-${max}`;
  let f = formats.get(key);
  if (!f) {
    f = new Intl.NumberFormat("en", { minimumFractionDigits: min, maximumFractionDigits: max });
    formats.set(key, f);
  }
  return f;
}

/** At most `digits` decimals: 5.5741824 → "5.57", 1500 → "1,500". */
export function num(value: number, digits = 0): string {
  return numberFormat(0, digits).format(value);
}

/** Exactly `digits` decimals: 9.80665 → "9.81". */
export function fixed(value: number, digits: number): string {
  return numberFormat(digits, digits).format(value);
}

/** Two significant figures for small values, whole numbers above 100: enough for a figure read at a glance. */
export function approx(value: number): string {
  const abs = Math.abs(value);
  if (abs >= 100) return num(value, 0);
  if (abs >= 10) return num(value, 1);
  return num(value, 2);
}

export function money(minor: number, currency: string): string {
  return formatMoney(minor, currency);
}

/** The currency's symbol as a price field shows it ("K" for ZMW), or the code while it is not a valid one. */
export function currencySymbol(currency: string): string {
  if (!/^[A-Z]{3}$/.test(currency)) return currency;
  const part = new Intl.NumberFormat("en-ZM", { style: "currency", currency }).formatToParts(0).find((p) => p.type === "currency");
  return part?.value ?? currency;
}

/** A length in metres with its feet beside it: "3.05 m (10 ft)". */
export function lengthBoth(metres: number): string {
  return `${num(metres, 2)} m (${num(metresToFeet(metres), 1)} ft)`;
}

export function percent(fraction: number, digits = 0): string {
  return `${num(fraction * 100, digits)} %`;
}
