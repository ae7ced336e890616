import { $ZodDiscriminatedUnion, $ZodNullable, $ZodNumber, $ZodObject, $ZodOptional, type $ZodType } from "zod/v4/core";
import { planInputSchema } from "@/lib/validations/planner";

/*
 * The numbers of the planner form: their labels, how each is shown (a length in m or ft, a share in %, money in major
 * units) and the range planInputSchema allows, read from the schema itself so that the form cannot drift from it.
 */

export const LENGTH_UNITS = ["m", "ft"] as const;
export type LengthUnit = (typeof LENGTH_UNITS)[number];

/** How a number is shown: a tank length in the chosen unit, a share in %, money in major units, or as the schema has it. */
export type NumberKind = "length" | "percent" | "money" | "plain";

export interface NumberFieldSpec {
  /** The field's path in PlanInput, dot-joined; also the key of its text in the draft and of its error. */
  path: string;
  kind: NumberKind;
  label: string;
  /** Unit of a plain number, shown beside the label. */
  unit?: string;
  /** Empty means "let the planner decide" (stored as null). */
  optional?: boolean;
}

export const NUMBER_FIELDS = [
  { path: "tank.dimensions.lengthM", kind: "length", label: "Length" },
  { path: "tank.dimensions.widthM", kind: "length", label: "Width" },
  { path: "tank.dimensions.diameterM", kind: "length", label: "Diameter" },
  { path: "tank.waterDepthM", kind: "length", label: "Water depth" },
  { path: "tank.freeboardM", kind: "length", label: "Freeboard" },
  { path: "tank.buildCostOverrideMinor", kind: "money", label: "Build cost of the tank", optional: true },
  { path: "tank.lifeYears", kind: "plain", label: "Tank life", unit: "years", optional: true },
  { path: "tilapia.stockingWeightG", kind: "plain", label: "Tilapia stocking weight", unit: "g" },
  { path: "tilapia.targetHarvestWeightG", kind: "plain", label: "Tilapia harvest weight", unit: "g" },
  { path: "tilapia.fingerlingPriceMinor", kind: "money", label: "Tilapia fingerling price, each" },
  { path: "tilapia.salePricePerKgMinor", kind: "money", label: "Tilapia sale price per kg" },
  { path: "tilapia.fcr", kind: "plain", label: "Tilapia FCR", unit: "kg feed per kg gained" },
  { path: "catfish.stockingWeightG", kind: "plain", label: "Catfish stocking weight", unit: "g" },
  { path: "catfish.targetHarvestWeightG", kind: "plain", label: "Catfish harvest weight", unit: "g" },
  { path: "catfish.fingerlingPriceMinor", kind: "money", label: "Catfish fingerling price, each" },
  { path: "catfish.salePricePerKgMinor", kind: "money", label: "Catfish sale price per kg" },
  { path: "catfish.fcr", kind: "plain", label: "Catfish FCR", unit: "kg feed per kg gained" },
  { path: "tilapiaShareOfFishFraction", kind: "percent", label: "Tilapia share of the fish" },
  { path: "fishToStock", kind: "plain", label: "Fish to stock", unit: "fish", optional: true },
  { path: "growOutSurvivalFraction", kind: "percent", label: "Grow-out survival" },
  { path: "quarantineSurvivalFraction", kind: "percent", label: "Quarantine survival" },
  { path: "waterTemperatureC", kind: "plain", label: "Water temperature", unit: "°C" },
  { path: "feedPricePerKgMinor", kind: "money", label: "Feed price per kg" },
  { path: "waterChange.intervalDays", kind: "plain", label: "Change the water every", unit: "days" },
  { path: "waterChange.fractionExchanged", kind: "percent", label: "Share of the water changed" },
  { path: "pump.headM", kind: "plain", label: "Pump head (height lifted)", unit: "m" },
  { path: "pump.efficiencyFraction", kind: "percent", label: "Pump efficiency" },
  { path: "pump.electricityTariffPerKWhMinor", kind: "money", label: "Electricity price per kWh" },
  { path: "labourCostPerCycleMinor", kind: "money", label: "Labour per cycle" },
] as const satisfies readonly NumberFieldSpec[];

export type NumberFieldPath = (typeof NUMBER_FIELDS)[number]["path"];

const SPEC_BY_PATH = new Map<string, NumberFieldSpec>(NUMBER_FIELDS.map((f) => [f.path, f]));

/** The form field behind a schema path, if it is one of the numbers. */
export function findFieldSpec(path: string): NumberFieldSpec | undefined {
  return SPEC_BY_PATH.get(path);
}

export function numberFieldSpec(path: NumberFieldPath): NumberFieldSpec {
  const spec = SPEC_BY_PATH.get(path);
  if (!spec) throw new Error(`No planner field ${path}`);
  return spec;
}

// Bounds of each number, read from planInputSchema itself so that the form's messages cannot drift from it. The
// schema is a zod/mini one (it runs in the browser), so this walks zod's core classes rather than zod's full API,
// imported by name: `z.core.…` would make the bundler keep all of zod's core (locales and JSON Schema included).
function unwrapped(schema: $ZodType): $ZodType {
  let s = schema;
  while (s instanceof $ZodOptional || s instanceof $ZodNullable) s = s._zod.def.innerType;
  return s;
}

function schemaAt(path: string): $ZodType | undefined {
  let node: $ZodType | undefined = planInputSchema;
  for (const key of path.split(".")) {
    const here: $ZodType | undefined = node ? unwrapped(node) : undefined;
    if (here instanceof $ZodObject) {
      node = (here._zod.def.shape as Record<string, $ZodType>)[key];
    } else if (here instanceof $ZodDiscriminatedUnion) {
      const options = here._zod.def.options as readonly $ZodType[];
      node = options.map((o) => (o instanceof $ZodObject ? (o._zod.def.shape as Record<string, $ZodType>)[key] : undefined)).find(Boolean);
    } else {
      return undefined;
    }
  }
  return node ? unwrapped(node) : undefined;
}

export interface FieldBounds {
  min: number;
  max: number;
  whole: boolean;
}

/** The range planInputSchema allows for a field, in schema units. */
export function schemaBounds(path: NumberFieldPath): FieldBounds {
  const schema = schemaAt(path);
  if (!(schema instanceof $ZodNumber)) throw new Error(`No bounded number at ${path}`);
  // The number's checks as zod's core defines them: z.gte is "greater_than", z.lte "less_than", z.int a "number_format".
  let min = Number.NEGATIVE_INFINITY;
  let max = Number.POSITIVE_INFINITY;
  let whole = false;
  for (const check of schema._zod.def.checks ?? []) {
    const def = check._zod.def as { check: string; value?: unknown; format?: unknown };
    if (def.check === "greater_than" && typeof def.value === "number") min = Math.max(min, def.value);
    else if (def.check === "less_than" && typeof def.value === "number") max = Math.min(max, def.value);
    else if (def.check === "number_format" && typeof def.format === "string" && def.format.includes("int")) whole = true;
  }
  if (!Number.isFinite(min) || !Number.isFinite(max)) throw new Error(`No bounded number at ${path}`);
  return { min, max, whole };
}

/** A field's unit as shown in the form, e.g. "ft", "%", "K" or "g". */
export function shownUnit(spec: NumberFieldSpec, draft: { lengthUnit: LengthUnit }, currencySymbol: string): string {
  switch (spec.kind) {
    case "length":
      return draft.lengthUnit;
    case "percent":
      return "%";
    case "money":
      return currencySymbol;
    case "plain":
      return spec.unit ?? "";
  }
}
