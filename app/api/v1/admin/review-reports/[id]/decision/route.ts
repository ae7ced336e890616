import { NextResponse } from "next/server";
import { parseWith, readJson, withApi } from "@/lib/api/handler";
import { requireApiPermission } from "@/lib/auth/session";
import { decideReport } from "@/lib/reviews/review-service";
import { moderationDecisionSchema } from "@/lib/validations/reviews";

/** An admin keeps or hides a reported review; the decision and its note go to the audit log. */
export const POST = withApi(async (request, { params }: { params: Promise<{ id: string }> }) => {
  const admin = await requireApiPermission(request, "admin:moderate-reviews");
  const { id } = await params;
  const input = parseWith(moderationDecisionSchema, await readJson(request));
  return NextResponse.json(await decideReport(admin, id, input));
});
