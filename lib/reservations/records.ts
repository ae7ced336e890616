import "server-only";
import { eq } from "drizzle-orm";
import type { Database } from "@/db/client";
import { reservation, type ReservationRow } from "@/db/schema-reservations";
import type { WriteTx } from "@/db/write-transaction";
import { DomainError, Forbidden, Invalid, NotFound } from "@/lib/errors";
import type { Role } from "@/lib/catalog";
import { reservationRoleOf } from "@/lib/auth/permissions";
import type { Reservation, ReservationActor, ReservationRefusal } from "./state";

// Reading reservation rows into the pure machine's shape, and the machine's refusals as HTTP-mapped errors.

export type Caller = { id: string; roles: readonly Role[] };

export function machineOf(row: ReservationRow): Reservation {
  return {
    state: row.state,
    farmerId: row.farmerId,
    hatcheryId: row.hatcheryId,
    count: row.count,
    currency: row.currency,
    depositMinor: row.depositMinor,
    requestedAt: row.requestedAt,
    acceptedAt: row.acceptedAt,
    depositHeldAt: row.depositHeldAt,
    handedOverAt: row.handedOverAt,
    handedOverCount: row.handedOverCount,
    survivalReminderSentAt: row.survivalReminderSentAt,
    survivedCount: row.survivedCount,
  };
}

export async function loadReservation(reader: Database | WriteTx, id: string): Promise<ReservationRow> {
  const row = (await reader.select().from(reservation).where(eq(reservation.id, id)).limit(1))[0];
  if (!row) throw new NotFound("No such reservation");
  return row;
}

/** The refusal as a reply that says why: 400 for bad counts (naming the field), 403 for the wrong person, 409 otherwise. */
export function refusalError(refusal: { reason: ReservationRefusal; message: string }, countField = "count"): DomainError {
  const { reason, message } = refusal;
  switch (reason) {
    case "forbidden_actor":
    case "not_party":
      return new Forbidden(message);
    case "invalid_count":
      return new Invalid(message, { [countField]: [message] });
    case "invalid_request":
      return new Invalid(message);
    default:
      // not_enough_stock, illegal_transition, too_early, too_late, already_done, amount_mismatch
      return new DomainError(message, 409, reason);
  }
}

/**
 * Who the caller is in this reservation. A party acts as the farmer or the hatchery; an admin who is not a party
 * acts as admin. Someone else gets a 404, so reservation ids cannot be probed.
 */
export function actorFor(caller: Caller, row: Pick<ReservationRow, "farmerId" | "hatcheryId">, adminOnly = false): ReservationActor {
  const role = reservationRoleOf(caller, row, adminOnly);
  if (role === null) throw new NotFound("No such reservation");
  return { role, userId: caller.id };
}
