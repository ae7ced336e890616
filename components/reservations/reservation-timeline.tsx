import { formatMoney } from "@/lib/money/money";
import { ACTOR_LABEL, formatDateTime, HISTORY_EVENT_LABEL } from "@/lib/reservations/labels";
import type { ReservationDetail, ReservationHistoryItem } from "@/lib/reservations/queries";

// The same two views for the farmer and the hatchery: where the reservation is on its path, and every move so far.

type Step = { label: string; at: string | null };

const ENDED_LABEL: Partial<Record<ReservationDetail["state"], string>> = {
  cancelled: "Cancelled",
  declined: "Declined by the hatchery",
  lapsed: "Lapsed",
  disputed: "Disputed: waiting for Shoal",
  refunded: "Deposit refunded",
};

function stepsOf(r: ReservationDetail): Step[] {
  const releasedAt = r.state === "released" ? r.closedAt : null;
  const reported = r.history.find((h) => h.event === "report_survival" || h.event === "auto_release")?.at ?? null;
  return [
    { label: "Requested", at: r.requestedAt },
    { label: "Accepted", at: r.acceptedAt },
    { label: "Deposit held", at: r.depositHeldAt },
    { label: "Handed over", at: r.handedOverAt },
    { label: "Quarantine week", at: reported },
    { label: "Released", at: releasedAt },
  ];
}

export function ReservationSteps({ reservation }: { reservation: ReservationDetail }) {
  const steps = stepsOf(reservation);
  const ended = ENDED_LABEL[reservation.state];
  const current = ended ? -1 : steps.findIndex((s) => s.at === null);
  return (
    <ol className="grid gap-2 sm:grid-cols-6" aria-label="Reservation progress">
      {steps.map((s, i) => {
        const done = s.at !== null;
        const isCurrent = i === current;
        return (
          <li key={s.label} className="flex items-center gap-2 sm:flex-col sm:items-start" aria-current={isCurrent ? "step" : undefined}>
            <span
              aria-hidden="true"
              className={`h-3 w-3 shrink-0 rounded-full sm:h-2 sm:w-full ${done ? "bg-lagoon-600" : isCurrent ? "bg-reed-400" : "bg-silt-200"}`}
            />
            <span className={`text-sm ${done ? "font-medium text-silt-900" : isCurrent ? "font-semibold text-reed-800" : "text-silt-500"}`}>
              {s.label}
              <span className="sr-only">{done ? " (done)" : isCurrent ? " (now)" : " (not yet)"}</span>
            </span>
          </li>
        );
      })}
      {ended ? (
        <li className="flex items-center gap-2 sm:col-span-6">
          <span aria-hidden="true" className="h-3 w-3 shrink-0 rounded-full bg-clay-500" />
          <span className="text-sm font-semibold text-clay-700">{ended}</span>
        </li>
      ) : null}
    </ol>
  );
}

function detailText(h: ReservationHistoryItem, currency: string): string | null {
  const d = h.detail ?? {};
  if (h.event === "request" && typeof d.count === "number") return `${d.count.toLocaleString("en")} fish`;
  if (h.event === "hand_over" && typeof d.count === "number") return `${d.count.toLocaleString("en")} fish handed over`;
  if (h.event === "report_survival" && typeof d.survived === "number") return `${d.survived.toLocaleString("en")} survived the first week`;
  if (h.event === "resolve_dispute") return d.outcome === "for_farmer" ? "Decided for the farmer" : "Decided for the hatchery";
  if (h.event === "pay_deposit" && typeof d.heldMinor === "number") return `${formatMoney(d.heldMinor, currency)} held`;
  if (typeof d.reason === "string" && d.reason) return `“${d.reason}”`;
  return null;
}

export function ReservationHistory({ reservation }: { reservation: ReservationDetail }) {
  return (
    <ol className="space-y-3" aria-label="History">
      {reservation.history.map((h) => {
        const extra = detailText(h, reservation.currency);
        return (
          <li key={h.id} className="border-l-2 border-lagoon-200 pl-3">
            <p className="text-sm font-medium text-silt-900">{HISTORY_EVENT_LABEL[h.event]}</p>
            {extra ? <p className="text-sm text-silt-700">{extra}</p> : null}
            <p className="text-xs text-silt-600">
              <time dateTime={h.at}>{formatDateTime(h.at)}</time> · {h.actorName ? `${h.actorName} (${ACTOR_LABEL[h.actorRole].toLowerCase()})` : ACTOR_LABEL[h.actorRole]}
            </p>
          </li>
        );
      })}
    </ol>
  );
}
