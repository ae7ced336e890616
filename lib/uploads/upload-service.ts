import "server-only";
import { and, eq } from "drizzle-orm";
import { db } from "@/db/client";
import { image, profile } from "@/db/schema";
import { writeTransaction, type WriteTx } from "@/db/write-transaction";
import { job, portfolioItem, tankRequest, uploadCompletion } from "@/db/schema-jobs";
import type { Role } from "@/lib/catalog";
import { Conflict, Forbidden, NotFound } from "@/lib/errors";
import { refreshListings } from "@/lib/listings/sync";
import { appStorage } from "@/lib/storage/app-storage";
import type { PresignedUpload, ProcessedUpload } from "@/lib/storage/upload-contract";
import { UploadRefused } from "@/lib/storage/upload-errors";
import { canUseUploadKind, isUploadKind, UPLOAD_KINDS, type UploadKind } from "@/lib/storage/upload-kinds";
import { deleteImage, presignUpload, processUpload, uploadKey, type Storage } from "@/lib/storage/uploads";
import { assertMayAddReviewPhotos } from "@/lib/reviews/review-photos";
import { countImagesOf } from "./images";

/*
 * The upload endpoints' logic: which object an image is for, whether this account may add to it, and how many of
 * this kind it already holds. lib/storage/uploads.ts does the byte work; this file ties it to the database.
 */

export type Uploader = { id: string; roles: readonly Role[] };
type Reader = typeof db | WriteTx;

/** How many images of this kind the object holds now, after checking the uploader may add to it. */
async function openSubject(reader: Reader, user: Uploader, kind: UploadKind, subjectId: string): Promise<number> {
  switch (kind) {
    case "site-photo": {
      // A request not posted yet is a draft: the new-request page hands out its id before the farmer posts.
      const [row] = await reader.select({ farmerId: tankRequest.farmerId, state: tankRequest.state }).from(tankRequest).where(eq(tankRequest.id, subjectId));
      if (row && row.farmerId !== user.id) throw new Forbidden("This tank request is not yours.");
      if (row && row.state !== "open") throw new Conflict("Site photos can be added while the request is open.");
      return countImagesOf(kind, subjectId, user.id, reader);
    }
    case "portfolio": {
      const [row] = await reader.select({ builderId: portfolioItem.builderId }).from(portfolioItem).where(eq(portfolioItem.id, subjectId));
      if (row && row.builderId !== user.id) throw new Forbidden("This portfolio item is not yours.");
      return countImagesOf(kind, subjectId, user.id, reader);
    }
    case "completion-photo": {
      const [row] = await reader.select({ builderId: job.builderId, state: job.state }).from(job).where(eq(job.id, subjectId));
      if (!row) throw new NotFound("No job with this id.");
      if (row.builderId !== user.id) throw new Forbidden("Only the builder of this job can add its completion photos.");
      if (row.state !== "on_site") throw new Conflict("Completion photos are added while the job is on site, before it is marked built.");
      return countImagesOf(kind, subjectId, user.id, reader);
    }
    case "avatar":
      if (subjectId !== user.id) throw new Forbidden("You can only change your own profile photo.");
      return 0; // a new profile photo replaces the old one
    case "review-photo":
      // Named by the job or reservation under review, so the farmer can add photos before the review exists
      // (and while it may still be edited); createReview and editReview attach them.
      await assertMayAddReviewPhotos(reader, user.id, subjectId);
      return countImagesOf(kind, subjectId, user.id, reader);
  }
}

function requireKind(user: Uploader, kind: UploadKind): void {
  // Before looking at the object, so a wrong role is told so rather than "not found".
  if (!canUseUploadKind(user.roles, kind)) throw new Forbidden(`Your account cannot upload ${UPLOAD_KINDS[kind].label}s.`);
}

export async function presignForSubject(
  user: Uploader,
  input: { kind: UploadKind; subjectId: string; contentType: string; contentLength: number },
  storage: Storage = appStorage(),
): Promise<PresignedUpload> {
  requireKind(user, input.kind);
  const existingCount = await openSubject(db, user, input.kind, input.subjectId);
  return presignUpload(storage, { kind: input.kind, ownerId: user.id, roles: user.roles, contentType: input.contentType, contentLength: input.contentLength, existingCount });
}

async function storedUpload(imageId: string): Promise<ProcessedUpload> {
  const [row] = await db.select().from(image).where(eq(image.id, imageId));
  if (!row || !isUploadKind(row.kind)) throw new NotFound("This upload was not found.");
  return { imageId: row.id, kind: row.kind, ownerId: row.ownerId, keyPrefix: row.keyPrefix, width: row.width, height: row.height, widths: row.widths };
}

/**
 * Checks and stores an uploaded original as an image of `subjectId`. A second submit of the same upload id gets
 * the image stored by the first (or a 409 while the first is still being processed), never a second image.
 */
export async function completeForSubject(
  user: Uploader,
  input: { kind: UploadKind; subjectId: string; uploadId: string },
  storage: Storage = appStorage(),
): Promise<ProcessedUpload> {
  requireKind(user, input.kind);
  const claimed = await db.insert(uploadCompletion).values({ uploadId: input.uploadId, ownerId: user.id }).onConflictDoNothing().returning();
  if (claimed.length === 0) {
    const [earlier] = await db.select().from(uploadCompletion).where(eq(uploadCompletion.uploadId, input.uploadId));
    if (!earlier || earlier.ownerId !== user.id) throw new Forbidden("This upload belongs to another account.");
    if (!earlier.imageId) throw new Conflict("This photo is still being checked. Wait a moment.");
    return storedUpload(earlier.imageId);
  }

  let processed: ProcessedUpload;
  try {
    const existingCount = await openSubject(db, user, input.kind, input.subjectId);
    processed = await processUpload(storage, { kind: input.kind, key: uploadKey(input.uploadId), ownerId: user.id, existingCount });
  } catch (error) {
    // Nothing was stored: free the id so that a retry is judged afresh (the original is gone, so it says "upload again").
    await db.delete(uploadCompletion).where(eq(uploadCompletion.uploadId, input.uploadId));
    throw error;
  }

  const spec = UPLOAD_KINDS[input.kind];
  let replaced: { id: string; widths: number[] } | null;
  try {
    replaced = await writeTransaction(db, async (tx): Promise<{ id: string; widths: number[] } | null> => {
      // Counted again inside the write transaction: several uploads of one object may finish at the same moment.
      const now = await openSubject(tx, user, input.kind, input.subjectId);
      if (now >= spec.maxCount) throw new UploadRefused("too-many-files", spec);
      await tx.insert(image).values({
        id: processed.imageId,
        ownerId: user.id,
        kind: input.kind,
        keyPrefix: processed.keyPrefix,
        widths: processed.widths,
        width: processed.width,
        height: processed.height,
        subjectId: input.subjectId,
      });
      await tx.update(uploadCompletion).set({ imageId: processed.imageId }).where(eq(uploadCompletion.uploadId, input.uploadId));
      if (input.kind !== "avatar") return null;
      const [prof] = await tx.select({ avatarImageId: profile.avatarImageId }).from(profile).where(eq(profile.userId, user.id));
      if (!prof) throw new NotFound("Complete your profile first.");
      await tx.update(profile).set({ avatarImageId: processed.imageId }).where(eq(profile.userId, user.id));
      const [old] = prof.avatarImageId
        ? await tx.select({ id: image.id, widths: image.widths }).from(image).where(and(eq(image.id, prof.avatarImageId), eq(image.ownerId, user.id)))
        : [];
      if (old) await tx.delete(image).where(eq(image.id, old.id));
      await refreshListings(tx, user.id); // listings show the avatar
      return old ?? null;
    });
  } catch (error) {
    await deleteImage(storage, processed.imageId, processed.widths).catch((cleanup: unknown) => console.error("[uploads] cleanup failed", processed.imageId, cleanup));
    await db.delete(uploadCompletion).where(eq(uploadCompletion.uploadId, input.uploadId));
    throw error;
  }
  if (replaced) {
    const old = replaced;
    await deleteImage(storage, old.id, old.widths).catch((error: unknown) => console.error("[uploads] old avatar not deleted", old.id, error));
  }
  return processed;
}
