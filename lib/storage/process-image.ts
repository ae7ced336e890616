import "server-only";
import { fileTypeFromBuffer } from "file-type";
import sharp from "sharp";
import { containsActiveContent, endsWithZipDirectory, inspectStructure, isPadding, type ImageFormat } from "@/lib/storage/image-structure";
import { UploadRefused } from "@/lib/storage/upload-errors";
import type { UploadSpec } from "@/lib/storage/upload-kinds";
import { encodeVariants, type Variant } from "@/lib/storage/variants";

export type ProcessedImage = { format: ImageFormat; width: number; height: number; variants: Variant[] };

// file-type's names for the three formats we take; APNG is a PNG whose first frame any PNG decoder shows.
const FORMAT_BY_EXT: Partial<Record<string, ImageFormat>> = { jpg: "jpeg", png: "png", apng: "png", webp: "webp" };

// Trailers cameras write after the image: multi-picture and gain-map JPEGs (CIPA DC-007, Ultra HDR)
// and motion-photo video. They are dropped by re-encoding, so they are tolerated.
const CAMERA_TRAILERS = new Set(["jpg", "mp4", "mov"]);

/**
 * Checks the bytes (never the name or the browser's word) and re-encodes to metadata-free WebP.
 *
 * The rule for files that are an image and something else at once (polyglots):
 *  1. the first bytes must be JPEG, PNG or WebP (file-type);
 *  2. walking the container from the start must reach the image's own end (JPEG EOI after a scan,
 *     PNG IEND, the WebP RIFF size); otherwise the file is truncated or damaged;
 *  3. bytes after that end are refused if they are another recognisable file, other than the
 *     trailers cameras write (extra JPEGs, motion-photo video); padding and unknown vendor data
 *     are tolerated because nothing of them survives re-encoding;
 *  4. no ZIP directory may sit at the end of the file (that is where ZIP readers look), and no web
 *     markup or script may appear in the metadata, comments or trailer;
 *  5. sharp must decode every pixel with failOn "error" (which includes truncation).
 * Whatever passes is rebuilt from decoded pixels only, so no byte of the upload is ever served.
 */
export async function processImage(bytes: Uint8Array, spec: UploadSpec): Promise<ProcessedImage> {
  if (bytes.byteLength === 0) throw new UploadRefused("empty", spec);
  if (bytes.byteLength > spec.maxBytes) throw new UploadRefused("too-large", spec, `${bytes.byteLength} bytes`);

  const detected = await fileTypeFromBuffer(bytes);
  const format = detected ? FORMAT_BY_EXT[detected.ext] : undefined;
  if (!format || !(spec.allowedTypes as readonly string[]).includes(`image/${format}`)) {
    throw new UploadRefused("not-an-image", spec, detected ? detected.mime : "unrecognised bytes");
  }

  const structure = inspectStructure(bytes, format);
  if (!structure.complete) throw new UploadRefused("damaged", spec, structure.problem);
  await refusePolyglot(bytes, structure.end, structure.sideData, spec);

  const input = Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  // Header-only read: refuse decompression bombs before a single pixel is decoded.
  const meta = await sharp(input, { failOn: "error", limitInputPixels: false })
    .metadata()
    .catch((error: unknown) => {
      throw new UploadRefused("damaged", spec, errorText(error));
    });
  if (meta.width * meta.height > spec.maxPixels) throw new UploadRefused("too-many-pixels", spec, `${meta.width}×${meta.height}`);
  const upright = meta.autoOrient; // EXIF orientation applied, as the variants will be
  if (upright.width < spec.minWidth || upright.height < spec.minHeight) {
    throw new UploadRefused("too-small", spec, `${upright.width}×${upright.height}`);
  }

  const encoded = await encodeVariants(input, spec.widths, { failOn: "error", limitInputPixels: spec.maxPixels }).catch((error: unknown) => {
    throw new UploadRefused("damaged", spec, errorText(error));
  });
  return { format, ...encoded };
}

async function refusePolyglot(bytes: Uint8Array, end: number, sideData: { start: number; end: number }[], spec: UploadSpec): Promise<void> {
  if (endsWithZipDirectory(bytes)) throw new UploadRefused("polyglot", spec, "ZIP directory at end of file");
  const trailer = bytes.subarray(end);
  if (trailer.length > 0 && !isPadding(trailer)) {
    const other = await fileTypeFromBuffer(trailer);
    if (other && !CAMERA_TRAILERS.has(other.ext)) throw new UploadRefused("polyglot", spec, `${other.mime} after the image`);
    if (containsActiveContent(trailer)) throw new UploadRefused("polyglot", spec, "markup after the image");
  }
  for (const range of sideData) {
    if (containsActiveContent(bytes.subarray(range.start, range.end))) throw new UploadRefused("polyglot", spec, "markup in metadata");
  }
}

function errorText(error: unknown): string {
  return error instanceof Error ? error.message : String(error);
}
