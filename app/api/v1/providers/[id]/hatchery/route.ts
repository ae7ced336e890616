import { NextResponse } from "next/server";
import { parseWith, readJson, withApi } from "@/lib/api/handler";
import { requireProviderEditor } from "@/lib/profiles/provider-access";
import { saveHatcheryProfile } from "@/lib/profiles/provider-profile";
import { hatcheryProfileSchema } from "@/lib/validations/provider";

export const PUT = withApi(async (request, { params }: { params: Promise<{ id: string }> }) => {
  const { id } = await params;
  await requireProviderEditor(request, id);
  const input = parseWith(hatcheryProfileSchema, await readJson(request));
  await saveHatcheryProfile(id, input);
  return NextResponse.json({ hatchery: input });
});
