import { NextResponse } from "next/server";
import { withApi } from "@/lib/api/handler";
import { requireApiPermission } from "@/lib/auth/session";
import { NotFound } from "@/lib/errors";
import { jobView } from "@/lib/jobs/job-views";

/** The job for its farmer, its builder or an admin. */
export const GET = withApi(async (request, { params }: { params: Promise<{ id: string }> }) => {
  const { id } = await params;
  const user = await requireApiPermission(request, "job:take-part");
  const view = await jobView(id, user);
  if (!view) throw new NotFound("No job with this id");
  return NextResponse.json({ job: view });
});
