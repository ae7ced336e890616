"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { Card } from "@/components/ui/card";
import { describedBy, Field, FormError, FormNotice, Input } from "@/components/ui/field";
import { putJson } from "@/lib/api/client";
import { SPECIES_LABEL } from "@/lib/catalog";
import { hatcheryProfileSchema, type HatcheryProfileInput } from "@/lib/validations/provider";

export function HatcheryProfileForm({ providerId, initial }: { providerId: string; initial: HatcheryProfileInput }) {
  const router = useRouter();
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  const { register, handleSubmit, formState, watch } = useForm<HatcheryProfileInput>({ resolver: zodResolver(hatcheryProfileSchema), defaultValues: initial });
  const { errors, isSubmitting } = formState;
  const delivers = watch("delivers");

  const onSubmit = handleSubmit(async (values) => {
    const result = await putJson(`/api/v1/providers/${providerId}/hatchery`, values);
    setMessage(result.ok ? { ok: true, text: "Saved." } : { ok: false, text: result.message });
    if (result.ok) router.refresh();
  });

  return (
    <form onSubmit={onSubmit} noValidate>
      <Card className="space-y-5">
        {message ? message.ok ? <FormNotice>{message.text}</FormNotice> : <FormError message={message.text} /> : null}
        <fieldset>
          <legend className="text-sm font-medium text-silt-800">Species you produce</legend>
          <div className="mt-2 flex flex-wrap gap-3">
            {(Object.keys(SPECIES_LABEL) as (keyof typeof SPECIES_LABEL)[]).map((s) => (
              <label key={s} className="flex min-h-11 items-center gap-2 rounded-lg border border-silt-200 px-3 has-[:checked]:border-lagoon-500 has-[:checked]:bg-lagoon-50">
                <input type="checkbox" value={s} className="h-5 w-5 accent-lagoon-600" {...register("species")} />
                {SPECIES_LABEL[s]}
              </label>
            ))}
          </div>
          {errors.species ? (
            <p role="alert" className="mt-1 text-sm font-medium text-clay-600">
              {errors.species.message}
            </p>
          ) : null}
        </fieldset>
        <label className="flex items-center gap-2">
          <input type="checkbox" className="h-5 w-5 accent-lagoon-600" {...register("delivers")} />
          <span className="text-sm font-medium text-silt-800">We deliver fingerlings</span>
        </label>
        {delivers ? (
          <Field id="deliveryRadiusKm" label="Delivery radius (km)" error={errors.deliveryRadiusKm?.message}>
            <Input
              id="deliveryRadiusKm"
              inputMode="numeric"
              aria-invalid={Boolean(errors.deliveryRadiusKm)}
              aria-describedby={describedBy("deliveryRadiusKm", errors.deliveryRadiusKm?.message)}
              {...register("deliveryRadiusKm", { valueAsNumber: true })}
            />
          </Field>
        ) : null}
        <Button type="submit" disabled={isSubmitting}>
          {isSubmitting ? "Saving…" : "Save"}
        </Button>
      </Card>
    </form>
  );
}
