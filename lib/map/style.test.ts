import { createRequire } from "node:module";
import type { StyleSpecification } from "maplibre-gl";
import { describe, expect, it } from "vitest";
import { BASEMAP_FILES, BASEMAP_PUBLIC_PATH } from "./basemap-files";
import { buildOfflineStyle, resolveMapStyle } from "./style";

// Validate with the style-spec package maplibre-gl itself depends on (a nested copy; another,
// older one is hoisted for @vis.gl/react-maplibre), resolved from maplibre-gl's own folder.
type StyleSpecModule = { validateStyleMin: (style: StyleSpecification) => { message: string }[] };
const require = createRequire(import.meta.url);
const requireFromMaplibre = createRequire(require.resolve("maplibre-gl/package.json"));
const styleSpec = requireFromMaplibre("@maplibre/maplibre-gl-style-spec") as StyleSpecModule;

describe("buildOfflineStyle", () => {
  const style = buildOfflineStyle("http://127.0.0.1:3000/");

  it("passes maplibre's style validation", () => {
    expect(styleSpec.validateStyleMin(style)).toEqual([]);
  });

  it("the validator does reject a broken style (so the check above can fail)", () => {
    const broken = {
      ...style,
      layers: [
        ...style.layers,
        { id: "lakes", type: "fill", source: "lakes", paint: { "fill-color": "not-a-colour" } },
      ],
    } as StyleSpecification;
    const messages = styleSpec.validateStyleMin(broken).map((e) => e.message).join("\n");
    expect(messages).toMatch(/source "lakes" not found/);
  });

  it("has no text or icon layers, glyphs or sprite (those need a server)", () => {
    expect(style.layers.some((layer) => layer.type === "symbol")).toBe(false);
    expect(style.glyphs).toBeUndefined();
    expect(style.sprite).toBeUndefined();
  });

  it("uses only our GeoJSON files as sources", () => {
    const urls = Object.values(style.sources).map((source) => {
      expect(source.type).toBe("geojson");
      return source.type === "geojson" ? source.data : null;
    });
    expect(urls.sort()).toEqual(
      Object.values(BASEMAP_FILES)
        .map((file) => `http://127.0.0.1:3000${BASEMAP_PUBLIC_PATH}/${file}`)
        .sort(),
    );
  });

  it("draws water as the background under land and borders", () => {
    expect(style.layers.map((layer) => layer.type)).toEqual(["background", "fill", "line"]);
  });

  it("uses root-relative URLs without an origin", () => {
    const land = buildOfflineStyle().sources.land;
    expect(land?.type === "geojson" ? land.data : null).toBe(`${BASEMAP_PUBLIC_PATH}/${BASEMAP_FILES.land}`);
  });
});

describe("resolveMapStyle", () => {
  it("returns MAP_STYLE_URL when set", () => {
    expect(resolveMapStyle({ MAP_STYLE_URL: " https://tiles.example.test/style.json " })).toBe(
      "https://tiles.example.test/style.json",
    );
  });

  it("falls back to the offline style when MAP_STYLE_URL is missing or blank", () => {
    expect(resolveMapStyle({})).toEqual(buildOfflineStyle());
    expect(resolveMapStyle({ MAP_STYLE_URL: "  " }, "http://localhost:3000")).toEqual(
      buildOfflineStyle("http://localhost:3000"),
    );
  });
});
