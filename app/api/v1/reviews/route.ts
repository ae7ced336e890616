import { NextResponse } from "next/server";
import { parseWith, readJson, withApi } from "@/lib/api/handler";
import { requireApiPermission } from "@/lib/auth/session";
import { createReview } from "@/lib/reviews/review-service";
import { createReviewSchema } from "@/lib/validations/reviews";

/** A farmer reviews a finished job or released reservation (photos uploaded beforehand with kind review-photo). */
export const POST = withApi(async (request) => {
  const user = await requireApiPermission(request, "review:write");
  const input = parseWith(createReviewSchema, await readJson(request));
  return NextResponse.json({ review: await createReview(user, input) }, { status: 201 });
});
