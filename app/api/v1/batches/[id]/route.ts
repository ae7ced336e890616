import { NextResponse } from "next/server";
import { parseWith, readJson, withApi } from "@/lib/api/handler";
import { requireApiPermission } from "@/lib/auth/session";
import { NotFound } from "@/lib/errors";
import { updateBatch } from "@/lib/reservations/batches";
import { getReservableBatch } from "@/lib/reservations/queries";
import { batchFormSchema } from "@/lib/validations/reservations";

type Context = { params: Promise<{ id: string }> };

/** What anyone may see of a batch (the provider page shows the same). */
export const GET = withApi(async (_request, { params }: Context) => {
  const found = await getReservableBatch((await params).id);
  if (!found) throw new NotFound("No such batch");
  return NextResponse.json({ batch: found });
});

/** The owner edits a batch; reservations already made keep their own price and count. */
export const PUT = withApi(async (request, { params }: Context) => {
  const user = await requireApiPermission(request, "batch:manage");
  const values = parseWith(batchFormSchema, await readJson(request));
  return NextResponse.json({ batch: await updateBatch(user, (await params).id, values) });
});
