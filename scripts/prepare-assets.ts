import { copyFileSync, existsSync, mkdirSync } from "node:fs";
import { spawnSync } from "node:child_process";

// Build-time assets that come from npm packages rather than from the repository:
// maplibre's worker (bundling hides the one inside the library) and the offline
// basemap drawn from Natural Earth data.
mkdirSync("public", { recursive: true });
copyFileSync("node_modules/maplibre-gl/dist/maplibre-gl-worker.mjs", "public/maplibre-gl-worker.mjs");

if (!existsSync("public/basemap/land.json") || process.argv.includes("--force")) {
  const r = spawnSync(process.execPath, ["node_modules/tsx/dist/cli.mjs", "scripts/build-basemap.ts"], { stdio: "inherit" });
  if (r.status !== 0) process.exit(r.status ?? 1);
}
console.log("assets ready: maplibre worker, offline basemap");
