import { NextResponse } from "next/server";
import { withApi } from "@/lib/api/handler";
import { requireApiPermission } from "@/lib/auth/session";
import { setHelpful } from "@/lib/reviews/review-service";

type Context = { params: Promise<{ id: string }> };

/** PUT marks the review helpful, DELETE takes the mark back; both answer the new count. */
export const PUT = withApi(async (request, { params }: Context) => {
  const user = await requireApiPermission(request, "review:vote");
  return NextResponse.json(await setHelpful(user, (await params).id, true));
});

export const DELETE = withApi(async (request, { params }: Context) => {
  const user = await requireApiPermission(request, "review:vote");
  return NextResponse.json(await setHelpful(user, (await params).id, false));
});
