import "server-only";
import { asc, eq } from "drizzle-orm";
import { db } from "@/db/client";
import { profile } from "@/db/schema";
import { job, jobEvent, tankRequest } from "@/db/schema-jobs";
import type { TankType } from "@/lib/catalog";
import { getHold, holdsForSubject, type HoldView } from "@/lib/payments/holds";
import { builderCards, quoteVersionView, type BuilderCard, type QuoteVersionView } from "@/lib/quotes/quote-views";
import { tankTitle, type StoredSize } from "@/lib/requests/format";
import { imagesOf, type ShownImage } from "@/lib/uploads/images";
import { jobButtons, JOB_EVENT_LABEL, type JobButton } from "./job-actions";
import { syncDeposit } from "./job-deposit";
import { partyOf, type JobUser } from "./job-service";
import { JOB_PARAMETERS } from "./parameters";
import { JOB_STATE_LABEL, type JobRowState } from "./vocabulary";

/* A job as its farmer, its builder or an admin sees it. */

export type JobTimelineEntry = { event: string; label: string; at: string; actorRole: string; detail: Record<string, unknown> | null };

export type JobView = {
  id: string;
  requestId: string;
  state: JobRowState;
  stateLabel: string;
  tankType: TankType;
  size: StoredSize;
  title: string;
  /** the exact site: a job's parties need it to meet there (the builder gets it once the deposit is held) */
  site: { lat: number; lng: number } | null;
  farmer: { id: string; name: string; phone: string | null; region: string };
  builder: BuilderCard;
  quote: QuoteVersionView;
  currency: string;
  totalMinor: number;
  depositMinor: number;
  hold: Pick<HoldView, "state" | "heldMinor" | "releasedMinor" | "returnedMinor" | "busy"> | null;
  /** the last declined payment, so the farmer knows why and can try another card */
  lastDecline: string | null;
  timeline: JobTimelineEntry[];
  completionPhotos: ShownImage[];
  minCompletionPhotos: number;
  autoConfirmAt: string | null;
  viewerRole: "farmer" | "builder" | "admin";
  buttons: JobButton[];
};

/** The job for one of its parties (or an admin); null when the viewer has no part in it (pages answer 404). */
export async function jobView(jobId: string, viewer: JobUser): Promise<JobView | null> {
  const [first] = await db.select().from(job).where(eq(job.id, jobId));
  if (!first) return null;
  const party = partyOf(first, viewer);
  if (!party) return null;
  const role = party.role;
  if (first.state === "awaiting_deposit") await syncDeposit(jobId);
  const [row] = await db.select().from(job).where(eq(job.id, jobId));
  const [request] = await db.select().from(tankRequest).where(eq(tankRequest.id, first.requestId));
  if (!row || !request) return null;
  const quote = await quoteVersionView(row.quoteId, row.quoteVersion);
  const cards = await builderCards([row.builderId]);
  const builder = cards.get(row.builderId);
  const [farmer] = await db.select({ name: profile.displayName, phone: profile.phone, region: profile.region }).from(profile).where(eq(profile.userId, row.farmerId));
  if (!quote || !builder || !farmer) return null;
  const hold = row.holdId ? await getHold(row.holdId) : null;
  const declined = row.state === "awaiting_deposit" ? (await holdsForSubject("job", jobId)).find((h) => h.state === "failed") : undefined;
  const events = await db.select().from(jobEvent).where(eq(jobEvent.jobId, jobId)).orderBy(asc(jobEvent.id));
  const size: StoredSize = { shape: request.shape, lengthM: request.lengthM, widthM: request.widthM, diameterM: request.diameterM, depthM: request.depthM, sizeUnit: request.sizeUnit };
  return {
    id: row.id,
    requestId: row.requestId,
    state: row.state,
    stateLabel: JOB_STATE_LABEL[row.state],
    tankType: request.tankType,
    size,
    title: tankTitle(request.tankType, size),
    site: row.state === "awaiting_deposit" && role === "builder" ? null : { lat: request.siteLat, lng: request.siteLng },
    // The farmer's phone reaches the builder once the deposit shows the farmer is serious.
    farmer: { id: row.farmerId, name: farmer.name, phone: row.state === "awaiting_deposit" && role === "builder" ? null : farmer.phone, region: farmer.region },
    builder,
    quote,
    currency: row.currency,
    totalMinor: row.totalMinor,
    depositMinor: row.depositMinor,
    hold: hold ? { state: hold.state, heldMinor: hold.heldMinor, releasedMinor: hold.releasedMinor, returnedMinor: hold.returnedMinor, busy: hold.busy } : null,
    lastDecline: declined?.failure?.message ?? null,
    timeline: events.map((e) => ({ event: e.event, label: JOB_EVENT_LABEL[e.event] ?? e.event, at: e.createdAt.toISOString(), actorRole: e.actorRole, detail: e.detail })),
    completionPhotos: await imagesOf("completion-photo", jobId, row.builderId),
    minCompletionPhotos: JOB_PARAMETERS.minCompletionPhotos.value,
    autoConfirmAt: row.autoConfirmAt?.toISOString() ?? null,
    viewerRole: role,
    buttons: jobButtons(row.state, role),
  };
}

export type JobListItem = { id: string; title: string; state: JobRowState; stateLabel: string; totalMinor: number; currency: string; updatedAt: string };

export async function builderJobs(builderId: string): Promise<JobListItem[]> {
  const rows = await db.select({ j: job, r: tankRequest }).from(job).innerJoin(tankRequest, eq(tankRequest.id, job.requestId)).where(eq(job.builderId, builderId)).orderBy(asc(job.createdAt));
  return rows
    .map(({ j, r }) => ({
      id: j.id,
      title: tankTitle(r.tankType, { shape: r.shape, lengthM: r.lengthM, widthM: r.widthM, diameterM: r.diameterM, depthM: r.depthM, sizeUnit: r.sizeUnit }),
      state: j.state,
      stateLabel: JOB_STATE_LABEL[j.state],
      totalMinor: j.totalMinor,
      currency: j.currency,
      updatedAt: j.updatedAt.toISOString(),
    }))
    .reverse();
}

/** The viewer's part in a job, or null (also for no such job): a cheap check pages make before streaming. */
export async function jobPartyRole(jobId: string, viewer: JobUser): Promise<JobView["viewerRole"] | null> {
  const [row] = await db.select({ farmerId: job.farmerId, builderId: job.builderId }).from(job).where(eq(job.id, jobId));
  return row ? (partyOf(row, viewer)?.role ?? null) : null;
}
