import { scaleMinor } from "@/lib/payments/ledger";
import { RESERVATION_PARAMETERS } from "./parameters";

export interface ReservationAmounts {
  /** count × price per fish */
  totalMinor: number;
  /** the part held until release: total × deposit share, rounded half up to the minor unit */
  depositMinor: number;
}

export function reservationAmounts(count: number, pricePerFishMinor: number): ReservationAmounts {
  if (!Number.isSafeInteger(count) || count < 1) throw new RangeError(`A reservation is for at least one whole fish, got ${count}`);
  if (!Number.isSafeInteger(pricePerFishMinor) || pricePerFishMinor < 1) {
    throw new RangeError(`A price per fish must be a positive integer count of minor units, got ${pricePerFishMinor}`);
  }
  const totalMinor = count * pricePerFishMinor;
  if (!Number.isSafeInteger(totalMinor)) throw new RangeError("Reservation total is too large");
  return { totalMinor, depositMinor: scaleMinor(totalMinor, RESERVATION_PARAMETERS.depositShareBasisPoints.value, 10_000, "half_up") };
}

export interface Settlement {
  /** to the hatchery */
  releaseMinor: number;
  /** back to the farmer */
  returnMinor: number;
}

/**
 * How a reservation's deposit settles in the hatchery's favour: pro rata to the fish actually handed over, rounded
 * down, so a farmer never pays for a fish not received and any fractional minor unit goes back to the farmer.
 * Fish that died during quarantine are not deducted: that is what a dispute is for.
 */
export function settlementFor(depositMinor: number, reservedCount: number, handedOverCount: number): Settlement {
  if (!Number.isSafeInteger(handedOverCount) || handedOverCount < 0 || handedOverCount > reservedCount) {
    throw new RangeError(`Handed-over count must be between 0 and ${reservedCount}, got ${handedOverCount}`);
  }
  const releaseMinor = scaleMinor(depositMinor, handedOverCount, reservedCount, "down");
  return { releaseMinor, returnMinor: depositMinor - releaseMinor };
}
