import Link from "next/link";
import { ReviewItem } from "@/components/reviews/review-item";
import { Card } from "@/components/ui/card";
import { Invalid } from "@/lib/errors";
import { listProviderReviews } from "@/lib/reviews/queries";
import { reviewFiltersQuery, type ReviewFilters } from "@/lib/reviews/review-filters";
import { ASPECT_LABELS, REVIEW_ASPECTS, type AspectKey, type ReviewRole } from "@/lib/reviews/types";

const ROLE_TAB: Record<ReviewRole, string> = { builder: "As a tank builder", hatchery: "As a hatchery" };
const PAGE_SIZE = 10;

type Props = {
  providerId: string;
  providerName: string;
  roles: readonly ReviewRole[];
  filters: ReviewFilters;
  viewerId: string | null;
};

const selectClass = "mt-1 block min-h-11 w-full rounded-lg border border-silt-300 bg-white px-2 text-sm text-silt-900";

/**
 * The reviews list: star counts that filter when followed, a GET form for sort and filters (so it all works
 * without JavaScript), the page of reviews, and a link to the next page. The URL holds every choice.
 */
export async function ProviderReviews({ providerId, providerName, roles, filters, viewerId }: Props) {
  const query = { sort: filters.sort, stars: filters.stars ?? undefined, aspect: filters.aspect ?? undefined, minAspectStars: filters.minAspectStars ?? undefined, limit: PAGE_SIZE };
  // A cursor from an old or edited link is refused by the list; show its first page rather than an error.
  const page = await listProviderReviews(providerId, filters.role, { ...query, cursor: filters.cursor }, viewerId).catch((error: unknown) => {
    if (error instanceof Invalid && filters.cursor) return listProviderReviews(providerId, filters.role, query, viewerId);
    throw error;
  });
  const base = `/providers/${providerId}`;
  const href = (change: Partial<ReviewFilters>) => `${base}${reviewFiltersQuery(filters, change, roles[0])}#reviews`;
  const all = ([5, 4, 3, 2, 1] as const).reduce((sum, n) => sum + page.starCounts[n], 0);
  const aspects = REVIEW_ASPECTS[filters.role] as readonly AspectKey[];
  const filtered = filters.stars !== null || filters.aspect !== null;
  const signInHref = viewerId ? null : `/sign-in?next=${encodeURIComponent(`${base}#reviews`)}`;

  return (
    <Card>
      <h2 id="reviews" className="scroll-mt-20 text-lg font-semibold">
        Reviews
      </h2>
      <p className="mt-1 text-sm text-silt-600">Only farmers who finished a job or received fish through Shoal can write one, once per job or order.</p>

      {roles.length > 1 ? (
        <nav aria-label="Reviews of which service" className="mt-3 flex flex-wrap gap-2">
          {roles.map((r) => (
            <Link
              key={r}
              href={`${base}${reviewFiltersQuery({ ...filters, role: r, aspect: null, minAspectStars: null }, {}, roles[0])}#reviews`}
              aria-current={r === filters.role ? "page" : undefined}
              className="inline-flex min-h-11 items-center rounded-full border border-silt-300 px-4 text-sm font-medium text-silt-800 aria-[current=page]:border-lagoon-600 aria-[current=page]:bg-lagoon-600 aria-[current=page]:text-white"
            >
              {ROLE_TAB[r]}
            </Link>
          ))}
        </nav>
      ) : null}

      {all > 0 ? (
        <div className="mt-4 grid gap-4 sm:grid-cols-2">
          <ul className="space-y-1" aria-label="Reviews by stars">
            {([5, 4, 3, 2, 1] as const).map((n) => {
              const count = page.starCounts[n];
              const share = all ? count / all : 0;
              const current = filters.stars === n;
              return (
                <li key={n}>
                  <Link
                    href={href({ stars: current ? null : n })}
                    aria-current={current ? "true" : undefined}
                    className="flex min-h-8 items-center gap-2 rounded px-1 text-sm text-silt-800 hover:bg-silt-100 aria-[current=true]:bg-reed-50 aria-[current=true]:font-semibold"
                  >
                    <span className="w-14 shrink-0">{n} {n === 1 ? "star" : "stars"}</span>
                    <span className="h-2 flex-1 overflow-hidden rounded-full bg-silt-100" aria-hidden="true">
                      <span className="block h-full rounded-full bg-reed-400" style={{ width: `${Math.round(share * 100)}%` }} />
                    </span>
                    <span className="w-8 shrink-0 text-right tabular-nums">{count}</span>
                    <span className="sr-only">{current ? ", shown now; follow to show all" : ", show only these"}</span>
                  </Link>
                </li>
              );
            })}
          </ul>
          <dl className="space-y-1 text-sm">
            {aspects.map((a) => {
              const m = page.aspectMeans[a];
              return (
                <div key={a} className="flex justify-between gap-2 border-b border-silt-100 py-1">
                  <dt className="text-silt-700">{ASPECT_LABELS[a]}</dt>
                  <dd className="font-medium tabular-nums text-silt-900">{m ? `${m.mean.toFixed(1)} of 5 (${m.count})` : "not rated yet"}</dd>
                </div>
              );
            })}
          </dl>
        </div>
      ) : null}

      {all > 0 ? (
        <form method="get" action={`${base}#reviews`} className="mt-4 grid grid-cols-2 gap-3 rounded-lg bg-silt-50 p-3 sm:grid-cols-4 sm:items-end" aria-label="Sort and filter reviews">
          {roles.length > 1 ? <input type="hidden" name="role" value={filters.role} /> : null}
          <div>
            <label htmlFor="reviews-sort" className="text-xs font-medium text-silt-700">Order</label>
            <select id="reviews-sort" name="sort" defaultValue={filters.sort} className={selectClass}>
              <option value="newest">Newest</option>
              <option value="helpful">Most helpful</option>
            </select>
          </div>
          <div>
            <label htmlFor="reviews-stars" className="text-xs font-medium text-silt-700">Stars</label>
            <select id="reviews-stars" name="stars" defaultValue={filters.stars ?? ""} className={selectClass}>
              <option value="">Any</option>
              {[5, 4, 3, 2, 1].map((n) => (
                <option key={n} value={n}>
                  {n} {n === 1 ? "star" : "stars"}
                </option>
              ))}
            </select>
          </div>
          <div>
            <label htmlFor="reviews-aspect" className="text-xs font-medium text-silt-700">Rated for</label>
            <select id="reviews-aspect" name="aspect" defaultValue={filters.aspect ?? ""} className={selectClass}>
              <option value="">Anything</option>
              {aspects.map((a) => (
                <option key={a} value={a}>
                  {ASPECT_LABELS[a]}
                </option>
              ))}
            </select>
          </div>
          <div>
            <label htmlFor="reviews-min" className="text-xs font-medium text-silt-700">with at least</label>
            <select id="reviews-min" name="minAspectStars" defaultValue={filters.minAspectStars ?? ""} className={selectClass}>
              <option value="">Any stars</option>
              {[5, 4, 3, 2].map((n) => (
                <option key={n} value={n}>
                  {n} stars
                </option>
              ))}
            </select>
          </div>
          <button type="submit" className="col-span-2 min-h-11 rounded-lg bg-lagoon-600 px-6 text-sm font-semibold text-white hover:bg-lagoon-700 sm:col-span-4 sm:justify-self-end">
            Show
          </button>
        </form>
      ) : null}

      <div className="mt-2">
        {page.items.length ? (
          <>
            <p className="pt-2 text-sm text-silt-600" data-testid="review-total">
              {page.total} {page.total === 1 ? "review" : "reviews"}
              {filtered ? " match" : ""}
              {filters.sort === "helpful" ? ", most helpful first" : ", newest first"}
              {filtered ? (
                <>
                  {" · "}
                  <Link href={href({ stars: null, aspect: null, minAspectStars: null })} className="font-medium text-lagoon-700 underline underline-offset-2">
                    Show all
                  </Link>
                </>
              ) : null}
            </p>
            <div className="divide-y divide-silt-100">
              {page.items.map((r) => (
                <ReviewItem key={r.id} review={r} providerName={providerName} signInHref={signInHref} />
              ))}
            </div>
          </>
        ) : all > 0 ? (
          <p className="py-4 text-sm text-silt-600">
            No reviews match these filters.{" "}
            <Link href={href({ stars: null, aspect: null, minAspectStars: null })} className="font-medium text-lagoon-700 underline underline-offset-2">
              Show all reviews
            </Link>
          </p>
        ) : (
          <p className="py-2 text-sm text-silt-600">No reviews yet.</p>
        )}
      </div>

      {page.nextCursor || filters.cursor ? (
        <nav aria-label="More reviews" className="mt-2 flex flex-wrap gap-3 border-t border-silt-100 pt-3">
          {filters.cursor ? (
            <Link href={href({})} className="inline-flex min-h-11 items-center rounded-lg border border-silt-300 px-4 text-sm font-semibold text-silt-900 hover:bg-silt-100">
              Back to the first page
            </Link>
          ) : null}
          {page.nextCursor ? (
            <Link href={href({ cursor: page.nextCursor })} className="inline-flex min-h-11 items-center rounded-lg border border-silt-300 px-4 text-sm font-semibold text-silt-900 hover:bg-silt-100">
              {filters.sort === "helpful" ? "More reviews" : "Older reviews"}
            </Link>
          ) : null}
        </nav>
      ) : null}
    </Card>
  );
}
