import { NextResponse } from "next/server";
import { withApi } from "@/lib/api/handler";
import { requireApiPermission } from "@/lib/auth/session";
import { deletePortfolioItem } from "@/lib/portfolio/portfolio-service";

/** Removes a hand-added item and its photos; tanks built through Shoal stay. */
export const DELETE = withApi(async (request, { params }: { params: Promise<{ id: string }> }) => {
  const { id } = await params;
  const user = await requireApiPermission(request, "portfolio:manage");
  await deletePortfolioItem(user.id, id);
  return NextResponse.json({ id, deleted: true });
});
