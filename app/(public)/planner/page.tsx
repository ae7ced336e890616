import type { Metadata } from "next";
import Link from "next/link";
import { PageHeading } from "@/components/ui/card";
import { FormNotice } from "@/components/ui/field";
import { can } from "@/lib/auth/permissions";
import { getCurrentUser } from "@/lib/auth/session";
import { findPlan, listOwnPlans } from "@/lib/plans/plan-service";
import { defaultPlanInput } from "@/lib/validations/planner";
import { PlannerApp } from "./_components/planner-app";

export const metadata: Metadata = {
  title: "Plan a tank",
  description: "What a tank of your size holds, costs and earns: water, fish, feed, power and money for one cycle.",
};

const dateFormat = new Intl.DateTimeFormat("en-GB", { dateStyle: "medium" });

export default async function PlannerPage({ searchParams }: { searchParams: Promise<{ from?: string | string[] }> }) {
  const { from } = await searchParams;
  const user = await getCurrentUser();
  const fromId = typeof from === "string" ? from : null;
  const plan = fromId ? await findPlan(fromId, user?.id ?? null) : null;
  const canSave = user !== null && can(user, "plan:save");
  const ownPlans = user && canSave ? await listOwnPlans(user.id) : [];

  return (
    <div className="mx-auto max-w-7xl px-4 py-6 sm:py-8">
      <PageHeading
        title="Plan a tank"
        lead={
          <span className="no-print">
            Enter your tank and fish; the figures below follow as you type. Every default shows where it comes from, so replace the ones you know better, especially prices.
          </span>
        }
      />
      {plan ? (
        <p className="mb-4 text-sm text-silt-700">
          Started from the saved plan{" "}
          <Link href={`/plans/${plan.id}`} className="font-medium text-lagoon-700 underline underline-offset-2">
            {plan.name}
          </Link>
          {plan.ownedByViewer ? "; saving changes it." : ", which is someone else's: saving makes your own copy."}
        </p>
      ) : null}
      {fromId && !plan ? (
        <div className="no-print mb-4">
          <FormNotice>That saved plan was not found, so the planner starts from its defaults.</FormNotice>
        </div>
      ) : null}
      <PlannerApp initialInput={plan?.input ?? defaultPlanInput} initialPlan={plan ? { id: plan.id, name: plan.name, owned: plan.ownedByViewer } : null} viewer={{ signedIn: user !== null, canSave }} />
      {ownPlans.length ? (
        <section aria-labelledby="own-plans" className="no-print mt-8 rounded-card border border-silt-200 bg-white p-4 sm:p-5">
          <h2 id="own-plans" className="text-lg font-semibold text-silt-950">
            Your saved plans
          </h2>
          <ul className="mt-2 divide-y divide-silt-100">
            {ownPlans.map((p) => (
              <li key={p.id} className="flex flex-wrap items-baseline justify-between gap-2 py-2 text-sm">
                <Link href={`/plans/${p.id}`} className="font-medium text-lagoon-700 underline underline-offset-2">
                  {p.name}
                </Link>
                <span className="text-silt-600">changed {dateFormat.format(new Date(p.updatedAt))}</span>
              </li>
            ))}
          </ul>
        </section>
      ) : null}
    </div>
  );
}
