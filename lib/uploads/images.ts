import "server-only";
import { and, asc, count, eq, inArray } from "drizzle-orm";
import { db } from "@/db/client";
import { image } from "@/db/schema";
import type { UploadKind } from "@/lib/storage/upload-kinds";

/** What a page needs to draw a processed image with ResponsiveImage. */
export type ShownImage = { id: string; widths: number[]; width: number; height: number; alt: string };

const shown = { id: image.id, widths: image.widths, width: image.width, height: image.height, alt: image.alt };

type Db = Pick<typeof db, "select">;

/**
 * Images of one kind that belong to one object, oldest first. `ownerId` narrows to one uploader: draft objects
 * (a request or portfolio item not saved yet) are named by an id anyone could type, so only the owner's count.
 */
export async function imagesOf(kind: UploadKind, subjectId: string, ownerId?: string, tx: Db = db): Promise<ShownImage[]> {
  const where = and(eq(image.kind, kind), eq(image.subjectId, subjectId), ownerId ? eq(image.ownerId, ownerId) : undefined);
  return tx.select(shown).from(image).where(where).orderBy(asc(image.createdAt), asc(image.id));
}

export async function countImagesOf(kind: UploadKind, subjectId: string, ownerId?: string, tx: Db = db): Promise<number> {
  const where = and(eq(image.kind, kind), eq(image.subjectId, subjectId), ownerId ? eq(image.ownerId, ownerId) : undefined);
  const [row] = await tx.select({ n: count() }).from(image).where(where);
  return row?.n ?? 0;
}

/** Images of one kind for many objects at once, grouped by object id; only each object's owner's uploads count. */
export async function imagesOfMany(kind: UploadKind, subjects: readonly { id: string; ownerId: string }[]): Promise<Map<string, ShownImage[]>> {
  const out = new Map<string, ShownImage[]>();
  if (subjects.length === 0) return out;
  const owners = new Map(subjects.map((s) => [s.id, s.ownerId]));
  const rows = await db
    .select({ ...shown, subjectId: image.subjectId, ownerId: image.ownerId })
    .from(image)
    .where(and(eq(image.kind, kind), inArray(image.subjectId, [...owners.keys()])))
    .orderBy(asc(image.createdAt), asc(image.id));
  for (const row of rows) {
    if (!row.subjectId || owners.get(row.subjectId) !== row.ownerId) continue;
    const list = out.get(row.subjectId) ?? [];
    list.push({ id: row.id, widths: row.widths, width: row.width, height: row.height, alt: row.alt });
    out.set(row.subjectId, list);
  }
  return out;
}
