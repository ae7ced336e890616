import type { Client } from "@libsql/client";
import { expect, test, type APIRequestContext } from "@playwright/test";
import fc from "fast-check";
import { readdirSync, readFileSync, statSync } from "node:fs";
import { join, relative, sep } from "node:path";
import { ACCESS_TABLE, expected, type AccessRow, type Visitor } from "./access-table";
import { apiVisitor, fillPlaceholders } from "./app-routes";
import { DbTracker } from "./db-fingerprint";
import { fuzzCases, SAMPLES, type FuzzCase } from "./fuzz-cases";
import { e2eDatabase, runSweep } from "./reservation-support";
import { seededAccounts } from "./seeded-accounts";
import { DEMO } from "./support";

// Issue 8: every JSON route under app/api/v1 (and the planner's /api/plans/estimate) gets fast-check-generated
// bodies and query strings — random JSON, wrong types, missing fields, 100 KB+ strings, emoji, RTL, NUL, lone
// surrogates, negative, enormous and Infinity-making numbers, deep nesting, non-JSON, wrong content types — sent
// with our own Origin by an account whose role may call the route (from tests/e2e/access-table.ts), so that the
// schema is what answers. Each reply must be: not a 5xx; a refusal as JSON with a message, and a 400 naming the
// field(s) in fieldErrors; and a refusal (or any GET, RFC 9110 §9.2.1 "safe") must leave the database as it was.
// The routes are read from the tree: a new route is fuzzed as soon as it exists, or fails here naming what is missing.
//
// The callers are seeded accounts no other spec looks at (a case that happens to be valid then changes only their
// data); only the admin is the demo one, as the seed has no other. FUZZ_RUNS and FUZZ_SEED replay or widen a run.

const RUNS_WITH_BODY = Number(process.env.FUZZ_RUNS ?? 40);
const RUNS_WITHOUT_BODY = Math.ceil(RUNS_WITH_BODY / 2);
const SEED = Number(process.env.FUZZ_SEED ?? Date.now() % 2_147_483_647);
const METHODS = ["GET", "POST", "PUT", "PATCH", "DELETE"] as const;
type Method = (typeof METHODS)[number];
type Target = { pattern: string; method: Method; takesBody: boolean };

/** Route handlers under app/api/v1, as URL patterns with the methods each file exports. */
function jsonRoutes(dir = "app/api/v1"): Target[] {
  const out: Target[] = [];
  for (const name of readdirSync(dir)) {
    const path = join(dir, name);
    if (statSync(path).isDirectory()) {
      if (!name.startsWith("_")) out.push(...jsonRoutes(path));
      continue;
    }
    if (!/^route\.tsx?$/.test(name)) continue;
    const source = readFileSync(path, "utf8");
    const pattern = `/${relative("app", dir).split(sep).filter((s) => s && !/^\(.*\)$/.test(s)).join("/")}`;
    const exported = new Set<string>();
    for (const m of source.matchAll(/export\s+(?:const|async\s+function|function)\s+(GET|POST|PUT|PATCH|DELETE)\b/g)) exported.add(m[1] ?? "");
    for (const m of source.matchAll(/export\s+const\s*\{([^}]*)\}/g)) for (const n of (m[1] ?? "").split(",")) exported.add(n.trim());
    // A handler that never reads the body (close, withdraw, DELETE) still gets bodies, but fewer cases.
    const readsBody = /readJson\(|request\.(?:text|json|formData|arrayBuffer)\(/.test(source);
    for (const method of METHODS) if (exported.has(method)) out.push({ pattern, method, takesBody: method !== "GET" && readsBody });
  }
  return out;
}

const TARGETS: Target[] = [...jsonRoutes(), { pattern: "/api/plans/estimate", method: "POST", takesBody: true }];
const CALLER_ORDER: Visitor[] = ["farmer", "hatchery", "builder", "admin", "signedOut"];

/** The first account kind the access table lets through (not 401/403), signed in where possible. */
function callerFor(row: AccessRow): Visitor | undefined {
  return CALLER_ORDER.find((who) => ![401, 403].includes(expected(row, who)));
}

function describeBody(text: string): string {
  return text.length > 400 ? `${text.slice(0, 400)}…` : text;
}

let casesRun = 0;
const perTarget: string[] = [];

test.describe("fuzzing the JSON API", () => {
  const contexts = new Map<Visitor, APIRequestContext>();
  const ids: Record<string, string> = {};
  let db: Client | undefined;
  let tracker: DbTracker | undefined;
  const started = Date.now();

  test.beforeAll(async () => {
    test.setTimeout(120_000);
    const [farmer] = await seededAccounts("farmer", 1);
    const [hatchery] = await seededAccounts("hatchery", 1);
    const [builder] = await seededAccounts("builder", 1);
    const accounts: Record<Visitor, string | null> = { signedOut: null, farmer: farmer ?? null, hatchery: hatchery ?? null, builder: builder ?? null, admin: DEMO.admin };
    for (const who of CALLER_ORDER) {
      const { ctx, id } = await apiVisitor(accounts[who]);
      contexts.set(who, ctx);
      if (id) ids[`${who}Id`] = id;
    }
    // The scheduled sweep runs every minute on the e2e server; one run now leaves it nothing to do for a while.
    const anonymous = contexts.get("signedOut");
    if (anonymous) await runSweep(anonymous);
    db = e2eDatabase();
    tracker = new DbTracker(db);
    await tracker.start();
    console.log(`[fuzz] seed ${SEED} (FUZZ_SEED=${SEED} replays this run), ${TARGETS.length} route × method pairs`);
  });

  test.afterAll(async () => {
    const seconds = ((Date.now() - started) / 1000).toFixed(0);
    console.log(`[fuzz] ${casesRun} cases over ${perTarget.length} route × method pairs in ${seconds} s (seed ${SEED})\n  ${perTarget.join("\n  ")}`);
    test.info().annotations.push({ type: "fuzz", description: `${casesRun} cases, ${perTarget.length} route × method pairs, seed ${SEED}` });
    for (const ctx of contexts.values()) await ctx.dispose();
    db?.close();
  });

  test("every route × method under app/api/v1 has an access-table row naming who may call it", () => {
    const missing = TARGETS.filter((t) => !ACCESS_TABLE.some((r) => r.route === t.pattern && r.method === t.method)).map((t) => `${t.method} ${t.pattern}`);
    expect(missing, "add a row to tests/e2e/access-table.ts for each, so the fuzz knows whom to send").toEqual([]);
    expect(TARGETS.length).toBeGreaterThan(30);
  });

  for (const [index, target] of TARGETS.entries()) {
    test(`${target.method} ${target.pattern}`, async () => {
      test.setTimeout(180_000);
      const row = ACCESS_TABLE.find((r) => r.route === target.pattern && r.method === target.method);
      test.skip(!row, "no access-table row: the test above fails for it");
      if (!row) return;
      const who = callerFor(row);
      expect(who, `${target.method} ${target.pattern}: the access table lets nobody through`).toBeDefined();
      const ctx = contexts.get(who ?? "signedOut");
      const store = tracker;
      if (!ctx || !store) throw new Error("beforeAll did not finish");
      const base = fillPlaceholders(row.url, ids);
      expect(base, `unknown placeholder in ${row.url}: give the fuzz an id for it`).not.toMatch(/\{\w+\}/);
      const path = base.split("?")[0] ?? base;
      const sample = SAMPLES[`${target.method} ${target.pattern}`];
      const statuses = new Map<number, number>();
      let runs = 0;

      const property = fc.asyncProperty(fuzzCases(sample, target.takesBody), async (c: FuzzCase) => {
        runs++;
        const url = c.query ? `${path}?${c.query}` : base;
        const headers: Record<string, string> = {};
        if (c.contentType !== undefined) headers["content-type"] = c.contentType;
        if (c.idempotencyKey !== undefined) headers["idempotency-key"] = c.idempotencyKey;
        const r = await ctx.fetch(url, { method: target.method, headers, data: c.body, maxRedirects: 0, failOnStatusCode: false, timeout: 30_000 });
        const status = r.status();
        statuses.set(status, (statuses.get(status) ?? 0) + 1);
        const text = await r.text();
        const where = `${target.method} ${url.slice(0, 160)} as ${who} — ${c.label}\n  → ${status} ${describeBody(text)}`;
        expect(status, where).toBeLessThan(500);
        if (status >= 400) {
          expect(r.headers()["content-type"] ?? "", where).toContain("application/json");
          const error = (JSON.parse(text) as { error?: { message?: unknown; fieldErrors?: Record<string, unknown> } }).error;
          expect(typeof error?.message === "string" && error.message.trim().length > 0, `${where}\n  a refusal says why in error.message`).toBe(true);
          if (status === 400) {
            const fields = Object.entries(error?.fieldErrors ?? {});
            expect(fields.length, `${where}\n  a 400 names the field(s) in error.fieldErrors`).toBeGreaterThan(0);
            for (const [field, messages] of fields) {
              expect(Array.isArray(messages) && messages.length > 0 && messages.every((m) => typeof m === "string" && m.length > 0), `${where}\n  fieldErrors.${field}`).toBe(true);
            }
          }
          if (status === 429) expect(Number(r.headers()["retry-after"]), where).toBeGreaterThan(0);
        }
        if (status >= 400 || target.method === "GET") {
          const changed = await store.changedTables();
          expect(changed, `${where}\n  a refused request (or a GET) stored something`).toEqual([]);
        } else {
          await store.settle();
        }
      });
      try {
        await fc.assert(property, {
          numRuns: target.takesBody ? RUNS_WITH_BODY : RUNS_WITHOUT_BODY,
          seed: SEED + index,
          interruptAfterTimeLimit: 150_000,
        });
      } finally {
        casesRun += runs;
        const seen = [...statuses.entries()].sort(([a], [b]) => a - b).map(([s, n]) => `${s}×${n}`).join(" ");
        perTarget.push(`${target.method} ${target.pattern} as ${who}: ${runs} cases (${seen})`);
        test.info().annotations.push({ type: "fuzz", description: `${runs} cases (${seen})` });
      }
    });
  }
});
