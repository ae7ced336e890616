import "server-only";
import { and, eq, inArray, isNotNull, ne, sql } from "drizzle-orm";
import { db } from "@/db/client";
import { builder, plan, profile, userRole } from "@/db/schema";
import { quote, tankRequest } from "@/db/schema-jobs";
import { writeTransaction } from "@/db/write-transaction";
import type { LatLng } from "@/lib/geo/coordinates";
import { Conflict, Forbidden, Invalid, NotFound } from "@/lib/errors";
import { appUrl, contactsOf, notify } from "@/lib/jobs/notify";
import { requestClosedMail, tankRequestNearbyMail } from "@/lib/mail/job-templates";
import type { TankRequestInput } from "@/lib/validations/tank-requests";
import { formatDay, storedSizeOf, tankTitle } from "./format";
import { formatDistance, MIN_METRES_PER_DEGREE_LAT, reachOf } from "./reach";

/* Posting and closing tank requests, and finding the builders a request reaches. */

export type ReachedBuilder = { builderId: string; distanceM: number; serviceRadiusKm: number };

/**
 * Builders whose service radius, from their exact base, covers the site: the rows in the latitude band any of them
 * could reach (a safe pre-filter, see reach.ts), then the exact geodesic distance. Rejected providers and accounts
 * without a base point are never reached; neither is the farmer's own builder account.
 */
export async function buildersInReach(site: LatLng, excludeUserId?: string): Promise<ReachedBuilder[]> {
  const rows = await db
    .select({ builderId: builder.userId, serviceRadiusKm: builder.serviceRadiusKm, lat: profile.lat, lng: profile.lng })
    .from(builder)
    .innerJoin(profile, eq(profile.userId, builder.userId))
    .innerJoin(userRole, and(eq(userRole.userId, builder.userId), eq(userRole.role, "builder")))
    .where(
      and(
        isNotNull(profile.lat),
        isNotNull(profile.lng),
        ne(profile.verificationState, "rejected"),
        excludeUserId ? ne(builder.userId, excludeUserId) : undefined,
        sql`abs(${profile.lat} - ${site.lat}) * ${MIN_METRES_PER_DEGREE_LAT} <= ${builder.serviceRadiusKm} * 1000 + 1`,
      ),
    );
  const reached: ReachedBuilder[] = [];
  for (const r of rows) {
    if (r.lat === null || r.lng === null) continue;
    const { distanceM, covered } = reachOf({ lat: r.lat, lng: r.lng }, r.serviceRadiusKm, site);
    if (covered) reached.push({ builderId: r.builderId, distanceM, serviceRadiusKm: r.serviceRadiusKm });
  }
  return reached.sort((a, b) => a.distanceM - b.distanceM);
}

export type PostedRequest = { id: string; created: boolean; reached: ReachedBuilder[] };

/**
 * Stores a farmer's request and writes to every builder it reaches. Posting the same form twice (a double click,
 * a retry after a lost reply) finds the request by its id and changes nothing.
 */
export async function postTankRequest(farmerId: string, input: TankRequestInput): Promise<PostedRequest> {
  if (input.planId) {
    const [own] = await db.select({ id: plan.id }).from(plan).where(and(eq(plan.id, input.planId), eq(plan.ownerId, farmerId)));
    if (!own) throw new Invalid("planId: Choose one of your own saved plans", { planId: ["Choose one of your own saved plans"] });
  }
  const size = input.size;
  const created = await writeTransaction(db, async (tx) => {
    const [existing] = await tx.select({ farmerId: tankRequest.farmerId }).from(tankRequest).where(eq(tankRequest.id, input.id));
    if (existing) {
      if (existing.farmerId !== farmerId) throw new Conflict("This form was already used. Reload the page and post again.");
      return false;
    }
    await tx.insert(tankRequest).values({
      id: input.id,
      farmerId,
      tankType: input.tankType,
      ...storedSizeOf(size),
      siteLat: input.site.lat,
      siteLng: input.site.lng,
      readiness: input.readiness,
      waterSource: input.waterSource,
      power: input.power,
      wantedBy: input.wantedBy,
      planId: input.planId,
      notes: input.notes,
    });
    return true;
  });
  if (!created) return { id: input.id, created: false, reached: [] };

  const reached = await buildersInReach(input.site, farmerId);
  const contacts = await contactsOf(reached.map((r) => r.builderId));
  const title = tankTitle(input.tankType, storedSizeOf(size));
  for (const r of reached) {
    const to = contacts.get(r.builderId);
    const mail = to
      ? tankRequestNearbyMail({ name: to.name, tank: title, distance: formatDistance(r.distanceM), wantedBy: formatDay(input.wantedBy), url: appUrl(`/builder/requests/${input.id}`) })
      : null;
    await notify(to, mail, `tank-request:${input.id}:${r.builderId}`);
  }
  return { id: input.id, created: true, reached };
}

/** The farmer takes an open request down; builders who quoted are told. */
export async function closeTankRequest(farmerId: string, requestId: string): Promise<void> {
  const quoted = await writeTransaction(db, async (tx) => {
    const [row] = await tx.select({ farmerId: tankRequest.farmerId, state: tankRequest.state }).from(tankRequest).where(eq(tankRequest.id, requestId));
    if (!row) throw new NotFound("No tank request with this id");
    if (row.farmerId !== farmerId) throw new Forbidden("This tank request is not yours");
    if (row.state !== "open") throw new Conflict(row.state === "awarded" ? "You accepted a quote: the request is now a job" : "This request is already closed");
    await tx.update(tankRequest).set({ state: "closed" }).where(and(eq(tankRequest.id, requestId), eq(tankRequest.state, "open")));
    const open = await tx.select({ id: quote.id, builderId: quote.builderId }).from(quote).where(and(eq(quote.requestId, requestId), eq(quote.state, "sent")));
    if (open.length) await tx.update(quote).set({ state: "declined" }).where(inArray(quote.id, open.map((q) => q.id)));
    return open;
  });
  const contacts = await contactsOf(quoted.map((q) => q.builderId));
  for (const q of quoted) {
    const to = contacts.get(q.builderId);
    await notify(to, to ? requestClosedMail({ name: to.name, url: appUrl("/builder/requests") }) : null, `tank-request-closed:${requestId}:${q.builderId}`);
  }
}
