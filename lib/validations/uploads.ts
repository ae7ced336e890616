import { z } from "zod";
import { completeRequestSchema, presignRequestSchema } from "@/lib/storage/upload-contract";

// The upload endpoints' bodies: the storage contract plus the object the image is for (a tank request, portfolio
// item or job id; for a profile photo, the account's own id).
const subjectId = z.string().regex(/^[A-Za-z0-9_-]{1,128}$/, "Name the object the photo is for");

export const presignBodySchema = presignRequestSchema.extend({ subjectId });
export const completeBodySchema = completeRequestSchema.extend({ subjectId });
