import { eq } from "drizzle-orm";
import type { Database } from "@/db/client";
import { profile, user } from "@/db/schema";
import { job, tankRequest } from "@/db/schema-jobs";
import { reservation } from "@/db/schema-reservations";
import type { WriteTx } from "@/db/write-transaction";
import { SPECIES_LABEL, TANK_TYPE_LABEL, type Species } from "@/lib/catalog";
import { describeSize } from "@/lib/requests/format";
import type { ReviewRole, ReviewSubjectKind } from "./types";

// What a review is about: a builder's job or a hatchery's reservation, read the same way for eligibility, photo
// uploads and the e-mails. Takes the reader so it runs inside the caller's write transaction.

type Reader = Database | WriteTx;

export type ReviewSubject = {
  kind: ReviewSubjectKind;
  id: string;
  role: ReviewRole;
  farmerId: string;
  providerId: string;
  /** the row's state (job or reservation vocabulary) */
  state: string;
  finished: boolean;
  disputed: boolean;
  label: string;
  /** where the farmer follows it (the review form lives under it) */
  farmerPath: string;
};

/** Finished for a review: a completed job, or one whose dispute is settled; a released reservation. */
const FINISHED_JOB_STATES = ["completed", "resolved"];

export async function loadReviewSubject(reader: Reader, kind: ReviewSubjectKind, id: string): Promise<ReviewSubject | null> {
  if (kind === "job") {
    const [row] = await reader
      .select({ j: job, r: tankRequest })
      .from(job)
      .innerJoin(tankRequest, eq(tankRequest.id, job.requestId))
      .where(eq(job.id, id))
      .limit(1);
    if (!row) return null;
    const { j, r } = row;
    return {
      kind,
      id,
      role: "builder",
      farmerId: j.farmerId,
      providerId: j.builderId,
      state: j.state,
      finished: FINISHED_JOB_STATES.includes(j.state),
      disputed: j.state === "disputed",
      label: `${TANK_TYPE_LABEL[r.tankType]} · ${describeSize(r)}`,
      farmerPath: `/farmer/requests/${r.id}`,
    };
  }
  const [r] = await reader.select().from(reservation).where(eq(reservation.id, id)).limit(1);
  if (!r) return null;
  const fish = r.handedOverCount ?? r.count;
  return {
    kind,
    id,
    role: "hatchery",
    farmerId: r.farmerId,
    providerId: r.hatcheryId,
    state: r.state,
    finished: r.state === "released",
    disputed: r.state === "disputed",
    label: `${SPECIES_LABEL[r.species as Species] ?? r.species} · ${fish.toLocaleString("en")} fingerlings`,
    farmerPath: `/farmer/reservations/${r.id}`,
  };
}

/** The review form of a subject (the pages live beside the farmer's job and reservation pages). */
export function reviewFormPath(subject: Pick<ReviewSubject, "farmerPath">): string {
  return `${subject.farmerPath}/review`;
}

/** A provider's public name: the business name on its profile. */
export async function providerNameOf(reader: Reader, userId: string): Promise<string> {
  const [row] = await reader.select({ displayName: profile.displayName, name: user.name }).from(user).leftJoin(profile, eq(profile.userId, user.id)).where(eq(user.id, userId)).limit(1);
  return row?.displayName ?? row?.name ?? "The provider";
}

/** "Given-name S.": enough for a reader to see a real person wrote it, not enough to find them. */
export function shortPersonName(fullName: string): string {
  const parts = fullName.trim().split(/\s+/).filter(Boolean);
  const first = parts[0];
  if (!first) return "A farmer";
  const last = parts.length > 1 ? parts.at(-1) : undefined;
  const initial = last ? Array.from(last)[0]?.toLocaleUpperCase("en") : undefined;
  return initial ? `${first} ${initial}.` : first;
}
