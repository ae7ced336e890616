import type { ReservationState } from "./state";

// Words and dates the reservation pages and e-mails show. No server imports: client components use these too.

/** Shoal's region is Zambia (prices in ZMW); times are shown on its clock whatever the server's zone is. */
export const DISPLAY_TIME_ZONE = "Africa/Lusaka";

export const RESERVATION_STATE_LABEL: Record<ReservationState, string> = {
  requested: "Waiting for the hatchery",
  accepted: "Accepted: deposit to pay",
  deposit_held: "Deposit held",
  quarantine: "Quarantine week",
  released: "Released",
  cancelled: "Cancelled",
  declined: "Declined",
  lapsed: "Lapsed",
  disputed: "Disputed",
  refunded: "Refunded",
};

export type HistoryEventName =
  | "request"
  | "accept"
  | "decline"
  | "pay_deposit"
  | "hand_over"
  | "remind_survival"
  | "report_survival"
  | "auto_release"
  | "cancel"
  | "lapse"
  | "dispute"
  | "resolve_dispute"
  | "refund";

export const HISTORY_EVENT_LABEL: Record<HistoryEventName, string> = {
  request: "Reserved",
  accept: "Accepted by the hatchery",
  decline: "Declined by the hatchery",
  pay_deposit: "Deposit paid and held by Shoal",
  hand_over: "Fish handed over",
  remind_survival: "Day-7 reminder sent",
  report_survival: "Survival reported",
  auto_release: "Released automatically",
  cancel: "Cancelled",
  lapse: "Lapsed",
  dispute: "Dispute opened",
  resolve_dispute: "Dispute decided",
  refund: "Deposit refunded",
};

export const ACTOR_LABEL = { farmer: "Farmer", hatchery: "Hatchery", admin: "Shoal admin", system: "Shoal" } as const;

/**
 * The first week after hand-over (issue 4; common practice, no published day count: REFERENCE-VALUES §6 notes that
 * import quarantine stations use 30 days and SPC gives no fixed number). The bag-floating step is from memory.
 */
export const QUARANTINE_CHECKLIST: { id: "hapa" | "acclimatise" | "watch" | "remove_dead" | "treat" | "release"; text: string }[] = [
  { id: "acclimatise", text: "Float the closed transport bag in the tank for about 15 minutes so the water temperatures even out, then let the fish swim out." },
  { id: "hapa", text: "Keep the new fish in a net enclosure (hapa) inside the tank, apart from any fish already there." },
  { id: "watch", text: "Watch them morning and evening: are they feeding, swimming normally, not gasping at the surface, free of spots or sores?" },
  { id: "remove_dead", text: "Take out and count any dead fish every day." },
  { id: "treat", text: "Treat them before release (for example a short salt bath), as your hatchery or extension officer advises." },
  { id: "release", text: "On day 7, count the survivors, report the number here, then release them into the main tank." },
];

export function formatDateTime(iso: string | Date): string {
  return new Date(iso).toLocaleString("en-GB", { timeZone: DISPLAY_TIME_ZONE, day: "numeric", month: "short", year: "numeric", hour: "2-digit", minute: "2-digit" });
}

export function formatDate(iso: string | Date, timeZone = DISPLAY_TIME_ZONE): string {
  return new Date(iso).toLocaleDateString("en-GB", { timeZone, day: "numeric", month: "short", year: "numeric" });
}

/** A short reference people can read out on the phone: the first 8 characters of the id. */
export function reservationReference(id: string): string {
  return id.replace(/-/g, "").slice(0, 8).toUpperCase();
}
