import AxeBuilder from "@axe-core/playwright";
import { expect, test, type APIRequestContext, type Page } from "@playwright/test";
import { randomUUID } from "node:crypto";
import { mkdirSync, writeFileSync } from "node:fs";
import { defaultPlanInput } from "@/lib/validations/planner";
import { ACCESS_TABLE, expected, VISITORS, type Visitor } from "./access-table";
import { apiVisitor, fillPlaceholders, matchesPattern, pagesInTree } from "./app-routes";
import { DEMO, signIn, uniqueEmail } from "./support";

// Every page of the app, opened by a visitor who may see it, scanned with axe-core for the WCAG 2.0/2.1/2.2 A and AA
// rules; a serious or critical finding fails. The page list comes from the access table (itself checked against
// app/ by the authorization spec), so a new page is scanned as soon as it has its row; a page that only answers
// for a real id is reached through a link to one (LINKED_PAGES) — a page with neither fails the first test below.

const WCAG_TAGS = ["wcag2a", "wcag2aa", "wcag21a", "wcag21aa", "wcag22aa"];
const BLOCKING = new Set(["serious", "critical"]);

/**
 * Pages that answer 200 only for an id that exists: who opens one, and where a link to one is found — a URL, or a
 * pattern meaning "the pages of that kind this visitor has seen links to" (at most a few are tried). Pages opened
 * on the way are scanned too, the first of each route.
 */
const LINKED_PAGES: { route: string; who: Visitor; from: string[] }[] = [
  { route: "/plans/[id]", who: "farmer", from: ["/planner"] },
  { route: "/dev/outbox/[id]", who: "signedOut", from: ["/dev/outbox"] },
  { route: "/farmer/requests/[id]", who: "farmer", from: ["/farmer/requests"] },
  { route: "/farmer/requests/[id]/review", who: "farmer", from: ["/farmer/requests/[id]"] },
  { route: "/farmer/reservations/[id]", who: "farmer", from: ["/farmer/reservations"] },
  { route: "/farmer/reservations/[id]/review", who: "farmer", from: ["/farmer/reservations/[id]"] },
  { route: "/farmer/reservations/new", who: "farmer", from: ["/providers/{hatcheryId}"] },
  { route: "/builder/requests/[id]", who: "builder", from: ["/builder/requests"] },
  { route: "/builder/jobs/[id]", who: "builder", from: ["/builder/jobs"] },
  { route: "/hatchery/batches/[id]/edit", who: "hatchery", from: ["/hatchery/batches"] },
  { route: "/hatchery/reservations/[id]", who: "hatchery", from: ["/hatchery/reservations"] },
];
const CANDIDATES_PER_PATTERN = 6;

/** The screens shown instead of a page: not found (the app's and a saved plan's) and another role's page. */
const STATUS_SCREENS: { who: Visitor; url: string; status: number }[] = [
  { who: "signedOut", url: "/no-such-page", status: 404 },
  { who: "signedOut", url: "/plans/00000000-0000-4000-8000-000000000000", status: 404 },
  { who: "farmer", url: "/admin", status: 403 },
];

type Visit = { route: string; url: string };

/** The access table's page rows, each with the visitors it answers 200 for: signed out if they may, else every role that may. */
function directVisits(): Map<Visitor, Visit[]> {
  const pages = new Set(pagesInTree());
  const out = new Map<Visitor, Visit[]>(VISITORS.map((v) => [v, []]));
  for (const row of ACCESS_TABLE) {
    if (row.method !== "GET" || !pages.has(row.route)) continue;
    const allowed = VISITORS.filter((v) => expected(row, v) === 200);
    for (const who of allowed.includes("signedOut") ? ["signedOut" as const] : allowed) out.get(who)?.push({ route: row.route, url: row.url });
  }
  return out;
}

test("every page of the app is scanned", () => {
  const direct = new Set([...directVisits().values()].flat().map((v) => v.route));
  const linked = new Set(LINKED_PAGES.map((l) => l.route));
  const tree = pagesInTree();
  expect(tree.filter((p) => !direct.has(p) && !linked.has(p)), "pages with no 200 row in access-table.ts and no entry in LINKED_PAGES").toEqual([]);
  expect([...linked].filter((p) => !tree.includes(p)), "LINKED_PAGES entries for pages that no longer exist").toEqual([]);
});

/** Waits until the page has loaded its data: no request in flight, no busy region, fonts in place. */
async function settle(page: Page): Promise<void> {
  await page.waitForLoadState("networkidle");
  await page.waitForFunction(() => document.querySelectorAll('[aria-busy="true"]').length === 0, undefined, { timeout: 15_000 });
  await page.evaluate(() => document.fonts.ready.then(() => undefined));
}

type Finding = { page: string; who: Visitor; rule: string; impact: string; help: string; targets: string[]; needsReview?: true };

async function scan(page: Page, who: Visitor, label: string, all: Finding[]): Promise<void> {
  // A sandboxed frame runs no scripts, so axe cannot look inside it (the dev outbox shows an e-mail's HTML in one);
  // the frame element itself is still checked (its title). Legacy mode runs axe in the page itself rather than
  // finishing in a blank page per scan: the app has no cross-origin frames, and the scan takes half the time.
  const result = await new AxeBuilder({ page }).withTags(WCAG_TAGS).exclude("iframe[sandbox]:not([sandbox~='allow-scripts'])").setLegacyMode().analyze();
  for (const v of result.violations) {
    all.push({ page: label, who, rule: v.id, impact: v.impact ?? "unknown", help: v.help, targets: v.nodes.map((n) => n.target.join(" ")) });
  }
  // What axe could not decide (text over a gradient or an image, mostly): written out for a person to check.
  for (const v of result.incomplete) {
    all.push({ page: label, who, rule: v.id, impact: v.impact ?? "unknown", help: v.help, targets: v.nodes.map((n) => n.target.join(" ")), needsReview: true });
  }
}

function report(findings: Finding[]): string[] {
  return findings.filter((f) => !f.needsReview && BLOCKING.has(f.impact)).flatMap((f) => f.targets.map((t) => `${f.rule} (${f.impact}) on ${f.page} as ${f.who}: ${t} — ${f.help}`));
}

/** A saved plan and an accepted quote (a job) for the demo farmer and builder, made once through the API: the seed has neither. */
async function ensurePlanAndJob(farmer: APIRequestContext, builder: APIRequestContext, builderId: string): Promise<void> {
  const plans = (await (await farmer.get("/api/v1/plans")).json()) as { plans: { id: string }[] };
  let planId = plans.plans[0]?.id;
  if (!planId) {
    const created = await farmer.post("/api/v1/plans", { data: { name: "Backyard tank, first cycle", input: defaultPlanInput } });
    expect(created.status(), await created.text()).toBe(201);
    planId = ((await created.json()) as { plan: { id: string } }).plan.id;
  }
  if (/href="\/builder\/jobs\/[0-9a-f-]{36}"/.test(await (await builder.get("/builder/jobs")).text())) return;
  const provider = (await (await builder.get(`/api/v1/providers/${builderId}`)).json()) as {
    provider: { point: { lat: number; lng: number }; builder: { prices: { tankType: string }[] } | null };
  };
  const tankType = provider.provider.builder?.prices[0]?.tankType ?? "concrete";
  const wanted = new Date(Date.now() + 30 * 86_400_000).toISOString().slice(0, 10);
  const posted = await farmer.post("/api/v1/tank-requests", {
    data: {
      id: randomUUID(),
      tankType,
      shape: "rectangular",
      unit: "m",
      length: "4",
      width: "3",
      diameter: "",
      depth: "1.2",
      lat: String(provider.provider.point.lat),
      lng: String(provider.provider.point.lng),
      readiness: "level_slab",
      waterSource: "borehole",
      power: "grid",
      wantedBy: wanted,
      planId,
      notes: "Behind the store room.",
    },
  });
  expect(posted.status(), await posted.text()).toBe(201);
  const requestId = ((await posted.json()) as { id: string }).id;
  const quoted = await builder.post(`/api/v1/tank-requests/${requestId}/quotes`, {
    data: { scope: "turnkey", note: "Two days of work.", lines: [{ kind: "labour", description: "Walls and floor", quantity: "1", unitPrice: "2500" }] },
  });
  expect(quoted.status(), await quoted.text()).toBe(201);
  const quote = (await quoted.json()) as { quoteId: string; version: number };
  const accepted = await farmer.post(`/api/v1/quotes/${quote.quoteId}/accept`, { data: { version: quote.version } });
  expect(accepted.ok(), await accepted.text()).toBe(true);
}

test.describe("accessibility @phone", () => {
  const ids: Record<string, string> = {};

  test.beforeAll(async () => {
    const farmer = await apiVisitor(DEMO.farmer);
    const builder = await apiVisitor(DEMO.builder);
    const hatchery = await apiVisitor(DEMO.hatchery);
    for (const [k, v] of [["farmerId", farmer.id], ["builderId", builder.id], ["hatcheryId", hatchery.id]] as const) if (v) ids[k] = v;
    await ensurePlanAndJob(farmer.ctx, builder.ctx, ids.builderId ?? "");
    // An e-mail for the outbox's message page: a new account's confirmation, to an address no other spec uses.
    const anyone = await apiVisitor(null);
    const outboxHasMail = async () => /href="\/dev\/outbox\/[^"]+"/.test(await (await anyone.ctx.get("/dev/outbox")).text());
    if (!(await outboxHasMail())) {
      const signUp = await anyone.ctx.post("/api/auth/sign-up/email", { data: { name: "Axe Scan", email: uniqueEmail("a11y"), password: "a11y-scan-password", callbackURL: "/onboarding" } });
      expect(signUp.ok(), await signUp.text()).toBe(true);
      await expect.poll(outboxHasMail, { timeout: 15_000, message: "the confirmation e-mail in the outbox" }).toBe(true);
    }
    await Promise.all([farmer.ctx.dispose(), builder.ctx.dispose(), hatchery.ctx.dispose(), anyone.ctx.dispose()]);
  });

  const visits = directVisits();
  const tree = pagesInTree();
  for (const who of VISITORS) {
    test(`pages ${who === "signedOut" ? "a signed-out visitor" : `the ${who}`} sees`, async ({ page }, info) => {
      test.setTimeout(240_000);
      const findings: Finding[] = [];
      // Every finding, minor ones too, is written out for whoever fixes them next; only serious and critical ones fail.
      const scanHere = async (label: string) => {
        await scan(page, who, label, findings);
        mkdirSync("test-results/a11y", { recursive: true });
        writeFileSync(`test-results/a11y/${who}-${info.project.name}.json`, JSON.stringify(findings, null, 2));
      };
      if (who !== "signedOut") await signIn(page, DEMO[who]);
      const scanned = new Set<string>();
      const seen: string[] = [];
      /**
       * Opens a page, checks its status and returns the same-origin links on it. It is scanned the first time its
       * route is opened (other reservations' pages, tried while looking for a link, are the same template).
       */
      const open = async (url: string, status = 200, label = url): Promise<string[]> => {
        const reply = await page.goto(url);
        expect(reply?.status(), url).toBe(status);
        await settle(page);
        const route = status === 200 ? (tree.find((p) => matchesPattern(url, p) && !p.includes("[")) ?? tree.find((p) => matchesPattern(url, p)) ?? url) : url;
        if (!scanned.has(route)) {
          scanned.add(route);
          await scanHere(label);
        }
        const links = await page.locator("a[href^='/']").evaluateAll((as) => as.map((a) => a.getAttribute("href") ?? ""));
        for (const l of links) if (!seen.includes(l)) seen.push(l);
        return links;
      };

      for (const visit of visits.get(who) ?? []) {
        const url = fillPlaceholders(visit.url, ids);
        await test.step(url, () => open(url).then(() => undefined));
      }

      for (const linked of LINKED_PAGES.filter((l) => l.who === who)) {
        await test.step(linked.route, async () => {
          let href: string | undefined;
          for (const source of linked.from.map((f) => fillPlaceholders(f, ids))) {
            const candidates = source.includes("[") ? seen.filter((h) => matchesPattern(h, source)).slice(0, CANDIDATES_PER_PATTERN) : [source];
            for (const candidate of candidates) {
              href = (await open(candidate)).find((h) => matchesPattern(h, linked.route));
              if (href) break;
            }
            if (href) break;
          }
          expect(href, `a link to ${linked.route} on ${linked.from.join(" or ")}`).toBeTruthy();
          if (href) await open(href);
        });
      }

      for (const screen of STATUS_SCREENS.filter((s) => s.who === who)) {
        await test.step(`${screen.status} ${screen.url}`, () => open(screen.url, screen.status, `${screen.url} (${screen.status})`).then(() => undefined));
      }

      await info.attach("axe-findings", { body: JSON.stringify(findings, null, 2), contentType: "application/json" });
      expect(report(findings), `axe: serious or critical findings (${info.project.name})`).toEqual([]);
    });
  }
});
