import AxeBuilder from "@axe-core/playwright";
import { expect, test, type Page } from "@playwright/test";
import { DEMO, signIn, watchConsole } from "./support";

// When the network or the server lets a person down: a failed save keeps every typed value and says what happened,
// the same button then sends it; the offline banner comes and goes with the connection; a page that loads shows its
// skeleton, announced to screen readers. Screenshots of each land in test-results/screens for people to look at.

function dateInDays(days: number): string {
  return new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);
}

/** Lets the first matching request fail in the given way, then lets the rest through. */
async function failOnce(page: Page, path: string, method: string, fail: "abort" | number): Promise<() => number> {
  let failed = 0;
  await page.route(
    (url) => url.pathname === path,
    async (route) => {
      if (route.request().method() !== method || failed > 0) return route.fallback();
      failed++;
      if (fail === "abort") return route.abort("internetdisconnected");
      return route.fulfill({ status: fail, contentType: "text/html", body: "<h1>Service unavailable</h1>" });
    },
  );
  return () => failed;
}

/** Holds the server's answer for a page (not the prefetch that brings its loading.tsx) until released. */
async function holdPage(page: Page, path: string): Promise<() => void> {
  let release: () => void = () => undefined;
  const held = new Promise<void>((resolve) => (release = resolve));
  await page.route(
    (url) => url.pathname === path,
    async (route) => {
      const headers = route.request().headers();
      if (headers.rsc === "1" && !headers["next-router-prefetch"]) await held;
      await route.fallback();
    },
  );
  return release;
}

test.describe("failures and slow loads @phone", () => {
  test("the tank request form keeps what was typed when the connection drops, and posts on the next try", async ({ page }, info) => {
    const problems = watchConsole(page);
    await signIn(page, DEMO.farmer);
    await page.goto("/farmer/requests/new");
    await page.getByLabel("Inner length (metres)").fill("4");
    await page.getByLabel("Inner width (metres)").fill("2.5");
    await page.getByLabel("Wall height or depth (metres)").fill("1.2");
    await page.getByLabel("Latitude (decimal degrees)").fill("-15.4167");
    await page.getByLabel("Longitude (decimal degrees)").fill("28.2833");
    await page.getByLabel("Water at the site").selectOption("mains");
    await page.getByLabel("Anything else builders should know (optional)").fill("Gate code 4417; the yard slopes a little to the east.");
    const failures = await failOnce(page, "/api/v1/tank-requests", "POST", "abort");

    await page.getByRole("button", { name: "Post the request" }).click();
    const alert = page.getByRole("alert").filter({ hasText: "You seem to be offline. Nothing was lost" });
    await expect(alert).toBeVisible();
    expect(failures()).toBe(1);
    await expect(page).toHaveURL(/\/farmer\/requests\/new$/);
    await expect(page.getByLabel("Inner length (metres)")).toHaveValue("4");
    await expect(page.getByLabel("Inner width (metres)")).toHaveValue("2.5");
    await expect(page.getByLabel("Wall height or depth (metres)")).toHaveValue("1.2");
    await expect(page.getByLabel("Latitude (decimal degrees)")).toHaveValue("-15.4167");
    await expect(page.getByLabel("Longitude (decimal degrees)")).toHaveValue("28.2833");
    await expect(page.getByLabel("Water at the site")).toHaveValue("mains");
    await expect(page.getByLabel("Anything else builders should know (optional)")).toHaveValue("Gate code 4417; the yard slopes a little to the east.");
    await alert.scrollIntoViewIfNeeded();
    await page.screenshot({ path: `test-results/screens/request-form-failed-${info.project.name}.png` });

    // The same button sends it; the request page shows what was typed.
    await page.getByRole("button", { name: "Post the request" }).click();
    await page.waitForURL(/\/farmer\/requests\/[0-9a-f-]{36}$/);
    await expect(page.getByText("Gate code 4417; the yard slopes a little to the east.")).toBeVisible();
    expect(problems).toEqual([]);
  });

  test("the batch form keeps what was typed when the server fails, and posts on the next try", async ({ page }, info) => {
    const problems = watchConsole(page, [/^503 POST \/api\/v1\/batches$/]);
    await signIn(page, DEMO.hatchery);
    await page.goto("/hatchery/batches/new");
    await page.getByLabel("Species").selectOption("catfish");
    // A size of its own per project, so the batch list's heading names exactly this one.
    const grams = String(7 + 2 * info.repeatEachIndex + (info.project.name === "phone" ? 1 : 0));
    await page.getByLabel("Mean weight (g)").fill(grams);
    await page.getByLabel("Mean length (cm)").fill("8.5");
    await page.getByLabel("Fish on offer").fill("640");
    await page.getByLabel("Price per fish").fill("1.45");
    await page.getByLabel("Ready from").fill(dateInDays(2));
    await page.getByLabel("Last day of sale").fill(dateInDays(40));
    await page.getByText("We deliver").click();
    const failures = await failOnce(page, "/api/v1/batches", "POST", 503);

    await page.getByRole("button", { name: "Post batch" }).click();
    const alert = page.getByRole("alert").filter({ hasText: "Shoal could not finish this just now (error 503). Nothing you typed was lost" });
    await expect(alert).toBeVisible();
    expect(failures()).toBe(1);
    await expect(page).toHaveURL(/\/hatchery\/batches\/new$/);
    await expect(page.getByLabel("Species")).toHaveValue("catfish");
    await expect(page.getByLabel("Mean weight (g)")).toHaveValue(grams);
    await expect(page.getByLabel("Mean length (cm)")).toHaveValue("8.5");
    await expect(page.getByLabel("Fish on offer")).toHaveValue("640");
    await expect(page.getByLabel("Price per fish")).toHaveValue("1.45");
    await expect(page.getByLabel("Ready from")).toHaveValue(dateInDays(2));
    await expect(page.getByLabel("Last day of sale")).toHaveValue(dateInDays(40));
    await expect(page.getByLabel("We deliver")).toBeChecked();
    await alert.scrollIntoViewIfNeeded();
    await page.screenshot({ path: `test-results/screens/batch-form-failed-${info.project.name}.png` });

    await page.getByRole("button", { name: "Post batch" }).click();
    await expect(page).toHaveURL(/\/hatchery\/batches$/);
    await expect(page.getByRole("heading", { name: `African catfish · ${grams} g / 8.5 cm` })).toBeVisible();
    expect(problems).toEqual([]);
  });

  test("the offline banner comes with the connection's loss and goes with its return", async ({ page, context }, info) => {
    const problems = watchConsole(page);
    await signIn(page, DEMO.hatchery);
    await page.goto("/hatchery/reservations");
    await expect(page.getByText(/reservations? · page 1 of/)).toBeVisible();
    const banner = page.getByTestId("offline-banner");
    await expect(banner).toBeEmpty();

    await context.setOffline(true);
    await expect(banner.getByText("You are offline.")).toBeVisible();
    await expect(banner).toHaveAttribute("aria-live", "polite");
    await page.screenshot({ path: `test-results/screens/offline-banner-${info.project.name}.png` });
    // A list that needs the server says so instead of spinning: the filter change waits for the connection.
    await page.getByLabel("Status").selectOption("done");
    await expect(page.getByText(/updating…|You are offline/).first()).toBeVisible();

    await context.setOffline(false);
    await expect(banner.getByText("Back online.")).toBeVisible();
    // The paused request goes out by itself: the list now shows the finished reservations.
    await expect(page.getByText("updating…")).toBeHidden();
    await expect(banner).toBeEmpty({ timeout: 10_000 });
    expect(problems).toEqual([]);
  });

  test("a page that is still loading shows its skeleton, announced, with no axe findings", async ({ page }, info) => {
    const problems = watchConsole(page);
    await signIn(page, DEMO.farmer);
    for (const { link, path, heading, name } of [
      { link: "Your fingerling reservations", path: "/farmer/reservations", heading: "Your reservations", name: "list" },
      { link: "Ask builders near you for a tank", path: "/farmer/requests/new", heading: "Ask for a tank", name: "form" },
    ]) {
      // The router can show loading.tsx at once only when it holds the layouts above it; on a first visit it may wait
      // for them instead. So: go there, come back through the header, and go again with the page's answer held.
      await page.goto("/dashboard");
      await page.getByRole("link", { name: link }).click();
      await expect(page.getByRole("heading", { level: 1, name: heading })).toBeVisible();
      await page.getByRole("link", { name: "My Shoal" }).click();
      await expect(page.getByRole("heading", { level: 1, name: /^Hello/ })).toBeVisible();
      const release = await holdPage(page, path);
      await page.getByRole("link", { name: link }).click();
      const skeleton = page.getByTestId("page-skeleton");
      await expect(skeleton).toBeVisible();
      await expect(skeleton).toHaveAttribute("role", "status");
      await expect(skeleton).toContainText("Loading…");
      await page.screenshot({ path: `test-results/screens/skeleton-${name}-${info.project.name}.png` });
      const axe = await new AxeBuilder({ page }).withTags(["wcag2a", "wcag2aa", "wcag21a", "wcag21aa", "wcag22aa"]).analyze();
      expect(axe.violations.map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(" ")).join(", ")}`)).toEqual([]);
      release();
      await expect(page.getByRole("heading", { level: 1, name: heading })).toBeVisible();
      await expect(skeleton).toBeHidden();
      await page.unrouteAll({ behavior: "wait" });
    }
    expect(problems).toEqual([]);
  });

  test("the focus ring on the home page's actions", async ({ page }, info) => {
    await page.goto("/");
    await page.keyboard.press("Tab");
    await page.screenshot({ path: `test-results/screens/focus-skip-link-${info.project.name}.png` });
    await page.getByRole("link", { name: "Find builders and hatcheries near you" }).focus();
    await page.keyboard.press("Tab"); // keyboard focus, so :focus-visible applies
    await page.keyboard.press("Shift+Tab");
    await page.screenshot({ path: `test-results/screens/focus-ring-${info.project.name}.png` });
    await expect(page.getByRole("link", { name: "Find builders and hatcheries near you" })).toBeFocused();
  });
});
