import "server-only";
import { and, asc, eq, inArray } from "drizzle-orm";
import { db } from "@/db/client";
import { image, user } from "@/db/schema";
import { review, reviewHelpful, reviewPhoto, reviewReply, reviewReport, type ReviewRow } from "@/db/schema-reviews";
import type { WriteTx } from "@/db/write-transaction";
import { fallbackWidth, imageSrcSet, imageUrl } from "@/lib/storage/image-urls";
import { shortPersonName } from "./subjects";
import { REVIEW_LIMITS, type AspectKey, type PublicReview, type ReviewPhoto } from "./types";

// Review rows as the pages and the API show them, several at once with one query per kind of detail (photos,
// replies, names, the viewer's marks), never one per review.

type Reader = typeof db | WriteTx;

const DAY_MS = 86_400_000;

/** The aspect columns of a review row, by aspect key. */
export const ASPECT_COLUMNS = {
  workmanship: review.workmanship,
  timeliness: review.timeliness,
  communication: review.communication,
  fish_health: review.fishHealth,
  count_as_promised: review.countAsPromised,
  size_as_promised: review.sizeAsPromised,
} as const satisfies Record<AspectKey, unknown>;

export function aspectsOf(row: ReviewRow): Partial<Record<AspectKey, number>> {
  const values: Record<AspectKey, number | null> = {
    workmanship: row.workmanship,
    timeliness: row.timeliness,
    communication: row.communication,
    fish_health: row.fishHealth,
    count_as_promised: row.countAsPromised,
    size_as_promised: row.sizeAsPromised,
  };
  const out: Partial<Record<AspectKey, number>> = {};
  for (const [key, value] of Object.entries(values) as [AspectKey, number | null][]) if (value !== null) out[key] = value;
  return out;
}

/** The row's columns for a set of aspect ratings (every aspect not given is empty). */
export function aspectColumnsOf(aspects: Partial<Record<AspectKey, number>>) {
  return {
    workmanship: aspects.workmanship ?? null,
    timeliness: aspects.timeliness ?? null,
    communication: aspects.communication ?? null,
    fishHealth: aspects.fish_health ?? null,
    countAsPromised: aspects.count_as_promised ?? null,
    sizeAsPromised: aspects.size_as_promised ?? null,
  };
}

export function editableUntil(row: Pick<ReviewRow, "createdAt">): Date {
  return new Date(row.createdAt.getTime() + REVIEW_LIMITS.editDays * DAY_MS);
}

export function canStillEdit(row: Pick<ReviewRow, "createdAt" | "hiddenAt">, now: Date): boolean {
  return row.hiddenAt === null && now.getTime() < editableUntil(row).getTime();
}

export async function photosOf(reader: Reader, reviewIds: readonly string[]): Promise<Map<string, ReviewPhoto[]>> {
  const out = new Map<string, ReviewPhoto[]>();
  if (reviewIds.length === 0) return out;
  const rows = await reader
    .select({ reviewId: reviewPhoto.reviewId, id: image.id, widths: image.widths, width: image.width, height: image.height, alt: image.alt })
    .from(reviewPhoto)
    .innerJoin(image, eq(image.id, reviewPhoto.imageId))
    .where(inArray(reviewPhoto.reviewId, [...reviewIds]))
    .orderBy(asc(reviewPhoto.reviewId), asc(reviewPhoto.position));
  for (const r of rows) {
    const width = fallbackWidth(r.widths);
    if (width === undefined) continue;
    const list = out.get(r.reviewId) ?? [];
    list.push({ imageId: r.id, alt: r.alt || "Photo added to the review", src: imageUrl(r.id, width), srcSet: imageSrcSet(r.id, r.widths), width: r.width, height: r.height });
    out.set(r.reviewId, list);
  }
  return out;
}

/**
 * Public names of review authors: "Given-name S." from the person's account name (not the profile's display name,
 * which for a provider who also farms is the business name).
 */
export async function shortNamesOf(reader: Reader, userIds: readonly string[]): Promise<Map<string, string>> {
  if (userIds.length === 0) return new Map();
  const rows = await reader
    .select({ id: user.id, name: user.name })
    .from(user)
    .where(inArray(user.id, [...new Set(userIds)]));
  return new Map(rows.map((r) => [r.id, shortPersonName(r.name)]));
}

export async function presentReviews(rows: readonly ReviewRow[], viewerUserId: string | null, now = new Date(), reader: Reader = db): Promise<PublicReview[]> {
  if (rows.length === 0) return [];
  const ids = rows.map((r) => r.id);
  const photos = await photosOf(reader, ids);
  const replies = new Map(
    (await reader.select().from(reviewReply).where(inArray(reviewReply.reviewId, ids))).map((r) => [r.reviewId, { body: r.body, createdAt: r.createdAt.toISOString() }]),
  );
  const names = await shortNamesOf(reader, rows.map((r) => r.authorId));
  const helped = new Set<string>();
  const reported = new Set<string>();
  if (viewerUserId) {
    for (const r of await reader.select({ id: reviewHelpful.reviewId }).from(reviewHelpful).where(and(eq(reviewHelpful.userId, viewerUserId), inArray(reviewHelpful.reviewId, ids)))) helped.add(r.id);
    for (const r of await reader.select({ id: reviewReport.reviewId }).from(reviewReport).where(and(eq(reviewReport.reporterId, viewerUserId), inArray(reviewReport.reviewId, ids)))) reported.add(r.id);
  }
  return rows.map((row) => {
    const isAuthor = viewerUserId === row.authorId;
    const isProvider = viewerUserId === row.providerId;
    const reply = replies.get(row.id) ?? null;
    const hidden = row.hiddenAt !== null;
    return {
      id: row.id,
      role: row.role,
      providerUserId: row.providerId,
      stars: row.stars,
      aspects: aspectsOf(row),
      body: row.body,
      photos: photos.get(row.id) ?? [],
      authorName: names.get(row.authorId) ?? "A farmer",
      subjectLabel: row.subjectLabel,
      createdAt: row.createdAt.toISOString(),
      editedAt: row.editedAt?.toISOString() ?? null,
      helpfulCount: row.helpfulCount,
      reply,
      hidden,
      viewer: {
        isAuthor,
        canEdit: isAuthor && canStillEdit(row, now),
        canReply: isProvider && reply === null && !hidden,
        canReport: viewerUserId !== null && !isAuthor && !reported.has(row.id) && !hidden,
        markedHelpful: helped.has(row.id),
        reported: reported.has(row.id),
        canMarkHelpful: viewerUserId !== null && !isAuthor && !isProvider && !hidden,
      },
    };
  });
}
