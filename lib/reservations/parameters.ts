/*
 * Every deadline and share that shapes a reservation, in one place, each with its reason. These are Shoal's
 * product choices unless marked otherwise; change them here and nowhere else.
 */

export interface ProductParameter<Unit extends string> {
  readonly value: number;
  readonly unit: Unit;
  readonly reason: string;
  /** "product choice": ours to set; "common practice": how the trade does it, no published figure found */
  readonly basis: "product choice" | "common practice";
}

export interface ReservationParameters {
  readonly acceptWithinHours: ProductParameter<"hours">;
  readonly payWithinHours: ProductParameter<"hours">;
  readonly quarantineDays: ProductParameter<"days">;
  readonly autoReleaseDays: ProductParameter<"days">;
  readonly depositShareBasisPoints: ProductParameter<"basis points">;
}

// Card authorisations lapse on the card network's clock: Stripe's "Place a hold on a payment method" page gives
// 7 days for most online card payments (5 for some Visa merchant-initiated ones). A reservation's money is held
// from payment through hand-over and up to autoReleaseDays after it, which can be longer. The hold machine records
// a lapse (hold-state.ts "expire"), but the wiring must decide how to keep the money safe past 7 days
// (capture into Shoal's holding earlier, or authorise nearer hand-over). That is not decided here: see
// lib/payments/holds.ts (SAFEKEEP_AFTER_HOURS), which authorises first and captures into Shoal's holding at day 5.
export const RESERVATION_PARAMETERS: ReservationParameters = {
  acceptWithinHours: {
    value: 48,
    unit: "hours",
    basis: "product choice",
    reason:
      "A request takes fish off the market until the hatchery answers. Many hatcheries are family businesses that read messages once a day, so two days gives them a full working day even for a request sent late in the evening, and unanswered requests keep fish locked away for two days at most.",
  },
  payWithinHours: {
    value: 48,
    unit: "hours",
    basis: "product choice",
    reason:
      "Paying can mean a trip to a mobile-money agent or a bank. Two days leaves time for that without keeping the hatchery's stock off the market for a week.",
  },
  quarantineDays: {
    value: 7,
    unit: "days",
    basis: "common practice",
    reason:
      "Issue 4: new fingerlings spend their first week in a net enclosure (hapa) inside the tank and the farmer reports survival on day 7 (common practice). Transport stress and latent disease show in that first week. Import quarantine stations keep fish 30 days (REFERENCE-VALUES 6.1) and SPC gives no fixed number (6.2), so 7 days is a farm-level choice, not a published figure.",
  },
  autoReleaseDays: {
    value: 14,
    unit: "days",
    basis: "product choice",
    reason:
      "The quarantine week plus one more week to report or dispute, so a farmer with poor signal or away from the tank still gets the chance. A hatchery that did its job waits at most two weeks after hand-over for its money. Disputes close at the same moment, so a release and a dispute can never both win.",
  },
  depositShareBasisPoints: {
    value: 10_000,
    unit: "basis points",
    basis: "product choice",
    reason:
      "The whole price (100 %) is held. Issue 4 promises that the farmer's money is safe until the fish are in the tank, and the first week is when sick fish die, so Shoal holds all of it rather than a part. Fingerling orders are small (500 fish at ZMW 1.50 is ZMW 750), so paying it all at once is not a burden. A short count or a dispute can then be settled entirely from the hold, with nothing to chase outside Shoal.",
  },
};

const HOUR_MS = 3_600_000;
const DAY_MS = 24 * HOUR_MS;

/** Deadlines are fixed 24-hour days from the moment of the event, independent of time zones. */
export function addHours(at: Date, hours: number): Date {
  return new Date(at.getTime() + hours * HOUR_MS);
}

export function addDays(at: Date, days: number): Date {
  return new Date(at.getTime() + days * DAY_MS);
}
