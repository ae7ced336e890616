import { NextResponse } from "next/server";
import { withApi } from "@/lib/api/handler";
import { requireApiPermission } from "@/lib/auth/session";
import { closeTankRequest } from "@/lib/requests/request-service";

/** The farmer takes an open request down; builders who quoted are told. */
export const POST = withApi(async (request, { params }: { params: Promise<{ id: string }> }) => {
  const { id } = await params;
  const user = await requireApiPermission(request, "tank-request:post");
  await closeTankRequest(user.id, id);
  return NextResponse.json({ id, state: "closed" });
});
