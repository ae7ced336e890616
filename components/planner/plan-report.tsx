import type { ReactNode } from "react";
import type { PlanEstimate } from "@/lib/planner/plan-estimate";
import type { PlanInput } from "@/lib/validations/planner";
import { CostBreakdownChart } from "./cost-breakdown-chart";
import { money } from "./format";
import { PlanAssumptions } from "./plan-assumptions";
import { SpeciesTable, TankWaterDetails } from "./plan-details";
import { PlanInputs } from "./plan-inputs";
import { PlanKeyFigures } from "./plan-key-figures";
import { PlanCautions, PlanWarnings } from "./plan-warnings";
import { TankComparisonChart } from "./tank-comparison-chart";
import { WeeklyCharts } from "./weekly-charts";

function Section({ id, title, children, className = "" }: { id: string; title: string; children: ReactNode; className?: string }) {
  return (
    <section aria-labelledby={id} className={`rounded-card border border-silt-200 bg-white p-4 shadow-card print:border-0 print:p-0 print:shadow-none sm:p-5 ${className}`}>
      <h2 id={id} className="text-lg font-semibold text-silt-950">
        {title}
      </h2>
      <div className="mt-3">{children}</div>
    </section>
  );
}

/**
 * Every figure of a plan: the live planner shows it beside the form, a saved plan's page on its own, and both print it.
 * No state and no effects, so a saved plan renders on the server with no JavaScript of its own.
 */
export function PlanReport({ input, estimate, inputs }: { input: PlanInput; estimate: PlanEstimate; inputs: "shown" | "print-only" }) {
  const e = estimate;
  return (
    <div className="space-y-4" data-testid="plan-report">
      <PlanWarnings warnings={e.warnings} />
      <PlanKeyFigures estimate={e} />
      <PlanCautions cautions={e.cautions} />
      <Section id="plan-weekly" title="Week by week">
        <WeeklyCharts weekly={e.weekly} />
      </Section>
      <Section id="plan-costs" title="Cost of one cycle">
        <CostBreakdownChart costs={e.costs} economics={e.economics} />
        <p className="mt-3 text-sm text-silt-700">
          {e.economics.breakEvenPricePerKgMinor === null
            ? "Nothing is harvested, so no sale price covers the cost."
            : `Selling at ${money(e.economics.breakEvenPricePerKgMinor, e.currency)} per kg or more covers the cycle.`}{" "}
          {e.costs.buildCostMinor === null
            ? "The tank's build cost is not known: enter a builder's quote."
            : `The tank costs ${money(e.costs.buildCostMinor, e.currency)} to build (${e.costs.buildCostSource === "override" ? "your figure" : "planner's estimate"}) and lasts about ${e.costs.lifeYears} years.`}
        </p>
      </Section>
      <Section id="plan-types" title="The same size as each tank type">
        <TankComparisonChart rows={e.tankComparison} currency={e.currency} />
      </Section>
      <Section id="plan-fish" title="Fish">
        <SpeciesTable estimate={e} />
      </Section>
      <Section id="plan-tank" title="Tank, water and pumping">
        <TankWaterDetails estimate={e} />
      </Section>
      <Section id="plan-inputs-heading" title="What was entered" className={inputs === "print-only" ? "hidden print:block" : ""}>
        <PlanInputs input={input} />
      </Section>
      <Section id="plan-assumptions-heading" title="Model values and their sources">
        <p className="mb-2 text-sm text-silt-700">
          Figures the planner uses that the form does not ask for. &ldquo;Demo default&rdquo; and &ldquo;from memory&rdquo; values are not from a checked source: treat them as rough.
        </p>
        <PlanAssumptions assumptions={e.assumptions} />
      </Section>
    </div>
  );
}
