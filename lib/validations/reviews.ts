import { z } from "zod";
import {
  ALL_ASPECTS,
  MODERATION_DECISIONS,
  REPORT_REASONS,
  REVIEW_ASPECTS,
  REVIEW_LIMITS,
  REVIEW_ROLES,
  REVIEW_SORTS,
  REVIEW_SUBJECT_KINDS,
  type AspectKey,
  type ReviewRole,
} from "@/lib/reviews/types";

/*
 * Bodies and queries of the reviews API, shared with the review, reply, report and moderation forms. Which aspects
 * belong to the subject (a builder's or a hatchery's) is known only once the job or reservation is read, so the
 * server checks that again; a form that knows the role uses reviewFormSchema(role), which requires each of them.
 */

const L = REVIEW_LIMITS;
const id = z.string().regex(/^[A-Za-z0-9_-]{1,128}$/, "Not a valid id");

export const starsSchema = z
  .number({ error: "Choose 1 to 5 stars" })
  .int("Choose 1 to 5 stars")
  .min(1, "Choose 1 to 5 stars")
  .max(5, "Choose 1 to 5 stars");

export const aspectsSchema = z.partialRecord(z.enum(ALL_ASPECTS, { error: "Not an aspect Shoal rates" }), starsSchema);

const body = z
  .string({ error: "Write a few words about how it went" })
  .trim()
  .min(L.bodyMin, `Write at least ${L.bodyMin} characters`)
  .max(L.bodyMax, `Keep it under ${L.bodyMax} characters`);

const photoIds = z.array(id, { error: "List the photos by id" }).max(L.maxPhotos, `At most ${L.maxPhotos} photos`);

export const createReviewSchema = z.object({
  subjectKind: z.enum(REVIEW_SUBJECT_KINDS, { error: "subjectKind is job or reservation" }),
  subjectId: id,
  stars: starsSchema,
  aspects: aspectsSchema.default({}),
  body,
  photoIds: photoIds.default([]),
});
export type CreateReviewInput = z.output<typeof createReviewSchema>;

export const editReviewSchema = z
  .object({ stars: starsSchema.optional(), aspects: aspectsSchema.optional(), body: body.optional(), photoIds: photoIds.optional() })
  .refine((v) => v.stars !== undefined || v.aspects !== undefined || v.body !== undefined || v.photoIds !== undefined, {
    message: "Change at least one thing",
    path: ["_"],
  });
export type EditReviewInput = z.output<typeof editReviewSchema>;

/** The review form for a known role: overall stars, every aspect of that role, the text and the photos. */
export function reviewFormSchema(role: ReviewRole) {
  const aspects = Object.fromEntries(REVIEW_ASPECTS[role].map((a) => [a, starsSchema])) as Record<AspectKey, typeof starsSchema>;
  return z.object({ stars: starsSchema, aspects: z.object(aspects), body, photoIds: photoIds.default([]) });
}

export const replySchema = z.object({
  body: z
    .string({ error: "Write your reply" })
    .trim()
    .min(L.replyMin, `Write at least ${L.replyMin} characters`)
    .max(L.replyMax, `Keep it under ${L.replyMax} characters`),
});
export type ReplyInput = z.output<typeof replySchema>;

export const reportSchema = z.object({
  reason: z.enum(REPORT_REASONS, { error: "Choose why you report this review" }),
  details: z
    .string()
    .trim()
    .max(1000, "Keep it under 1000 characters")
    .optional()
    .transform((v) => (v ? v : null)),
});
export type ReportInput = z.output<typeof reportSchema>;

export const moderationDecisionSchema = z.object({
  decision: z.enum(MODERATION_DECISIONS, { error: "Decide keep or hide" }),
  note: z.string({ error: "Say why in a few words" }).trim().min(3, "Say why in a few words").max(1000, "Keep it under 1000 characters"),
});
export type ModerationDecisionInput = z.output<typeof moderationDecisionSchema>;

export const providerReviewsQuerySchema = z.object({
  role: z.enum(REVIEW_ROLES, { error: "role is builder or hatchery" }),
  sort: z.enum(REVIEW_SORTS, { error: "sort is newest or helpful" }).default("newest"),
  stars: z.coerce
    .number({ error: "stars is 1 to 5" })
    .pipe(z.union([z.literal(1), z.literal(2), z.literal(3), z.literal(4), z.literal(5)], { error: "stars is 1 to 5" }))
    .optional(),
  aspect: z.enum(ALL_ASPECTS, { error: "Not an aspect Shoal rates" }).optional(),
  minAspectStars: z.coerce.number({ error: "minAspectStars is 1 to 5" }).int("minAspectStars is 1 to 5").min(1, "minAspectStars is 1 to 5").max(5, "minAspectStars is 1 to 5").optional(),
  cursor: z.string().max(200, "cursor is too long").optional(),
  limit: z.coerce.number({ error: "limit must be a number" }).int("limit is a whole number").min(1, "limit is at least 1").max(50, "limit is at most 50").default(10),
});
export type ProviderReviewsQuery = z.output<typeof providerReviewsQuerySchema>;

/** URLSearchParams → the object providerReviewsQuerySchema reads; empty values are left out (a cleared filter). */
export function reviewQueryFromParams(params: URLSearchParams): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [key, value] of params) if (value !== "") out[key] = value;
  return out;
}
