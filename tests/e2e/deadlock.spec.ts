import { expect, test } from "@playwright/test";
import { journeyTenderId, json, pageAs, tenderState } from "./journey";
import { ACCOUNTS, confirmStep } from "./helpers";
import { AWARD_VALUE_REASON } from "./journey-tenders";

// Approvals that cannot deadlock, on a copy of the demo gauges tender of its own (RC-E2E-DEADLOCK).
// Starting state (written by prepare.ts): envelopes open and a 250,000 EUR recommendation of the
// top offer awaiting approval (Helen Strand's limit is 250,000 EUR, Tomas Veld's 2,000,000 EUR;
// the band from 250,000 EUR needs two approvals). It ends with a 250,000 EUR recommendation in approval again.
test("the buyer withdraws a recommendation, one nobody can approve is refused with the reason, and a coverable one goes through", async ({ browser }) => {
  const buyer = await pageAs(browser, ACCOUNTS.buyer);
  const tenderId = await journeyTenderId(buyer.request, "deadlock");
  expect(await tenderState(buyer.request, tenderId)).toBe("approval");

  // Nobody strands the pending recommendation: Tomas Veld cannot be deactivated while it needs him.
  const admin = await pageAs(browser, ACCOUNTS.admin);
  const people = (await json(admin.request, "get", "/api/v1/users")).body;
  const tomas = (Array.isArray(people) ? people : people.users).find((u: { email: string }) => u.email === ACCOUNTS.director);
  // A signed-in write through the API must come from the app itself.
  const stranding = await admin.request.patch(`/api/v1/users/${tomas.id}`, { data: { active: false }, headers: { origin: new URL(admin.url()).origin } });
  expect(stranding.status()).toBe(409);
  expect((await stranding.json()).error).toMatch(/without enough approvers.*Ask the buyer to withdraw that recommendation first/);

  // Withdraw it from the Sign-off tab, with a reason and a confirmation.
  await buyer.goto(`/tenders/${tenderId}/sign-off`);
  const withdraw = buyer.getByRole("form", { name: "Withdraw the recommendation" });
  await withdraw.getByLabel("Reason for withdrawing").fill("Checking the award value against the approvers' limits.");
  await withdraw.getByRole("button", { name: "Withdraw the recommendation" }).click();
  await expect(buyer.getByRole("dialog")).toContainText("any approvals given to it stop counting");
  await confirmStep(buyer, "Withdraw");
  const recommendation = buyer.getByRole("region", { name: "Recommendation" });
  await expect(recommendation).toContainText("Withdrawn by the buyer");
  await expect(recommendation).toContainText("Withdrawn: Checking the award value against the approvers' limits.");
  expect(await tenderState(buyer.request, tenderId)).toBe("commercial");

  // 300,000 EUR needs two approvers with limits of at least 300,000 EUR: only one exists, so it is refused.
  await buyer.goto(`/tenders/${tenderId}/comparison`);
  const form = buyer.getByRole("form", { name: "Recommend an award" });
  await form.getByLabel(/Award value/).fill("300000");
  await form.getByLabel("Why the award value differs from the offer's prices").fill(AWARD_VALUE_REASON);
  await form.getByLabel("Justification").fill("Highest total score; plausible at both operating points and a short lead time.");
  await form.getByRole("button", { name: "Submit recommendation" }).click();
  await expect(form.getByRole("alert")).toContainText("needs 2 approvals from different approvers with a limit of at least €300,000.00");
  await expect(form.getByRole("alert")).toContainText("only 1 approver can give one (Tomas Veld)");
  expect(await tenderState(buyer.request, tenderId)).toBe("commercial");

  // The Approval limits page says which awards today's approvers cannot meet.
  await admin.goto("/approval-limits");
  await expect(admin.getByRole("note", { name: "Bands the approvers cannot meet" })).toContainText("Awards above €250,000.00");

  // 250,000 EUR can be approved by Helen Strand and Tomas Veld together: accepted.
  await form.getByLabel(/Award value/).fill("250000");
  await form.getByRole("button", { name: "Submit recommendation" }).click();
  await expect(buyer.getByRole("list", { name: "Recommendations so far" }).getByRole("listitem").first()).toContainText("4,000 units for €250,000.00: pending");
  expect(await tenderState(buyer.request, tenderId)).toBe("approval");
});
