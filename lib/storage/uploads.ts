import "server-only";
import { randomUUID } from "node:crypto";
import { DeleteObjectCommand, GetObjectCommand, ListObjectsV2Command, PutObjectCommand, type S3Client } from "@aws-sdk/client-s3";
import { getSignedUrl } from "@aws-sdk/s3-request-presigner";
import type { Role } from "@/lib/catalog";
import { Forbidden, Invalid, NotFound } from "@/lib/errors";
import { imageKeyPrefix, variantKey } from "@/lib/storage/image-urls";
import { processImage } from "@/lib/storage/process-image";
import type { PresignedUpload, ProcessedUpload } from "@/lib/storage/upload-contract";
import { UploadRefused } from "@/lib/storage/upload-errors";
import { canUseUploadKind, isAllowedImageType, UPLOAD_KINDS, type UploadKind, type UploadSpec } from "@/lib/storage/upload-kinds";

export type Storage = {
  s3: S3Client;
  bucket: string;
  /** Client whose endpoint the browser can reach, for signing URLs (defaults to `s3`). */
  presignS3?: S3Client;
};

export const UPLOAD_TMP_PREFIX = "uploads/tmp/";
export const PRESIGN_SECONDS = 600;
const UPLOAD_KEY = /^uploads\/tmp\/[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/;
// Stored as S3 user metadata so the complete step can tell whose upload it is without a database row.
const OWNER_HEADER = "x-amz-meta-owner";
const KIND_HEADER = "x-amz-meta-kind";
const SAFE_OWNER_ID = /^[A-Za-z0-9_-]{1,128}$/;
const VARIANT_CACHE_CONTROL = "public, max-age=31536000, immutable";

export function uploadKey(uploadId: string): string {
  return `${UPLOAD_TMP_PREFIX}${uploadId}`;
}

export type PresignInput = {
  kind: UploadKind;
  ownerId: string;
  roles: readonly Role[];
  contentType: string;
  contentLength: number;
  /** Images of this kind the owner object already holds (counted by the caller). */
  existingCount: number;
};

/**
 * A presigned PUT for one file. Content-Type, Content-Length and the owner/kind metadata are signed,
 * so S3 or MinIO refuse a request that sends other values (the browser sets Content-Length from the
 * body, so a different file cannot be sent). s3rver does not check V4 signatures, which is why
 * processUpload checks size and owner again.
 */
export async function presignUpload(storage: Storage, input: PresignInput, now: Date = new Date()): Promise<PresignedUpload> {
  const spec = UPLOAD_KINDS[input.kind];
  if (!canUseUploadKind(input.roles, input.kind)) throw new Forbidden(`Your account cannot upload ${spec.label}s.`);
  if (!SAFE_OWNER_ID.test(input.ownerId)) throw new Error(`owner id is not header-safe: ${JSON.stringify(input.ownerId)}`);
  if (input.existingCount >= spec.maxCount) throw new UploadRefused("too-many-files", spec);
  if (!isAllowedImageType(spec, input.contentType)) throw new UploadRefused("type-not-allowed", spec, input.contentType);
  if (!Number.isInteger(input.contentLength) || input.contentLength < 0) throw new Invalid("contentLength must be a whole number of bytes");
  if (input.contentLength === 0) throw new UploadRefused("empty", spec);
  if (input.contentLength > spec.maxBytes) throw new UploadRefused("too-large", spec, `${input.contentLength} bytes`);

  const uploadId = randomUUID();
  const key = uploadKey(uploadId);
  const command = new PutObjectCommand({
    Bucket: storage.bucket,
    Key: key,
    ContentType: input.contentType,
    ContentLength: input.contentLength,
    Metadata: { owner: input.ownerId, kind: input.kind },
  });
  const url = await getSignedUrl(storage.presignS3 ?? storage.s3, command, {
    expiresIn: PRESIGN_SECONDS,
    signingDate: now,
    // The presigner leaves content-type unsigned and moves x-amz-* into the query unless told otherwise.
    signableHeaders: new Set(["content-type", "content-length"]),
    unhoistableHeaders: new Set([OWNER_HEADER, KIND_HEADER]),
  });
  return {
    uploadId,
    key,
    url,
    method: "PUT",
    headers: { "Content-Type": input.contentType, [OWNER_HEADER]: input.ownerId, [KIND_HEADER]: input.kind },
    expiresAt: new Date(now.getTime() + PRESIGN_SECONDS * 1000).toISOString(),
  };
}

export type ProcessInput = {
  kind: UploadKind;
  key: string;
  ownerId: string;
  /** Checked again here: several presigns may have been handed out at once. */
  existingCount: number;
};

/**
 * Turns an uploaded original into served variants under images/<imageId>/<width>.webp and deletes the
 * original whatever happens (unless it belongs to someone else: then it is left for the sweep, so
 * that knowing an upload id is not enough to destroy another person's upload).
 */
export async function processUpload(storage: Storage, input: ProcessInput): Promise<ProcessedUpload> {
  if (!UPLOAD_KEY.test(input.key)) throw new Invalid("This is not an upload key");
  const spec = UPLOAD_KINDS[input.kind];
  const object = await storage.s3.send(new GetObjectCommand({ Bucket: storage.bucket, Key: input.key })).catch((error: unknown) => {
    if (error instanceof Error && (error.name === "NoSuchKey" || error.name === "NotFound")) {
      throw new NotFound("This upload was not found. It may have expired: upload the file again.");
    }
    throw error;
  });
  const body = object.Body;
  if (!body) throw new NotFound("This upload was not found. It may have expired: upload the file again.");
  const stream = body.transformToWebStream();
  if (object.Metadata?.owner !== input.ownerId || object.Metadata.kind !== input.kind) {
    await stream.cancel();
    throw new Forbidden("This upload belongs to another account or another kind of photo.");
  }

  try {
    if (input.existingCount >= spec.maxCount) throw new UploadRefused("too-many-files", spec);
    if ((object.ContentLength ?? 0) > spec.maxBytes) throw new UploadRefused("too-large", spec, `${object.ContentLength} bytes stored`);
    const bytes = await readCapped(stream, spec);
    const processed = await processImage(bytes, spec);
    const imageId = randomUUID();
    await writeVariants(storage, imageId, processed.variants);
    const widest = processed.variants.reduce((a, b) => (b.width > a.width ? b : a));
    return {
      imageId,
      kind: input.kind,
      ownerId: input.ownerId,
      keyPrefix: imageKeyPrefix(imageId),
      width: widest.width,
      height: widest.height,
      widths: processed.variants.map((v) => v.width),
    };
  } finally {
    await stream.cancel().catch(() => undefined); // already consumed on the happy path
    await storage.s3.send(new DeleteObjectCommand({ Bucket: storage.bucket, Key: input.key }));
  }
}

async function readCapped(stream: ReadableStream<Uint8Array>, spec: UploadSpec): Promise<Uint8Array> {
  const chunks: Uint8Array[] = [];
  let total = 0;
  const reader = stream.getReader();
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > spec.maxBytes) {
      await reader.cancel();
      throw new UploadRefused("too-large", spec, `more than ${spec.maxBytes} bytes read`);
    }
    chunks.push(value);
  }
  reader.releaseLock();
  return Buffer.concat(chunks, total);
}

async function writeVariants(storage: Storage, imageId: string, variants: { width: number; data: Buffer }[]): Promise<void> {
  const results = await Promise.allSettled(
    variants.map((v) =>
      storage.s3.send(
        new PutObjectCommand({ Bucket: storage.bucket, Key: variantKey(imageId, v.width), Body: v.data, ContentType: "image/webp", CacheControl: VARIANT_CACHE_CONTROL }),
      ),
    ),
  );
  const failed = results.find((r) => r.status === "rejected");
  if (failed) {
    // Leave no half-stored image behind; the caller inserts nothing and the user retries.
    await deleteImage(storage, imageId, variants.map((v) => v.width)).catch((error: unknown) => console.error("[uploads] cleanup failed", imageId, error));
    throw failed.reason;
  }
}

/** Deletes every stored variant of an image (when its row is deleted). */
export async function deleteImage(storage: Storage, imageId: string, widths: readonly number[]): Promise<void> {
  await Promise.all(widths.map((w) => storage.s3.send(new DeleteObjectCommand({ Bucket: storage.bucket, Key: variantKey(imageId, w) }))));
}

/**
 * Deletes originals that were uploaded but never completed (closed tab, refused owner). s3rver has no
 * lifecycle rules, so run this from a periodic job; on S3 or MinIO a lifecycle rule on the prefix also works.
 */
export async function sweepStaleUploads(storage: Storage, options: { olderThanMs?: number; now?: Date } = {}): Promise<number> {
  const cutoff = (options.now ?? new Date()).getTime() - (options.olderThanMs ?? 2 * PRESIGN_SECONDS * 1000);
  let deleted = 0;
  let token: string | undefined;
  do {
    const page = await storage.s3.send(new ListObjectsV2Command({ Bucket: storage.bucket, Prefix: UPLOAD_TMP_PREFIX, ContinuationToken: token }));
    for (const item of page.Contents ?? []) {
      if (item.Key && item.LastModified && item.LastModified.getTime() < cutoff) {
        await storage.s3.send(new DeleteObjectCommand({ Bucket: storage.bucket, Key: item.Key }));
        deleted++;
      }
    }
    token = page.IsTruncated ? page.NextContinuationToken : undefined;
  } while (token);
  return deleted;
}
