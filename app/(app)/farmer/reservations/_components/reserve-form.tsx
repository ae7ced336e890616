"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useRef, useState } from "react";
import { useForm } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { Card } from "@/components/ui/card";
import { describedBy, Field, FormError, Input, inputClass } from "@/components/ui/field";
import { postJson } from "@/lib/api/client";
import { formatMoney } from "@/lib/money/money";
import { reservationAmounts } from "@/lib/reservations/amounts";
import type { ReservableBatch } from "@/lib/reservations/queries";
import { reserveSchema, type ReserveInput, type ReserveValues } from "@/lib/validations/reservations";
import { AttemptKeys } from "./attempt-key";

/** Reserve fish from one batch: the total and the deposit update as the count is typed. */
export function ReserveForm({ batch }: { batch: ReservableBatch }) {
  const router = useRouter();
  const keys = useRef(new AttemptKeys());
  const [failure, setFailure] = useState<string | null>(null);
  const fixedMethod = batch.delivery === "both" ? null : batch.delivery;
  const { register, handleSubmit, setError, watch, formState } = useForm<ReserveInput, unknown, ReserveValues>({
    resolver: zodResolver(reserveSchema),
    defaultValues: { batchId: batch.id, count: "", handoverMethod: fixedMethod ?? "pickup", note: "" },
  });
  const { errors, isSubmitting } = formState;
  const typed = Number(String(watch("count") ?? "").replace(",", "."));
  const amounts = Number.isSafeInteger(typed) && typed >= 1 && typed <= batch.countAvailable ? reservationAmounts(typed, batch.priceMinor) : null;

  const onSubmit = handleSubmit(async (values) => {
    setFailure(null);
    const result = await postJson<{ reservation: { id: string } }>("/api/v1/reservations", values, { idempotencyKey: keys.current.keyFor(values) });
    keys.current.settle(result);
    if (result.ok) {
      router.push(`/farmer/reservations/${result.data.reservation.id}`);
      return;
    }
    let placed = false;
    for (const [field, messages] of Object.entries(result.fieldErrors ?? {})) {
      if ((field === "count" || field === "handoverMethod" || field === "note") && messages[0]) {
        setError(field, { message: messages[0] });
        placed = true;
      }
    }
    if (!placed) setFailure(result.message);
  });

  return (
    <form onSubmit={onSubmit} noValidate>
      <Card className="space-y-5">
        <FormError message={failure} />
        <input type="hidden" {...register("batchId")} />
        <Field id="count" label="How many fish?" hint={`Up to ${batch.countAvailable.toLocaleString("en")} are available.`} error={errors.count?.message}>
          <Input id="count" inputMode="numeric" autoComplete="off" aria-invalid={Boolean(errors.count)} aria-describedby={describedBy("count", errors.count?.message, true)} {...register("count")} />
        </Field>
        {fixedMethod ? (
          <p className="text-sm text-silt-700">{fixedMethod === "pickup" ? "You collect the fish at the hatchery." : "The hatchery delivers the fish."}</p>
        ) : (
          <fieldset>
            <legend className="text-sm font-medium text-silt-800">Hand-over</legend>
            <div className="mt-2 grid gap-2 sm:grid-cols-2">
              {(["pickup", "delivery"] as const).map((m) => (
                <label key={m} className="flex min-h-11 items-center gap-2 rounded-lg border border-silt-200 px-3 text-sm has-[:checked]:border-lagoon-500 has-[:checked]:bg-lagoon-50">
                  <input type="radio" value={m} className="h-5 w-5 accent-lagoon-600" {...register("handoverMethod")} />
                  {m === "pickup" ? "I collect at the hatchery" : "The hatchery delivers"}
                </label>
              ))}
            </div>
            {errors.handoverMethod ? (
              <p role="alert" className="mt-1 text-sm font-medium text-clay-600">
                {errors.handoverMethod.message}
              </p>
            ) : null}
          </fieldset>
        )}
        <Field id="note" label="Note to the hatchery (optional)" error={errors.note?.message}>
          <textarea id="note" rows={3} className={inputClass} aria-invalid={Boolean(errors.note)} {...register("note")} />
        </Field>
        <div className="rounded-lg bg-lagoon-50 p-4 text-sm" aria-live="polite">
          {amounts ? (
            <>
              <p>
                Total <strong>{formatMoney(amounts.totalMinor, batch.currency)}</strong> ({formatMoney(batch.priceMinor, batch.currency)} × {typed.toLocaleString("en")})
              </p>
              <p className="mt-1">
                Deposit to pay once the hatchery accepts: <strong>{formatMoney(amounts.depositMinor, batch.currency)}</strong>. Shoal holds it until your fish have been through their first week.
              </p>
            </>
          ) : (
            <p>Type a count to see the total and the deposit.</p>
          )}
        </div>
        <Button type="submit" disabled={isSubmitting}>
          {isSubmitting ? "Reserving…" : "Reserve"}
        </Button>
      </Card>
    </form>
  );
}
