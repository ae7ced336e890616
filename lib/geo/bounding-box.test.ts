import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { boundingBox, isInBoundingBox } from "./bounding-box";
import { distanceMeters } from "./distance";
import { between, referenceDestination, referenceDistance } from "./geographiclib.test-helper";

const latitude = between(-90, 90);
const longitude = between(-180, 180);

describe("boundingBox contains every point within the radius", () => {
  it("for points placed by GeographicLib's direct solution (Karney 2013)", () => {
    fc.assert(
      fc.property(
        latitude,
        longitude,
        between(1, 3_000_000),
        between(0, 360),
        between(0, 1),
        (lat, lng, radius, azimuth, fraction) => {
          const box = boundingBox({ lat, lng }, radius);
          const point = referenceDestination(lat, lng, azimuth, radius * fraction);
          return isInBoundingBox(box, point);
        },
      ),
      { numRuns: 3000 },
    );
  });

  it("for points exactly on the radius, in every direction", () => {
    fc.assert(
      fc.property(
        latitude,
        longitude,
        between(1, 500_000),
        (lat, lng, radius) => {
          const box = boundingBox({ lat, lng }, radius);
          for (let azimuth = 0; azimuth < 360; azimuth += 7.5) {
            if (!isInBoundingBox(box, referenceDestination(lat, lng, azimuth, radius))) return false;
          }
          return true;
        },
      ),
      { numRuns: 300 },
    );
  });

  it("for random nearby points that distanceMeters puts inside the radius", () => {
    fc.assert(
      fc.property(
        between(-85, 85),
        longitude,
        between(100, 200_000),
        between(-3, 3),
        between(-3, 3),
        (lat, lng, radius, dLat, dLng) => {
          const center = { lat, lng };
          const point = { lat: Math.max(-90, Math.min(90, lat + dLat)), lng: lng + dLng };
          const box = boundingBox(center, radius);
          return distanceMeters(center, point) > radius || isInBoundingBox(box, point);
        },
      ),
      { numRuns: 3000 },
    );
  });
});

describe("boundingBox shape", () => {
  it("is tight near the equator (within 1 % of the true north-south extent)", () => {
    const box = boundingBox({ lat: 0, lng: 28 }, 10_000);
    const north = referenceDestination(0, 28, 0, 10_000).lat;
    expect(box.maxLat).toBeGreaterThanOrEqual(north);
    expect(box.maxLat).toBeLessThanOrEqual(north * 1.01);
  });

  it("over Zambia (Lusaka, 50 km) is a single range not much wider than needed", () => {
    const box = boundingBox({ lat: -15.4167, lng: 28.2833 }, 50_000);
    expect(box.crossesAntimeridian).toBe(false);
    expect(box.lngRanges).toHaveLength(1);
    const east = referenceDestination(-15.4167, 28.2833, 90, 50_000).lng;
    expect(box.maxLng).toBeGreaterThanOrEqual(east);
    expect(box.maxLng - 28.2833).toBeLessThanOrEqual((east - 28.2833) * 1.02);
  });

  it("splits into two longitude ranges across the antimeridian", () => {
    const box = boundingBox({ lat: -17.7, lng: 179.9 }, 50_000);
    expect(box.crossesAntimeridian).toBe(true);
    expect(box.minLng).toBeGreaterThan(box.maxLng);
    expect(box.lngRanges).toEqual([
      { minLng: box.minLng, maxLng: 180 },
      { minLng: -180, maxLng: box.maxLng },
    ]);
    // A point 20 km east, on the far side of 180°, is inside.
    const east = referenceDestination(-17.7, 179.9, 90, 20_000);
    expect(east.lng).toBeLessThan(0);
    expect(isInBoundingBox(box, east)).toBe(true);
    expect(isInBoundingBox(box, { lat: -17.7, lng: 0 })).toBe(false);
  });

  it("also splits when the centre is just east of the antimeridian", () => {
    const box = boundingBox({ lat: 65, lng: -179.95 }, 30_000);
    expect(box.crossesAntimeridian).toBe(true);
    expect(box.lngRanges[0]?.maxLng).toBe(180);
    expect(box.lngRanges[1]?.minLng).toBe(-180);
  });

  it("clamps at the pole and then spans every longitude", () => {
    const box = boundingBox({ lat: 89.8, lng: 10 }, 50_000);
    expect(box.maxLat).toBe(90);
    expect(box.lngRanges).toEqual([{ minLng: -180, maxLng: 180 }]);
    const across = referenceDestination(89.8, 10, 0, 40_000);
    expect(referenceDistance(89.8, 10, across.lat, across.lng)).toBeLessThan(50_000);
    expect(isInBoundingBox(box, across)).toBe(true);
  });

  it("refuses a negative or non-finite radius", () => {
    expect(() => boundingBox({ lat: 0, lng: 0 }, -1)).toThrow(RangeError);
    expect(() => boundingBox({ lat: 0, lng: 0 }, Number.NaN)).toThrow(RangeError);
    expect(() => boundingBox({ lat: 100, lng: 0 }, 10)).toThrow(/center\.lat/);
  });
});
