import type { TankType } from "@/lib/catalog";
import { isCurrencyCode } from "@/lib/money/money";
import { scaleMinor } from "@/lib/payments/ledger";
import { JOB_PARAMETERS } from "./parameters";

/*
 * A builder's quote in integer minor units of one ISO 4217 currency.
 *
 * Rounding rules (each stated once, here):
 * - A quantity is taken to 4 decimal places, half up (0.0001 m² is 1 cm², 0.0001 day under 9 seconds): enough for
 *   any real quantity, and it makes every line exact integer arithmetic.
 * - A line total is quantity × unit price, rounded half up to the minor unit, per line (as on a printed invoice,
 *   so the lines the farmer sees add up to the subtotal).
 * - Travel is the one-way distance from the builder's base to the site, in whole metres (half up), × the rate
 *   per km ÷ 1000, rounded half up to the minor unit. The rate is per km of that distance; a builder who drives
 *   there and back sets the rate to cover both.
 * - The deposit is the total × the deposit share, rounded half up to the minor unit; the balance is the rest.
 * There are no tax lines: how VAT applies to builders is not decided.
 */

export const QUOTE_LINE_KINDS = ["materials", "labour", "travel", "other"] as const;
export type QuoteLineKind = (typeof QUOTE_LINE_KINDS)[number];

export interface QuoteLine {
  kind: QuoteLineKind;
  description: string;
  /** how many units (m², days, trips…); up to 4 decimals count */
  quantity: number;
  unitPriceMinor: number;
}

export interface PricedQuoteLine extends QuoteLine {
  totalMinor: number;
  /** false for materials when the farmer supplies them: shown, not charged */
  included: boolean;
}

export interface QuoteInput {
  currency: string;
  lines: readonly QuoteLine[];
  /** the computed travel line; null when the site is the builder's own yard or travel is not charged */
  travel: { distanceM: number; ratePerKmMinor: number } | null;
  baseServiceFeeMinor: number;
  farmerSuppliesMaterials: boolean;
}

export interface PricedQuote {
  currency: string;
  /** the builder's lines, then the computed travel line */
  lines: PricedQuoteLine[];
  materialsMinor: number;
  labourMinor: number;
  travelMinor: number;
  otherMinor: number;
  /** materials the farmer supplies: priced for reference, left out of the totals */
  excludedMaterialsMinor: number;
  /** all charged lines */
  subtotalMinor: number;
  baseServiceFeeMinor: number;
  /** subtotal + base service fee */
  totalMinor: number;
  /** held when the farmer accepts (JOB_PARAMETERS.depositShareBasisPoints) */
  depositMinor: number;
  /** total − deposit, settled on completion */
  balanceMinor: number;
}

const QUANTITY_SCALE = 10_000;

function requireMinor(value: number, what: string): void {
  if (!Number.isSafeInteger(value) || value < 0) throw new RangeError(`${what} must be a non-negative integer count of minor units, got ${value}`);
}

/** A quantity in ten-thousandths, half up. toFixed stops 1.00005 × 10000 = 10000.499999… from rounding down. */
function quantityUnits(quantity: number): number {
  if (!Number.isFinite(quantity) || quantity <= 0) throw new RangeError(`A quantity must be positive, got ${quantity}`);
  const units = Math.round(Number((quantity * QUANTITY_SCALE).toFixed(6)));
  if (!Number.isSafeInteger(units) || units < 1) throw new RangeError(`Quantity ${quantity} is too small or too large`);
  return units;
}

/** quantity × unit price, half up to the minor unit. */
export function lineTotalMinor(quantity: number, unitPriceMinor: number): number {
  requireMinor(unitPriceMinor, "A unit price");
  return scaleMinor(unitPriceMinor, quantityUnits(quantity), QUANTITY_SCALE, "half_up");
}

/** One-way distance in metres (rounded to whole metres, half up) × rate per km, half up to the minor unit. */
export function travelMinor(distanceM: number, ratePerKmMinor: number): number {
  if (!Number.isFinite(distanceM) || distanceM < 0) throw new RangeError(`A distance must be non-negative, got ${distanceM}`);
  requireMinor(ratePerKmMinor, "A travel rate");
  return scaleMinor(ratePerKmMinor, Math.round(distanceM), 1000, "half_up");
}

export function priceQuote(input: QuoteInput): PricedQuote {
  if (!isCurrencyCode(input.currency)) throw new RangeError(`Not an ISO 4217 currency code: ${input.currency}`);
  requireMinor(input.baseServiceFeeMinor, "A base service fee");

  const lines: PricedQuoteLine[] = input.lines.map((line) => ({
    ...line,
    totalMinor: lineTotalMinor(line.quantity, line.unitPriceMinor),
    included: !(input.farmerSuppliesMaterials && line.kind === "materials"),
  }));
  if (input.travel && Math.round(input.travel.distanceM) > 0) {
    const metres = Math.round(input.travel.distanceM);
    lines.push({
      kind: "travel",
      description: `Travel, ${(metres / 1000).toFixed(1)} km`,
      quantity: metres / 1000,
      unitPriceMinor: input.travel.ratePerKmMinor,
      totalMinor: travelMinor(metres, input.travel.ratePerKmMinor),
      included: true,
    });
  }

  const sum = (pick: (l: PricedQuoteLine) => boolean) => lines.filter(pick).reduce((acc, l) => acc + l.totalMinor, 0);
  const materialsMinor = sum((l) => l.included && l.kind === "materials");
  const labourMinor = sum((l) => l.included && l.kind === "labour");
  const travel = sum((l) => l.included && l.kind === "travel");
  const otherMinor = sum((l) => l.included && l.kind === "other");
  const excludedMaterialsMinor = sum((l) => !l.included);
  const subtotalMinor = materialsMinor + labourMinor + travel + otherMinor;
  const totalMinor = subtotalMinor + input.baseServiceFeeMinor;
  if (!Number.isSafeInteger(totalMinor)) throw new RangeError("Quote total is too large");
  const depositMinor = scaleMinor(totalMinor, JOB_PARAMETERS.depositShareBasisPoints.value, 10_000, "half_up");

  return {
    currency: input.currency,
    lines,
    materialsMinor,
    labourMinor,
    travelMinor: travel,
    otherMinor,
    excludedMaterialsMinor,
    subtotalMinor,
    baseServiceFeeMinor: input.baseServiceFeeMinor,
    totalMinor,
    depositMinor,
    balanceMinor: totalMinor - depositMinor,
  };
}

/** One row of a builder's price sheet (db/schema.ts builder_price). */
export interface PriceSheetRow {
  tankType: TankType;
  materialsPerSqmMinor: number;
  labourPerSqmMinor: number;
}

export interface PriceSheetEstimate {
  /** the floor area as priced: to 4 decimals (whole cm²), half up */
  floorAreaM2: number;
  materialsMinor: number;
  labourMinor: number;
  /** a materials line and a labour line to start a quote from */
  lines: [QuoteLine, QuoteLine];
}

/** Starting materials and labour for a tank of this floor area, from the builder's per-m² prices. */
export function estimateFromPriceSheet(row: PriceSheetRow, floorAreaM2: number): PriceSheetEstimate {
  const area = quantityUnits(floorAreaM2) / QUANTITY_SCALE;
  const label = `${row.tankType} tank, ${area} m² floor`;
  const lines: [QuoteLine, QuoteLine] = [
    { kind: "materials", description: `Materials for a ${label}`, quantity: area, unitPriceMinor: row.materialsPerSqmMinor },
    { kind: "labour", description: `Labour for a ${label}`, quantity: area, unitPriceMinor: row.labourPerSqmMinor },
  ];
  return {
    floorAreaM2: area,
    materialsMinor: lineTotalMinor(area, row.materialsPerSqmMinor),
    labourMinor: lineTotalMinor(area, row.labourPerSqmMinor),
    lines,
  };
}
