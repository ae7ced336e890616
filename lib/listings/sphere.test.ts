import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { between, referenceDestination, referenceDistance } from "@/lib/geo/geographiclib.test-helper";
import { chordSquared, metersFromChordSquared, SPHERICAL_RELATIVE_ERROR, unitVector } from "./sphere";

function sphericalMeters(a: { lat: number; lng: number }, b: { lat: number; lng: number }): number {
  const u = unitVector(a);
  const v = unitVector(b);
  return metersFromChordSquared((u.x - v.x) ** 2 + (u.y - v.y) ** 2 + (u.z - v.z) ** 2);
}

describe("the spherical pre-filter's error bound", () => {
  // Reference: GeographicLib (C. F. F. Karney, "Algorithms for geodesics", J. Geodesy 2013) on WGS84.
  it("holds for pairs from 1 m to 2 000 km at every latitude and azimuth", () => {
    fc.assert(
      fc.property(between(-89.5, 89.5), between(-180, 180), between(0, 360), between(0, 6.3), (lat, lng, azi, logKm) => {
        const meters = 10 ** logKm; // 1 m … 2 000 km
        const to = referenceDestination(lat, lng, azi, meters);
        const exact = referenceDistance(lat, lng, to.lat, to.lng);
        const ratio = exact / sphericalMeters({ lat, lng }, to);
        return Math.abs(ratio - 1) <= SPHERICAL_RELATIVE_ERROR;
      }),
      { numRuns: 5000 },
    );
  });

  it("is not wider than it needs to be: the extremes come within 0.1 % of it", () => {
    // North–south steps at the equator use the smallest radius of curvature a(1 − e²).
    const at = referenceDestination(0, 30, 0, 1000);
    const ratio = referenceDistance(0, 30, at.lat, at.lng) / sphericalMeters({ lat: 0, lng: 30 }, at);
    expect(1 - ratio).toBeGreaterThan(SPHERICAL_RELATIVE_ERROR - 0.001);
  });

  it("turns distances into chords and back", () => {
    for (const m of [0, 1, 1000, 123_456, 10_000_000]) expect(metersFromChordSquared(chordSquared(m))).toBeCloseTo(m, 3);
  });
});
