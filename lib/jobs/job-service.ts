import "server-only";
import { and, eq, lte } from "drizzle-orm";
import { db } from "@/db/client";
import { auditLog } from "@/db/schema";
import { job, jobEvent, tankRequest } from "@/db/schema-jobs";
import { writeTransaction, type WriteTx } from "@/db/write-transaction";
import type { Role } from "@/lib/catalog";
import { Conflict, DomainError, Forbidden, Invalid, NotFound } from "@/lib/errors";
import { jobStateMail } from "@/lib/mail/job-templates";
import type { HoldEvent } from "@/lib/payments/hold-state";
import { applyHoldEventInTx, runHoldOperation } from "@/lib/payments/holds";
import { addItemFromJob } from "@/lib/portfolio/portfolio-service";
import { sendReviewRequest } from "@/lib/reviews/review-mail";
import { afterJobMoveInTx } from "@/lib/reviews/trust-hooks";
import { countImagesOf } from "@/lib/uploads/images";
import type { JobAction } from "@/lib/validations/jobs";
import { adminContacts, appUrl, contactsOf, notify } from "./notify";
import { jobTransition, type Job, type JobActor, type JobEffect, type JobEvent, type JobRefusal } from "./state";

/*
 * A job's moves, stored. The pure machine (state.ts) decides; this file writes the state, a history row and the
 * deposit hold's move in one transaction (the hold's processor call is queued there and run after commit, see
 * lib/payments/holds.ts), then sends the mails. A completed job adds its tank to the builder's portfolio.
 */

export type JobRow = typeof job.$inferSelect;
type HoldMove = Parameters<typeof applyHoldEventInTx>[2];

export type JobUser = { id: string; roles: readonly Role[] };

function snapshot(row: JobRow): Job {
  return {
    state: row.state === "awaiting_deposit" ? "scheduled" : row.state,
    farmerId: row.farmerId,
    builderId: row.builderId,
    currency: row.currency,
    depositMinor: row.depositMinor,
    onSiteAt: row.onSiteAt,
    builtAt: row.builtAt,
    completionPhotoCount: row.completionPhotoCount,
    resolution: row.resolution,
  };
}

export async function loadJob(jobId: string): Promise<JobRow> {
  const [row] = await db.select().from(job).where(eq(job.id, jobId));
  if (!row) throw new NotFound("No job with this id");
  return row;
}

export type PartyActor = Extract<JobActor, { userId: string }>;

/** The role a user plays in this job, or null; an admin who is also a party acts as the party unless resolving. */
export function partyOf(row: Pick<JobRow, "farmerId" | "builderId">, user: JobUser, wantsAdmin = false): PartyActor | null {
  if (!wantsAdmin && user.id === row.farmerId) return { role: "farmer", userId: user.id };
  if (!wantsAdmin && user.id === row.builderId) return { role: "builder", userId: user.id };
  if (user.roles.includes("admin")) return { role: "admin", userId: user.id };
  return null;
}

function actorFor(row: Pick<JobRow, "farmerId" | "builderId">, user: JobUser, wantsAdmin: boolean): PartyActor {
  const party = partyOf(row, user, wantsAdmin);
  if (!party) throw new Forbidden("This job is not yours");
  return party;
}

function refusal(reason: JobRefusal, message: string): DomainError {
  switch (reason) {
    case "forbidden_actor":
    case "not_party":
      return new Forbidden(message);
    case "missing_photos":
      return new DomainError(message, 422, "missing_photos", { photos: [message] });
    case "invalid_amount":
      return new Invalid(message, { releaseMinor: [message] });
    case "illegal_transition":
    case "too_early":
    case "too_late":
      return new Conflict(message);
  }
}

function holdMove(event: HoldEvent): HoldMove {
  switch (event.type) {
    case "release":
    case "refund":
    case "freeze":
    case "resolve":
      return event;
    default:
      throw new Error(`a job never moves its hold by "${event.type}"`);
  }
}

async function sendJobMails(row: JobRow, effects: readonly JobEffect[], key: string): Promise<void> {
  const mails = effects.flatMap((e) => (e.kind === "mail" ? [e] : []));
  if (!mails.length) return;
  const contacts = await contactsOf([row.farmerId, row.builderId]);
  const admins = mails.some((m) => m.to === "admins") ? await adminContacts() : [];
  for (const m of mails) {
    const recipients = m.to === "admins" ? admins : [contacts.get(m.to === "farmer" ? row.farmerId : row.builderId)];
    for (const to of recipients) {
      if (!to) continue;
      const url = appUrl(m.to === "farmer" ? `/farmer/requests/${row.requestId}` : m.to === "builder" ? `/builder/jobs/${row.id}` : `/admin`);
      await notify(to, jobStateMail(m.template, m.to, { name: to.name, url }), `${key}:${m.template}:${to.id}`);
    }
  }
}

/** Calling a job off before its deposit: nothing is held, so nothing moves but the request, which closes. */
async function callOff(row: JobRow, actor: JobActor, reason: string): Promise<void> {
  if (actor.role !== "farmer" && actor.role !== "builder") throw new Forbidden("Only the farmer or the builder can call off this job");
  const role = actor.role;
  await writeTransaction(db, async (tx) => {
    const moved = await tx.update(job).set({ state: "cancelled" }).where(and(eq(job.id, row.id), eq(job.state, "awaiting_deposit"))).returning({ id: job.id });
    if (moved.length === 0) throw new Conflict("This job changed meanwhile: reload the page");
    await tx.update(tankRequest).set({ state: "closed" }).where(eq(tankRequest.id, row.requestId));
    await tx.insert(jobEvent).values({ jobId: row.id, event: "cancel", fromState: "awaiting_deposit", toState: "cancelled", actorId: actor.userId, actorRole: role, detail: { reason } });
  });
  await sendJobMails(row, [{ kind: "mail", template: "job-cancelled", to: role === "farmer" ? "builder" : "farmer" }], `job:${row.id}:cancel`);
}

function eventOf(action: JobAction, photoCount: number): JobEvent {
  switch (action.type) {
    case "mark_built":
      return { type: "mark_built", photoCount };
    case "resolve":
      if (action.outcome === "split") {
        if (action.releaseMinor === undefined) throw new Invalid("releaseMinor: Say how much goes to the builder", { releaseMinor: ["Say how much goes to the builder"] });
        return { type: "resolve", outcome: "split", releaseMinor: action.releaseMinor };
      }
      return { type: "resolve", outcome: action.outcome };
    case "arrive":
    case "confirm":
    case "dispute":
    case "cancel":
      return { type: action.type };
  }
}

/** Applies one move to a job as the signed-in user (or the system, for the automatic confirmation). */
export async function actOnJob(jobId: string, user: JobUser | "system", action: JobAction, now = new Date()): Promise<void> {
  const row = await loadJob(jobId);
  const actor: JobActor = user === "system" ? { role: "system" } : actorFor(row, user, action.type === "resolve");
  if (row.state === "awaiting_deposit") {
    if (action.type !== "cancel") throw new Conflict("The deposit is not paid yet");
    return callOff(row, actor, action.reason);
  }
  const photoCount = action.type === "mark_built" ? await countImagesOf("completion-photo", jobId, row.builderId) : 0;
  const event: JobEvent = actor.role === "system" && action.type === "confirm" ? { type: "auto_confirm" } : eventOf(action, photoCount);
  const result = jobTransition(snapshot(row), event, { actor, now });
  if (!result.ok) throw refusal(result.reason, result.message);
  const next = result.next;
  const holdEffects = result.effects.flatMap((e) => (e.kind === "hold" ? [e] : []));
  const holdId = row.holdId;
  if (holdEffects.length && !holdId) throw new Error(`job ${jobId} has no deposit hold`);
  const schedule = result.effects.find((e) => e.kind === "schedule");

  let askForReview = false;
  await writeTransaction(db, async (tx: WriteTx) => {
    const moved = await tx
      .update(job)
      .set({ state: next.state, onSiteAt: next.onSiteAt, builtAt: next.builtAt, completionPhotoCount: next.completionPhotoCount, resolution: next.resolution, autoConfirmAt: schedule ? schedule.at : row.autoConfirmAt })
      .where(and(eq(job.id, jobId), eq(job.state, row.state)))
      .returning({ id: job.id });
    if (moved.length === 0) throw new Conflict("This job changed meanwhile: reload the page");
    const detail: Record<string, unknown> = {};
    if (action.type === "dispute" || action.type === "cancel") detail.reason = action.reason;
    if (action.type === "mark_built") detail.photoCount = photoCount;
    if (action.type === "resolve") Object.assign(detail, { outcome: action.outcome, releaseMinor: action.releaseMinor ?? null, note: action.note });
    await tx.insert(jobEvent).values({ jobId, event: event.type, fromState: row.state, toState: next.state, actorId: actor.role === "system" ? null : actor.userId, actorRole: actor.role, detail });
    // An admin's decision over someone's money goes to the append-only audit log as well.
    if (actor.role === "admin") await tx.insert(auditLog).values({ actorId: actor.userId, action: `job.${event.type}`, subjectType: "job", subjectId: jobId, detail: { from: row.state, to: next.state, ...detail }, createdAt: now });
    for (const e of holdEffects) {
      if (!holdId) continue;
      const caller = { role: e.actor, userId: actor.role === "system" ? null : actor.userId };
      await applyHoldEventInTx(tx, holdId, holdMove(e.event), caller, `job:${jobId}:${e.event.type}`, now);
    }
    if (next.state === "completed") await addItemFromJob(tx, jobId, now);
    // Finished or dropped work changes the builder's trust; a finished job may now be reviewed.
    askForReview = await afterJobMoveInTx(tx, row, next.state);
  });
  if (holdEffects.length && holdId) {
    const after = await runHoldOperation(holdId, now);
    if (!after.settled) console.warn("[jobs] deposit move queued for the sweep", jobId);
  }
  await sendJobMails(row, result.effects, `job:${jobId}:${action.type}`);
  if (askForReview) await sendReviewRequest("job", jobId);
}

/** Confirms built jobs whose farmer neither confirmed nor disputed in time (run by the scheduled sweep). */
export async function autoConfirmDueJobs(now = new Date()): Promise<number> {
  const due = await db.select({ id: job.id }).from(job).where(and(eq(job.state, "built"), lte(job.autoConfirmAt, now))).limit(100);
  let done = 0;
  for (const d of due) {
    try {
      await actOnJob(d.id, "system", { type: "confirm" }, now);
      done++;
    } catch (error) {
      console.error("[jobs] auto-confirm failed", d.id, error instanceof Error ? error.message : error);
    }
  }
  return done;
}
