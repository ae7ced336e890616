import { NextResponse } from "next/server";
import { parseWith, readJson, withApi } from "@/lib/api/handler";
import { requireApiPermission } from "@/lib/auth/session";
import { createBatch, listOwnBatches } from "@/lib/reservations/batches";
import { batchFormSchema } from "@/lib/validations/reservations";

/** The signed-in hatchery's own batches. */
export const GET = withApi(async (request) => {
  const user = await requireApiPermission(request, "batch:manage");
  return NextResponse.json({ batches: await listOwnBatches(user) });
});

/** Posts a new batch. */
export const POST = withApi(async (request) => {
  const user = await requireApiPermission(request, "batch:manage");
  const values = parseWith(batchFormSchema, await readJson(request));
  return NextResponse.json({ batch: await createBatch(user, values) }, { status: 201 });
});
