import { describe, expect, it } from "vitest";
import { clipRing, planarLines, planarPolygons, signedArea, unwrapLongitudes, type Position2 } from "./antimeridian";
import { simplifyMercator } from "./simplify";

// Expected values here are exact plane geometry (areas of rectangles in degrees²).
const options = { decimals: 6 };
const area = (rings: Position2[][]) => rings.reduce((s, ring, i) => s + (i === 0 ? 1 : -1) * Math.abs(signedArea(ring)), 0);
const totalArea = (polygons: Position2[][][]) => polygons.reduce((s, p) => s + area(p), 0);

function expectPlanar(polygons: Position2[][][]) {
  for (const polygon of polygons) {
    polygon.forEach((ring, index) => {
      expect(ring.length).toBeGreaterThanOrEqual(4);
      expect(ring[0]).toEqual(ring[ring.length - 1]);
      for (const [lng, lat] of ring) {
        expect(lng).toBeGreaterThanOrEqual(-180);
        expect(lng).toBeLessThanOrEqual(180);
        expect(Math.abs(lat)).toBeLessThanOrEqual(90);
      }
      const lngs = ring.map(([lng]) => lng);
      expect(Math.max(...lngs) - Math.min(...lngs)).toBeLessThanOrEqual(180);
      // RFC 7946 §3.1.6: exterior rings counter-clockwise, holes clockwise.
      expect(signedArea(ring) > 0).toBe(index === 0);
    });
  }
}

describe("unwrapLongitudes", () => {
  it("takes the short way across ±180°", () => {
    expect(unwrapLongitudes([[170, 0], [-170, 0], [-160, 1]])).toEqual([[170, 0], [190, 0], [200, 1]]);
    expect(unwrapLongitudes([[-179, 5], [179, 5]])).toEqual([[-179, 5], [-181, 5]]);
  });
});

describe("clipRing", () => {
  // A "C" open to the west: [-10, 10] × [0, 10] without the notch [-10, 5] × [3, 7].
  const cShape: Position2[] = [
    [-10, 0], [10, 0], [10, 10], [-10, 10], [-10, 7], [5, 7], [5, 3], [-10, 3], [-10, 0],
  ];

  it("splits a concave ring into separate pieces where the cut crosses it four times", () => {
    const west = clipRing(cShape, 0, "west");
    expect(west).toHaveLength(2);
    expect(west.map((r) => Math.abs(signedArea(r))).sort()).toEqual([30, 30]);
    const east = clipRing(cShape, 0, "east");
    expect(east).toHaveLength(1);
    expect(Math.abs(signedArea(east[0] ?? []))).toBeCloseTo(80, 9);
  });

  it("keeps the whole ring or nothing when the cut misses it", () => {
    expect(clipRing(cShape, 20, "west")).toHaveLength(1);
    expect(clipRing(cShape, 20, "east")).toHaveLength(0);
  });
});

describe("planarPolygons", () => {
  it("cuts a rectangle that crosses the antimeridian into two pieces inside ±180°", () => {
    const ring = [[170, -10], [-170, -10], [-170, 10], [170, 10], [170, -10]];
    const polygons = planarPolygons([ring], options);
    expectPlanar(polygons);
    expect(polygons).toHaveLength(2);
    expect(polygons.map((p) => area(p)).sort()).toEqual([200, 200]);
    const wests = polygons.map((p) => Math.min(...(p[0] ?? []).map(([lng]) => lng))).sort((a, b) => a - b);
    expect(wests).toEqual([-180, 170]);
  });

  it("closes a ring around the south pole along the map's bottom edge", () => {
    // Eastwards around the pole at 70° S, like Antarctica's coast in world-atlas.
    const ring: number[][] = [];
    for (let lng = -180; lng <= 180; lng += 30) ring.push([lng, -70]);
    const polygons = planarPolygons([ring], options);
    expectPlanar(polygons);
    // The band from 70° S to the pole over all longitudes: 360 × 20.
    expect(totalArea(polygons)).toBeCloseTo(360 * 20, 6);
    expect(polygons.every((p) => (p[0] ?? []).some(([, lat]) => lat === -90))).toBe(true);
  });

  it("drops world-atlas' polar cap hole but keeps a real hole, clockwise", () => {
    const cap: number[][] = [];
    for (let lng = 180; lng >= -180; lng -= 45) cap.push([lng, -89.999]);
    const coast: number[][] = [];
    for (let lng = -180; lng <= 180; lng += 30) coast.push([lng, -70]);
    expect(totalArea(planarPolygons([coast, cap], options))).toBeCloseTo(7200, 6);

    const square = [[10, 10], [20, 10], [20, 20], [10, 20], [10, 10]];
    const lake = [[12, 12], [14, 12], [14, 14], [12, 14], [12, 12]];
    const [polygon, ...rest] = planarPolygons([square, lake], options);
    expect(rest).toHaveLength(0);
    expect(polygon).toHaveLength(2);
    expectPlanar(polygon ? [polygon] : []);
    expect(area(polygon ?? [])).toBe(100 - 4);
  });

  it("finds a hole that lies 360° away in the outer ring's unwrapped frame", () => {
    // The outer ring's first point is written as -181 (the meridian 179° E), so it unwraps to
    // longitudes between -210 and -181, while the hole stays at 160-162.
    const outer = [[-181, 0], [-181, 10], [150, 10], [150, 0], [-181, 0]];
    const hole = [[160, 2], [160, 4], [162, 4], [162, 2], [160, 2]];
    const polygons = planarPolygons([outer, hole], options);
    expectPlanar(polygons);
    const total = totalArea(polygons);
    expect(total).toBeCloseTo(29 * 10 - 4, 6);
    expect(polygons[0]).toHaveLength(2);
  });
});

describe("planarLines", () => {
  it("cuts a line where it crosses the antimeridian", () => {
    expect(planarLines([[170, 0], [-170, 10]], options)).toEqual([
      [[170, 0], [180, 5]],
      [[-180, 5], [-170, 10]],
    ]);
  });

  it("leaves a line that stays on one side alone", () => {
    expect(planarLines([[20, 0], [30, 5], [40, 0]], options)).toEqual([[[20, 0], [30, 5], [40, 0]]]);
  });
});

describe("simplifyMercator (Douglas & Peucker 1973)", () => {
  it("drops points on a straight line and keeps a corner", () => {
    const line: Position2[] = [[0, 0], [1, 0], [2, 0], [3, 0], [3, 3]];
    expect(simplifyMercator(line, 0.01)).toEqual([[0, 0], [3, 0], [3, 3]]);
  });

  it("measures in Mercator: the same bump counts sec φ times more at 80° than at the equator", () => {
    // Mercator's north-south scale is sec φ; sec 80° ≈ 5.76, so a 0.01° bump spans ~0.058° there.
    const bump = (lat: number): Position2[] => [[0, lat], [0.5, lat + 0.01], [1, lat]];
    expect(simplifyMercator(bump(0), 0.03)).toHaveLength(2);
    expect(simplifyMercator(bump(80), 0.03)).toHaveLength(3);
  });
});
