import type { Role } from "@/lib/catalog";

/**
 * Who may do what. The single table every route handler, server action and
 * protected page consults; hidden buttons are only a convenience.
 */
export const PERMISSIONS = {
  "dashboard:view": ["farmer", "hatchery", "builder", "admin"],
  "profile:edit-own": ["farmer", "hatchery", "builder", "admin"],
  "hatchery:manage": ["hatchery"],
  "builder:manage": ["builder"],
  "plan:save": ["farmer"],
  "tank-request:post": ["farmer"],
  "reservation:create": ["farmer"],
  "review:write": ["farmer"],
  "admin:verify-providers": ["admin"],
  "admin:resolve-disputes": ["admin"],
  "admin:read-ledger": ["admin"],
} as const satisfies Record<string, readonly Role[]>;

export type Permission = keyof typeof PERMISSIONS;

export type Actor = { id: string; roles: readonly Role[] } | null;

export type AccessDecision = "allowed" | "signed-out" | "forbidden";

export function decide(actor: Actor, permission: Permission): AccessDecision {
  if (!actor) return "signed-out";
  const allowed: readonly Role[] = PERMISSIONS[permission];
  return actor.roles.some((r) => allowed.includes(r)) ? "allowed" : "forbidden";
}

export function can(actor: Actor, permission: Permission): boolean {
  return decide(actor, permission) === "allowed";
}

/** Owners edit their own profile; admins may correct any profile. */
export function canEditProfile(actor: Actor, profileUserId: string): boolean {
  if (!actor) return false;
  return actor.id === profileUserId || actor.roles.includes("admin");
}

/** Roles a user may pick for themselves; admin is granted by another admin or the seed only. */
export const SELF_SERVICE_ROLES = ["farmer", "hatchery", "builder"] as const satisfies readonly Role[];
export type SelfServiceRole = (typeof SELF_SERVICE_ROLES)[number];

export function isProvider(roles: readonly Role[]): boolean {
  return roles.includes("hatchery") || roles.includes("builder");
}
