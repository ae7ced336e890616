import { expect, request as newRequest, test, type Browser, type Page } from "@playwright/test";
import sharp from "sharp";
import { E2E_BASE_URL } from "./ports";
import { DEMO, DEMO_PASSWORD, signIn, waitForMail, watchConsole } from "./support";

// Tank request → two quotes → comparison → acceptance → deposit held → completion photo → confirmation → deposit
// released → the tank in the builder's portfolio with its mark. Three people, each in their own browser.

const HATCHERY_BUILDER = "hatchery-builder@shoal.demo";

async function apiAs(email: string) {
  const ctx = await newRequest.newContext({ baseURL: E2E_BASE_URL, extraHTTPHeaders: { origin: E2E_BASE_URL } });
  expect((await ctx.post("/api/auth/sign-in/email", { data: { email, password: DEMO_PASSWORD } })).status()).toBe(200);
  const me = (await (await ctx.get("/api/v1/me")).json()) as { user: { id: string } };
  return { ctx, id: me.user.id };
}

async function publicPoint(id: string): Promise<{ lat: number; lng: number }> {
  const ctx = await newRequest.newContext({ baseURL: E2E_BASE_URL });
  const body = (await (await ctx.get(`/api/v1/providers/${id}`)).json()) as { provider: { point: { lat: number; lng: number } } };
  await ctx.dispose();
  return body.provider.point;
}

async function personPage(browser: Browser, email: string): Promise<Page> {
  const context = await browser.newContext();
  const page = await context.newPage();
  await signIn(page, email);
  return page;
}

/**
 * A picture of a finished tank (sky, ground, a blue liner on a frame) with grain in it, so PNG cannot squeeze it
 * small and the upload takes a moment on a slow link.
 */
async function photoPng(width: number, height: number): Promise<Buffer> {
  const pixels = Buffer.alloc(width * height * 3);
  let seed = 12345;
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      const tank = x > width * 0.25 && x < width * 0.75 && y > height * 0.4 && y < height * 0.72;
      const post = tank && Math.abs(((x - width * 0.25) % (width * 0.125)) - 4) < 5;
      const [r, g, b] = post ? [122, 72, 21] : tank ? [31, 95, 168] : y < height * 0.6 ? [190, 226, 242] : [168, 149, 107];
      seed = (seed * 1103515245 + 12345) >>> 0;
      const grain = (seed >>> 24) % 25 - 12;
      const i = (y * width + x) * 3;
      pixels[i] = Math.max(0, Math.min(255, r + grain));
      pixels[i + 1] = Math.max(0, Math.min(255, g + grain));
      pixels[i + 2] = Math.max(0, Math.min(255, b + grain));
    }
  }
  return sharp(pixels, { raw: { width, height, channels: 3 } }).png().toBuffer();
}

/** Chromium's network emulation: uploads at `bytesPerSecond`, or unthrottled with null. */
async function throttleUploads(page: Page, bytesPerSecond: number | null) {
  const cdp = await page.context().newCDPSession(page);
  await cdp.send("Network.enable");
  await cdp.send("Network.emulateNetworkConditions", { offline: false, latency: 0, downloadThroughput: -1, uploadThroughput: bytesPerSecond ?? -1 });
}

async function sendQuote(page: Page, requestId: string, scope: "turnkey" | "farmer") {
  await page.goto("/builder/requests");
  await expect(page.locator(`a[href="/builder/requests/${requestId}"]`)).toBeVisible();
  await page.goto(`/builder/requests/${requestId}`);
  // Lines start from the builder's price sheet; travel is computed and shown, never typed.
  await expect(page.getByLabel("Description").first()).toHaveValue("Materials, per m² of floor");
  await expect(page.getByText(/straight-line ×/).first()).toBeVisible();
  if (scope === "farmer") await page.getByLabel("The farmer supplies the materials").check();
  await page.getByRole("button", { name: "Send the quote" }).click();
  await expect(page.getByRole("status")).toContainText("Sent");
}

test.describe("a tank from request to portfolio", () => {
  // Not tagged @phone: it runs once, at desktop size; the phone screens are below.
  test("request, two quotes, comparison, deposit, completion photo, confirmation, portfolio", async ({ browser }) => {
    test.setTimeout(180_000);
    const builderApi = await apiAs(DEMO.builder);
    const otherApi = await apiAs(HATCHERY_BUILDER);
    // Both builders' bases are near Chongwe (db/seed.ts); the midpoint of their public points is inside both areas.
    const [a, b] = await Promise.all([publicPoint(builderApi.id), publicPoint(otherApi.id)]);
    const site = { lat: ((a.lat + b.lat) / 2).toFixed(5), lng: ((a.lng + b.lng) / 2).toFixed(5) };

    // The farmer posts the request; a wrong size is refused first and nothing is stored.
    const farmer = await personPage(browser, DEMO.farmer);
    const farmerProblems = watchConsole(farmer, [/400 POST \/api\/v1\/tank-requests$/]);
    await farmer.goto("/farmer/requests/new");
    await farmer.getByLabel("Feet").check();
    await farmer.getByLabel("Inner length (feet)").fill("10");
    await farmer.getByLabel("Wall height or depth (feet)").fill("3");
    await farmer.getByLabel("Latitude (decimal degrees)").fill(site.lat);
    await farmer.getByLabel("Longitude (decimal degrees)").fill(site.lng);
    await expect(farmer.getByRole("note")).toContainText("tonnes");
    await farmer.getByRole("button", { name: "Post the request" }).click();
    await expect(farmer.getByText("Enter the width")).toBeVisible();
    await expect(farmer).toHaveURL(/\/farmer\/requests\/new$/);
    await expect(farmer.getByLabel("Inner length (feet)")).toHaveValue("10"); // what was typed stays
    await farmer.getByLabel("Inner width (feet)").fill("6");
    await farmer.getByRole("button", { name: "Post the request" }).click();
    await farmer.waitForURL(/\/farmer\/requests\/[0-9a-f-]{36}$/);
    const requestId = farmer.url().split("/").pop() ?? "";
    await expect(farmer.getByText("Waiting for quotes")).toBeVisible();

    // Both builders were told by e-mail and quote; the second leaves the materials to the farmer.
    const anyApi = await newRequest.newContext();
    await waitForMail(anyApi, DEMO.builder, "New tank request");
    await waitForMail(anyApi, HATCHERY_BUILDER, "New tank request");
    const builder = await personPage(browser, DEMO.builder);
    const builderProblems = watchConsole(builder);
    await sendQuote(builder, requestId, "turnkey");
    const other = await personPage(browser, HATCHERY_BUILDER);
    await sendQuote(other, requestId, "farmer");

    // The farmer compares them side by side and accepts the demo builder's.
    await farmer.reload();
    const table = farmer.getByTestId("quote-comparison");
    await expect(table.locator("thead th")).toHaveCount(3);
    await expect(table).toContainText("You supply");
    await expect(table).toContainText("Distance, straight line");
    await farmer.screenshot({ path: "test-results/screens/quote-comparison-flow-desktop.png", fullPage: true });
    // The demo builder is "Solid Ground Tanks" (db/seed-data.ts BUILDER_NAMES[0]).
    await farmer.getByRole("button", { name: "Accept Solid Ground Tanks's quote" }).click();
    await farmer.getByRole("button", { name: "Yes, accept" }).click();
    await expect(farmer.getByTestId("job-state")).toHaveText("Waiting for the deposit");
    await waitForMail(anyApi, HATCHERY_BUILDER, "The farmer chose another quote");

    // The deposit is held.
    await farmer.getByRole("button", { name: /Pay .* deposit/ }).click();
    await expect(farmer.getByTestId("job-state")).toHaveText("Scheduled");
    await expect(farmer.getByTestId("deposit-state")).toContainText("held by Shoal");
    await waitForMail(anyApi, DEMO.builder, "The deposit is held");

    // The builder arrives, uploads a completion photo through the uploader (with its progress bar) and marks it built.
    await builder.goto(`/builder/requests/${requestId}`);
    await builder.getByRole("link", { name: "Open the job" }).click();
    await builder.waitForURL(/\/builder\/jobs\//);
    await builder.getByRole("button", { name: "I am on site: start the job" }).click();
    await expect(builder.getByTestId("job-state")).toHaveText("Builder on site");
    await throttleUploads(builder, 200 * 1024);
    await builder.getByLabel("Add photos of the finished tank").setInputFiles({ name: "finished-tank.png", mimeType: "image/png", buffer: await photoPng(900, 700) });
    await expect(builder.getByRole("progressbar", { name: "Upload of finished-tank.png" })).toBeVisible();
    await expect(builder.getByText(/^([1-9]|[1-9]\d) %$/)).toBeVisible({ timeout: 20_000 });
    await builder.screenshot({ path: "test-results/screens/upload-progress-flow-desktop.png" });
    await throttleUploads(builder, null);
    await expect(builder.getByText("Ready", { exact: true })).toBeVisible({ timeout: 30_000 });
    await expect(builder.getByRole("list", { name: "Completion photo" }).getByRole("img")).toHaveCount(1);
    await builder.getByRole("button", { name: "Mark the tank built" }).click();
    await expect(builder.getByTestId("job-state")).toHaveText("Built: waiting for the farmer");

    // The farmer sees the photo and confirms: the deposit is released.
    await farmer.reload();
    await expect(farmer.getByRole("list", { name: "Completion photo" }).getByRole("img")).toHaveCount(1);
    await farmer.getByRole("button", { name: "Confirm: the tank is as agreed" }).click();
    await expect(farmer.getByTestId("job-state")).toHaveText("Completed");
    await expect(farmer.getByTestId("deposit-state")).toContainText("released to the builder");

    // The tank is in the builder's portfolio, public page included, with the mark.
    await builder.goto(`/providers/${builderApi.id}`);
    const marked = builder.getByTestId("portfolio-item").filter({ hasText: "Done through Shoal" });
    await expect(marked).toHaveCount(1);
    await expect(marked).toContainText("10 × 6 ft, 3 ft deep");
    await expect(marked.getByRole("img").first()).toBeVisible();

    expect(farmerProblems).toEqual([]);
    expect(builderProblems).toEqual([]);
    await Promise.all([builderApi.ctx.dispose(), otherApi.ctx.dispose(), anyApi.dispose()]);
  });
});

test.describe("tank request screens @phone", () => {
  test("quote comparison, upload progress and a portfolio render cleanly", async ({ page }, info) => {
    test.setTimeout(90_000);
    const problems = watchConsole(page);
    const builder = await apiAs(DEMO.builder);

    // The demo farmer's seeded request with two quotes (db/seed-jobs.ts).
    await signIn(page, DEMO.farmer);
    await page.goto("/farmer/requests");
    await page.getByRole("link", { name: /tarpaulin on frame tank, 10 × 6 ft/i }).last().click();
    await expect(page.getByTestId("quote-comparison")).toBeVisible();
    await page.screenshot({ path: `test-results/screens/quote-comparison-${info.project.name}.png`, fullPage: true });
    await page.goto("/farmer/requests/new");
    await page.getByRole("button", { name: "Pick on a map" }).click();
    await expect(page.locator(".maplibregl-canvas")).toBeVisible();
    await page.screenshot({ path: `test-results/screens/request-form-${info.project.name}.png`, fullPage: true });

    // A portfolio upload on a slow link, caught mid-way.
    await page.context().clearCookies();
    await signIn(page, DEMO.builder);
    await page.goto("/builder/requests");
    await page.getByRole("list", { name: "Open requests within reach" }).getByRole("link").first().click();
    await expect(page.getByRole("form", { name: /quote/i })).toBeVisible();
    await page.screenshot({ path: `test-results/screens/quote-form-${info.project.name}.png`, fullPage: true });
    await page.goto("/builder/portfolio");
    await throttleUploads(page, 150 * 1024);
    await page.getByLabel("Photos of the finished tank").setInputFiles({ name: "new-tank.png", mimeType: "image/png", buffer: await photoPng(800, 600) });
    await expect(page.getByText(/^([1-9]|[1-9]\d) %$/)).toBeVisible({ timeout: 20_000 });
    await page.getByRole("progressbar").scrollIntoViewIfNeeded();
    await page.screenshot({ path: `test-results/screens/upload-progress-${info.project.name}.png` });
    await throttleUploads(page, null);
    await expect(page.getByText("Ready", { exact: true })).toBeVisible({ timeout: 30_000 });

    // The public portfolio.
    await page.goto(`/providers/${builder.id}`);
    await expect(page.getByRole("heading", { name: "Finished tanks" })).toBeVisible();
    await page.getByRole("heading", { name: "Finished tanks" }).scrollIntoViewIfNeeded();
    await page.screenshot({ path: `test-results/screens/portfolio-${info.project.name}.png`, fullPage: true });
    await page.goto("/builder/portfolio");
    await page.screenshot({ path: `test-results/screens/builder-portfolio-${info.project.name}.png`, fullPage: true });
    expect(problems).toEqual([]);
    await builder.ctx.dispose();
  });
});
