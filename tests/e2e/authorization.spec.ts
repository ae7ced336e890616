import { expect, test, type APIRequestContext } from "@playwright/test";
import { ACCESS_TABLE, expected, VISITORS, type Visitor } from "./access-table";
import { apiVisitor, fillPlaceholders, routesInTree } from "./app-routes";
import { DEMO } from "./support";

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
      const { ctx, id } = await apiVisitor(who === "signedOut" ? null : DEMO[who]);
      if (id) ids[`${who}Id`] = id;
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
        const url = fillPlaceholders(row.url, ids);
        const r = await ctx.fetch(url, { method: row.method, data: row.body, maxRedirects: 0 });
        seen[who] = r.status();
        want[who] = expected(row, who);
        if (r.status() === 307) expect(r.headers().location, `${who} is sent to sign in`).toContain("/sign-in?next=");
      }
      expect(seen).toEqual(want);
    });
  }
});
