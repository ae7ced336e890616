import sharp from "sharp";

/** Widths every served image is re-encoded at; pages pick one through srcset. */
export const IMAGE_WIDTHS = [160, 320, 640, 1280] as const;
export type ImageWidth = (typeof IMAGE_WIDTHS)[number];

export type Variant = { width: number; height: number; data: Buffer };

/**
 * Re-encodes an image to WebP at each width no larger than the original.
 * sharp drops all metadata (EXIF, GPS, XMP, ICC) unless asked to keep it, so the
 * output never carries where a photo was taken.
 */
export async function encodeVariants(input: Buffer, widths: readonly number[] = IMAGE_WIDTHS): Promise<{ width: number; height: number; variants: Variant[] }> {
  const base = sharp(input, { failOn: "error" }).rotate(); // apply the EXIF orientation before it is dropped
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

export function variantKey(imageId: string, width: number): string {
  return `images/${imageId}/${width}.webp`;
}
