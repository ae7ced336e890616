import "server-only";
import { Resend } from "resend";
import { env } from "@/lib/env";
import { renderMail, type MailTemplate } from "./templates";

let client: Resend | undefined;
function resend(): Resend {
  // The base URL points at Resend in production and at the local stand-in otherwise.
  client ??= new Resend(env.RESEND_API_KEY, { baseUrl: env.RESEND_BASE_URL });
  return client;
}

export type SendMailOptions = { idempotencyKey?: string };

/** Renders a template and sends it; throws when the mail service refuses it. */
export async function sendMail(template: MailTemplate, to: string, options: SendMailOptions = {}): Promise<string> {
  const { subject, html, text } = renderMail(template);
  const { data, error } = await resend().emails.send(
    { from: env.MAIL_FROM, to, subject, html, text, tags: [{ name: "template", value: template.name }] },
    options.idempotencyKey ? { idempotencyKey: options.idempotencyKey } : undefined,
  );
  if (error || !data) throw new Error(`mail to ${to} (${template.name}) refused: ${error?.message ?? "no id"}`);
  return data.id;
}
