import { NextResponse } from "next/server";
import { parseWith, readJson, withApi } from "@/lib/api/handler";
import { requireApiPermission } from "@/lib/auth/session";
import { sendQuote } from "@/lib/quotes/quote-service";
import { quoteFormSchema } from "@/lib/validations/quotes";

/** A builder within reach sends a quote; travel is added from the straight-line distance and the builder's rate. */
export const POST = withApi(async (request, { params }: { params: Promise<{ id: string }> }) => {
  const { id } = await params;
  const user = await requireApiPermission(request, "tank-request:quote");
  const input = parseWith(quoteFormSchema, await readJson(request));
  return NextResponse.json(await sendQuote(user.id, id, input), { status: 201 });
});
