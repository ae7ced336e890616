import { expect, test, type Locator, type Page } from "@playwright/test";
import { DEMO, DEMO_PASSWORD, watchConsole } from "./support";

// The app used with a keyboard alone: Tab reaches every control in order, each focused control shows a ring
// (WCAG 2.2 SC 2.4.7 Focus Visible), forms fill and send with keys only, and inline confirmation steps keep focus.

type Focused = { tag: string; name: string; ring: boolean; inView: boolean; style: string };

/** What has focus now, and whether it shows an outline or a box-shadow and sits on screen. */
async function focused(page: Page): Promise<Focused | null> {
  return page.evaluate(() => {
    const el = document.activeElement;
    if (!(el instanceof HTMLElement) || el === document.body) return null;
    const cs = getComputedStyle(el);
    const outline = cs.outlineStyle !== "none" && Number.parseFloat(cs.outlineWidth) >= 2;
    const shadow = cs.boxShadow !== "none" && cs.boxShadow !== "";
    const box = el.getBoundingClientRect();
    const inView = box.width > 1 && box.height > 1 && box.bottom > 0 && box.right > 0 && box.top < window.innerHeight && box.left < window.innerWidth;
    const name = (el.getAttribute("aria-label") ?? el.textContent ?? el.getAttribute("name") ?? el.id).replace(/\s+/g, " ").trim().slice(0, 60);
    return { tag: el.tagName.toLowerCase(), name, ring: outline || shadow, inView, style: `outline ${cs.outlineStyle} ${cs.outlineWidth} ${cs.outlineColor}; shadow ${cs.boxShadow}` };
  });
}

/** Presses Tab (or Shift+Tab) until `target` has focus; fails if it is not reached within `max` presses. */
async function tabTo(page: Page, target: Locator, max = 60, key = "Tab"): Promise<void> {
  for (let i = 0; i < max; i++) {
    if (await target.evaluate((el) => el === document.activeElement).catch(() => false)) return;
    await page.keyboard.press(key);
  }
  await expect(target, `reached with ${key} within ${max} presses`).toBeFocused();
}

test.describe("keyboard only @phone", () => {
  test("the home page: a skip link first, then every control shows its focus ring", async ({ page }) => {
    const problems = watchConsole(page);
    await page.goto("/");
    await page.keyboard.press("Tab");
    const skip = page.getByRole("link", { name: "Skip to content" });
    await expect(skip).toBeFocused();
    await expect(skip).toBeInViewport();
    expect((await focused(page))?.ring, "the skip link shows a ring").toBe(true);

    // Every stop from the top of the page to the footer (after the last one focus leaves the page): each on
    // screen, each with a ring.
    const stops: Focused[] = [];
    for (let i = 0; i < 60; i++) {
      await page.keyboard.press("Tab");
      const now = await focused(page);
      if (!now || now.name === "Skip to content") break;
      stops.push(now);
    }
    expect(stops.length, "controls reached on the home page").toBeGreaterThan(8);
    const bare = stops.filter((s) => !s.ring || !s.inView);
    expect(bare, "focused controls with no visible ring, or off screen").toEqual([]);
    // The hero's main action is among them, in reading order after the header.
    const names = stops.map((s) => s.name);
    expect(names.indexOf("Find builders and hatcheries near you")).toBeGreaterThan(names.indexOf("Shoal"));

    // The skip link moves focus into the content, so the next Tab lands on the hero's first action.
    await page.goto("/");
    await page.keyboard.press("Tab");
    await page.keyboard.press("Enter");
    await expect(page.locator("main")).toBeFocused();
    await page.keyboard.press("Tab");
    expect((await focused(page))?.name).toBe("Find builders and hatcheries near you");
    expect(problems).toEqual([]);
  });

  test("sign in with the keyboard alone", async ({ page }) => {
    const problems = watchConsole(page);
    await page.goto("/sign-in");
    const email = page.getByLabel("E-mail");
    await tabTo(page, email);
    expect((await focused(page))?.ring).toBe(true);
    await page.keyboard.type(DEMO.farmer);
    await page.keyboard.press("Tab");
    await expect(page.getByLabel("Password")).toBeFocused();
    expect((await focused(page))?.ring).toBe(true);
    await page.keyboard.type(DEMO_PASSWORD);
    await page.keyboard.press("Tab");
    await expect(page.getByRole("button", { name: "Sign in" })).toBeFocused();
    expect((await focused(page))?.ring).toBe(true);
    await page.keyboard.press("Enter");
    await page.waitForURL(/\/dashboard/);
    await expect(page.getByRole("heading", { level: 1 })).toContainText("Hello");
    expect(problems).toEqual([]);
  });

  test("fill the planner with the keyboard alone", async ({ page }) => {
    const problems = watchConsole(page);
    await page.goto("/planner");
    await expect(page.getByRole("heading", { level: 1, name: "Plan a tank" })).toBeVisible();

    // Length 6 m on the default 1.8288 m (6 ft) width and 1 m of water: 6 × 1.8288 × 1 = 10.9728 m³ (box volume,
    // arithmetic by hand, as in planner.spec.ts).
    const length = page.getByLabel("Length (m)", { exact: true });
    await tabTo(page, length, 80);
    expect((await focused(page))?.ring).toBe(true);
    await page.keyboard.press("ControlOrMeta+A");
    await page.keyboard.type("6");
    await expect(page.getByTestId("figure-volume")).toHaveText("10.97 m³");

    // A radio group moves with the arrow keys: from metres to feet, 6 m shows as 19.685 ft (6 / 0.3048, the
    // international foot of 1959) and no figure moves.
    const metres = page.getByRole("radio", { name: "Metres" });
    await tabTo(page, metres, 40, "Shift+Tab");
    expect((await focused(page))?.ring).toBe(true);
    await page.keyboard.press("ArrowRight");
    await expect(page.getByRole("radio", { name: "Feet" })).toBeChecked();
    await expect(page.getByLabel("Length (ft)", { exact: true })).toHaveValue("19.685");
    await expect(page.getByTestId("figure-volume")).toHaveText("10.97 m³");

    // Round, 2 m across (in metres again), 1 m deep: π × 1² × 1 = 3.14 m³ (cylinder volume πr²h).
    await page.keyboard.press("ArrowLeft");
    await expect(metres).toBeChecked();
    const round = page.getByRole("radio", { name: "Round", exact: true });
    const rectangular = page.getByRole("radio", { name: "Rectangular", exact: true });
    await tabTo(page, rectangular, 40, "Shift+Tab");
    await page.keyboard.press("ArrowRight");
    await expect(round).toBeChecked();
    const diameter = page.getByLabel("Diameter (m)", { exact: true });
    await tabTo(page, diameter, 20);
    await page.keyboard.press("ControlOrMeta+A");
    await page.keyboard.type("2");
    await expect(page.getByTestId("figure-volume")).toHaveText("3.14 m³");
    expect(problems).toEqual([]);
  });

  test("the map's result list: every result reached with Tab, Enter opens the provider", async ({ page }) => {
    const problems = watchConsole(page);
    await page.goto("/map?lat=-15.4167&lng=28.2833&radiusKm=50&kind=builder");
    const links = page.getByTestId("result").getByRole("link");
    await expect(links.first()).toBeVisible();
    const count = Math.min(await links.count(), 5);
    expect(count).toBeGreaterThan(1);
    await tabTo(page, links.first(), 80);
    expect((await focused(page))?.ring).toBe(true);
    for (let i = 1; i < count; i++) {
      await tabTo(page, links.nth(i), 4); // at most the card's "Show on map" button in between
      const now = await focused(page);
      expect(now?.ring && now.inView, `result ${i + 1} shows its focus on screen`).toBe(true);
    }
    const href = await links.nth(count - 1).getAttribute("href");
    await page.keyboard.press("Enter");
    await page.waitForURL((url) => url.pathname === href);
    await expect(page.getByRole("heading", { level: 1 })).toBeVisible();
    expect(problems).toEqual([]);
  });

  test("from a result, Show on map opens its popup with focus inside; closing it gives focus back", async ({ page }, info) => {
    const problems = watchConsole(page);
    await page.goto("/map?lat=-15.4167&lng=28.2833&radiusKm=50&kind=builder");
    const show = page.getByTestId("result").first().getByRole("button", { name: "Show on map" });
    await expect(show).toBeVisible();
    await show.focus();
    await page.keyboard.press("Enter");
    const popup = page.getByTestId("map-popup");
    await expect(popup).toBeVisible();
    await expect(popup.getByRole("link", { name: "Open profile" })).toBeFocused();
    // The popup's own close button (maplibre's, labelled "Close popup") is reached with Tab.
    await tabTo(page, page.getByRole("button", { name: "Close popup" }), 3);
    await page.keyboard.press("Enter");
    await expect(popup).toHaveCount(0);
    // Desktop: back on the same result's button; phone (map shown instead of the list): on the List tab.
    if (info.project.name === "phone") await expect(page.getByRole("tab", { name: "List" })).toBeFocused();
    else await expect(show).toBeFocused();
    expect(problems).toEqual([]);
  });

  test("an inline confirmation takes focus, Escape backs out and gives it back", async ({ page }) => {
    const problems = watchConsole(page);
    await page.goto("/sign-in");
    await page.getByLabel("E-mail").fill(DEMO.farmer);
    await page.getByLabel("Password").fill(DEMO_PASSWORD);
    await page.getByLabel("Password").press("Enter");
    await page.waitForURL(/\/dashboard/);
    // The demo farmer's seeded request with two quotes (db/seed-jobs.ts).
    await page.goto("/farmer/requests");
    await page.getByRole("link", { name: /tarpaulin on frame tank, 10 × 6 ft/i }).last().click();
    const accept = page.getByRole("button", { name: /^Accept .+'s quote$/ }).first();
    await expect(accept).toBeVisible();
    await tabTo(page, accept, 80);
    const label = await accept.textContent();
    await page.keyboard.press("Enter");
    await expect(page.getByRole("button", { name: "Yes, accept" })).toBeFocused();
    await page.keyboard.press("Escape");
    const again = page.getByRole("button", { name: label ?? "" });
    await expect(again).toBeFocused();
    expect((await focused(page))?.ring).toBe(true);
    expect(problems).toEqual([]);
  });
});
