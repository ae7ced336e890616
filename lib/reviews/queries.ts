import "server-only";
import { and, asc, avg, count, desc, eq, gte, inArray, isNotNull, isNull, lt, or, sql, type SQL } from "drizzle-orm";
import { db } from "@/db/client";
import { profile, user } from "@/db/schema";
import { review, reviewReport } from "@/db/schema-reviews";
import { Invalid } from "@/lib/errors";
import { ASPECT_COLUMNS, canStillEdit, editableUntil, presentReviews } from "./present";
import {
  REVIEW_ASPECTS,
  type AspectKey,
  type ModerationReport,
  type PublicReview,
  type ReviewPage,
  type ReviewRole,
  type ReviewSort,
  type ReviewSubjectKind,
  type StarCountsRecord,
} from "./types";

export type ProviderReviewQuery = {
  sort: ReviewSort;
  stars?: 1 | 2 | 3 | 4 | 5;
  aspect?: AspectKey;
  /** with `aspect`: only reviews that gave that aspect at least this many stars (default: any rating of it) */
  minAspectStars?: number;
  cursor?: string | null;
  limit?: number;
};

const DEFAULT_LIMIT = 10;
const MAX_LIMIT = 50;

type Cursor = { sort: ReviewSort; helpful: number; createdAt: number; id: string };

function encodeCursor(sort: ReviewSort, last: { helpfulCount: number; createdAt: Date; id: string }): string {
  const key = sort === "helpful" ? [last.helpfulCount, last.createdAt.getTime(), last.id] : [last.createdAt.getTime(), last.id];
  return Buffer.from(JSON.stringify({ s: sort, k: key })).toString("base64url");
}

function decodeCursor(sort: ReviewSort, cursor: string | null | undefined): Cursor | null {
  if (!cursor) return null;
  const refuse = () => new Invalid("cursor: not a cursor from this list (start again without it)", { cursor: ["Not a cursor from this list"] });
  let parsed: unknown;
  try {
    parsed = JSON.parse(Buffer.from(cursor, "base64url").toString("utf8"));
  } catch {
    throw refuse();
  }
  if (typeof parsed !== "object" || parsed === null) throw refuse();
  const { s, k } = parsed as { s?: unknown; k?: unknown };
  if (s !== sort || !Array.isArray(k)) throw refuse();
  const isCount = (v: unknown): v is number => typeof v === "number" && Number.isSafeInteger(v) && v >= 0;
  const isId = (v: unknown): v is string => typeof v === "string" && /^[A-Za-z0-9_-]{1,128}$/.test(v);
  if (sort === "helpful" && k.length === 3 && isCount(k[0]) && isCount(k[1]) && isId(k[2])) return { sort, helpful: k[0], createdAt: k[1], id: k[2] };
  if (sort === "newest" && k.length === 2 && isCount(k[0]) && isId(k[1])) return { sort, helpful: 0, createdAt: k[0], id: k[1] };
  throw refuse();
}

/** Rows after the cursor in the list's order (newest: created_at, id descending; helpful: the count first). */
function afterCursor(c: Cursor): SQL | undefined {
  const at = new Date(c.createdAt);
  const olderOrSameTimeLowerId = or(lt(review.createdAt, at), and(eq(review.createdAt, at), lt(review.id, c.id)));
  if (c.sort === "newest") return olderOrSameTimeLowerId;
  return or(lt(review.helpfulCount, c.helpful), and(eq(review.helpfulCount, c.helpful), olderOrSameTimeLowerId));
}

/** One provider role's visible reviews, filtered and sorted, one page at a time, with the star and aspect tallies. */
export async function listProviderReviews(providerUserId: string, role: ReviewRole, q: ProviderReviewQuery, viewerUserId: string | null, now = new Date()): Promise<ReviewPage> {
  const limit = Math.min(MAX_LIMIT, Math.max(1, q.limit ?? DEFAULT_LIMIT));
  const aspects: readonly AspectKey[] = REVIEW_ASPECTS[role];
  if (q.aspect && !aspects.includes(q.aspect)) {
    const message = `A ${role} is not rated on that; choose one of ${aspects.join(", ")}`;
    throw new Invalid(`aspect: ${message}`, { aspect: [message] });
  }
  const visible = and(eq(review.providerId, providerUserId), eq(review.role, role), isNull(review.hiddenAt));
  const filters: SQL[] = [];
  if (q.stars) filters.push(eq(review.stars, q.stars));
  if (q.aspect) {
    const column = ASPECT_COLUMNS[q.aspect];
    filters.push(q.minAspectStars ? gte(column, q.minAspectStars) : isNotNull(column));
  }
  const filtered = and(visible, ...filters);
  const cursor = decodeCursor(q.sort, q.cursor);

  const rows = await db
    .select()
    .from(review)
    .where(cursor ? and(filtered, afterCursor(cursor)) : filtered)
    .orderBy(...(q.sort === "helpful" ? [desc(review.helpfulCount)] : []), desc(review.createdAt), desc(review.id))
    .limit(limit + 1);
  const page = rows.slice(0, limit);
  const last = page.at(-1);

  const [totalRow] = await db.select({ n: count() }).from(review).where(filtered);
  const starCounts: StarCountsRecord = { 1: 0, 2: 0, 3: 0, 4: 0, 5: 0 };
  for (const r of await db.select({ stars: review.stars, n: count() }).from(review).where(visible).groupBy(review.stars)) {
    if (r.stars >= 1 && r.stars <= 5) starCounts[r.stars as 1 | 2 | 3 | 4 | 5] = r.n;
  }
  const means = Object.fromEntries(aspects.flatMap((a) => [[`${a}:mean`, avg(ASPECT_COLUMNS[a])], [`${a}:count`, count(ASPECT_COLUMNS[a])]]));
  const [meanRow] = await db.select(means).from(review).where(visible);
  const aspectMeans: ReviewPage["aspectMeans"] = {};
  for (const a of aspects) {
    const n = Number(meanRow?.[`${a}:count`] ?? 0);
    const mean = meanRow?.[`${a}:mean`];
    if (n > 0 && mean !== null && mean !== undefined) aspectMeans[a] = { mean: Number(mean), count: n };
  }

  return {
    items: await presentReviews(page, viewerUserId, now),
    total: totalRow?.n ?? 0,
    nextCursor: rows.length > limit && last ? encodeCursor(q.sort, last) : null,
    starCounts,
    aspectMeans,
  };
}

/** The review of one job or reservation as its author sees it (hidden ones included), or as anyone else would. */
export async function getReviewForSubject(subjectKind: ReviewSubjectKind, subjectId: string, viewerUserId: string | null, now = new Date()): Promise<PublicReview | null> {
  const [row] = await db
    .select()
    .from(review)
    .where(and(eq(review.subjectKind, subjectKind), eq(review.subjectId, subjectId)))
    .limit(1);
  if (!row || (row.hiddenAt !== null && row.authorId !== viewerUserId)) return null;
  return (await presentReviews([row], viewerUserId, now))[0] ?? null;
}

/** A review for its author's edit form; null for anyone else (the page answers 404). */
export async function getReviewForEdit(reviewId: string, userId: string, now = new Date()): Promise<{ review: PublicReview; editableUntil: string; canEdit: boolean; subjectKind: ReviewSubjectKind; subjectId: string } | null> {
  const [row] = await db.select().from(review).where(eq(review.id, reviewId)).limit(1);
  if (!row || row.authorId !== userId) return null;
  const [shown] = await presentReviews([row], userId, now);
  if (!shown) return null;
  return { review: shown, editableUntil: editableUntil(row).toISOString(), canEdit: canStillEdit(row, now), subjectKind: row.subjectKind, subjectId: row.subjectId };
}

const QUEUE_LIMIT = 100;

/** Open reports, oldest first, each with the review as the public would see it. */
export async function listModerationReports(): Promise<ModerationReport[]> {
  const reports = await db
    .select({ report: reviewReport, reporterName: profile.displayName, reporterAccount: user.name })
    .from(reviewReport)
    .innerJoin(user, eq(user.id, reviewReport.reporterId))
    .leftJoin(profile, eq(profile.userId, reviewReport.reporterId))
    .where(eq(reviewReport.state, "open"))
    .orderBy(asc(reviewReport.createdAt), asc(reviewReport.id))
    .limit(QUEUE_LIMIT);
  if (reports.length === 0) return [];
  const reviewIds = [...new Set(reports.map((r) => r.report.reviewId))];
  const rows = await db.select().from(review).where(inArray(review.id, reviewIds));
  const shown = new Map((await presentReviews(rows, null)).map((r) => [r.id, r]));
  const providerIds = [...new Set(rows.map((r) => r.providerId))];
  const providers = new Map(
    (await db.select({ id: profile.userId, name: profile.displayName }).from(profile).where(inArray(profile.userId, providerIds))).map((p) => [p.id, p.name]),
  );
  const providerOf = new Map(rows.map((r) => [r.id, r.providerId]));
  return reports.flatMap(({ report, reporterName, reporterAccount }) => {
    const r = shown.get(report.reviewId);
    if (!r) return [];
    return [
      {
        id: report.id,
        reviewId: report.reviewId,
        review: r,
        providerName: providers.get(providerOf.get(report.reviewId) ?? "") ?? "A provider",
        reason: report.reason,
        details: report.details,
        reporterName: reporterName ?? reporterAccount,
        createdAt: report.createdAt.toISOString(),
      },
    ];
  });
}

/** How many reports wait for a decision (the admin dashboard's count). */
export async function countOpenReports(): Promise<number> {
  const [row] = await db.select({ n: sql<number>`count(*)` }).from(reviewReport).where(eq(reviewReport.state, "open"));
  return Number(row?.n ?? 0);
}
