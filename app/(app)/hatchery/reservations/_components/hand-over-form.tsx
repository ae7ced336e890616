"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { describedBy, FormError, Input } from "@/components/ui/field";
import { postJson } from "@/lib/api/client";
import { handOverSchema, type HandOverInput } from "@/lib/validations/reservations";

/** Records the hand-over with the count actually handed over (at most the count reserved). */
export function HandOverForm({ reservationId, reserved, onDone, idPrefix = "handover" }: { reservationId: string; reserved: number; onDone: () => void; idPrefix?: string }) {
  const [failure, setFailure] = useState<string | null>(null);
  const { register, handleSubmit, setError, formState } = useForm<HandOverInput, unknown, { action: "hand_over"; count: number }>({
    resolver: zodResolver(handOverSchema),
    defaultValues: { action: "hand_over", count: String(reserved) },
  });
  const error = formState.errors.count?.message;
  const id = `${idPrefix}-${reservationId}`;
  const onSubmit = handleSubmit(async (values) => {
    setFailure(null);
    const result = await postJson(`/api/v1/reservations/${reservationId}/actions`, values);
    if (result.ok) return onDone();
    const fieldMessage = result.fieldErrors?.count?.[0];
    if (fieldMessage) setError("count", { message: fieldMessage });
    else setFailure(result.message);
  });
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-2">
      <FormError message={failure} />
      <label htmlFor={id} className="block text-sm font-medium text-silt-800">
        Fish handed over (of {reserved.toLocaleString("en")})
      </label>
      <div className="flex flex-wrap items-start gap-2">
        <Input id={id} inputMode="numeric" className="max-w-32" aria-invalid={Boolean(error)} aria-describedby={describedBy(id, error)} {...register("count")} />
        <Button type="submit" disabled={formState.isSubmitting}>
          {formState.isSubmitting ? "Saving…" : "Record hand-over"}
        </Button>
      </div>
      {error ? (
        <p id={`${id}-error`} role="alert" className="text-sm font-medium text-clay-600">
          {error}
        </p>
      ) : null}
    </form>
  );
}
