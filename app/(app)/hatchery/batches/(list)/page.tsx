import type { Metadata } from "next";
import Link from "next/link";
import { ButtonLink } from "@/components/ui/button";
import { Card, PageHeading } from "@/components/ui/card";
import { requirePagePermission } from "@/lib/auth/session";
import { SPECIES_LABEL } from "@/lib/catalog";
import { formatMoney } from "@/lib/money/money";
import { listOwnBatches } from "@/lib/reservations/batches";
import { formatDate } from "@/lib/reservations/labels";
import { BatchStateButtons } from "../_components/batch-state-buttons";

export const metadata: Metadata = { title: "Your batches" };

const STATE_TEXT = { open: "Open", paused: "Paused", closed: "Closed" } as const;
const DELIVERY_TEXT = { pickup: "Collection", delivery: "Delivery", both: "Collection or delivery" } as const;

export default async function BatchesPage() {
  const user = await requirePagePermission("batch:manage", "/hatchery/batches");
  const batches = await listOwnBatches(user);
  return (
    <div>
      <PageHeading title="Your batches" lead="What you offer now. Buyers reserve from open batches; a paused batch takes no new reservations.">
        <div className="flex flex-wrap gap-2">
          <ButtonLink href="/hatchery/reservations" variant="secondary">
            Reservations
          </ButtonLink>
          <ButtonLink href="/hatchery/batches/new">Post a batch</ButtonLink>
        </div>
      </PageHeading>
      {batches.length === 0 ? (
        <Card>
          <p className="text-silt-700">No batches yet. Post one to show it on your page and in the search.</p>
        </Card>
      ) : (
        <ul className="grid grid-cols-1 gap-4 md:grid-cols-2">
          {batches.map((b) => {
            const label = `${SPECIES_LABEL[b.species]}, ${b.meanWeightG} g`;
            return (
              <li key={b.id}>
                <Card className="h-full space-y-3">
                  <div className="flex flex-wrap items-start justify-between gap-2">
                    <h2 className="text-lg font-semibold text-silt-950">
                      {SPECIES_LABEL[b.species]} · {b.meanWeightG} g / {b.meanLengthCm} cm
                    </h2>
                    <span className={`rounded-full px-2.5 py-0.5 text-xs font-semibold ${b.state === "open" ? "bg-lagoon-100 text-lagoon-800" : "bg-silt-200 text-silt-800"}`}>{STATE_TEXT[b.state]}</span>
                  </div>
                  <dl className="grid grid-cols-[8rem_1fr] gap-y-1 text-sm">
                    <dt className="text-silt-600">On offer</dt>
                    <dd>
                      <strong>{b.countAvailable.toLocaleString("en")}</strong> of {b.countTotal.toLocaleString("en")} ({b.countReserved.toLocaleString("en")} reserved)
                    </dd>
                    <dt className="text-silt-600">Price</dt>
                    <dd>{formatMoney(b.priceMinor, b.currency)} per fish</dd>
                    <dt className="text-silt-600">Ready</dt>
                    <dd>
                      {formatDate(b.readyFrom, "UTC")} to {formatDate(b.sellBy, "UTC")}
                    </dd>
                    <dt className="text-silt-600">Hand-over</dt>
                    <dd>{DELIVERY_TEXT[b.delivery]}</dd>
                    <dt className="text-silt-600">Open requests</dt>
                    <dd>
                      <Link href={`/hatchery/reservations?batch=${b.id}`} className="font-medium text-lagoon-700 underline underline-offset-2">
                        {b.openReservations} open reservation{b.openReservations === 1 ? "" : "s"}
                      </Link>
                    </dd>
                  </dl>
                  <div className="flex flex-wrap items-center gap-2 border-t border-silt-100 pt-3">
                    {b.state !== "closed" ? (
                      <ButtonLink href={`/hatchery/batches/${b.id}/edit`} variant="secondary">
                        Edit
                      </ButtonLink>
                    ) : null}
                    <BatchStateButtons batchId={b.id} state={b.state} label={label} />
                  </div>
                </Card>
              </li>
            );
          })}
        </ul>
      )}
    </div>
  );
}
