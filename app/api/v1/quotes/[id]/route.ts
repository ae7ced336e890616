import { NextResponse } from "next/server";
import { parseWith, readJson, withApi } from "@/lib/api/handler";
import { requireApiPermission } from "@/lib/auth/session";
import { reviseQuote } from "@/lib/quotes/quote-service";
import { quoteFormSchema } from "@/lib/validations/quotes";

/** Revises a sent quote: a new version; the earlier ones are kept. */
export const PUT = withApi(async (request, { params }: { params: Promise<{ id: string }> }) => {
  const { id } = await params;
  const user = await requireApiPermission(request, "tank-request:quote");
  const input = parseWith(quoteFormSchema, await readJson(request));
  return NextResponse.json(await reviseQuote(user.id, id, input));
});
