import "server-only";
import { and, eq, inArray } from "drizzle-orm";
import type { Database } from "@/db/client";
import { image } from "@/db/schema";
import { review, reviewPhoto } from "@/db/schema-reviews";
import type { WriteTx } from "@/db/write-transaction";
import { Conflict, Forbidden, Invalid, NotFound } from "@/lib/errors";
import { appStorage } from "@/lib/storage/app-storage";
import { deleteImage } from "@/lib/storage/uploads";
import { checkEligibility } from "./eligibility";
import { canStillEdit } from "./present";
import { loadReviewSubject } from "./subjects";
import { REVIEW_LIMITS, type ReviewSubjectKind } from "./types";

// Review photos are uploaded through the ordinary upload routes (kind "review-photo") with the JOB or RESERVATION id
// as their subject, so a farmer can add them while writing, before the review exists. Creating or editing the
// review then attaches exactly the photos it lists; the subject's other review photos of that farmer (left out, or
// removed in an edit) are deleted, files included, so a photo the farmer took back does not linger unseen.

type Reader = Database | WriteTx;

async function subjectKindOf(reader: Reader, subjectId: string): Promise<ReviewSubjectKind | null> {
  if (await loadReviewSubject(reader, "job", subjectId)) return "job";
  if (await loadReviewSubject(reader, "reservation", subjectId)) return "reservation";
  return null;
}

/** The upload routes' check: may this user add review photos for this job or reservation now? */
export async function assertMayAddReviewPhotos(reader: Reader, userId: string, subjectId: string, now = new Date()): Promise<void> {
  const kind = await subjectKindOf(reader, subjectId);
  if (!kind) throw new NotFound("There is no job or reservation with this id to review.");
  const { eligibility } = await checkEligibility(reader, userId, kind, subjectId);
  if (eligibility.eligible) return;
  switch (eligibility.reason) {
    case "not_found":
      throw new NotFound(eligibility.message);
    case "not_yours":
    case "own_business":
      throw new Forbidden(eligibility.message);
    case "already_reviewed": {
      const [row] = await reader.select({ authorId: review.authorId, createdAt: review.createdAt, hiddenAt: review.hiddenAt }).from(review).where(eq(review.id, eligibility.existingReviewId ?? "")).limit(1);
      if (row && row.authorId === userId && canStillEdit(row, now)) return;
      throw new Conflict("This review can no longer be changed, so no photos can be added to it.");
    }
    case "disputed":
    case "not_finished":
      throw new Conflict(eligibility.message);
  }
}

export type ReplacedPhotos = { removed: { id: string; widths: number[] }[] };

/**
 * Makes `photoIds` (in that order) the review's photos. Every id must be a review photo this author uploaded for
 * this subject; the author's other review photos of the subject are deleted (their files after commit, see
 * deleteRemovedPhotos).
 */
export async function setReviewPhotos(tx: WriteTx, r: { reviewId: string; subjectId: string; authorId: string }, photoIds: readonly string[]): Promise<ReplacedPhotos> {
  const refuse = (message: string) => new Invalid(`photoIds: ${message}`, { photoIds: [message] });
  if (photoIds.length > REVIEW_LIMITS.maxPhotos) throw refuse(`At most ${REVIEW_LIMITS.maxPhotos} photos`);
  if (new Set(photoIds).size !== photoIds.length) throw refuse("A photo is listed twice");
  const uploaded = await tx
    .select({ id: image.id, widths: image.widths })
    .from(image)
    .where(and(eq(image.kind, "review-photo"), eq(image.subjectId, r.subjectId), eq(image.ownerId, r.authorId)));
  const mine = new Set(uploaded.map((u) => u.id));
  if (photoIds.some((id) => !mine.has(id))) throw refuse("Add the photos with the upload on this page first");
  await tx.delete(reviewPhoto).where(eq(reviewPhoto.reviewId, r.reviewId));
  if (photoIds.length) await tx.insert(reviewPhoto).values(photoIds.map((imageId, position) => ({ reviewId: r.reviewId, imageId, position })));
  const keep = new Set(photoIds);
  const removed = uploaded.filter((u) => !keep.has(u.id));
  if (removed.length) await tx.delete(image).where(inArray(image.id, removed.map((u) => u.id)));
  return { removed };
}

/** After commit: the files of photos that were left out or taken back. A failure only leaves unreachable files. */
export async function deleteRemovedPhotos(replaced: ReplacedPhotos): Promise<void> {
  if (replaced.removed.length === 0) return;
  const storage = appStorage();
  for (const photo of replaced.removed) {
    await deleteImage(storage, photo.id, photo.widths).catch((error: unknown) => console.error("[reviews] photo files not deleted", photo.id, error instanceof Error ? error.message : error));
  }
}
