import { NextResponse } from "next/server";
import { parseWith, readJson, withApi } from "@/lib/api/handler";
import { requireApiUser } from "@/lib/auth/session";
import { completeOnboarding } from "@/lib/profiles/onboarding";
import { onboardingSchema } from "@/lib/validations/profile";

export const POST = withApi(async (request) => {
  const user = await requireApiUser(request);
  const input = parseWith(onboardingSchema, await readJson(request));
  await completeOnboarding(user.id, input);
  return NextResponse.json({ ok: true });
});
