import type { Metadata } from "next";
import { PageHeading } from "@/components/ui/card";
import { listOpenDisputes, type OpenDispute } from "@/lib/disputes/dispute-queue";
import { formatMoney } from "@/lib/money/money";
import { formatDay } from "@/lib/requests/format";
import { DisputeDecision } from "./_components/dispute-decision";

export const metadata: Metadata = { title: "Disputes" };

function Party({ label, name, phone }: { label: string; name: string; phone: string | null }) {
  return (
    <div>
      <dt className="text-xs uppercase tracking-wide text-silt-600">{label}</dt>
      <dd className="text-silt-900">
        {name}
        {phone ? (
          <>
            {" · "}
            <a href={`tel:${phone}`} className="text-lagoon-700 underline underline-offset-2">
              {phone}
            </a>
          </>
        ) : null}
      </dd>
    </div>
  );
}

function Facts({ d }: { d: OpenDispute }) {
  if (d.kind === "job") return <p className="text-sm text-silt-700">Quote total {formatMoney(d.totalMinor, d.currency)} · deposit held {formatMoney(d.depositMinor, d.currency)}</p>;
  return (
    <p className="text-sm text-silt-700">
      Deposit held {formatMoney(d.depositMinor, d.currency)} · {d.count.toLocaleString("en")} reserved
      {d.handedOverCount !== null ? ` · ${d.handedOverCount.toLocaleString("en")} handed over` : " · not handed over"}
      {d.survivedCount !== null ? ` · ${d.survivedCount.toLocaleString("en")} alive on day 7` : ""}
    </p>
  );
}

export default async function DisputesPage() {
  const disputes = await listOpenDisputes();
  return (
    <div>
      <PageHeading
        title="Disputes"
        lead="A deposit stays frozen while its dispute is open. Call both sides, look at the photos and the timeline, then decide. Each decision moves the money and is written to the audit log."
      />
      {disputes.length === 0 ? (
        <p className="rounded-card border border-dashed border-silt-300 p-8 text-center text-silt-600">No open disputes.</p>
      ) : (
        <ul className="space-y-4" aria-label="Open disputes">
          {disputes.map((d) => (
            <li key={`${d.kind}:${d.id}`} className="rounded-card border border-silt-200 bg-white p-4 shadow-card">
              <article aria-labelledby={`dispute-${d.id}`} className="grid gap-4 md:grid-cols-[1fr_20rem]">
                <div className="space-y-3">
                  <div>
                    <p className="text-xs font-semibold uppercase tracking-wide text-clay-700">{d.kind === "job" ? "Tank job" : "Fingerling reservation"} · {d.reference}</p>
                    <h2 id={`dispute-${d.id}`} className="text-lg font-semibold text-silt-950">
                      {d.title}
                    </h2>
                    <p className="text-sm text-silt-600">Opened {formatDay(d.openedAt)}</p>
                  </div>
                  <dl className="grid gap-2 sm:grid-cols-2">
                    <Party label="Farmer" name={d.farmer.name} phone={d.farmer.phone} />
                    <Party label={d.kind === "job" ? "Builder" : "Hatchery"} name={d.provider.name} phone={d.provider.phone} />
                  </dl>
                  <Facts d={d} />
                  <figure className="rounded-lg bg-silt-50 p-3">
                    <figcaption className="text-xs font-semibold uppercase tracking-wide text-silt-600">What the farmer says</figcaption>
                    <blockquote className="mt-1 whitespace-pre-line text-silt-900">{d.reason ?? "No reason was given."}</blockquote>
                  </figure>
                </div>
                <DisputeDecision dispute={{ kind: d.kind, id: d.id, reference: d.reference, currency: d.currency, depositMinor: d.depositMinor }} />
              </article>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
