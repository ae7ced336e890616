import type { WeeklyPoint } from "@/lib/planner/cycle";
import { TimeChart } from "./time-chart";

/** Biomass and feed week by week over the cycle, as two charts sharing the week axis. */
export function WeeklyCharts({ weekly }: { weekly: readonly WeeklyPoint[] }) {
  return (
    <div className="grid gap-6 lg:grid-cols-2">
      <TimeChart title="Fish in the tank" unit="kg" values={weekly.map((w) => w.biomassKg)} kind="area" testId="chart-biomass" />
      <TimeChart title="Feed each week" unit="kg" values={weekly.map((w) => w.feedKg)} kind="bars" testId="chart-feed" />
    </div>
  );
}
