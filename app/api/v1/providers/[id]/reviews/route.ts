import { NextResponse } from "next/server";
import { parseWith, withApi } from "@/lib/api/handler";
import { getRequestUser } from "@/lib/auth/session";
import { listProviderReviews } from "@/lib/reviews/queries";
import { providerReviewsQuerySchema, reviewQueryFromParams } from "@/lib/validations/reviews";

/** A provider role's reviews, public; the viewer's own marks (helpful, reported, may edit) when signed in. */
export const GET = withApi(async (request, { params }: { params: Promise<{ id: string }> }) => {
  const { id } = await params;
  const q = parseWith(providerReviewsQuerySchema, reviewQueryFromParams(new URL(request.url).searchParams));
  const viewer = await getRequestUser(request);
  const page = await listProviderReviews(id, q.role, q, viewer?.id ?? null);
  // Per viewer (their marks), so never shared by caches.
  return NextResponse.json(page, { headers: { "Cache-Control": "private, no-store" } });
});
