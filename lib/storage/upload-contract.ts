import { z } from "zod";
import { UPLOAD_KIND_NAMES, type UploadKind } from "@/lib/storage/upload-kinds";

/**
 * What the browser and the two upload endpoints (presign, complete) exchange. The routes parse with
 * these schemas (extending them with their owner object's id) and the uploader sends these shapes.
 * Type and size are checked by presignUpload itself so that refusals carry the upload wording.
 */
export const presignRequestSchema = z.object({
  kind: z.enum(UPLOAD_KIND_NAMES),
  contentType: z.string().max(200),
  contentLength: z.number().int().nonnegative(),
});
export type PresignRequest = z.infer<typeof presignRequestSchema>;

export const completeRequestSchema = z.object({
  kind: z.enum(UPLOAD_KIND_NAMES),
  uploadId: z.uuid(),
});
export type CompleteRequest = z.infer<typeof completeRequestSchema>;

/** The presign endpoint's reply: PUT the file's bytes to `url` with exactly these headers. */
export type PresignedUpload = {
  uploadId: string;
  key: string;
  url: string;
  method: "PUT";
  headers: Record<string, string>;
  expiresAt: string;
};

/** The complete endpoint's reply, and what the caller inserts into the `image` table. */
export type ProcessedUpload = {
  imageId: string;
  kind: UploadKind;
  ownerId: string;
  keyPrefix: string;
  /** Size of the widest stored variant (what is served); its ratio is the image's. */
  width: number;
  height: number;
  widths: number[];
};
