import * as z from "zod/mini";
import { feetToMetres } from "@/lib/planner/units";

/*
 * Input of the tank and stocking planner, in SI units: metres, grams, days, °C, fractions (0.85 = 85 %),
 * and money as whole minor currency units (ngwee, cents) beside an ISO 4217 code.
 * The browser form and POST /api/plans/estimate parse with this one schema; lib/planner/estimate.ts computes from it.
 * Written with zod/mini, the tree-shakable form of zod 4, because the planner parses it in the browser on every
 * keystroke: all of zod would add about 31 KB gzipped to the planner's first load. The server parses the same
 * schema objects with zod. zod/mini ships no locale, so every rule carries its own message.
 */

import { DEFAULT_WATER_CHANGE, LINER_COLOURS, SPECIES_CHOICES, SUN_EXPOSURES, TANK_SHAPES, TANK_TYPES } from "@/lib/planner/choices";
import type { TankType } from "@/lib/planner/choices";

// Kept here too for the form and the API, which import their vocabulary with the schema.
export { DEFAULT_WATER_CHANGE, LINER_COLOURS, SPECIES_CHOICES, SUN_EXPOSURES, TANK_SHAPES, TANK_TYPES };
export type { LinerColour, SpeciesChoice, SunExposure, TankShape, TankType } from "@/lib/planner/choices";

const numberFormat = new Intl.NumberFormat("en", { maximumFractionDigits: 6 });

type Bound = { label: string; min: number; max: number; unit?: string; whole?: boolean; hint?: string };

/** A bounded number whose every message names the field, e.g. "Water depth must be between 0.2 and 3 m". */
function bounded({ label, min, max, unit, whole, hint }: Bound) {
  const range = `${label} must be between ${numberFormat.format(min)} and ${numberFormat.format(max)}${unit ? ` ${unit}` : ""}${hint ? ` (${hint})` : ""}`;
  const schema = z.number({ error: `${label} must be a number` }).check(z.gte(min, range), z.lte(max, range));
  return whole ? schema.check(z.int(`${label} must be a whole number`)) : schema;
}

const fraction = (label: string, min: number, hint = "a fraction: 0.85 means 85 %", max = 1) => bounded({ label, min, max, hint });

/**
 * Money in minor units (ngwee for ZMW): whole numbers. The caps keep every product in the estimate (price × the largest
 * feed, harvest or energy figure a valid plan can give) below Number.MAX_SAFE_INTEGER, so rounded totals stay exact.
 */
const money = (label: string, max: number) => bounded({ label, min: 0, max, unit: "minor currency units", whole: true });

const oneOf = <T extends readonly [string, ...string[]]>(values: T, label: string) =>
  z.enum(values, { error: `${label} must be one of: ${values.join(", ")}` });

const CURRENCY_MESSAGE = "Currency must be a three-letter ISO 4217 code such as ZMW";

const length = (label: string) => bounded({ label, min: 0.3, max: 100, unit: "m" });

const tankDimensionsSchema = z.discriminatedUnion(
  "shape",
  [
    z.object({ shape: z.literal("rectangular"), lengthM: length("Tank length"), widthM: length("Tank width") }, { error: "Tank length and width are required" }),
    z.object({ shape: z.literal("round"), diameterM: length("Tank diameter") }, { error: "Tank diameter is required" }),
  ],
  { error: `Tank shape must be one of: ${TANK_SHAPES.join(", ")}` },
);

const tankSchema = z.object(
  {
    type: oneOf(TANK_TYPES, "Tank type"),
    dimensions: tankDimensionsSchema,
    waterDepthM: bounded({ label: "Water depth", min: 0.2, max: 3, unit: "m" }),
    freeboardM: bounded({ label: "Freeboard", min: 0, max: 1, unit: "m" }),
    linerColour: oneOf(LINER_COLOURS, "Liner colour"),
    sunExposure: oneOf(SUN_EXPOSURES, "Sun exposure"),
    /** Leave empty to use the planner's build-cost model for the tank type. */
    buildCostOverrideMinor: z.nullish(money("Tank build cost", 1_000_000_000_000)),
    /** Leave empty to use the default life of the tank type. */
    lifeYears: z.nullish(bounded({ label: "Tank life", min: 1, max: 50, unit: "years" })),
  },
  { error: "Tank details (type, size, depth) are required" },
);

function speciesStockSchema(name: string) {
  return z.object(
    {
      stockingWeightG: bounded({ label: `${name} stocking weight`, min: 0.5, max: 1000, unit: "g" }),
      targetHarvestWeightG: bounded({ label: `${name} target harvest weight`, min: 5, max: 3000, unit: "g" }),
      fingerlingPriceMinor: money(`${name} fingerling price`, 1_000_000),
      salePricePerKgMinor: money(`${name} sale price per kg`, 100_000_000),
      fcr: bounded({ label: `${name} FCR`, min: 0.6, max: 4, hint: "kg of feed per kg of fish gained" }),
    },
    { error: `${name} stocking details are required` },
  );
}

const waterChangeSchema = z.object(
  {
    intervalDays: bounded({ label: "Water-change interval", min: 1, max: 365, unit: "days", whole: true }),
    fractionExchanged: fraction("Share of water exchanged", 0, "a fraction: 1 means the whole tank"),
  },
  { error: "Water-change schedule is required" },
);

const pumpSchema = z.object(
  {
    headM: bounded({ label: "Pump head", min: 0, max: 100, unit: "m" }),
    efficiencyFraction: fraction("Pump efficiency", 0.05, "a fraction: 0.4 means 40 % wire-to-water", 0.95),
    electricityTariffPerKWhMinor: money("Electricity tariff per kWh", 1_000_000),
  },
  { error: "Pump details (head, efficiency, tariff) are required" },
);

export const planInputSchema = z
  .object(
    {
      currency: z.string({ error: CURRENCY_MESSAGE }).check(z.regex(/^[A-Z]{3}$/, CURRENCY_MESSAGE)),
      tank: tankSchema,
      species: oneOf(SPECIES_CHOICES, "Species"),
      tilapia: speciesStockSchema("Tilapia"),
      catfish: speciesStockSchema("Catfish"),
      /** Only read when species is "both": the share of the fish stocked that are tilapia. */
      tilapiaShareOfFishFraction: fraction("Tilapia share of the fish", 0, "a fraction: 0.8 means 8 tilapia in 10 fish"),
      /** Leave empty to stock as many as the tank carries; a number above that raises the over-density warning. */
      fishToStock: z.nullish(bounded({ label: "Fish to stock", min: 0, max: 1_000_000, whole: true })),
      growOutSurvivalFraction: fraction("Grow-out survival", 0.1),
      quarantineSurvivalFraction: fraction("Quarantine survival", 0.1),
      waterTemperatureC: bounded({ label: "Water temperature", min: 5, max: 40, unit: "°C" }),
      catfishShadeProvided: z.boolean({ error: "Shade for catfish must be yes or no" }),
      feedPricePerKgMinor: money("Feed price per kg", 100_000_000),
      waterChange: waterChangeSchema,
      pump: pumpSchema,
      labourCostPerCycleMinor: money("Labour cost per cycle", 100_000_000_000),
    },
    { error: "The plan must be an object" },
  )
  .check(
    z.superRefine((plan, ctx) => {
      // Only the species in the tank must grow; the other block is kept for the form but not checked.
      const inUse = plan.species === "both" ? (["tilapia", "catfish"] as const) : ([plan.species] as const);
      for (const species of inUse) {
        const stock = plan[species];
        if (stock.targetHarvestWeightG <= stock.stockingWeightG) {
          const name = species === "tilapia" ? "Tilapia" : "Catfish";
          ctx.addIssue({ code: "custom", path: [species, "targetHarvestWeightG"], message: `${name} target harvest weight must be more than its stocking weight` });
        }
      }
    }),
  );

export type PlanInput = z.output<typeof planInputSchema>;
export type PlanInputDraft = z.input<typeof planInputSchema>;
export type TankDimensions = PlanInput["tank"]["dimensions"];
export type SpeciesStock = PlanInput["tilapia"];
export type WaterChangeSchedule = PlanInput["waterChange"];


/**
 * The plan the page opens with: a 6 ft × 10 ft tarpaulin tank (a common small size) of Nile tilapia.
 * Prices are DEMO DEFAULTS in ZMW ngwee (K1 = 100 ngwee), plausible for Zambia but not quotes: the user must enter their own.
 * Sources of the non-price defaults are listed in lib/planner/assumptions.ts (INPUT_DEFAULT_SOURCES).
 */
export const defaultPlanInput: PlanInput = {
  currency: "ZMW",
  tank: {
    type: "tarpaulin",
    dimensions: { shape: "rectangular", lengthM: feetToMetres(10), widthM: feetToMetres(6) },
    waterDepthM: 1,
    freeboardM: 0.3,
    linerColour: "blue",
    sunExposure: "part-shade",
    buildCostOverrideMinor: null,
    lifeYears: null,
  },
  species: "tilapia",
  tilapia: { stockingWeightG: 10, targetHarvestWeightG: 350, fingerlingPriceMinor: 150, salePricePerKgMinor: 6_000, fcr: 1.5 },
  catfish: { stockingWeightG: 10, targetHarvestWeightG: 1_000, fingerlingPriceMinor: 250, salePricePerKgMinor: 4_500, fcr: 1.3 },
  tilapiaShareOfFishFraction: 0.8,
  fishToStock: null,
  growOutSurvivalFraction: 0.85,
  quarantineSurvivalFraction: 0.95,
  waterTemperatureC: 26,
  catfishShadeProvided: false,
  feedPricePerKgMinor: 1_800,
  waterChange: { ...DEFAULT_WATER_CHANGE.tarpaulin },
  pump: { headM: 5, efficiencyFraction: 0.4, electricityTariffPerKWhMinor: 150 },
  labourCostPerCycleMinor: 150_000,
};

/** A saved plan: a name for the farmer's list and the planner input (POST and PUT /api/v1/plans). */
export const PLAN_NAME_MAX_LENGTH = 120;
export const savePlanSchema = z.object(
  {
    name: z
      .string({ error: "Plan name is required" })
      .check(z.trim(), z.minLength(1, "Plan name is required"), z.maxLength(PLAN_NAME_MAX_LENGTH, `Plan name must be at most ${PLAN_NAME_MAX_LENGTH} characters`)),
    input: planInputSchema,
  },
  { error: "The plan must be an object with a name and an input" },
);
export type SavePlanInput = z.output<typeof savePlanSchema>;
