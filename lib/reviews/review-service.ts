import "server-only";
import { randomUUID } from "node:crypto";
import { and, asc, count, eq } from "drizzle-orm";
import { db } from "@/db/client";
import { auditLog } from "@/db/schema";
import { review, reviewHelpful, reviewPhoto, reviewReply, reviewReport, reviewRevision, type ReviewRow } from "@/db/schema-reviews";
import { writeTransaction, type WriteTx } from "@/db/write-transaction";
import { can } from "@/lib/auth/permissions";
import type { Role } from "@/lib/catalog";
import { DomainError, Forbidden, Invalid, NotFound } from "@/lib/errors";
import { refreshListings } from "@/lib/listings/sync";
import type { CreateReviewInput, EditReviewInput, ModerationDecisionInput, ReplyInput, ReportInput } from "@/lib/validations/reviews";
import { checkEligibility } from "./eligibility";
import { aspectColumnsOf, aspectsOf, canStillEdit, presentReviews } from "./present";
import { deliverReviewMail, queueReviewMail } from "./review-mail";
import { deleteRemovedPhotos, setReviewPhotos, type ReplacedPhotos } from "./review-photos";
import { REVIEW_ASPECTS, REVIEW_LIMITS, type AspectKey, type PublicReview, type ReviewEligibility, type ReviewRole } from "./types";

/*
 * Writing reviews, replies, reports, helpful marks and moderation decisions. Every write runs in one write
 * transaction that re-reads what it depends on (so two tabs or two people cannot both pass a check), and changes to
 * what trust counts recompute the provider's listings (score and badge) in the same transaction. The database
 * backs the guards with its own constraints (one review per subject, one reply per review, one report per user and
 * review, stars 1..5); a race that reaches them is answered like the check it raced.
 * E-mails are queued in the transaction and sent after commit (review-mail.ts).
 */

export type ReviewActor = { id: string; roles: readonly Role[] };

const conflict = (code: string, message: string) => new DomainError(message, 409, code);

function isUniqueViolation(error: unknown): boolean {
  for (let e: unknown = error; e instanceof Error; e = e.cause) if (/UNIQUE constraint failed/i.test(e.message)) return true;
  return false;
}

function refusalOf(e: Extract<ReviewEligibility, { eligible: false }>): DomainError {
  switch (e.reason) {
    case "not_found":
      return new NotFound(e.message);
    case "not_yours":
    case "own_business":
      return new Forbidden(e.message);
    case "already_reviewed":
    case "disputed":
    case "not_finished":
      return conflict(e.reason, e.message);
  }
}

/** The aspects of the role, each rated; anything else is the caller's mistake (400 with the field named). */
function checkAspects(role: ReviewRole, aspects: Partial<Record<AspectKey, number>>): Partial<Record<AspectKey, number>> {
  const allowed: readonly AspectKey[] = REVIEW_ASPECTS[role];
  const fieldErrors: Record<string, string[]> = {};
  for (const key of Object.keys(aspects) as AspectKey[]) {
    if (!allowed.includes(key)) fieldErrors[`aspects.${key}`] = [`A ${role} is not rated on this`];
  }
  for (const key of allowed) if (aspects[key] === undefined) fieldErrors[`aspects.${key}`] = ["Choose 1 to 5 stars"];
  const first = Object.entries(fieldErrors)[0];
  if (first) throw new Invalid(`${first[0]}: ${first[1][0]}`, fieldErrors);
  return aspects;
}

async function loadReview(reader: typeof db | WriteTx, reviewId: string): Promise<ReviewRow> {
  const [row] = await reader.select().from(review).where(eq(review.id, reviewId)).limit(1);
  if (!row) throw new NotFound("There is no such review.");
  return row;
}

async function shown(reviewId: string, viewerId: string, now: Date): Promise<PublicReview> {
  const [out] = await presentReviews([await loadReview(db, reviewId)], viewerId, now);
  if (!out) throw new NotFound("There is no such review.");
  return out;
}

/** A farmer reviews a finished job or released reservation of theirs: once, with photos uploaded beforehand. */
export async function createReview(actor: ReviewActor, input: CreateReviewInput, now = new Date()): Promise<PublicReview> {
  if (!can(actor, "review:write")) throw new Forbidden("Only a farmer account can write reviews.");
  const id = randomUUID();
  let photos: ReplacedPhotos = { removed: [] };
  try {
    photos = await writeTransaction(db, async (tx) => {
      const { eligibility, subject } = await checkEligibility(tx, actor.id, input.subjectKind, input.subjectId);
      if (!eligibility.eligible) throw refusalOf(eligibility);
      if (!subject) throw new NotFound("There is nothing to review here.");
      const aspects = checkAspects(subject.role, input.aspects);
      await tx.insert(review).values({
        id,
        subjectKind: subject.kind,
        subjectId: subject.id,
        role: subject.role,
        authorId: actor.id,
        providerId: subject.providerId,
        stars: input.stars,
        ...aspectColumnsOf(aspects),
        body: input.body,
        subjectLabel: subject.label,
        createdAt: now,
        updatedAt: now,
      });
      const replaced = await setReviewPhotos(tx, { reviewId: id, subjectId: subject.id, authorId: actor.id }, input.photoIds);
      await refreshListings(tx, subject.providerId);
      await queueReviewMail(tx, "review-received", id, subject.providerId);
      return replaced;
    });
  } catch (error) {
    // Two submits at once: the unique (subject_kind, subject_id) index let only one through.
    if (isUniqueViolation(error)) throw conflict("already_reviewed", "You have already reviewed this.");
    throw error;
  }
  await deleteRemovedPhotos(photos);
  await deliverReviewMail({ subjectId: id });
  return shown(id, actor.id, now);
}

/** The author changes their review within the edit window; the version it replaces is kept in review_revision. */
export async function editReview(actor: ReviewActor, reviewId: string, input: EditReviewInput, now = new Date()): Promise<PublicReview> {
  const photos = await writeTransaction(db, async (tx) => {
    const row = await loadReview(tx, reviewId);
    if (row.authorId !== actor.id) throw new Forbidden("Only the farmer who wrote this review can change it.");
    if (row.hiddenAt !== null) throw conflict("hidden", "Shoal hid this review after a report, so it can no longer be changed.");
    if (!canStillEdit(row, now)) throw conflict("edit_window_closed", `A review can be changed for ${REVIEW_LIMITS.editDays} days after it is written; this one can no longer be changed.`);
    const aspects = input.aspects === undefined ? aspectsOf(row) : checkAspects(row.role, { ...aspectsOf(row), ...input.aspects });
    const current = await tx.select({ id: reviewPhoto.imageId }).from(reviewPhoto).where(eq(reviewPhoto.reviewId, reviewId)).orderBy(asc(reviewPhoto.position));
    await tx.insert(reviewRevision).values({
      reviewId,
      version: row.version,
      stars: row.stars,
      aspects: aspectsOf(row),
      body: row.body,
      photoIds: current.map((p) => p.id),
      writtenAt: row.editedAt ?? row.createdAt,
      replacedAt: now,
    });
    const moved = await tx
      .update(review)
      .set({ stars: input.stars ?? row.stars, ...aspectColumnsOf(aspects), body: input.body ?? row.body, version: row.version + 1, editedAt: now, updatedAt: now })
      .where(and(eq(review.id, reviewId), eq(review.version, row.version)))
      .returning({ id: review.id });
    if (moved.length === 0) throw conflict("changed", "This review was changed in another window. Reload and try again.");
    const replaced = input.photoIds === undefined ? { removed: [] } : await setReviewPhotos(tx, { reviewId, subjectId: row.subjectId, authorId: actor.id }, input.photoIds);
    await refreshListings(tx, row.providerId);
    return replaced;
  });
  await deleteRemovedPhotos(photos);
  return shown(reviewId, actor.id, now);
}

/** The reviewed provider answers once, publicly. */
export async function replyToReview(actor: ReviewActor, reviewId: string, input: ReplyInput, now = new Date()): Promise<PublicReview> {
  try {
    await writeTransaction(db, async (tx) => {
      const row = await loadReview(tx, reviewId);
      if (row.providerId !== actor.id || !actor.roles.includes(row.role)) throw new Forbidden("Only the provider this review is about can reply to it.");
      if (row.hiddenAt !== null) throw conflict("hidden", "This review was hidden by Shoal; there is nothing to reply to.");
      const [existing] = await tx.select({ id: reviewReply.id }).from(reviewReply).where(eq(reviewReply.reviewId, reviewId)).limit(1);
      if (existing) throw conflict("already_replied", "You have already replied to this review. A reply is given once.");
      await tx.insert(reviewReply).values({ id: randomUUID(), reviewId, authorId: actor.id, body: input.body, createdAt: now });
      await queueReviewMail(tx, "review-reply", reviewId, row.authorId);
    });
  } catch (error) {
    if (isUniqueViolation(error)) throw conflict("already_replied", "You have already replied to this review. A reply is given once.");
    throw error;
  }
  await deliverReviewMail({ subjectId: reviewId });
  return shown(reviewId, actor.id, now);
}

/** A signed-in user (not the author) reports a review to the moderation queue, once. */
export async function reportReview(actor: ReviewActor, reviewId: string, input: ReportInput, now = new Date()): Promise<{ reportId: string }> {
  const reportId = randomUUID();
  try {
    await writeTransaction(db, async (tx) => {
      const row = await loadReview(tx, reviewId);
      if (row.authorId === actor.id) throw new Forbidden("You cannot report your own review. You can change it for 14 days instead.");
      if (row.hiddenAt !== null) throw conflict("hidden", "Shoal has already hidden this review.");
      const [existing] = await tx.select({ id: reviewReport.id }).from(reviewReport).where(and(eq(reviewReport.reviewId, reviewId), eq(reviewReport.reporterId, actor.id))).limit(1);
      if (existing) throw conflict("already_reported", "You have already reported this review. Shoal will look at it.");
      await tx.insert(reviewReport).values({ id: reportId, reviewId, reporterId: actor.id, reason: input.reason, details: input.details, createdAt: now });
    });
  } catch (error) {
    if (isUniqueViolation(error)) throw conflict("already_reported", "You have already reported this review. Shoal will look at it.");
    throw error;
  }
  return { reportId };
}

/** Marks a review helpful (or takes the mark back); neither its author nor the reviewed provider may vote. */
export async function setHelpful(actor: ReviewActor, reviewId: string, helpful: boolean): Promise<{ helpfulCount: number; markedHelpful: boolean }> {
  return writeTransaction(db, async (tx) => {
    const row = await loadReview(tx, reviewId);
    if (row.hiddenAt !== null) throw new NotFound("There is no such review.");
    if (row.authorId === actor.id) throw new Forbidden("You cannot mark your own review helpful.");
    if (row.providerId === actor.id) throw new Forbidden("You cannot vote on reviews of your own business.");
    if (helpful) await tx.insert(reviewHelpful).values({ reviewId, userId: actor.id }).onConflictDoNothing();
    else await tx.delete(reviewHelpful).where(and(eq(reviewHelpful.reviewId, reviewId), eq(reviewHelpful.userId, actor.id)));
    // Counted afresh rather than incremented, so a repeated click or a lost reply can never drift the count.
    const [tally] = await tx.select({ n: count() }).from(reviewHelpful).where(eq(reviewHelpful.reviewId, reviewId));
    const helpfulCount = tally?.n ?? 0;
    await tx.update(review).set({ helpfulCount }).where(eq(review.id, reviewId));
    return { helpfulCount, markedHelpful: helpful };
  });
}

/**
 * An admin decides a report: "keep" leaves the review up; "hide" takes it out of lists and of trust (and closes
 * the review's other open reports). Either way the decision and its note go to the audit log.
 */
export async function decideReport(actor: ReviewActor, reportId: string, input: ModerationDecisionInput, now = new Date()): Promise<{ reportId: string; reviewId: string; decision: "keep" | "hide" }> {
  if (!can(actor, "admin:moderate-reviews")) throw new Forbidden("Only Shoal's admins decide on reported reviews.");
  return writeTransaction(db, async (tx) => {
    const [report] = await tx.select().from(reviewReport).where(eq(reviewReport.id, reportId)).limit(1);
    if (!report) throw new NotFound("There is no such report.");
    if (report.state !== "open") throw conflict("already_decided", "This report was already decided.");
    const row = await loadReview(tx, report.reviewId);
    const state = input.decision === "hide" ? "hidden" : "kept";
    const closing = { state, decision: input.decision, decisionNote: input.note, decidedBy: actor.id, decidedAt: now } as const;
    const decided = await tx
      .update(reviewReport)
      .set(closing)
      .where(and(eq(reviewReport.id, reportId), eq(reviewReport.state, "open")))
      .returning({ id: reviewReport.id });
    if (decided.length === 0) throw conflict("already_decided", "This report was decided meanwhile.");
    let alsoClosed: string[] = [];
    if (input.decision === "hide") {
      if (row.hiddenAt === null) await tx.update(review).set({ hiddenAt: now, updatedAt: now }).where(eq(review.id, row.id));
      alsoClosed = (
        await tx
          .update(reviewReport)
          .set(closing)
          .where(and(eq(reviewReport.reviewId, row.id), eq(reviewReport.state, "open")))
          .returning({ id: reviewReport.id })
      ).map((r) => r.id);
      // A hidden review no longer counts towards the provider's trust.
      await refreshListings(tx, row.providerId);
    }
    await tx.insert(auditLog).values({
      actorId: actor.id,
      action: `review.${input.decision}`,
      subjectType: "review",
      subjectId: row.id,
      detail: { reportId, reason: report.reason, note: input.note, providerId: row.providerId, alsoClosed },
      createdAt: now,
    });
    return { reportId, reviewId: row.id, decision: input.decision };
  });
}
