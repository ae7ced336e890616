import { NextResponse } from "next/server";
import { z } from "zod";
import { parseWith, readJson, withApi } from "@/lib/api/handler";
import { requireApiPermission } from "@/lib/auth/session";
import { addPortfolioItem, listPortfolio } from "@/lib/portfolio/portfolio-service";
import { portfolioItemFormSchema } from "@/lib/validations/portfolio";

const listQuery = z.object({ builderId: z.string().regex(/^[A-Za-z0-9_-]{1,128}$/, "Name the builder") });

/** A builder's finished tanks, for anyone: places are already rounded to about 1 km. */
export const GET = withApi(async (request) => {
  const { builderId } = parseWith(listQuery, Object.fromEntries(new URL(request.url).searchParams));
  return NextResponse.json({ items: await listPortfolio(builderId) });
});

/** The signed-in builder adds a finished tank (its photos were uploaded under the item's id first). */
export const POST = withApi(async (request) => {
  const user = await requireApiPermission(request, "portfolio:manage");
  const input = parseWith(portfolioItemFormSchema, await readJson(request));
  const saved = await addPortfolioItem(user.id, input);
  return NextResponse.json(saved, { status: saved.created ? 201 : 200 });
});
