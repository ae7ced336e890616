import { NextResponse } from "next/server";
import { parseWith, readJson, withApi } from "@/lib/api/handler";
import { requireApiPermission } from "@/lib/auth/session";
import { getBuilderProfile, saveBuilderProfile } from "@/lib/profiles/provider-profile";
import { builderProfileSchema } from "@/lib/validations/provider";

export const GET = withApi(async (request) => {
  const user = await requireApiPermission(request, "builder:manage");
  return NextResponse.json({ builder: await getBuilderProfile(user.id) });
});

export const PUT = withApi(async (request) => {
  const user = await requireApiPermission(request, "builder:manage");
  const input = parseWith(builderProfileSchema, await readJson(request));
  await saveBuilderProfile(user.id, input);
  return NextResponse.json({ builder: input });
});
