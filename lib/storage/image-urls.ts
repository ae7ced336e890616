/**
 * Where processed images live and how pages address them. Pure, so client components can use it
 * without pulling sharp or the S3 SDK into the browser bundle.
 */

/** Widths every served image is re-encoded at; pages pick one through srcset. */
export const IMAGE_WIDTHS = [160, 320, 640, 1280] as const;
export type ImageWidth = (typeof IMAGE_WIDTHS)[number];

export function variantKey(imageId: string, width: number): string {
  return `images/${imageId}/${width}.webp`;
}

/** The value stored in `image.key_prefix`: every variant key starts with it. */
export function imageKeyPrefix(imageId: string): string {
  return `images/${imageId}`;
}

export function imageUrl(imageId: string, width: number): string {
  return `/api/images/${encodeURIComponent(imageId)}/${width}.webp`;
}

/** A srcset with width descriptors (HTML Standard, "srcset attribute": `<url> <integer>w`, comma-separated). */
export function imageSrcSet(imageId: string, widths: readonly number[]): string {
  return [...new Set(widths)]
    .filter((w) => Number.isInteger(w) && w > 0)
    .sort((a, b) => a - b)
    .map((w) => `${imageUrl(imageId, w)} ${w}w`)
    .join(", ");
}

/** The fallback `src`: the smallest stored width at least `target` wide, else the widest one. */
export function fallbackWidth(widths: readonly number[], target = 640): number | undefined {
  const sorted = [...widths].sort((a, b) => a - b);
  return sorted.find((w) => w >= target) ?? sorted.at(-1);
}
