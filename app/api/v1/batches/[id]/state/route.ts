import { NextResponse } from "next/server";
import { parseWith, readJson, withApi } from "@/lib/api/handler";
import { requireApiPermission } from "@/lib/auth/session";
import { setBatchState } from "@/lib/reservations/batches";
import { batchActionSchema } from "@/lib/validations/reservations";

/** Pause, resume or close one of the hatchery's batches. */
export const POST = withApi(async (request, { params }: { params: Promise<{ id: string }> }) => {
  const user = await requireApiPermission(request, "batch:manage");
  const { action } = parseWith(batchActionSchema, await readJson(request));
  return NextResponse.json({ batch: await setBatchState(user, (await params).id, action) });
});
