// Coordinates in decimal degrees on WGS84, as GeoJSON and the browser's geolocation give them.

/** A point in decimal degrees: latitude north positive, longitude east positive. */
export type LatLng = { readonly lat: number; readonly lng: number };

/**
 * WGS84 ellipsoid: semi-major axis a (m) and flattening f.
 * Source: NIMA TR8350.2 (WGS84 definition), as quoted in REFERENCE-VALUES §9.
 */
export const WGS84 = {
  a: 6_378_137,
  f: 1 / 298.257223563,
} as const;

export function isValidLatitude(lat: number): boolean {
  return Number.isFinite(lat) && lat >= -90 && lat <= 90;
}

/** Any finite longitude is accepted (−190 is the same meridian as 170); see normalizeLongitude. */
export function isValidLongitude(lng: number): boolean {
  return Number.isFinite(lng);
}

export function isValidPoint(point: LatLng): boolean {
  return isValidLatitude(point.lat) && isValidLongitude(point.lng);
}

/** Throws a RangeError naming the field, so a bad query parameter surfaces as a clear message. */
export function assertValidPoint(point: LatLng, name = "point"): void {
  if (!isValidLatitude(point.lat)) {
    throw new RangeError(`${name}.lat must be a number between -90 and 90, got ${point.lat}`);
  }
  if (!isValidLongitude(point.lng)) {
    throw new RangeError(`${name}.lng must be a finite number, got ${point.lng}`);
  }
}

/** Wraps a longitude into [−180, 180). */
export function normalizeLongitude(lng: number): number {
  const wrapped = ((((lng + 180) % 360) + 360) % 360) - 180;
  // Never -0, so results compare equal with Object.is and print as "0".
  return wrapped === 0 ? 0 : wrapped;
}

/**
 * Metres per degree used for the privacy grid, chosen so that a cell is never smaller than asked
 * (its height, and its width along its centre line):
 * the shortest degree of latitude is at the equator, where the meridian radius of curvature is
 * a(1 − e²); a degree of longitude at latitude φ is N(φ)·cos φ with N(φ) ≥ a, so a·cos φ
 * never overstates it.
 */
const E2 = WGS84.f * (2 - WGS84.f);
const MIN_METERS_PER_DEGREE_LAT = (WGS84.a * (1 - E2) * Math.PI) / 180;
const METERS_PER_DEGREE_LNG_AT_EQUATOR = (WGS84.a * Math.PI) / 180;

/**
 * Grid size for an "approximate place" (a home or farm shown on a public page). Our choice: about
 * a village block, enough to plan a visit without pointing at one house.
 */
export const APPROXIMATE_PLACE_GRID_METERS = 1_000;

/** Decimal places kept on snapped coordinates (~0.1 m): cell centres, without float noise. */
const SNAP_DECIMALS = 6;

function roundTo(value: number, decimals: number): number {
  const factor = 10 ** decimals;
  const rounded = Math.round(value * factor) / factor;
  return rounded === 0 ? 0 : rounded;
}

/**
 * Snaps a point to the centre of a grid cell about `meters` on a side, so an approximate place can
 * be shown without exposing where a home or farm is. The same input always gives the same cell,
 * so repeated requests cannot be averaged to recover the exact point. The longitude step is
 * taken at the snapped latitude (the cell's row), never at the exact one, for the same reason.
 */
export function roundCoordinate(point: LatLng, meters: number): LatLng {
  assertValidPoint(point);
  if (!Number.isFinite(meters) || meters <= 0) {
    throw new RangeError(`meters must be a positive number, got ${meters}`);
  }
  const latStep = Math.min(meters / MIN_METERS_PER_DEGREE_LAT, 180);
  // Rows are counted from the south pole so that the grid is the same in both hemispheres.
  const rows = Math.max(1, Math.floor(180 / latStep));
  const rowHeight = 180 / rows;
  const row = Math.min(rows - 1, Math.floor((point.lat + 90) / rowHeight));
  const lat = -90 + (row + 0.5) * rowHeight;

  const cosLat = Math.cos((lat * Math.PI) / 180);
  const lngStepWanted = meters / (METERS_PER_DEGREE_LNG_AT_EQUATOR * Math.max(cosLat, 1e-12));
  // A whole number of columns per row keeps cells the same width across the antimeridian.
  const columns = Math.max(1, Math.floor(360 / Math.min(lngStepWanted, 360)));
  const columnWidth = 360 / columns;
  const column = Math.min(columns - 1, Math.floor((normalizeLongitude(point.lng) + 180) / columnWidth));
  const lng = -180 + (column + 0.5) * columnWidth;

  return { lat: roundTo(lat, SNAP_DECIMALS), lng: roundTo(lng, SNAP_DECIMALS) };
}
