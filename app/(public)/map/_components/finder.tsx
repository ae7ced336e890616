"use client";
import { useInfiniteQuery } from "@tanstack/react-query";
import dynamic from "next/dynamic";
import { useEffect, useMemo, useState } from "react";
import { Button } from "@/components/ui/button";
import { getJson } from "@/lib/api/client";
import type { NearbyItem, NearbyPage } from "@/lib/listings/search";
import { FinderFilters } from "./finder-filters";
import { ResultCard } from "./result-card";
import { apiQuery, useFinderParams } from "./use-finder-params";

// The map library is large: it loads only when a map is on screen.
const FinderMap = dynamic(() => import("@/components/map/finder-map"), {
  ssr: false,
  loading: () => (
    <div className="h-full w-full animate-pulse bg-lagoon-50" role="status">
      <span className="sr-only">Loading the map…</span>
    </div>
  ),
});

function useWideScreen(): boolean {
  const [wide, setWide] = useState(false);
  useEffect(() => {
    const mq = window.matchMedia("(min-width: 1024px)");
    setWide(mq.matches);
    const on = (e: MediaQueryListEvent) => setWide(e.matches);
    mq.addEventListener("change", on);
    return () => mq.removeEventListener("change", on);
  }, []);
  return wide;
}

export function Finder({ hostedStyleUrl }: { hostedStyleUrl: string | null }) {
  const [params, update] = useFinderParams();
  const [tab, setTab] = useState<"list" | "map">("list");
  const [selected, setSelected] = useState<string | null>(null);
  const wide = useWideScreen();
  const query = apiQuery(params);

  const results = useInfiniteQuery({
    queryKey: ["nearby", query],
    initialPageParam: null as string | null,
    queryFn: async ({ pageParam }) => {
      const r = await getJson<NearbyPage>(`/api/v1/listings/nearby?${query}${pageParam ? `&cursor=${encodeURIComponent(pageParam)}` : ""}`);
      if (!r.ok) throw new Error(r.message);
      return r.data;
    },
    getNextPageParam: (last) => last.nextCursor,
  });

  const items: NearbyItem[] = useMemo(() => results.data?.pages.flatMap((p) => p.items) ?? [], [results.data]);
  const mapItems = useMemo(
    () => items.map((i) => ({ id: String(i.listingId), providerId: i.providerId, kind: i.kind, name: i.displayName, lat: i.lat, lng: i.lng, distanceKm: i.distanceKm, verified: i.verified, trust: i.trust })),
    [items],
  );
  const showMap = wide || tab === "map";

  // When a popup closes, focus goes back to the result it was opened from (or, on a phone showing the map,
  // to the List tab), never to the top of the page.
  function select(id: string | null) {
    const closing = id === null ? selected : null;
    setSelected(id);
    if (!closing) return;
    requestAnimationFrame(() => {
      const card = document.querySelector<HTMLButtonElement>(`[data-show-on-map="${closing}"]`);
      if (card && card.offsetParent !== null) card.focus();
      else document.querySelector<HTMLButtonElement>('[role="tab"][aria-selected="false"]')?.focus();
    });
  }

  return (
    <div className="mx-auto flex max-w-7xl flex-col lg:h-[calc(100vh-3.75rem)] lg:flex-row">
      <div className="flex flex-col lg:w-[26rem] lg:shrink-0 lg:overflow-y-auto lg:border-r lg:border-silt-200">
        <div className="px-4 pt-5">
          <h1 className="text-xl font-semibold text-silt-950 sm:text-2xl">Builders and hatcheries near you</h1>
        </div>
        <FinderFilters params={params} update={update} />
        <div className="sticky top-0 z-10 flex gap-1 border-b border-silt-200 bg-silt-50 px-4 py-2 lg:hidden" role="tablist" aria-label="Show results as">
          {(["list", "map"] as const).map((t) => (
            <button
              key={t}
              role="tab"
              type="button"
              aria-selected={tab === t}
              onClick={() => setTab(t)}
              className="min-h-11 flex-1 rounded-lg text-sm font-semibold text-silt-700 aria-selected:bg-lagoon-600 aria-selected:text-white"
            >
              {t === "list" ? "List" : "Map"}
            </button>
          ))}
        </div>
        <section aria-label="Results" className={`${tab === "list" || wide ? "block" : "hidden"} px-4 pb-8 pt-3`} aria-live="polite" aria-busy={results.isFetching}>
          {results.isPending ? (
            <ul className="space-y-3" aria-label="Loading results">
              {[0, 1, 2].map((k) => (
                <li key={k} className="h-24 animate-pulse rounded-card bg-silt-200" />
              ))}
            </ul>
          ) : results.isError ? (
            <div role="alert" className="rounded-card border border-clay-500/30 bg-clay-50 p-4 text-sm text-clay-700">
              <p>{navigator.onLine ? `We could not load results: ${results.error.message}` : "You are offline. Results will load when you are back online."}</p>
              <Button type="button" variant="secondary" className="mt-3" onClick={() => void results.refetch()}>
                Try again
              </Button>
            </div>
          ) : items.length === 0 ? (
            <p className="rounded-card border border-dashed border-silt-300 p-6 text-center text-silt-600">
              Nobody matches within {params.radiusKm} km. Try a larger distance or fewer filters.
            </p>
          ) : (
            <>
              <p className="mb-3 text-sm text-silt-600" data-testid="result-count">
                {results.hasNextPage ? `${items.length}+` : items.length} within {params.radiusKm} km{params.place ? ` of ${params.place}` : ""},{" "}
                {params.sort === "trust" ? "most trusted first" : "nearest first"}
              </p>
              <ul className="space-y-3" data-testid="result-list">
                {items.map((item) => (
                  <ResultCard key={item.listingId} item={item} selected={selected === String(item.listingId)} onShowOnMap={() => { setSelected(String(item.listingId)); setTab("map"); }} />
                ))}
              </ul>
              {results.hasNextPage ? (
                <Button type="button" variant="secondary" className="mt-4 w-full" disabled={results.isFetchingNextPage} onClick={() => void results.fetchNextPage()}>
                  {results.isFetchingNextPage ? "Loading…" : "Show more"}
                </Button>
              ) : null}
            </>
          )}
        </section>
      </div>
      <div className={`${showMap ? "block" : "hidden"} h-[70vh] lg:h-auto lg:flex-1`} data-testid="finder-map">
        {showMap ? (
          <FinderMap center={{ lat: params.lat, lng: params.lng }} radiusKm={params.radiusKm} items={mapItems} hostedStyleUrl={hostedStyleUrl} selectedId={selected} onSelect={select} />
        ) : null}
      </div>
    </div>
  );
}
