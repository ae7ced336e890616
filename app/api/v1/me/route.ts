import { NextResponse } from "next/server";
import { withApi } from "@/lib/api/handler";
import { requireApiUser } from "@/lib/auth/session";
import { getOwnProfile } from "@/lib/profiles/onboarding";

export const GET = withApi(async (request) => {
  const user = await requireApiUser(request);
  const profile = await getOwnProfile(user.id);
  return NextResponse.json({ user: { id: user.id, name: user.name, email: user.email, roles: user.roles, onboarded: user.onboarded }, profile });
});
