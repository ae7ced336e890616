import { WGS84, type LatLng } from "@/lib/geo/coordinates";
import { distanceMeters } from "@/lib/geo/distance";

/*
 * Which builders a tank request reaches: those whose service radius, measured from their exact base point, covers
 * the site. The distance is the geodesic (straight-line, road-free) one on WGS84 (lib/geo/distance.ts); the same
 * figure prices the quote's travel line, so a builder never quotes travel for a distance other than the one shown.
 */

export type Reach = { distanceM: number; covered: boolean };

/** A site on the circle's edge is covered: "within 30 km" includes 30 km. */
export function reachOf(base: LatLng, serviceRadiusKm: number, site: LatLng): Reach {
  const distanceM = distanceMeters(base, site);
  return { distanceM, covered: Number.isFinite(serviceRadiusKm) && serviceRadiusKm > 0 && distanceM <= serviceRadiusKm * 1000 };
}

/**
 * Smallest length of a degree of latitude, at the equator: the meridian radius of curvature a(1 − e²) × π/180
 * (about 110 574 m). A path of length s changes latitude by at most s / that, so |Δlat| ≤ radius / that is a safe
 * SQL pre-filter: it can let far rows through (the exact distance drops them) but never drops a covered one.
 */
const E2 = WGS84.f * (2 - WGS84.f);
export const MIN_METRES_PER_DEGREE_LAT = (WGS84.a * (1 - E2) * Math.PI) / 180;

/** The latitude half-band, in degrees, that can hold a point within `radiusM`; widened by 1 m for rounding. */
export function latitudeBand(radiusM: number): number {
  return (radiusM + 1) / MIN_METRES_PER_DEGREE_LAT;
}

/** "12.3 km", "850 m": how far, as people read it. */
export function formatDistance(metres: number): string {
  if (metres < 1000) return `${Math.round(metres)} m`;
  return `${(metres / 1000).toFixed(metres < 100_000 ? 1 : 0)} km`;
}
