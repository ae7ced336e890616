import { money, num } from "@/components/planner/format";
import type { PlanEstimate } from "@/lib/planner/plan-estimate";

/** On a phone the figures sit below the long form: this strip keeps the main ones in sight while typing. */
export function SummaryBar({ estimate, stale }: { estimate: PlanEstimate; stale: boolean }) {
  const warnings = estimate.warnings.filter((w) => w.severity !== "info").length;
  return (
    <div className="no-print fixed inset-x-0 bottom-0 z-20 border-t border-silt-200 bg-white/95 px-4 py-2 shadow-[0_-4px_16px_rgb(23_22_18/0.08)] lg:hidden" data-testid="summary-bar">
      <div className="mx-auto flex max-w-3xl items-center gap-3">
        <p className="flex-1 text-sm leading-tight text-silt-800" aria-live="off">
          <span className="font-semibold tabular-nums text-silt-950">{num(estimate.stocking.fishStocked)}</span> fish ·{" "}
          <span className="font-semibold tabular-nums text-silt-950">{num(estimate.cycle.harvestKg, 0)} kg</span> ·{" "}
          <span className={`font-semibold tabular-nums ${estimate.economics.marginMinor < 0 ? "text-clay-700" : "text-lagoon-800"}`}>{money(estimate.economics.marginMinor, estimate.currency)}</span>
          <br />
          <span className="text-xs text-silt-600">
            {stale ? "Fix the marked field to update" : `${num(estimate.cycle.cycleDays)} days`}
            {warnings ? ` · ${warnings} warning${warnings > 1 ? "s" : ""}` : ""}
          </span>
        </p>
        <a href="#figures" className="rounded-lg bg-lagoon-600 px-3 py-2 text-sm font-semibold text-white hover:bg-lagoon-700">
          Figures
        </a>
      </div>
    </div>
  );
}
