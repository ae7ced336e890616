import AxeBuilder from "@axe-core/playwright";
import { expect, request as newRequest, test, type APIRequestContext, type Page } from "@playwright/test";
import { randomUUID } from "node:crypto";
import sharp from "sharp";
import { apiAs } from "./reservation-support";
import { DEMO, signIn, watchConsole } from "./support";

// Reviews and trust in the browser (issue 7): a farmer confirms a finished tank, reviews it with photos (the text
// holds a script tag, which must show as text), the builder's badge and reasons change, the builder replies,
// another account reports the review, and an admin hides it. Also the form's refusals and a failed send that keeps
// what was typed, and the hatchery review offered beside the day-7 survival report.
//
// Each project (desktop, phone) gets its own job, driven through the JSON API up to "built", so the two runs
// never share a review.

const BUILDER_NAME = "Solid Ground Tanks"; // db/seed-data.ts BUILDER_NAMES[0], the demo builder
const SCRIPT_TEXT = "<script>alert(1)</script>";

/** A photo with grain in it (sky, ground, a tank), big enough for every stored width. */
async function photoPng(width: number, height: number, tint: number): Promise<Buffer> {
  const pixels = Buffer.alloc(width * height * 3);
  let seed = 977 + tint;
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      const tank = x > width * 0.2 && x < width * 0.8 && y > height * 0.45 && y < height * 0.75;
      const [r, g, b] = tank ? [31 + tint, 95, 168] : y < height * 0.55 ? [190, 226, 242] : [168, 149, 107];
      seed = (seed * 1103515245 + 12345) >>> 0;
      const grain = ((seed >>> 24) % 21) - 10;
      const i = (y * width + x) * 3;
      pixels[i] = Math.max(0, Math.min(255, r + grain));
      pixels[i + 1] = Math.max(0, Math.min(255, g + grain));
      pixels[i + 2] = Math.max(0, Math.min(255, b + grain));
    }
  }
  return sharp(pixels, { raw: { width, height, channels: 3 } }).png().toBuffer();
}

async function ok(response: Promise<import("@playwright/test").APIResponse>, what: string): Promise<unknown> {
  const r = await response;
  expect(r.ok(), `${what}: ${r.status()} ${await r.text()}`).toBe(true);
  return r.json();
}

/**
 * A tank request of the demo farmer, quoted by the demo builder, accepted, deposit held, the builder on site with a
 * completion photo and the tank marked built: one step (the farmer's confirmation) from completion.
 */
async function jobWaitingForConfirmation(farmer: APIRequestContext, builder: { ctx: APIRequestContext; id: string }): Promise<{ requestId: string; jobId: string }> {
  const anon = await newRequest.newContext();
  const { provider } = (await ok(builder.ctx.get(`/api/v1/providers/${builder.id}`), "builder's public point")) as { provider: { point: { lat: number; lng: number } } };
  const wanted = new Date(Date.now() + 20 * 86_400_000).toISOString().slice(0, 10);
  const requestId = randomUUID();
  await ok(
    farmer.post("/api/v1/tank-requests", {
      data: { id: requestId, tankType: "tarpaulin", shape: "rectangular", unit: "ft", length: "10", width: "6", diameter: "", depth: "3", lat: provider.point.lat.toFixed(5), lng: provider.point.lng.toFixed(5), readiness: "compacted_ground", waterSource: "borehole", power: "grid", wantedBy: wanted, planId: "", notes: "Behind the house." },
    }),
    "post the request",
  );
  const quote = (await ok(
    builder.ctx.post(`/api/v1/tank-requests/${requestId}/quotes`, { data: { scope: "turnkey", note: "", lines: [{ kind: "labour", description: "Frame, liner and fitting", quantity: "1", unitPrice: "1500" }] } }),
    "send the quote",
  )) as { quoteId: string; version: number };
  const { jobId } = (await ok(farmer.post(`/api/v1/quotes/${quote.quoteId}/accept`, { data: { version: quote.version } }), "accept")) as { jobId: string };
  await ok(farmer.post(`/api/v1/jobs/${jobId}/deposit`, { data: { paymentMethod: "pm_card_visa" } }), "pay the deposit");
  await ok(builder.ctx.post(`/api/v1/jobs/${jobId}/events`, { data: { type: "arrive" } }), "arrive");
  const png = await photoPng(640, 480, 0);
  const presigned = (await ok(builder.ctx.post("/api/v1/uploads/presign", { data: { kind: "completion-photo", contentType: "image/png", contentLength: png.length, subjectId: jobId } }), "presign")) as {
    uploadId: string;
    url: string;
    headers: Record<string, string>;
  };
  const put = await anon.put(presigned.url, { headers: presigned.headers, data: png });
  expect(put.ok(), "photo stored").toBe(true);
  await ok(builder.ctx.post("/api/v1/uploads/complete", { data: { kind: "completion-photo", uploadId: presigned.uploadId, subjectId: jobId } }), "complete the upload");
  await ok(builder.ctx.post(`/api/v1/jobs/${jobId}/events`, { data: { type: "mark_built" } }), "mark built");
  await anon.dispose();
  return { requestId, jobId };
}

/** The number in the provider page header's badge ("3 reviews"). */
async function badgeReviews(page: Page): Promise<number> {
  const text = (await page.locator("header").getByTestId("trust-badge-reviews").first().textContent()) ?? "";
  const match = /^(\d+) review/.exec(text.trim());
  if (!match?.[1]) throw new Error(`no review count in "${text}"`);
  return Number(match[1]);
}

async function jobsCompletedReason(page: Page): Promise<number> {
  const text = (await page.getByTestId("trust-reason-jobs_completed").first().textContent()) ?? "";
  const match = /(\d+) jobs? completed/.exec(text);
  if (!match?.[1]) throw new Error(`no job count in "${text}"`);
  return Number(match[1]);
}

/** Axe with the WCAG A/AA rules; only serious and critical findings fail the test. */
async function seriousViolations(page: Page): Promise<string[]> {
  const result = await new AxeBuilder({ page }).withTags(["wcag2a", "wcag2aa", "wcag21aa"]).analyze();
  return result.violations.filter((v) => v.impact === "serious" || v.impact === "critical").map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(" ")).join(", ")}`);
}

function trustCard(page: Page) {
  return page.locator("section").filter({ has: page.getByRole("heading", { level: 2, name: "How this score is made" }) });
}

test.describe("reviews and trust @phone", () => {
  test("finished job → review with photos → badge and reasons change → reply → report → admin hides it", async ({ page }, info) => {
    test.setTimeout(240_000);
    const size = info.project.name;
    const farmerApi = await apiAs(DEMO.farmer);
    const builderApi = await apiAs(DEMO.builder);
    const { requestId } = await jobWaitingForConfirmation(farmerApi.ctx, builderApi);
    const providerUrl = `/providers/${builderApi.id}`;

    // Before: what the public page says about the builder.
    const problems = watchConsole(page, [/^503 POST \/api\/v1\/reviews$/]);
    const dialogs: string[] = [];
    page.on("dialog", (d) => {
      dialogs.push(d.message());
      void d.dismiss();
    });
    await page.goto(providerUrl);
    await expect(trustCard(page)).toBeVisible();
    const reviewsBefore = await badgeReviews(page);
    const jobsBefore = await jobsCompletedReason(page);

    // The farmer confirms the tank; the job page then offers the review.
    await signIn(page, DEMO.farmer);
    await page.goto(`/farmer/requests/${requestId}`);
    await page.getByRole("button", { name: "Confirm: the tank is as agreed" }).click();
    await expect(page.getByTestId("job-state")).toHaveText("Completed");
    await page.getByRole("link", { name: "Write a review" }).click();
    await page.waitForURL(`**/farmer/requests/${requestId}/review`);
    await expect(page.getByRole("heading", { level: 1, name: `Review ${BUILDER_NAME}` })).toBeVisible();

    // Nothing chosen: each question names what is missing, and nothing is sent.
    await page.getByRole("button", { name: "Publish the review" }).click();
    await expect(page.getByRole("radiogroup", { name: `Overall, how was ${BUILDER_NAME}?` })).toContainText("Choose 1 to 5 stars");
    await expect(page.getByRole("radiogroup", { name: "Kept to the dates" })).toContainText("Choose 1 to 5 stars");
    await expect(page.getByText("Write at least 10 characters")).toBeVisible();
    await page.screenshot({ path: `test-results/screens/review-form-errors-${size}.png`, fullPage: true });

    // The stars work from the keyboard: a radio group, arrow keys move the choice.
    const overall = page.getByRole("radiogroup", { name: `Overall, how was ${BUILDER_NAME}?` });
    await overall.getByRole("radio", { name: /^1 star/ }).focus();
    await page.keyboard.press("Space");
    for (let i = 0; i < 3; i++) await page.keyboard.press("ArrowRight");
    await expect(overall.getByRole("radio", { name: /^4 stars/ })).toBeChecked();
    await expect(overall.getByRole("radio", { name: /^4 stars/ })).toBeFocused();
    await expect(overall).not.toContainText("Choose 1 to 5 stars");
    for (const [aspect, stars] of [["Quality of the build", 5], ["Kept to the dates", 3], ["Kept me informed", 4]] as const) {
      await page.getByRole("radiogroup", { name: aspect }).getByRole("radio", { name: new RegExp(`^${stars} stars`) }).check();
    }
    // The text names the run, so the desktop and phone runs (one server) each find their own review.
    const body = `Level base, straight frame, no leaks after a week. ${SCRIPT_TEXT} They came two days late (${size}).`;
    await page.getByLabel("In your own words").fill(body);
    await expect(page.getByText(`${body.length} of 2,000 characters`)).toBeVisible();

    // Two photos through the uploader.
    await page.getByLabel("Add photos").setInputFiles([
      { name: "tank-full.png", mimeType: "image/png", buffer: await photoPng(640, 480, 10) },
      { name: "tank-side.png", mimeType: "image/png", buffer: await photoPng(480, 640, 40) },
    ]);
    await expect(page.getByRole("list", { name: "Photos in your review" }).getByRole("img")).toHaveCount(2, { timeout: 30_000 });
    await page.screenshot({ path: `test-results/screens/review-form-${size}.png`, fullPage: true });
    expect(await seriousViolations(page)).toEqual([]);

    // The first send fails on the way (the server never sees it): the message shows, and everything stays.
    let failedOnce = false;
    await page.route("**/api/v1/reviews", async (route) => {
      if (route.request().method() === "POST" && !failedOnce) {
        failedOnce = true;
        await route.fulfill({ status: 503, contentType: "application/json", body: JSON.stringify({ error: { message: "Shoal is busy for a moment. Your review was not sent: try again." } }) });
        return;
      }
      await route.continue();
    });
    await page.getByRole("button", { name: "Publish the review" }).click();
    await expect(page.getByRole("alert").filter({ hasText: "Your review was not sent" })).toBeVisible();
    await expect(page.getByLabel("In your own words")).toHaveValue(body);
    await expect(overall.getByRole("radio", { name: /^4 stars/ })).toBeChecked();
    await expect(page.getByRole("radiogroup", { name: "Kept to the dates" }).getByRole("radio", { name: /^3 stars/ })).toBeChecked();
    await expect(page.getByRole("list", { name: "Photos in your review" }).getByRole("img")).toHaveCount(2);

    // The second goes through: back on the job page with "Your review".
    await page.getByRole("button", { name: "Publish the review" }).click();
    await page.waitForURL(`**/farmer/requests/${requestId}`);
    await expect(page.getByRole("heading", { name: "Your review" })).toBeVisible();
    await expect(page.getByRole("link", { name: "Change your review" })).toBeVisible();
    await expect(page.getByTestId("your-review-body")).toContainText(SCRIPT_TEXT);
    await page.unroute("**/api/v1/reviews");

    // The public page: the text shows as typed (no script ran, none was added), with its photos; counts went up.
    await page.goto(providerUrl);
    const review = page.getByTestId("review").filter({ hasText: body });
    await expect(review).toHaveCount(1);
    await expect(review.getByTestId("review-body")).toHaveText(body);
    await expect(review.locator("script")).toHaveCount(0);
    await expect(review.getByRole("list", { name: /^Photos from/ }).getByRole("img")).toHaveCount(2);
    expect(await badgeReviews(page)).toBe(reviewsBefore + 1);
    expect(await jobsCompletedReason(page)).toBe(jobsBefore + 1);
    await expect(page.getByTestId("trust-reason-reviews")).toContainText(`${reviewsBefore + 1} review`);
    await trustCard(page).scrollIntoViewIfNeeded();
    await trustCard(page).screenshot({ path: `test-results/screens/provider-trust-${size}.png` });

    // The builder replies, once, in public.
    await page.context().clearCookies();
    await signIn(page, DEMO.builder);
    await page.goto(providerUrl);
    await review.getByRole("button", { name: /^Reply in public/ }).click();
    const reply = "Thank you. The late start was the liner delivery from Lusaka; we phoned the day before.";
    await review.getByLabel(/^Your reply to/).fill(reply);
    await review.getByRole("button", { name: "Publish the reply" }).click();
    await expect(review.getByTestId("review-reply")).toContainText(reply);
    await expect(review.getByRole("button", { name: /^Reply in public/ })).toHaveCount(0);

    // Another account finds it helpful, then reports it through the dialog.
    await page.context().clearCookies();
    await signIn(page, DEMO.hatchery);
    await page.goto(providerUrl);
    const helpful = review.getByRole("button", { name: /^Helpful/ });
    await expect(helpful).toHaveAttribute("aria-pressed", "false");
    await helpful.click();
    await expect(helpful).toHaveAttribute("aria-pressed", "true");
    await expect(helpful).toContainText("(1)");

    const reportButton = review.getByRole("button", { name: /^Report the review by/ });
    await reportButton.click();
    const dialog = page.getByRole("dialog", { name: "Report this review" });
    await expect(dialog).toBeVisible();
    await expect(dialog.getByRole("radio").first()).toBeFocused();
    // Tab stays inside the dialog however far it goes.
    for (let i = 0; i < 12; i++) {
      await page.keyboard.press("Tab");
      expect(await dialog.evaluate((d) => d.contains(document.activeElement))).toBe(true);
    }
    await page.keyboard.press("Escape");
    await expect(dialog).toBeHidden();
    await expect(reportButton).toBeFocused();
    await reportButton.click();
    await dialog.getByRole("button", { name: "Send the report" }).click();
    await expect(dialog.getByText("Choose why you report this review")).toBeVisible();
    await dialog.getByRole("radio", { name: "Shares private details (phone, address, names)" }).check();
    await dialog.getByLabel(/Anything the moderator should know/).fill("It names the farmer's neighbour.");
    await dialog.getByRole("button", { name: "Send the report" }).click();
    await expect(dialog).toBeHidden();
    await expect(review.getByText("Reported: a Shoal moderator will read it.")).toBeFocused();
    expect(await seriousViolations(page)).toEqual([]);
    await page.screenshot({ path: `test-results/screens/provider-reviews-${size}.png`, fullPage: true });

    // The admin sees the report in the queue and hides the review, with a note.
    await page.context().clearCookies();
    await signIn(page, DEMO.admin);
    await page.goto("/admin");
    const queued = page.getByTestId("moderation-report").filter({ hasText: body });
    await expect(queued).toHaveCount(1);
    await expect(queued).toContainText("Shares private details");
    await expect(queued).toContainText("It names the farmer's neighbour.");
    await expect(queued.getByTestId("moderation-review-body")).toHaveText(body);
    expect(await seriousViolations(page)).toEqual([]);
    await page.getByRole("heading", { name: "Reported reviews" }).scrollIntoViewIfNeeded();
    await page.screenshot({ path: `test-results/screens/admin-reports-${size}.png`, fullPage: true });
    await queued.getByRole("button", { name: "Hide the review" }).click();
    await expect(queued.getByText("Say why in a few words")).toBeVisible();
    await queued.getByLabel("Note for the log").fill("Names a private person; the farmer may write it again without the name.");
    await queued.getByRole("button", { name: "Hide the review" }).click();
    await expect(queued).toHaveCount(0);

    // Hidden: gone from the public list, and it no longer counts.
    await page.context().clearCookies();
    await page.goto(providerUrl);
    await expect(page.getByTestId("review").filter({ hasText: body })).toHaveCount(0);
    expect(await badgeReviews(page)).toBe(reviewsBefore);

    expect(dialogs).toEqual([]);
    expect(problems).toEqual([]);
    await Promise.all([farmerApi.ctx.dispose(), builderApi.ctx.dispose()]);
  });

  test("the hatchery review is offered beside the day-7 survival report, and can be changed", async ({ page }, info) => {
    test.setTimeout(90_000);
    const problems = watchConsole(page);
    const farmerApi = await apiAs(DEMO.farmer);
    // The demo farmer's released reservation (db/seed-reservations.ts: 200 handed over, 188 reported alive).
    const list = (await ok(farmerApi.ctx.get("/api/v1/reservations?state=done&pageSize=50"), "list reservations")) as { rows: { id: string; state: string; survivedCount: number | null }[] };
    // Other specs (reservations-flow) release reservations of their own for the same farmer: pick the seeded one.
    const released = list.rows.find((r) => r.state === "released" && r.survivedCount === 188);
    if (!released) throw new Error("the seed has a released reservation for the demo farmer");
    await farmerApi.ctx.dispose();

    await signIn(page, DEMO.farmer);
    await page.goto(`/farmer/reservations/${released.id}`);
    await expect(page.getByRole("heading", { name: "Your day-7 report" })).toBeVisible();
    // 188 / 200 = 94 %
    await expect(page.getByTestId("survival-figure")).toHaveText("94%");

    // The desktop run writes the review; the phone run (same server, later) finds it and changes it.
    const write = page.getByRole("link", { name: "Write a review" });
    if (await write.isVisible()) {
      await write.click();
      await page.waitForURL(`**/farmer/reservations/${released.id}/review`);
      await page.getByRole("radiogroup", { name: /^Overall, how was/ }).getByRole("radio", { name: /^5 stars/ }).check();
      for (const aspect of ["Fish health", "Count as promised", "Size as promised"]) {
        await page.getByRole("radiogroup", { name: aspect }).getByRole("radio", { name: /^4 stars/ }).check();
      }
      await page.getByLabel("In your own words").fill("Lively fingerlings, counted in front of me at collection.");
      await page.getByRole("button", { name: "Publish the review" }).click();
      await page.waitForURL(`**/farmer/reservations/${released.id}`);
    }
    await expect(page.getByRole("heading", { name: "Your review" })).toBeVisible();
    await page.getByRole("link", { name: "Change your review" }).click();
    await page.waitForURL(`**/farmer/reservations/${released.id}/review`);
    await expect(page.getByRole("heading", { level: 1, name: "Change your review" })).toBeVisible();
    await expect(page.getByRole("radiogroup", { name: "Fish health" }).getByRole("radio", { name: /^4 stars/ })).toBeChecked();
    await page.screenshot({ path: `test-results/screens/review-edit-${info.project.name}.png`, fullPage: true });
    const changed = `Lively fingerlings, counted in front of me. Checked again on the ${info.project.name}: still fine.`;
    await page.getByLabel("In your own words").fill(changed);
    await page.getByRole("button", { name: "Save the changes" }).click();
    await page.waitForURL(`**/farmer/reservations/${released.id}`);
    await expect(page.getByTestId("your-review-body")).toHaveText(changed);
    expect(problems).toEqual([]);
  });
});

test.describe("trust badges on the map @phone", () => {
  test("a list card and the map popup carry the provider's badge", async ({ page }, info) => {
    const problems = watchConsole(page);
    const builderApi = await apiAs(DEMO.builder);
    const { provider } = (await ok(builderApi.ctx.get(`/api/v1/providers/${builderApi.id}`), "builder's public point")) as { provider: { point: { lat: number; lng: number } } };
    await builderApi.ctx.dispose();
    // A small circle around the demo builder's public point: it is the nearest result and has a marker of its own.
    await page.goto(`/map?lat=${provider.point.lat}&lng=${provider.point.lng}&radiusKm=2&kind=builder`);
    const card = page.getByTestId("result").filter({ hasText: BUILDER_NAME });
    await expect(card.getByTestId("trust-badge")).toBeVisible();
    await expect(card.getByTestId("trust-badge-reviews")).toHaveText(/^\d+ reviews?$/);
    if (info.project.name === "phone") await card.getByRole("button", { name: "Show on map" }).click();
    else await page.getByTestId("finder-map").getByRole("button", { name: new RegExp(`^${BUILDER_NAME}, builder`) }).click();
    const popup = page.getByTestId("map-popup");
    await expect(popup).toBeVisible({ timeout: 20_000 });
    await expect(popup).toContainText(BUILDER_NAME);
    await expect(popup.getByTestId("trust-badge-reviews")).toHaveText((await card.getByTestId("trust-badge-reviews").textContent()) ?? "");
    await page.waitForTimeout(500); // let the basemap draw under the popup before the picture
    await page.screenshot({ path: `test-results/screens/map-popup-${info.project.name}.png` });

    // A provider who builds tanks and sells fish is judged on each separately: two badges, two sets of reasons.
    const both = await apiAs("hatchery-builder@shoal.demo");
    await both.ctx.dispose();
    await page.goto(`/providers/${both.id}`);
    await expect(page.locator("header").getByTestId("trust-badge")).toHaveCount(2);
    await expect(trustCard(page).getByRole("heading", { level: 3 })).toHaveText(["Trust as a tank builder", "Trust as a hatchery"]);
    await expect(trustCard(page).getByTestId("trust-hatchery").getByTestId("trust-reason-survival")).toBeVisible();
    await expect(page.getByRole("navigation", { name: "Reviews of which service" }).getByRole("link")).toHaveCount(2);
    await trustCard(page).screenshot({ path: `test-results/screens/provider-trust-two-roles-${info.project.name}.png` });
    expect(problems).toEqual([]);
  });
});
