import { existsSync, readFileSync } from "node:fs";
import { createRequire } from "node:module";
import { join } from "node:path";
import type { Position } from "geojson";
import { feature } from "topojson-client";
import { describe, expect, it } from "vitest";
import { referenceGeodesic } from "../geo/geographiclib.test-helper";
import { asTopology, buildBasemap, type Basemap } from "./basemap";
import { BASEMAP_FILES, BASEMAP_PUBLIC_PATH } from "./basemap-files";

const require = createRequire(import.meta.url);
const readTopology = (file: string) =>
  asTopology(JSON.parse(readFileSync(require.resolve(`world-atlas/${file}`), "utf8")), file);
const landTopology = readTopology("land-50m.json");
const countriesTopology = readTopology("countries-50m.json");
const basemap = buildBasemap(landTopology, countriesTopology);
const unsimplified = buildBasemap(landTopology, countriesTopology, { tolerance: 0 });

function polygonsOf(map: Basemap): Position[][][] {
  return map.land.features.flatMap((f) => f.geometry.coordinates);
}

/** Shoelace area in degrees², positive counter-clockwise. */
function planarSignedArea(ring: Position[]): number {
  let sum = 0;
  for (let i = 1; i < ring.length; i++) {
    const a = ring[i - 1] ?? [0, 0];
    const b = ring[i] ?? [0, 0];
    sum += (a[0] ?? 0) * (b[1] ?? 0) - (b[0] ?? 0) * (a[1] ?? 0);
  }
  return sum / 2;
}

function inRing(ring: Position[], lng: number, lat: number): boolean {
  let inside = false;
  for (let i = 1; i < ring.length; i++) {
    const [ax = 0, ay = 0] = ring[i - 1] ?? [];
    const [bx = 0, by = 0] = ring[i] ?? [];
    if (ay > lat !== by > lat && lng < ((bx - ax) * (lat - ay)) / (by - ay) + ax) inside = !inside;
  }
  return inside;
}

function isLand(map: Basemap, lng: number, lat: number): boolean {
  return polygonsOf(map).some(
    ([outer, ...holes]) => outer !== undefined && inRing(outer, lng, lat) && !holes.some((h) => inRing(h, lng, lat)),
  );
}

describe("offline basemap: land polygons are valid for a flat map", () => {
  const polygons = polygonsOf(basemap);

  it("is a GeoJSON FeatureCollection of MultiPolygons with plenty of polygons", () => {
    expect(basemap.land.type).toBe("FeatureCollection");
    expect(basemap.land.features.every((f) => f.type === "Feature" && f.geometry.type === "MultiPolygon")).toBe(true);
    expect(polygons.length).toBeGreaterThan(1000);
  });

  it("has closed rings of at least 4 positions, inside ±180° × ±90°, none wider than 180°", () => {
    // Problems are collected rather than asserted one by one: there are ~40 000 positions.
    const problems: string[] = [];
    polygons.forEach((polygon, p) => {
      polygon.forEach((ring, r) => {
        const where = `polygon ${p} ring ${r}`;
        const first = ring[0];
        const last = ring[ring.length - 1];
        if (ring.length < 4) problems.push(`${where}: ${ring.length} positions`);
        if (first?.[0] !== last?.[0] || first?.[1] !== last?.[1]) problems.push(`${where}: not closed`);
        let min = Number.POSITIVE_INFINITY;
        let max = Number.NEGATIVE_INFINITY;
        for (const position of ring) {
          const [lng = Number.NaN, lat = Number.NaN] = position;
          if (position.length !== 2 || !(Math.abs(lng) <= 180) || !(Math.abs(lat) <= 90)) {
            problems.push(`${where}: bad position ${JSON.stringify(position)}`);
          }
          min = Math.min(min, lng);
          max = Math.max(max, lng);
        }
        if (max - min > 180) problems.push(`${where}: spans ${max - min}° of longitude`);
      });
    });
    expect(problems).toEqual([]);
  });

  it("winds exterior rings counter-clockwise and holes clockwise (RFC 7946 §3.1.6)", () => {
    for (const [outer, ...holes] of polygons) {
      expect(planarSignedArea(outer ?? [])).toBeGreaterThan(0);
      for (const hole of holes) expect(planarSignedArea(hole)).toBeLessThan(0);
    }
  });

  it("has land and sea where they are", () => {
    // Places chosen well inside land or open sea, so 1:50m generalisation cannot move them.
    expect(isLand(basemap, 28.28, -15.42)).toBe(true); // Lusaka
    expect(isLand(basemap, 15.3, -4.3)).toBe(true); // Kinshasa
    expect(isLand(basemap, 178.0, -17.8)).toBe(true); // Viti Levu, Fiji, west of 180°
    expect(isLand(basemap, -172.0, 66.0)).toBe(true); // Chukotka, east of 180°
    expect(isLand(basemap, 0, -80)).toBe(true); // Antarctica
    expect(isLand(basemap, 179.9, -85)).toBe(true); // Antarctica beside the antimeridian
    expect(isLand(basemap, -30, 0)).toBe(false); // Atlantic
    expect(isLand(basemap, 70, -30)).toBe(false); // Indian Ocean
    expect(isLand(basemap, 180, -60)).toBe(false); // Southern Ocean
    expect(isLand(basemap, 50.5, 42)).toBe(false); // Caspian Sea, a hole in Eurasia
  });
});

describe("offline basemap: nothing is lost or doubled by the cuts", () => {
  // Geodesic areas from GeographicLib (Karney 2013). The whole ellipsoid's area is
  // 2πa²·[1 + (1 − e²)/(2e)·ln((1 + e)/(1 − e))]; a ring's region is the smaller side.
  const { a, f } = referenceGeodesic;
  const e = Math.sqrt(f * (2 - f));
  const earth = 2 * Math.PI * a * a * (1 + ((1 - e * e) / (2 * e)) * Math.log((1 + e) / (1 - e)));
  const ringArea = (ring: Position[]) => {
    const polygon = referenceGeodesic.Polygon(false);
    for (const [lng = 0, lat = 0] of ring.slice(0, -1)) polygon.AddPoint(lat, lng);
    const signed = polygon.Compute(false, true).area ?? Number.NaN;
    const magnitude = Math.abs(signed) % earth;
    return Math.min(magnitude, earth - magnitude);
  };
  const polygonArea = ([outer, ...holes]: Position[][]) =>
    ringArea(outer ?? []) - holes.reduce((s, hole) => s + ringArea(hole), 0);

  it("keeps the total land area of the unsimplified data within 0.01 %", () => {
    const landObject = landTopology.objects.land;
    if (landObject === undefined) throw new Error("land-50m.json has no land object");
    const source = feature(landTopology, landObject);
    const sourceFeatures = source.type === "FeatureCollection" ? source.features : [source];
    let before = 0;
    for (const { geometry } of sourceFeatures) {
      if (geometry.type === "Polygon") before += polygonArea(geometry.coordinates);
      if (geometry.type === "MultiPolygon") for (const p of geometry.coordinates) before += polygonArea(p);
    }
    const after = polygonsOf(unsimplified).reduce((s, p) => s + polygonArea(p), 0);
    // Natural Earth's land is about 1.5e14 m² (a third of the earth's surface would be 1.7e14).
    expect(before).toBeGreaterThan(1.3e14);
    expect(before).toBeLessThan(1.6e14);
    expect(Math.abs(after - before) / before).toBeLessThan(1e-4);
  });

  it("changes the area by under 0.5 % with the default simplification", () => {
    const exact = polygonsOf(unsimplified);
    const simplified = polygonsOf(basemap);
    const sum = (ps: Position[][][]) => ps.reduce((s, p) => s + polygonArea(p), 0);
    expect(Math.abs(sum(simplified) - sum(exact)) / sum(exact)).toBeLessThan(5e-3);
  });
});

describe("offline basemap: borders", () => {
  const lines = basemap.borders.features.flatMap((f) => f.geometry.coordinates);

  it("are lines of 2+ positions that never jump across the antimeridian", () => {
    expect(lines.length).toBeGreaterThan(100);
    for (const line of lines) {
      expect(line.length).toBeGreaterThanOrEqual(2);
      for (let i = 1; i < line.length; i++) {
        expect(Math.abs((line[i]?.[0] ?? 0) - (line[i - 1]?.[0] ?? 0))).toBeLessThan(180);
      }
    }
  });

  it("include the borders around Zambia (the demo region)", () => {
    const inZambiaBox = lines.flat().filter(([lng = 0, lat = 0]) => lng > 22 && lng < 34 && lat > -18 && lat < -8);
    expect(inZambiaBox.length).toBeGreaterThan(50);
  });
});

describe("the built files in public/basemap", () => {
  const dir = join(process.cwd(), "public", BASEMAP_PUBLIC_PATH);
  const built = existsSync(join(dir, BASEMAP_FILES.land)) && existsSync(join(dir, BASEMAP_FILES.borders));

  // scripts/prepare-assets.ts builds them before the tests and before `next build`; they must be current.
  it("match a fresh build from world-atlas", () => {
    expect(built, "public/basemap is missing: run `npm run basemap`").toBe(true);
    const land: unknown = JSON.parse(readFileSync(join(dir, BASEMAP_FILES.land), "utf8"));
    const borders: unknown = JSON.parse(readFileSync(join(dir, BASEMAP_FILES.borders), "utf8"));
    expect(land).toEqual(basemap.land);
    expect(borders).toEqual(basemap.borders);
  });
});
