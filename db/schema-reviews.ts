// Tables for reviews of builders and hatcheries (issue 7): the review, its earlier versions, photos, the provider's
// one reply, reports for the moderation queue and "helpful" marks. Kept apart from db/schema.ts.
// Relative imports only: drizzle-kit loads this file without the "@/" alias.
import { sql } from "drizzle-orm";
import { check, index, integer, primaryKey, sqliteTable, text, uniqueIndex } from "drizzle-orm/sqlite-core";
import { MODERATION_DECISIONS, REPORT_REASONS, REVIEW_ROLES, REVIEW_SUBJECT_KINDS, type AspectKey } from "../lib/reviews/types";
import { createdAt, updatedAt } from "./columns";
import { image, user } from "./schema";

const at = (name: string) => integer(name, { mode: "timestamp_ms" });
const stars = (name: string) => integer(name);
const inStarRange = (column: unknown) => sql`${column} IS NULL OR (${column} >= 1 AND ${column} <= 5)`;

export const REPORT_STATES = ["open", "kept", "hidden"] as const;

/**
 * One farmer's review of one finished job or released reservation. The subject pair is unique, so the database
 * itself refuses a second review of the same job or reservation. Aspects are columns (not JSON) so the list can
 * filter and average them in SQL; a builder's review leaves the hatchery aspects empty and the other way round.
 * Nobody deletes a review: an admin hides it after a report (hidden_at), which takes it out of lists and trust.
 */
export const review = sqliteTable(
  "review",
  {
    id: text("id").primaryKey(),
    subjectKind: text("subject_kind", { enum: REVIEW_SUBJECT_KINDS }).notNull(),
    subjectId: text("subject_id").notNull(),
    role: text("role", { enum: REVIEW_ROLES }).notNull(),
    authorId: text("author_id")
      .notNull()
      .references(() => user.id, { onDelete: "cascade" }),
    providerId: text("provider_id")
      .notNull()
      .references(() => user.id, { onDelete: "cascade" }),
    stars: stars("stars").notNull(),
    workmanship: stars("workmanship"),
    timeliness: stars("timeliness"),
    communication: stars("communication"),
    fishHealth: stars("fish_health"),
    countAsPromised: stars("count_as_promised"),
    sizeAsPromised: stars("size_as_promised"),
    body: text("body").notNull(),
    /** what was reviewed, as written when the review was ("Tarpaulin on frame · …", "Nile tilapia · 500 fingerlings") */
    subjectLabel: text("subject_label").notNull(),
    /** kept in step with review_helpful in the same transaction, so "most helpful" sorts on an indexed column */
    helpfulCount: integer("helpful_count").notNull().default(0),
    /** bumped by every edit; the edit is written only if nobody edited since it was read */
    version: integer("version").notNull().default(1),
    editedAt: at("edited_at"),
    hiddenAt: at("hidden_at"),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [
    uniqueIndex("review_subject_idx").on(t.subjectKind, t.subjectId),
    index("review_provider_idx").on(t.providerId, t.role, t.hiddenAt, t.createdAt),
    index("review_author_idx").on(t.authorId),
    check("review_stars_range", sql`${t.stars} >= 1 AND ${t.stars} <= 5`),
    check(
      "review_aspects_range",
      sql`(${inStarRange(t.workmanship)}) AND (${inStarRange(t.timeliness)}) AND (${inStarRange(t.communication)}) AND (${inStarRange(t.fishHealth)}) AND (${inStarRange(t.countAsPromised)}) AND (${inStarRange(t.sizeAsPromised)})`,
    ),
    check(
      "review_aspects_of_role",
      sql`(${t.role} = 'builder' AND ${t.fishHealth} IS NULL AND ${t.countAsPromised} IS NULL AND ${t.sizeAsPromised} IS NULL) OR (${t.role} = 'hatchery' AND ${t.workmanship} IS NULL AND ${t.timeliness} IS NULL AND ${t.communication} IS NULL)`,
    ),
    check("review_subject_matches_role", sql`(${t.subjectKind} = 'job' AND ${t.role} = 'builder') OR (${t.subjectKind} = 'reservation' AND ${t.role} = 'hatchery')`),
    check("review_not_own", sql`${t.authorId} <> ${t.providerId}`),
    check("review_body_length", sql`length(${t.body}) >= 10 AND length(${t.body}) <= 2000`),
    check("review_helpful_count", sql`${t.helpfulCount} >= 0`),
  ],
);

/** The review as it was before an edit: one row per replaced version, append-only. */
export const reviewRevision = sqliteTable(
  "review_revision",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    reviewId: text("review_id")
      .notNull()
      .references(() => review.id, { onDelete: "cascade" }),
    version: integer("version").notNull(),
    stars: stars("stars").notNull(),
    aspects: text("aspects", { mode: "json" }).$type<Partial<Record<AspectKey, number>>>().notNull(),
    body: text("body").notNull(),
    photoIds: text("photo_ids", { mode: "json" }).$type<string[]>().notNull(),
    /** when this version was written (the review's creation or an earlier edit) */
    writtenAt: at("written_at").notNull(),
    /** when the edit that replaced it was made */
    replacedAt: at("replaced_at").notNull(),
  },
  (t) => [uniqueIndex("review_revision_version_idx").on(t.reviewId, t.version), check("review_revision_stars_range", sql`${t.stars} >= 1 AND ${t.stars} <= 5`)],
);

/** Photos shown with a review, in order. The image row keeps the job or reservation id as its subject. */
export const reviewPhoto = sqliteTable(
  "review_photo",
  {
    reviewId: text("review_id")
      .notNull()
      .references(() => review.id, { onDelete: "cascade" }),
    imageId: text("image_id")
      .notNull()
      .references(() => image.id, { onDelete: "cascade" }),
    position: integer("position").notNull(),
  },
  (t) => [primaryKey({ columns: [t.reviewId, t.imageId] }), uniqueIndex("review_photo_image_idx").on(t.imageId), check("review_photo_position", sql`${t.position} >= 0 AND ${t.position} < 6`)],
);

/** The provider's one public reply (unique per review). */
export const reviewReply = sqliteTable(
  "review_reply",
  {
    id: text("id").primaryKey(),
    reviewId: text("review_id")
      .notNull()
      .references(() => review.id, { onDelete: "cascade" }),
    authorId: text("author_id")
      .notNull()
      .references(() => user.id, { onDelete: "cascade" }),
    body: text("body").notNull(),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("review_reply_review_idx").on(t.reviewId), check("review_reply_body_length", sql`length(${t.body}) >= 10 AND length(${t.body}) <= 1000`)],
);

/** A signed-in user's report of a review (one per user and review), waiting for an admin's decision. */
export const reviewReport = sqliteTable(
  "review_report",
  {
    id: text("id").primaryKey(),
    reviewId: text("review_id")
      .notNull()
      .references(() => review.id, { onDelete: "cascade" }),
    reporterId: text("reporter_id")
      .notNull()
      .references(() => user.id, { onDelete: "cascade" }),
    reason: text("reason", { enum: REPORT_REASONS }).notNull(),
    details: text("details"),
    state: text("state", { enum: REPORT_STATES }).notNull().default("open"),
    decision: text("decision", { enum: MODERATION_DECISIONS }),
    decisionNote: text("decision_note"),
    decidedBy: text("decided_by").references(() => user.id, { onDelete: "set null" }),
    decidedAt: at("decided_at"),
    createdAt: createdAt(),
  },
  (t) => [
    uniqueIndex("review_report_reporter_idx").on(t.reviewId, t.reporterId),
    index("review_report_state_idx").on(t.state, t.createdAt),
    check("review_report_reason", sql`${t.reason} IN (${sql.raw(REPORT_REASONS.map((r) => `'${r}'`).join(", "))})`),
    check("review_report_decided", sql`(${t.state} = 'open' AND ${t.decision} IS NULL) OR (${t.state} <> 'open' AND ${t.decision} IS NOT NULL AND ${t.decidedAt} IS NOT NULL)`),
  ],
);

/** "This review helped me": one mark per user and review, which the user may take back. */
export const reviewHelpful = sqliteTable(
  "review_helpful",
  {
    reviewId: text("review_id")
      .notNull()
      .references(() => review.id, { onDelete: "cascade" }),
    userId: text("user_id")
      .notNull()
      .references(() => user.id, { onDelete: "cascade" }),
    createdAt: createdAt(),
  },
  (t) => [primaryKey({ columns: [t.reviewId, t.userId] }), index("review_helpful_user_idx").on(t.userId)],
);

export type ReviewRow = typeof review.$inferSelect;
export type ReviewReportRow = typeof reviewReport.$inferSelect;
