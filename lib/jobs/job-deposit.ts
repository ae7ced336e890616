import "server-only";
import { and, eq } from "drizzle-orm";
import { db } from "@/db/client";
import { job, jobEvent } from "@/db/schema-jobs";
import { writeTransaction } from "@/db/write-transaction";
import { Conflict, Forbidden } from "@/lib/errors";
import { depositHeldMail } from "@/lib/mail/job-templates";
import { formatMoney } from "@/lib/money/money";
import { holdsForSubject, openHold } from "@/lib/payments/holds";
import { loadJob, type JobRow } from "./job-service";
import { appUrl, contactsOf, notify } from "./notify";

/* A job's deposit: held through lib/payments/holds.ts for the accepted quote's deposit; once held, the job is scheduled. */

export type DepositResult = { ok: true } | { ok: false; message: string };

/**
 * The farmer pays the deposit: a hold is opened for the accepted quote's deposit; once it is held the job is
 * scheduled. A repeated click uses the same key and gets the same hold; after a declined card the next try is new.
 */
export async function payDeposit(farmerId: string, jobId: string, paymentMethod: string): Promise<DepositResult> {
  const row = await loadJob(jobId);
  if (row.farmerId !== farmerId) throw new Forbidden("This job is not yours");
  if (row.state !== "awaiting_deposit") {
    if (row.holdId) return { ok: true }; // already paid: a retried request after a lost reply
    throw new Conflict("This job is not waiting for a deposit");
  }
  const failedBefore = (await holdsForSubject("job", jobId)).filter((h) => h.state === "failed").length;
  const opened = await openHold({
    subjectType: "job",
    subjectId: jobId,
    payerId: farmerId,
    payeeId: row.builderId,
    amountMinor: row.depositMinor,
    currency: row.currency,
    idempotencyKey: `job:${jobId}:deposit:${failedBefore}:${paymentMethod}`,
    paymentMethod,
    description: "Tank job deposit",
  });
  if (!opened.ok) return { ok: false, message: opened.message };
  if (opened.hold.state === "held") await markDepositHeld(row, opened.hold.id);
  return { ok: true };
}

/** awaiting_deposit → scheduled once a hold for the job is held (called after paying, and when a page finds one). */
export async function markDepositHeld(row: JobRow, holdId: string): Promise<boolean> {
  const moved = await writeTransaction(db, async (tx) => {
    const done = await tx.update(job).set({ state: "scheduled", holdId }).where(and(eq(job.id, row.id), eq(job.state, "awaiting_deposit"))).returning({ id: job.id });
    if (done.length) await tx.insert(jobEvent).values({ jobId: row.id, event: "deposit_held", fromState: "awaiting_deposit", toState: "scheduled", actorId: row.farmerId, actorRole: "farmer", detail: { holdId, depositMinor: row.depositMinor } });
    return done.length > 0;
  });
  if (!moved) return false;
  const contacts = await contactsOf([row.builderId]);
  const to = contacts.get(row.builderId);
  await notify(to, to ? depositHeldMail({ name: to.name, deposit: formatMoney(row.depositMinor, row.currency), url: appUrl(`/builder/jobs/${row.id}`) }) : null, `job:${row.id}:deposit-held`);
  return true;
}

/** A deposit held by a late processor answer (webhook) moves its job on the next look; true when it moved. */
export async function syncDeposit(jobId: string): Promise<boolean> {
  const row = await loadJob(jobId);
  if (row.state !== "awaiting_deposit") return false;
  const held = (await holdsForSubject("job", jobId)).find((h) => h.state === "held");
  return held ? markDepositHeld(row, held.id) : false;
}
