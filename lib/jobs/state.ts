import type { HoldActor, HoldEvent } from "@/lib/payments/hold-state";
import { addDays } from "@/lib/reservations/parameters";
import { JOB_PARAMETERS } from "./parameters";

/*
 * An accepted builder quote, from booking to completion, as a pure state machine (CONVENTIONS habit 6). A job is
 * created once the quote's deposit hold is held; the caller stores the snapshot, writes a history row per move
 * and carries out the effects.
 *
 *   scheduled ──arrive──▶ on_site ──mark_built──▶ built ──confirm──────▶ completed   (deposit released)
 *       │                    │                      │  ──auto_confirm─▶ completed
 *       │                    └──dispute──┐          └──dispute──┐
 *       │                                ▼                      ▼
 *       │                             disputed ──resolve (for_farmer | for_builder | split)──▶ resolved
 *       └──cancel──▶ cancelled   (deposit refunded)
 *
 * Once the builder is on site, ending a job early is a dispute for an admin, not a cancel: materials may be bought
 * and work done, and neither side should decide alone what that was worth.
 */

export const JOB_STATES = ["scheduled", "on_site", "built", "completed", "disputed", "resolved", "cancelled"] as const;
export type JobState = (typeof JOB_STATES)[number];

export const FINAL_JOB_STATES: readonly JobState[] = ["completed", "resolved", "cancelled"];

export const JOB_EVENTS = ["arrive", "mark_built", "confirm", "auto_confirm", "dispute", "resolve", "cancel"] as const;
export type JobEventType = (typeof JOB_EVENTS)[number];

export const JOB_ACTORS = ["farmer", "builder", "admin", "system"] as const;
export type JobActorRole = (typeof JOB_ACTORS)[number];

export type JobActor = { role: "farmer" | "builder" | "admin"; userId: string } | { role: "system" };

export type JobResolution = { outcome: "for_farmer" } | { outcome: "for_builder" } | { outcome: "split"; releaseMinor: number };

export type JobEvent =
  | { type: "arrive" }
  | { type: "mark_built"; photoCount: number }
  | { type: "confirm" }
  | { type: "auto_confirm" }
  | { type: "dispute" }
  | ({ type: "resolve" } & JobResolution)
  | { type: "cancel" };

type SameKeys<A, B> = [A] extends [B] ? ([B] extends [A] ? true : false) : false;
const eventsMatch: SameKeys<JobEvent["type"], JobEventType> = true;
void eventsMatch;

export interface Job {
  state: JobState;
  farmerId: string;
  builderId: string;
  currency: string;
  /** the held deposit (quote.ts priceQuote depositMinor) */
  depositMinor: number;
  onSiteAt: Date | null;
  builtAt: Date | null;
  completionPhotoCount: number | null;
  resolution: JobResolution | null;
}

export type JobMailTemplate = "job-started" | "job-built" | "job-completed" | "job-cancelled" | "job-disputed" | "job-dispute-resolved";
export type JobMailRecipient = "farmer" | "builder" | "admins";

export type JobEffect =
  /** apply this event to the job's deposit hold (lib/payments/hold-state.ts) as this actor */
  | { kind: "hold"; event: HoldEvent; actor: HoldActor }
  | { kind: "mail"; template: JobMailTemplate; to: JobMailRecipient }
  | { kind: "schedule"; event: "auto_confirm"; at: Date };

export type JobRefusal = "illegal_transition" | "forbidden_actor" | "not_party" | "too_early" | "too_late" | "missing_photos" | "invalid_amount";

export type JobResult = { ok: true; next: Job; effects: JobEffect[] } | { ok: false; reason: JobRefusal; message: string };

export interface JobContext {
  actor: JobActor;
  now: Date;
}

export const JOB_RULES: { readonly [E in JobEventType]: Readonly<Partial<Record<JobState, readonly JobActorRole[]>>> } = {
  arrive: { scheduled: ["builder"] },
  mark_built: { on_site: ["builder"] },
  confirm: { built: ["farmer"] },
  auto_confirm: { built: ["system"] },
  dispute: { on_site: ["farmer"], built: ["farmer"] },
  resolve: { disputed: ["admin"] },
  cancel: { scheduled: ["farmer", "builder"] },
};

/** A job for an accepted quote whose deposit is held. */
export function newJob(input: { farmerId: string; builderId: string; currency: string; depositMinor: number }): Job {
  if (input.farmerId === input.builderId) throw new RangeError("A builder cannot take its own tank request");
  if (!Number.isSafeInteger(input.depositMinor) || input.depositMinor < 1) throw new RangeError("A job needs a held deposit");
  return { ...input, state: "scheduled", onSiteAt: null, builtAt: null, completionPhotoCount: null, resolution: null };
}

/** When the job confirms itself if the farmer neither confirms nor disputes; disputes close at the same moment. */
export function autoConfirmAt(job: Job): Date | null {
  return job.builtAt ? addDays(job.builtAt, JOB_PARAMETERS.autoConfirmDays.value) : null;
}

const refuse = (reason: JobRefusal, message: string): JobResult => ({ ok: false, reason, message });

const mailBoth = (template: JobMailTemplate): JobEffect[] => [
  { kind: "mail", template, to: "farmer" },
  { kind: "mail", template, to: "builder" },
];

function resolutionHoldEvent(job: Job, resolution: JobResolution): HoldEvent | null {
  switch (resolution.outcome) {
    case "for_farmer":
      return { type: "resolve", outcome: "for_farmer" };
    case "for_builder":
      return { type: "resolve", outcome: "for_provider", amountMinor: job.depositMinor };
    case "split":
      // A split gives each side something; all-or-nothing has its own outcome.
      if (!Number.isSafeInteger(resolution.releaseMinor) || resolution.releaseMinor < 1 || resolution.releaseMinor >= job.depositMinor) return null;
      return { type: "resolve", outcome: "for_provider", amountMinor: resolution.releaseMinor };
  }
}

export function jobTransition(current: Job, event: JobEvent, context: JobContext): JobResult {
  const { actor, now } = context;
  const allowed = JOB_RULES[event.type][current.state];
  if (!allowed) return refuse("illegal_transition", `A ${current.state} job cannot take "${event.type}"`);
  if (!allowed.includes(actor.role)) return refuse("forbidden_actor", `"${event.type}" on a ${current.state} job is not for the ${actor.role}`);
  if (actor.role === "farmer" && actor.userId !== current.farmerId) return refuse("not_party", "This is another farmer's job");
  if (actor.role === "builder" && actor.userId !== current.builderId) return refuse("not_party", "This is another builder's job");

  const confirmBy = autoConfirmAt(current);
  switch (event.type) {
    case "arrive":
      return { ok: true, next: { ...current, state: "on_site", onSiteAt: now }, effects: [{ kind: "mail", template: "job-started", to: "farmer" }] };
    case "mark_built": {
      const min = JOB_PARAMETERS.minCompletionPhotos.value;
      if (!Number.isSafeInteger(event.photoCount) || event.photoCount < min) return refuse("missing_photos", `Add at least ${min} photo of the finished tank`);
      return {
        ok: true,
        next: { ...current, state: "built", builtAt: now, completionPhotoCount: event.photoCount },
        effects: [
          { kind: "mail", template: "job-built", to: "farmer" },
          { kind: "schedule", event: "auto_confirm", at: addDays(now, JOB_PARAMETERS.autoConfirmDays.value) },
        ],
      };
    }
    case "confirm":
      return {
        ok: true,
        next: { ...current, state: "completed" },
        effects: [{ kind: "hold", event: { type: "release", amountMinor: current.depositMinor }, actor: "farmer" }, ...mailBoth("job-completed")],
      };
    case "auto_confirm":
      if (confirmBy && now.getTime() < confirmBy.getTime()) return refuse("too_early", "The farmer still has time to confirm or dispute");
      return {
        ok: true,
        next: { ...current, state: "completed" },
        effects: [{ kind: "hold", event: { type: "release", amountMinor: current.depositMinor }, actor: "system" }, ...mailBoth("job-completed")],
      };
    case "dispute":
      if (current.state === "built" && confirmBy && now.getTime() >= confirmBy.getTime()) {
        return refuse("too_late", "The job confirmed itself; disputes closed at the same moment");
      }
      return {
        ok: true,
        next: { ...current, state: "disputed" },
        effects: [
          { kind: "hold", event: { type: "freeze" }, actor: "farmer" },
          { kind: "mail", template: "job-disputed", to: "builder" },
          { kind: "mail", template: "job-disputed", to: "admins" },
        ],
      };
    case "resolve": {
      const resolution: JobResolution = event.outcome === "split" ? { outcome: "split", releaseMinor: event.releaseMinor } : { outcome: event.outcome };
      const holdEvent = resolutionHoldEvent(current, resolution);
      if (!holdEvent) return refuse("invalid_amount", `A split releases between 1 and ${current.depositMinor - 1} minor units to the builder`);
      return {
        ok: true,
        next: { ...current, state: "resolved", resolution },
        effects: [{ kind: "hold", event: holdEvent, actor: "admin" }, ...mailBoth("job-dispute-resolved")],
      };
    }
    case "cancel":
      return {
        ok: true,
        next: { ...current, state: "cancelled" },
        effects: [
          { kind: "hold", event: { type: "refund" }, actor: actor.role === "builder" ? "provider" : "farmer" },
          { kind: "mail", template: "job-cancelled", to: actor.role === "farmer" ? "builder" : "farmer" },
        ],
      };
  }
}
