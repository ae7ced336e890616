import Link from "next/link";
import type { PlanCaution } from "@/lib/planner/cautions";
import type { PlanWarning, WarningSeverity } from "@/lib/planner/warnings";

const SEVERITY: Record<WarningSeverity, { box: string; word: string }> = {
  danger: { box: "border-clay-500/40 bg-clay-50 text-clay-700", word: "Danger" },
  warning: { box: "border-reed-300 bg-reed-50 text-reed-800", word: "Warning" },
  info: { box: "border-lagoon-200 bg-lagoon-50 text-lagoon-800", word: "Note" },
};

/** What is wrong with the plan as entered. Announced politely as it changes, since it follows what the person types. */
export function PlanWarnings({ warnings }: { warnings: readonly PlanWarning[] }) {
  return (
    <div aria-live="polite" data-testid="plan-warnings">
      {warnings.length ? (
        <ul className="space-y-2">
          {warnings.map((w, i) => (
            <li key={`${w.code}-${w.species ?? i}`} data-code={w.code} className={`break-inside-avoid rounded-lg border px-3 py-2.5 text-sm ${SEVERITY[w.severity].box}`}>
              <strong className="font-semibold">{SEVERITY[w.severity].word}: </strong>
              {w.message}
            </li>
          ))}
        </ul>
      ) : (
        <p className="rounded-lg border border-lagoon-200 bg-lagoon-50 px-3 py-2.5 text-sm text-lagoon-800">No warnings for this plan.</p>
      )}
    </div>
  );
}

/** Safety notes that always go with a tank of this kind: they change no figure. */
export function PlanCautions({ cautions }: { cautions: readonly PlanCaution[] }) {
  return (
    <div className="break-inside-avoid rounded-card border border-reed-200 bg-reed-50 p-4" data-testid="plan-cautions">
      <h3 className="text-base font-semibold text-reed-900">Safety</h3>
      <ul className="mt-2 list-disc space-y-1.5 pl-5 text-sm text-reed-900">
        {cautions.map((c) => (
          <li key={c.code} data-code={c.code}>
            {c.message}
          </li>
        ))}
      </ul>
      <p className="no-print mt-2 text-sm">
        <Link href="/safety" className="font-medium text-reed-900 underline underline-offset-2">
          More on safety around tanks and pumps
        </Link>
      </p>
    </div>
  );
}
