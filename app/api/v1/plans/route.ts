import { NextResponse } from "next/server";
import { parseWith, readJson, withApi } from "@/lib/api/handler";
import { requireApiPermission } from "@/lib/auth/session";
import { createPlan, listOwnPlans } from "@/lib/plans/plan-service";
import { savePlanSchema } from "@/lib/validations/planner";

/** The signed-in farmer's saved plans (id, name, dates), latest change first. */
export const GET = withApi(async (request) => {
  const user = await requireApiPermission(request, "plan:save");
  return NextResponse.json({ plans: await listOwnPlans(user.id) });
});

/** Saves a new plan: { name, input } with input as planInputSchema accepts it. 201 with the plan and its link. */
export const POST = withApi(async (request) => {
  const user = await requireApiPermission(request, "plan:save");
  const data = parseWith(savePlanSchema, await readJson(request));
  const plan = await createPlan(user.id, data);
  return NextResponse.json({ plan, url: `/plans/${plan.id}` }, { status: 201, headers: { location: `/api/v1/plans/${plan.id}` } });
});
