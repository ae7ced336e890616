"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { Button } from "@/components/ui/button";
import { describedBy, FormError, inputClass } from "@/components/ui/field";
import { postJson } from "@/lib/api/client";
import type { ModerationDecision } from "@/lib/reviews/types";
import { moderationDecisionSchema } from "@/lib/validations/reviews";

type FormInput = z.input<typeof moderationDecisionSchema>;
type FormOutput = z.output<typeof moderationDecisionSchema>;

/** Keep or hide a reported review, always with a note: the note goes to the audit log with the decision. */
export function ReportDecision({ reportId, authorName }: { reportId: string; authorName: string }) {
  const router = useRouter();
  const [failure, setFailure] = useState<string | null>(null);
  const { register, handleSubmit, setValue, setError, formState } = useForm<FormInput, unknown, FormOutput>({
    resolver: zodResolver(moderationDecisionSchema),
    defaultValues: { note: "" },
  });
  const id = `decision-${reportId}`;
  const noteError = formState.errors.note?.message;

  const send = handleSubmit(async (values) => {
    setFailure(null);
    const result = await postJson(`/api/v1/admin/review-reports/${reportId}/decision`, values);
    if (result.ok) return router.refresh();
    const message = result.fieldErrors?.note?.[0];
    if (message) setError("note", { message });
    else setFailure(result.message);
  });

  const decide = (decision: ModerationDecision) => () => setValue("decision", decision);

  return (
    <form onSubmit={send} noValidate className="space-y-2" aria-label={`Decide on the report about ${authorName}'s review`}>
      <div className="space-y-1.5">
        <label htmlFor={id} className="block text-sm font-medium text-silt-800">
          Note for the log
        </label>
        <textarea id={id} rows={2} className={inputClass} aria-invalid={Boolean(noteError)} aria-describedby={describedBy(id, noteError, true)} {...register("note")} />
        {noteError ? (
          <p id={`${id}-error`} role="alert" className="text-sm font-medium text-clay-600">
            {noteError}
          </p>
        ) : (
          <p id={`${id}-hint`} className="text-xs text-silt-600">
            Why you decided so, in a few words. It is kept in the audit log with your decision.
          </p>
        )}
      </div>
      <FormError message={failure} />
      <div className="flex flex-wrap gap-2">
        <Button type="submit" variant="secondary" onClick={decide("keep")} disabled={formState.isSubmitting}>
          Keep it up
        </Button>
        <Button type="submit" variant="danger" onClick={decide("hide")} disabled={formState.isSubmitting}>
          Hide the review
        </Button>
      </div>
    </form>
  );
}
