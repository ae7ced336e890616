import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { Card } from "@/components/ui/card";
import { readOutboxMessage } from "@/lib/dev/outbox";
import { env } from "@/lib/env";

export const metadata: Metadata = { title: "E-mail (demo outbox)" };
export const dynamic = "force-dynamic";

export default async function OutboxMessagePage({ params }: { params: Promise<{ id: string }> }) {
  if (!env.DEV_OUTBOX) notFound();
  const { id } = await params;
  const message = await readOutboxMessage(id);
  if (!message) notFound();
  const links = Array.from(new Set((message.text ?? "").match(/https?:\/\/[^\s<>"]+/g) ?? []));
  return (
    <div className="mx-auto max-w-3xl px-4 py-8">
      <Link href="/dev/outbox" className="text-sm font-medium text-lagoon-700 underline underline-offset-2">
        ← Outbox
      </Link>
      <Card className="mt-4">
        <dl className="grid grid-cols-[5rem_1fr] gap-y-1 text-sm">
          <dt className="text-silt-600">From</dt>
          <dd className="break-all">{message.from}</dd>
          <dt className="text-silt-600">To</dt>
          <dd className="break-all">{message.to.join(", ")}</dd>
          <dt className="text-silt-600">Subject</dt>
          <dd className="font-semibold">{message.subject}</dd>
        </dl>
        {links.length ? (
          <div className="mt-4">
            <h2 className="text-sm font-semibold text-silt-800">Links in this e-mail</h2>
            <ul className="mt-1 space-y-1">
              {links.map((href) => (
                <li key={href}>
                  <a href={href} className="break-all text-sm font-medium text-lagoon-700 underline underline-offset-2" data-testid="mail-link">
                    {href}
                  </a>
                </li>
              ))}
            </ul>
          </div>
        ) : null}
        {/* The HTML body is shown in a sandboxed frame with scripts off; links open normally. */}
        {message.html ? (
          <iframe title="E-mail body" sandbox="allow-top-navigation-by-user-activation allow-popups" srcDoc={message.html} className="mt-4 h-[28rem] w-full rounded-lg border border-silt-200" />
        ) : null}
        {message.text ? (
          <details className="mt-4" open={!message.html}>
            <summary className="cursor-pointer text-sm font-medium text-silt-700">Plain text</summary>
            <pre className="mt-2 whitespace-pre-wrap break-words rounded-lg bg-silt-100 p-3 text-sm" data-testid="mail-text">
              {message.text}
            </pre>
          </details>
        ) : null}
      </Card>
    </div>
  );
}
