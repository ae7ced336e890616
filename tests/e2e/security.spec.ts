import { expect, request as newRequest, test, type APIRequestContext } from "@playwright/test";
import { randomUUID } from "node:crypto";
import { apiVisitor } from "./app-routes";
import { E2E_BASE_URL, E2E_SERVICE_PORTS } from "./ports";
import { seededAccounts } from "./seeded-accounts";
import { DEMO, DEMO_PASSWORD, signIn, watchConsole } from "./support";

test("a forged cross-site request is refused and changes nothing", async () => {
  const ctx = await newRequest.newContext({ baseURL: E2E_BASE_URL, extraHTTPHeaders: { origin: E2E_BASE_URL } });
  expect((await ctx.post("/api/auth/sign-in/email", { data: { email: DEMO.hatchery, password: DEMO_PASSWORD } })).status()).toBe(200);
  const me = (await (await ctx.get("/api/v1/me")).json()) as { user: { id: string } };
  const before = await (await ctx.get(`/api/v1/providers/${me.user.id}`)).json();

  // The signed-in hatchery's cookies ride along, as they would from a hostile page in the same browser.
  const forged: Record<string, string>[] = [{ origin: "https://evil.example" }, { origin: "null" }, { origin: E2E_BASE_URL, "sec-fetch-site": "cross-site" }];
  for (const headers of forged) {
    const r = await ctx.put(`/api/v1/providers/${me.user.id}/hatchery`, { headers, data: { species: ["catfish"], delivers: true, deliveryRadiusKm: 5 } });
    expect(r.status(), JSON.stringify(headers)).toBe(403);
    expect(((await r.json()) as { error: { message: string } }).error.message).toContain("other sites");
  }
  expect(await (await ctx.get(`/api/v1/providers/${me.user.id}`)).json()).toEqual(before);

  // The same request from our own origin goes through.
  const own = await ctx.put(`/api/v1/providers/${me.user.id}/hatchery`, { data: { species: ["tilapia"], delivers: false, deliveryRadiusKm: 0 } });
  expect(own.status()).toBe(200);
  await ctx.dispose();
});

test("security headers are sent on pages and API replies", async ({ request }) => {
  for (const path of ["/", "/api/health"]) {
    const r = await request.get(path);
    const h = r.headers();
    expect(h["x-content-type-options"], path).toBe("nosniff");
    expect(h["x-frame-options"], path).toBe("DENY");
    expect(h["referrer-policy"], path).toBe("strict-origin-when-cross-origin");
    expect(h["x-powered-by"], path).toBeUndefined();
  }
});

test("the app can be added to a phone's home screen: manifest and icons", async ({ request }) => {
  const manifest = (await (await request.get("/manifest.webmanifest")).json()) as { name: string; start_url: string; display: string; icons: { src: string; sizes: string }[] };
  expect(manifest).toMatchObject({ start_url: "/", display: "standalone" });
  for (const icon of manifest.icons) {
    const r = await request.get(icon.src);
    expect(r.status(), icon.src).toBe(200);
    expect(r.headers()["content-type"]).toBe("image/png");
    const body = await r.body();
    // PNG signature and IHDR width/height (PNG spec, ISO/IEC 15948): bytes 16–23.
    expect(body.subarray(1, 4).toString("latin1")).toBe("PNG");
    const [w, h] = icon.sizes.split("x").map(Number);
    expect(body.readUInt32BE(16)).toBe(w);
    expect(body.readUInt32BE(20)).toBe(h);
  }
  expect((await request.get("/icons/100")).status()).toBe(404);
});

// ---- Content-Security-Policy (issue 8; policy in lib/security/csp.ts, set per request in proxy.ts) -------------

const STORAGE_ORIGIN = `http://127.0.0.1:${E2E_SERVICE_PORTS.s3}`; // the e2e server's S3 stand-in (scripts/e2e-server.ts)

function directives(policy: string | undefined): Map<string, string[]> {
  const out = new Map<string, string[]>();
  for (const part of (policy ?? "").split(";")) {
    const [name, ...sources] = part.trim().split(/\s+/);
    if (name) out.set(name, sources);
  }
  return out;
}

test("a Content-Security-Policy with a fresh nonce is on pages and API replies, and Next puts that nonce on every script", async ({ request }) => {
  const nonces = new Set<string>();
  for (const path of ["/", "/map?lat=-15.4&lng=28.3&radiusKm=50", "/sign-in", "/api/health", "/api/v1/listings/nearby?lat=-15.4&lng=28.3&radiusKm=50", "/api/v1/me"]) {
    const r = await request.get(path, { maxRedirects: 0 });
    const csp = directives(r.headers()["content-security-policy"]);
    expect(csp.get("default-src"), path).toEqual(["'self'"]);
    const script = csp.get("script-src") ?? [];
    const nonce = script.find((s) => s.startsWith("'nonce-"))?.slice("'nonce-".length, -1);
    expect(nonce, `${path}: script-src ${script.join(" ")}`).toMatch(/^[A-Za-z0-9+/]{22}==$/);
    if (nonce) nonces.add(nonce);
    expect(script, path).toContain("'strict-dynamic'");
    expect(script, path).not.toContain("'unsafe-inline'");
    expect(script, `${path}: a production build needs no eval`).not.toContain("'unsafe-eval'");
    expect(csp.get("img-src"), path).toEqual(["'self'", "data:", "blob:", STORAGE_ORIGIN]);
    expect(csp.get("connect-src"), `${path}: presigned PUTs go to storage; MAP_STYLE_URL is unset here`).toEqual(["'self'", STORAGE_ORIGIN]);
    expect(csp.get("worker-src"), path).toEqual(["'self'", "blob:"]);
    expect(csp.get("frame-ancestors"), path).toEqual(["'none'"]);
    expect(csp.get("object-src"), path).toEqual(["'none'"]);
    expect(csp.get("base-uri"), path).toEqual(["'self'"]);
    expect(csp.get("form-action"), path).toEqual(["'self'"]);

    if (path === "/") {
      // Every <script> the page was served with carries this request's nonce, or the browser would refuse it.
      const html = await r.text();
      const tags = html.match(/<script\b[^>]*>/g) ?? [];
      expect(tags.length).toBeGreaterThan(3);
      for (const tag of tags) expect(tag).toContain(`nonce="${nonce}"`);
    }
  }
  expect(nonces.size, "a new nonce for every reply").toBe(6);
});

test("the map, the planner, sign-in and a photo upload work under the policy with no violation", async ({ page }) => {
  test.setTimeout(120_000);
  const violations: string[] = [];
  await page.exposeFunction("reportCspViolation", (line: string) => violations.push(line));
  await page.addInitScript(() => {
    document.addEventListener("securitypolicyviolation", (e) => {
      (window as unknown as { reportCspViolation: (line: string) => void }).reportCspViolation(`${e.effectiveDirective} blocked ${e.blockedURI || "inline"} in ${e.documentURI}`);
    });
  });
  const problems = watchConsole(page);

  // The map: maplibre's worker (served from /maplibre-gl-worker.mjs) draws the offline basemap and the markers.
  await page.goto("/map?lat=-15.4167&lng=28.2833&place=Lusaka&radiusKm=100");
  const map = page.getByTestId("finder-map");
  await expect(map.locator("canvas")).toBeVisible({ timeout: 20_000 });
  await expect.poll(async () => (await map.getByTestId("map-marker").count()) + (await map.getByRole("button", { name: /providers here/ }).count()), { timeout: 20_000 }).toBeGreaterThan(0);

  // The planner: its figures follow the typed size only if the page's scripts run.
  await page.goto("/planner");
  await expect(page.getByTestId("figure-volume")).toHaveText("5.57 m³");
  await page.getByLabel("Length (m)", { exact: true }).fill("6");
  await expect(page.getByTestId("figure-volume")).toHaveText("10.97 m³");

  // Sign-in through the form, then a site photo: presigned PUT to storage (another origin), checked, shown.
  const [farmer] = await seededAccounts("farmer", 1, 1);
  await signIn(page, farmer ?? "");
  await page.goto("/farmer/requests/new");
  await page.getByLabel("Add site photos").setInputFiles({ name: "site.png", mimeType: "image/png", buffer: await sitePhoto() });
  await expect(page.getByText("Ready", { exact: true })).toBeVisible({ timeout: 30_000 });
  await expect(page.locator('img[src^="/api/images/"]').first()).toBeVisible();
  await expect.poll(() => page.locator('img[src^="/api/images/"]').first().evaluate((img) => (img as HTMLImageElement).naturalWidth)).toBeGreaterThan(0);

  expect(violations, "securitypolicyviolation events").toEqual([]);
  expect(problems, "console errors (a blocked script or request logs one)").toEqual([]);
});

/** A 640 × 480 PNG, big enough for every served width (lib/storage/upload-kinds.ts minWidth). */
async function sitePhoto(): Promise<Buffer> {
  const { default: sharp } = await import("sharp");
  return sharp({ create: { width: 640, height: 480, channels: 3, background: { r: 40, g: 120, b: 160 } } }).png().toBuffer();
}

// ---- Rate limits on uploads (issue 8; lib/api/rate-limit.ts) -------------------------------------------------

test("upload links are limited per account: past 120 in 10 minutes a 429 with Retry-After, another account unaffected", async () => {
  test.setTimeout(120_000);
  const [first, second] = await seededAccounts("farmer", 2, 2);
  const a = await apiVisitor(first ?? "");
  const b = await apiVisitor(second ?? "");
  const presign = (ctx: APIRequestContext) =>
    ctx.post("/api/v1/uploads/presign", { data: { kind: "site-photo", subjectId: randomUUID(), contentType: "image/jpeg", contentLength: 100_000 } });
  for (let i = 0; i < 120; i++) expect((await presign(a.ctx)).status(), `upload link ${i + 1}`).toBe(200);
  const refused = await presign(a.ctx);
  expect(refused.status()).toBe(429);
  const retryAfter = Number(refused.headers()["retry-after"]);
  expect(retryAfter).toBeGreaterThan(0);
  expect(retryAfter).toBeLessThanOrEqual(600);
  const body = (await refused.json()) as { error: { code: string; message: string } };
  expect(body.error.code).toBe("rate_limited");
  expect(body.error.message).toMatch(/^Too many photo uploads from this account: at most 120 in 10 minutes\. Try again in \d+ (seconds|minutes)\.$/);
  // The count is per account: the next farmer still gets a link.
  expect((await presign(b.ctx)).status()).toBe(200);
  await a.ctx.dispose();
  await b.ctx.dispose();
});
