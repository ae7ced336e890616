import { expect, request as newRequest, test } from "@playwright/test";
import { E2E_BASE_URL } from "./ports";
import { DEMO, DEMO_PASSWORD } from "./support";

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
