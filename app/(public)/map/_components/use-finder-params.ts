"use client";
import { usePathname, useRouter, useSearchParams } from "next/navigation";
import { useCallback, useEffect, useMemo, useRef } from "react";
import { DEFAULT_PLACE } from "@/lib/places/gazetteer";

export type FinderParams = {
  lat: number;
  lng: number;
  place: string;
  radiusKm: number;
  kind: "all" | "hatchery" | "builder";
  tankType: string[];
  species: string[];
  verified: boolean;
  readyNow: boolean;
  sort: "distance" | "trust";
};

const RADII = [10, 25, 50, 100, 200] as const;
export const RADIUS_CHOICES = RADII;

function num(v: string | null, fallback: number, min: number, max: number): number {
  const n = v === null ? Number.NaN : Number(v);
  return Number.isFinite(n) && n >= min && n <= max ? n : fallback;
}

/** The finder's filters live in the URL, so a search can be shared and reloaded. */
export function useFinderParams(): [FinderParams, (next: Partial<FinderParams>) => void] {
  const search = useSearchParams();
  const router = useRouter();
  const pathname = usePathname();
  const params = useMemo<FinderParams>(() => {
    const kind = search.get("kind");
    return {
      lat: num(search.get("lat"), DEFAULT_PLACE.lat, -90, 90),
      lng: num(search.get("lng"), DEFAULT_PLACE.lng, -180, 180),
      place: search.get("place") ?? (search.get("lat") ? "" : DEFAULT_PLACE.name),
      radiusKm: num(search.get("radiusKm"), 50, 1, 500),
      kind: kind === "hatchery" || kind === "builder" ? kind : "all",
      tankType: search.getAll("tankType").filter((t) => ["tarpaulin", "concrete", "earthen"].includes(t)),
      species: search.getAll("species").filter((s) => ["tilapia", "catfish"].includes(s)),
      verified: search.get("verified") === "true",
      readyNow: search.get("readyNow") === "true",
      sort: search.get("sort") === "trust" ? "trust" : "distance",
    };
  }, [search]);

  // Two quick taps (a kind chip, then a tank type) must not undo each other: until the URL shows the last
  // change, the next one builds on that change rather than on the URL it has not reached yet.
  const pending = useRef<{ params: FinderParams; queries: string[] } | null>(null);
  useEffect(() => {
    const p = pending.current;
    if (!p) return;
    const at = p.queries.indexOf(search.toString());
    // The last change arrived, or the URL moved for another reason (back button): build on the URL again.
    if (at === -1 || at === p.queries.length - 1) pending.current = null;
    else p.queries = p.queries.slice(at + 1);
  }, [search]);

  const update = useCallback(
    (next: Partial<FinderParams>) => {
      const merged = { ...(pending.current?.params ?? params), ...next };
      const q = new URLSearchParams();
      q.set("lat", merged.lat.toFixed(4));
      q.set("lng", merged.lng.toFixed(4));
      if (merged.place) q.set("place", merged.place);
      q.set("radiusKm", String(merged.radiusKm));
      if (merged.kind !== "all") q.set("kind", merged.kind);
      for (const t of merged.tankType) q.append("tankType", t);
      for (const s of merged.species) q.append("species", s);
      if (merged.verified) q.set("verified", "true");
      if (merged.readyNow) q.set("readyNow", "true");
      if (merged.sort !== "distance") q.set("sort", merged.sort);
      pending.current = { params: merged, queries: [...(pending.current?.queries ?? []), q.toString()] };
      router.replace(`${pathname}?${q.toString()}`, { scroll: false });
    },
    [params, pathname, router],
  );
  return [params, update];
}

/** The API query string for a set of filters (without cursor). */
export function apiQuery(p: FinderParams): string {
  const q = new URLSearchParams({ lat: String(p.lat), lng: String(p.lng), radiusKm: String(p.radiusKm), kind: p.kind, sort: p.sort, limit: "30" });
  for (const t of p.tankType) q.append("tankType", t);
  for (const s of p.species) q.append("species", s);
  if (p.verified) q.set("verified", "true");
  if (p.readyNow) q.set("readyNow", "true");
  return q.toString();
}
