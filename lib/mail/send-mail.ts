import "server-only";
import { Resend } from "resend";
import { env } from "@/lib/env";
import type { RenderedMail } from "./layout";

let client: Resend | undefined;
function resend(): Resend {
  // The base URL points at Resend in production and at the local stand-in otherwise.
  client ??= new Resend(env.RESEND_API_KEY, { baseUrl: env.RESEND_BASE_URL });
  return client;
}

export type SendMailOptions = { idempotencyKey?: string };

/** Sends a rendered message (see lib/mail/*-templates.ts); throws when the mail service refuses it. */
export async function sendMail(message: RenderedMail, to: string, options: SendMailOptions = {}): Promise<string> {
  const { data, error } = await resend().emails.send(
    { from: env.MAIL_FROM, to, subject: message.subject, html: message.html, text: message.text, tags: [{ name: "template", value: message.template }] },
    options.idempotencyKey ? { idempotencyKey: options.idempotencyKey } : undefined,
  );
  if (error || !data) throw new Error(`mail to ${to} (${message.template}) refused: ${error?.message ?? "no id"}`);
  return data.id;
}
