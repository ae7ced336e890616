import { NextResponse } from "next/server";
import { parseWith, readJson, withApi } from "@/lib/api/handler";
import { requireApiPermission } from "@/lib/auth/session";
import { decideVerification } from "@/lib/profiles/verification";
import { verificationDecisionSchema } from "@/lib/validations/admin";

export const POST = withApi(async (request, { params }: { params: Promise<{ id: string }> }) => {
  const admin = await requireApiPermission(request, "admin:verify-providers");
  const { id } = await params;
  const { decision, note } = parseWith(verificationDecisionSchema, await readJson(request));
  await decideVerification(admin.id, id, decision, note);
  return NextResponse.json({ ok: true });
});
