import { expect, test } from "@playwright/test";
import { ACCOUNTS, nav, signIn } from "./helpers";
import { JOURNEY_TENDERS } from "./journey-tenders";

// An awarded tender of its own (RC-E2E-LEDGER, a copy of the demo gauges tender that prepare.ts
// takes through both approvals, so its memo is issued before the server starts): the memo's ledger
// head on Memo check, the tender's Ledger tab, and the admin's full check with its progress.
test.describe.configure({ mode: "serial" });

const { reference: REFERENCE } = JOURNEY_TENDERS.ledger;

test("Memo check names the ledger head the memo was issued at, still in the verified chain", async ({ page, request }) => {
  await signIn(page, ACCOUNTS.buyer);
  const list = await (await page.request.get(`/api/v1/tenders?q=${REFERENCE}`)).json();
  const tender = list.tenders.find((t: { reference: string }) => t.reference === REFERENCE);
  const memo = await page.request.get(`/api/v1/tenders/${tender.id}/memo`);
  const fingerprint = memo.headers()["x-memo-sha256"];
  const check = await request.post("/api/v1/memo-check", { data: { sha256: fingerprint } });
  expect(await check.json()).toMatchObject({ authentic: true, ledgerHead: { inVerifiedChain: true } });

  await page.goto(`/tenders/${tender.id}/ledger`);
  await expect(page.getByRole("status", { name: "Chain check" })).toContainText(/Chain verified through entry #\d+ \(\d+ new entries checked just now\)/);

  await page.goto("/memo-check");
  await page.getByLabel("SHA-256 fingerprint", { exact: true }).fill(fingerprint);
  await page.getByRole("button", { name: /Check the fingerprint/i }).click();
  await expect(page.getByLabel("Ledger head")).toContainText(/Issued at ledger entry #\d+, hash [0-9a-f]{12}\. Entry #\d+ is in the ledger with the same hash/);
});

test("the admin checks the whole ledger from the Ledger check page, with progress and the result", async ({ page }) => {
  await signIn(page, ACCOUNTS.admin);
  await nav(page).getByRole("link", { name: "Ledger check" }).click();
  await expect(page.getByRole("heading", { name: "Ledger check", level: 1 })).toBeVisible();
  await expect(page.getByRole("status", { name: "Chain state" })).toContainText(/Verified through entry #\d+/);
  await page.getByRole("button", { name: "Check the whole ledger" }).click();
  await expect(page.getByRole("status", { name: "Full check progress" })).toContainText(/Intact: all [\d,]+ entries and every signed checkpoint hold\./);
  await expect(page.getByRole("region", { name: "Recent full checks" })).toContainText("Intact");
});

test("buyers have no Ledger check page", async ({ page }) => {
  await signIn(page, ACCOUNTS.buyer);
  await expect(nav(page).getByRole("link", { name: "Ledger check" })).toHaveCount(0);
});
