import { NextResponse } from "next/server";
import { parseWith, readJson, withApi } from "@/lib/api/handler";
import { requireApiPermission } from "@/lib/auth/session";
import { actOnJob } from "@/lib/jobs/job-service";
import { jobActionSchema } from "@/lib/validations/jobs";

/** One move of the job: on site, built, confirm, dispute, cancel (parties) or resolve (admin). */
export const POST = withApi(async (request, { params }: { params: Promise<{ id: string }> }) => {
  const { id } = await params;
  const user = await requireApiPermission(request, "job:take-part");
  const action = parseWith(jobActionSchema, await readJson(request));
  await actOnJob(id, user, action);
  return NextResponse.json({ id, done: action.type });
});
