import "server-only";
import { eq, inArray } from "drizzle-orm";
import { db } from "@/db/client";
import { profile, user, userRole } from "@/db/schema";
import { env } from "@/lib/env";
import type { RenderedMail } from "@/lib/mail/layout";
import { sendMail } from "@/lib/mail/send-mail";

/* Who to write to, and writing without letting a mail failure undo what was already saved. */

export type Contact = { id: string; email: string; name: string };

export async function contactsOf(userIds: readonly string[]): Promise<Map<string, Contact>> {
  if (userIds.length === 0) return new Map();
  const rows = await db
    .select({ id: user.id, email: user.email, name: user.name, displayName: profile.displayName })
    .from(user)
    .leftJoin(profile, eq(profile.userId, user.id))
    .where(inArray(user.id, [...new Set(userIds)]));
  return new Map(rows.map((r) => [r.id, { id: r.id, email: r.email, name: r.displayName ?? r.name }]));
}

export async function adminContacts(): Promise<Contact[]> {
  const rows = await db
    .select({ id: user.id, email: user.email, name: user.name })
    .from(user)
    .innerJoin(userRole, eq(userRole.userId, user.id))
    .where(eq(userRole.role, "admin"));
  return rows;
}

export function appUrl(path: string): string {
  return new URL(path, env.APP_URL).toString();
}

/**
 * Sends after the change is committed. The idempotency key makes a retried action send each message once; a
 * failure is logged, not thrown: the farmer's or builder's action already happened and the page shows it.
 */
export async function notify(to: Contact | undefined, mail: RenderedMail | null, idempotencyKey: string): Promise<void> {
  if (!to || !mail) return;
  try {
    await sendMail(mail, to.email, { idempotencyKey });
  } catch (error) {
    console.error(`[mail] ${mail.template} to ${to.id} failed`, error);
  }
}
