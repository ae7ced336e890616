import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { PlanReport } from "@/components/planner/plan-report";
import { ButtonLink } from "@/components/ui/button";
import { getCurrentUser } from "@/lib/auth/session";
import { estimatePlan } from "@/lib/planner/estimate";
import { findPlan } from "@/lib/plans/plan-service";
import { ShareActions } from "./_components/share-actions";

// A plan is unlisted: readable by anyone with the link, never offered to search engines.
export const metadata: Metadata = { title: "Saved tank plan", robots: { index: false, follow: false } };

const dateFormat = new Intl.DateTimeFormat("en-GB", { dateStyle: "medium" });

export default async function SavedPlanPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await getCurrentUser();
  // No loading.tsx in this segment: the lookup finishes before any HTML streams, so a missing plan is a real 404.
  const plan = await findPlan(id, user?.id ?? null);
  if (!plan) notFound();
  // Worked out again from the stored input, so the page always shows what the planner computes today.
  const estimate = estimatePlan(plan.input);
  const path = `/plans/${plan.id}`;
  const saved = dateFormat.format(new Date(plan.createdAt));
  const changed = dateFormat.format(new Date(plan.updatedAt));

  return (
    <div className="mx-auto max-w-4xl px-4 py-6 sm:py-8">
      <p className="text-sm font-semibold uppercase tracking-wider text-reed-700">Tank plan</p>
      <h1 className="mt-1 text-2xl font-semibold text-silt-950 sm:text-3xl">{plan.name}</h1>
      <p className="mt-1 text-sm text-silt-700">
        Saved {saved}
        {changed !== saved ? `, last changed ${changed}` : ""}. Figures are estimates from the Shoal planner, not a quote.
      </p>
      <div className="no-print mt-4 flex flex-wrap gap-2">
        <ShareActions path={path} />
        <ButtonLink href={`/planner?from=${plan.id}`} variant="secondary">
          {plan.ownedByViewer ? "Change this plan" : "Try changes in the planner"}
        </ButtonLink>
      </div>
      <div className="mt-6">
        <PlanReport input={plan.input} estimate={estimate} inputs="shown" />
      </div>
    </div>
  );
}
