import { NextResponse } from "next/server";
import { parseWith, readJson, withApi } from "@/lib/api/handler";
import { enforceRateLimit, RATE_LIMITS } from "@/lib/api/rate-limit";
import { requireApiPermission } from "@/lib/auth/session";
import { presignForSubject } from "@/lib/uploads/upload-service";
import { presignBodySchema } from "@/lib/validations/uploads";

/** A presigned PUT for one photo of one object the caller may add to. */
export const POST = withApi(async (request) => {
  const user = await requireApiPermission(request, "upload:image");
  const input = parseWith(presignBodySchema, await readJson(request));
  await enforceRateLimit(RATE_LIMITS.uploadPresign, user.id);
  return NextResponse.json(await presignForSubject(user, input));
});
