import "server-only";
import { randomUUID } from "node:crypto";
import { and, asc, eq, inArray, isNull, lt, or, sql } from "drizzle-orm";
import { db } from "@/db/client";
import { profile, user } from "@/db/schema";
import { mailOutbox } from "@/db/schema-reservations";
import { review, reviewReply } from "@/db/schema-reviews";
import { writeTransaction, type WriteTx } from "@/db/write-transaction";
import { env } from "@/lib/env";
import type { RenderedMail } from "@/lib/mail/layout";
import { isReviewMailTemplate, reviewReceivedMail, reviewReplyMail, reviewRequestMail, type ReviewMailTemplate } from "@/lib/mail/review-templates";
import { sendMail } from "@/lib/mail/send-mail";
import { loadReviewSubject, providerNameOf, reviewFormPath, shortPersonName } from "./subjects";
import type { ReviewSubjectKind } from "./types";

// Review e-mails go through the same outbox table as the reservations' (db/schema-reservations.ts mail_outbox): the
// move that causes a message queues it in its own transaction, so a rolled-back move mails nobody; it is sent right
// after commit, and the sweep sends whatever the mail service refused then. The outbox row id is the mail
// service's idempotency key. Rows are told apart by subject_type: "review-request" (subject "job:<id>" or
// "reservation:<id>") and "review" (subject: the review id); lib/reservations/mail-outbox.ts sends only its own.

const SUBJECT_TYPES = ["review-request", "review"] as const;
const MAX_ATTEMPTS = 8;
const CLAIM_TIMEOUT_MS = 2 * 60_000;

export function requestSubjectId(kind: ReviewSubjectKind, id: string): string {
  return `${kind}:${id}`;
}

/** Asks the farmer for a review of a job or reservation that just finished (once per subject). */
export async function queueReviewRequest(tx: WriteTx, subject: { kind: ReviewSubjectKind; id: string; farmerId: string }): Promise<void> {
  const subjectId = requestSubjectId(subject.kind, subject.id);
  await tx
    .insert(mailOutbox)
    .values({ id: randomUUID(), subjectType: "review-request", subjectId, template: "review-request", recipientId: subject.farmerId, dedupeKey: `review-request:${subjectId}` })
    .onConflictDoNothing();
}

/** Tells the provider about a new review, or the author about the provider's reply. */
export async function queueReviewMail(tx: WriteTx, template: Exclude<ReviewMailTemplate, "review-request">, reviewId: string, recipientId: string): Promise<void> {
  await tx
    .insert(mailOutbox)
    .values({ id: randomUUID(), subjectType: "review", subjectId: reviewId, template, recipientId, dedupeKey: `${template}:${reviewId}:${recipientId}` })
    .onConflictDoNothing();
}

async function contactOf(userId: string): Promise<{ email: string; name: string } | null> {
  const [row] = await db.select({ email: user.email, name: user.name, displayName: profile.displayName }).from(user).leftJoin(profile, eq(profile.userId, user.id)).where(eq(user.id, userId)).limit(1);
  return row ? { email: row.email, name: row.displayName ?? row.name } : null;
}

function link(path: string): string {
  return new URL(path, env.APP_URL).toString();
}

async function render(message: typeof mailOutbox.$inferSelect): Promise<{ mail: RenderedMail; to: string } | null> {
  if (!isReviewMailTemplate(message.template)) return null;
  const to = await contactOf(message.recipientId);
  if (!to) return null;
  if (message.template === "review-request") {
    const [kind, id] = message.subjectId.split(":");
    if ((kind !== "job" && kind !== "reservation") || !id) return null;
    const subject = await loadReviewSubject(db, kind, id);
    if (!subject) return null;
    const mail = reviewRequestMail({
      name: to.name,
      providerName: await providerNameOf(db, subject.providerId),
      what: kind === "job" ? "the builder and the tank" : "the hatchery and the fish",
      subjectLabel: subject.label,
      url: link(reviewFormPath(subject)),
    });
    return { mail, to: to.email };
  }
  const [row] = await db.select().from(review).where(eq(review.id, message.subjectId)).limit(1);
  if (!row) return null;
  const url = link(`/providers/${row.providerId}#review-${row.id}`);
  if (message.template === "review-received") {
    const [author] = await db.select({ name: user.name }).from(user).where(eq(user.id, row.authorId)).limit(1);
    return { mail: reviewReceivedMail({ name: to.name, authorName: shortPersonName(author?.name ?? ""), stars: row.stars, body: row.body, subjectLabel: row.subjectLabel, url }), to: to.email };
  }
  const [reply] = await db.select().from(reviewReply).where(eq(reviewReply.reviewId, row.id)).limit(1);
  if (!reply) return null;
  return { mail: reviewReplyMail({ name: to.name, providerName: await providerNameOf(db, row.providerId), body: reply.body, url }), to: to.email };
}

/**
 * Sends queued review messages: those of one subject right after its move (`subjectId`: a review id or
 * requestSubjectId(kind, id)), or everything due (the sweep). Returns how many went out.
 */
export async function deliverReviewMail(options: { subjectId?: string; now?: Date; limit?: number } = {}): Promise<number> {
  const now = options.now ?? new Date();
  const staleClaim = new Date(now.getTime() - CLAIM_TIMEOUT_MS);
  const claimable = and(
    inArray(mailOutbox.subjectType, [...SUBJECT_TYPES]),
    isNull(mailOutbox.sentAt),
    lt(mailOutbox.attempts, MAX_ATTEMPTS),
    or(isNull(mailOutbox.claimedAt), lt(mailOutbox.claimedAt, staleClaim)),
  );
  const due = await db
    .select({ id: mailOutbox.id })
    .from(mailOutbox)
    .where(options.subjectId ? and(claimable, eq(mailOutbox.subjectId, options.subjectId)) : claimable)
    .orderBy(asc(mailOutbox.createdAt))
    .limit(options.limit ?? 100);
  let sent = 0;
  for (const { id } of due) {
    // As in lib/reservations/mail-outbox.ts: the sweep claims a row first; right after a move the idempotency key
    // (the row id) is enough to make two senders of one row one message.
    const message = options.subjectId
      ? (await db.select().from(mailOutbox).where(eq(mailOutbox.id, id)).limit(1))[0]
      : (await writeTransaction(db, (tx) => tx.update(mailOutbox).set({ claimedAt: now }).where(and(eq(mailOutbox.id, id), claimable)).returning()))[0];
    if (!message || message.sentAt) continue;
    try {
      const rendered = await render(message);
      if (rendered) await sendMail(rendered.mail, rendered.to, { idempotencyKey: message.id });
      await writeTransaction(db, (tx) =>
        tx
          .update(mailOutbox)
          .set({ sentAt: new Date(), attempts: sql`${mailOutbox.attempts} + 1`, lastError: rendered ? null : "recipient or subject gone" })
          .where(eq(mailOutbox.id, id)),
      );
      sent += 1;
    } catch (err) {
      const text = err instanceof Error ? err.message : String(err);
      console.error("[mail] review message left for the sweep", id, text);
      await writeTransaction(db, (tx) => tx.update(mailOutbox).set({ claimedAt: null, attempts: sql`${mailOutbox.attempts} + 1`, lastError: text.slice(0, 500) }).where(eq(mailOutbox.id, id)));
    }
  }
  return sent;
}

/** After a job's or reservation's move commits: send the review request it queued, never failing the move. */
export async function sendReviewRequest(kind: ReviewSubjectKind, id: string): Promise<void> {
  try {
    await deliverReviewMail({ subjectId: requestSubjectId(kind, id) });
  } catch (error) {
    console.error("[mail] review request not sent yet", kind, id, error instanceof Error ? error.message : error);
  }
}
