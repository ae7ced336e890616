import { NextResponse } from "next/server";
import { parseWith, readJson, withApi } from "@/lib/api/handler";
import { getRequestUser, requireApiPermission, requireApiUser } from "@/lib/auth/session";
import { estimatePlan } from "@/lib/planner/estimate";
import { deletePlan, getPlan, updatePlan } from "@/lib/plans/plan-service";
import { planSummary } from "@/lib/plans/plan-summary";
import { savePlanSchema } from "@/lib/validations/planner";

type Context = { params: Promise<{ id: string }> };

/** Anyone with the link: the plan's input and a summary of its figures (what a tank request shows). 404 when missing. */
export const GET = withApi(async (request, { params }: Context) => {
  const { id } = await params;
  const viewer = await getRequestUser(request);
  const plan = await getPlan(id, viewer?.id ?? null);
  return NextResponse.json({ plan, summary: planSummary(plan.input, estimatePlan(plan.input)), url: `/plans/${plan.id}` });
});

/** The owner replaces the name and input. 401 signed out, 403 not a farmer or not the owner, 404 missing, 400 bad body. */
export const PUT = withApi(async (request, { params }: Context) => {
  const user = await requireApiPermission(request, "plan:save");
  const { id } = await params;
  const data = parseWith(savePlanSchema, await readJson(request));
  return NextResponse.json({ plan: await updatePlan(user, id, data), url: `/plans/${id}` });
});

/** The owner deletes it. 401 signed out, 403 not the owner, 404 missing. */
export const DELETE = withApi(async (request, { params }: Context) => {
  const user = await requireApiUser(request);
  const { id } = await params;
  await deletePlan(user, id);
  return new NextResponse(null, { status: 204 });
});
