// Test support (never imported by app code). Reference geodesics: GeographicLib (C. F. F. Karney, "Algorithms for geodesics",
// J. Geodesy 87:43-55, 2013), accurate to about 15 nanometres on WGS84.
// The package is a UMD bundle whose named exports Node's ESM loader cannot see, hence require.
import { createRequire } from "node:module";
import fc from "fast-check";

type GeodesicModule = typeof import("geographiclib-geodesic");

const require = createRequire(import.meta.url);
const geographiclib = require("geographiclib-geodesic") as GeodesicModule;

export const referenceGeodesic = geographiclib.Geodesic.WGS84;

/** Geodesic distance in metres between two points in degrees, from GeographicLib. */
export function referenceDistance(lat1: number, lng1: number, lat2: number, lng2: number): number {
  return referenceGeodesic.Inverse(lat1, lng1, lat2, lng2).s12 ?? Number.NaN;
}

/** The point reached from (lat, lng) after `meters` along azimuth `azimuth` (degrees). */
export function referenceDestination(lat: number, lng: number, azimuth: number, meters: number) {
  const r = referenceGeodesic.Direct(lat, lng, azimuth, meters);
  return { lat: r.lat2 ?? Number.NaN, lng: r.lon2 ?? Number.NaN };
}

/**
 * Numbers spread evenly over [min, max]. fc.double spreads its draws over the bit patterns of
 * doubles, so most land next to 0, which would leave most of the globe untested.
 */
export function between(min: number, max: number) {
  return fc.integer({ min: 0, max: 2 ** 30 }).map((i) => min + ((max - min) * i) / 2 ** 30);
}
