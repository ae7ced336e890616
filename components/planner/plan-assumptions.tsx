import type { Assumption, Confidence } from "@/lib/planner/assumptions";
import { num } from "./format";

const CONFIDENCE_STYLE: Record<Confidence, string> = {
  published: "bg-lagoon-100 text-lagoon-800",
  "common practice": "bg-silt-100 text-silt-800",
  "from memory": "bg-reed-100 text-reed-800",
  "demo default": "bg-clay-50 text-clay-700",
};

export function ConfidenceBadge({ confidence }: { confidence: Confidence }) {
  return <span className={`whitespace-nowrap rounded-full px-2 py-0.5 text-2xs font-medium ${CONFIDENCE_STYLE[confidence]}`}>{confidence}</span>;
}

function shown(value: number | string): string {
  return typeof value === "number" ? num(value, 4) : value;
}

/** The model's own constants and the sources behind them: the figures the form does not ask for. */
export function PlanAssumptions({ assumptions }: { assumptions: readonly Assumption[] }) {
  return (
    <ul className="divide-y divide-silt-100 text-sm" data-testid="plan-assumptions">
      {assumptions.map((a) => (
        <li key={a.key} className="break-inside-avoid py-2">
          <div className="flex flex-wrap items-baseline justify-between gap-x-3 gap-y-1">
            <span className="font-medium text-silt-900">{a.label}</span>
            <span className="tabular-nums text-silt-900">
              {shown(a.value)} {a.unit}
            </span>
          </div>
          <p className="mt-0.5 text-xs text-silt-700">
            <ConfidenceBadge confidence={a.confidence} /> {a.source}
          </p>
        </li>
      ))}
    </ul>
  );
}
