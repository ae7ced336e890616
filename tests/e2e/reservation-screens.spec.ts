import { expect, test } from "@playwright/test";
import { DEMO, signIn, watchConsole } from "./support";
import { apiAs } from "./reservation-support";

// The reservation screens with the seeded demo data, at desktop size and (tagged @phone) at 390×844, saved for
// people to look at (test-results/screens). Fails on console errors, error responses or off-machine requests.
test.describe("reservation screens @phone", () => {
  test("the hatchery's batches and reservation table", async ({ page }, info) => {
    const problems = watchConsole(page);
    await signIn(page, DEMO.hatchery);
    await page.goto("/hatchery/batches");
    await expect(page.getByRole("heading", { level: 1, name: "Your batches" })).toBeVisible();
    await page.screenshot({ path: `test-results/screens/hatchery-batches-${info.project.name}.png`, fullPage: true });
    await page.goto("/hatchery/reservations");
    await expect(page.getByRole("heading", { level: 1, name: "Reservations" })).toBeVisible();
    await expect(page.getByText(/reservations? · page 1 of/)).toBeVisible();
    // The default view: open reservations, newest first; seeded requests wait for an answer.
    await expect(page.getByRole("button", { name: /^Accept / }).first()).toBeVisible();
    await page.screenshot({ path: `test-results/screens/hatchery-reservations-${info.project.name}.png`, fullPage: true });
    expect(problems).toEqual([]);
  });

  test("the farmer's reservations, the quarantine week and the deposit form", async ({ page }, info) => {
    const problems = watchConsole(page);
    await signIn(page, DEMO.farmer);
    // The hatchery's public page with its batches and the Reserve action.
    const hatchery = await apiAs(DEMO.hatchery);
    const provider = (await (await hatchery.ctx.get(`/api/v1/providers/${hatchery.id}`)).json()) as { provider: { displayName: string } };
    await hatchery.ctx.dispose();
    await page.goto(`/providers/${hatchery.id}`);
    await expect(page.getByRole("heading", { level: 1, name: provider.provider.displayName })).toBeVisible();
    await expect(page.getByRole("link", { name: "Reserve" }).first()).toBeVisible();
    await page.screenshot({ path: `test-results/screens/provider-batches-${info.project.name}.png`, fullPage: true });
    await page.goto("/farmer/reservations");
    await expect(page.getByRole("heading", { level: 1, name: "Your reservations" })).toBeVisible();
    await page.screenshot({ path: `test-results/screens/farmer-reservations-${info.project.name}.png`, fullPage: true });
    await page.getByRole("link").filter({ hasText: "Quarantine week" }).first().click();
    await expect(page.getByText(/Quarantine week: day \d of 7\./)).toBeVisible();
    await expect(page.getByRole("heading", { name: "Quarantine checklist" })).toBeVisible();
    await page.screenshot({ path: `test-results/screens/farmer-reservation-${info.project.name}.png`, fullPage: true });
    await page.goto("/farmer/reservations");
    await page.getByRole("link").filter({ hasText: "Accepted: deposit to pay" }).first().click();
    await expect(page.getByRole("heading", { name: "Pay the deposit" })).toBeVisible();
    await page.screenshot({ path: `test-results/screens/farmer-pay-${info.project.name}.png`, fullPage: true });
    expect(problems).toEqual([]);
  });
});
