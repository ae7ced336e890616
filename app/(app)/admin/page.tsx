import type { Metadata } from "next";
import Link from "next/link";
import { PageHeading } from "@/components/ui/card";
import { requirePagePermission } from "@/lib/auth/session";
import { listProvidersForReview } from "@/lib/profiles/verification";
import { listModerationReports } from "@/lib/reviews/queries";
import { ModerationQueue } from "./_components/moderation-queue";
import { VerificationButtons } from "./_components/verification-buttons";

export const metadata: Metadata = { title: "Moderation and verification" };

const TABS = [
  { state: "pending", label: "Waiting" },
  { state: "verified", label: "Checked" },
  { state: "rejected", label: "Refused" },
] as const;

export default async function AdminPage({ searchParams }: { searchParams: Promise<{ state?: string }> }) {
  await requirePagePermission("admin:verify-providers", "/admin");
  const { state: raw } = await searchParams;
  const state = TABS.find((t) => t.state === raw)?.state ?? "pending";
  const [providers, reports] = await Promise.all([listProvidersForReview(state), listModerationReports()]);
  return (
    <div className="space-y-10">
      <PageHeading title="What needs a decision" lead="Reported reviews and new providers wait here. Every decision is logged with your name.">
        <nav aria-label="Queues" className="flex flex-wrap gap-2 text-sm">
          <a href="#reports" className="inline-flex min-h-11 items-center rounded-lg border border-silt-300 bg-white px-3 font-medium text-silt-800 hover:bg-silt-100">
            Reported reviews ({reports.length})
          </a>
          <a href="#verification" className="inline-flex min-h-11 items-center rounded-lg border border-silt-300 bg-white px-3 font-medium text-silt-800 hover:bg-silt-100">
            New providers
          </a>
        </nav>
      </PageHeading>
      <section aria-labelledby="reports">
        <h2 id="reports" className="scroll-mt-20 text-xl font-semibold text-silt-950">
          Reported reviews
        </h2>
        <p className="mb-4 mt-1 max-w-2xl text-sm text-silt-700">
          Keep a review that is fair even if it is harsh; hide one that insults, invents or shares private details. A hidden review stops counting towards the provider&apos;s score.
        </p>
        <ModerationQueue reports={reports} />
      </section>
      <section aria-labelledby="verification">
        <h2 id="verification" className="scroll-mt-20 text-xl font-semibold text-silt-950">
          Provider verification
        </h2>
        <p className="mb-4 mt-1 max-w-2xl text-sm text-silt-700">Call the provider, check that the business and place are real, then decide.</p>
        <nav aria-label="Filter by state" className="mb-4 flex gap-2">
          {TABS.map((t) => (
            <Link
              key={t.state}
              href={`/admin?state=${t.state}#verification`}
              aria-current={t.state === state ? "page" : undefined}
              className="rounded-full border border-silt-300 px-3 py-1.5 text-sm aria-[current=page]:border-lagoon-600 aria-[current=page]:bg-lagoon-600 aria-[current=page]:text-white"
            >
              {t.label}
            </Link>
          ))}
        </nav>
        {providers.length === 0 ? (
          <p className="rounded-card border border-dashed border-silt-300 p-8 text-center text-silt-600">Nothing here.</p>
        ) : (
          <ul className="space-y-3">
            {providers.map((p) => (
              <li key={p.userId} className="flex flex-col gap-3 rounded-card border border-silt-200 bg-white p-4 sm:flex-row sm:items-center">
                <div className="flex-1">
                  <p className="font-semibold text-silt-900">{p.displayName}</p>
                  <p className="text-sm text-silt-600">
                    {p.roles.filter((r) => r !== "farmer").join(" and ")} · {p.region} · {p.phone ?? "no phone"} · joined{" "}
                    {p.joinedAt.toISOString().slice(0, 10)}
                  </p>
                </div>
                {state === "pending" ? <VerificationButtons providerId={p.userId} name={p.displayName} /> : null}
              </li>
            ))}
          </ul>
        )}
      </section>
    </div>
  );
}
