import { NextResponse } from "next/server";
import { parseWith, readJson, withApi } from "@/lib/api/handler";
import { requireApiPermission } from "@/lib/auth/session";
import { editReview } from "@/lib/reviews/review-service";
import { editReviewSchema } from "@/lib/validations/reviews";

// No DELETE: nobody deletes a review (an admin may hide one after a report).

/** The author corrects their review within the edit window; the earlier version is kept. */
export const PATCH = withApi(async (request, { params }: { params: Promise<{ id: string }> }) => {
  const user = await requireApiPermission(request, "review:write");
  const { id } = await params;
  const input = parseWith(editReviewSchema, await readJson(request));
  return NextResponse.json({ review: await editReview(user, id, input) });
});
