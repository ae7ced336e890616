"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useFieldArray, useForm, type FieldPath } from "react-hook-form";
import { QuoteLines } from "@/components/jobs/quote-lines";
import { Button } from "@/components/ui/button";
import { Card } from "@/components/ui/card";
import { describedBy, Field, FormError, FormNotice, Input, inputClass } from "@/components/ui/field";
import { postJson, putJson } from "@/lib/api/client";
import { formatMoney } from "@/lib/money/money";
import { priceQuoteForm, type BuilderTerms } from "@/lib/quotes/quote-pricing";
import type { QuoteVersionView } from "@/lib/quotes/quote-views";
import { formatDistance } from "@/lib/requests/reach";
import { MAX_QUOTE_LINES, quoteFormSchema, type QuoteForm as QuoteFormValues } from "@/lib/validations/quotes";

type Props = {
  requestId: string;
  /** set when revising (or re-sending a withdrawn quote) */
  quoteId: string | null;
  mode: "send" | "revise" | "resend";
  terms: BuilderTerms;
  distanceM: number;
  initial: QuoteFormValues;
};

/** The builder's quote: typed lines, then travel computed from the straight-line distance and the rate per km. */
export function QuoteForm({ requestId, quoteId, mode, terms, distanceM, initial }: Props) {
  const router = useRouter();
  const [failure, setFailure] = useState<string | null>(null);
  const [saved, setSaved] = useState<string | null>(null);
  const { register, control, handleSubmit, watch, setError, formState } = useForm<QuoteFormValues>({
    resolver: zodResolver(quoteFormSchema, undefined, { raw: true }),
    defaultValues: initial,
  });
  const { fields, append, remove } = useFieldArray({ control, name: "lines" });
  const values = watch();
  const errors = formState.errors;

  // A live preview with the same arithmetic the server uses; shown only while every line parses.
  const parsed = quoteFormSchema.safeParse(values);
  const preview = parsed.success ? priceQuoteForm(parsed.data, terms, distanceM) : null;
  const previewView: QuoteVersionView | null =
    preview && preview.ok
      ? {
          version: 0,
          sentAt: "",
          currency: terms.currency,
          farmerSuppliesMaterials: values.scope === "farmer_supplies_materials",
          note: "",
          travelDistanceM: Math.round(distanceM),
          travelRatePerKmMinor: terms.travelRatePerKmMinor,
          baseFeeMinor: preview.priced.baseServiceFeeMinor,
          subtotalMinor: preview.priced.subtotalMinor,
          totalMinor: preview.priced.totalMinor,
          depositMinor: preview.priced.depositMinor,
          excludedMaterialsMinor: preview.priced.excludedMaterialsMinor,
          lines: preview.priced.lines,
        }
      : null;

  const onSubmit = handleSubmit(async (raw) => {
    setFailure(null);
    setSaved(null);
    const result = mode === "revise" && quoteId ? await putJson(`/api/v1/quotes/${quoteId}`, raw) : await postJson(`/api/v1/tank-requests/${requestId}/quotes`, raw);
    if (!result.ok) {
      for (const [path, messages] of Object.entries(result.fieldErrors ?? {})) {
        if (messages[0]) setError(path as FieldPath<QuoteFormValues>, { message: messages[0] });
      }
      return setFailure(result.message);
    }
    setSaved(mode === "revise" ? "Revised: the farmer sees the new version and was told." : "Sent: the farmer was told and can compare it now.");
    router.refresh();
  });

  const lineError = (i: number, key: "kind" | "description" | "quantity" | "unitPrice") => errors.lines?.[i]?.[key]?.message;

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-label={mode === "revise" ? "Revise your quote" : "Your quote"}>
      <FormError message={failure} />
      {saved ? <FormNotice>{saved}</FormNotice> : null}
      <fieldset>
        <legend className="mb-1.5 text-sm font-medium text-silt-800">What the price covers</legend>
        <div className="grid gap-2 sm:grid-cols-2">
          <label className="flex min-h-11 cursor-pointer items-center gap-2 rounded-lg border border-silt-300 bg-white px-3 py-2 text-sm has-[:checked]:border-lagoon-600 has-[:checked]:bg-lagoon-50">
            <input type="radio" value="turnkey" className="h-4 w-4 accent-lagoon-600" {...register("scope")} />
            Turnkey: I supply the materials
          </label>
          <label className="flex min-h-11 cursor-pointer items-center gap-2 rounded-lg border border-silt-300 bg-white px-3 py-2 text-sm has-[:checked]:border-lagoon-600 has-[:checked]:bg-lagoon-50">
            <input type="radio" value="farmer_supplies_materials" className="h-4 w-4 accent-lagoon-600" {...register("scope")} />
            The farmer supplies the materials
          </label>
        </div>
      </fieldset>

      <div className="space-y-3">
        {fields.map((f, i) => (
          <Card key={f.id} className="grid grid-cols-2 gap-3 p-3 sm:grid-cols-[8rem_1fr_6rem_8rem_auto] sm:items-end">
            <div className="col-span-2 sm:col-span-1">
              <Field id={`line-${i}-kind`} label="Kind" error={lineError(i, "kind")}>
                <select id={`line-${i}-kind`} className={inputClass} {...register(`lines.${i}.kind`)}>
                  <option value="materials">Materials</option>
                  <option value="labour">Labour</option>
                  <option value="other">Other</option>
                </select>
              </Field>
            </div>
            <div className="col-span-2 sm:col-span-1">
              <Field id={`line-${i}-description`} label="Description" error={lineError(i, "description")}>
                <Input id={`line-${i}-description`} aria-invalid={Boolean(lineError(i, "description"))} aria-describedby={describedBy(`line-${i}-description`, lineError(i, "description"))} {...register(`lines.${i}.description`)} />
              </Field>
            </div>
            <Field id={`line-${i}-quantity`} label="Quantity" error={lineError(i, "quantity")}>
              <Input id={`line-${i}-quantity`} inputMode="decimal" aria-invalid={Boolean(lineError(i, "quantity"))} aria-describedby={describedBy(`line-${i}-quantity`, lineError(i, "quantity"))} {...register(`lines.${i}.quantity`)} />
            </Field>
            <Field id={`line-${i}-unitPrice`} label={`Unit price (${terms.currency})`} error={lineError(i, "unitPrice")}>
              <Input id={`line-${i}-unitPrice`} inputMode="decimal" aria-invalid={Boolean(lineError(i, "unitPrice"))} aria-describedby={describedBy(`line-${i}-unitPrice`, lineError(i, "unitPrice"))} {...register(`lines.${i}.unitPrice`)} />
            </Field>
            <Button type="button" variant="ghost" className="col-span-2 sm:col-span-1" onClick={() => remove(i)} disabled={fields.length === 1}>
              Remove<span className="sr-only"> line {i + 1}</span>
            </Button>
          </Card>
        ))}
        {errors.lines?.root?.message || errors.lines?.message ? <p role="alert" className="text-sm font-medium text-clay-600">{errors.lines?.root?.message ?? errors.lines?.message}</p> : null}
        <Button type="button" variant="secondary" onClick={() => append({ kind: "other", description: "", quantity: "1", unitPrice: "" })} disabled={fields.length >= MAX_QUOTE_LINES}>
          Add a line
        </Button>
      </div>

      <p className="rounded-lg bg-silt-50 p-3 text-sm text-silt-700">
        Travel is added for you: {formatDistance(distanceM)} in a straight line from your base × {formatMoney(terms.travelRatePerKmMinor, terms.currency)} per km, shown to the
        farmer as such. Your base fee of {formatMoney(terms.baseFeeMinor, terms.currency)} is added once.
      </p>

      <Field id="quote-note" label="A note to the farmer (optional)" hint="When you can start, how long it takes, what the farmer should prepare." error={errors.note?.message}>
        <textarea id="quote-note" rows={3} className={inputClass} aria-describedby={describedBy("quote-note", errors.note?.message, true)} {...register("note")} />
      </Field>

      {previewView ? (
        <Card className="bg-silt-50">
          <h3 className="mb-2 font-semibold">What the farmer will see</h3>
          <QuoteLines quote={previewView} />
        </Card>
      ) : null}

      <Button type="submit" disabled={formState.isSubmitting}>
        {formState.isSubmitting ? "Sending…" : mode === "revise" ? "Send the revised quote" : "Send the quote"}
      </Button>
    </form>
  );
}
