import "server-only";
import { randomUUID } from "node:crypto";
import { and, desc, eq, inArray } from "drizzle-orm";
import { db } from "@/db/client";
import { image, profile } from "@/db/schema";
import { job, portfolioItem, tankRequest } from "@/db/schema-jobs";
import { writeTransaction, type WriteTx } from "@/db/write-transaction";
import type { TankType } from "@/lib/catalog";
import { Conflict, Forbidden, Invalid, NotFound } from "@/lib/errors";
import { APPROXIMATE_PLACE_GRID_METERS, roundCoordinate } from "@/lib/geo/coordinates";
import { storedSizeOf, type StoredSize } from "@/lib/requests/format";
import { appStorage } from "@/lib/storage/app-storage";
import { deleteImage } from "@/lib/storage/uploads";
import { countImagesOf, imagesOfMany, type ShownImage } from "@/lib/uploads/images";
import type { PortfolioItemInput } from "@/lib/validations/portfolio";

/*
 * A builder's finished tanks. Places are rounded to about 1 km before they are stored, so neither a farmer's home
 * (for tanks built through Shoal) nor any exact site is ever kept or shown here.
 */

export type PortfolioEntry = {
  id: string;
  tankType: TankType;
  size: StoredSize;
  placeName: string;
  approxPlace: { lat: number; lng: number };
  completedOn: string;
  caption: string;
  /** the "done through Shoal" mark: the tank came from a job completed here */
  throughShoal: boolean;
  photos: ShownImage[];
};

function approximate(point: { lat: number; lng: number }): { lat: number; lng: number } {
  return roundCoordinate(point, APPROXIMATE_PLACE_GRID_METERS);
}

/** A builder's portfolio, newest first: hand-added photos, and for Shoal jobs the job's completion photos. */
export async function listPortfolio(builderId: string): Promise<PortfolioEntry[]> {
  const rows = await db.select().from(portfolioItem).where(eq(portfolioItem.builderId, builderId)).orderBy(desc(portfolioItem.completedOn), desc(portfolioItem.createdAt));
  const own = await imagesOfMany("portfolio", rows.map((r) => ({ id: r.id, ownerId: builderId })));
  const fromJobs = await imagesOfMany(
    "completion-photo",
    rows.flatMap((r) => (r.jobId ? [{ id: r.jobId, ownerId: builderId }] : [])),
  );
  return rows.map((r) => ({
    id: r.id,
    tankType: r.tankType,
    size: { shape: r.shape, lengthM: r.lengthM, widthM: r.widthM, diameterM: r.diameterM, depthM: r.depthM, sizeUnit: r.sizeUnit },
    placeName: r.placeName,
    approxPlace: { lat: r.approxLat, lng: r.approxLng },
    completedOn: r.completedOn.toISOString(),
    caption: r.caption,
    throughShoal: r.jobId !== null,
    photos: [...(r.jobId ? (fromJobs.get(r.jobId) ?? []) : []), ...(own.get(r.id) ?? [])],
  }));
}

/** A finished tank added by hand; needs at least one photo (uploaded before saving, under the item's id). */
export async function addPortfolioItem(builderId: string, input: PortfolioItemInput): Promise<{ id: string; created: boolean }> {
  return writeTransaction(db, async (tx) => {
    const [existing] = await tx.select({ builderId: portfolioItem.builderId }).from(portfolioItem).where(eq(portfolioItem.id, input.id));
    if (existing) {
      if (existing.builderId !== builderId) throw new Conflict("This form was already used. Reload the page.");
      return { id: input.id, created: false };
    }
    if ((await countImagesOf("portfolio", input.id, builderId, tx)) === 0) {
      throw new Invalid("photos: Add at least one photo of the finished tank", { photos: ["Add at least one photo of the finished tank"] });
    }
    const place = approximate(input.place);
    const size = input.size;
    await tx.insert(portfolioItem).values({
      id: input.id,
      builderId,
      tankType: input.tankType,
      ...storedSizeOf(size),
      placeName: input.placeName,
      approxLat: place.lat,
      approxLng: place.lng,
      completedOn: input.completedOn,
      caption: input.caption,
    });
    return { id: input.id, created: true };
  });
}

/** Hand-added items only: a tank built through Shoal stays, it is the record of a completed job. */
export async function deletePortfolioItem(builderId: string, itemId: string): Promise<void> {
  const photos = await writeTransaction(db, async (tx) => {
    const [row] = await tx.select({ builderId: portfolioItem.builderId, jobId: portfolioItem.jobId }).from(portfolioItem).where(eq(portfolioItem.id, itemId));
    if (!row) throw new NotFound("No portfolio item with this id");
    if (row.builderId !== builderId) throw new Forbidden("This portfolio item is not yours");
    if (row.jobId) throw new Conflict("A tank built through Shoal stays in your portfolio");
    const imgs = await tx.select({ id: image.id, widths: image.widths }).from(image).where(and(eq(image.kind, "portfolio"), eq(image.subjectId, itemId), eq(image.ownerId, builderId)));
    if (imgs.length) await tx.delete(image).where(inArray(image.id, imgs.map((i) => i.id)));
    await tx.delete(portfolioItem).where(eq(portfolioItem.id, itemId));
    return imgs;
  });
  const storage = appStorage();
  for (const p of photos) await deleteImage(storage, p.id, p.widths).catch((error: unknown) => console.error("[portfolio] photo not deleted", p.id, error));
}

/** The portfolio entry a completed job adds (inside the job's completing transaction). Idempotent per job. */
export async function addItemFromJob(tx: WriteTx, jobId: string, completedOn: Date): Promise<void> {
  const [row] = await tx
    .select({ builderId: job.builderId, farmerId: job.farmerId, request: tankRequest, region: profile.region })
    .from(job)
    .innerJoin(tankRequest, eq(tankRequest.id, job.requestId))
    .leftJoin(profile, eq(profile.userId, job.farmerId))
    .where(eq(job.id, jobId));
  if (!row) throw new Error(`job ${jobId} not found`);
  const r = row.request;
  const place = approximate({ lat: r.siteLat, lng: r.siteLng });
  await tx
    .insert(portfolioItem)
    .values({
      id: randomUUID(),
      builderId: row.builderId,
      jobId,
      tankType: r.tankType,
      shape: r.shape,
      lengthM: r.lengthM,
      widthM: r.widthM,
      diameterM: r.diameterM,
      depthM: r.depthM,
      sizeUnit: r.sizeUnit,
      placeName: row.region ?? "Place not given",
      approxLat: place.lat,
      approxLng: place.lng,
      completedOn: new Date(`${completedOn.toISOString().slice(0, 10)}T00:00:00.000Z`),
      caption: "",
    })
    .onConflictDoNothing({ target: portfolioItem.jobId });
}
