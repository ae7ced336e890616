import type { JobTimelineEntry } from "@/lib/jobs/job-views";

const STEPS = [
  { key: "accept_quote", label: "Quote accepted" },
  { key: "deposit_held", label: "Deposit held" },
  { key: "arrive", label: "On site" },
  { key: "mark_built", label: "Built" },
  { key: "confirm", label: "Confirmed" },
] as const;

function when(iso: string): string {
  return new Date(iso).toLocaleString("en-GB", { day: "numeric", month: "short", hour: "2-digit", minute: "2-digit", timeZone: "UTC" });
}

/** The job's steps so far, and the ones still to come. */
export function JobTimeline({ entries }: { entries: readonly JobTimelineEntry[] }) {
  const seen = new Map(entries.map((e) => [e.event === "auto_confirm" ? "confirm" : e.event, e]));
  const offPath = entries.filter((e) => ["dispute", "resolve", "cancel"].includes(e.event));
  return (
    <ol className="space-y-2" aria-label="Job timeline">
      {STEPS.map((s) => {
        const e = seen.get(s.key);
        return (
          <li key={s.key} className="flex items-start gap-3">
            <span aria-hidden="true" className={`mt-1 h-3 w-3 shrink-0 rounded-full ${e ? "bg-lagoon-600" : "border-2 border-silt-300 bg-white"}`} />
            <span className={`text-sm ${e ? "text-silt-900" : "text-silt-500"}`}>
              {e ? e.label : s.label}
              {e ? <span className="block text-xs text-silt-600">{when(e.at)} UTC</span> : <span className="sr-only"> (not yet)</span>}
            </span>
          </li>
        );
      })}
      {offPath.map((e, i) => (
        <li key={`x${i}`} className="flex items-start gap-3">
          <span aria-hidden="true" className="mt-1 h-3 w-3 shrink-0 rounded-full bg-clay-500" />
          <span className="text-sm text-silt-900">
            {e.label}
            {typeof e.detail?.reason === "string" && e.detail.reason ? <span className="block text-xs text-silt-700">“{e.detail.reason}”</span> : null}
            <span className="block text-xs text-silt-600">{when(e.at)} UTC</span>
          </span>
        </li>
      ))}
    </ol>
  );
}
