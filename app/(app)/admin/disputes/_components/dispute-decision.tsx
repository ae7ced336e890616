"use client";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { describedBy, Field, inputClass } from "@/components/ui/field";
import { postJson } from "@/lib/api/client";
import { formatMoney, minorDigits, toMajor, toMinor } from "@/lib/money/money";

type Props = { dispute: { kind: "job" | "reservation"; id: string; reference: string; currency: string; depositMinor: number } };
type Outcome = "for_farmer" | "for_provider" | "split";
type Values = { outcome: Outcome | ""; release: string; note: string };

/** The admin's decision on one dispute: who gets the frozen deposit, and why (kept in the audit log). */
export function DisputeDecision({ dispute }: Props) {
  const router = useRouter();
  const [failure, setFailure] = useState<string | null>(null);
  const { register, handleSubmit, watch, setError, formState } = useForm<Values>({ defaultValues: { outcome: "", release: "", note: "" } });
  const outcome = watch("outcome");
  const deposit = formatMoney(dispute.depositMinor, dispute.currency);
  const provider = dispute.kind === "job" ? "builder" : "hatchery";
  const prefix = `decision-${dispute.id}`;

  async function onSubmit(values: Values) {
    setFailure(null);
    if (!values.outcome) return setError("outcome", { message: "Choose who the deposit goes to" });
    let releaseMinor: number | undefined;
    if (values.outcome === "split") {
      const major = Number(values.release.replace(",", "."));
      const minor = Number.isFinite(major) ? toMinor(major, dispute.currency) : Number.NaN;
      if (!(minor > 0 && minor < dispute.depositMinor) || !Number.isInteger(minor)) {
        const most = toMajor(dispute.depositMinor, dispute.currency).toFixed(minorDigits(dispute.currency));
        return setError("release", { message: `Give an amount above 0 and below ${most}` });
      }
      releaseMinor = minor;
    }
    const result =
      dispute.kind === "job"
        ? await postJson(`/api/v1/jobs/${dispute.id}/events`, { type: "resolve", outcome: values.outcome === "for_provider" ? "for_builder" : values.outcome, releaseMinor, note: values.note })
        : await postJson(`/api/v1/reservations/${dispute.id}/actions`, { action: "resolve_dispute", outcome: values.outcome === "split" ? "for_provider" : values.outcome, note: values.note });
    if (!result.ok) {
      setFailure(result.message);
      return;
    }
    router.refresh();
  }

  const errors = formState.errors;
  return (
    <form onSubmit={handleSubmit(onSubmit)} noValidate className="space-y-3 rounded-lg border border-silt-200 p-3" aria-label={`Decide ${dispute.reference}`}>
      <fieldset aria-describedby={errors.outcome ? `${prefix}-outcome-error` : undefined}>
        <legend className="text-sm font-semibold text-silt-900">Decision on the {deposit} deposit</legend>
        <div className="mt-2 space-y-2 text-sm">
          <label className="flex items-start gap-2">
            <input type="radio" value="for_farmer" {...register("outcome")} className="mt-1 accent-lagoon-600" />
            <span>For the farmer: the whole deposit goes back</span>
          </label>
          <label className="flex items-start gap-2">
            <input type="radio" value="for_provider" {...register("outcome")} className="mt-1 accent-lagoon-600" />
            <span>{dispute.kind === "job" ? "For the builder: the whole deposit is released to them" : "For the hatchery: released for the fish handed over"}</span>
          </label>
          {dispute.kind === "job" ? (
            <label className="flex items-start gap-2">
              <input type="radio" value="split" {...register("outcome")} className="mt-1 accent-lagoon-600" />
              <span>Split: part to the {provider}, the rest back to the farmer</span>
            </label>
          ) : null}
        </div>
        {errors.outcome ? (
          <p id={`${prefix}-outcome-error`} role="alert" className="mt-1 text-sm font-medium text-clay-600">
            {errors.outcome.message}
          </p>
        ) : null}
      </fieldset>
      {outcome === "split" ? (
        <Field id={`${prefix}-release`} label={`Amount to the ${provider} (${dispute.currency})`} error={errors.release?.message}>
          <input
            id={`${prefix}-release`}
            inputMode="decimal"
            className={inputClass}
            aria-invalid={errors.release ? true : undefined}
            aria-describedby={describedBy(`${prefix}-release`, errors.release?.message)}
            {...register("release")}
          />
        </Field>
      ) : null}
      <Field id={`${prefix}-note`} label="Note for the record" hint="Who you spoke to and what you saw. Kept in the audit log." error={errors.note?.message}>
        <textarea
          id={`${prefix}-note`}
          rows={3}
          maxLength={2000}
          className={inputClass}
          aria-describedby={describedBy(`${prefix}-note`, errors.note?.message, true)}
          {...register("note", { maxLength: { value: 2000, message: "Keep the note under 2000 characters" } })}
        />
      </Field>
      {failure ? (
        <p role="alert" className="text-sm font-medium text-clay-600">
          {failure}
        </p>
      ) : null}
      <Button type="submit" disabled={formState.isSubmitting} className="w-full">
        {formState.isSubmitting ? "Deciding…" : "Record the decision"}
      </Button>
    </form>
  );
}
