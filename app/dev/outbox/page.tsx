import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { PageHeading } from "@/components/ui/card";
import { listOutbox } from "@/lib/dev/outbox";
import { env } from "@/lib/env";

export const metadata: Metadata = { title: "Outbox (demo)" };
export const dynamic = "force-dynamic";

export default async function OutboxPage({ searchParams }: { searchParams: Promise<{ to?: string }> }) {
  if (!env.DEV_OUTBOX) notFound();
  const { to } = await searchParams;
  const messages = await listOutbox(to?.slice(0, 200));
  return (
    <div className="mx-auto max-w-4xl px-4 py-8">
      <PageHeading title="Outbox" lead="E-mails the demo server would have sent. They never leave this machine." />
      <form className="mb-4 flex gap-2" role="search">
        <label htmlFor="to" className="sr-only">
          Recipient
        </label>
        <input id="to" name="to" defaultValue={to ?? ""} placeholder="Filter by recipient" className="min-h-11 flex-1 rounded-lg border border-silt-300 px-3" />
        <button className="min-h-11 rounded-lg bg-lagoon-600 px-4 font-semibold text-white">Filter</button>
      </form>
      {messages.length === 0 ? (
        <p className="rounded-card border border-dashed border-silt-300 p-8 text-center text-silt-600">No e-mails yet.</p>
      ) : (
        <ul className="divide-y divide-silt-200 overflow-hidden rounded-card border border-silt-200 bg-white">
          {messages.map((m) => (
            <li key={m.id}>
              <Link href={`/dev/outbox/${m.id}`} className="flex flex-col gap-0.5 px-4 py-3 hover:bg-lagoon-50 sm:flex-row sm:items-center sm:gap-4">
                <span className="font-medium text-silt-900 sm:w-2/5">{m.subject}</span>
                <span className="break-all text-sm text-silt-600 sm:flex-1">{m.to.join(", ")}</span>
                <time className="text-xs text-silt-500" dateTime={m.created_at}>
                  {new Date(m.created_at).toLocaleString("en-GB", { timeZone: "UTC" })} UTC
                </time>
              </Link>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
