import { existsSync, readFileSync } from "node:fs";
import { join } from "node:path";
import { runInNewContext } from "node:vm";
import { gzipSync } from "node:zlib";

/*
 * First-load JavaScript of a route, read from the production build rather than from the network: the framework
 * chunks every page starts with (build-manifest.json rootMainFiles) plus the chunks of each segment of the route
 * (layouts, error boundaries and the page: entryJSFiles of the route's client reference manifest), each gzipped
 * with node's zlib at level 9. Chunks a page imports later (next/dynamic, the map library) are not counted:
 * they are not part of the first load, and the network figure beside this one shows them.
 * Works for Turbopack and webpack builds alike (both write the two manifests).
 */

export type FirstLoad = { route: string; bytes: number; frameworkBytes: number; files: { file: string; bytes: number }[] };

type BuildManifest = { rootMainFiles: string[]; polyfillFiles?: string[] };
type ClientReferenceManifest = { entryJSFiles?: Record<string, string[]>; clientModules?: Record<string, { chunks: string[]; async?: boolean }> };

/** Segment files whose client code a visit loads (app router file conventions). */
const SEGMENT_KINDS = new Set(["layout", "template", "page", "error", "loading", "not-found", "forbidden", "unauthorized", "global-error"]);

export class FirstLoadReader {
  private readonly sizes = new Map<string, number>();
  private readonly root: string[];
  private readonly routes: { appPath: string; pattern: RegExp; dynamicSegments: number }[];

  constructor(private readonly distDir: string) {
    const manifest = JSON.parse(readFileSync(join(distDir, "build-manifest.json"), "utf8")) as BuildManifest;
    // Polyfill files are served with `nomodule`: a browser with ES modules (all we target) never fetches them.
    this.root = manifest.rootMainFiles;
    const appPaths = JSON.parse(readFileSync(join(distDir, "app-path-routes-manifest.json"), "utf8")) as Record<string, string>;
    this.routes = Object.entries(appPaths)
      .filter(([appPath]) => appPath.endsWith("/page"))
      .map(([appPath, url]) => ({
        appPath,
        pattern: new RegExp(`^${url.replace(/\[\[?\.\.\.[^\]]+\]\]?/g, ".+").replace(/\[[^\]]+\]/g, "[^/]+")}$`),
        dynamicSegments: (url.match(/\[/g) ?? []).length,
      }))
      // A static route wins over a dynamic one that matches the same path.
      .sort((a, b) => a.dynamicSegments - b.dynamicSegments);
  }

  /** Gzipped size (zlib level 9) of one file under the dist dir. */
  gzipped(file: string): number {
    const known = this.sizes.get(file);
    if (known !== undefined) return known;
    const bytes = gzipSync(readFileSync(join(this.distDir, file)), { level: 9 }).length;
    this.sizes.set(file, bytes);
    return bytes;
  }

  /** The app path (e.g. "/(public)/providers/[id]/page") that serves a URL path. */
  appPathOf(urlPath: string): string | undefined {
    const path = urlPath.split("?")[0] ?? urlPath;
    return this.routes.find((r) => r.pattern.test(path))?.appPath;
  }

  forUrl(urlPath: string): FirstLoad {
    const appPath = this.appPathOf(urlPath);
    if (!appPath) throw new Error(`no page in the build serves ${urlPath}`);
    const file = join(this.distDir, "server/app", `${appPath}_client-reference-manifest.js`);
    if (!existsSync(file)) throw new Error(`no client reference manifest for ${appPath}`);
    // The manifest is a script assigning globalThis.__RSC_MANIFEST[appPath]; run it in an empty sandbox to read it.
    const sandbox: { globalThis: { __RSC_MANIFEST?: Record<string, ClientReferenceManifest> } } = { globalThis: {} };
    runInNewContext(readFileSync(file, "utf8"), sandbox);
    const manifest = sandbox.globalThis.__RSC_MANIFEST?.[appPath] ?? Object.values(sandbox.globalThis.__RSC_MANIFEST ?? {})[0];
    const pageDir = appPath.slice(0, -"/page".length);
    // A segment file of this route: a layout, boundary or loading state of the page's folder or one above it, or the page.
    const onRoute = (dir: string, kind: string) => (kind === "page" ? dir === pageDir : dir === "" || pageDir === dir || pageDir.startsWith(`${dir}/`)) && SEGMENT_KINDS.has(kind);
    const files = new Set(this.root);
    if (manifest?.entryJSFiles) {
      // Turbopack: chunks per segment entry, keyed "[project]/app/<folder>/<kind>".
      for (const [entry, chunks] of Object.entries(manifest.entryJSFiles)) {
        const m = /^\[project\]\/app(.*)\/([^/]+)$/.exec(entry);
        if (m && onRoute(m[1] ?? "", m[2] ?? "")) for (const chunk of chunks) if (chunk.endsWith(".js")) files.add(chunk);
      }
    } else {
      // webpack: each client module lists its chunk group (shared chunks, then the entry chunk
      // static/chunks/app/<folder>/<kind>-<hash>.js); take the groups whose entry is a segment of this route.
      for (const mod of Object.values(manifest?.clientModules ?? {})) {
        if (mod.async) continue;
        // Paths are URL-encoded there ("[id]" as "%5Bid%5D"); the files on disk are not.
        const chunks = mod.chunks.filter((c) => c.endsWith(".js")).map((c) => decodeURIComponent(c));
        const entries = chunks.map((c) => /^static\/chunks\/app(.*)\/([^/]+)-[0-9a-f]+\.js$/.exec(c)).filter((m) => m !== null);
        if (entries.some((m) => onRoute(m[1] ?? "", m[2] ?? ""))) for (const chunk of chunks) files.add(chunk);
      }
    }
    const list = [...files].map((f) => ({ file: f, bytes: this.gzipped(f) }));
    return {
      route: appPath,
      bytes: list.reduce((sum, f) => sum + f.bytes, 0),
      frameworkBytes: this.root.reduce((sum, f) => sum + this.gzipped(f), 0),
      files: list,
    };
  }
}
