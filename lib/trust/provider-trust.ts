import "server-only";
import { and, eq, or } from "drizzle-orm";
import { db } from "@/db/client";
import { listing } from "@/db/schema";
import { trustKey, type ReviewRole, type TrustBadge } from "@/lib/reviews/types";
import type { TrustSummary } from "./compose-trust";
import { computeTrust } from "./trust-stats";

/** The full trust summary of one provider role, with the reasons the provider page shows, computed now. */
export async function getProviderTrust(providerUserId: string, role: ReviewRole): Promise<TrustSummary> {
  return (await computeTrust(db, providerUserId, role)).summary;
}

/**
 * Badges for many provider roles at once, keyed `${providerUserId}:${role}` (trustKey). One query reads the badge
 * columns of their listing rows (written with the score by refreshListings); a provider role without a listing
 * (no public location yet) is computed on the spot.
 */
export async function getTrustBadges(keys: readonly { providerUserId: string; role: ReviewRole }[]): Promise<Map<string, TrustBadge>> {
  const out = new Map<string, TrustBadge>();
  const wanted = [...new Map(keys.map((k) => [trustKey(k.providerUserId, k.role), k])).values()];
  if (wanted.length === 0) return out;
  const rows = await db
    .select({
      userId: listing.userId,
      kind: listing.kind,
      isNew: listing.trustIsNew,
      rating: listing.trustRating,
      reviews: listing.trustReviews,
      jobsCompleted: listing.trustJobsCompleted,
      verified: listing.verified,
    })
    .from(listing)
    .where(or(...wanted.map((k) => and(eq(listing.userId, k.providerUserId), eq(listing.kind, k.role)))));
  for (const r of rows) {
    out.set(trustKey(r.userId, r.kind), { isNew: r.isNew, displayRating: r.rating, reviews: r.reviews, jobsCompleted: r.jobsCompleted, verified: r.verified });
  }
  for (const k of wanted) {
    const key = trustKey(k.providerUserId, k.role);
    if (!out.has(key)) out.set(key, (await computeTrust(db, k.providerUserId, k.role)).badge);
  }
  return out;
}
