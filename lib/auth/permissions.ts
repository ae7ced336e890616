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
  // Tank requests, quotes, jobs and portfolios (issue 5). Each service also checks that the caller is a party.
  "tank-request:quote": ["builder"],
  "job:take-part": ["farmer", "builder", "admin"],
  "portfolio:manage": ["builder"],
  "upload:image": ["farmer", "hatchery", "builder", "admin"],
  "reservation:create": ["farmer"],
  "reservation:pay": ["farmer"],
  // Reading one's own reservations and moving them along; ownership is checked again per reservation.
  "reservation:view": ["farmer", "hatchery", "admin"],
  "reservation:respond": ["hatchery"],
  "reservation:export": ["hatchery"],
  "batch:manage": ["hatchery"],
  "review:write": ["farmer"],
  // Reviews (issue 7). Each service checks the party again: only the reviewed provider replies, nobody votes on or
  // reports their own review.
  "review:respond": ["hatchery", "builder"],
  "review:report": ["farmer", "hatchery", "builder", "admin"],
  "review:vote": ["farmer", "hatchery", "builder", "admin"],
  "admin:moderate-reviews": ["admin"],
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

/** A hatchery manages its own batches only. */
export function canManageBatch(actor: Actor, batch: { hatcheryId: string }): boolean {
  return Boolean(actor && actor.roles.includes("hatchery") && actor.id === batch.hatcheryId);
}

/**
 * The part the actor plays in a reservation: its farmer, its hatchery, or an admin who is neither; null for
 * everyone else. `preferAdmin` is for admin-only moves (settling a dispute) by an admin who is also a party.
 */
export function reservationRoleOf(actor: Actor, reservation: { farmerId: string; hatcheryId: string }, preferAdmin = false): "farmer" | "hatchery" | "admin" | null {
  if (!actor) return null;
  if (preferAdmin && actor.roles.includes("admin")) return "admin";
  if (actor.id === reservation.farmerId && actor.roles.includes("farmer")) return "farmer";
  if (actor.id === reservation.hatcheryId && actor.roles.includes("hatchery")) return "hatchery";
  if (actor.roles.includes("admin")) return "admin";
  return null;
}
