import { NextResponse } from "next/server";
import { parseWith, readJson, withApi } from "@/lib/api/handler";
import { requireApiPermission } from "@/lib/auth/session";
import { presignForSubject } from "@/lib/uploads/upload-service";
import { presignBodySchema } from "@/lib/validations/uploads";

/** A presigned PUT for one photo of one object the caller may add to. */
export const POST = withApi(async (request) => {
  const user = await requireApiPermission(request, "upload:image");
  const input = parseWith(presignBodySchema, await readJson(request));
  return NextResponse.json(await presignForSubject(user, input));
});
