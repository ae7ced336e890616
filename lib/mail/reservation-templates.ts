import type { ReservationMailTemplate } from "@/lib/reservations/state";
import { composeMail, type RenderedMail } from "./layout";

// E-mails about fingerling reservations: one function per message, each telling the reader what happened and
// what (if anything) they should do next. Money arrives already formatted (lib/money/money.ts formatMoney).

export interface ReservationMailData {
  /** the person reading it */
  recipientName: string;
  /** "farmer" links go to the farmer's page of the reservation, "hatchery" ones to the hatchery's */
  recipientSide: "farmer" | "hatchery" | "admin";
  reference: string;
  fish: string;
  hatcheryName: string;
  farmerName: string;
  totalText: string;
  depositText: string;
  url: string;
  handedOverCount?: number | null;
  survivedCount?: number | null;
  reason?: string | null;
  deadlineText?: string | null;
  outcomeText?: string | null;
}

type Template = (d: ReservationMailData) => RenderedMail;

const open = (d: ReservationMailData) => ({ label: "Open the reservation", url: d.url });

const TEMPLATES: Record<ReservationMailTemplate, Template> = {
  "reservation-requested": (d) =>
    composeMail(
      "reservation-requested",
      `New reservation: ${d.fish}`,
      "A farmer wants to reserve fish",
      [
        `Hello ${d.recipientName},`,
        `${d.farmerName} asks to reserve ${d.fish} (${d.totalText}). The fish are set aside for them until you answer.`,
        d.deadlineText ? `Accept or decline by ${d.deadlineText}; after that the request lapses and the fish go back on offer.` : "Accept or decline soon: an unanswered request lapses and the fish go back on offer.",
        ...(d.reason ? [`Their note: "${d.reason}"`] : []),
      ],
      open(d),
    ),
  "reservation-accepted": (d) =>
    composeMail(
      "reservation-accepted",
      `${d.hatcheryName} accepted your reservation`,
      "Your reservation was accepted",
      [
        `Hello ${d.recipientName},`,
        `${d.hatcheryName} accepted your reservation of ${d.fish}.`,
        `Pay the deposit of ${d.depositText} to confirm it. Shoal holds the money and pays the hatchery only after your fish have been through their first week.`,
        d.deadlineText ? `Pay by ${d.deadlineText}, or the reservation lapses.` : "An unpaid reservation lapses after two days.",
      ],
      { label: "Pay the deposit", url: d.url },
    ),
  "reservation-declined": (d) =>
    composeMail(
      "reservation-declined",
      `${d.hatcheryName} could not take your reservation`,
      "Your reservation was declined",
      [`Hello ${d.recipientName},`, `${d.hatcheryName} cannot supply ${d.fish} this time. Nothing was paid.`, "Other hatcheries near you may have fish ready: look on the map."],
      open(d),
    ),
  "reservation-deposit-held": (d) =>
    composeMail(
      "reservation-deposit-held",
      `Deposit paid: ${d.fish}`,
      "The deposit is held",
      [
        `Hello ${d.recipientName},`,
        `${d.farmerName} paid the deposit of ${d.depositText} for ${d.fish}. Shoal holds it for you.`,
        "Hand the fish over as agreed and record the count you handed over. The money is released to you after the farmer's first week, or automatically if they raise no problem.",
      ],
      open(d),
    ),
  "reservation-handed-over": (d) =>
    composeMail(
      "reservation-handed-over",
      `Your fish were handed over: ${d.fish}`,
      "Your fingerlings are with you",
      [
        `Hello ${d.recipientName},`,
        `${d.hatcheryName} recorded that ${d.handedOverCount ?? "your"} fish were handed over to you.`,
        "For the first seven days keep them in a net enclosure (hapa) inside the tank, watch how they swim and feed, and treat them before releasing them into the main tank. Your reservation page has the checklist.",
        "On day 7, report how many survived. If something is wrong, open a dispute from the same page before the deposit is released.",
      ],
      open(d),
    ),
  "reservation-survival-reminder": (d) =>
    composeMail(
      "reservation-survival-reminder",
      "Day 7: how many of your fish survived?",
      "Your quarantine week is over",
      [
        `Hello ${d.recipientName},`,
        `It is a week since ${d.fish} from ${d.hatcheryName} were handed over to you. Count the fish in the hapa and report how many survived.`,
        d.deadlineText ? `If you report nothing and open no dispute, the deposit goes to the hatchery on ${d.deadlineText}.` : "If you report nothing and open no dispute, the deposit goes to the hatchery after the second week.",
      ],
      { label: "Report survival", url: d.url },
    ),
  "reservation-released": (d) =>
    composeMail(
      "reservation-released",
      `Deposit released: ${d.fish}`,
      "The deposit was released",
      [
        `Hello ${d.recipientName},`,
        d.outcomeText ?? `The deposit for ${d.fish} was released to ${d.hatcheryName}.`,
        ...(d.survivedCount !== null && d.survivedCount !== undefined ? [`Reported survival: ${d.survivedCount} of ${d.handedOverCount ?? "?"} fish after the first week.`] : []),
      ],
      open(d),
    ),
  "reservation-lapsed": (d) =>
    composeMail(
      "reservation-lapsed",
      `Reservation lapsed: ${d.fish}`,
      "The reservation lapsed",
      [
        `Hello ${d.recipientName},`,
        d.reason ?? `The reservation of ${d.fish} lapsed because the next step was not taken in time.`,
        "The fish are back on offer and nothing was charged.",
      ],
      open(d),
    ),
  "reservation-cancelled": (d) =>
    composeMail(
      "reservation-cancelled",
      `Reservation cancelled: ${d.fish}`,
      "The reservation was cancelled",
      [`Hello ${d.recipientName},`, `The reservation of ${d.fish} was cancelled${d.reason ? `: "${d.reason}"` : "."}`, "Any deposit that was held goes back to the farmer in full."],
      open(d),
    ),
  "reservation-disputed": (d) =>
    composeMail(
      "reservation-disputed",
      `Dispute opened: ${d.fish}`,
      "A dispute was opened",
      [
        `Hello ${d.recipientName},`,
        `${d.farmerName} opened a dispute about ${d.fish} from ${d.hatcheryName}${d.reason ? `: "${d.reason}"` : "."}`,
        "The deposit stays held until a Shoal administrator decides. Both sides can be asked for photos or counts.",
      ],
      open(d),
    ),
  "reservation-dispute-resolved": (d) =>
    composeMail(
      "reservation-dispute-resolved",
      `Dispute decided: ${d.fish}`,
      "The dispute was decided",
      [`Hello ${d.recipientName},`, d.outcomeText ?? `A Shoal administrator decided the dispute about ${d.fish}.`],
      open(d),
    ),
  "reservation-refunded": (d) =>
    composeMail(
      "reservation-refunded",
      `Deposit refunded: ${d.fish}`,
      "The deposit was refunded",
      [`Hello ${d.recipientName},`, `The deposit of ${d.depositText} for ${d.fish} was given back to ${d.farmerName} in full.`],
      open(d),
    ),
};

export function reservationMail(template: ReservationMailTemplate, data: ReservationMailData): RenderedMail {
  return TEMPLATES[template](data);
}
