import { NextResponse } from "next/server";
import { parseWith, readJson, withApi } from "@/lib/api/handler";
import { enforceRateLimit, RATE_LIMITS } from "@/lib/api/rate-limit";
import { requireApiPermission } from "@/lib/auth/session";
import { completeForSubject } from "@/lib/uploads/upload-service";
import { completeBodySchema } from "@/lib/validations/uploads";

/** Checks the uploaded bytes, stores the metadata-free variants and records the image. */
export const POST = withApi(async (request) => {
  const user = await requireApiPermission(request, "upload:image");
  const input = parseWith(completeBodySchema, await readJson(request));
  await enforceRateLimit(RATE_LIMITS.uploadComplete, user.id);
  return NextResponse.json(await completeForSubject(user, input), { status: 201 });
});
