import { NextResponse, type NextRequest } from "next/server";
import { env } from "@/lib/env";
import { buildContentSecurityPolicy, newNonce } from "@/lib/security/csp";

// Puts a fresh Content-Security-Policy on every document and API reply (lib/security/csp.ts says why a nonce).
// It is built here, per request, and not in next.config.ts headers(): those are fixed at build time, while the
// storage endpoint and map style come from the environment the server starts with (the e2e server moves them).
export function proxy(request: NextRequest) {
  const policy = buildContentSecurityPolicy({
    nonce: newNonce(),
    development: env.NODE_ENV === "development",
    appUrl: env.APP_URL,
    storageEndpoint: env.S3_PUBLIC_ENDPOINT ?? env.S3_ENDPOINT,
    storageBucket: env.S3_BUCKET,
    storagePathStyle: env.S3_FORCE_PATH_STYLE,
    mapStyleUrl: env.MAP_STYLE_URL,
  });
  // Next reads the nonce from the request's header and stamps it on the scripts it renders.
  const requestHeaders = new Headers(request.headers);
  requestHeaders.set("content-security-policy", policy);
  const response = NextResponse.next({ request: { headers: requestHeaders } });
  response.headers.set("content-security-policy", policy);
  return response;
}

export const config = {
  matcher: [
    {
      // Not the build's own files nor public/ files (scripts, styles, fonts, GeoJSON): they are no documents, and
      // a policy on /maplibre-gl-worker.mjs would become the map worker's own policy.
      source: "/((?!_next/static|_next/image|favicon\\.ico|maplibre-gl-worker\\.mjs|basemap/).*)",
      // Link prefetches fetch RSC data, not a document to protect.
      missing: [
        { type: "header", key: "next-router-prefetch" },
        { type: "header", key: "purpose", value: "prefetch" },
      ],
    },
  ],
};
