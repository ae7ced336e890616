/**
 * Money is held as integer minor units with an ISO 4217 code. The number of minor
 * digits comes from the platform's Intl data (ISO 4217's minor-unit column), so
 * JPY has 0, ZMW and USD 2, BHD 3.
 */
export function minorDigits(currency: string): number {
  return new Intl.NumberFormat("en", { style: "currency", currency }).resolvedOptions().maximumFractionDigits ?? 2;
}

export function toMinor(major: number, currency: string): number {
  const factor = 10 ** minorDigits(currency);
  // Round half away from zero on the scaled value; toFixed guards against 1.005 * 100 = 100.49999.
  return Math.round(Number((major * factor).toFixed(6)));
}

export function toMajor(minor: number, currency: string): number {
  return minor / 10 ** minorDigits(currency);
}

export function formatMoney(minor: number, currency: string, locale = "en-ZM"): string {
  const digits = minorDigits(currency);
  return new Intl.NumberFormat(locale, { style: "currency", currency, minimumFractionDigits: digits, maximumFractionDigits: digits }).format(
    toMajor(minor, currency),
  );
}

export function isCurrencyCode(code: string): boolean {
  if (!/^[A-Z]{3}$/.test(code)) return false;
  try {
    return Intl.supportedValuesOf("currency").includes(code);
  } catch {
    return false;
  }
}
