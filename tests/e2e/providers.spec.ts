import { expect, request as newRequest, test } from "@playwright/test";
import { E2E_BASE_URL } from "./ports";
import { DEMO, DEMO_PASSWORD } from "./support";

async function signedIn(email: string) {
  const ctx = await newRequest.newContext({ baseURL: E2E_BASE_URL, extraHTTPHeaders: { origin: E2E_BASE_URL } });
  expect((await ctx.post("/api/auth/sign-in/email", { data: { email, password: DEMO_PASSWORD } })).status()).toBe(200);
  const me = (await (await ctx.get("/api/v1/me")).json()) as { user: { id: string } };
  return { ctx, id: me.user.id };
}

test("only the owner may change a provider profile: another provider gets 403 and nothing changes", async () => {
  const hatchery = await signedIn(DEMO.hatchery);
  const builder = await signedIn(DEMO.builder);
  const before = (await (await hatchery.ctx.get(`/api/v1/providers/${hatchery.id}`)).json()) as { provider: { hatchery: unknown } };

  const attempt = await builder.ctx.put(`/api/v1/providers/${hatchery.id}/hatchery`, { data: { species: ["catfish"], delivers: true, deliveryRadiusKm: 999 } });
  expect(attempt.status()).toBe(403);
  const after = (await (await hatchery.ctx.get(`/api/v1/providers/${hatchery.id}`)).json()) as { provider: { hatchery: unknown } };
  expect(after.provider.hatchery).toEqual(before.provider.hatchery);

  // The owner can, and the change shows on the public record and in the search.
  const own = await hatchery.ctx.put(`/api/v1/providers/${hatchery.id}/hatchery`, { data: { species: ["tilapia", "catfish"], delivers: true, deliveryRadiusKm: 40 } });
  expect(own.status()).toBe(200);
  const changed = (await (await hatchery.ctx.get(`/api/v1/providers/${hatchery.id}`)).json()) as { provider: { hatchery: { deliveryRadiusKm: number; species: string[] } } };
  expect(changed.provider.hatchery).toMatchObject({ deliveryRadiusKm: 40, species: ["tilapia", "catfish"] });
  await hatchery.ctx.dispose();
  await builder.ctx.dispose();
});
