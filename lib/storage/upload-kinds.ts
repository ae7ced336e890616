import type { Role } from "@/lib/catalog";
import { IMAGE_WIDTHS } from "@/lib/storage/image-urls";

/**
 * The one place that says what each kind of upload accepts and who may use it.
 * Pure data, so the browser (accept attribute, early size check) and the server read the same rules.
 */

/** IANA media type names: image/jpeg (RFC 2046), image/png (W3C PNG spec), image/webp (RFC 9649). */
export const ALLOWED_IMAGE_TYPES = ["image/jpeg", "image/png", "image/webp"] as const;
export type AllowedImageType = (typeof ALLOWED_IMAGE_TYPES)[number];

export const UPLOAD_KIND_NAMES = ["avatar", "site-photo", "portfolio", "completion-photo", "review-photo"] as const;
export type UploadKind = (typeof UPLOAD_KIND_NAMES)[number];

export type UploadSpec = {
  kind: UploadKind;
  /** What the user sees in lists and messages. */
  label: string;
  allowedTypes: readonly AllowedImageType[];
  maxBytes: number;
  /** How many images of this kind one owner object (profile, tank request, portfolio item, job, review) may hold. */
  maxCount: number;
  /** The owner object, for messages like "A job can have at most 10 completion photos". */
  ownerObject: string;
  /** Header-declared width × height above which decoding is refused (decompression bombs). */
  maxPixels: number;
  /** Smaller images are refused: the smallest served width must exist for every image. */
  minWidth: number;
  minHeight: number;
  /** Widths re-encoded for this kind (a subset of IMAGE_WIDTHS, which the serving route accepts). */
  widths: readonly number[];
  roles: readonly Role[];
};

const MB = 1024 * 1024;
const SMALLEST_WIDTH = IMAGE_WIDTHS[0];
const PHOTO_TYPES = ALLOWED_IMAGE_TYPES;
// A 48-megapixel phone photo is 8000 × 6000; anything past 50 MP is not a phone snapshot.
const PHOTO_MAX_PIXELS = 50_000_000;

export const UPLOAD_KINDS: { readonly [K in UploadKind]: UploadSpec } = {
  avatar: {
    kind: "avatar",
    label: "profile photo",
    allowedTypes: PHOTO_TYPES,
    maxBytes: 5 * MB,
    maxCount: 1,
    ownerObject: "profile",
    maxPixels: 25_000_000,
    minWidth: SMALLEST_WIDTH,
    minHeight: SMALLEST_WIDTH,
    widths: [160, 320, 640],
    roles: ["farmer", "hatchery", "builder", "admin"],
  },
  "site-photo": {
    kind: "site-photo",
    label: "site photo",
    allowedTypes: PHOTO_TYPES,
    maxBytes: 8 * MB,
    maxCount: 6,
    ownerObject: "tank request",
    maxPixels: PHOTO_MAX_PIXELS,
    minWidth: SMALLEST_WIDTH,
    minHeight: SMALLEST_WIDTH,
    widths: IMAGE_WIDTHS,
    roles: ["farmer"],
  },
  portfolio: {
    kind: "portfolio",
    label: "portfolio photo",
    allowedTypes: PHOTO_TYPES,
    maxBytes: 8 * MB,
    maxCount: 12,
    ownerObject: "portfolio item",
    maxPixels: PHOTO_MAX_PIXELS,
    minWidth: SMALLEST_WIDTH,
    minHeight: SMALLEST_WIDTH,
    widths: IMAGE_WIDTHS,
    roles: ["builder"],
  },
  "completion-photo": {
    kind: "completion-photo",
    label: "completion photo",
    allowedTypes: PHOTO_TYPES,
    maxBytes: 8 * MB,
    maxCount: 10,
    ownerObject: "job",
    maxPixels: PHOTO_MAX_PIXELS,
    minWidth: SMALLEST_WIDTH,
    minHeight: SMALLEST_WIDTH,
    widths: IMAGE_WIDTHS,
    roles: ["builder"],
  },
  "review-photo": {
    kind: "review-photo",
    label: "review photo",
    allowedTypes: PHOTO_TYPES,
    maxBytes: 8 * MB,
    // Issue 7: "up to 6 photos" per review (lib/reviews/types.ts REVIEW_LIMITS.maxPhotos).
    maxCount: 6,
    ownerObject: "review",
    maxPixels: PHOTO_MAX_PIXELS,
    minWidth: SMALLEST_WIDTH,
    minHeight: SMALLEST_WIDTH,
    widths: IMAGE_WIDTHS,
    roles: ["farmer"],
  },
};

export function isUploadKind(value: string): value is UploadKind {
  return (UPLOAD_KIND_NAMES as readonly string[]).includes(value);
}

export function isAllowedImageType(spec: UploadSpec, contentType: string): contentType is AllowedImageType {
  return (spec.allowedTypes as readonly string[]).includes(contentType);
}

/** Any one of the account's roles is enough (an account may hold several). */
export function canUseUploadKind(roles: readonly Role[], kind: UploadKind): boolean {
  const allowed = UPLOAD_KINDS[kind].roles;
  return roles.some((role) => allowed.includes(role));
}

/** "8 MB", "1.5 MB", "900 KB": binary units, shown the way phones show file sizes. */
export function formatBytes(bytes: number): string {
  if (bytes >= MB) return `${trim(bytes / MB)} MB`;
  return `${trim(bytes / 1024)} KB`;
}

function trim(n: number): string {
  return Number.isInteger(n) ? String(n) : n.toFixed(1).replace(/\.0$/, "");
}

/** The browser's `accept` attribute for a kind's file input. */
export function acceptAttribute(spec: UploadSpec): string {
  const extensions: Record<AllowedImageType, string> = { "image/jpeg": ".jpg,.jpeg", "image/png": ".png", "image/webp": ".webp" };
  return spec.allowedTypes.flatMap((type) => [type, extensions[type]]).join(",");
}
