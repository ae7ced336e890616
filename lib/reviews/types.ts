// The shapes of reviews shared by the server (lib/reviews/*, the API) and the pages. Pure: no server imports,
// so client components and the zod schemas (lib/validations/reviews.ts) can use it too.

export type ReviewRole = "builder" | "hatchery";
export const REVIEW_ROLES = ["builder", "hatchery"] as const satisfies readonly ReviewRole[];

/** The aspects a farmer rates besides the overall stars: what matters most for each kind of provider. */
export const REVIEW_ASPECTS = {
  builder: ["workmanship", "timeliness", "communication"],
  hatchery: ["fish_health", "count_as_promised", "size_as_promised"],
} as const;
export type AspectKey = (typeof REVIEW_ASPECTS)[ReviewRole][number];
export const ALL_ASPECTS = [...REVIEW_ASPECTS.builder, ...REVIEW_ASPECTS.hatchery] as const satisfies readonly AspectKey[];

export const ASPECT_LABELS: Record<AspectKey, string> = {
  workmanship: "Quality of the build",
  timeliness: "Kept to the dates",
  communication: "Kept me informed",
  fish_health: "Fish health",
  count_as_promised: "Count as promised",
  size_as_promised: "Size as promised",
};

export const REVIEW_LIMITS = { bodyMin: 10, bodyMax: 2000, replyMin: 10, replyMax: 1000, maxPhotos: 6, editDays: 14 } as const;

export type ReviewSubjectKind = "job" | "reservation";
export const REVIEW_SUBJECT_KINDS = ["job", "reservation"] as const satisfies readonly ReviewSubjectKind[];
export type ReviewSort = "newest" | "helpful";
export const REVIEW_SORTS = ["newest", "helpful"] as const satisfies readonly ReviewSort[];

export type ReviewPhoto = { imageId: string; alt: string; src: string; srcSet: string; width: number; height: number };

export type ReviewViewer = {
  isAuthor: boolean;
  canEdit: boolean;
  canReply: boolean;
  canReport: boolean;
  markedHelpful: boolean;
  reported: boolean;
  /** signed in, and neither the author nor the reviewed provider (they may not vote on it) */
  canMarkHelpful: boolean;
};

export type PublicReview = {
  id: string;
  role: ReviewRole;
  providerUserId: string;
  /** 1..5 */
  stars: number;
  aspects: Partial<Record<AspectKey, number>>;
  /** Plain text: render as text, never as HTML. */
  body: string;
  photos: ReviewPhoto[];
  /** "Given-name S.": never the full surname or the e-mail. */
  authorName: string;
  /** e.g. "Tarpaulin on frame · 3 × 2 m" or "Nile tilapia · 500 fingerlings" */
  subjectLabel: string;
  /** ISO */
  createdAt: string;
  editedAt: string | null;
  helpfulCount: number;
  reply: { body: string; createdAt: string } | null;
  /** hidden by an admin after a report: only its author (and the moderation queue) still sees it */
  hidden: boolean;
  viewer: ReviewViewer;
};

export type StarCountsRecord = { 1: number; 2: number; 3: number; 4: number; 5: number };

export type ReviewPage = {
  items: PublicReview[];
  /** visible reviews matching the filters */
  total: number;
  nextCursor: string | null;
  /** over all visible reviews of this provider role, whatever the filters */
  starCounts: StarCountsRecord;
  aspectMeans: Partial<Record<AspectKey, { mean: number; count: number }>>;
};

export type ReviewRefusalReason = "not_found" | "not_yours" | "not_finished" | "disputed" | "already_reviewed" | "own_business";

export type ReviewEligibility =
  | {
      eligible: true;
      subjectKind: ReviewSubjectKind;
      subjectId: string;
      role: ReviewRole;
      providerUserId: string;
      providerName: string;
      subjectLabel: string;
    }
  | { eligible: false; reason: ReviewRefusalReason; message: string; existingReviewId?: string };

export const REPORT_REASONS = ["abusive", "false", "private_info", "spam", "other"] as const;
export type ReportReason = (typeof REPORT_REASONS)[number];
export const REPORT_REASON_LABELS: Record<ReportReason, string> = {
  abusive: "Insulting or threatening",
  false: "Describes something that did not happen",
  private_info: "Shares private details (phone, address, names)",
  spam: "Advertising or unrelated to the work",
  other: "Something else",
};

export type ModerationReport = {
  id: string;
  reviewId: string;
  review: PublicReview;
  providerName: string;
  reason: ReportReason;
  details: string | null;
  reporterName: string;
  createdAt: string;
};

export const MODERATION_DECISIONS = ["keep", "hide"] as const;
export type ModerationDecision = (typeof MODERATION_DECISIONS)[number];

/** What a card, list row or map popup shows; the full reasons are on the provider page (TrustSummary). */
export type TrustBadge = {
  isNew: boolean;
  /** damped mean of the stars (1..5), null while new */
  displayRating: number | null;
  reviews: number;
  jobsCompleted: number;
  verified: boolean;
};

/** Key of getTrustBadges' map. */
export function trustKey(providerUserId: string, role: ReviewRole): string {
  return `${providerUserId}:${role}`;
}
