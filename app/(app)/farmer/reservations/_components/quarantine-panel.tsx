"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { describedBy, FormError, Input, inputClass } from "@/components/ui/field";
import { postJson } from "@/lib/api/client";
import { QUARANTINE_CHECKLIST } from "@/lib/reservations/labels";
import { disputeSchema, survivalSchema, type DisputeInput, type SurvivalInput } from "@/lib/validations/reservations";

type Props = {
  reservationId: string;
  handedOverCount: number;
  checks: Record<string, string>;
  canCheck: boolean;
  canReport: boolean;
  reportNotYet: string | null;
  canDispute: boolean;
};

/** The first week after hand-over: the checklist, the day-7 survival report and the dispute. */
export function QuarantinePanel({ reservationId, handedOverCount, checks, canCheck, canReport, reportNotYet, canDispute }: Props) {
  const router = useRouter();
  const [ticked, setTicked] = useState<Record<string, boolean>>(() => Object.fromEntries(QUARANTINE_CHECKLIST.map((c) => [c.id, Boolean(checks[c.id])])));
  const [checkError, setCheckError] = useState<string | null>(null);
  const [failure, setFailure] = useState<string | null>(null);
  const [disputing, setDisputing] = useState(false);

  const survival = useForm<SurvivalInput, unknown, { action: "report_survival"; survived: number }>({ resolver: zodResolver(survivalSchema), defaultValues: { action: "report_survival", survived: "" } });
  const dispute = useForm<DisputeInput, unknown, { action: "dispute"; reason: string }>({ resolver: zodResolver(disputeSchema), defaultValues: { action: "dispute", reason: "" } });

  async function tick(item: (typeof QUARANTINE_CHECKLIST)[number]["id"], done: boolean) {
    setTicked((t) => ({ ...t, [item]: done }));
    setCheckError(null);
    const result = await postJson(`/api/v1/reservations/${reservationId}/actions`, { action: "check", item, done });
    if (!result.ok) {
      setTicked((t) => ({ ...t, [item]: !done }));
      setCheckError(result.message);
    }
  }

  const report = survival.handleSubmit(async (values) => {
    setFailure(null);
    const result = await postJson(`/api/v1/reservations/${reservationId}/actions`, values);
    if (result.ok) return router.refresh();
    const message = result.fieldErrors?.survived?.[0];
    if (message) survival.setError("survived", { message });
    else setFailure(result.message);
  });

  const openDispute = dispute.handleSubmit(async (values) => {
    setFailure(null);
    const result = await postJson(`/api/v1/reservations/${reservationId}/actions`, values);
    if (result.ok) return router.refresh();
    const message = result.fieldErrors?.reason?.[0];
    if (message) dispute.setError("reason", { message });
    else setFailure(result.message);
  });

  const survivedError = survival.formState.errors.survived?.message;
  const reasonError = dispute.formState.errors.reason?.message;
  return (
    <div className="space-y-6">
      <FormError message={failure} />
      <section aria-labelledby="checklist-heading">
        <h3 id="checklist-heading" className="font-semibold text-silt-900">
          Quarantine checklist
        </h3>
        <ul className="mt-2 space-y-2">
          {QUARANTINE_CHECKLIST.map((c) => (
            <li key={c.id}>
              <label className="flex items-start gap-3 rounded-lg border border-silt-200 p-3 text-sm has-[:checked]:border-lagoon-300 has-[:checked]:bg-lagoon-50">
                <input type="checkbox" className="mt-0.5 h-5 w-5 shrink-0 accent-lagoon-600" checked={ticked[c.id] ?? false} disabled={!canCheck} onChange={(e) => tick(c.id, e.target.checked)} />
                <span>{c.text}</span>
              </label>
            </li>
          ))}
        </ul>
        {checkError ? (
          <p role="alert" className="mt-1 text-sm font-medium text-clay-600">
            {checkError}
          </p>
        ) : null}
      </section>

      <section aria-labelledby="survival-heading">
        <h3 id="survival-heading" className="font-semibold text-silt-900">
          Day 7: how many survived?
        </h3>
        {canReport ? (
          <form onSubmit={report} noValidate className="mt-2 space-y-2">
            <label htmlFor="survived" className="block text-sm text-silt-800">
              Fish alive after the first week (of {handedOverCount.toLocaleString("en")} handed over)
            </label>
            <div className="flex flex-wrap items-start gap-2">
              <Input id="survived" inputMode="numeric" className="max-w-32" aria-invalid={Boolean(survivedError)} aria-describedby={describedBy("survived", survivedError)} {...survival.register("survived")} />
              <Button type="submit" disabled={survival.formState.isSubmitting}>
                {survival.formState.isSubmitting ? "Sending…" : "Report and release the deposit"}
              </Button>
            </div>
            {survivedError ? (
              <p id="survived-error" role="alert" className="text-sm font-medium text-clay-600">
                {survivedError}
              </p>
            ) : null}
            <p className="text-xs text-silt-600">Reporting releases the deposit to the hatchery for the fish handed over. If something is wrong, open a dispute instead.</p>
          </form>
        ) : (
          <p className="mt-1 text-sm text-silt-700">{reportNotYet ?? "Not open now."}</p>
        )}
      </section>

      {canDispute ? (
        <section aria-labelledby="dispute-heading">
          <h3 id="dispute-heading" className="font-semibold text-silt-900">
            Something wrong?
          </h3>
          {disputing ? (
            <form onSubmit={openDispute} noValidate className="mt-2 space-y-2">
              <label htmlFor="reason" className="block text-sm text-silt-800">
                What went wrong? (count short, fish sick or dying, wrong size)
              </label>
              <textarea id="reason" rows={3} className={inputClass} aria-invalid={Boolean(reasonError)} aria-describedby={describedBy("reason", reasonError)} {...dispute.register("reason")} />
              {reasonError ? (
                <p id="reason-error" role="alert" className="text-sm font-medium text-clay-600">
                  {reasonError}
                </p>
              ) : null}
              <div className="flex gap-2">
                <Button type="submit" variant="danger" disabled={dispute.formState.isSubmitting}>
                  Open a dispute
                </Button>
                <Button type="button" variant="secondary" onClick={() => setDisputing(false)}>
                  Back
                </Button>
              </div>
              <p className="text-xs text-silt-600">The deposit stays frozen until a Shoal administrator decides.</p>
            </form>
          ) : (
            <Button className="mt-2" variant="secondary" onClick={() => setDisputing(true)}>
              Open a dispute
            </Button>
          )}
        </section>
      ) : null}
    </div>
  );
}
