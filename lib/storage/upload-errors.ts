import { DomainError } from "@/lib/errors";
import { formatBytes, type UploadSpec } from "@/lib/storage/upload-kinds";

/** Every way an upload can be refused for what it is (not for who sent it). */
export const UPLOAD_REFUSALS = [
  "type-not-allowed",
  "empty",
  "too-large",
  "not-an-image",
  "damaged",
  "polyglot",
  "too-many-pixels",
  "too-small",
  "too-many-files",
] as const;
export type UploadRefusal = (typeof UPLOAD_REFUSALS)[number];

/** The words the user reads; the browser's early checks use the same ones. */
export function refusalMessage(reason: UploadRefusal, spec: UploadSpec): string {
  switch (reason) {
    case "type-not-allowed":
    case "not-an-image":
      return "This file is not a JPEG, PNG or WebP image";
    case "empty":
      return "This file is empty (0 bytes). Choose the photo again.";
    case "too-large":
      return `This photo is larger than ${formatBytes(spec.maxBytes)}`;
    case "damaged":
      return "This image is incomplete or damaged. Save or export it again, or choose another photo.";
    case "polyglot":
      return "This file holds something besides the image (such as an archive, a web page or a script), so it cannot be used.";
    case "too-many-pixels":
      return `This image has too many pixels: at most ${Math.floor(spec.maxPixels / 1_000_000)} megapixels.`;
    case "too-small":
      return `This image is too small: it must be at least ${spec.minWidth} × ${spec.minHeight} pixels.`;
    case "too-many-files":
      return `A ${spec.ownerObject} can have at most ${spec.maxCount} ${spec.label}${spec.maxCount === 1 ? "" : "s"}.`;
  }
}

/** An upload refused for its content or limits: 422 with a message meant for the person uploading. */
export class UploadRefused extends DomainError {
  constructor(
    readonly reason: UploadRefusal,
    spec: UploadSpec,
    /** What was found, for logs only (never shown). */
    readonly detail?: string,
  ) {
    super(refusalMessage(reason, spec), 422, `upload_${reason.replaceAll("-", "_")}`);
  }
}
