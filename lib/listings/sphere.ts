import type { LatLng } from "@/lib/geo/coordinates";

/** Mean earth radius R1 = (2a + b) / 3 of WGS84 (IUGG), metres. */
export const MEAN_EARTH_RADIUS_M = 6_371_008.8;

/**
 * Bound on |ellipsoidal / spherical − 1| for any pair of points, with distances on the
 * sphere of radius MEAN_EARTH_RADIUS_M. Locally the ellipsoid's radius of curvature runs
 * from a(1 − e²) = 6 335 439 m (meridian at the equator, −0.56 %) to a²/b = 6 399 594 m
 * (at the poles, +0.45 %); longer paths average between. 0.6 % covers both with room,
 * and sphere.test.ts checks it against GeographicLib.
 */
export const SPHERICAL_RELATIVE_ERROR = 0.006;

const DEG = Math.PI / 180;

export type UnitVector = { x: number; y: number; z: number };

export function unitVector(p: LatLng): UnitVector {
  const lat = p.lat * DEG;
  const lng = p.lng * DEG;
  return { x: Math.cos(lat) * Math.cos(lng), y: Math.cos(lat) * Math.sin(lng), z: Math.sin(lat) };
}

/** Squared chord, on the unit sphere, of a great-circle distance in metres (monotonic up to half the globe). */
export function chordSquared(meters: number): number {
  const angle = Math.min(Math.max(meters, 0) / MEAN_EARTH_RADIUS_M, Math.PI);
  const chord = 2 * Math.sin(angle / 2);
  return chord * chord;
}

/** Great-circle distance in metres on the mean sphere from a squared unit chord. */
export function metersFromChordSquared(c2: number): number {
  const half = Math.min(1, Math.sqrt(Math.max(c2, 0)) / 2);
  return 2 * MEAN_EARTH_RADIUS_M * Math.asin(half);
}
