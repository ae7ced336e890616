"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { Card } from "@/components/ui/card";
import { describedBy, Field, FormError, Input, inputClass } from "@/components/ui/field";
import { postJson, putJson } from "@/lib/api/client";
import { SPECIES, SPECIES_LABEL } from "@/lib/catalog";
import { BATCH_DELIVERY, batchFormSchema, type BatchFormInput, type BatchFormValues } from "@/lib/validations/reservations";

const DELIVERY_LABEL: Record<(typeof BATCH_DELIVERY)[number], string> = {
  pickup: "Buyers collect at the hatchery",
  delivery: "We deliver",
  both: "Either: buyer chooses",
};

type Props = { batchId?: string; initial: BatchFormInput };

/** Post or edit a batch. The same zod schema checks it here and on the server; a failed save keeps what was typed. */
export function BatchForm({ batchId, initial }: Props) {
  const router = useRouter();
  const [failure, setFailure] = useState<string | null>(null);
  const { register, handleSubmit, setError, formState } = useForm<BatchFormInput, unknown, BatchFormValues>({ resolver: zodResolver(batchFormSchema), defaultValues: initial });
  const { errors, isSubmitting } = formState;
  const err = (name: keyof BatchFormInput) => errors[name]?.message;

  const onSubmit = handleSubmit(async (values) => {
    setFailure(null);
    const result = batchId ? await putJson(`/api/v1/batches/${batchId}`, values) : await postJson("/api/v1/batches", values);
    if (result.ok) {
      router.push("/hatchery/batches");
      router.refresh();
      return;
    }
    for (const [field, messages] of Object.entries(result.fieldErrors ?? {})) {
      if (field in initial && messages[0]) setError(field as keyof BatchFormInput, { message: messages[0] });
    }
    setFailure(result.message);
  });

  const number = (name: "meanWeightG" | "meanLengthCm" | "countAvailable" | "pricePerFish", label: string, hint?: string) => (
    <Field id={name} label={label} hint={hint} error={err(name)}>
      <Input id={name} inputMode={name === "countAvailable" ? "numeric" : "decimal"} aria-invalid={Boolean(err(name))} aria-describedby={describedBy(name, err(name), Boolean(hint))} {...register(name)} />
    </Field>
  );

  return (
    <form onSubmit={onSubmit} noValidate>
      <Card className="space-y-5">
        <Field id="species" label="Species" error={err("species")}>
          <select id="species" className={inputClass} aria-invalid={Boolean(err("species"))} aria-describedby={describedBy("species", err("species"))} {...register("species")}>
            {SPECIES.map((s) => (
              <option key={s} value={s}>
                {SPECIES_LABEL[s]}
              </option>
            ))}
          </select>
        </Field>
        <div className="grid gap-4 sm:grid-cols-2">
          {number("meanWeightG", "Mean weight (g)", "Weigh a sample and divide by the count.")}
          {number("meanLengthCm", "Mean length (cm)")}
        </div>
        <div className="grid gap-4 sm:grid-cols-2">
          {number("countAvailable", batchId ? "Fish still on offer" : "Fish on offer", batchId ? "Fish already reserved stay reserved." : undefined)}
          <div className="grid grid-cols-[1fr_6rem] gap-2">
            {number("pricePerFish", "Price per fish")}
            <Field id="currency" label="Currency" error={err("currency")}>
              <Input id="currency" maxLength={3} autoCapitalize="characters" aria-invalid={Boolean(err("currency"))} aria-describedby={describedBy("currency", err("currency"))} {...register("currency")} />
            </Field>
          </div>
        </div>
        <div className="grid gap-4 sm:grid-cols-2">
          <Field id="readyFrom" label="Ready from" error={err("readyFrom")}>
            <Input id="readyFrom" type="date" aria-invalid={Boolean(err("readyFrom"))} aria-describedby={describedBy("readyFrom", err("readyFrom"))} {...register("readyFrom")} />
          </Field>
          <Field id="sellBy" label="Last day of sale" error={err("sellBy")}>
            <Input id="sellBy" type="date" aria-invalid={Boolean(err("sellBy"))} aria-describedby={describedBy("sellBy", err("sellBy"))} {...register("sellBy")} />
          </Field>
        </div>
        <fieldset>
          <legend className="text-sm font-medium text-silt-800">Hand-over</legend>
          <div className="mt-2 grid gap-2 sm:grid-cols-3">
            {BATCH_DELIVERY.map((d) => (
              <label key={d} className="flex min-h-11 items-center gap-2 rounded-lg border border-silt-200 px-3 text-sm has-[:checked]:border-lagoon-500 has-[:checked]:bg-lagoon-50">
                <input type="radio" value={d} className="h-5 w-5 accent-lagoon-600" {...register("delivery")} />
                {DELIVERY_LABEL[d]}
              </label>
            ))}
          </div>
          {err("delivery") ? (
            <p role="alert" className="mt-1 text-sm font-medium text-clay-600">
              {err("delivery")}
            </p>
          ) : null}
        </fieldset>
        {/* Beside the buttons, where the eye is after pressing one. */}
        <FormError message={failure} />
        <div className="flex flex-wrap gap-3">
          <Button type="submit" disabled={isSubmitting}>
            {isSubmitting ? "Saving…" : batchId ? "Save changes" : "Post batch"}
          </Button>
          <Button type="button" variant="secondary" onClick={() => router.push("/hatchery/batches")}>
            Cancel
          </Button>
        </div>
      </Card>
    </form>
  );
}
