import "server-only";
import { Forbidden } from "@/lib/errors";
import { canEditProfile } from "@/lib/auth/permissions";
import { requireApiUser, type CurrentUser } from "@/lib/auth/session";

/** The caller must own the provider profile (or be an admin) to change it. */
export async function requireProviderEditor(request: Request, providerId: string): Promise<CurrentUser> {
  const user = await requireApiUser(request);
  if (!canEditProfile(user, providerId)) throw new Forbidden("Only the owner of this profile can change it");
  return user;
}
