// Builds the offline basemap (land and country borders as planar GeoJSON) from Natural Earth
// TopoJSON as the world-atlas package ships it. Pure: the caller reads the files and writes the
// result (scripts/build-basemap.ts).
import type { Feature, FeatureCollection, MultiLineString, MultiPolygon } from "geojson";
import type { GeometryObject, Objects, Topology } from "topojson-specification";
import { feature, mesh } from "topojson-client";
import { planarLines, planarPolygons } from "./antimeridian";

/**
 * 4 decimals ≈ 11 m. world-atlas' 50m topology is quantised to about 0.0036° × 0.0017°
 * (its transform), so more decimals would only add bytes.
 */
export const BASEMAP_DECIMALS = 3;
/**
 * Douglas–Peucker tolerance in degrees of Mercator x: about two pixels at zoom 6 (360° / (256 × 2⁶)
 * = 0.022°). Chosen for phones on slow, costly data: the basemap is ~200 KiB gzipped instead of
 * ~340 KiB at 0.02° and 4 decimals (measured with the build script); closer in, the 1:50m
 * generalisation shows either way. 1:50m data is generalised for small scales; closer in, it shows
 * its own straight segments whether simplified or not.
 */
export const BASEMAP_TOLERANCE = 0.044;

export type BasemapOptions = { readonly decimals?: number; readonly tolerance?: number };

export type Basemap = {
  readonly land: FeatureCollection<MultiPolygon>;
  readonly borders: FeatureCollection<MultiLineString>;
};

/** world-atlas topologies: their objects carry no properties we use. */
export type AtlasTopology = Topology<Objects<Record<string, unknown>>>;

function objectOf(topology: AtlasTopology, name: string): GeometryObject<Record<string, unknown>> {
  const object = topology.objects[name];
  if (object === undefined) {
    throw new Error(`the topology has no object "${name}" (it has ${Object.keys(topology.objects).join(", ")})`);
  }
  return object;
}

function single<G extends MultiPolygon | MultiLineString>(geometry: G): FeatureCollection<G> {
  const only: Feature<G> = { type: "Feature", properties: {}, geometry };
  return { type: "FeatureCollection", features: [only] };
}

/**
 * @param landTopology world-atlas land-*.json (object "land")
 * @param countriesTopology world-atlas countries-*.json (object "countries")
 */
export function buildBasemap(
  landTopology: AtlasTopology,
  countriesTopology: AtlasTopology,
  { decimals = BASEMAP_DECIMALS, tolerance = BASEMAP_TOLERANCE }: BasemapOptions = {},
): Basemap {
  const options = { decimals, tolerance };
  const land = feature(landTopology, objectOf(landTopology, "land"));
  const landFeatures = land.type === "FeatureCollection" ? land.features : [land];
  const polygons: MultiPolygon["coordinates"] = [];
  for (const { geometry } of landFeatures) {
    if (geometry.type === "Polygon") {
      polygons.push(...planarPolygons(geometry.coordinates, options));
    } else if (geometry.type === "MultiPolygon") {
      for (const polygon of geometry.coordinates) polygons.push(...planarPolygons(polygon, options));
    } else {
      throw new Error(`unexpected ${geometry.type} in the land layer`);
    }
  }

  // Shared arcs only (a ≠ b): borders between two countries, not coastlines.
  const borderMesh = mesh(countriesTopology, objectOf(countriesTopology, "countries"), (a, b) => a !== b);
  const lines: MultiLineString["coordinates"] = borderMesh.coordinates.flatMap((line) => planarLines(line, options));

  return {
    land: single<MultiPolygon>({ type: "MultiPolygon", coordinates: polygons }),
    borders: single<MultiLineString>({ type: "MultiLineString", coordinates: lines }),
  };
}

/** Checks that parsed JSON looks like a TopoJSON topology before it is handed to topojson-client. */
export function asTopology(value: unknown, source: string): AtlasTopology {
  if (
    typeof value !== "object" ||
    value === null ||
    !("type" in value) ||
    value.type !== "Topology" ||
    !("objects" in value) ||
    typeof value.objects !== "object" ||
    !("arcs" in value) ||
    !Array.isArray(value.arcs)
  ) {
    throw new Error(`${source} is not a TopoJSON topology`);
  }
  return value as AtlasTopology;
}
