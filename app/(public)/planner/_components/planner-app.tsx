"use client";
import { useDeferredValue, useEffect, useMemo, useState } from "react";
import { Button } from "@/components/ui/button";
import { currencySymbol } from "@/components/planner/format";
import { PlanReport } from "@/components/planner/plan-report";
import { estimatePlan } from "@/lib/planner/estimate";
import { findFieldSpec } from "@/lib/plans/draft-fields";
import { draftErrors } from "@/lib/plans/draft-messages";
import { draftToCandidate, inputToDraft, suggestPlanName, withNumber, type PlanDraft } from "@/lib/plans/plan-draft";
import { defaultPlanInput, planInputSchema, type PlanInput } from "@/lib/validations/planner";
import { clearStoredDraft, loadStoredDraft, storeDraft } from "./draft-storage";
import { fieldId } from "./number-field";
import { PlanForm } from "./plan-form";
import { SavePanel, type SavedPlanRef, type Viewer } from "./save-panel";
import { SummaryBar } from "./summary-bar";

/** The name of a field in the list of fields to fix; a choice that is not a number is named by its path. */
function labelOf(path: string): string {
  return findFieldSpec(path)?.label ?? (path === "currency" ? "Currency" : path);
}

/**
 * The live planner: the form on one side, every figure on the other, recomputed in the browser on each keystroke with
 * the same estimatePlan the API runs. While a field is not valid the figures stay on the last valid entry.
 */
export function PlannerApp({ initialInput, initialPlan, viewer }: { initialInput: PlanInput; initialPlan: SavedPlanRef | null; viewer: Viewer }) {
  const [draft, setDraft] = useState<PlanDraft>(() => inputToDraft(initialInput));
  const [saved, setSaved] = useState<SavedPlanRef | null>(initialPlan);
  const [restored, setRestored] = useState(false);
  const [kept, setKept] = useState(true);

  // Bring back what was typed on this device: any draft on /planner, or the edits of this plan on /planner?from=<id>.
  const initialPlanId = initialPlan?.id ?? null;
  useEffect(() => {
    const stored = loadStoredDraft();
    if (stored && (initialPlanId === null || stored.fromPlanId === initialPlanId)) setDraft(stored.draft);
    setRestored(true);
  }, [initialPlanId]);

  useEffect(() => {
    if (restored) setKept(storeDraft({ draft, fromPlanId: saved?.id ?? null }));
  }, [draft, saved, restored]);

  const symbol = currencySymbol(draft.currency.trim().toUpperCase());
  const parsed = useMemo(() => planInputSchema.safeParse(draftToCandidate(draft)), [draft]);
  const [lastGood, setLastGood] = useState<PlanInput>(initialInput);
  useEffect(() => {
    if (parsed.success) setLastGood(parsed.data);
  }, [parsed]);
  const input = useDeferredValue(parsed.success ? parsed.data : lastGood);
  const estimate = useMemo(() => estimatePlan(input), [input]);
  const errors = useMemo(() => (parsed.success ? {} : draftErrors(draft, parsed.error.issues, symbol)), [parsed, draft, symbol]);

  const onSaved = (plan: SavedPlanRef) => {
    setSaved(plan);
    // The address now names the plan, so a reload or a sign-in round trip comes back to it.
    window.history.replaceState(null, "", `/planner?from=${plan.id}`);
  };

  const startAgain = () => {
    clearStoredDraft();
    setDraft(inputToDraft(defaultPlanInput, draft.lengthUnit));
    setSaved(null);
    window.history.replaceState(null, "", "/planner");
  };

  return (
    <div className="pb-24 lg:pb-0 print:pb-0">
      <div className="lg:grid lg:grid-cols-[minmax(0,27rem)_minmax(0,1fr)] lg:gap-6 xl:grid-cols-[minmax(0,30rem)_minmax(0,1fr)]">
        <form className="no-print" aria-label="Plan inputs" noValidate onSubmit={(e) => e.preventDefault()}>
          <PlanForm
            draft={draft}
            errors={errors}
            shownInput={input}
            estimate={estimate}
            currencySymbol={symbol}
            onNumber={(path, text) => setDraft((d) => withNumber(d, path, text))}
            onDraft={(change) => setDraft(change)}
          />
          <div className="mt-4 flex flex-wrap items-center gap-3">
            <Button type="button" variant="ghost" onClick={startAgain}>
              Start again from the defaults
            </Button>
            {!kept ? <p className="text-xs text-clay-700">This device will not keep your draft: save it or note the figures.</p> : null}
          </div>
        </form>

        <div id="figures" className="mt-6 scroll-mt-4 space-y-4 lg:sticky lg:top-0 lg:mt-0 lg:self-start lg:max-h-screen lg:overflow-y-auto lg:pb-6 lg:pr-1 print:static print:mt-0 print:max-h-none print:overflow-visible">
          <SavePanel viewer={viewer} saved={saved} onSaved={onSaved} input={parsed.success ? parsed.data : null} suggestedName={suggestPlanName(input)} />
          {!parsed.success ? (
            <div role="alert" className="no-print rounded-lg border border-clay-500/30 bg-clay-50 px-3 py-2.5 text-sm text-clay-700" data-testid="stale-figures">
              <p className="font-semibold">These figures are for your last complete entry. To update them, fix:</p>
              <ul className="mt-1 list-disc pl-5">
                {Object.entries(errors).map(([path, message]) => (
                  <li key={path}>
                    <a href={`#${fieldId(path)}`} className="underline underline-offset-2">
                      {labelOf(path)}
                    </a>
                    : {message}
                  </li>
                ))}
              </ul>
            </div>
          ) : null}
          <PlanReport input={input} estimate={estimate} inputs="print-only" />
        </div>
      </div>
      <SummaryBar estimate={estimate} stale={!parsed.success} />
    </div>
  );
}
