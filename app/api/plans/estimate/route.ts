import { NextResponse } from "next/server";
import { parseWith, readJson, withApi } from "@/lib/api/handler";
import { estimatePlan } from "@/lib/planner/estimate";
import { planInputSchema } from "@/lib/validations/planner";

/**
 * The planner without the page: a plan input as JSON (SI units, see lib/validations/planner.ts) in, every figure out.
 * Open to anyone, like the page. A body the schema refuses is a 400 naming the field ("tank.waterDepthM: …").
 */
export const POST = withApi(async (request) => {
  const input = parseWith(planInputSchema, await readJson(request));
  return NextResponse.json({ estimate: estimatePlan(input) });
});
