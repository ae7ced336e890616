import { expect, test } from "@playwright/test";
import { E2E_BASE_URL } from "./ports";
import { countMail, openMailLink, signIn, uniqueEmail, waitForMail, watchConsole } from "./support";

test.describe("account life cycle", () => {
  test("sign up, verify from the outbox, choose roles, reach the dashboard, sign out", async ({ page, request }) => {
    // Two refusals are provoked on purpose: signing in before confirming, and opening the admin area.
    const problems = watchConsole(page, [/^403 POST \/api\/auth\/sign-in\/email$/, /^403 GET \/admin$/]);
    const email = uniqueEmail("newcomer");
    await page.goto("/sign-up");
    await page.getByLabel("Your name or business name").fill("Naomi Test-Farmer");
    await page.getByLabel("E-mail").fill(email);
    await page.getByLabel("Password", { exact: true }).fill("a-long-password-1");
    await page.getByLabel("Password again").fill("a-long-password-1");
    await page.getByRole("button", { name: "Create account" }).click();
    await expect(page).toHaveURL(/\/check-email/);
    await expect(page.getByText(email)).toBeVisible();

    // Signing in before confirming is refused with a clear message.
    await page.goto("/sign-in");
    await page.getByLabel("E-mail").fill(email);
    await page.getByLabel("Password").fill("a-long-password-1");
    await page.getByRole("button", { name: "Sign in" }).click();
    await expect(page.getByRole("alert").filter({ hasText: "Confirm your e-mail first" })).toBeVisible();

    const mailId = await waitForMail(request, email, "Confirm your e-mail");
    await page.goto("/dev/outbox");
    await expect(page.getByRole("link", { name: /Confirm your e-mail for Shoal/ }).first()).toBeVisible();
    const link = await openMailLink(page, mailId);
    await page.goto(link);
    await expect(page).toHaveURL(/\/onboarding/);

    await page.getByText("I farm fish (or want to)").click();
    await page.getByText("I build tanks").click();
    await page.getByLabel("Business name (shown to buyers)").fill("Naomi's Tanks");
    await page.getByLabel("Region or province").fill("Lusaka");
    await page.getByLabel(/^Phone/).fill("+260 97 555 0101");
    await page.getByLabel("Latitude").fill("-15.41");
    await page.getByLabel("Longitude").fill("28.29");
    await page.getByRole("button", { name: "Save and continue" }).click();
    await expect(page).toHaveURL(/\/dashboard/);
    const roles = page.getByLabel("Your roles");
    await expect(roles).toContainText("Farmer");
    await expect(roles).toContainText("Tank builder");
    await expect(page.getByText("Waiting for a Shoal check")).toBeVisible();

    // The builder area opens for this account; the admin area does not.
    await page.goto("/builder");
    await expect(page.getByRole("heading", { name: "Your service and prices" })).toBeVisible();
    const admin = await page.goto("/admin");
    expect(admin?.status()).toBe(403);
    await expect(page.getByText("This part of Shoal is for another role")).toBeVisible();

    await page.goto("/dashboard");
    await page.getByRole("button", { name: "Sign out" }).click();
    await expect(page).toHaveURL(/\/$/);
    await expect(page.getByRole("banner").getByRole("link", { name: "Sign in" })).toBeVisible();
    const after = await page.goto("/dashboard");
    expect(after?.url()).toContain("/sign-in");
    expect(problems).toEqual([]);
  });

  test("reset a forgotten password", async ({ page, request }) => {
    const email = uniqueEmail("forgetful");
    // Make a verified account through the real flow.
    await page.goto("/sign-up");
    await page.getByLabel("Your name or business name").fill("Forgetful Farmer");
    await page.getByLabel("E-mail").fill(email);
    await page.getByLabel("Password", { exact: true }).fill("first-password-1");
    await page.getByLabel("Password again").fill("first-password-1");
    await page.getByRole("button", { name: "Create account" }).click();
    await page.goto(await openMailLink(page, await waitForMail(request, email, "Confirm your e-mail")));
    await expect(page).toHaveURL(/\/onboarding/);
    await page.context().clearCookies();

    await page.goto("/sign-in");
    await page.getByRole("link", { name: "Forgot your password?" }).click();
    await expect(page.getByRole("heading", { name: "Forgot your password?" })).toBeVisible();
    await page.getByLabel("E-mail").fill(email);
    await page.getByRole("button", { name: "Send the link" }).click();
    await expect(page.getByRole("status")).toContainText("is on its way");
    const resetLink = await openMailLink(page, await waitForMail(request, email, "Set a new Shoal password"));
    await page.goto(resetLink);
    await expect(page).toHaveURL(/\/reset-password\?token=/);
    await page.getByLabel("New password", { exact: true }).fill("second-password-2");
    await page.getByLabel("New password again").fill("second-password-2");
    await page.getByRole("button", { name: "Save new password" }).click();
    await expect(page).toHaveURL(/\/sign-in\?reset=done/);

    // The old password no longer works; the new one does.
    await page.getByLabel("E-mail").fill(email);
    await page.getByLabel("Password").fill("first-password-1");
    await page.getByRole("button", { name: "Sign in" }).click();
    await expect(page.getByRole("alert").filter({ hasText: "do not match" })).toBeVisible();
    await signIn(page, email, "second-password-2");
    await expect(page).toHaveURL(/\/onboarding/);

    // The reset link works only once.
    await page.context().clearCookies();
    await page.goto(resetLink);
    await expect(page.getByText("This link is not valid any more")).toBeVisible();
  });

  test("bad sign-up input gets field messages and stores nothing", async ({ page, request }) => {
    const email = "not-an-email";
    await page.goto("/sign-up");
    await page.getByLabel("Your name or business name").fill("A");
    await page.getByLabel("E-mail").fill(email);
    await page.getByLabel("Password", { exact: true }).fill("short");
    await page.getByLabel("Password again").fill("different");
    await page.getByRole("button", { name: "Create account" }).click();
    await expect(page.getByText("Name is at least 2 characters")).toBeVisible();
    await expect(page.getByText("Enter a valid e-mail address")).toBeVisible();
    await expect(page.getByText("Use at least 10 characters")).toBeVisible();
    await expect(page.getByText("The two passwords differ")).toBeVisible();
    await expect(page).toHaveURL(/\/sign-up/);

    // The server refuses the same input sent directly, and no account or e-mail results.
    const direct = uniqueEmail("direct");
    const r = await request.post("/api/auth/sign-up/email", {
      headers: { origin: E2E_BASE_URL },
      data: { name: "Direct", email: direct, password: "short" },
    });
    expect(r.status()).toBe(400);
    expect(await countMail(request, direct)).toBe(0);
    const signInAttempt = await request.post("/api/auth/sign-in/email", { headers: { origin: E2E_BASE_URL }, data: { email: direct, password: "short" } });
    expect(signInAttempt.status()).toBe(401);
  });

  test("bad profile input gets field messages and stores nothing", async ({ page, request }) => {
    const email = uniqueEmail("badprofile");
    await page.goto("/sign-up");
    await page.getByLabel("Your name or business name").fill("Profile Tester");
    await page.getByLabel("E-mail").fill(email);
    await page.getByLabel("Password", { exact: true }).fill("profile-password-1");
    await page.getByLabel("Password again").fill("profile-password-1");
    await page.getByRole("button", { name: "Create account" }).click();
    await page.goto(await openMailLink(page, await waitForMail(request, email, "Confirm your e-mail")));
    await expect(page).toHaveURL(/\/onboarding/);

    await page.getByText("I run a hatchery").click();
    await page.getByLabel("Region or province").fill("Central");
    await page.getByLabel(/^Phone/).fill("0971234567");
    await page.getByLabel("Latitude").fill("-95");
    await page.getByLabel("Longitude").fill("28.3");
    await page.getByRole("button", { name: "Save and continue" }).click();
    await expect(page.getByText("Use international form")).toBeVisible();
    await expect(page.getByText("Latitude is between -90 and 90")).toBeVisible();
    await expect(page).toHaveURL(/\/onboarding/);

    // Sent straight to the API, the same input is refused with the field named.
    const api = await page.request.post("/api/v1/onboarding", {
      data: { roles: ["hatchery"], displayName: "X Hatch", region: "Central", phone: "0971234567", lat: -95, lng: 28.3 },
    });
    expect(api.status()).toBe(400);
    const body = (await api.json()) as { error: { fieldErrors: Record<string, string[]> } };
    expect(Object.keys(body.error.fieldErrors)).toEqual(expect.arrayContaining(["phone", "lat"]));
    const me = (await (await page.request.get("/api/v1/me")).json()) as { user: { roles: string[]; onboarded: boolean }; profile: unknown };
    expect(me.user.roles).toEqual([]);
    expect(me.user.onboarded).toBe(false);
    expect(me.profile).toBeNull();
  });
});
