"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { Button } from "@/components/ui/button";
import { FormError, inputClass } from "@/components/ui/field";
import { postJson } from "@/lib/api/client";
import { REVIEW_LIMITS } from "@/lib/reviews/types";
import { replySchema } from "@/lib/validations/reviews";

type FormInput = z.input<typeof replySchema>;
type FormOutput = z.output<typeof replySchema>;

/** The provider's one public reply, as a form; loaded by reply-form.tsx when the provider asks for it. */
export function ReplyFormFields({ reviewId, authorName, onCancel }: { reviewId: string; authorName: string; onCancel: () => void }) {
  const router = useRouter();
  const [failure, setFailure] = useState<string | null>(null);
  const { register, handleSubmit, setError, watch, formState } = useForm<FormInput, unknown, FormOutput>({ resolver: zodResolver(replySchema), defaultValues: { body: "" } });
  const id = `reply-${reviewId}`;
  const error = formState.errors.body?.message;
  const length = (watch("body") ?? "").length;

  const send = handleSubmit(async (values) => {
    setFailure(null);
    const result = await postJson(`/api/v1/reviews/${reviewId}/reply`, values);
    if (result.ok) return router.refresh();
    const message = result.fieldErrors?.body?.[0];
    if (message) setError("body", { message });
    else setFailure(result.message);
  });

  return (
    <form onSubmit={send} noValidate className="space-y-2 rounded-lg border border-lagoon-200 bg-lagoon-50/50 p-3">
      <label htmlFor={id} className="block text-sm font-medium text-silt-800">
        Your reply to {authorName}
      </label>
      <textarea
        id={id}
        rows={4}
        maxLength={REVIEW_LIMITS.replyMax}
        autoFocus
        className={inputClass}
        aria-invalid={Boolean(error)}
        aria-describedby={`${error ? `${id}-error` : `${id}-hint`} ${id}-count`}
        {...register("body")}
      />
      <div className="flex flex-wrap items-start justify-between gap-2">
        {error ? (
          <p id={`${id}-error`} role="alert" className="text-sm font-medium text-clay-600">
            {error}
          </p>
        ) : (
          <p id={`${id}-hint`} className="text-xs text-silt-600">
            Everyone can read it, and you can reply only once. Thank them, or say calmly what happened on your side.
          </p>
        )}
        <p id={`${id}-count`} className="ml-auto text-xs tabular-nums text-silt-600">
          {length} of {REVIEW_LIMITS.replyMax} characters
        </p>
      </div>
      <FormError message={failure} />
      <div className="flex flex-wrap gap-2">
        <Button type="submit" disabled={formState.isSubmitting}>
          {formState.isSubmitting ? "Publishing…" : "Publish the reply"}
        </Button>
        <Button type="button" variant="ghost" onClick={onCancel}>
          Not now
        </Button>
      </div>
    </form>
  );
}
