"use client";
import { setWorkerUrl, type StyleSpecification } from "maplibre-gl";
import { buildOfflineStyle } from "@/lib/map/style";

let workerSet = false;

/** Bundling hides maplibre's own worker; we serve a copy from /public (see scripts/prepare-assets.ts). */
export function prepareMapLibre(): void {
  if (workerSet) return;
  setWorkerUrl("/maplibre-gl-worker.mjs");
  workerSet = true;
}

export function mapStyle(hostedStyleUrl: string | null): string | StyleSpecification {
  return hostedStyleUrl ?? buildOfflineStyle(typeof window === "undefined" ? "" : window.location.origin);
}

/** A circle of the given radius as a GeoJSON polygon, for drawing only (spherical, 64 sides). */
export function circlePolygon(center: { lat: number; lng: number }, radiusKm: number): GeoJSON.Feature<GeoJSON.Polygon> {
  const R = 6371.0088; // mean earth radius, km (IUGG)
  const d = radiusKm / R;
  const lat1 = (center.lat * Math.PI) / 180;
  const lng1 = (center.lng * Math.PI) / 180;
  const ring: [number, number][] = [];
  for (let i = 0; i <= 64; i++) {
    const brng = (i / 64) * 2 * Math.PI;
    const lat2 = Math.asin(Math.sin(lat1) * Math.cos(d) + Math.cos(lat1) * Math.sin(d) * Math.cos(brng));
    const lng2 = lng1 + Math.atan2(Math.sin(brng) * Math.sin(d) * Math.cos(lat1), Math.cos(d) - Math.sin(lat1) * Math.sin(lat2));
    ring.push([(lng2 * 180) / Math.PI, (lat2 * 180) / Math.PI]);
  }
  return { type: "Feature", properties: {}, geometry: { type: "Polygon", coordinates: [ring] } };
}
