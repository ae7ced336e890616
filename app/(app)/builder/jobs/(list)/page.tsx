import type { Metadata } from "next";
import Link from "next/link";
import { Card, PageHeading } from "@/components/ui/card";
import { requirePagePermission } from "@/lib/auth/session";
import { builderJobs } from "@/lib/jobs/job-views";
import { formatMoney } from "@/lib/money/money";

export const metadata: Metadata = { title: "Your jobs" };

export default async function BuilderJobsPage() {
  const user = await requirePagePermission("tank-request:quote", "/builder/jobs");
  const jobs = await builderJobs(user.id);
  return (
    <div className="mx-auto max-w-3xl">
      <PageHeading title="Your jobs" lead="Accepted quotes, from the deposit to the farmer's confirmation." />
      {jobs.length === 0 ? (
        <Card>
          <p className="text-silt-700">
            No jobs yet. <Link href="/builder/requests" className="font-medium text-lagoon-700 underline underline-offset-2">Quote on requests near you</Link>.
          </p>
        </Card>
      ) : (
        <ul className="divide-y divide-silt-100 rounded-card border border-silt-200 bg-white">
          {jobs.map((j) => (
            <li key={j.id} className="flex flex-wrap items-center justify-between gap-2 p-3 text-sm">
              <Link href={`/builder/jobs/${j.id}`} className="font-medium text-lagoon-800 underline-offset-2 first-letter:uppercase hover:underline">
                {j.title}
              </Link>
              <span className="text-silt-700">
                {formatMoney(j.totalMinor, j.currency)} · {j.stateLabel}
              </span>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
