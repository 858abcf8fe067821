import { expect, test, type Page } from "@playwright/test";
import { ACCOUNTS, signIn, signOut } from "./helpers";

// Vendors submit offers on the open weirs tender (hard decision, p = 2e-3, BLER 1e-5 required)
// and read the engine's verdict before closing. A rerun against the same database resubmits.

async function openOfferForm(page: Page) {
  await page.goto("/tenders");
  await page.getByRole("link", { name: "Weir telemetry links" }).click();
  await page.getByRole("navigation", { name: "Tender sections" }).getByRole("link", { name: "Offers" }).click();
  await page.getByRole("link", { name: /Submit an offer|Open the offer form/ }).click();
  await expect(page.getByRole("form", { name: "Offer form" })).toBeVisible();
}

interface Filled {
  module: string;
  part: string;
  family: string;
  n: string;
  k: string;
  claim: string;
  price: string;
  weeks: string;
  months: string;
}

async function fillOffer(page: Page, v: Filled) {
  const form = page.getByRole("form", { name: "Offer form" });
  await form.getByLabel("Module name", { exact: true }).fill(v.module);
  await form.getByLabel("Part number", { exact: true }).fill(v.part);
  await form.getByLabel(/^Code family/).fill(v.family);
  await form.getByLabel("Decoder input", { exact: true }).selectOption("hard");
  await form.getByLabel("Block length n (bits)", { exact: true }).fill(v.n);
  await form.getByLabel("Information bits k", { exact: true }).fill(v.k);
  await form.getByLabel("Code rate k/n", { exact: true }).fill("");
  await form.getByLabel(/^Overhead/).fill("");
  const claim = form.getByRole("group", { name: "Claim at Typical path" });
  await claim.getByLabel("Metric", { exact: true }).selectOption("bler");
  await claim.getByLabel("Claimed value", { exact: true }).fill(v.claim);
  await form.getByLabel("Unit price", { exact: true }).fill(v.price);
  // The tender fixes the currency: shown, not typed.
  await expect(form.getByTestId("offer-currency")).toHaveText("EUR, set by the tender");
  await form.getByLabel("Lead time (weeks)", { exact: true }).fill(v.weeks);
  await form.getByLabel("Warranty (months)", { exact: true }).fill(v.months);
  await form.getByRole("button", { name: /Submit offer|Submit a new version/ }).click();
  await expect(form.getByRole("status")).toContainText("submitted");
}

test("Kestrelink claims beyond capacity and sees Impossible before closing", async ({ page }) => {
  await signIn(page, ACCOUNTS.kestrelink);
  await openOfferForm(page);
  // Rate 2040/2048 = 0.996 is above the capacity of the BSC at p = 2e-3 (about 0.979).
  await fillOffer(page, {
    module: "KR-868 WeirLink",
    part: "KR-868-WL",
    family: "RS",
    n: "2048",
    k: "2040",
    claim: "1e-9",
    price: "27.50",
    weeks: "10",
    months: "24",
  });
  const verdicts = page.getByRole("region", { name: "Verdicts" });
  await expect(verdicts.getByText("Impossible", { exact: true })).toBeVisible();
  await expect(verdicts.getByText(/No code can reach|needs capacity/).first()).toBeVisible();
  await expect(page.getByRole("note", { name: "Cautions" }).first()).toContainText("do not replace qualification testing");
  await signOut(page);
});

test("Oxbow submits an honest offer, sees Plausible, and only its own offer on the Offers tab", async ({ page }) => {
  await signIn(page, ACCOUNTS.oxbow);
  await openOfferForm(page);
  await fillOffer(page, {
    module: "Oxbow OW-Weir",
    part: "OW-W1",
    family: "LDPC",
    n: "2048",
    k: "1536",
    claim: "1e-5",
    price: "61.00",
    weeks: "9",
    months: "24",
  });
  const verdicts = page.getByRole("region", { name: "Verdicts" });
  await expect(verdicts.getByText("Plausible", { exact: true })).toBeVisible();
  await expect(verdicts.getByText("Impossible", { exact: true })).toHaveCount(0);

  await page.getByRole("navigation", { name: "Tender sections" }).getByRole("link", { name: "Offers" }).click();
  await expect(page.getByRole("region", { name: "Oxbow Wireless" })).toBeVisible();
  await expect(page.getByText("Kestrelink")).toHaveCount(0);
  await expect(page.getByRole("region", { name: "Oxbow Wireless" }).getByText("€61.00")).toBeVisible();
  await signOut(page);
});

test("a claim with k > n is refused with a message naming k, and the form keeps what was typed", async ({ page }) => {
  await signIn(page, ACCOUNTS.quillfield);
  await openOfferForm(page);
  const form = page.getByRole("form", { name: "Offer form" });
  await form.getByLabel("Block length n (bits)", { exact: true }).fill("1023");
  await form.getByLabel("Information bits k", { exact: true }).fill("2000");
  await form.getByRole("button", { name: /Submit offer|Submit a new version/ }).click();
  await expect(form.getByText(/k must be at most n \(1023\)/)).toBeVisible();
  await expect(form.getByLabel("Information bits k", { exact: true })).toHaveValue("2000");
  await signOut(page);
});
