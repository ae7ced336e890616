import type { Actor } from "@/lib/auth/permissions";

/**
 * Anyone with a plan's link may read it (its id is a random UUID); only the farmer who saved it may change or delete
 * it. Admins do not edit farmers' plans: a plan holds no one else's data, so there is nothing to moderate.
 */
export function canChangePlan(actor: Actor, plan: { ownerId: string }): boolean {
  return actor !== null && actor.id === plan.ownerId;
}
