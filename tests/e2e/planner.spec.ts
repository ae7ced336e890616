import AxeBuilder from "@axe-core/playwright";
import { expect, request as newRequest, test, type APIRequestContext, type Page } from "@playwright/test";
import { E2E_BASE_URL } from "./ports";
import { DEMO, DEMO_PASSWORD, watchConsole } from "./support";

// The tank planner in the browser: live figures and charts, each warning, saving as the demo farmer, the link, print.
// Figures are checked against arithmetic done by hand on the default 10 ft × 6 ft tank (1 ft = 0.3048 m exactly,
// NBS 1959): floor 3.048 m × 1.8288 m = 5.5741824 m², so 1 m of water is 5.5741824 m³ and, at 1000 kg/m³ (round
// figure for fresh water), 5.574 t; pressure ρgh = 1000 × 9.80665 (standard gravity, 3rd CGPM 1901) × 1 = 9.81 kPa.

const field = (page: Page, label: string) => page.getByLabel(label, { exact: true });
const figure = (page: Page, id: string) => page.getByTestId(id);
const warning = (page: Page, code: string) => page.getByTestId("plan-warnings").locator(`[data-code="${code}"]`);

async function apiAs(who: keyof typeof DEMO | "hatcheryBuilder" | "signedOut"): Promise<APIRequestContext> {
  const ctx = await newRequest.newContext({ baseURL: E2E_BASE_URL, extraHTTPHeaders: { origin: E2E_BASE_URL } });
  if (who !== "signedOut") {
    const email = who === "hatcheryBuilder" ? "hatchery-builder@shoal.demo" : DEMO[who];
    const r = await ctx.post("/api/auth/sign-in/email", { data: { email, password: DEMO_PASSWORD } });
    expect(r.status(), `sign in as ${who}`).toBe(200);
  }
  return ctx;
}

/**
 * A full-page screenshot from the top. The phone's fixed summary strip is laid out in the flow for the picture, or a
 * full-page capture would paint it across the middle of the page.
 */
async function shoot(page: Page, name: string): Promise<void> {
  await page.evaluate(() => window.scrollTo(0, 0));
  await page.screenshot({ path: `test-results/screens/${name}.png`, fullPage: true, style: "[data-testid=summary-bar]{position:static!important}" });
}

async function numberOf(page: Page, testId: string, attribute: string): Promise<number> {
  return Number(await page.getByTestId(testId).getAttribute(attribute));
}

test.describe("tank planner @phone", () => {
  test("figures and charts follow the size as it is typed, in metres or feet", async ({ page }, info) => {
    const problems = watchConsole(page);
    await page.goto("/planner");
    await expect(page.getByRole("heading", { level: 1, name: "Plan a tank" })).toBeVisible();
    await expect(figure(page, "figure-volume")).toHaveText("5.57 m³");
    await expect(page.getByText("5,574 litres")).toBeVisible();
    await expect(figure(page, "figure-weight")).toHaveText("5.57 t");
    await expect(page.getByText("9.81 kPa on the floor")).toBeVisible();
    // Liner sheet: floor plus walls of 1.3 m (1 m water + 0.3 m freeboard) plus 0.3 m fold on each edge:
    // 3.048 + 2 × 1.6 = 6.248 m by 1.8288 + 3.2 = 5.0288 m (lib/planner/geometry.ts rule, arithmetic by hand).
    await expect(page.getByText("6.25 m × 5.03 m")).toBeVisible();
    const peakBefore = await numberOf(page, "chart-biomass", "data-peak");
    const costBefore = await numberOf(page, "chart-costs", "data-total");
    expect(peakBefore).toBeGreaterThan(0);

    // 6 m × 1.8288 m × 1 m = 10.9728 m³: twice the fish room, so more biomass on the chart and a dearer cycle.
    await field(page, "Length (m)").fill("6");
    await expect(figure(page, "figure-volume")).toHaveText("10.97 m³");
    await expect(figure(page, "figure-weight")).toHaveText("10.97 t");
    await expect.poll(() => numberOf(page, "chart-biomass", "data-peak")).toBeGreaterThan(peakBefore * 1.8);
    await expect.poll(() => numberOf(page, "chart-costs", "data-total")).toBeGreaterThan(costBefore);

    // Feet: 6 m shows as 19.685 ft (6 / 0.3048), the width as 6 ft, and no figure moves.
    await page.getByRole("radio", { name: "Feet" }).check();
    await expect(field(page, "Length (ft)")).toHaveValue("19.685");
    await expect(field(page, "Width (ft)")).toHaveValue("6");
    await expect(figure(page, "figure-volume")).toHaveText("10.97 m³");
    await field(page, "Length (ft)").fill("10");
    await expect(figure(page, "figure-volume")).toHaveText("5.57 m³");

    // A round tank 2 m across, 1 m deep: π × 1² × 1 = 3.14 m³ (cylinder volume πr²h).
    await page.getByRole("radio", { name: "Metres" }).check();
    await page.getByRole("radio", { name: "Round", exact: true }).check();
    await field(page, "Diameter (m)").fill("2");
    await expect(figure(page, "figure-volume")).toHaveText("3.14 m³");

    // A value out of range keeps the last figures and says which field to fix, in the unit shown.
    await field(page, "Water depth (m)").fill("9");
    await expect(page.getByTestId("stale-figures")).toContainText("Water depth must be between 0.2 and 3 m");
    await expect(figure(page, "figure-volume")).toHaveText("3.14 m³");
    await field(page, "Water depth (m)").fill("1.5");
    await expect(page.getByTestId("stale-figures")).toBeHidden();
    await expect(figure(page, "figure-volume")).toHaveText("4.71 m³");

    await page.getByRole("button", { name: "Start again from the defaults" }).click();
    await expect(figure(page, "figure-volume")).toHaveText("5.57 m³");
    // An earthen pond is only partly exchanged (a tenth a week, lib/validations/planner.ts): the untouched schedule follows.
    await page.getByRole("radio", { name: /^Earthen pond/ }).check();
    await expect(field(page, "Share of the water changed (%)")).toHaveValue("10");
    await expect(page.getByTestId("chart-tank-types").getByTestId("tank-type-earthen")).toContainText("this plan");
    await page.getByRole("radio", { name: /^Tarpaulin on a frame/ }).check();
    await expect(field(page, "Share of the water changed (%)")).toHaveValue("100");
    await shoot(page, `planner-${info.project.name}`);
    expect(problems).toEqual([]);
  });

  test("each warning shows where it applies, and the safety cautions always", async ({ page }, info) => {
    const problems = watchConsole(page);
    await page.goto("/planner");
    await expect(page.getByTestId("plan-warnings")).toContainText("No warnings for this plan.");
    const cautions = page.getByTestId("plan-cautions");
    for (const code of ["children-deep-water", "electric-pump-near-water", "base-must-carry-water"]) await expect(cautions.locator(`[data-code="${code}"]`)).toBeVisible();

    // Over-density: the default tank carries a few hundred tilapia to 350 g; 5 000 is far above.
    await field(page, "Fish to stock (fish)").fill("5000");
    await expect(warning(page, "over-density")).toBeVisible();
    await field(page, "Fish to stock (fish)").fill("");
    await expect(warning(page, "over-density")).toBeHidden();

    // Black liner in full sun (tarpaulin tank).
    await page.getByLabel("Liner colour").selectOption("black");
    await page.getByLabel("Sun on the tank").selectOption("full-sun");
    await expect(warning(page, "black-liner-full-sun")).toBeVisible();
    await page.getByLabel("Liner colour").selectOption("blue");
    await expect(warning(page, "black-liner-full-sun")).toBeHidden();

    // Both species: tilapia of 10 g with catfish of 20 g will be eaten.
    await page.getByRole("radio", { name: "Both together" }).check();
    await field(page, "Tilapia stocking weight (g)").fill("10");
    await field(page, "Catfish stocking weight (g)").fill("20");
    await expect(warning(page, "tilapia-with-larger-catfish")).toBeVisible();
    // Catfish in full sun with no shade.
    await expect(warning(page, "catfish-without-shade")).toBeVisible();
    await shoot(page, `planner-warnings-${info.project.name}`);
    // What the screen shows with the charts in view (on a desktop the figures scroll beside the form).
    await page.getByTestId("chart-biomass").scrollIntoViewIfNeeded();
    await page.screenshot({ path: `test-results/screens/planner-charts-${info.project.name}.png` });

    await field(page, "Tilapia stocking weight (g)").fill("60");
    await expect(warning(page, "tilapia-with-larger-catfish")).toBeHidden();
    await page.getByLabel("Part of the tank is shaded or covered for the catfish").check();
    await expect(warning(page, "catfish-without-shade")).toBeHidden();
    expect(problems).toEqual([]);
  });

  test("the form works from the keyboard and every control has a label", async ({ page }) => {
    const problems = watchConsole(page);
    await page.goto("/planner");
    await field(page, "Length (m)").focus();
    await page.keyboard.press("ControlOrMeta+a");
    await page.keyboard.type("4");
    // 4 × 1.8288 × 1 = 7.3152 m³.
    await expect(figure(page, "figure-volume")).toHaveText("7.32 m³");
    // A changed field offers its default next in the tab order; Enter on it brings the default back.
    await page.keyboard.press("Tab");
    await expect(page.getByRole("button", { name: "Use the default" })).toBeFocused();
    await page.keyboard.press("Enter");
    await expect(field(page, "Length (m)")).toHaveValue("3.048");
    await expect(figure(page, "figure-volume")).toHaveText("5.57 m³");
    await field(page, "Length (m)").focus();
    await page.keyboard.press("Tab");
    await expect(field(page, "Width (m)")).toBeFocused();
    // Arrow keys move within a radio group.
    await page.getByRole("radio", { name: /^Tarpaulin on a frame/ }).focus();
    await page.keyboard.press("ArrowDown");
    await expect(page.getByRole("radio", { name: /^Concrete/ })).toBeChecked();
    await expect(page.getByTestId("chart-tank-types").getByTestId("tank-type-concrete")).toContainText("this plan");

    const unlabelled = await page.locator("form[aria-label='Plan inputs'] :is(input, select)").evaluateAll((els) =>
      els.filter((el) => !(el as HTMLInputElement).labels?.length && !el.closest("label")).map((el) => el.outerHTML),
    );
    expect(unlabelled).toEqual([]);
    const axe = await new AxeBuilder({ page }).withTags(["wcag2a", "wcag2aa", "wcag21aa"]).analyze();
    expect(axe.violations.map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(" ")).join(", ")}`)).toEqual([]);
    expect(problems).toEqual([]);
  });

  test("a visitor's draft survives signing in; the farmer saves, reopens by link and prints", async ({ page }, info) => {
    const problems = watchConsole(page);
    await page.goto("/planner");
    await field(page, "Length (m)").fill("4");
    await expect(figure(page, "figure-volume")).toHaveText("7.32 m³");

    await page.getByRole("link", { name: "Sign in to save" }).click();
    await expect(page).toHaveURL(/\/sign-in\?next=%2Fplanner/);
    await page.getByLabel("E-mail").fill(DEMO.farmer);
    await page.getByLabel("Password").fill(DEMO_PASSWORD);
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.waitForURL(/\/planner$/);
    await expect(field(page, "Length (m)")).toHaveValue("4");
    await expect(figure(page, "figure-volume")).toHaveText("7.32 m³");

    const name = `E2E plan ${info.project.name} ${Date.now()}`;
    await field(page, "Plan name").fill(name);
    await page.getByRole("button", { name: "Save plan" }).click();
    await expect(page.getByText("Saved. Anyone with the link below can read this plan.")).toBeVisible();
    await expect(page).toHaveURL(/\/planner\?from=[0-9a-f-]{36}$/);
    const href = await page.getByTestId("plan-link").getAttribute("href");
    expect(href).toMatch(/^\/plans\/[0-9a-f-]{36}$/);
    const id = (href ?? "").split("/").pop() ?? "";

    // A change is saved onto the same plan.
    await field(page, "Water depth (m)").fill("1.2");
    await page.getByRole("button", { name: "Save changes" }).click();
    await expect(page.getByText("Changes saved.")).toBeVisible();

    // Reopened by link, signed out: the same figures, worked out on the server (4 × 1.8288 × 1.2 = 8.778 m³).
    await page.context().clearCookies();
    await page.goto(href ?? "/");
    await expect(page.getByRole("heading", { level: 1, name })).toBeVisible();
    await expect(figure(page, "figure-volume")).toHaveText("8.78 m³");
    await expect(page.getByTestId("plan-inputs")).toContainText("4 m (13.1 ft) × 1.83 m (6 ft)");
    await expect(page.getByTestId("chart-biomass")).toBeVisible();
    await expect(page.getByRole("link", { name: "Try changes in the planner" })).toBeVisible();
    await shoot(page, `plan-page-${info.project.name}`);

    // Print: no site header, no buttons; figures and charts stay.
    await page.emulateMedia({ media: "print" });
    await expect(page.getByRole("button", { name: "Print" })).toBeHidden();
    await expect(page.getByRole("banner")).toBeHidden();
    await expect(figure(page, "figure-volume")).toBeVisible();
    await expect(page.getByTestId("chart-costs")).toBeVisible();
    await shoot(page, `plan-print-${info.project.name}`);
    await page.emulateMedia({ media: "screen" });

    // The planner prints its figures and what was entered, not the form.
    await page.goto("/planner");
    await page.emulateMedia({ media: "print" });
    await expect(page.locator("form[aria-label='Plan inputs']")).toBeHidden();
    await expect(page.getByTestId("plan-inputs")).toBeVisible();
    await expect(page.getByTestId("summary-bar")).toBeHidden();
    await page.emulateMedia({ media: "screen" });

    // The JSON a tank request page can call: anyone may read the plan; only its owner may change or delete it.
    const anyone = await apiAs("signedOut");
    const read = await anyone.get(`/api/v1/plans/${id}`);
    expect(read.status()).toBe(200);
    const body = (await read.json()) as { plan: { id: string; name: string; ownedByViewer: boolean; input: object }; summary: { waterVolumeM3: number; tankType: string } };
    expect(body.plan).toMatchObject({ id, name, ownedByViewer: false });
    expect(body.summary.waterVolumeM3).toBeCloseTo(4 * 1.8288 * 1.2, 9);
    expect(body.summary.tankType).toBe("tarpaulin");
    const otherFarmer = await apiAs("hatcheryBuilder");
    const hatchery = await apiAs("hatchery");
    const change = { name: "Not yours", input: body.plan.input };
    expect((await otherFarmer.put(`/api/v1/plans/${id}`, { data: change })).status()).toBe(403);
    expect((await hatchery.put(`/api/v1/plans/${id}`, { data: change })).status()).toBe(403);
    expect((await otherFarmer.delete(`/api/v1/plans/${id}`)).status()).toBe(403);
    expect((await anyone.delete(`/api/v1/plans/${id}`)).status()).toBe(401);
    expect((await anyone.get(`/api/v1/plans/${id}`)).status()).toBe(200);
    const farmer = await apiAs("farmer");
    const list = (await (await farmer.get("/api/v1/plans")).json()) as { plans: { id: string }[] };
    expect(list.plans.map((p) => p.id)).toContain(id);
    for (const ctx of [anyone, otherFarmer, hatchery, farmer]) await ctx.dispose();
    expect(problems).toEqual([]);
  });
});

test.describe("planner API", () => {
  test("a link to no plan is a 404 page that leads back to the planner", async ({ page }) => {
    const problems = watchConsole(page, [/^404 GET \/plans\/[0-9a-f-]{36}$/]);
    const reply = await page.goto("/plans/0b6c2f7e-5d1a-4c3b-9e8f-7a6b5c4d3e2f");
    expect(reply?.status()).toBe(404);
    await expect(page.getByRole("heading", { level: 1, name: "We could not find that plan" })).toBeVisible();
    await page.getByRole("link", { name: "Plan a tank of your own" }).click();
    await expect(page).toHaveURL(/\/planner$/);
    expect(problems).toEqual([]);
  });

  test("POST /api/plans/estimate answers the figures, and a 400 naming the field for bad input", async () => {
    const api = await apiAs("signedOut");
    const bad = await api.post("/api/plans/estimate", { data: { currency: "ZMW", tank: { type: "tarpaulin" } } });
    expect(bad.status()).toBe(400);
    const badBody = (await bad.json()) as { error: { message: string; fieldErrors: Record<string, string[]> } };
    expect(Object.keys(badBody.error.fieldErrors)).toContain("tank.dimensions");
    const notJson = await api.post("/api/plans/estimate", { headers: { "content-type": "application/json" }, data: "{not json" });
    expect(notJson.status()).toBe(400);

    // The defaults as the page sends them: the default tank (see the hand arithmetic at the top of this file).
    expect((await api.get("/api/v1/plans/00000000-0000-4000-8000-000000000000")).status()).toBe(404);
    const input = {
      currency: "ZMW",
      tank: { type: "tarpaulin", dimensions: { shape: "rectangular", lengthM: 3.048, widthM: 1.8288 }, waterDepthM: 1, freeboardM: 0.3, linerColour: "black", sunExposure: "full-sun" },
      species: "tilapia",
      tilapia: { stockingWeightG: 10, targetHarvestWeightG: 350, fingerlingPriceMinor: 150, salePricePerKgMinor: 6000, fcr: 1.5 },
      catfish: { stockingWeightG: 10, targetHarvestWeightG: 1000, fingerlingPriceMinor: 250, salePricePerKgMinor: 4500, fcr: 1.3 },
      tilapiaShareOfFishFraction: 0.8,
      growOutSurvivalFraction: 0.85,
      quarantineSurvivalFraction: 0.95,
      waterTemperatureC: 26,
      catfishShadeProvided: false,
      feedPricePerKgMinor: 1800,
      waterChange: { intervalDays: 7, fractionExchanged: 1 },
      pump: { headM: 5, efficiencyFraction: 0.4, electricityTariffPerKWhMinor: 150 },
      labourCostPerCycleMinor: 150000,
    };
    const good = await api.post("/api/plans/estimate", { data: input });
    expect(good.status()).toBe(200);
    const { estimate } = (await good.json()) as { estimate: { tank: { waterVolumeM3: number; basePressureKPa: number }; warnings: { code: string }[] } };
    expect(estimate.tank.waterVolumeM3).toBeCloseTo(5.5741824, 9);
    expect(estimate.tank.basePressureKPa).toBeCloseTo(9.80665, 9);
    expect(estimate.warnings.map((w) => w.code)).toContain("black-liner-full-sun");

    const deep = await api.post("/api/plans/estimate", { data: { ...input, tank: { ...input.tank, waterDepthM: 9 } } });
    expect(deep.status()).toBe(400);
    expect(((await deep.json()) as { error: { message: string } }).error.message).toBe("tank.waterDepthM: Water depth must be between 0.2 and 3 m");
    await api.dispose();
  });
});
