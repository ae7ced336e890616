import { expect, test } from "@playwright/test";
import { DEMO, signIn, watchConsole } from "./support";
import { apiAs, e2eDatabase, postBatch } from "./reservation-support";

// A farmer opens a dispute in the quarantine week, the admin decides it on the dispute screen, the deposit moves
// back to the farmer and the decision is in the audit log. Money is worked by hand: 40 fish × ZMW 1.00 = ZMW 40.00,
// the whole of it held as the deposit (the reservation page shows the same figure), all of it returned.

test.describe("disputes @phone", () => {
  test("a farmer's dispute reaches the admin, who decides it for the farmer with a note", async ({ browser }, info) => {
    test.setTimeout(120_000);
    const hatchery = await apiAs(DEMO.hatchery);
    const farmer = await apiAs(DEMO.farmer);
    const batchId = await postBatch(hatchery.ctx, 100, "6");
    const created = await farmer.ctx.post("/api/v1/reservations", { data: { batchId, count: 40, handoverMethod: "pickup" }, headers: { "idempotency-key": `dispute-spec-${batchId}` } });
    expect(created.status()).toBe(201);
    const reservationId = ((await created.json()) as { reservation: { id: string } }).reservation.id;
    expect((await hatchery.ctx.post(`/api/v1/reservations/${reservationId}/actions`, { data: { action: "accept" } })).status()).toBe(200);
    expect((await farmer.ctx.post(`/api/v1/reservations/${reservationId}/pay`, { data: { paymentMethod: "pm_card_visa" }, headers: { "idempotency-key": `dispute-spec-pay-${batchId}` } })).status()).toBe(200);
    expect((await hatchery.ctx.post(`/api/v1/reservations/${reservationId}/actions`, { data: { action: "hand_over", count: 40 } })).status()).toBe(200);

    // The farmer opens the dispute from the reservation page, in the browser.
    const size = info.project.use.viewport ?? undefined;
    const farmerPage = await (await browser.newContext({ viewport: size })).newPage();
    const farmerProblems = watchConsole(farmerPage);
    await signIn(farmerPage, DEMO.farmer);
    await farmerPage.goto(`/farmer/reservations/${reservationId}`);
    await farmerPage.getByRole("button", { name: "Open a dispute" }).click();
    const reason = "Twelve of the forty were dead in the bag on arrival and more floated the next morning";
    await farmerPage.getByLabel(/What went wrong\?/).fill(reason);
    await farmerPage.getByRole("button", { name: "Open a dispute" }).click();
    await expect(farmerPage.getByText(/A Shoal administrator will decide/).first()).toBeVisible();

    // The admin sees it in the queue with the reason and both parties, refuses an empty decision, then decides.
    const adminPage = await (await browser.newContext({ viewport: size })).newPage();
    const adminProblems = watchConsole(adminPage);
    await signIn(adminPage, DEMO.admin);
    await adminPage.goto("/admin");
    await adminPage.getByRole("navigation", { name: "Admin sections" }).getByRole("link", { name: /Disputes \(\d+ open\)/ }).click();
    await expect(adminPage).toHaveURL(/\/admin\/disputes$/);
    const card = adminPage.getByRole("listitem").filter({ hasText: reason });
    await expect(card).toContainText("Fingerling reservation");
    await expect(card).toContainText("40 handed over");
    await card.scrollIntoViewIfNeeded();
    await adminPage.screenshot({ path: `test-results/screens/admin-disputes-${info.project.name}.png`, fullPage: false });
    await card.getByRole("button", { name: "Record the decision" }).click();
    await expect(card.getByRole("alert")).toHaveText("Choose who the deposit goes to");
    await card.getByLabel(/For the farmer/).check();
    await card.getByLabel("Note for the record").fill("Spoke to both; the farmer's photos show the losses");
    await card.getByRole("button", { name: "Record the decision" }).click();
    await expect(adminPage.getByRole("listitem").filter({ hasText: reason })).toHaveCount(0);

    // The farmer's page shows the outcome; the hold returned the whole deposit; the audit log has the decision.
    await farmerPage.reload();
    await expect(farmerPage.getByText(/Refunded|Deposit returned|returned/i).first()).toBeVisible();
    const db = e2eDatabase();
    try {
      const state = (await db.execute({ sql: "select state from reservation where id = ?", args: [reservationId] })).rows[0]?.state;
      expect(state).toBe("refunded");
      const hold = (await db.execute({ sql: "select state, held_minor, returned_minor, released_minor from deposit_hold where subject_type = 'reservation' and subject_id = ?", args: [reservationId] })).rows[0];
      expect(hold).toMatchObject({ returned_minor: 4000, released_minor: 0 }); // ZMW 40.00 = 4000 ngwee, all back
      const audit = (await db.execute({ sql: "select actor_id, detail from audit_log where subject_type = 'reservation' and subject_id = ? and action = 'reservation.resolve_dispute'", args: [reservationId] })).rows;
      expect(audit).toHaveLength(1);
      expect(JSON.parse(String(audit[0]?.detail))).toMatchObject({ outcome: "for_farmer", note: "Spoke to both; the farmer's photos show the losses", from: "disputed", to: "refunded" });
    } finally {
      db.close();
    }
    expect(farmerProblems).toEqual([]);
    expect(adminProblems).toEqual([]);
  });
});
