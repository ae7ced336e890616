import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { PhotoStrip } from "@/components/jobs/photo-strip";
import { QuoteLines } from "@/components/jobs/quote-lines";
import { RequestFacts } from "@/components/jobs/request-facts";
import { ButtonLink } from "@/components/ui/button";
import { Card, PageHeading } from "@/components/ui/card";
import { requirePagePermission } from "@/lib/auth/session";
import { estimateFromPriceSheet } from "@/lib/jobs/quote";
import { formatDay } from "@/lib/requests/format";
import { minorToAmount } from "@/lib/quotes/quote-pricing";
import { formatDistance } from "@/lib/requests/reach";
import { builderRequestView, type BuilderRequestView } from "@/lib/requests/request-views";
import type { QuoteForm as QuoteFormValues } from "@/lib/validations/quotes";
import { QuoteForm } from "./_components/quote-form";
import { WithdrawQuote } from "./_components/withdraw-quote";

export const metadata: Metadata = { title: "Tank request" };

type Props = { params: Promise<{ id: string }> };

/** Starting lines: the builder's last version, else the price sheet for this floor area, else one empty line. */
function initialForm(view: BuilderRequestView): QuoteFormValues {
  const currency = view.context.currency;
  if (view.myQuote) {
    const v = view.myQuote.current;
    return {
      scope: v.farmerSuppliesMaterials ? "farmer_supplies_materials" : "turnkey",
      note: v.note,
      lines: v.lines.flatMap((l) => (l.kind === "travel" ? [] : [{ kind: l.kind, description: l.description, quantity: String(l.quantity), unitPrice: minorToAmount(l.unitPriceMinor, currency) }])),
    };
  }
  if (view.priceRow && view.floorAreaM2 > 0) {
    const estimate = estimateFromPriceSheet({ tankType: view.tankType, ...view.priceRow }, view.floorAreaM2);
    return {
      scope: "turnkey",
      note: "",
      // Quantities in m² of floor at the price sheet's rates; the builder edits from there.
      lines: estimate.lines.map((l) => ({
        kind: l.kind === "labour" ? "labour" : "materials",
        description: l.kind === "labour" ? "Labour, per m² of floor" : "Materials, per m² of floor",
        quantity: String(l.quantity),
        unitPrice: minorToAmount(l.unitPriceMinor, currency),
      })),
    };
  }
  return { scope: "turnkey", note: "", lines: [{ kind: "materials", description: "", quantity: "1", unitPrice: "" }] };
}

export default async function BuilderRequestPage({ params }: Props) {
  const { id } = await params;
  const user = await requirePagePermission("tank-request:quote", `/builder/requests/${id}`);
  const view = await builderRequestView(user.id, id);
  if (!view) notFound();
  const mine = view.myQuote;
  const open = view.state === "open";
  const mode = mine?.state === "sent" ? "revise" : mine?.state === "withdrawn" ? "resend" : "send";
  const canQuote = open && (!mine || mine.state === "sent" || mine.state === "withdrawn");
  const place = `about ${view.approxPlace.lat.toFixed(2)}, ${view.approxPlace.lng.toFixed(2)}${view.region ? ` (${view.region})` : ""}, ${formatDistance(view.distanceM)} from your base`;

  return (
    <div className="space-y-6">
      <PageHeading title={`A ${view.title}`} lead={`${formatDistance(view.distanceM)} in a straight line from your base · wanted by ${formatDay(view.wantedBy)}`}>
        <ButtonLink href="/builder/requests" variant="secondary">
          All requests
        </ButtonLink>
      </PageHeading>
      <div className="grid gap-6 lg:grid-cols-[1fr_20rem]">
        <div className="min-w-0 space-y-6">
          {view.jobId ? (
            <Card>
              <p className="text-sm">
                The farmer accepted your quote. <Link href={`/builder/jobs/${view.jobId}`} className="font-medium text-lagoon-700 underline underline-offset-2">Open the job</Link>
              </p>
            </Card>
          ) : null}
          {mine && mine.state !== "sent" && !view.jobId ? (
            <p className="rounded-lg bg-silt-100 p-3 text-sm text-silt-700">
              {mine.state === "withdrawn" ? "You withdrew your quote." : mine.state === "declined" ? "The farmer chose another quote or closed the request." : ""}
            </p>
          ) : null}
          {canQuote ? (
            <Card className="space-y-3">
              <h2 className="text-lg font-semibold">{mode === "revise" ? `Revise your quote (now version ${mine?.versionCount ?? 1})` : "Your quote"}</h2>
              <QuoteForm requestId={view.id} quoteId={mine?.id ?? null} mode={mode} terms={view.context} distanceM={view.distanceM} initial={initialForm(view)} />
              {mine?.state === "sent" ? <WithdrawQuote quoteId={mine.id} /> : null}
            </Card>
          ) : null}
          {view.history.length ? (
            <section aria-labelledby="history-heading" className="space-y-3">
              <h2 id="history-heading" className="text-lg font-semibold">Versions you sent</h2>
              {view.history.map((v) => (
                <details key={v.version} className="rounded-card border border-silt-200 bg-white p-4" open={v.version === view.history[0]?.version}>
                  <summary className="cursor-pointer font-medium">
                    Version {v.version} · {formatDay(v.sentAt)}
                  </summary>
                  <div className="mt-3">
                    <QuoteLines quote={v} />
                  </div>
                </details>
              ))}
            </section>
          ) : null}
        </div>
        <aside className="space-y-4">
          <Card className="space-y-3">
            <h2 className="font-semibold">The request</h2>
            <RequestFacts request={view} place={place} />
            <p className="text-xs text-silt-600">The exact site is shared once the farmer accepts your quote.</p>
          </Card>
          <Card className="space-y-3">
            <h2 className="font-semibold">Site photos</h2>
            <PhotoStrip photos={view.sitePhotos} label="Site photo" empty="The farmer added no photos." />
          </Card>
        </aside>
      </div>
    </div>
  );
}
