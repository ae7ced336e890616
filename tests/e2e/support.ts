import { expect, type APIRequestContext, type Page } from "@playwright/test";
import { E2E_SERVICE_PORTS } from "./ports";

export const DEMO_PASSWORD = "shoal-demo-2026";
export const DEMO = {
  admin: "admin@shoal.demo",
  farmer: "farmer@shoal.demo",
  hatchery: "hatchery@shoal.demo",
  builder: "builder@shoal.demo",
} as const;
export type DemoRole = keyof typeof DEMO;

const MAIL_API = `http://127.0.0.1:${E2E_SERVICE_PORTS.mail}`; // the e2e server's mail stand-in (scripts/e2e-server.ts)

export function uniqueEmail(tag: string): string {
  return `${tag}.${Date.now()}.${Math.floor(Math.random() * 1e6)}@example.test`;
}

/** Waits until the mail stand-in holds a message to `to` whose subject contains `subject`; returns its id. */
export async function waitForMail(request: APIRequestContext, to: string, subject: string): Promise<string> {
  let id: string | undefined;
  await expect
    .poll(
      async () => {
        const r = await request.get(`${MAIL_API}/emails?to=${encodeURIComponent(to)}`, { headers: { authorization: "Bearer e2e" } });
        const body = (await r.json()) as { data: { id: string; subject: string }[] };
        id = body.data.find((m) => m.subject.includes(subject))?.id;
        return Boolean(id);
      },
      { timeout: 15_000, message: `e-mail "${subject}" to ${to}` },
    )
    .toBe(true);
  return id as string;
}

export async function countMail(request: APIRequestContext, to: string): Promise<number> {
  const r = await request.get(`${MAIL_API}/emails?to=${encodeURIComponent(to)}`, { headers: { authorization: "Bearer e2e" } });
  return ((await r.json()) as { data: unknown[] }).data.length;
}

/** Opens the message in the dev outbox, as a person would, and returns the first link in it. */
export async function openMailLink(page: Page, id: string): Promise<string> {
  await page.goto(`/dev/outbox/${id}`);
  const link = page.getByTestId("mail-link").first();
  await expect(link).toBeVisible();
  const href = await link.getAttribute("href");
  if (!href) throw new Error("mail has no link");
  return href;
}

export async function signIn(page: Page, email: string, password = DEMO_PASSWORD): Promise<void> {
  await page.goto("/sign-in");
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL(/\/(dashboard|onboarding)/);
}

/**
 * Collects console errors, error responses and requests that leave this machine, so a
 * test can assert a clean page. Responses a test provokes on purpose are passed in `allow`.
 */
export function watchConsole(page: Page, allow: RegExp[] = []): string[] {
  const problems: string[] = [];
  page.on("console", (m) => {
    // The browser's own "Failed to load resource" line repeats a response seen below.
    if (m.type() === "error" && !m.text().startsWith("Failed to load resource")) problems.push(`console: ${m.text()}`);
  });
  page.on("response", (r) => {
    const line = `${r.status()} ${r.request().method()} ${new URL(r.url()).pathname}`;
    if (r.status() >= 400 && !allow.some((a) => a.test(line))) problems.push(`response: ${line}`);
  });
  page.on("pageerror", (e) => problems.push(`pageerror: ${e.message}`));
  page.on("request", (r) => {
    const u = new URL(r.url());
    if (!["localhost", "127.0.0.1"].includes(u.hostname) && !u.protocol.startsWith("data") && !u.protocol.startsWith("blob")) {
      problems.push(`external request: ${r.url()}`);
    }
  });
  return problems;
}
