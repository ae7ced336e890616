// The Content-Security-Policy every document and API reply carries (set per request in proxy.ts).
//
// Scripts: a per-request nonce with 'strict-dynamic' (W3C CSP Level 3), not 'unsafe-inline'.
// The App Router streams its RSC payload as inline <script> tags whose text differs per page and per user, so no
// build-time hash can cover them; Next's experimental SRI only adds integrity to the external chunk files. Next
// reads the nonce from the request's CSP header and puts it on its own scripts (node_modules/next/dist/docs/01-app/
// 02-guides/content-security-policy.md). The price of a nonce is that no page can be prerendered — and none is:
// the root layout's header reads the session, so every page already renders per request (the build's
// prerender-manifest lists only /_global-error). Chunks loaded later by those scripts are trusted through
// 'strict-dynamic'.
//
// Styles: 'unsafe-inline' stays for style-src. React renders `style={…}` props (the map containers, rating bars,
// the global error page; recharts' SVG) as style attributes in the server HTML, which only 'unsafe-inline' allows
// (a nonce cannot cover an attribute, and a nonce in the list would switch 'unsafe-inline' off). Injected CSS
// cannot run script; it is the smaller risk, accepted here.

export type CspSettings = {
  /** base64 nonce of this request, from newNonce() */
  nonce: string;
  /** `next dev` needs eval for React's error overlays; a production build never does */
  development: boolean;
  /** APP_URL: on https, plain-http subresources are upgraded */
  appUrl: string;
  /** where browsers PUT uploads with a presigned URL: S3_PUBLIC_ENDPOINT, or S3_ENDPOINT when unset */
  storageEndpoint: string;
  storageBucket: string;
  storagePathStyle: boolean;
  /** MAP_STYLE_URL when a hosted style replaces the offline basemap */
  mapStyleUrl?: string | undefined;
};

/** A fresh 128-bit nonce, base64 as the nonce-source grammar wants (CSP Level 3 asks for at least 128 bits; from memory). */
export function newNonce(): string {
  const bytes = new Uint8Array(16);
  crypto.getRandomValues(bytes);
  return btoa(String.fromCharCode(...bytes));
}

/**
 * The origins a browser talks to for stored photos. Path-style URLs (s3rver, MinIO) keep the endpoint's host;
 * virtual-hosted ones (AWS) put the bucket in front of it, so both spellings are allowed then.
 */
export function storageOrigins(endpoint: string, bucket: string, pathStyle: boolean): string[] {
  const u = new URL(endpoint);
  if (pathStyle) return [u.origin];
  return [u.origin, `${u.protocol}//${bucket}.${u.host}`];
}

function originOf(url: string | undefined): string | null {
  if (!url) return null;
  try {
    return new URL(url).origin;
  } catch {
    return null;
  }
}

/** The policy as one header value, directives separated by "; ". */
export function buildContentSecurityPolicy(s: CspSettings): string {
  const storage = storageOrigins(s.storageEndpoint, s.storageBucket, s.storagePathStyle);
  // A hosted style's tiles, glyphs and sprites are fetched (by maplibre's worker) from the style's own origin;
  // a style that pulls tiles from yet another host needs that host added here.
  const tiles = originOf(s.mapStyleUrl);
  const directives: [string, ...string[]][] = [
    ["default-src", "'self'"],
    ["script-src", "'self'", `'nonce-${s.nonce}'`, "'strict-dynamic'", ...(s.development ? ["'unsafe-eval'"] : [])],
    ["style-src", "'self'", "'unsafe-inline'"],
    // Photos are served through /api/images (our origin); blob: is the uploader's preview, data: small inline icons.
    ["img-src", "'self'", "data:", "blob:", ...storage],
    // Presigned PUTs go straight to storage; the map's worker fetches the hosted style and its tiles.
    ["connect-src", "'self'", ...storage, ...(tiles ? [tiles] : [])],
    // maplibre's worker is served from /maplibre-gl-worker.mjs (scripts/prepare-assets.ts); maplibre wraps a
    // worker URL of another origin in a blob: module, so blob: stays allowed for that case.
    ["worker-src", "'self'", "blob:"],
    ["font-src", "'self'"],
    ["object-src", "'none'"],
    ["base-uri", "'self'"],
    ["form-action", "'self'"],
    ["frame-ancestors", "'none'"],
  ];
  if (new URL(s.appUrl).protocol === "https:") directives.push(["upgrade-insecure-requests"]);
  return directives.map((d) => d.join(" ")).join("; ");
}
