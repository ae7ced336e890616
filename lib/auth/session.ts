import "server-only";
import { eq } from "drizzle-orm";
import { headers } from "next/headers";
import { forbidden, redirect } from "next/navigation";
import { cache } from "react";
import { db } from "@/db/client";
import { profile, userRole } from "@/db/schema";
import { type Role } from "@/lib/catalog";
import { Forbidden, Unauthorized } from "@/lib/errors";
import { auth } from "./auth";
import { decide, type Permission } from "./permissions";

export type CurrentUser = {
  id: string;
  email: string;
  name: string;
  emailVerified: boolean;
  roles: Role[];
  onboarded: boolean;
};

async function loadUser(requestHeaders: Headers): Promise<CurrentUser | null> {
  const session = await auth.api.getSession({ headers: requestHeaders });
  if (!session) return null;
  const [roles, prof] = await Promise.all([
    db.select({ role: userRole.role }).from(userRole).where(eq(userRole.userId, session.user.id)),
    db.select({ onboardedAt: profile.onboardedAt }).from(profile).where(eq(profile.userId, session.user.id)).limit(1),
  ]);
  return {
    id: session.user.id,
    email: session.user.email,
    name: session.user.name,
    emailVerified: session.user.emailVerified,
    roles: roles.map((r) => r.role),
    onboarded: Boolean(prof[0]?.onboardedAt),
  };
}

/** The signed-in user for this request (pages and server actions), or null. */
export const getCurrentUser = cache(async (): Promise<CurrentUser | null> => loadUser(await headers()));

/** For route handlers, which receive the request. */
export async function getRequestUser(request: Request): Promise<CurrentUser | null> {
  return loadUser(request.headers);
}

/** Route handlers: throws Unauthorized (401) or Forbidden (403). */
export async function requireApiPermission(request: Request, permission: Permission): Promise<CurrentUser> {
  const user = await getRequestUser(request);
  const decision = decide(user, permission);
  if (decision === "signed-out" || !user) throw new Unauthorized();
  if (decision === "forbidden") throw new Forbidden(`Your account has no role that may do this (${permission}).`);
  return user;
}

export async function requireApiUser(request: Request): Promise<CurrentUser> {
  const user = await getRequestUser(request);
  if (!user) throw new Unauthorized();
  return user;
}

/** Pages: sends signed-out visitors to sign in and renders the 403 page for the wrong role. */
export async function requirePagePermission(permission: Permission, returnTo: string): Promise<CurrentUser> {
  const user = await getCurrentUser();
  const decision = decide(user, permission);
  if (decision === "signed-out" || !user) redirect(`/sign-in?next=${encodeURIComponent(returnTo)}`);
  if (decision === "forbidden") forbidden();
  return user;
}

/** Pages that any signed-in user may see. */
export async function requirePageUser(returnTo: string): Promise<CurrentUser> {
  const user = await getCurrentUser();
  if (!user) redirect(`/sign-in?next=${encodeURIComponent(returnTo)}`);
  return user;
}
