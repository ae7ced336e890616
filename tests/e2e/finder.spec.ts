import { expect, test } from "@playwright/test";
import { watchConsole } from "./support";

test.describe("find nearby @phone", () => {
  test("open the map, see markers on our basemap, filter, and open a provider; list and map agree", async ({ page }, info) => {
    const problems = watchConsole(page);
    const phone = info.project.name === "phone";
    await page.goto("/map?lat=-15.4167&lng=28.2833&place=Lusaka&radiusKm=100");
    await expect(page.getByRole("heading", { level: 1, name: "Builders and hatcheries near you" })).toBeVisible();
    const results = page.getByTestId("result");
    await expect(results.first()).toBeVisible();
    const listCount = await results.count();
    expect(listCount).toBeGreaterThan(5);

    // Distances are shown and sorted nearest first.
    const distances = (await page.getByTestId("result-distance").allTextContents()).map((t) => Number.parseFloat(t));
    expect(distances).toEqual([...distances].sort((a, b) => a - b));
    expect(distances.at(-1) ?? 0).toBeLessThanOrEqual(100);

    if (phone) await page.getByRole("tab", { name: "Map" }).click();
    const map = page.getByTestId("finder-map");
    await expect(map.locator("canvas")).toBeVisible({ timeout: 20_000 });
    // Markers and clusters together account for every listed result.
    await expect
      .poll(async () => {
        const markers = await map.getByTestId("map-marker").count();
        const clustered = await map.getByRole("button", { name: /providers here/ }).evaluateAll((els) =>
          els.reduce((n, el) => n + Number.parseInt(el.textContent ?? "0", 10), 0),
        );
        return markers + clustered;
      })
      .toBe(listCount);
    await page.waitForTimeout(800); // let the basemap finish drawing before the picture
    await page.screenshot({ path: `test-results/screens/map-${info.project.name}.png` });

    // Filter: builders of concrete tanks only. The URL holds the filters.
    if (phone) {
      await page.getByRole("tab", { name: "List" }).click();
      // On phones the detailed filters fold away behind one button.
      await page.getByRole("button", { name: /^Filters/ }).click();
    }
    await page.getByText("Tank builders", { exact: true }).click();
    await page.getByText("Concrete", { exact: true }).click();
    await expect(page).toHaveURL(/kind=builder/);
    await expect(page).toHaveURL(/tankType=concrete/);
    await expect(page.getByTestId("result-count")).toBeVisible();
    const filtered = await results.count();
    expect(filtered).toBeGreaterThan(0);
    expect(filtered).toBeLessThan(listCount);
    for (const text of await results.allTextContents()) {
      expect(text).toContain("Tank builder");
      expect(text).toContain("Concrete");
    }

    // Reloading the shared URL gives the same results.
    const before = await results.allTextContents();
    await page.reload();
    await expect(results.first()).toBeVisible();
    expect(await results.allTextContents()).toEqual(before);

    // Open the first provider.
    const name = (await results.first().getByRole("link").textContent()) ?? "";
    await results.first().getByRole("link").click();
    await expect(page.getByRole("heading", { level: 1, name })).toBeVisible();
    await expect(page.getByRole("heading", { name: "Tanks and starting prices" })).toBeVisible();
    await expect(page.getByRole("link", { name: "Call" })).toHaveAttribute("href", /^tel:\+260/);
    // The map loads as it nears the screen (below the reviews on a phone), so scroll to it as a reader would.
    const area = page.getByRole("region", { name: /Map of the area served/ });
    await area.scrollIntoViewIfNeeded();
    await expect(area.locator("canvas")).toBeVisible({ timeout: 20_000 });
    await page.waitForTimeout(800);
    await page.screenshot({ path: `test-results/screens/provider-${info.project.name}.png`, fullPage: true });
    expect(problems).toEqual([]);
  });

  test("bad search parameters are refused with a message naming the field", async ({ request }) => {
    for (const [qs, field] of [
      ["lat=abc&lng=28", "lat"],
      ["lat=-15&lng=28&radiusKm=0", "radiusKm"],
      ["lat=-15&lng=28&kind=shop", "kind"],
      ["lat=-15&lng=28&cursor=xyz", "cursor"],
      ["lng=28", "lat"],
    ] as const) {
      const r = await request.get(`/api/v1/listings/nearby?${qs}`);
      expect(r.status(), qs).toBe(400);
      const body = (await r.json()) as { error: { message: string; fieldErrors: Record<string, string[]> } };
      expect(Object.keys(body.error.fieldErrors), qs).toContain(field);
    }
  });
});
