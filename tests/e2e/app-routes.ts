import { expect, request as newRequest, type APIRequestContext } from "@playwright/test";
import { readdirSync, statSync } from "node:fs";
import { join, relative, sep } from "node:path";
import { E2E_BASE_URL } from "./ports";
import { DEMO_PASSWORD } from "./support";

// The route tree under app/ and the placeholders of tests/e2e/access-table.ts, shared by the specs that
// walk every route (the authorization matrix, the accessibility scan) so each reads the tree the same way.

export type AppRoute = { pattern: string; kind: "page" | "route" };

/** Every page.tsx and route.ts under app/, as its URL pattern (route groups and _private folders removed). */
export function appRoutes(dir = "app"): AppRoute[] {
  const out: AppRoute[] = [];
  for (const name of readdirSync(dir)) {
    const path = join(dir, name);
    if (statSync(path).isDirectory()) {
      if (name.startsWith("_")) continue;
      out.push(...appRoutes(path));
    } else {
      const file = /^(page|route)\.tsx?$/.exec(name);
      if (!file) continue;
      const segments = relative("app", dir).split(sep).filter((s) => s && !/^\(.*\)$/.test(s));
      out.push({ pattern: `/${segments.join("/")}`, kind: file[1] === "page" ? "page" : "route" });
    }
  }
  return out;
}

/** The URL patterns of every page and route handler. */
export function routesInTree(): string[] {
  return appRoutes().map((r) => r.pattern);
}

/** The URL patterns of the pages only (what a person opens in a browser). */
export function pagesInTree(): string[] {
  return appRoutes()
    .filter((r) => r.kind === "page")
    .map((r) => r.pattern);
}

/** Puts ids in for the table's placeholders ({hatcheryId}, {builderId}…); an unknown one stays as its name. */
export function fillPlaceholders(url: string, ids: Record<string, string>): string {
  return url.replace(/\{(\w+)\}/g, (_, key: string) => ids[key] ?? key);
}

/** Whether a path (query and hash ignored) is an instance of a pattern such as /builder/jobs/[id]. */
export function matchesPattern(path: string, pattern: string): boolean {
  const pathname = path.split(/[?#]/)[0] ?? "";
  const source = pattern
    .split("/")
    .map((s) => (/^\[\.\.\..+\]$/.test(s) ? ".+" : /^\[.+\]$/.test(s) ? "[^/]+" : s.replace(/[.*+?^${}()|\\]/g, "\\$&")))
    .join("/");
  return new RegExp(`^${source}$`).test(pathname);
}

/**
 * An API client signed in as a demo account (or signed out with null), sending our own Origin as a browser would,
 * with the account's user id: the value of its {<who>Id} placeholder.
 */
export async function apiVisitor(email: string | null): Promise<{ ctx: APIRequestContext; id: string | null }> {
  const ctx = await newRequest.newContext({ baseURL: E2E_BASE_URL, extraHTTPHeaders: { origin: E2E_BASE_URL }, maxRedirects: 0 });
  if (email === null) return { ctx, id: null };
  const r = await ctx.post("/api/auth/sign-in/email", { data: { email, password: DEMO_PASSWORD } });
  expect(r.status(), `sign in as ${email}`).toBe(200);
  const me = (await (await ctx.get("/api/v1/me")).json()) as { user: { id: string } };
  return { ctx, id: me.user.id };
}
