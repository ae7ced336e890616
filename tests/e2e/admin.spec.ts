import { expect, test } from "@playwright/test";
import { DEMO, signIn } from "./support";

test("an admin checks a waiting provider; the decision shows in the queue and in the search", async ({ page, request }) => {
  await signIn(page, DEMO.admin);
  await page.goto("/admin");
  const row = page.getByRole("listitem").filter({ hasText: "Kingfisher Fry House" });
  await expect(row).toBeVisible();
  await row.getByRole("button", { name: "Mark Kingfisher Fry House as checked" }).click();
  await expect(row).toHaveCount(0);
  await page.getByRole("link", { name: "Checked" }).click();
  await expect(page.getByRole("listitem").filter({ hasText: "Kingfisher Fry House" })).toBeVisible();

  // The public listing now carries the mark: it is found with "checked only".
  const found = async (verified: boolean) => {
    const r = await request.get(`/api/v1/listings/nearby?lat=-16.5&lng=27.5&radiusKm=300&kind=hatchery&limit=100${verified ? "&verified=true" : ""}`);
    const body = (await r.json()) as { items: { displayName: string; verified: boolean }[] };
    return body.items.find((i) => i.displayName === "Kingfisher Fry House");
  };
  expect(await found(true)).toMatchObject({ verified: true });
});
