import { formatMoney } from "@/lib/money/money";
import { formatDateTime } from "@/lib/reservations/labels";
import type { ReservationDetail } from "@/lib/reservations/queries";

const HOLD_TEXT: Record<string, string> = {
  pending: "Payment on its way",
  held: "Held by Shoal",
  frozen: "Frozen while the dispute is open",
  released: "Released to the hatchery",
  partially_released: "Released for the fish handed over, the rest returned",
  refunded: "Returned to the farmer",
  voided: "Not charged",
  expired: "The card authorisation lapsed: Shoal support will contact you",
};

/** What was agreed and where the money is, the same for both sides. */
export function ReservationFacts({ reservation: r }: { reservation: ReservationDetail }) {
  const other = r.viewerRole === "hatchery" ? { label: "Farmer", ...r.farmer } : { label: "Hatchery", ...r.hatchery };
  return (
    <dl className="grid grid-cols-[8.5rem_1fr] gap-x-3 gap-y-1.5 text-sm">
      <dt className="text-silt-600">Fish</dt>
      <dd>
        {r.count.toLocaleString("en")} {r.speciesLabel}, about {r.meanWeightG} g / {r.meanLengthCm} cm
      </dd>
      <dt className="text-silt-600">Price</dt>
      <dd>
        {formatMoney(r.pricePerFishMinor, r.currency)} each · total <strong>{formatMoney(r.totalMinor, r.currency)}</strong>
      </dd>
      <dt className="text-silt-600">Deposit</dt>
      <dd>
        {formatMoney(r.depositMinor, r.currency)}
        {r.hold ? <span className="block text-xs text-silt-600">{HOLD_TEXT[r.hold.state] ?? r.hold.state}</span> : null}
        {r.hold && (r.hold.releasedMinor > 0 || r.hold.returnedMinor > 0) ? (
          <span className="block text-xs text-silt-600">
            {formatMoney(r.hold.releasedMinor, r.currency)} to the hatchery · {formatMoney(r.hold.returnedMinor, r.currency)} back to the farmer
          </span>
        ) : null}
      </dd>
      <dt className="text-silt-600">Hand-over</dt>
      <dd>{r.handoverMethod === "pickup" ? "Collection at the hatchery" : "Delivery by the hatchery"}</dd>
      {r.handedOverCount !== null ? (
        <>
          <dt className="text-silt-600">Handed over</dt>
          <dd>
            {r.handedOverCount.toLocaleString("en")} fish{r.handedOverAt ? ` on ${formatDateTime(r.handedOverAt)}` : ""}
          </dd>
        </>
      ) : null}
      {r.survivedCount !== null ? (
        <>
          <dt className="text-silt-600">Survived week 1</dt>
          <dd>{r.survivedCount.toLocaleString("en")} fish</dd>
        </>
      ) : null}
      <dt className="text-silt-600">{other.label}</dt>
      <dd>
        {other.name}
        {other.phone ? (
          <a href={`tel:${other.phone}`} className="ml-2 font-medium text-lagoon-700 underline underline-offset-2">
            {other.phone}
          </a>
        ) : null}
      </dd>
      {r.note ? (
        <>
          <dt className="text-silt-600">Note</dt>
          <dd className="whitespace-pre-line">{r.note}</dd>
        </>
      ) : null}
      <dt className="text-silt-600">Reference</dt>
      <dd className="font-mono">{r.reference}</dd>
    </dl>
  );
}
