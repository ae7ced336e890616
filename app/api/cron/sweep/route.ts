import { timingSafeEqual } from "node:crypto";
import { NextResponse } from "next/server";
import { withApi } from "@/lib/api/handler";
import { env } from "@/lib/env";
import { Unauthorized } from "@/lib/errors";
import { sweepJobs } from "@/lib/jobs/job-sweep";
import { sweep } from "@/lib/reservations/sweep";
import { deliverReviewMail } from "@/lib/reviews/review-mail";

function authorised(request: Request): boolean {
  const given = Buffer.from(request.headers.get("authorization") ?? "");
  const wanted = Buffer.from(`Bearer ${env.CRON_SECRET}`);
  return given.length === wanted.length && timingSafeEqual(given, wanted);
}

/** The scheduled sweep: lapses stale reservations, sends day-7 reminders, releases holds past their time, sends review mail left over. Safe to call twice at once. */
export const POST = withApi(async (request) => {
  if (!authorised(request)) throw new Unauthorized("The sweep needs the cron secret.");
  return NextResponse.json({ swept: await sweep(), jobs: await sweepJobs(), reviewMailSent: await deliverReviewMail() });
});
