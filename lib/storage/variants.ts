import sharp, { type FailOnOptions } from "sharp";
import { IMAGE_WIDTHS } from "@/lib/storage/image-urls";

// Kept here too so existing imports keep working; the pure definitions live in image-urls.ts for client code.
export { IMAGE_WIDTHS, variantKey, type ImageWidth } from "@/lib/storage/image-urls";

export type Variant = { width: number; height: number; data: Buffer };

export type EncodeOptions = {
  /** Refuse to decode more pixels than this (sharp's default is 0x3FFF × 0x3FFF). */
  limitInputPixels?: number;
  failOn?: FailOnOptions;
};

/**
 * Re-encodes an image to WebP at each width no larger than the original.
 * sharp drops all metadata (EXIF, GPS, XMP, ICC) unless asked to keep it, so the
 * output never carries where a photo was taken.
 */
export async function encodeVariants(
  input: Buffer,
  widths: readonly number[] = IMAGE_WIDTHS,
  options: EncodeOptions = {},
): Promise<{ width: number; height: number; variants: Variant[] }> {
  const base = sharp(input, { failOn: options.failOn ?? "error", ...(options.limitInputPixels ? { limitInputPixels: options.limitInputPixels } : {}) }).rotate(); // apply the EXIF orientation before it is dropped
  const meta = await base.metadata();
  const sourceWidth = meta.autoOrient?.width ?? meta.width ?? 0;
  const sourceHeight = meta.autoOrient?.height ?? meta.height ?? 0;
  if (!sourceWidth || !sourceHeight) throw new Error("image has no dimensions");
  const chosen = widths.filter((w) => w <= sourceWidth);
  if (chosen.length === 0) chosen.push(Math.min(sourceWidth, widths[0] ?? sourceWidth));
  const variants: Variant[] = [];
  for (const width of chosen) {
    const { data, info } = await base.clone().resize({ width, withoutEnlargement: true }).webp({ quality: 72 }).toBuffer({ resolveWithObject: true });
    variants.push({ width: info.width, height: info.height, data });
  }
  return { width: sourceWidth, height: sourceHeight, variants };
}
