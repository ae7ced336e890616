import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  APPROXIMATE_PLACE_GRID_METERS,
  assertValidPoint,
  isValidPoint,
  normalizeLongitude,
  roundCoordinate,
} from "./coordinates";
import { between, referenceDistance } from "./geographiclib.test-helper";

describe("coordinate validation", () => {
  it("accepts latitudes in [-90, 90] and any finite longitude", () => {
    expect(isValidPoint({ lat: -90, lng: 0 })).toBe(true);
    expect(isValidPoint({ lat: 90, lng: 540 })).toBe(true);
    expect(isValidPoint({ lat: 90.0001, lng: 0 })).toBe(false);
    expect(isValidPoint({ lat: 0, lng: Number.NaN })).toBe(false);
    expect(() => assertValidPoint({ lat: -91, lng: 0 }, "home")).toThrow(/home\.lat/);
  });

  it("wraps longitudes into [-180, 180)", () => {
    expect(normalizeLongitude(190)).toBe(-170);
    expect(normalizeLongitude(180)).toBe(-180);
    expect(normalizeLongitude(-180)).toBe(-180);
    expect(normalizeLongitude(-190)).toBe(170);
    expect(normalizeLongitude(720 + 28.25)).toBeCloseTo(28.25, 10);
    expect(Object.is(normalizeLongitude(-360), 0)).toBe(true);
  });
});

describe("roundCoordinate hides the exact place", () => {
  const nearby = fc.record({
    lat: between(-70, 70),
    lng: between(-180, 180),
  });
  const gridMeters = between(100, 10_000);

  it("moves a point by at most about half a cell diagonal (measured with GeographicLib)", () => {
    fc.assert(
      fc.property(nearby, gridMeters, (point, meters) => {
        const snapped = roundCoordinate(point, meters);
        // Half the diagonal of a cell that is at most ~1 % larger than asked is < 0.72·meters.
        return referenceDistance(point.lat, point.lng, snapped.lat, snapped.lng) <= 0.75 * meters;
      }),
      { numRuns: 1000 },
    );
  });

  it("gives the same answer for the snapped point (cells do not drift)", () => {
    fc.assert(
      fc.property(nearby, gridMeters, (point, meters) => {
        const snapped = roundCoordinate(point, meters);
        expect(roundCoordinate(snapped, meters)).toEqual(snapped);
      }),
      { numRuns: 500 },
    );
  });

  it("never yields two places closer than the grid size (cells are at least that large)", () => {
    fc.assert(
      fc.property(
        between(-85, 85),
        between(-180, 180),
        between(-0.05, 0.05),
        between(-0.05, 0.05),
        between(200, 5_000),
        (lat, lng, dLat, dLng, meters) => {
          const a = roundCoordinate({ lat, lng }, meters);
          const b = roundCoordinate({ lat: Math.max(-90, Math.min(90, lat + dLat)), lng: lng + dLng }, meters);
          const apart = referenceDistance(a.lat, a.lng, b.lat, b.lng);
          // Snapped coordinates keep 6 decimals (~0.1 m), hence the 0.5 m slack.
          return apart === 0 || apart >= meters - 0.5;
        },
      ),
      { numRuns: 2000 },
    );
  });

  it("maps points near the antimeridian on both sides consistently", () => {
    const west = roundCoordinate({ lat: -17.7, lng: 179.9999 }, APPROXIMATE_PLACE_GRID_METERS);
    const east = roundCoordinate({ lat: -17.7, lng: -179.9999 }, APPROXIMATE_PLACE_GRID_METERS);
    expect(west.lng).toBeGreaterThan(179);
    expect(east.lng).toBeLessThan(-179);
    const apart = referenceDistance(west.lat, west.lng, east.lat, east.lng);
    expect(apart).toBeGreaterThanOrEqual(APPROXIMATE_PLACE_GRID_METERS - 0.5);
    expect(apart).toBeLessThan(1.1 * APPROXIMATE_PLACE_GRID_METERS);
  });

  it("refuses a non-positive grid size", () => {
    expect(() => roundCoordinate({ lat: 0, lng: 0 }, 0)).toThrow(RangeError);
  });
});
