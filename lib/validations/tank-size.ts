import { z } from "zod";
import { TANK_TYPES } from "@/lib/catalog";
import { SIZE_UNITS, TANK_SHAPES, type SizeUnit } from "@/lib/jobs/vocabulary";
import { feetToMetres, metresToFeet } from "@/lib/planner/units";

/*
 * Pieces shared by the tank request and portfolio schemas. Forms hold what people type (strings, in metres or
 * feet); these schemas turn that into metres and say what is wrong in the unit the person used.
 */

const DECIMAL = /^[+-]?\d+(?:[.,]\d+)?$/;

/** A typed decimal ("2.5" or "2,5"): trimmed, "" when empty. */
export const typedNumber = z.string().trim().max(20, "Too long");

export function parseDecimal(text: string): number {
  return DECIMAL.test(text) ? Number(text.replace(",", ".")) : Number.NaN;
}

// Inner sizes a small farm's tank or pond can have. The planner takes 0.3–100 m sides (lib/validations/planner.ts);
// a wall or pond deeper than 3 m is beyond what we take as a small farm's (our choice).
export const SIDE_RANGE_M = { min: 0.3, max: 100 } as const;
export const DEPTH_RANGE_M = { min: 0.3, max: 3 } as const;

function inUnit(metres: number, unit: SizeUnit): string {
  const value = unit === "m" ? metres : metresToFeet(metres);
  return `${Number(value.toFixed(1))} ${unit}`;
}

export type TankSize =
  | { shape: "rectangular"; lengthM: number; widthM: number; depthM: number; sizeUnit: SizeUnit }
  | { shape: "round"; diameterM: number; depthM: number; sizeUnit: SizeUnit };

export const tankSizeFields = {
  tankType: z.enum(TANK_TYPES, { error: "Choose a tank type" }),
  shape: z.enum(TANK_SHAPES, { error: "Choose rectangular or round" }),
  unit: z.enum(SIZE_UNITS, { error: "Choose metres or feet" }),
  length: typedNumber,
  width: typedNumber,
  diameter: typedNumber,
  depth: typedNumber,
};

type SizeInput = { shape?: unknown; unit?: unknown; length?: unknown; width?: unknown; diameter?: unknown; depth?: unknown };
export type FieldIssue = { path: string; message: string };

const asText = (value: unknown) => (typeof value === "string" ? value.trim() : "");

/**
 * Reads a typed size into metres, with one issue per wrong field (path = the form field) worded in the unit the
 * person used. Defensive about its input: it also runs when other fields of the form failed, so every mistake
 * shows at once.
 */
export function readTankSize(v: SizeInput): { size: TankSize | null; issues: FieldIssue[] } {
  const issues: FieldIssue[] = [];
  const unit: SizeUnit = v.unit === "ft" ? "ft" : "m";
  if (v.shape !== "rectangular" && v.shape !== "round") return { size: null, issues };
  const read = (field: "length" | "width" | "diameter" | "depth", label: string, range: { min: number; max: number }): number | null => {
    const text = asText(v[field]);
    if (text === "") {
      issues.push({ path: field, message: `Enter the ${label.toLowerCase()}` });
      return null;
    }
    const n = parseDecimal(text);
    const m = unit === "m" ? n : feetToMetres(n);
    if (!Number.isFinite(m) || m < range.min || m > range.max) {
      issues.push({ path: field, message: `${label} must be a number between ${inUnit(range.min, unit)} and ${inUnit(range.max, unit)}` });
      return null;
    }
    return m;
  };
  if (v.shape === "rectangular") {
    const lengthM = read("length", "Length", SIDE_RANGE_M);
    const widthM = read("width", "Width", SIDE_RANGE_M);
    const depthM = read("depth", "Depth", DEPTH_RANGE_M);
    return { size: lengthM !== null && widthM !== null && depthM !== null ? { shape: "rectangular", lengthM, widthM, depthM, sizeUnit: unit } : null, issues };
  }
  const diameterM = read("diameter", "Diameter", SIDE_RANGE_M);
  const depthM = read("depth", "Depth", DEPTH_RANGE_M);
  return { size: diameterM !== null && depthM !== null ? { shape: "round", diameterM, depthM, sizeUnit: unit } : null, issues };
}

/** Typed coordinates in decimal degrees (WGS84, as the browser's geolocation gives them). */
export const pointFields = { lat: typedNumber, lng: typedNumber };

/** Reads typed coordinates, with an issue per wrong field. */
export function readPoint(v: { lat?: unknown; lng?: unknown }): { point: { lat: number; lng: number } | null; issues: FieldIssue[] } {
  const issues: FieldIssue[] = [];
  const latText = asText(v.lat);
  const lngText = asText(v.lng);
  const lat = parseDecimal(latText);
  const lng = parseDecimal(lngText);
  if (!(lat >= -90 && lat <= 90)) issues.push({ path: "lat", message: latText === "" ? "Enter the latitude or use your location" : "Latitude must be between -90 and 90 degrees" });
  if (!(lng >= -180 && lng <= 180)) issues.push({ path: "lng", message: lngText === "" ? "Enter the longitude or use your location" : "Longitude must be between -180 and 180 degrees" });
  return { point: issues.length ? null : { lat, lng }, issues };
}

/** Adds field issues to a refinement context. */
export function report(ctx: z.RefinementCtx, issues: readonly FieldIssue[]): void {
  for (const issue of issues) ctx.addIssue({ code: "custom", path: [issue.path], message: issue.message });
}

/** Runs a refinement even when other fields failed, so the form shows every mistake in one go. */
export const ALWAYS = { when: () => true } as const;

/** "YYYY-MM-DD" as <input type="date"> gives it, read as midnight UTC. */
export const isoDate = z.iso.date({ error: "Choose a date" });

export function dateFromIso(day: string): Date {
  return new Date(`${day}T00:00:00.000Z`);
}

/** Today's date in UTC as YYYY-MM-DD; a day of slack either way covers the farmer's own time zone. */
export function isoDay(at: Date): string {
  return at.toISOString().slice(0, 10);
}

export const DAY_MS = 24 * 60 * 60 * 1000;
