import { NextResponse } from "next/server";
import { parseWith, readJson, withApi } from "@/lib/api/handler";
import { requireApiPermission } from "@/lib/auth/session";
import { postTankRequest } from "@/lib/requests/request-service";
import { listFarmerRequests } from "@/lib/requests/request-views";
import { tankRequestFormSchema } from "@/lib/validations/tank-requests";

/** The farmer's own requests, newest first. */
export const GET = withApi(async (request) => {
  const user = await requireApiPermission(request, "tank-request:post");
  return NextResponse.json({ requests: await listFarmerRequests(user.id) });
});

/** Posts a request; builders whose service area covers the site are e-mailed. */
export const POST = withApi(async (request) => {
  const user = await requireApiPermission(request, "tank-request:post");
  const input = parseWith(tankRequestFormSchema, await readJson(request));
  const posted = await postTankRequest(user.id, input);
  return NextResponse.json({ id: posted.id, buildersReached: posted.reached.length }, { status: posted.created ? 201 : 200 });
});
