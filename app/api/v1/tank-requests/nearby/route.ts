import { NextResponse } from "next/server";
import { withApi } from "@/lib/api/handler";
import { requireApiPermission } from "@/lib/auth/session";
import { openRequestsForBuilder } from "@/lib/requests/request-views";

/** Open requests inside the signed-in builder's service area, nearest first, with the straight-line distance. */
export const GET = withApi(async (request) => {
  const user = await requireApiPermission(request, "tank-request:quote");
  return NextResponse.json(await openRequestsForBuilder(user.id));
});
