// Turns spherical polygons and lines (as world-atlas ships them, stitched across ±180° for
// d3-geo) into planar GeoJSON that a flat Web-Mercator map draws correctly:
// - a ring that crosses the antimeridian is unwrapped (longitudes made continuous) and cut into
//   pieces that each lie inside [−180°, 180°];
// - a ring that goes once around a pole (Antarctica's coast) is closed along the map's edge
//   through the pole, so its fill covers the land rather than the whole world outside it;
// - every polygon is also cut at the prime meridian, so no ring spans more than 180° of
//   longitude. A ring wider than that is legitimate on a flat map, but keeping every ring within
//   half the world makes a wrong wrap (a ring jumping the antimeridian) easy to detect.
// Cuts are invisible on the map: the pieces share their edges and the fill colour.
// Optionally each ring and line is simplified first (Douglas–Peucker, see simplify.ts).

import { simplifyMercator } from "./simplify";

export type Position2 = [number, number];
type Ring = Position2[];

export type PlanarOptions = {
  /** Decimal places kept in the output. */
  readonly decimals: number;
  /** Douglas–Peucker tolerance in degrees of longitude on a Mercator map; 0 keeps every point. */
  readonly tolerance?: number;
};

/** Points within this many degrees of a pole count as "at the pole" (world-atlas uses −89.999). */
const POLE_TOLERANCE_DEG = 0.01;
/** Points exactly on a cut line are nudged east by this much so every crossing is a proper one. */
const ON_LINE_NUDGE_DEG = 1e-9;
/** Strip edges closer than this to a ring's extent do not create an extra (empty) piece. */
const STRIP_EDGE_TOLERANCE_DEG = 1e-6;
/** Width of the strips polygons are cut into, aligned on the prime meridian and ±180°. */
const POLYGON_STRIP_DEG = 180;

/** Makes consecutive longitudes differ by at most 180°, taking the short way round each time. */
export function unwrapLongitudes(points: readonly (readonly number[])[]): Ring {
  const out: Ring = [];
  let previousRaw = 0;
  let previous = 0;
  for (const [index, point] of points.entries()) {
    const lng = point[0] ?? Number.NaN;
    const lat = point[1] ?? Number.NaN;
    if (!Number.isFinite(lng) || !Number.isFinite(lat)) throw new Error(`invalid position at index ${index}`);
    if (index === 0) {
      previous = lng;
    } else {
      let delta = lng - previousRaw;
      delta -= 360 * Math.round(delta / 360);
      previous += delta;
    }
    previousRaw = lng;
    out.push([previous, lat]);
  }
  return out;
}

/** Signed area in degrees² (shoelace); positive for counter-clockwise in (lng, lat). */
export function signedArea(ring: readonly Position2[]): number {
  let sum = 0;
  for (let i = 1; i < ring.length; i++) {
    const a = ring[i - 1];
    const b = ring[i];
    if (a === undefined || b === undefined) continue;
    sum += a[0] * b[1] - b[0] * a[1];
  }
  return sum / 2;
}

/** Ray-casting point-in-ring test (even-odd), for a closed ring. */
export function ringContains(ring: readonly Position2[], point: Position2): boolean {
  const [x, y] = point;
  let inside = false;
  for (let i = 1; i < ring.length; i++) {
    const a = ring[i - 1];
    const b = ring[i];
    if (a === undefined || b === undefined) continue;
    if (a[1] > y !== b[1] > y && x < ((b[0] - a[0]) * (y - a[1])) / (b[1] - a[1]) + a[0]) inside = !inside;
  }
  return inside;
}

function closeRing(points: Ring): Ring {
  const first = points[0];
  const last = points[points.length - 1];
  if (first !== undefined && last !== undefined && (first[0] !== last[0] || first[1] !== last[1])) {
    points.push([first[0], first[1]]);
  }
  return points;
}

/** Latitude where the segment a–b meets the meridian x0; symmetric in a and b so both sides agree. */
function crossingLatitude(a: Position2, b: Position2, x0: number): number {
  const [p, q] = a[0] < b[0] ? [a, b] : [b, a];
  return p[1] + ((x0 - p[0]) * (q[1] - p[1])) / (q[0] - p[0]);
}

/**
 * Clips a closed, simple ring to one side of the meridian x = x0 and returns the closed rings of
 * the part kept (possibly several, for a ring that crosses the line more than twice). The parts
 * are joined along the line by pairing the crossings in order of latitude: between the 1st and
 * 2nd crossing the line runs inside the ring, between the 2nd and 3rd outside, and so on.
 */
export function clipRing(ring: readonly Position2[], x0: number, keep: "east" | "west"): Ring[] {
  const points: Ring = ring
    .slice(0, -1)
    .map(([x, y]) => [x === x0 ? x0 + ON_LINE_NUDGE_DEG : x, y] as Position2);
  const n = points.length;
  const inside = (p: Position2) => (keep === "east" ? p[0] > x0 : p[0] < x0);
  const start = points.findIndex((p) => !inside(p));
  if (start === -1) return [closeRing(points)];
  if (points.every((p) => !inside(p))) return [];

  type Chain = Ring;
  const chains: Chain[] = [];
  let current: Chain | null = null;
  for (let i = 0; i < n; i++) {
    const a = points[(start + i) % n];
    const b = points[(start + i + 1) % n];
    if (a === undefined || b === undefined) continue;
    const aIn = inside(a);
    const bIn = inside(b);
    if (aIn && current !== null) current.push(a);
    if (aIn !== bIn) {
      const crossing: Position2 = [x0, crossingLatitude(a, b, x0)];
      if (!aIn) {
        current = [crossing];
      } else if (current !== null) {
        current.push(crossing);
        chains.push(current);
        current = null;
      }
    }
  }

  // Each chain enters at its first point and leaves at its last, both on the line.
  type End = { lat: number; chain: number; entry: boolean };
  const ends: End[] = [];
  chains.forEach((chain, index) => {
    const entry = chain[0];
    const exit = chain[chain.length - 1];
    if (entry === undefined || exit === undefined) return;
    ends.push({ lat: entry[1], chain: index, entry: true }, { lat: exit[1], chain: index, entry: false });
  });
  ends.sort((p, q) => p.lat - q.lat);
  const nextChain = new Map<number, number>();
  for (let i = 0; i + 1 < ends.length; i += 2) {
    const lower = ends[i];
    const upper = ends[i + 1];
    if (lower === undefined || upper === undefined || lower.entry === upper.entry) {
      throw new Error("clipRing: the ring is not simple (crossings do not alternate along the cut)");
    }
    const exit = lower.entry ? upper : lower;
    const entry = lower.entry ? lower : upper;
    nextChain.set(exit.chain, entry.chain);
  }

  const rings: Ring[] = [];
  const used = new Set<number>();
  for (let first = 0; first < chains.length; first++) {
    if (used.has(first)) continue;
    const out: Ring = [];
    let index: number | undefined = first;
    while (index !== undefined && !used.has(index)) {
      used.add(index);
      out.push(...(chains[index] ?? []));
      index = nextChain.get(index);
    }
    rings.push(closeRing(out));
  }
  return rings;
}

function roundValue(value: number, factor: number): number {
  const rounded = Math.round(value * factor) / factor;
  return rounded === 0 ? 0 : rounded;
}

/** Rounds, drops repeated points, and returns null for a ring too small to draw. */
function tidyRing(ring: readonly Position2[], decimals: number): Ring | null {
  const factor = 10 ** decimals;
  const out: Ring = [];
  for (const [x, y] of ring) {
    const point: Position2 = [roundValue(x, factor), roundValue(y, factor)];
    const last = out[out.length - 1];
    if (last === undefined || last[0] !== point[0] || last[1] !== point[1]) out.push(point);
  }
  closeRing(out);
  if (out.length < 4 || signedArea(out) === 0) return null;
  return out;
}

function orient(ring: Ring, counterClockwise: boolean): Ring {
  return signedArea(ring) > 0 === counterClockwise ? ring : ring.reverse();
}

function shiftRing(ring: readonly Position2[], dx: number): Ring {
  return ring.map(([x, y]) => [x + dx, y]);
}

function longitudeExtent(ring: readonly Position2[]): [number, number] {
  let min = Number.POSITIVE_INFINITY;
  let max = Number.NEGATIVE_INFINITY;
  for (const [x] of ring) {
    if (x < min) min = x;
    if (x > max) max = x;
  }
  return [min, max];
}

/** Which strips [k·w, (k+1)·w] a longitude range touches. */
function stripIndices(min: number, max: number, width: number): number[] {
  const first = Math.floor((min + STRIP_EDGE_TOLERANCE_DEG) / width);
  const last = Math.ceil((max - STRIP_EDGE_TOLERANCE_DEG) / width) - 1;
  const out: number[] = [];
  for (let k = first; k <= last; k++) out.push(k);
  return out;
}

/** The multiple of 360° that brings a strip starting at `west` back inside [−180°, 180°]. */
function stripShift(west: number, width: number): number {
  return -360 * Math.round((west + width / 2) / 360);
}

/**
 * Planar version of a spherical polygon (outer ring, then holes): a list of polygons, each with
 * its outer ring counter-clockwise and holes clockwise (RFC 7946 §3.1.6), every coordinate in
 * [−180, 180] × [−90, 90], rounded to `decimals`.
 */
export function planarPolygons(
  rings: readonly (readonly (readonly number[])[])[],
  options: PlanarOptions,
): Position2[][][] {
  const { decimals, tolerance = 0 } = options;
  const [outerRaw, ...holesRaw] = rings;
  if (outerRaw === undefined) return [];

  const unwrapped = unwrapLongitudes(outerRaw);
  const outer = simplifyMercator(unwrapped, tolerance);
  // Simplified to a sliver (an islet smaller than the tolerance): nothing to draw.
  if (outer.length < 4) return [];
  const turns = Math.round(((outer[outer.length - 1]?.[0] ?? 0) - (outer[0]?.[0] ?? 0)) / 360);
  if (turns !== 0) {
    if (Math.abs(turns) !== 1) throw new Error(`a ring winds ${turns} times around a pole`);
    // Close along the map's edge through the pole on the ring's own side of the equator.
    const meanLat = outer.reduce((s, p) => s + p[1], 0) / outer.length;
    const pole = meanLat < 0 ? -90 : 90;
    const first = outer[0];
    const last = outer[outer.length - 1];
    if (first === undefined || last === undefined) return [];
    outer.push([last[0], pole], [first[0], pole], [first[0], first[1]]);
  }

  const holes: Ring[] = [];
  for (const holeRaw of holesRaw) {
    const hole = simplifyMercator(unwrapLongitudes(holeRaw), tolerance);
    const holeTurns = Math.round(((hole[hole.length - 1]?.[0] ?? 0) - (hole[0]?.[0] ?? 0)) / 360);
    if (holeTurns !== 0) {
      // world-atlas keeps a tiny cap around the south pole (at −89.999°) as a hole so that
      // d3-geo fills Antarctica on the sphere. On the plane it is the pole line itself, which
      // Web Mercator does not show (it stops at ±85.05°), so it is dropped.
      if (hole.every(([, lat]) => 90 - Math.abs(lat) <= POLE_TOLERANCE_DEG)) continue;
      throw new Error("a hole goes around a pole; this basemap builder does not handle that");
    }
    if (hole.length >= 4) holes.push(hole);
  }

  const [minLng, maxLng] = longitudeExtent(outer);
  // Each ring was unwrapped from its own first point, so a hole may sit 360° away from where the
  // outer ring has it (the Caspian Sea in Eurasia, unwrapped westwards from 180°). Move each
  // hole by the multiple of 360° that puts it inside the outer ring.
  const placedHoles = holes.map((hole) => {
    const x = hole[0]?.[0] ?? 0;
    for (let m = Math.ceil((minLng - x) / 360); m <= Math.floor((maxLng - x) / 360); m++) {
      const moved = shiftRing(hole, 360 * m);
      const probe = moved[0];
      if (probe !== undefined && ringContains(outer, probe)) return moved;
    }
    throw new Error("a hole lies outside its polygon's outer ring");
  });
  const polygons: Position2[][][] = [];
  const holesPlaced = new Set<Ring>();
  for (const k of stripIndices(minLng, maxLng, POLYGON_STRIP_DEG)) {
    const west = k * POLYGON_STRIP_DEG;
    const east = west + POLYGON_STRIP_DEG;
    const shift = stripShift(west, POLYGON_STRIP_DEG);
    const pieces = clipRing(outer, west, "east").flatMap((piece) => clipRing(piece, east, "west"));
    const stripHoles = placedHoles.filter((hole) => {
      const [holeMin, holeMax] = longitudeExtent(hole);
      if (holeMin < west && holeMax > west) throw new Error("a hole crosses a cut line");
      if (holeMin < east && holeMax > east) throw new Error("a hole crosses a cut line");
      return holeMin >= west && holeMax <= east;
    });
    for (const piece of pieces) {
      const outerRing = tidyRing(shiftRing(piece, shift), decimals);
      if (outerRing === null) continue;
      const polygon: Ring[] = [orient(outerRing, true)];
      for (const hole of stripHoles) {
        const firstPoint = hole[0];
        if (firstPoint === undefined || !ringContains(piece, firstPoint)) continue;
        holesPlaced.add(hole);
        const holeRing = tidyRing(shiftRing(hole, shift), decimals);
        if (holeRing !== null) polygon.push(orient(holeRing, false));
      }
      polygons.push(polygon);
    }
  }
  // A hole that found no piece would silently turn a lake into land: fail the build instead.
  if (holesPlaced.size !== placedHoles.length) throw new Error("a hole was not placed in any piece of its polygon");
  return polygons;
}

/**
 * Planar version of a spherical line: cut wherever it crosses ±180°, each part shifted back
 * inside [−180, 180], rounded to `decimals`.
 */
export function planarLines(line: readonly (readonly number[])[], options: PlanarOptions): Position2[][] {
  const { decimals, tolerance = 0 } = options;
  const points = simplifyMercator(unwrapLongitudes(line), tolerance);
  const factor = 10 ** decimals;
  const parts: Position2[][] = [];
  let current: Position2[] = [];
  // Strip k holds longitudes in [−180 + 360k, 180 + 360k].
  const stripOf = (x: number) => Math.floor((x + 180) / 360);
  const push = (x: number, y: number, k: number) => {
    const point: Position2 = [roundValue(x - 360 * k, factor), roundValue(y, factor)];
    const last = current[current.length - 1];
    if (last === undefined || last[0] !== point[0] || last[1] !== point[1]) current.push(point);
  };
  const finish = () => {
    if (current.length >= 2) parts.push(current);
    current = [];
  };

  let previous: Position2 | undefined;
  let k = 0;
  for (const point of points) {
    if (previous === undefined) {
      k = stripOf(point[0]);
      push(point[0], point[1], k);
    } else {
      let target = stripOf(point[0]);
      while (target !== k) {
        // Leave through the strip's east or west edge, then carry on in the next strip.
        const edge = target > k ? 180 + 360 * k : -180 + 360 * k;
        const lat = crossingLatitude(previous, point, edge);
        push(edge, lat, k);
        finish();
        k += target > k ? 1 : -1;
        push(edge, lat, k);
        target = stripOf(point[0]);
      }
      push(point[0], point[1], k);
    }
    previous = point;
  }
  finish();
  return parts;
}
