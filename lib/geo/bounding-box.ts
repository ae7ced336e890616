// A latitude/longitude box that contains every point within a radius of a centre, for an indexed
// SQL pre-filter (`lat BETWEEN … AND (lng BETWEEN … OR lng BETWEEN …)`); the exact distance is
// then checked with distanceMeters on the few rows that pass.

import { assertValidPoint, normalizeLongitude, WGS84, type LatLng } from "./coordinates";

export type LngRange = { readonly minLng: number; readonly maxLng: number };

export type BoundingBox = {
  readonly minLat: number;
  readonly maxLat: number;
  /** Western edge. Greater than maxLng when the box crosses the antimeridian. */
  readonly minLng: number;
  /** Eastern edge. */
  readonly maxLng: number;
  readonly crossesAntimeridian: boolean;
  /** One range, or two when the box crosses ±180°; each has minLng ≤ maxLng. */
  readonly lngRanges: readonly LngRange[];
};

const E2 = WGS84.f * (2 - WGS84.f);
const DEG = Math.PI / 180;
/**
 * Smallest meridian radius of curvature, a(1 − e²), reached at the equator. A path of length s
 * changes latitude by at most s / M_min radians, because ds ≥ M(φ)·|dφ| ≥ M_min·|dφ|.
 */
const MIN_MERIDIAN_RADIUS = WGS84.a * (1 - E2);
/**
 * Widening for rounding and for distanceMeters' own error (< 1 mm), so a point that
 * distanceMeters puts exactly on the radius is still inside the box.
 */
const RELATIVE_MARGIN = 1e-9;
const ABSOLUTE_MARGIN_METERS = 0.01;

/** Radius of the parallel at latitude φ (distance from the earth's axis), N(φ)·cos φ. */
function parallelRadius(latRad: number): number {
  const sin = Math.sin(latRad);
  return (WGS84.a * Math.cos(latRad)) / Math.sqrt(1 - E2 * sin * sin);
}

const FULL_LNG: readonly LngRange[] = [{ minLng: -180, maxLng: 180 }];

/**
 * Conservative box around `center`: every point within `radiusMeters` (geodesic, WGS84) lies in
 * it. Near the poles the box is clamped to ±90° and spans all longitudes once it reaches a pole.
 */
export function boundingBox(center: LatLng, radiusMeters: number): BoundingBox {
  assertValidPoint(center, "center");
  if (!Number.isFinite(radiusMeters) || radiusMeters < 0) {
    throw new RangeError(`radiusMeters must be a non-negative number, got ${radiusMeters}`);
  }
  const r = radiusMeters * (1 + RELATIVE_MARGIN) + ABSOLUTE_MARGIN_METERS;
  const dLat = r / MIN_MERIDIAN_RADIUS / DEG;
  const minLat = Math.max(-90, center.lat - dLat);
  const maxLat = Math.min(90, center.lat + dLat);

  if (minLat <= -90 || maxLat >= 90) {
    return { minLat, maxLat, minLng: -180, maxLng: 180, crossesAntimeridian: false, lngRanges: FULL_LNG };
  }

  // Every point of a path shorter than r stays inside [minLat, maxLat], where the parallel is
  // shortest at the latitude farthest from the equator; ds ≥ p(φ)·|dλ| then bounds |Δλ|.
  const farthestLat = Math.max(Math.abs(minLat), Math.abs(maxLat)) * DEG;
  const dLng = r / parallelRadius(farthestLat) / DEG;
  if (dLng >= 180) {
    return { minLat, maxLat, minLng: -180, maxLng: 180, crossesAntimeridian: false, lngRanges: FULL_LNG };
  }

  const lng = normalizeLongitude(center.lng);
  const west = lng - dLng;
  const east = lng + dLng;
  if (west < -180) {
    const minLng = west + 360;
    return {
      minLat,
      maxLat,
      minLng,
      maxLng: east,
      crossesAntimeridian: true,
      lngRanges: [
        { minLng, maxLng: 180 },
        { minLng: -180, maxLng: east },
      ],
    };
  }
  if (east > 180) {
    const maxLng = east - 360;
    return {
      minLat,
      maxLat,
      minLng: west,
      maxLng,
      crossesAntimeridian: true,
      lngRanges: [
        { minLng: west, maxLng: 180 },
        { minLng: -180, maxLng },
      ],
    };
  }
  return {
    minLat,
    maxLat,
    minLng: west,
    maxLng: east,
    crossesAntimeridian: false,
    lngRanges: [{ minLng: west, maxLng: east }],
  };
}

/** The same test the SQL pre-filter makes, for in-memory use. */
export function isInBoundingBox(box: BoundingBox, point: LatLng): boolean {
  if (point.lat < box.minLat || point.lat > box.maxLat) return false;
  const lng = normalizeLongitude(point.lng);
  // normalizeLongitude maps 180 to −180; both are the same meridian.
  return box.lngRanges.some(
    (range) => (lng >= range.minLng && lng <= range.maxLng) || (lng === -180 && range.maxLng === 180),
  );
}
