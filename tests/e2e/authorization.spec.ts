import { expect, request as newRequest, test, type APIRequestContext } from "@playwright/test";
import { readdirSync, statSync } from "node:fs";
import { join, relative, sep } from "node:path";
import { ACCESS_TABLE, expected, VISITORS, type Visitor } from "./access-table";
import { E2E_BASE_URL } from "./ports";
import { DEMO, DEMO_PASSWORD } from "./support";

const BASE = E2E_BASE_URL;

/** Every page.tsx and route.ts under app/, as its URL pattern (route groups and _private folders removed). */
function routesInTree(dir = "app"): string[] {
  const out: string[] = [];
  for (const name of readdirSync(dir)) {
    const path = join(dir, name);
    if (statSync(path).isDirectory()) {
      if (name.startsWith("_")) continue;
      out.push(...routesInTree(path));
    } else if (/^(page|route)\.tsx?$/.test(name)) {
      const segments = relative("app", dir).split(sep).filter((s) => s && !/^\(.*\)$/.test(s));
      out.push(`/${segments.join("/")}`);
    }
  }
  return out;
}

test("the access table lists every route in app/", () => {
  const listed = new Set(ACCESS_TABLE.map((r) => r.route));
  const missing = routesInTree().filter((r) => !listed.has(r));
  expect(missing, "routes with no row in tests/e2e/access-table.ts").toEqual([]);
});

test.describe("authorization matrix", () => {
  const contexts = new Map<Visitor, APIRequestContext>();
  const ids: Record<string, string> = {};

  test.beforeAll(async () => {
    for (const who of VISITORS) {
      const ctx = await newRequest.newContext({ baseURL: BASE, extraHTTPHeaders: { origin: BASE }, maxRedirects: 0 });
      if (who !== "signedOut") {
        const r = await ctx.post("/api/auth/sign-in/email", { data: { email: DEMO[who], password: DEMO_PASSWORD } });
        expect(r.status(), `sign in as ${who}`).toBe(200);
        const me = (await (await ctx.get("/api/v1/me")).json()) as { user: { id: string } };
        ids[`${who}Id`] = me.user.id;
      }
      contexts.set(who, ctx);
    }
  });

  test.afterAll(async () => {
    for (const ctx of contexts.values()) await ctx.dispose();
  });

  for (const row of ACCESS_TABLE) {
    test(`${row.method} ${row.url}`, async () => {
      const seen: Record<string, number> = {};
      const want: Record<string, number> = {};
      for (const who of VISITORS) {
        const ctx = contexts.get(who);
        if (!ctx) throw new Error("no context");
        const url = row.url.replace(/\{(\w+)\}/g, (_, key: string) => ids[key] ?? key);
        const r = await ctx.fetch(url, { method: row.method, data: row.body, maxRedirects: 0 });
        seen[who] = r.status();
        want[who] = expected(row, who);
        if (r.status() === 307) expect(r.headers().location, `${who} is sent to sign in`).toContain("/sign-in?next=");
      }
      expect(seen).toEqual(want);
    });
  }
});
