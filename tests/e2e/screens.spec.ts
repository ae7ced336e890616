import { expect, test } from "@playwright/test";
import { DEMO, signIn, watchConsole } from "./support";

// Renders the main screens at the project's viewport, saves screenshots for people to
// look at (test-results/screens), and fails on console errors or off-machine requests.
const PAGES = [
  { name: "home", url: "/", heading: /Shoal connects new fish farmers/ },
  { name: "sign-up", url: "/sign-up", heading: "Create your Shoal account" },
  { name: "safety", url: "/safety", heading: "Safety around tanks and pumps" },
  { name: "outbox", url: "/dev/outbox", heading: "Outbox" },
];

test.describe("main screens @phone", () => {
  for (const p of PAGES) {
    test(`${p.name} renders cleanly`, async ({ page }, info) => {
      const problems = watchConsole(page);
      await page.goto(p.url);
      await expect(page.getByRole("heading", { level: 1, name: p.heading })).toBeVisible();
      await page.screenshot({ path: `test-results/screens/${p.name}-${info.project.name}.png`, fullPage: true });
      expect(problems).toEqual([]);
    });
  }

  test("dashboards render cleanly for each role", async ({ page }, info) => {
    const problems = watchConsole(page);
    for (const who of ["farmer", "builder", "admin"] as const) {
      await page.context().clearCookies();
      await signIn(page, DEMO[who]);
      await expect(page.getByRole("heading", { level: 1 })).toContainText("Hello");
      await page.screenshot({ path: `test-results/screens/dashboard-${who}-${info.project.name}.png`, fullPage: true });
    }
    await page.goto("/admin");
    await expect(page.getByRole("heading", { name: "Provider verification" })).toBeVisible();
    await page.screenshot({ path: `test-results/screens/admin-${info.project.name}.png`, fullPage: true });
    expect(problems).toEqual([]);
  });
});
