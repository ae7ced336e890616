import { RESERVATION_STATE_LABEL } from "@/lib/reservations/labels";
import type { ReservationState } from "@/lib/reservations/state";

const TONE: Record<ReservationState, string> = {
  requested: "bg-reed-100 text-reed-800",
  accepted: "bg-reed-100 text-reed-800",
  deposit_held: "bg-lagoon-100 text-lagoon-800",
  quarantine: "bg-lagoon-100 text-lagoon-800",
  released: "bg-lagoon-600 text-white",
  disputed: "bg-clay-100 text-clay-700",
  cancelled: "bg-silt-200 text-silt-800",
  declined: "bg-silt-200 text-silt-800",
  lapsed: "bg-silt-200 text-silt-800",
  refunded: "bg-silt-200 text-silt-800",
};

// The hatchery reads the same states from its side of the deal.
const HATCHERY_LABEL: Partial<Record<ReservationState, string>> = {
  requested: "Waiting for your answer",
  accepted: "Waiting for the deposit",
  deposit_held: "Deposit held: hand over",
};

export function ReservationStatus({ state, viewer = "farmer" }: { state: ReservationState; viewer?: "farmer" | "hatchery" }) {
  const label = (viewer === "hatchery" ? HATCHERY_LABEL[state] : undefined) ?? RESERVATION_STATE_LABEL[state];
  return <span className={`inline-block whitespace-nowrap rounded-full px-2.5 py-0.5 text-xs font-semibold ${TONE[state]}`}>{label}</span>;
}
