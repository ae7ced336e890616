import { NextResponse } from "next/server";
import { parseWith, readJson, withApi } from "@/lib/api/handler";
import { requireApiPermission } from "@/lib/auth/session";
import { reportReview } from "@/lib/reviews/review-service";
import { reportSchema } from "@/lib/validations/reviews";

/** Sends a review to the admins' moderation queue (once per user and review). */
export const POST = withApi(async (request, { params }: { params: Promise<{ id: string }> }) => {
  const user = await requireApiPermission(request, "review:report");
  const { id } = await params;
  const input = parseWith(reportSchema, await readJson(request));
  return NextResponse.json(await reportReview(user, id, input), { status: 201 });
});
