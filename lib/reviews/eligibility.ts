import "server-only";
import { and, eq } from "drizzle-orm";
import { db, type Database } from "@/db/client";
import { review } from "@/db/schema-reviews";
import type { WriteTx } from "@/db/write-transaction";
import { loadReviewSubject, providerNameOf, type ReviewSubject } from "./subjects";
import type { ReviewEligibility, ReviewSubjectKind } from "./types";

// Who may review what, in one place (the API, the pages and the photo upload all ask here):
// only the farmer of the job or reservation, only once it is finished (a job completed, or resolved after a
// dispute; a reservation released), never while a dispute is open, once per job or reservation (the database's
// unique index says so too), and never about oneself: the provider's account must not be the author's, whichever
// of its roles it is acting in.

type Reader = Database | WriteTx;

export type EligibilityCheck = { eligibility: ReviewEligibility; subject: ReviewSubject | null };

export async function checkEligibility(reader: Reader, farmerUserId: string, subjectKind: ReviewSubjectKind, subjectId: string): Promise<EligibilityCheck> {
  const subject = await loadReviewSubject(reader, subjectKind, subjectId);
  if (!subject) {
    return { subject, eligibility: { eligible: false, reason: "not_found", message: subjectKind === "job" ? "There is no such job." : "There is no such reservation." } };
  }
  if (subject.farmerId !== farmerUserId) {
    return { subject, eligibility: { eligible: false, reason: "not_yours", message: `Only the farmer who ${subjectKind === "job" ? "ordered this tank" : "reserved these fish"} can review it.` } };
  }
  if (subject.providerId === farmerUserId) {
    return { subject, eligibility: { eligible: false, reason: "own_business", message: "You cannot review your own business." } };
  }
  const [existing] = await reader
    .select({ id: review.id })
    .from(review)
    .where(and(eq(review.subjectKind, subjectKind), eq(review.subjectId, subjectId)))
    .limit(1);
  if (existing) {
    return { subject, eligibility: { eligible: false, reason: "already_reviewed", message: "You have already reviewed this. You can still correct your review for 14 days after writing it.", existingReviewId: existing.id } };
  }
  if (subject.disputed) {
    return { subject, eligibility: { eligible: false, reason: "disputed", message: "This is in dispute. You can review it once Shoal has settled the dispute." } };
  }
  if (!subject.finished) {
    const message = subjectKind === "job" ? "You can review the builder once the job is completed." : "You can review the hatchery once the reservation is released, after the first week with the fish.";
    return { subject, eligibility: { eligible: false, reason: "not_finished", message } };
  }
  return {
    subject,
    eligibility: {
      eligible: true,
      subjectKind,
      subjectId,
      role: subject.role,
      providerUserId: subject.providerId,
      providerName: await providerNameOf(reader, subject.providerId),
      subjectLabel: subject.label,
    },
  };
}

/** Whether this farmer may review this job or reservation now, and if not, why (the page shows the message). */
export async function getReviewEligibility(farmerUserId: string, subjectKind: ReviewSubjectKind, subjectId: string): Promise<ReviewEligibility> {
  return (await checkEligibility(db, farmerUserId, subjectKind, subjectId)).eligibility;
}
