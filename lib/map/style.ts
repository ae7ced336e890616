// The map's default style: only our own offline GeoJSON layers, no tile server, no glyphs or
// sprites (a text or icon layer would need a glyph server), so the map works with no network.
// A hosted style can replace it through MAP_STYLE_URL.
import type { StyleSpecification } from "maplibre-gl";
import { BASEMAP_FILES, BASEMAP_PUBLIC_PATH } from "./basemap-files";

/** Shoal's basemap colours: a calm teal sea, warm sand-coloured land, muted clay borders. */
export const BASEMAP_COLOURS = {
  water: "#a9d6cf",
  land: "#f5eedc",
  border: "#b59b7c",
} as const;

function basemapUrl(origin: string, file: string): string {
  return `${origin.replace(/\/+$/, "")}${BASEMAP_PUBLIC_PATH}/${file}`;
}

/**
 * @param origin prefix for the GeoJSON URLs, e.g. window.location.origin; empty for URLs
 *   relative to the site root (maplibre resolves those against the page).
 */
export function buildOfflineStyle(origin = ""): StyleSpecification {
  return {
    version: 8,
    name: "Shoal offline basemap",
    sources: {
      land: {
        type: "geojson",
        data: basemapUrl(origin, BASEMAP_FILES.land),
        // 1:50m data has no more detail to show past zoom 8; maplibre over-zooms from there.
        maxzoom: 8,
        attribution: "Natural Earth",
      },
      borders: {
        type: "geojson",
        data: basemapUrl(origin, BASEMAP_FILES.borders),
        maxzoom: 8,
      },
    },
    layers: [
      { id: "water", type: "background", paint: { "background-color": BASEMAP_COLOURS.water } },
      {
        id: "land",
        type: "fill",
        source: "land",
        paint: {
          "fill-color": BASEMAP_COLOURS.land,
          // The land is cut at 0° and ±180° (lib/map/antimeridian.ts); an outline in the fill's
          // own colour keeps those seams from showing.
          "fill-outline-color": BASEMAP_COLOURS.land,
        },
      },
      {
        id: "country-borders",
        type: "line",
        source: "borders",
        layout: { "line-join": "round", "line-cap": "round" },
        paint: {
          "line-color": BASEMAP_COLOURS.border,
          "line-width": ["interpolate", ["linear"], ["zoom"], 2, 0.5, 6, 1.2, 10, 2],
          "line-dasharray": [3, 2],
        },
      },
    ],
  };
}

export type MapStyleEnv = { readonly MAP_STYLE_URL?: string | undefined };

/** MAP_STYLE_URL when it is set (a hosted style), otherwise the offline style. */
export function resolveMapStyle(env: MapStyleEnv, origin = ""): string | StyleSpecification {
  const url = env.MAP_STYLE_URL?.trim();
  return url ? url : buildOfflineStyle(origin);
}
