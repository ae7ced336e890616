import { NextResponse } from "next/server";
import { withApi } from "@/lib/api/handler";
import { requireApiUser } from "@/lib/auth/session";
import { NotFound } from "@/lib/errors";
import { builderRequestView, farmerRequestView } from "@/lib/requests/request-views";

/** The request as the caller may see it: all of it for its farmer, a distance and rounded place for a builder within reach. */
export const GET = withApi(async (request, { params }: { params: Promise<{ id: string }> }) => {
  const { id } = await params;
  const user = await requireApiUser(request);
  const own = user.roles.includes("farmer") ? await farmerRequestView(user.id, id) : null;
  if (own) return NextResponse.json({ view: "farmer", request: own });
  const near = user.roles.includes("builder") ? await builderRequestView(user.id, id) : null;
  if (near) return NextResponse.json({ view: "builder", request: near });
  throw new NotFound("No tank request with this id");
});
