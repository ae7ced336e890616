import "server-only";
import { z } from "zod";
import { env } from "@/lib/env";

// Reads the local mail stand-in's store. Only used when DEV_OUTBOX is on; the
// hosted mail service has no such listing.
const messageSchema = z.object({
  id: z.string(),
  from: z.string(),
  to: z.union([z.string(), z.array(z.string())]).transform((t) => (Array.isArray(t) ? t : [t])),
  subject: z.string(),
  created_at: z.string(),
  html: z.string().nullish(),
  text: z.string().nullish(),
});
export type OutboxMessage = z.infer<typeof messageSchema>;

async function call(path: string): Promise<unknown> {
  const response = await fetch(`${env.RESEND_BASE_URL}${path}`, {
    headers: { authorization: `Bearer ${env.RESEND_API_KEY}` },
    cache: "no-store",
  });
  if (response.status === 404) return null;
  if (!response.ok) throw new Error(`outbox answered ${response.status}`);
  return response.json();
}

export async function listOutbox(to?: string): Promise<OutboxMessage[]> {
  const query = new URLSearchParams({ limit: "100", ...(to ? { to } : {}) });
  const body = z.object({ data: z.array(messageSchema) }).parse(await call(`/emails?${query}`));
  return body.data;
}

export async function readOutboxMessage(id: string): Promise<OutboxMessage | null> {
  if (!/^[A-Za-z0-9-]{1,64}$/.test(id)) return null;
  const body = await call(`/emails/${id}`);
  return body ? messageSchema.parse(body) : null;
}
