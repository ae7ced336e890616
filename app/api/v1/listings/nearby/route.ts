import { NextResponse } from "next/server";
import { parseWith, withApi } from "@/lib/api/handler";
import { env } from "@/lib/env";
import { searchNearby } from "@/lib/listings/search";
import { nearbyQuerySchema, searchParamsToObject } from "@/lib/validations/search";

export const GET = withApi(async (request) => {
  const url = new URL(request.url);
  const query = parseWith(nearbyQuerySchema, searchParamsToObject(url.searchParams));
  // The full-scan strategy exists only for the benchmark's comparison, on a server started for it.
  const strategy = env.SHOAL_BENCH && url.searchParams.get("strategy") === "scan" ? "scan" : "index";
  const page = await searchNearby(query, { strategy });
  return NextResponse.json(page, { headers: { "Cache-Control": "public, max-age=30" } });
});
