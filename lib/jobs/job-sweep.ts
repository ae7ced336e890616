import "server-only";
import { eq } from "drizzle-orm";
import { db } from "@/db/client";
import { job } from "@/db/schema-jobs";
import { appStorage } from "@/lib/storage/app-storage";
import { sweepStaleUploads } from "@/lib/storage/uploads";
import { syncDeposit } from "./job-deposit";
import { autoConfirmDueJobs } from "./job-service";

// The jobs' and uploads' part of the scheduled sweep (POST /api/cron/sweep). Each step is safe to run twice at once:
// job moves are conditional on the state read, and deleting an upload original that is already gone changes nothing.

export interface JobSweepReport {
  autoConfirmed: number;
  depositsNoticed: number;
  staleUploadsDeleted: number;
}

export async function sweepJobs(now = new Date()): Promise<JobSweepReport> {
  const autoConfirmed = await autoConfirmDueJobs(now);

  // A deposit the processor confirmed late (by webhook) moves its job on even if nobody opens the page.
  const waiting = await db.select({ id: job.id }).from(job).where(eq(job.state, "awaiting_deposit")).limit(200);
  let depositsNoticed = 0;
  for (const w of waiting) if (await syncDeposit(w.id)) depositsNoticed++;

  // Originals uploaded but never completed (a closed tab, a refused file left for safety); s3rver has no lifecycle rules.
  const staleUploadsDeleted = await sweepStaleUploads(appStorage(), { now }).catch((error: unknown) => {
    console.error("[sweep] stale uploads not swept", error instanceof Error ? error.message : error);
    return 0;
  });
  return { autoConfirmed, depositsNoticed, staleUploadsDeleted };
}
