import { NextResponse } from "next/server";
import { parseWith, readJson, withApi } from "@/lib/api/handler";
import { requireApiPermission } from "@/lib/auth/session";
import { getHatcheryProfile, saveHatcheryProfile } from "@/lib/profiles/provider-profile";
import { hatcheryProfileSchema } from "@/lib/validations/provider";

export const GET = withApi(async (request) => {
  const user = await requireApiPermission(request, "hatchery:manage");
  return NextResponse.json({ hatchery: await getHatcheryProfile(user.id) });
});

export const PUT = withApi(async (request) => {
  const user = await requireApiPermission(request, "hatchery:manage");
  const input = parseWith(hatcheryProfileSchema, await readJson(request));
  await saveHatcheryProfile(user.id, input);
  return NextResponse.json({ hatchery: input });
});
