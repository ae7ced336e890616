// Builds the offline basemap into public/basemap/ from Natural Earth data in the world-atlas
// package (no network). Run: npx tsx scripts/build-basemap.ts
import { mkdirSync, readFileSync, writeFileSync } from "node:fs";
import { createRequire } from "node:module";
import { dirname, join, relative, resolve } from "node:path";
import { fileURLToPath } from "node:url";
import { gzipSync } from "node:zlib";
import { asTopology, buildBasemap } from "../lib/map/basemap";
import { BASEMAP_FILES, BASEMAP_PUBLIC_PATH } from "../lib/map/basemap-files";

const root = resolve(dirname(fileURLToPath(import.meta.url)), "..");
const require = createRequire(join(root, "package.json"));

function readTopology(file: string) {
  const path = require.resolve(`world-atlas/${file}`);
  return asTopology(JSON.parse(readFileSync(path, "utf8")), file);
}

// 1:50m: coasts and borders in the demo region (Zambia) read well at regional zooms, and the
// world stays at a few hundred KiB gzipped. (1:110m looks crude past zoom 5; 1:10m is ~5× larger.)
const basemap = buildBasemap(readTopology("land-50m.json"), readTopology("countries-50m.json"));

const outDir = join(root, "public", BASEMAP_PUBLIC_PATH);
mkdirSync(outDir, { recursive: true });

let rawTotal = 0;
let gzipTotal = 0;
const outputs = [
  [BASEMAP_FILES.land, basemap.land],
  [BASEMAP_FILES.borders, basemap.borders],
] as const;
for (const [file, collection] of outputs) {
  const json = JSON.stringify(collection);
  const path = join(outDir, file);
  writeFileSync(path, json);
  const raw = Buffer.byteLength(json);
  const gzipped = gzipSync(json, { level: 9 }).length;
  rawTotal += raw;
  gzipTotal += gzipped;
  console.log(`${relative(root, path)}: ${(raw / 1024).toFixed(1)} KiB raw, ${(gzipped / 1024).toFixed(1)} KiB gzipped`);
}
console.log(`basemap total: ${(rawTotal / 1024).toFixed(1)} KiB raw, ${(gzipTotal / 1024).toFixed(1)} KiB gzipped`);
