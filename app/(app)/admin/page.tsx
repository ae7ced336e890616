import type { Metadata } from "next";
import Link from "next/link";
import { PageHeading } from "@/components/ui/card";
import { requirePagePermission } from "@/lib/auth/session";
import { listProvidersForReview } from "@/lib/profiles/verification";
import { VerificationButtons } from "./_components/verification-buttons";

export const metadata: Metadata = { title: "Verification queue" };

const TABS = [
  { state: "pending", label: "Waiting" },
  { state: "verified", label: "Checked" },
  { state: "rejected", label: "Refused" },
] as const;

export default async function AdminPage({ searchParams }: { searchParams: Promise<{ state?: string }> }) {
  await requirePagePermission("admin:verify-providers", "/admin");
  const { state: raw } = await searchParams;
  const state = TABS.find((t) => t.state === raw)?.state ?? "pending";
  const providers = await listProvidersForReview(state);
  return (
    <div>
      <PageHeading title="Provider verification" lead="Call the provider, check that the business and place are real, then decide. Every decision is logged." />
      <nav aria-label="Filter by state" className="mb-4 flex gap-2">
        {TABS.map((t) => (
          <Link
            key={t.state}
            href={`/admin?state=${t.state}`}
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
    </div>
  );
}
