// Where the offline basemap is served from. Kept apart from basemap.ts so the browser bundle that
// imports the style does not pull in the build-time TopoJSON code.

/** URL path of the basemap folder; the files live in public/basemap/. */
export const BASEMAP_PUBLIC_PATH = "/basemap";
/** One GeoJSON file per layer. */
export const BASEMAP_FILES = { land: "land.json", borders: "borders.json" } as const;
