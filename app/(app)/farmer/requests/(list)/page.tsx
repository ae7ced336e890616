import type { Metadata } from "next";
import Link from "next/link";
import { ButtonLink } from "@/components/ui/button";
import { Card, PageHeading } from "@/components/ui/card";
import { requirePagePermission } from "@/lib/auth/session";
import { JOB_STATE_LABEL } from "@/lib/jobs/vocabulary";
import { formatDay } from "@/lib/requests/format";
import { listFarmerRequests } from "@/lib/requests/request-views";

export const metadata: Metadata = { title: "Your tank requests" };

const STATE_TEXT = { open: "Open for quotes", awarded: "Quote accepted", closed: "Closed" } as const;

export default async function FarmerRequestsPage() {
  const user = await requirePagePermission("tank-request:post", "/farmer/requests");
  const requests = await listFarmerRequests(user.id);
  return (
    <div className="mx-auto max-w-3xl">
      <PageHeading title="Your tank requests" lead="Builders whose service area covers your site get your request and answer with itemised quotes.">
        <ButtonLink href="/farmer/requests/new">Ask for a tank</ButtonLink>
      </PageHeading>
      {requests.length === 0 ? (
        <Card>
          <p className="text-silt-700">No requests yet. Describe the tank you want and where it goes; builders nearby will quote.</p>
        </Card>
      ) : (
        <ul className="space-y-3">
          {requests.map((r) => (
            <li key={r.id}>
              <Card className="flex flex-wrap items-center justify-between gap-3">
                <div className="min-w-0">
                  <Link href={`/farmer/requests/${r.id}`} className="font-semibold text-lagoon-800 underline-offset-2 first-letter:uppercase hover:underline">
                    {r.title}
                  </Link>
                  <p className="text-sm text-silt-600">
                    Posted {formatDay(r.createdAt)} · wanted by {formatDay(r.wantedBy)}
                  </p>
                </div>
                <p className="text-sm font-medium text-silt-800">
                  {r.jobState ? JOB_STATE_LABEL[r.jobState] : STATE_TEXT[r.state]}
                  {r.state === "open" ? ` · ${r.openQuotes} ${r.openQuotes === 1 ? "quote" : "quotes"}` : ""}
                </p>
              </Card>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
