import "server-only";
import type { WriteTx } from "@/db/write-transaction";
import { refreshListings } from "@/lib/listings/sync";
import { queueReviewRequest } from "./review-mail";

// Where the trust inputs change outside reviews, the owning service calls one of these inside its own write
// transaction: the provider's listings (score and badge) are recomputed there, so the map's "most trusted" order
// never lags a finished job, and the farmer's review request is queued with the move that allows it.
// After commit the caller sends the request with sendReviewRequest (lib/reviews/review-mail.ts).

const JOB_STATES_THAT_COUNT = ["completed", "resolved", "cancelled"];

/** A job moved to `nextState`: finished or dropped work changes the builder's record. */
export async function afterJobMoveInTx(tx: WriteTx, row: { id: string; farmerId: string; builderId: string }, nextState: string): Promise<boolean> {
  if (!JOB_STATES_THAT_COUNT.includes(nextState)) return false;
  await refreshListings(tx, row.builderId);
  if (nextState === "cancelled") return false;
  await queueReviewRequest(tx, { kind: "job", id: row.id, farmerId: row.farmerId });
  return true;
}

const RESERVATION_EVENTS_THAT_COUNT = ["accept", "decline", "lapse", "report_survival", "auto_release", "resolve_dispute", "refund"];

/**
 * A reservation moved: an answer (accept, decline, or none until it lapsed) changes the hatchery's response time; a
 * release, a survival report or a refund, and a cancel by the hatchery, change its record. A farmer's own cancel
 * changes nothing that trust counts, so the busiest move costs nothing extra. Returns whether a review request was
 * queued.
 */
export async function afterReservationMoveInTx(tx: WriteTx, row: { id: string; farmerId: string; hatcheryId: string }, event: string, nextState: string, actorRole: string): Promise<boolean> {
  const counts = RESERVATION_EVENTS_THAT_COUNT.includes(event) || (event === "cancel" && actorRole === "hatchery");
  if (!counts) return false;
  await refreshListings(tx, row.hatcheryId);
  if (nextState !== "released") return false;
  await queueReviewRequest(tx, { kind: "reservation", id: row.id, farmerId: row.farmerId });
  return true;
}

/** A builder answered a tank request: its response time changed. */
export async function afterQuoteSentInTx(tx: WriteTx, builderId: string): Promise<void> {
  await refreshListings(tx, builderId);
}
