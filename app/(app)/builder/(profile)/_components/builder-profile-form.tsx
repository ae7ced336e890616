"use client";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { Card } from "@/components/ui/card";
import { describedBy, Field, FormError, FormNotice, Input } from "@/components/ui/field";
import { fieldErrorsFromZod } from "@/lib/api/form-errors";
import { putJson } from "@/lib/api/client";
import { toMajor, toMinor } from "@/lib/money/money";
import { TANK_TYPE_LABEL } from "@/lib/catalog";
import { builderProfileSchema, type BuilderProfileInput } from "@/lib/validations/provider";

type TankType = keyof typeof TANK_TYPE_LABEL;
const TYPES = Object.keys(TANK_TYPE_LABEL) as TankType[];

// The form works in major units (what people type); the API takes integer minor units.
type FormValues = {
  serviceRadiusKm: string;
  currency: string;
  baseFee: string;
  travelRate: string;
  prices: Record<TankType, { offered: boolean; materials: string; labour: string }>;
};

function toForm(p: BuilderProfileInput): FormValues {
  const row = (t: TankType) => p.prices.find((x) => x.tankType === t);
  return {
    serviceRadiusKm: String(p.serviceRadiusKm),
    currency: p.currency,
    baseFee: String(toMajor(p.baseFeeMinor, p.currency)),
    travelRate: String(toMajor(p.travelRatePerKmMinor, p.currency)),
    prices: Object.fromEntries(
      TYPES.map((t) => {
        const r = row(t);
        return [t, { offered: Boolean(r), materials: r ? String(toMajor(r.materialsPerSqmMinor, p.currency)) : "", labour: r ? String(toMajor(r.labourPerSqmMinor, p.currency)) : "" }];
      }),
    ) as FormValues["prices"],
  };
}

function num(s: string): number {
  return s.trim() === "" ? Number.NaN : Number(s.replace(",", "."));
}

export function BuilderProfileForm({ providerId, initial }: { providerId: string; initial: BuilderProfileInput }) {
  const router = useRouter();
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const { register, handleSubmit, watch, formState } = useForm<FormValues>({ defaultValues: toForm(initial) });
  const currency = watch("currency").toUpperCase();

  const onSubmit = handleSubmit(async (v) => {
    setMessage(null);
    const cur = v.currency.trim().toUpperCase();
    const safeMinor = (s: string) => {
      const n = num(s);
      try {
        return Number.isFinite(n) ? toMinor(n, cur) : Number.NaN;
      } catch {
        return Number.NaN; // unknown currency: the schema names the currency field
      }
    };
    const candidate = {
      serviceRadiusKm: num(v.serviceRadiusKm),
      currency: cur,
      baseFeeMinor: safeMinor(v.baseFee),
      travelRatePerKmMinor: safeMinor(v.travelRate),
      prices: TYPES.filter((t) => v.prices[t].offered).map((t) => ({
        tankType: t,
        materialsPerSqmMinor: safeMinor(v.prices[t].materials),
        labourPerSqmMinor: safeMinor(v.prices[t].labour),
      })),
    };
    const parsed = builderProfileSchema.safeParse(candidate);
    if (!parsed.success) {
      setErrors(fieldErrorsFromZod(parsed.error));
      setMessage({ ok: false, text: "Some values need fixing; see the marked fields." });
      return;
    }
    setErrors({});
    const result = await putJson(`/api/v1/providers/${providerId}/builder`, parsed.data);
    setMessage(result.ok ? { ok: true, text: "Saved." } : { ok: false, text: result.message });
    if (result.ok) router.refresh();
  });

  const priceError = (i: number, key: string) => errors[`prices.${i}.${key}`];
  const offeredTypes = TYPES.filter((t) => watch(`prices.${t}.offered`));

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-5">
      {message ? message.ok ? <FormNotice>{message.text}</FormNotice> : <FormError message={message.text} /> : null}
      <Card className="grid gap-4 sm:grid-cols-2">
        <Field id="serviceRadiusKm" label="Service radius (km)" hint="How far from your base you take jobs." error={errors.serviceRadiusKm}>
          <Input id="serviceRadiusKm" inputMode="numeric" aria-invalid={Boolean(errors.serviceRadiusKm)} aria-describedby={describedBy("serviceRadiusKm", errors.serviceRadiusKm, true)} {...register("serviceRadiusKm")} />
        </Field>
        <Field id="currency" label="Currency" hint="ISO 4217 code, e.g. ZMW" error={errors.currency}>
          <Input id="currency" maxLength={3} className="uppercase" aria-invalid={Boolean(errors.currency)} aria-describedby={describedBy("currency", errors.currency, true)} {...register("currency")} />
        </Field>
        <Field id="baseFee" label={`Base service fee (${currency})`} hint="Charged once per job." error={errors.baseFeeMinor}>
          <Input id="baseFee" inputMode="decimal" aria-invalid={Boolean(errors.baseFeeMinor)} aria-describedby={describedBy("baseFee", errors.baseFeeMinor, true)} {...register("baseFee")} />
        </Field>
        <Field id="travelRate" label={`Travel rate per km (${currency})`} hint="Applied to the straight-line distance to the site." error={errors.travelRatePerKmMinor}>
          <Input id="travelRate" inputMode="decimal" aria-invalid={Boolean(errors.travelRatePerKmMinor)} aria-describedby={describedBy("travelRate", errors.travelRatePerKmMinor, true)} {...register("travelRate")} />
        </Field>
      </Card>
      <Card>
        <h2 className="text-lg font-semibold">Price sheet per square metre of tank floor</h2>
        <p className="text-sm text-silt-600">Tick the tank types you build. Materials are left out of a quote when the farmer supplies them.</p>
        <div className="mt-4 space-y-4">
          {TYPES.map((t) => {
            const i = offeredTypes.indexOf(t);
            return (
              <fieldset key={t} className="rounded-lg border border-silt-200 p-3">
                <legend className="px-1">
                  <label className="flex items-center gap-2 font-medium">
                    <input type="checkbox" className="h-5 w-5 accent-lagoon-600" {...register(`prices.${t}.offered`)} />
                    {TANK_TYPE_LABEL[t]}
                  </label>
                </legend>
                {watch(`prices.${t}.offered`) ? (
                  <div className="mt-2 grid gap-3 sm:grid-cols-2">
                    <Field id={`${t}-materials`} label={`Materials per m² (${currency})`} error={priceError(i, "materialsPerSqmMinor")}>
                      <Input id={`${t}-materials`} inputMode="decimal" aria-invalid={Boolean(priceError(i, "materialsPerSqmMinor"))} {...register(`prices.${t}.materials`)} />
                    </Field>
                    <Field id={`${t}-labour`} label={`Labour per m² (${currency})`} error={priceError(i, "labourPerSqmMinor")}>
                      <Input id={`${t}-labour`} inputMode="decimal" aria-invalid={Boolean(priceError(i, "labourPerSqmMinor"))} {...register(`prices.${t}.labour`)} />
                    </Field>
                  </div>
                ) : null}
              </fieldset>
            );
          })}
        </div>
      </Card>
      <Button type="submit" disabled={formState.isSubmitting}>
        {formState.isSubmitting ? "Saving…" : "Save"}
      </Button>
    </form>
  );
}
