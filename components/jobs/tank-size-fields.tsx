"use client";
import type { UseFormRegisterReturn } from "react-hook-form";
import { describedBy, Field, Input } from "@/components/ui/field";
import { TANK_TYPE_LABEL, TANK_TYPES } from "@/lib/catalog";

type Name = "tankType" | "shape" | "unit" | "length" | "width" | "diameter" | "depth";

export type TankSizeFieldsProps = {
  idPrefix: string;
  register: { [K in Name]: UseFormRegisterReturn<K> };
  shape: string;
  unit: string;
  errors: Partial<Record<Name, string>>;
};

function Choice({ reg, value, label, id }: { reg: UseFormRegisterReturn; value: string; label: string; id: string }) {
  return (
    <label htmlFor={id} className="flex min-h-11 cursor-pointer items-center gap-2 rounded-lg border border-silt-300 bg-white px-3 py-2 text-sm has-[:checked]:border-lagoon-600 has-[:checked]:bg-lagoon-50">
      <input id={id} type="radio" value={value} className="h-4 w-4 accent-lagoon-600" {...reg} />
      {label}
    </label>
  );
}

/** Tank type and inner size (length × width or diameter, and depth) in metres or feet. Shared by requests and portfolio. */
export function TankSizeFields({ idPrefix, register, shape, unit, errors }: TankSizeFieldsProps) {
  const id = (name: string) => `${idPrefix}-${name}`;
  const sizeInput = (name: "length" | "width" | "diameter" | "depth", label: string, hint?: string) => (
    <Field id={id(name)} label={`${label} (${unit === "ft" ? "feet" : "metres"})`} hint={hint} error={errors[name]}>
      <Input id={id(name)} inputMode="decimal" autoComplete="off" aria-invalid={Boolean(errors[name])} aria-describedby={describedBy(id(name), errors[name], Boolean(hint))} {...register[name]} />
    </Field>
  );
  return (
    <div className="space-y-4">
      <fieldset>
        <legend className="mb-1.5 text-sm font-medium text-silt-800">Tank type</legend>
        <div className="grid gap-2 sm:grid-cols-3">
          {TANK_TYPES.map((t) => (
            <Choice key={t} id={id(`type-${t}`)} reg={register.tankType} value={t} label={TANK_TYPE_LABEL[t]} />
          ))}
        </div>
        {errors.tankType ? <p role="alert" className="mt-1 text-sm font-medium text-clay-600">{errors.tankType}</p> : null}
      </fieldset>
      <div className="grid gap-4 sm:grid-cols-2">
        <fieldset>
          <legend className="mb-1.5 text-sm font-medium text-silt-800">Shape</legend>
          <div className="grid grid-cols-2 gap-2">
            <Choice id={id("shape-rect")} reg={register.shape} value="rectangular" label="Rectangular" />
            <Choice id={id("shape-round")} reg={register.shape} value="round" label="Round" />
          </div>
        </fieldset>
        <fieldset>
          <legend className="mb-1.5 text-sm font-medium text-silt-800">Sizes in</legend>
          <div className="grid grid-cols-2 gap-2">
            <Choice id={id("unit-m")} reg={register.unit} value="m" label="Metres" />
            <Choice id={id("unit-ft")} reg={register.unit} value="ft" label="Feet" />
          </div>
        </fieldset>
      </div>
      <div className="grid gap-4 sm:grid-cols-3">
        {shape === "round" ? (
          sizeInput("diameter", "Inner diameter")
        ) : (
          <>
            {sizeInput("length", "Inner length")}
            {sizeInput("width", "Inner width")}
          </>
        )}
        {sizeInput("depth", "Wall height or depth", "Inside, from floor to rim")}
      </div>
    </div>
  );
}
