import "server-only";
import { eq, or } from "drizzle-orm";
import { db } from "@/db/client";
import { depositHold, processedWebhookEvent, type DepositHoldRow } from "@/db/schema-reservations";
import { writeTransaction } from "@/db/write-transaction";
import { holdTransition } from "./hold-state";
import { authorizeInTx, cancelLateAuthorisation } from "./hold-open";
import { commitHoldMove, machineOf, viewOf, type HoldView } from "./hold-store";
import type { PaymentEvent } from "./processor";
import { paymentProcessor } from "./processor-from-env";

export type PaymentEventOutcome = {
  outcome: "applied" | "confirmed" | "replayed" | "ignored" | "unknown_hold";
  hold: HoldView | null;
  /** the event made the hold held (the subject may now move, e.g. a reservation's deposit is paid) */
  becameHeld: boolean;
};

/**
 * Applies a verified processor event. The event id is recorded in the same transaction as any change, so a
 * replayed delivery (same id) changes nothing. Events that only confirm a move we made ourselves change nothing
 * either; the ones that matter are an authorisation or decline whose answer we missed, and an authorisation the
 * card network let lapse while we still held it.
 */
export async function applyPaymentEvent(event: PaymentEvent, now = new Date()): Promise<PaymentEventOutcome> {
  const processorName = paymentProcessor().name;
  const result = await writeTransaction(db, async (tx) => {
    const recorded = await tx
      .insert(processedWebhookEvent)
      .values({ eventId: event.eventId, processor: processorName, type: event.type === "ignored" ? event.processorType : event.type, outcome: "received", receivedAt: now })
      .onConflictDoNothing()
      .returning({ id: processedWebhookEvent.eventId });
    if (recorded.length === 0) return { outcome: "replayed" as const, row: null, becameHeld: false, cancel: null };
    const finish = async (outcome: PaymentEventOutcome["outcome"], row: DepositHoldRow | null, becameHeld = false, cancel: string | null = null) => {
      await tx.update(processedWebhookEvent).set({ outcome, holdId: row?.id ?? null }).where(eq(processedWebhookEvent.eventId, event.eventId));
      return { outcome, row, becameHeld, cancel };
    };
    if (event.type === "ignored") return finish("ignored", null);
    const row = (await tx.select().from(depositHold).where(or(eq(depositHold.processorHoldId, event.holdId), eq(depositHold.id, event.reference ?? ""))).limit(1))[0];
    if (!row) return finish("unknown_hold", null);
    switch (event.type) {
      case "hold.authorized": {
        const r = await authorizeInTx(tx, row, { processorHoldId: event.holdId, heldMinor: event.heldMinor, currency: event.currency }, "webhook", now);
        return finish(r.becameHeld ? "applied" : "confirmed", r.row, r.becameHeld, r.cancelAtProcessor ? event.holdId : null);
      }
      case "hold.failed": {
        if (row.state !== "pending" || row.pendingOp) return finish("confirmed", row);
        const t = holdTransition(machineOf(row), { type: "fail" }, "system");
        if (!t.ok) return finish("confirmed", row);
        const after = await commitHoldMove(tx, row, { ...t, event: "fail", caller: { role: "system" }, at: now, detail: { via: "webhook" }, set: { processorHoldId: event.holdId, failureCode: event.failure?.code ?? "declined", failureMessage: event.failure?.message ?? "The payment was declined." } });
        return finish("applied", after);
      }
      case "hold.canceled": {
        // Cancelled while we still hold it, not by us (nothing queued) and not captured: the authorisation lapsed.
        if ((row.state !== "held" && row.state !== "frozen") || row.pendingOp || row.capturedAt) return finish("confirmed", row);
        const t = holdTransition(machineOf(row), { type: "expire" }, "system");
        if (!t.ok) return finish("confirmed", row);
        const after = await commitHoldMove(tx, row, { ...t, event: "expire", caller: { role: "system" }, at: now, detail: { via: "webhook" } });
        return finish("applied", after);
      }
      case "hold.released":
      case "hold.refunded":
        return finish("confirmed", row);
    }
  });
  if (result.cancel && result.row) await cancelLateAuthorisation(result.row, result.cancel);
  return { outcome: result.outcome, hold: result.row ? viewOf(result.row) : null, becameHeld: result.becameHeld };
}

