import type { z } from "zod";
import { findFieldSpec, schemaBounds, shownUnit, type NumberFieldPath, type NumberFieldSpec } from "./draft-fields";
import { fromSchemaUnits, parseTypedNumber, type PlanDraft } from "./plan-draft";

/* The schema's refusals worded for the form: the field's own label, and ranges in the units the person sees. */

function rangeMessage(spec: NumberFieldSpec, draft: PlanDraft, currencySymbol: string): string {
  const { min, max } = schemaBounds(spec.path as NumberFieldPath);
  const shown = (v: number) => new Intl.NumberFormat("en", { maximumFractionDigits: 2 }).format(fromSchemaUnits(spec, v, draft.lengthUnit, draft.currency));
  if (spec.kind === "money") return `${spec.label} must be between ${currencySymbol}${shown(min)} and ${currencySymbol}${shown(max)}`;
  const unit = shownUnit(spec, draft, currencySymbol);
  return `${spec.label} must be between ${shown(min)} and ${shown(max)}${unit ? ` ${unit}` : ""}`;
}

/**
 * The schema's issues as messages per form field, in the units shown. A number's range is restated in those units;
 * a rule between fields (harvest above stocking weight) keeps the schema's own words.
 */
export function draftErrors(draft: PlanDraft, issues: readonly z.core.$ZodIssue[], currencySymbol: string): Record<string, string> {
  const out: Record<string, string> = {};
  for (const issue of issues) {
    const key = issue.path.map(String).join(".") || "_";
    if (out[key]) continue;
    const spec = findFieldSpec(key);
    if (!spec) {
      out[key] = issue.message;
    } else if (issue.code === "invalid_type" && issue.expected === "int") {
      out[key] = `${spec.label} must be a whole number`;
    } else if (issue.code === "invalid_type") {
      out[key] = parseTypedNumber(draft.numbers[spec.path as NumberFieldPath]) === null ? `Enter the ${spec.label.toLowerCase()}` : `${spec.label} must be a number`;
    } else if (issue.code === "too_small" || issue.code === "too_big") {
      out[key] = rangeMessage(spec, draft, currencySymbol);
    } else {
      out[key] = issue.message;
    }
  }
  return out;
}
