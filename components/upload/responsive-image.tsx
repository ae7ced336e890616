import { fallbackWidth, imageSrcSet, imageUrl } from "@/lib/storage/image-urls";

export type ResponsiveImageProps = {
  id: string;
  /** The widths stored for this image (`image.widths`). */
  widths: readonly number[];
  /** Intrinsic size (`image.width`, `image.height`): reserves the box so nothing shifts while loading. */
  width: number;
  height: number;
  alt: string;
  /** How wide the image is drawn, e.g. "(min-width: 768px) 33vw, 100vw" (HTML Standard, sizes attribute). */
  sizes?: string;
  loading?: "lazy" | "eager";
  className?: string;
};

/**
 * A processed upload with a srcset over its stored WebP widths. A plain <img>, not next/image: the
 * variants are already resized and re-encoded, so another optimisation pass would only cost CPU.
 */
export function ResponsiveImage({ id, widths, width, height, alt, sizes = "100vw", loading = "lazy", className = "" }: ResponsiveImageProps) {
  const src = fallbackWidth(widths);
  if (src === undefined) return null;
  return (
    <img
      src={imageUrl(id, src)}
      srcSet={imageSrcSet(id, widths)}
      sizes={sizes}
      width={width}
      height={height}
      alt={alt}
      loading={loading}
      decoding="async"
      className={`h-auto max-w-full ${className}`}
    />
  );
}
