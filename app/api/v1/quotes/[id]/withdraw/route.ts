import { NextResponse } from "next/server";
import { withApi } from "@/lib/api/handler";
import { requireApiPermission } from "@/lib/auth/session";
import { withdrawQuote } from "@/lib/quotes/quote-service";

export const POST = withApi(async (request, { params }: { params: Promise<{ id: string }> }) => {
  const { id } = await params;
  const user = await requireApiPermission(request, "tank-request:quote");
  await withdrawQuote(user.id, id);
  return NextResponse.json({ id, state: "withdrawn" });
});
