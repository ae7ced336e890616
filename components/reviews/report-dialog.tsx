"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import { useState, type RefObject } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { Button } from "@/components/ui/button";
import { Dialog } from "@/components/ui/dialog";
import { describedBy, FormError, inputClass } from "@/components/ui/field";
import { postJson } from "@/lib/api/client";
import { REPORT_REASON_LABELS, REPORT_REASONS } from "@/lib/reviews/types";
import { reportSchema } from "@/lib/validations/reviews";

type FormInput = z.input<typeof reportSchema>;
type FormOutput = z.output<typeof reportSchema>;

type Props = {
  reviewId: string;
  authorName: string;
  open: boolean;
  onClose: () => void;
  /** the report is with the moderators (sent now, or by this account before) */
  onReported: () => void;
  returnFocusTo: RefObject<HTMLElement | null>;
};

/**
 * The report dialog: why, and optionally what. Loaded only when someone opens it (see report-review.tsx), so the
 * form library stays off the provider page's first load.
 */
export function ReportDialog({ reviewId, authorName, open, onClose, onReported, returnFocusTo }: Props) {
  const [failure, setFailure] = useState<string | null>(null);
  const { register, handleSubmit, reset, setError, formState } = useForm<FormInput, unknown, FormOutput>({
    resolver: zodResolver(reportSchema),
    defaultValues: { details: "" },
  });
  const reasonError = formState.errors.reason?.message;
  const detailsError = formState.errors.details?.message;
  const base = `report-${reviewId}`;

  const send = handleSubmit(async (values) => {
    setFailure(null);
    const result = await postJson(`/api/v1/reviews/${reviewId}/reports`, values);
    if (result.ok || result.status === 409) {
      // 409: reported by this account before (another tab) or already hidden; either way nothing more to do here.
      reset();
      onReported();
      return;
    }
    const reason = result.fieldErrors?.reason?.[0];
    const details = result.fieldErrors?.details?.[0];
    if (reason) setError("reason", { message: reason });
    if (details) setError("details", { message: details });
    if (!reason && !details) setFailure(result.message);
  });

  return (
    <Dialog open={open} onClose={onClose} title="Report this review" returnFocusTo={returnFocusTo}>
      <form onSubmit={send} noValidate className="space-y-4">
        <p className="text-sm text-silt-700">
          Tell us what is wrong with it. A Shoal moderator reads every report and decides whether the review stays up. {authorName} is not told who reported it.
        </p>
        <FormError message={failure} />
        <fieldset aria-describedby={reasonError ? `${base}-reason-error` : undefined}>
          <legend className="text-sm font-medium text-silt-800">Why are you reporting it?</legend>
          <div className="mt-2 space-y-1.5">
            {REPORT_REASONS.map((reason, i) => (
              <label key={reason} className="flex min-h-11 cursor-pointer items-center gap-3 rounded-lg border border-silt-200 px-3 py-2 text-sm has-[:checked]:border-lagoon-500 has-[:checked]:bg-lagoon-50">
                <input type="radio" value={reason} className="h-5 w-5 shrink-0 accent-lagoon-600" data-autofocus={i === 0 ? "" : undefined} {...register("reason")} />
                {REPORT_REASON_LABELS[reason]}
              </label>
            ))}
          </div>
          {reasonError ? (
            <p id={`${base}-reason-error`} role="alert" className="mt-1 text-sm font-medium text-clay-600">
              {reasonError}
            </p>
          ) : null}
        </fieldset>
        <div className="space-y-1.5">
          <label htmlFor={`${base}-details`} className="block text-sm font-medium text-silt-800">
            Anything the moderator should know? (optional)
          </label>
          <textarea id={`${base}-details`} rows={3} maxLength={1000} className={inputClass} aria-invalid={Boolean(detailsError)} aria-describedby={describedBy(`${base}-details`, detailsError)} {...register("details")} />
          {detailsError ? (
            <p id={`${base}-details-error`} role="alert" className="text-sm font-medium text-clay-600">
              {detailsError}
            </p>
          ) : null}
        </div>
        <div className="flex flex-wrap gap-2">
          <Button type="submit" disabled={formState.isSubmitting}>
            {formState.isSubmitting ? "Sending…" : "Send the report"}
          </Button>
          <Button type="button" variant="secondary" onClick={onClose}>
            Cancel
          </Button>
        </div>
      </form>
    </Dialog>
  );
}
