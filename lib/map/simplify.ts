// Douglas–Peucker simplification (D. H. Douglas & T. K. Peucker, "Algorithms for the reduction of
// the number of points required to represent a digitized line or its caricature", The Canadian
// Cartographer 10(2):112-122, 1973), measured in Web Mercator so that the tolerance is the same
// number of pixels everywhere on the map: at high latitudes Mercator stretches north-south
// distances by sec φ, so a tolerance in plain degrees would show as larger errors there.

type Position2 = [number, number];

const DEG = Math.PI / 180;
/** Mercator is infinite at the poles; rings here never come closer than this. */
const MAX_LAT = 89.9;

/** Web Mercator y in "degrees" (same scale as longitude on screen). */
function mercatorY(lat: number): number {
  const clamped = Math.max(-MAX_LAT, Math.min(MAX_LAT, lat));
  return Math.log(Math.tan(Math.PI / 4 + (clamped * DEG) / 2)) / DEG;
}

function distanceToSegmentSq(p: Position2, a: Position2, b: Position2): number {
  const dx = b[0] - a[0];
  const dy = b[1] - a[1];
  const lengthSq = dx * dx + dy * dy;
  let t = lengthSq === 0 ? 0 : ((p[0] - a[0]) * dx + (p[1] - a[1]) * dy) / lengthSq;
  t = Math.max(0, Math.min(1, t));
  const x = a[0] + t * dx - p[0];
  const y = a[1] + t * dy - p[1];
  return x * x + y * y;
}

/**
 * Keeps the points of a polyline (or a closed ring, whose first and last points are equal) that
 * are needed to stay within `tolerance` (degrees of longitude on a Mercator map). Endpoints are
 * always kept. `points` are [lng, lat]; longitudes may be unwrapped beyond ±180.
 */
export function simplifyMercator<P extends Position2>(points: readonly P[], tolerance: number): P[] {
  if (tolerance <= 0 || points.length <= 2) return [...points];
  const projected: Position2[] = points.map(([x, y]) => [x, mercatorY(y)]);
  const keep = new Uint8Array(points.length);
  keep[0] = 1;
  keep[points.length - 1] = 1;
  const toleranceSq = tolerance * tolerance;
  // An explicit stack rather than recursion: coastlines have thousands of points.
  const stack: [number, number][] = [[0, points.length - 1]];
  while (stack.length > 0) {
    const span = stack.pop();
    if (span === undefined) break;
    const [first, last] = span;
    const a = projected[first];
    const b = projected[last];
    if (a === undefined || b === undefined) continue;
    let farthest = -1;
    let farthestSq = toleranceSq;
    for (let i = first + 1; i < last; i++) {
      const p = projected[i];
      if (p === undefined) continue;
      const d = distanceToSegmentSq(p, a, b);
      if (d > farthestSq) {
        farthestSq = d;
        farthest = i;
      }
    }
    if (farthest !== -1) {
      keep[farthest] = 1;
      stack.push([first, farthest], [farthest, last]);
    }
  }
  return points.filter((_, i) => keep[i] === 1);
}
