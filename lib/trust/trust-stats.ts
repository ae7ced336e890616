import { and, count, desc, eq, inArray, isNotNull, isNull, sql } from "drizzle-orm";
import type { Database } from "@/db/client";
import { profile } from "@/db/schema";
import { job, jobEvent, quote, tankRequest } from "@/db/schema-jobs";
import { reservation, reservationHistory } from "@/db/schema-reservations";
import { review } from "@/db/schema-reviews";
import type { WriteTx } from "@/db/write-transaction";
import type { ReviewRole, TrustBadge } from "@/lib/reviews/types";
import { composeTrust, type StarCounts, type TrustStats, type TrustSummary } from "./compose-trust";

// What happened on Shoal, read from the database per provider ROLE (one account that builds tanks and sells fish
// has two records), turned into composeTrust's inputs. No server-only marker and no default client: refreshListings
// calls this inside the caller's transaction, and the seed calls it with its own connection.
//
// What each input counts (the definitions shown to users through the reasons):
// - stars: visible reviews (not hidden by an admin) of this role.
// - builder jobsCompleted: jobs completed or resolved (a settled dispute is a finished job);
//   hatchery: reservations released (fish handed over and the week passed, or a dispute settled for the hatchery).
// - jobsAccepted: those, plus the work the provider took on and did not finish: a builder cancelling a scheduled job
//   (deposit held), a hatchery cancelling a reservation it had accepted, a reservation refunded after hand-over or
//   by an admin. Jobs still under way are not counted, nor a farmer calling off or letting a reservation lapse.
// - disputesLost: builder jobs resolved wholly for the farmer (a split is not a loss); hatchery reservations
//   refunded by a dispute decided for the farmer.
// - medianResponseHours: builder: from a farmer's tank request to this builder's quote on it; hatchery: from a
//   reservation request to the hatchery's accept or decline (a request left to lapse counts with all the time it
//   waited). Over the latest RESPONSE_SAMPLE requests, so an old slow spell fades and the query stays small.
// - survivalReports: hatcheries only, every farmer's 7-day report (survived / handed over).

type Reader = Database | WriteTx;

const RESPONSE_SAMPLE = 50;
/** Reservation states reached through an answer of the hatchery (accepted at some point, declined, or left to lapse). */
const ANSWERED_STATES = ["accepted", "deposit_held", "quarantine", "released", "disputed", "refunded", "cancelled", "declined", "lapsed"] as const;
const HOUR_MS = 3_600_000;

function median(values: readonly number[]): number | null {
  if (values.length === 0) return null;
  const sorted = [...values].sort((a, b) => a - b);
  const mid = Math.floor(sorted.length / 2);
  const upper = sorted[mid] ?? 0;
  return sorted.length % 2 === 1 ? upper : ((sorted[mid - 1] ?? upper) + upper) / 2;
}

async function starCounts(reader: Reader, userId: string, role: ReviewRole): Promise<StarCounts> {
  const rows = await reader
    .select({ stars: review.stars, n: count() })
    .from(review)
    .where(and(eq(review.providerId, userId), eq(review.role, role), isNull(review.hiddenAt)))
    .groupBy(review.stars);
  const out = { 1: 0, 2: 0, 3: 0, 4: 0, 5: 0 };
  for (const r of rows) if (r.stars >= 1 && r.stars <= 5) out[r.stars as 1 | 2 | 3 | 4 | 5] = r.n;
  return out;
}

async function isVerified(reader: Reader, userId: string): Promise<boolean> {
  const [row] = await reader.select({ state: profile.verificationState }).from(profile).where(eq(profile.userId, userId)).limit(1);
  return row?.state === "verified";
}

async function builderStats(reader: Reader, userId: string): Promise<Omit<TrustStats, "stars" | "verified">> {
  const [finished] = await reader
    .select({
      completed: count(),
      lost: sql<number>`coalesce(sum(case when ${job.state} = 'resolved' and json_extract(${job.resolution}, '$.outcome') = 'for_farmer' then 1 else 0 end), 0)`,
    })
    .from(job)
    .where(and(eq(job.builderId, userId), inArray(job.state, ["completed", "resolved"])));
  const [dropped] = await reader
    .select({ n: count() })
    .from(job)
    .where(
      and(
        eq(job.builderId, userId),
        eq(job.state, "cancelled"),
        sql`exists (select 1 from ${jobEvent} e where e.job_id = ${job.id} and e.event = 'cancel' and e.actor_role = 'builder' and e.from_state = 'scheduled')`,
      ),
    );
  const answers = await reader
    .select({ asked: tankRequest.createdAt, answered: quote.createdAt })
    .from(quote)
    .innerJoin(tankRequest, eq(tankRequest.id, quote.requestId))
    .where(eq(quote.builderId, userId))
    .orderBy(desc(quote.createdAt))
    .limit(RESPONSE_SAMPLE);
  const completed = Number(finished?.completed ?? 0);
  return {
    jobsCompleted: completed,
    jobsAccepted: completed + (dropped?.n ?? 0),
    disputesLost: Number(finished?.lost ?? 0),
    medianResponseHours: median(answers.map((a) => Math.max(0, a.answered.getTime() - a.asked.getTime()) / HOUR_MS)),
  };
}

async function hatcheryStats(reader: Reader, userId: string): Promise<Omit<TrustStats, "stars" | "verified">> {
  // Only the ended states (the index on (hatchery_id, state, …) finds them), and the history looked up for those alone.
  const lostByDispute = sql`exists (select 1 from ${reservationHistory} h where h.reservation_id = ${reservation.id} and h.event = 'resolve_dispute' and json_extract(h.detail, '$.outcome') = 'for_farmer')`;
  // A hatchery may cancel only what it accepted, so reservations cancelled before acceptance need no look-up.
  const droppedByHatchery = sql`${reservation.acceptedAt} is not null and exists (select 1 from ${reservationHistory} h where h.reservation_id = ${reservation.id} and h.event = 'cancel' and h.actor_role = 'hatchery')`;
  const ended = await reader
    .select({ state: reservation.state, n: count(), lost: sql<number>`coalesce(sum(case when ${reservation.state} = 'refunded' and ${lostByDispute} then 1 else 0 end), 0)`, dropped: sql<number>`coalesce(sum(case when ${reservation.state} = 'cancelled' and ${droppedByHatchery} then 1 else 0 end), 0)` })
    .from(reservation)
    .where(and(eq(reservation.hatcheryId, userId), inArray(reservation.state, ["released", "refunded", "cancelled"])))
    .groupBy(reservation.state);
  const of = (state: string) => ended.find((e) => e.state === state);
  // The answer to a request is its acceptance, or its decline (a final state: closed_at is the moment); a request
  // left unanswered until it lapsed counts with the whole time it waited.
  // One small query per state, each read in the order of the (hatchery_id, state, requested_at) index and cut at
  // the sample size, then merged: no sort over all of a busy hatchery's reservations inside a write transaction.
  const answers: { asked: Date; accepted: Date | null; closed: Date | null }[] = [];
  for (const state of ANSWERED_STATES) {
    const rows = await reader
      .select({ asked: reservation.requestedAt, accepted: reservation.acceptedAt, closed: reservation.closedAt })
      .from(reservation)
      .where(and(eq(reservation.hatcheryId, userId), eq(reservation.state, state), state === "cancelled" ? isNotNull(reservation.acceptedAt) : undefined))
      .orderBy(desc(reservation.requestedAt))
      .limit(RESPONSE_SAMPLE);
    answers.push(...rows);
  }
  answers.sort((a, b) => b.asked.getTime() - a.asked.getTime());
  answers.length = Math.min(answers.length, RESPONSE_SAMPLE);
  const reports = await reader
    .select({ handedOver: reservation.handedOverCount, survived: reservation.survivedCount })
    .from(reservation)
    .where(and(eq(reservation.hatcheryId, userId), eq(reservation.state, "released"), isNotNull(reservation.survivedCount), isNotNull(reservation.handedOverCount)));
  const released = of("released")?.n ?? 0;
  return {
    jobsCompleted: released,
    jobsAccepted: released + (of("refunded")?.n ?? 0) + Number(of("cancelled")?.dropped ?? 0),
    disputesLost: Number(of("refunded")?.lost ?? 0),
    medianResponseHours: median(
      answers.flatMap((a) => {
        const at = a.accepted ?? a.closed;
        return at ? [Math.max(0, at.getTime() - a.asked.getTime()) / HOUR_MS] : [];
      }),
    ),
    survivalReports: reports.flatMap((r) => (r.handedOver !== null && r.handedOver > 0 && r.survived !== null ? [{ fishHandedOver: r.handedOver, fishSurvived: r.survived }] : [])),
  };
}

/** composeTrust's inputs for one provider role, from the database as `reader` sees it. */
export async function gatherTrustStats(reader: Reader, userId: string, role: ReviewRole): Promise<TrustStats> {
  // One after another: inside a transaction the queries share one connection.
  const stars = await starCounts(reader, userId, role);
  const verified = await isVerified(reader, userId);
  const rest = role === "builder" ? await builderStats(reader, userId) : await hatcheryStats(reader, userId);
  return { stars, verified, ...rest };
}

export type ComputedTrust = { stats: TrustStats; summary: TrustSummary; badge: TrustBadge };

export function badgeOf(summary: TrustSummary, verified: boolean): TrustBadge {
  return { isNew: summary.isNew, displayRating: summary.displayRating, reviews: summary.counts.reviews, jobsCompleted: summary.counts.jobsCompleted, verified };
}

export async function computeTrust(reader: Reader, userId: string, role: ReviewRole): Promise<ComputedTrust> {
  const stats = await gatherTrustStats(reader, userId, role);
  const summary = composeTrust(stats);
  return { stats, summary, badge: badgeOf(summary, stats.verified) };
}

/** The listing columns that carry the trust score and badge (refreshListings writes them with the rest). */
export function trustColumns(computed: ComputedTrust) {
  return {
    trustScore: computed.summary.score,
    trustIsNew: computed.badge.isNew,
    trustRating: computed.badge.displayRating,
    trustReviews: computed.badge.reviews,
    trustJobsCompleted: computed.badge.jobsCompleted,
  };
}
