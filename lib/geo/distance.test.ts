import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { distanceMeters } from "./distance";
import { between, referenceDistance } from "./geographiclib.test-helper";

// Tolerance against GeographicLib (Karney 2013, ~15 nm accurate): 1 mm absolute, or 1e-10 of the
// distance when that is larger (2 mm at 20 000 km). Vincenty's series stays below ~0.1 mm.
const ABSOLUTE_TOLERANCE_M = 1e-3;
const RELATIVE_TOLERANCE = 1e-10;
const tolerance = (meters: number) => Math.max(ABSOLUTE_TOLERANCE_M, RELATIVE_TOLERANCE * meters);

type Pair = readonly [label: string, lat1: number, lng1: number, lat2: number, lng2: number];

// Hand-picked pairs; each expected value comes from GeographicLib at run time.
const PAIRS: readonly Pair[] = [
  // near the equator
  ["equator, 1° of longitude", 0, 0, 0, 1],
  ["equator, across the prime meridian", 0.5, -0.5, -0.5, 0.5],
  ["equator, 90° of longitude", 0, 10, 0, 100],
  ["Kampala to Kisumu (just off the equator)", 0.3476, 32.5825, -0.0917, 34.768],
  ["equator, 179° of longitude (still along the equator)", 0, 0, 0, 179],
  // across the antimeridian
  ["Fiji across 180°", -17.7, 179.9, -17.8, -179.9],
  ["Chukotka to Alaska", 65.7, 176.5, 64.5, -165.4],
  ["across 180° near the equator", 1, 179.5, -1, -179.5],
  ["same meridian written as 180 and -180", 10, 180, 11, -180],
  // short pairs (< 1 km)
  ["Lusaka, 10 m north", -15.4167, 28.2833, -15.41661, 28.2833],
  ["Lusaka, about 150 m diagonal", -15.4167, 28.2833, -15.4157, 28.2843],
  ["Lake Kariba shore, about 700 m", -16.5, 28.8, -16.505, 28.805],
  ["Kafue, 1 m east", -15.7667, 28.1833, -15.7667, 28.18331],
  ["high latitude, about 500 m", 69.65, 18.95, 69.654, 18.956],
  ["identical points", -12.8, 28.2, -12.8, 28.2],
  // regional and long pairs
  ["Lusaka to Ndola", -15.4167, 28.2833, -12.9587, 28.6366],
  ["Lusaka to Harare", -15.4167, 28.2833, -17.8292, 31.0522],
  ["Lusaka to Lilongwe", -15.4167, 28.2833, -13.9626, 33.7741],
  ["Cape Town to Cairo", -33.9249, 18.4241, 30.0444, 31.2357],
  ["Dakar to Mombasa", 14.7167, -17.4677, -4.0435, 39.6682],
  ["Lusaka to Lima", -15.4167, 28.2833, -12.0464, -77.0428],
  ["Sydney to London", -33.8688, 151.2093, 51.5072, -0.1276],
  // poles
  ["pole to pole", 90, 0, -90, 0],
  ["north pole to the equator", 90, 0, 0, 45],
  ["around the north pole", 89.9, 0, 89.9, 180],
  // nearly antipodal (Vincenty's iteration fails here; the fallback answers)
  ["exactly antipodal on the equator", 0, 0, 0, 180],
  ["nearly antipodal on the equator", 0, 0, 0.5, 179.5],
  ["nearly antipodal, off the equator", 20, 30, -20.3, -150.2],
  ["Lusaka to its antipode, nudged", -15.4167, 28.2833, 15.5, -151.8],
];

describe("distanceMeters against GeographicLib (Karney 2013)", () => {
  it("has at least 20 hand-picked pairs", () => {
    expect(PAIRS.length).toBeGreaterThanOrEqual(20);
  });

  it.each(PAIRS)("%s", (_label, lat1, lng1, lat2, lng2) => {
    const expected = referenceDistance(lat1, lng1, lat2, lng2);
    const actual = distanceMeters({ lat: lat1, lng: lng1 }, { lat: lat2, lng: lng2 });
    expect(Math.abs(actual - expected)).toBeLessThanOrEqual(tolerance(expected));
  });

  it("includes short pairs under 1 km (the pre-filter's edge cases live there)", () => {
    const short = PAIRS.filter(([, a, b, c, d]) => {
      const s = referenceDistance(a, b, c, d);
      return s > 0 && s < 1000;
    });
    expect(short.length).toBeGreaterThanOrEqual(4);
  });

  it("matches GeographicLib on random pairs anywhere on the globe", () => {
    fc.assert(
      fc.property(
        between(-90, 90),
        between(-180, 180),
        between(-90, 90),
        between(-180, 180),
        (lat1, lng1, lat2, lng2) => {
          const expected = referenceDistance(lat1, lng1, lat2, lng2);
          const actual = distanceMeters({ lat: lat1, lng: lng1 }, { lat: lat2, lng: lng2 });
          return Math.abs(actual - expected) <= tolerance(expected);
        },
      ),
      { numRuns: 2000 },
    );
  });

  it("matches GeographicLib on random short pairs (up to ~1 km)", () => {
    fc.assert(
      fc.property(
        between(-89, 89),
        between(-180, 180),
        between(-0.009, 0.009),
        between(-0.009, 0.009),
        (lat, lng, dLat, dLng) => {
          const expected = referenceDistance(lat, lng, lat + dLat, lng + dLng);
          const actual = distanceMeters({ lat, lng }, { lat: lat + dLat, lng: lng + dLng });
          return Math.abs(actual - expected) <= tolerance(expected);
        },
      ),
      { numRuns: 2000 },
    );
  });

  it("matches GeographicLib on random nearly antipodal pairs (the fallback)", () => {
    fc.assert(
      fc.property(
        between(-60, 60),
        between(-180, 180),
        between(-1, 1),
        between(-1, 1),
        (lat, lng, dLat, dLng) => {
          const lat2 = -lat + dLat;
          const lng2 = lng + 180 + dLng;
          const expected = referenceDistance(lat, lng, lat2, lng2);
          const actual = distanceMeters({ lat, lng }, { lat: lat2, lng: lng2 });
          return Math.abs(actual - expected) <= tolerance(expected);
        },
      ),
      { numRuns: 300 },
    );
  });
});

describe("distanceMeters against published values", () => {
  it("JFK to CDG is 5 853 226 m ± 0.5 m", () => {
    // GeographicLib's own test GeodSolve0 (geographiclib-python test_geodesic.py), REFERENCE-VALUES 9.1.
    const s = distanceMeters({ lat: 40.6, lng: -73.8 }, { lat: 49.01666667, lng: 2.55 });
    expect(Math.abs(s - 5_853_226)).toBeLessThanOrEqual(0.5);
  });
});

describe("distanceMeters properties", () => {
  it("is symmetric and zero for identical points", () => {
    fc.assert(
      fc.property(
        between(-90, 90),
        between(-180, 180),
        between(-90, 90),
        between(-180, 180),
        (lat1, lng1, lat2, lng2) => {
          const a = { lat: lat1, lng: lng1 };
          const b = { lat: lat2, lng: lng2 };
          const ab = distanceMeters(a, b);
          return Math.abs(ab - distanceMeters(b, a)) <= tolerance(ab) && distanceMeters(a, a) === 0;
        },
      ),
      { numRuns: 500 },
    );
  });

  it("treats longitudes 360° apart as the same meridian", () => {
    const a = { lat: -17.7, lng: 179.9 };
    expect(distanceMeters(a, { lat: -17.8, lng: -179.9 })).toBeCloseTo(
      distanceMeters(a, { lat: -17.8, lng: 180.1 }),
      6,
    );
  });

  it("refuses latitudes outside ±90° and non-finite numbers", () => {
    expect(() => distanceMeters({ lat: 91, lng: 0 }, { lat: 0, lng: 0 })).toThrow(RangeError);
    expect(() => distanceMeters({ lat: 0, lng: 0 }, { lat: Number.NaN, lng: 0 })).toThrow(/to\.lat/);
    expect(() => distanceMeters({ lat: 0, lng: Number.POSITIVE_INFINITY }, { lat: 0, lng: 0 })).toThrow(
      /from\.lng/,
    );
  });
});
