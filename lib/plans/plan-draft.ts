import * as z from "zod/mini";
import { minorDigits } from "@/lib/money/money";
import { feetToMetres, metresToFeet } from "@/lib/planner/units";
import {
  defaultPlanInput,
  LINER_COLOURS,
  SPECIES_CHOICES,
  SUN_EXPOSURES,
  TANK_SHAPES,
  TANK_TYPES,
  type PlanInput,
  type PlanInputDraft,
} from "@/lib/validations/planner";
import { LENGTH_UNITS, NUMBER_FIELDS, numberFieldSpec, type LengthUnit, type NumberFieldPath, type NumberFieldSpec } from "./draft-fields";

/*
 * The planner form at its edge: what the person types (text, in metres or feet, prices in major units such as K18,
 * shares in %), converted to the SI input that planInputSchema parses, and back. The schema stays the one validator;
 * this module only converts units (field specs in draft-fields.ts, messages in draft-messages.ts).
 */

/** Everything the planner form holds; kept in localStorage so nothing typed is lost (for example while signing in). */
export interface PlanDraft {
  version: 1;
  lengthUnit: LengthUnit;
  currency: string;
  tankType: PlanInput["tank"]["type"];
  shape: PlanInput["tank"]["dimensions"]["shape"];
  linerColour: PlanInput["tank"]["linerColour"];
  sunExposure: PlanInput["tank"]["sunExposure"];
  species: PlanInput["species"];
  catfishShadeProvided: boolean;
  numbers: Record<NumberFieldPath, string>;
  /**
   * The exact length in metres behind a length the form rewrote in other units (1 m shows as 3.2808 ft), so that
   * switching units or reopening a plan in feet changes no figure. Typing in the field drops it.
   */
  exactLengthsM: Partial<Record<NumberFieldPath, number>>;
}

// zod/mini, as the planner's schema: this runs in the browser (the draft kept on the device), where all of zod would
// cost about 31 KB gzipped. A stored draft that fails is dropped, never shown, so these checks need no messages.
const numberTexts = z.object(Object.fromEntries(NUMBER_FIELDS.map((f) => [f.path, z.string().check(z.maxLength(40))])) as Record<NumberFieldPath, z.ZodMiniString>);

/** Checks a draft read back from storage (it may be old or edited by hand). */
export const planDraftSchema = z.object({
  version: z.literal(1),
  lengthUnit: z.enum(LENGTH_UNITS),
  currency: z.string().check(z.maxLength(8)),
  tankType: z.enum(TANK_TYPES),
  shape: z.enum(TANK_SHAPES),
  linerColour: z.enum(LINER_COLOURS),
  sunExposure: z.enum(SUN_EXPOSURES),
  species: z.enum(SPECIES_CHOICES),
  catfishShadeProvided: z.boolean(),
  numbers: numberTexts,
  exactLengthsM: z._default(z.partialRecord(z.enum(NUMBER_FIELDS.map((f) => f.path) as [NumberFieldPath, ...NumberFieldPath[]]), z.number()), {}),
});

/** Minor digits of a currency, or 2 while the code typed is not yet a well-formed ISO 4217 code (the schema says so). */
function safeMinorDigits(currency: string): number {
  return /^[A-Z]{3}$/.test(currency) ? minorDigits(currency) : 2;
}

/**
 * Reads a typed number. Spaces are dropped; a comma is a thousands separator ("1,500") unless it cannot be one
 * ("0,85" or "2,5"), when it is read as a decimal comma. Empty text is null; anything else unreadable is NaN.
 */
export function parseTypedNumber(text: string): number | null {
  const compact = text.replace(/[\s\u00a0]/g, "");
  if (compact === "") return null;
  let normal = compact;
  if (compact.includes(",")) {
    const afterLastComma = compact.slice(compact.lastIndexOf(",") + 1);
    const decimalComma = !compact.includes(".") && compact.split(",").length === 2 && afterLastComma.length !== 3;
    normal = decimalComma ? compact.replace(",", ".") : compact.replace(/,/g, "");
  }
  if (!/^[+-]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i.test(normal)) return Number.NaN;
  return Number(normal);
}

/** Up to four decimals, no grouping, trailing zeros dropped: 3.048, 1.8288, 85. */
export function formatTypedNumber(value: number): string {
  return String(Number(value.toFixed(4)));
}

function toSchemaUnits(spec: NumberFieldSpec, shown: number, draft: Pick<PlanDraft, "lengthUnit" | "currency">): number {
  switch (spec.kind) {
    case "length":
      return draft.lengthUnit === "ft" ? feetToMetres(shown) : shown;
    case "percent":
      return shown / 100;
    case "money":
      // Round half away from zero to whole minor units, as lib/money does.
      return Math.round(Number((shown * 10 ** safeMinorDigits(draft.currency)).toFixed(6)));
    case "plain":
      return shown;
  }
}

export function fromSchemaUnits(spec: NumberFieldSpec, value: number, lengthUnit: LengthUnit, currency: string): number {
  switch (spec.kind) {
    case "length":
      return lengthUnit === "ft" ? metresToFeet(value) : value;
    case "percent":
      return value * 100;
    case "money":
      return value / 10 ** safeMinorDigits(currency);
    case "plain":
      return value;
  }
}

/** The number a field holds in schema units: null when left empty, NaN when unreadable. */
export function fieldValue(draft: PlanDraft, path: NumberFieldPath): number | null {
  const spec = numberFieldSpec(path);
  const shown = parseTypedNumber(draft.numbers[path]);
  if (shown === null) return null;
  if (Number.isNaN(shown)) return Number.NaN;
  const exact = spec.kind === "length" ? draft.exactLengthsM[path] : undefined;
  return exact ?? toSchemaUnits(spec, shown, draft);
}

/** The draft with one number retyped. */
export function withNumber(draft: PlanDraft, path: NumberFieldPath, text: string): PlanDraft {
  const { [path]: _dropped, ...exactLengthsM } = draft.exactLengthsM;
  return { ...draft, numbers: { ...draft.numbers, [path]: text }, exactLengthsM };
}

/** A required number: empty counts as unreadable, so the schema names the field. */
const required = (draft: PlanDraft, path: NumberFieldPath) => fieldValue(draft, path) ?? Number.NaN;

function stockOf(draft: PlanDraft, species: "tilapia" | "catfish"): PlanInputDraft["tilapia"] {
  return {
    stockingWeightG: required(draft, `${species}.stockingWeightG`),
    targetHarvestWeightG: required(draft, `${species}.targetHarvestWeightG`),
    fingerlingPriceMinor: required(draft, `${species}.fingerlingPriceMinor`),
    salePricePerKgMinor: required(draft, `${species}.salePricePerKgMinor`),
    fcr: required(draft, `${species}.fcr`),
  };
}

/** The draft in the schema's shape and units, ready for planInputSchema.safeParse. */
export function draftToCandidate(draft: PlanDraft): PlanInputDraft {
  const dimensions: PlanInputDraft["tank"]["dimensions"] =
    draft.shape === "round"
      ? { shape: "round", diameterM: required(draft, "tank.dimensions.diameterM") }
      : { shape: "rectangular", lengthM: required(draft, "tank.dimensions.lengthM"), widthM: required(draft, "tank.dimensions.widthM") };
  return {
    currency: draft.currency.trim().toUpperCase(),
    tank: {
      type: draft.tankType,
      dimensions,
      waterDepthM: required(draft, "tank.waterDepthM"),
      freeboardM: required(draft, "tank.freeboardM"),
      linerColour: draft.linerColour,
      sunExposure: draft.sunExposure,
      buildCostOverrideMinor: fieldValue(draft, "tank.buildCostOverrideMinor"),
      lifeYears: fieldValue(draft, "tank.lifeYears"),
    },
    species: draft.species,
    tilapia: stockOf(draft, "tilapia"),
    catfish: stockOf(draft, "catfish"),
    tilapiaShareOfFishFraction: required(draft, "tilapiaShareOfFishFraction"),
    fishToStock: fieldValue(draft, "fishToStock"),
    growOutSurvivalFraction: required(draft, "growOutSurvivalFraction"),
    quarantineSurvivalFraction: required(draft, "quarantineSurvivalFraction"),
    waterTemperatureC: required(draft, "waterTemperatureC"),
    catfishShadeProvided: draft.catfishShadeProvided,
    feedPricePerKgMinor: required(draft, "feedPricePerKgMinor"),
    waterChange: { intervalDays: required(draft, "waterChange.intervalDays"), fractionExchanged: required(draft, "waterChange.fractionExchanged") },
    pump: {
      headM: required(draft, "pump.headM"),
      efficiencyFraction: required(draft, "pump.efficiencyFraction"),
      electricityTariffPerKWhMinor: required(draft, "pump.electricityTariffPerKWhMinor"),
    },
    labourCostPerCycleMinor: required(draft, "labourCostPerCycleMinor"),
  };
}

/** Reads a value of a PlanInput by dot path; a dimension the shape does not have is undefined. */
function valueAt(input: PlanInput, path: string): unknown {
  let node: unknown = input;
  for (const key of path.split(".")) {
    if (typeof node !== "object" || node === null) return undefined;
    node = (node as Record<string, unknown>)[key];
  }
  return node;
}

/** The form showing a plan: every number written in the units shown. A dimension the shape lacks takes the default tank's. */
export function inputToDraft(input: PlanInput, lengthUnit: LengthUnit = "m"): PlanDraft {
  const defaultLengthM = defaultPlanInput.tank.dimensions.shape === "rectangular" ? defaultPlanInput.tank.dimensions.lengthM : 3;
  const fallback: Partial<Record<NumberFieldPath, number>> = {
    "tank.dimensions.lengthM": defaultLengthM,
    "tank.dimensions.widthM": defaultPlanInput.tank.dimensions.shape === "rectangular" ? defaultPlanInput.tank.dimensions.widthM : 2,
    // A round tank as wide as the default tank is long (10 ft); only used when the shape is switched to round.
    "tank.dimensions.diameterM": defaultLengthM,
  };
  const exactLengthsM: PlanDraft["exactLengthsM"] = {};
  const numbers = Object.fromEntries(
    NUMBER_FIELDS.map((spec) => {
      const raw = valueAt(input, spec.path) ?? fallback[spec.path];
      if (typeof raw !== "number") return [spec.path, ""];
      if (spec.kind === "length") exactLengthsM[spec.path] = raw;
      return [spec.path, formatTypedNumber(fromSchemaUnits(spec, raw, lengthUnit, input.currency))];
    }),
  ) as Record<NumberFieldPath, string>;
  return {
    version: 1,
    lengthUnit,
    currency: input.currency,
    tankType: input.tank.type,
    shape: input.tank.dimensions.shape,
    linerColour: input.tank.linerColour,
    sunExposure: input.tank.sunExposure,
    species: input.species,
    catfishShadeProvided: input.catfishShadeProvided,
    numbers,
    exactLengthsM,
  };
}

/** Switches the unit of the tank lengths, rewriting what is typed; text that is not a number is left as it is. */
export function withLengthUnit(draft: PlanDraft, lengthUnit: LengthUnit): PlanDraft {
  if (lengthUnit === draft.lengthUnit) return draft;
  const numbers = { ...draft.numbers };
  const exactLengthsM = { ...draft.exactLengthsM };
  for (const spec of NUMBER_FIELDS) {
    if (spec.kind !== "length") continue;
    const shown = parseTypedNumber(numbers[spec.path]);
    if (shown === null || Number.isNaN(shown)) continue;
    const metres = exactLengthsM[spec.path] ?? (draft.lengthUnit === "ft" ? feetToMetres(shown) : shown);
    exactLengthsM[spec.path] = metres;
    numbers[spec.path] = formatTypedNumber(lengthUnit === "ft" ? metresToFeet(metres) : metres);
  }
  return { ...draft, lengthUnit, numbers, exactLengthsM };
}


/** A name for a new plan, such as "Tarpaulin tank 3.05 m × 1.83 m, Nile tilapia". */
export function suggestPlanName(input: PlanInput): string {
  const type = { tarpaulin: "Tarpaulin tank", concrete: "Concrete tank", earthen: "Earthen pond" }[input.tank.type];
  const d = input.tank.dimensions;
  const m = (v: number) => `${Number(v.toFixed(2))} m`;
  const size = d.shape === "round" ? `${m(d.diameterM)} across` : `${m(d.lengthM)} × ${m(d.widthM)}`;
  const fish = { tilapia: "Nile tilapia", catfish: "African catfish", both: "tilapia and catfish" }[input.species];
  return `${type} ${size}, ${fish}`;
}
