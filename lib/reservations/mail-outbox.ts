import "server-only";
import { randomUUID } from "node:crypto";
import { and, asc, eq, isNull, lt, or, sql } from "drizzle-orm";
import { db } from "@/db/client";
import { profile, user, userRole } from "@/db/schema";
import { mailOutbox, reservation, type ReservationRow } from "@/db/schema-reservations";
import { writeTransaction, type WriteTx } from "@/db/write-transaction";
import { SPECIES_LABEL, type Species } from "@/lib/catalog";
import { env } from "@/lib/env";
import { reservationMail, type ReservationMailData } from "@/lib/mail/reservation-templates";
import { sendMail } from "@/lib/mail/send-mail";
import { formatMoney } from "@/lib/money/money";
import { formatDateTime, reservationReference } from "./labels";
import { reservationDeadlines, type ReservationMailRecipient, type ReservationMailTemplate } from "./state";

// Reservation e-mails go through an outbox: a move queues its messages in the same transaction (so a move that
// rolls back mails nobody), they are sent right after commit, and whatever the mail service refused is sent by the
// next sweep. The outbox row id is the mail service's idempotency key, so a message is delivered once.

const MAX_ATTEMPTS = 8;
// A claim older than this belongs to a send that died half-way; another sender may take it over.
const CLAIM_TIMEOUT_MS = 2 * 60_000;

export interface MailContext {
  reason?: string | null;
  outcomeText?: string | null;
}

/** Queues one message per recipient for a move recorded as history row `historyId`. */
export async function queueReservationMail(tx: WriteTx, row: Pick<ReservationRow, "id" | "farmerId" | "hatcheryId">, template: ReservationMailTemplate, to: ReservationMailRecipient, historyId: number, context: MailContext = {}): Promise<void> {
  let recipients: string[];
  if (to === "farmer") recipients = [row.farmerId];
  else if (to === "hatchery") recipients = [row.hatcheryId];
  else recipients = (await tx.select({ id: userRole.userId }).from(userRole).where(eq(userRole.role, "admin"))).map((r) => r.id);
  if (recipients.length === 0) return;
  await tx
    .insert(mailOutbox)
    .values(
      recipients.map((recipientId) => ({
        id: randomUUID(),
        subjectType: "reservation",
        subjectId: row.id,
        template,
        context: context.reason || context.outcomeText ? context : null,
        recipientId,
        dedupeKey: `${historyId}:${template}:${recipientId}`,
      })),
    )
    .onConflictDoNothing();
}

async function nameOf(userId: string): Promise<{ name: string; email: string } | null> {
  const row = (await db.select({ email: user.email, name: user.name, displayName: profile.displayName }).from(user).leftJoin(profile, eq(profile.userId, user.id)).where(eq(user.id, userId)).limit(1))[0];
  return row ? { name: row.displayName ?? row.name, email: row.email } : null;
}

function deadlineFor(template: ReservationMailTemplate, r: ReservationRow): Date | null {
  const d = reservationDeadlines({ ...r, state: r.state });
  if (template === "reservation-requested") return d.acceptBy;
  if (template === "reservation-accepted") return d.payBy;
  if (template === "reservation-survival-reminder") return d.autoReleaseAt;
  return null;
}

async function render(templateName: ReservationMailTemplate, context: MailContext, r: ReservationRow, recipientId: string) {
  const [recipient, farmer, hatchery] = await Promise.all([nameOf(recipientId), nameOf(r.farmerId), nameOf(r.hatcheryId)]);
  if (!recipient) return null;
  const side: ReservationMailData["recipientSide"] = recipientId === r.farmerId ? "farmer" : recipientId === r.hatcheryId ? "hatchery" : "admin";
  const path = side === "farmer" ? `/farmer/reservations/${r.id}` : side === "hatchery" ? `/hatchery/reservations/${r.id}` : "/dashboard";
  const deadline = deadlineFor(templateName, r);
  const data: ReservationMailData = {
    recipientName: recipient.name,
    recipientSide: side,
    reference: reservationReference(r.id),
    fish: `${r.count.toLocaleString("en")} ${SPECIES_LABEL[r.species as Species] ?? r.species} fingerlings`,
    hatcheryName: hatchery?.name ?? "The hatchery",
    farmerName: farmer?.name ?? "The farmer",
    totalText: formatMoney(r.totalMinor, r.currency),
    depositText: formatMoney(r.depositMinor, r.currency),
    url: `${env.APP_URL}${path}`,
    handedOverCount: r.handedOverCount,
    survivedCount: r.survivedCount,
    reason: context.reason ?? (templateName === "reservation-requested" ? r.note : null),
    deadlineText: deadline ? formatDateTime(deadline) : null,
    outcomeText: context.outcomeText ?? null,
  };
  return { mail: reservationMail(templateName, data), to: recipient.email };
}

/** Sends queued messages (of one reservation, or all that are due); returns how many went out. */
export async function deliverPendingMail(options: { reservationId?: string; now?: Date; limit?: number } = {}): Promise<number> {
  const now = options.now ?? new Date();
  const staleClaim = new Date(now.getTime() - CLAIM_TIMEOUT_MS);
  // Only reservation messages: reviews queue theirs in the same table and send them with lib/reviews/review-mail.ts.
  const claimable = and(eq(mailOutbox.subjectType, "reservation"), isNull(mailOutbox.sentAt), lt(mailOutbox.attempts, MAX_ATTEMPTS), or(isNull(mailOutbox.claimedAt), lt(mailOutbox.claimedAt, staleClaim)));
  const due = await db
    .select({ id: mailOutbox.id })
    .from(mailOutbox)
    .where(options.reservationId ? and(claimable, eq(mailOutbox.subjectId, options.reservationId)) : claimable)
    .orderBy(asc(mailOutbox.createdAt))
    .limit(options.limit ?? 100);
  let sent = 0;
  for (const { id } of due) {
    // The sweep claims a row before sending (several instances may sweep at once). Right after a move there is no
    // claim: the outbox id is the mail service's idempotency key, so two senders of one row still make one message,
    // and the request saves a commit.
    const message = options.reservationId
      ? (await db.select().from(mailOutbox).where(eq(mailOutbox.id, id)).limit(1))[0]
      : (
          await writeTransaction(db, (tx) =>
            tx
              .update(mailOutbox)
              .set({ claimedAt: now })
              .where(and(eq(mailOutbox.id, id), claimable))
              .returning(),
          )
        )[0];
    if (!message || message.sentAt) continue;
    try {
      const r = (await db.select().from(reservation).where(eq(reservation.id, message.subjectId)).limit(1))[0];
      const rendered = r ? await render(message.template as ReservationMailTemplate, message.context ?? {}, r, message.recipientId) : null;
      if (rendered) await sendMail(rendered.mail, rendered.to, { idempotencyKey: message.id });
      await writeTransaction(db, (tx) => tx.update(mailOutbox).set({ sentAt: new Date(), attempts: sql`${mailOutbox.attempts} + 1`, lastError: rendered ? null : "recipient or reservation gone" }).where(eq(mailOutbox.id, id)));
      sent += 1;
    } catch (err) {
      const text = err instanceof Error ? err.message : String(err);
      console.error("[mail] reservation message left for the sweep", id, text);
      await writeTransaction(db, (tx) => tx.update(mailOutbox).set({ claimedAt: null, attempts: sql`${mailOutbox.attempts} + 1`, lastError: text.slice(0, 500) }).where(eq(mailOutbox.id, id)));
    }
  }
  return sent;
}
