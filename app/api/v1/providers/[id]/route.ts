import { NextResponse } from "next/server";
import { withApi } from "@/lib/api/handler";
import { NotFound } from "@/lib/errors";
import { getPublicProvider } from "@/lib/listings/provider";

export const GET = withApi(async (_request, { params }: { params: Promise<{ id: string }> }) => {
  const { id } = await params;
  const provider = await getPublicProvider(id);
  if (!provider) throw new NotFound("No provider with that id");
  return NextResponse.json({ provider });
});
