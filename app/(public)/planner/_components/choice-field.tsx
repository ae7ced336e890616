"use client";
import type { ReactNode } from "react";
import { inputClass } from "@/components/ui/field";

export interface Choice<T extends string> {
  value: T;
  label: string;
  note?: string;
}

/** A radio group as a row of tappable cards; arrow keys move within it as in any radio group. */
export function RadioCards<T extends string>({
  name,
  legend,
  choices,
  value,
  onChange,
  columns = "sm:grid-cols-3",
  hint,
}: {
  name: string;
  legend: string;
  choices: readonly Choice<T>[];
  value: T;
  onChange: (value: T) => void;
  columns?: string;
  hint?: ReactNode;
}) {
  return (
    <fieldset>
      <legend className="text-sm font-medium text-silt-800">{legend}</legend>
      {hint ? <p className="mt-0.5 text-xs text-silt-600">{hint}</p> : null}
      <div className={`mt-2 grid gap-2 ${columns}`}>
        {choices.map((c) => (
          <label
            key={c.value}
            className="flex min-h-11 cursor-pointer items-start gap-2 rounded-lg border border-silt-200 bg-white px-3 py-2 has-[:checked]:border-lagoon-500 has-[:checked]:bg-lagoon-50 has-[:focus-visible]:ring-2 has-[:focus-visible]:ring-reed-500"
          >
            <input type="radio" name={name} value={c.value} checked={value === c.value} onChange={() => onChange(c.value)} className="mt-1 h-4 w-4 shrink-0 accent-lagoon-600" />
            <span>
              <span className="block text-sm font-medium text-silt-900">{c.label}</span>
              {c.note ? <span className="block text-xs text-silt-600">{c.note}</span> : null}
            </span>
          </label>
        ))}
      </div>
    </fieldset>
  );
}

export function SelectField<T extends string>({ id, label, choices, value, onChange }: { id: string; label: string; choices: readonly Choice<T>[]; value: T; onChange: (value: T) => void }) {
  return (
    <div className="space-y-1.5">
      <label htmlFor={id} className="block text-sm font-medium text-silt-800">
        {label}
      </label>
      <select id={id} value={value} onChange={(e) => onChange(choices.find((c) => c.value === e.target.value)?.value ?? value)} className={inputClass}>
        {choices.map((c) => (
          <option key={c.value} value={c.value}>
            {c.label}
          </option>
        ))}
      </select>
    </div>
  );
}
