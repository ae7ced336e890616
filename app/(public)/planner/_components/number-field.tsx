"use client";
import { ConfidenceBadge } from "@/components/planner/plan-assumptions";
import { describedBy, inputClass } from "@/components/ui/field";
import type { DefaultSource } from "@/lib/planner/assumptions";

export function fieldId(path: string): string {
  return `f-${path.replace(/\./g, "-")}`;
}

export interface NumberFieldProps {
  path: string;
  label: string;
  unit: string;
  value: string;
  onChange: (text: string) => void;
  error?: string;
  /** The default as typed in the units shown, or null when the field's default is "empty". */
  defaultText: string | null;
  /** Words for the default, e.g. "1 m" or "empty: the planner's estimate, K9,425.98". */
  defaultWords: string;
  source?: DefaultSource;
  placeholder?: string;
}

/**
 * A number typed as text (so "0,85" and half-typed values stay as typed), with its default, the default's source and
 * a way back to it. Label, box and notes sit on a subgrid, so boxes side by side line up when one label wraps.
 */
export function NumberField({ path, label, unit, value, onChange, error, defaultText, defaultWords, source, placeholder }: NumberFieldProps) {
  const id = fieldId(path);
  const changed = (defaultText ?? "") !== value.trim();
  return (
    <div className="row-span-3 grid grid-rows-subgrid gap-y-1.5">
      <label htmlFor={id} className="self-end text-sm font-medium text-silt-800">
        {unit ? `${label} (${unit})` : label}
      </label>
      <input
        id={id}
        name={path}
        type="text"
        inputMode="decimal"
        autoComplete="off"
        value={value}
        placeholder={placeholder}
        onChange={(e) => onChange(e.target.value)}
        aria-invalid={Boolean(error)}
        aria-describedby={describedBy(id, error, true)}
        className={inputClass}
      />
      <div className="pb-3 text-xs text-silt-600">
        {error ? (
          <p id={`${id}-error`} role="alert" className="text-sm font-medium text-clay-600">
            {error}
          </p>
        ) : (
          <div id={`${id}-hint`} className="space-y-0.5">
            <p>
              Default {defaultWords}
              {changed ? (
                <>
                  {" · "}
                  <button type="button" onClick={() => onChange(defaultText ?? "")} className="font-medium text-lagoon-700 underline underline-offset-2 hover:text-lagoon-800">
                    Use the default
                  </button>
                </>
              ) : null}
            </p>
            {source ? (
              <p>
                <ConfidenceBadge confidence={source.confidence} /> {source.source}
              </p>
            ) : null}
          </div>
        )}
      </div>
    </div>
  );
}
