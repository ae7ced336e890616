import "server-only";
import { and, eq, inArray, isNull, lte } from "drizzle-orm";
import { db } from "@/db/client";
import { depositHold, reservation } from "@/db/schema-reservations";
import { DomainError } from "@/lib/errors";
import { viewOf } from "@/lib/payments/hold-store";
import { sweepHolds, type HoldSweepReport } from "@/lib/payments/hold-sweep";
import { deliverPendingMail } from "./mail-outbox";
import { moveReservation, settleHeldDeposit } from "./service";
import type { ReservationEvent } from "./state";

// The scheduled sweep (POST /api/cron/sweep; the demo runner calls it every minute). Safe to run twice at once:
// each move is a conditional UPDATE on the reservation's version inside moveReservation, so of two sweeps that
// picked the same reservation one moves it and the other is refused and counts nothing.

export interface SweepReport {
  lapsed: number;
  reminded: number;
  released: number;
  paymentsSettled: number;
  holds: HoldSweepReport;
  mailSent: number;
}

const BATCH = 200;

/** Runs one system move; false if another sweep or a person got there first (or it is not due after all). */
async function tryMove(id: string, event: ReservationEvent, now: Date): Promise<boolean> {
  try {
    await moveReservation(id, event, { role: "system" }, now);
    return true;
  } catch (err) {
    if (err instanceof DomainError && err.status === 409) return false;
    console.error("[sweep] could not", event.type, id, err instanceof Error ? err.message : err);
    return false;
  }
}

export async function sweep(now = new Date()): Promise<SweepReport> {
  const report: SweepReport = { lapsed: 0, reminded: 0, released: 0, paymentsSettled: 0, holds: { safekept: 0, retried: 0, reauthorised: 0 }, mailSent: 0 };

  // Money first: a payment that was authorised but never reached its reservation wins over a lapse (state.ts).
  const paidButAccepted = await db
    .select({ hold: depositHold })
    .from(depositHold)
    .innerJoin(reservation, eq(reservation.id, depositHold.subjectId))
    .where(and(eq(depositHold.subjectType, "reservation"), eq(depositHold.state, "held"), inArray(reservation.state, ["accepted", "lapsed", "cancelled", "declined"])))
    .limit(BATCH);
  for (const { hold } of paidButAccepted) {
    try {
      await settleHeldDeposit(viewOf(hold), { role: "system" }, now);
      report.paymentsSettled += 1;
    } catch (err) {
      console.error("[sweep] could not settle a held deposit", hold.id, err instanceof Error ? err.message : err);
    }
  }

  const stale = await db
    .select({ id: reservation.id })
    .from(reservation)
    .where(and(inArray(reservation.state, ["requested", "accepted"]), lte(reservation.lapseAt, now)))
    .limit(BATCH);
  for (const r of stale) if (await tryMove(r.id, { type: "lapse" }, now)) report.lapsed += 1;

  const remind = await db
    .select({ id: reservation.id })
    .from(reservation)
    .where(and(eq(reservation.state, "quarantine"), lte(reservation.remindAt, now), isNull(reservation.survivalReminderSentAt)))
    .limit(BATCH);
  for (const r of remind) if (await tryMove(r.id, { type: "remind_survival" }, now)) report.reminded += 1;

  const release = await db
    .select({ id: reservation.id })
    .from(reservation)
    .where(and(eq(reservation.state, "quarantine"), lte(reservation.autoReleaseAt, now)))
    .limit(BATCH);
  for (const r of release) if (await tryMove(r.id, { type: "auto_release" }, now)) report.released += 1;

  report.holds = await sweepHolds(now);
  report.mailSent = await deliverPendingMail({ now });
  return report;
}
