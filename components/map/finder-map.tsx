"use client";
import "maplibre-gl/dist/maplibre-gl.css";
import { Layer, Map, Marker, NavigationControl, Popup, Source, type MapRef } from "@vis.gl/react-maplibre";
import Link from "next/link";
import { useEffect, useMemo, useRef, useState } from "react";
import Supercluster from "supercluster";
import { TrustBadge } from "@/components/trust/trust-badge";
import type { TrustBadge as TrustBadgeData } from "@/lib/reviews/types";
import { circlePolygon, mapStyle, prepareMapLibre } from "./map-style";
import { ProviderMark } from "./provider-marker";

export type MapItem = { id: string; providerId: string; kind: "hatchery" | "builder"; name: string; lat: number; lng: number; distanceKm: number; verified: boolean; trust: TrustBadgeData };

type Props = {
  center: { lat: number; lng: number };
  radiusKm: number;
  items: MapItem[];
  hostedStyleUrl: string | null;
  selectedId: string | null;
  onSelect: (id: string | null) => void;
};

function zoomForRadius(radiusKm: number): number {
  // The search circle fills about half of a 700 px map (at zoom z a pixel is ~156 km / 2^z at the equator).
  return Math.max(3, Math.min(12, 10.5 - Math.log2(radiusKm / 10)));
}

/** The finder's map: our offline basemap, the search circle, and markers that cluster when zoomed out. */
export default function FinderMap({ center, radiusKm, items, hostedStyleUrl, selectedId, onSelect }: Props) {
  prepareMapLibre();
  const mapRef = useRef<MapRef>(null);
  const [view, setView] = useState<{ zoom: number; bounds: [number, number, number, number] } | null>(null);
  const style = useMemo(() => mapStyle(hostedStyleUrl), [hostedStyleUrl]);

  const index = useMemo(() => {
    const sc = new Supercluster<{ id: string }>({ radius: 48, maxZoom: 13 });
    sc.load(items.map((i) => ({ type: "Feature", properties: { id: i.id }, geometry: { type: "Point", coordinates: [i.lng, i.lat] } })));
    return sc;
  }, [items]);
  const byId = useMemo(() => new globalThis.Map(items.map((i) => [i.id, i])), [items]);

  useEffect(() => {
    mapRef.current?.flyTo({ center: [center.lng, center.lat], zoom: zoomForRadius(radiusKm), duration: 600 });
  }, [center.lat, center.lng, radiusKm]);

  const clusters = view ? index.getClusters(view.bounds, Math.round(view.zoom)) : [];
  const selected = selectedId ? byId.get(selectedId) : undefined;
  const popupLink = useRef<HTMLAnchorElement>(null);
  useEffect(() => {
    // The popup's content is mounted by the map a frame later.
    if (!selectedId) return;
    const frame = requestAnimationFrame(() => popupLink.current?.focus({ preventScroll: true }));
    return () => cancelAnimationFrame(frame);
  }, [selectedId]);

  function updateView() {
    const map = mapRef.current;
    if (!map) return;
    const b = map.getBounds();
    setView({ zoom: map.getZoom(), bounds: [b.getWest(), b.getSouth(), b.getEast(), b.getNorth()] });
  }

  return (
    <Map
      ref={mapRef}
      initialViewState={{ longitude: center.lng, latitude: center.lat, zoom: zoomForRadius(radiusKm) }}
      mapStyle={style}
      style={{ width: "100%", height: "100%" }}
      onLoad={updateView}
      onMoveEnd={updateView}
      attributionControl={{ compact: true }}
      dragRotate={false}
    >
      <NavigationControl position="top-right" showCompass={false} />
      <Source id="search-area" type="geojson" data={circlePolygon(center, radiusKm)}>
        <Layer id="search-area-fill" type="fill" paint={{ "fill-color": "#176d64", "fill-opacity": 0.06 }} />
        <Layer id="search-area-line" type="line" paint={{ "line-color": "#176d64", "line-width": 1.5, "line-dasharray": [2, 2] }} />
      </Source>
      <Marker longitude={center.lng} latitude={center.lat} anchor="center">
        <span className="block h-3.5 w-3.5 rounded-full border-2 border-white bg-silt-900 shadow" title="Search centre" />
      </Marker>
      {clusters.map((c) => {
        const [lng, lat] = c.geometry.coordinates as [number, number];
        const props = c.properties as { cluster?: boolean; cluster_id?: number; point_count?: number; id?: string };
        if (props.cluster && props.cluster_id !== undefined) {
          const clusterId = props.cluster_id;
          return (
            <Marker key={`c${clusterId}`} longitude={lng} latitude={lat} anchor="center">
              <button
                type="button"
                className="flex h-10 min-w-10 items-center justify-center rounded-full border-2 border-white bg-silt-800 px-2 text-sm font-semibold text-white shadow-card"
                aria-label={`${props.point_count} providers here; zoom in`}
                onClick={() => mapRef.current?.flyTo({ center: [lng, lat], zoom: Math.min(index.getClusterExpansionZoom(clusterId), 14) })}
              >
                {props.point_count}
              </button>
            </Marker>
          );
        }
        const item = props.id ? byId.get(props.id) : undefined;
        if (!item) return null;
        return (
          <Marker key={item.id} longitude={lng} latitude={lat} anchor="center">
            <button type="button" aria-label={`${item.name}, ${item.kind}, ${item.distanceKm} km`} onClick={() => onSelect(item.id)} data-testid="map-marker">
              <ProviderMark kind={item.kind} selected={item.id === selectedId} />
            </button>
          </Marker>
        );
      })}
      {selected ? (
        <Popup key={selected.id} longitude={selected.lng} latitude={selected.lat} anchor="bottom" offset={18} onClose={() => onSelect(null)} closeOnClick={false}>
          <div className="min-w-40 max-w-64 space-y-1 p-1 text-silt-900" data-testid="map-popup">
            <p className="font-semibold">{selected.name}</p>
            <p className="text-xs text-silt-600">
              {selected.kind === "hatchery" ? "Hatchery" : "Tank builder"} · {selected.distanceKm} km
            </p>
            <TrustBadge badge={selected.trust} role={selected.kind} />
            {/* Focus moves into the popup when it opens, so a keyboard user lands on what they asked for. */}
            <Link ref={popupLink} href={`/providers/${selected.providerId}`} className="text-sm font-semibold text-lagoon-700 underline underline-offset-2">
              Open profile
            </Link>
          </div>
        </Popup>
      ) : null}
    </Map>
  );
}
