import { NextResponse } from "next/server";
import { parseWith, readJson, withApi } from "@/lib/api/handler";
import { requireApiPermission } from "@/lib/auth/session";
import { acceptQuote } from "@/lib/quotes/quote-service";
import { acceptQuoteSchema } from "@/lib/validations/quotes";

/** The farmer accepts the version they saw; the other builders are told, and the job waits for its deposit. */
export const POST = withApi(async (request, { params }: { params: Promise<{ id: string }> }) => {
  const { id } = await params;
  const user = await requireApiPermission(request, "tank-request:post");
  const input = parseWith(acceptQuoteSchema, await readJson(request));
  return NextResponse.json(await acceptQuote(user.id, id, input.version), { status: 201 });
});
