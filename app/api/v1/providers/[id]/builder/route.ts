import { NextResponse } from "next/server";
import { parseWith, readJson, withApi } from "@/lib/api/handler";
import { requireProviderEditor } from "@/lib/profiles/provider-access";
import { saveBuilderProfile } from "@/lib/profiles/provider-profile";
import { builderProfileSchema } from "@/lib/validations/provider";

export const PUT = withApi(async (request, { params }: { params: Promise<{ id: string }> }) => {
  const { id } = await params;
  await requireProviderEditor(request, id);
  const input = parseWith(builderProfileSchema, await readJson(request));
  await saveBuilderProfile(id, input);
  return NextResponse.json({ builder: input });
});
