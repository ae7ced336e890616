import { expect, test } from "@playwright/test";
import { DEMO, signIn, watchConsole } from "./support";

// The planner's result travels with a tank request: save a plan, attach it when posting
// the request, and find it linked from the request.
test("a saved plan is attached to a tank request and linked from it", async ({ page }, info) => {
  const problems = watchConsole(page);
  await signIn(page, DEMO.farmer);
  await page.goto("/planner");
  const name = `Backyard tank ${info.project.name} ${Date.now()}`;
  await page.getByLabel("Plan name").fill(name);
  await page.getByRole("button", { name: "Save plan" }).click();
  await expect(page.getByText("Saved. Anyone with the link below can read this plan.")).toBeVisible();
  const planHref = (await page.getByTestId("plan-link").getAttribute("href")) ?? "";
  expect(planHref).toMatch(/^\/plans\/[0-9a-f-]{36}$/);

  await page.goto("/farmer/requests/new");
  await page.getByLabel("Inner length (metres)").fill("3.05");
  await page.getByLabel("Inner width (metres)").fill("1.83");
  await page.getByLabel("Wall height or depth (metres)").fill("1.2");
  await page.getByLabel("Latitude (decimal degrees)").fill("-15.42");
  await page.getByLabel("Longitude (decimal degrees)").fill("28.29");
  await page.getByLabel("Attach one of your saved plans (optional)").selectOption({ label: name });
  await page.getByRole("button", { name: "Post the request" }).click();
  await page.waitForURL(/\/farmer\/requests\/[0-9a-f-]{36}$/);
  const link = page.getByRole("link", { name });
  await expect(link).toHaveAttribute("href", planHref);
  await link.click();
  await expect(page.getByRole("heading", { level: 1, name })).toBeVisible();
  expect(problems).toEqual([]);
});
