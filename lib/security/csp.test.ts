import { PutObjectCommand, S3Client } from "@aws-sdk/client-s3";
import { getSignedUrl } from "@aws-sdk/s3-request-presigner";
import { getScriptNonceFromHeader } from "next/dist/server/app-render/get-script-nonce-from-header";
import { describe, expect, it } from "vitest";
import { buildContentSecurityPolicy, newNonce, storageOrigins, type CspSettings } from "./csp";

const BASE: CspSettings = {
  nonce: "AAECAwQFBgcICQoLDA0ODw==",
  development: false,
  appUrl: "http://localhost:3000",
  storageEndpoint: "http://127.0.0.1:4569",
  storageBucket: "shoal-images",
  storagePathStyle: true,
};

/** Directive name → its source list, as a browser splits a serialized policy (W3C CSP Level 3, "parse a serialized CSP"). */
function parsePolicy(policy: string): Map<string, string[]> {
  const out = new Map<string, string[]>();
  for (const token of policy.split(";")) {
    const [name, ...values] = token.trim().split(/\s+/);
    if (!name) continue;
    expect(out.has(name.toLowerCase()), `directive ${name} given twice (the browser ignores the second)`).toBe(false);
    out.set(name.toLowerCase(), values);
  }
  return out;
}

// The source-expression grammar of W3C CSP Level 3 ("2.3.1 Source Lists"): keywords, nonce/hash sources,
// scheme sources such as data:, and host sources (scheme://host[:port]).
const SOURCE_EXPRESSION = /^(?:'(?:self|none|unsafe-inline|unsafe-eval|strict-dynamic|wasm-unsafe-eval)'|'nonce-[A-Za-z0-9+/_-]+={0,2}'|[a-z][a-z0-9+.-]*:|[a-z][a-z0-9+.-]*:\/\/[A-Za-z0-9.-]+(?::\d+)?)$/;
const DIRECTIVE_NAME = /^[a-z0-9-]+$/; // directive-name = 1*( ALPHA / DIGIT / "-" ), same spec, "2.2 Policies"

async function presignedPutOrigin(endpoint: string, bucket: string, forcePathStyle: boolean): Promise<string> {
  const client = new S3Client({ endpoint, region: "us-east-1", forcePathStyle, credentials: { accessKeyId: "a", secretAccessKey: "b" } });
  const url = await getSignedUrl(client, new PutObjectCommand({ Bucket: bucket, Key: "uploads/x", ContentType: "image/jpeg" }), { expiresIn: 60 });
  return new URL(url).origin;
}

describe("buildContentSecurityPolicy", () => {
  it("is well-formed: every directive name and source expression fits the CSP Level 3 grammar", () => {
    const policy = parsePolicy(buildContentSecurityPolicy({ ...BASE, development: true, mapStyleUrl: "https://tiles.example.org/styles/x.json", appUrl: "https://shoal.example" }));
    for (const [name, sources] of policy) {
      expect(name).toMatch(DIRECTIVE_NAME);
      for (const source of sources) expect(source, `${name} ${source}`).toMatch(SOURCE_EXPRESSION);
    }
  });

  it("carries a nonce that Next's own header parser finds, so Next stamps it on its scripts", () => {
    // next/dist/server/app-render/get-script-nonce-from-header.js is what the renderer calls on the request header.
    expect(getScriptNonceFromHeader(buildContentSecurityPolicy(BASE))).toBe(BASE.nonce);
  });

  it("allows scripts only by nonce (no 'unsafe-inline'); 'unsafe-eval' only for next dev", () => {
    const prod = parsePolicy(buildContentSecurityPolicy(BASE));
    expect(prod.get("script-src")).toEqual(["'self'", `'nonce-${BASE.nonce}'`, "'strict-dynamic'"]);
    const dev = parsePolicy(buildContentSecurityPolicy({ ...BASE, development: true }));
    expect(dev.get("script-src")).toContain("'unsafe-eval'");
    expect(dev.get("script-src")).not.toContain("'unsafe-inline'");
  });

  it("locks framing, plugins, <base> and form targets to what the issue asks", () => {
    const p = parsePolicy(buildContentSecurityPolicy(BASE));
    expect(p.get("default-src")).toEqual(["'self'"]);
    expect(p.get("frame-ancestors")).toEqual(["'none'"]);
    expect(p.get("object-src")).toEqual(["'none'"]);
    expect(p.get("base-uri")).toEqual(["'self'"]);
    expect(p.get("form-action")).toEqual(["'self'"]);
    expect(p.get("worker-src")).toEqual(["'self'", "blob:"]);
  });

  it("lets the browser PUT to the URL the AWS presigner really produces, path-style and virtual-hosted", async () => {
    // The reference is @aws-sdk/s3-request-presigner itself: whatever origin it signs must be in connect-src.
    for (const [endpoint, pathStyle] of [["http://127.0.0.1:4569", true], ["https://s3.eu-west-1.amazonaws.com", false], ["https://minio.example.org:9000", true]] as const) {
      const origin = await presignedPutOrigin(endpoint, "shoal-images", pathStyle);
      const p = parsePolicy(buildContentSecurityPolicy({ ...BASE, storageEndpoint: endpoint, storagePathStyle: pathStyle }));
      expect(p.get("connect-src"), `${endpoint} path-style=${pathStyle}`).toContain(origin);
      expect(p.get("img-src")).toContain(origin);
      expect(storageOrigins(endpoint, "shoal-images", pathStyle)).toContain(origin);
    }
  });

  it("adds the hosted map style's origin to connect-src only when MAP_STYLE_URL is set", () => {
    const without = parsePolicy(buildContentSecurityPolicy(BASE));
    expect(without.get("connect-src")).toEqual(["'self'", "http://127.0.0.1:4569"]);
    const withMap = parsePolicy(buildContentSecurityPolicy({ ...BASE, mapStyleUrl: "https://tiles.example.org:8443/styles/basic/style.json?key=k" }));
    expect(withMap.get("connect-src")).toEqual(["'self'", "http://127.0.0.1:4569", "https://tiles.example.org:8443"]);
    expect(withMap.get("img-src")).not.toContain("https://tiles.example.org:8443");
  });

  it("upgrades insecure subresources only when the app itself is served over https", () => {
    expect(parsePolicy(buildContentSecurityPolicy(BASE)).has("upgrade-insecure-requests")).toBe(false);
    expect(parsePolicy(buildContentSecurityPolicy({ ...BASE, appUrl: "https://shoal.example" })).get("upgrade-insecure-requests")).toEqual([]);
  });
});

describe("newNonce", () => {
  it("is 16 random bytes in base64, different every time", () => {
    const seen = new Set<string>();
    for (let i = 0; i < 200; i++) {
      const nonce = newNonce();
      // Node's own base64 decoder is the reference for the encoding.
      expect(Buffer.from(nonce, "base64")).toHaveLength(16);
      expect(Buffer.from(nonce, "base64").toString("base64")).toBe(nonce);
      seen.add(nonce);
    }
    expect(seen.size).toBe(200);
  });
});
