import { NextResponse } from "next/server";
import { parseWith, readJson, withApi } from "@/lib/api/handler";
import { requireApiPermission } from "@/lib/auth/session";
import { replyToReview } from "@/lib/reviews/review-service";
import { replySchema } from "@/lib/validations/reviews";

/** The reviewed provider's one public reply. */
export const POST = withApi(async (request, { params }: { params: Promise<{ id: string }> }) => {
  const user = await requireApiPermission(request, "review:respond");
  const { id } = await params;
  const input = parseWith(replySchema, await readJson(request));
  return NextResponse.json({ review: await replyToReview(user, id, input) }, { status: 201 });
});
