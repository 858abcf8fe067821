import { expect, test } from "@playwright/test";
import { ACCOUNTS, signIn, signOut } from "./helpers";

// A vendor answers the open flood-warning gateway tender (RC-2027-004), stated as an input level:
// -130 dBm at 1,200 bit/s, 160-bit packets, PER 1e-2. It enters its datasheet's sensitivity line,
// reads a waterfall curve from a CSV file (previewed first), types one more point, and reads the
// verdict with the worst point's limit and margin in dB.

test("Quillfield enters a sensitivity line and a curve, and sees the verdict, the limit and the margin", async ({ page }) => {
  await signIn(page, ACCOUNTS.quillfield);
  await page.goto("/tenders");
  await page.getByRole("link", { name: "Flood-warning gateway receivers" }).click();
  await expect(page.getByRole("region", { name: "Requirements" })).toContainText("input level -130 dBm at 1,200 bit/s, 160-bit payload");
  await page.getByRole("navigation", { name: "Tender sections" }).getByRole("link", { name: "Offers" }).click();
  await page.getByRole("link", { name: /Submit an offer|Open the offer form/ }).click();
  const form = page.getByRole("form", { name: "Offer form" });
  await expect(form).toBeVisible();

  await form.getByLabel("Module name", { exact: true }).fill("Quillfield QG-2 Gateway");
  await form.getByLabel("Part number", { exact: true }).fill("QG2-868");
  await form.getByLabel(/^Code family/).fill("LDPC");
  await form.getByLabel("Decoder input", { exact: true }).selectOption("soft");
  await form.getByLabel("Code rate k/n", { exact: true }).fill("0.5");

  const claim = form.getByRole("group", { name: "Claim at Valley gateway" });
  await claim.getByLabel("Sensitivity (dBm)", { exact: true }).fill("-138");
  await claim.getByLabel("At PER", { exact: true }).fill("1e-2");
  await claim.getByLabel("Noise figure (dB, optional)", { exact: true }).fill("5");

  await claim.getByLabel("Or read a CSV file:").setInputFiles({
    name: "waterfall.csv",
    mimeType: "text/csv",
    buffer: Buffer.from("level_dbm,per\n-139,1e-1\n-138,1e-2\n-137,1e-3\n"),
  });
  const preview = claim.getByRole("region", { name: "Curve file preview" });
  await expect(preview).toContainText("3 points read");
  await preview.getByRole("button", { name: "Use these 3 points" }).click();
  await expect(claim.getByLabel("Curve point 3 x")).toHaveValue("-137");

  // One more point typed by hand, in Eb/N0: -1 dB at BLER 1e-2 is below the least energy for 160 bits.
  await claim.getByRole("button", { name: "Add curve point" }).click();
  await claim.getByLabel("Curve point 4 x").fill("-1");
  await claim.getByLabel("Curve point 4 unit").selectOption("ebn0Db");
  await claim.getByLabel("Curve point 4 metric").selectOption("bler");
  await claim.getByLabel("Curve point 4 error rate").fill("1e-2");

  await form.getByLabel("Unit price", { exact: true }).fill("175");
  await form.getByLabel("Lead time (weeks)", { exact: true }).fill("7");
  await form.getByLabel("Warranty (months)", { exact: true }).fill("36");
  await form.getByRole("button", { name: /Submit offer|Submit a new version/ }).click();
  await expect(form.getByRole("status")).toContainText("submitted");

  const verdicts = page.getByRole("region", { name: "Verdicts" });
  // The claim's own badge (the curve's badges sit folded inside the claim cell).
  await expect(verdicts.locator("tr[data-claim] > td > [data-verdict]")).toHaveAttribute("data-verdict", "impossible");
  const worst = verdicts.locator("[data-sensitivity-worst]");
  await expect(worst).toHaveAttribute("data-sensitivity-worst", "4");
  await expect(worst).toContainText("Sensitivity -138 dBm at PER 0.01, NF 5 dB");
  await expect(worst).toContainText(/Worst: curve point 4 \(-1 dB Eb\/N0, BLER 0\.01\): implied Eb\/N0 -1\.00 dB, limit -0\.\d\d dB, margin −0\.\d\d dB/);
  await verdicts.getByText(/Curve, 4 points/).click();
  await expect(verdicts.getByRole("table", { name: "Curve points" }).locator("[data-curve-point]")).toHaveCount(4);
  await expect(page.getByRole("note", { name: "Sensitivity caution" })).toContainText("conducted or radiated");
  await signOut(page);
});

test("a buyer states an operating point as an input level, with the units and the assumed noise figure", async ({ page }) => {
  const title = `Reservoir gateways ${Date.now().toString(36)}`;
  await signIn(page, ACCOUNTS.buyer);
  await page.goto("/tenders/new");
  const form = page.getByRole("form", { name: "New tender" });
  await form.getByLabel("Title").fill(title);
  await form.getByLabel("Channel model").selectOption("biawgn");
  await form.getByLabel("Point 1 name").fill("Dam wall");
  await form.getByLabel("Point 1 stated as").selectOption("dbm");
  await form.getByLabel("Point 1 input level (dBm)").fill("-128");
  await form.getByLabel("Information bit rate (bit/s)").fill("2400");
  await form.getByLabel("Payload (bits per packet)").fill("200");
  await form.getByLabel("Packet error rate at most").fill("1e-2");
  await expect(form.getByText(/impossibility is always judged at the vendor.s stated figure or 0 dB/)).toBeVisible();
  await form.getByLabel("Assumed receiver noise figure (dB)").fill("5");
  await form.getByLabel("Quantity (units)").fill("12");
  await form.getByRole("button", { name: "Create draft" }).click();

  await expect(page.getByRole("heading", { name: title, level: 1 })).toBeVisible();
  const requirements = page.getByRole("region", { name: "Requirements" });
  await expect(requirements).toContainText("Dam wall: input level -128 dBm at 2,400 bit/s, 200-bit payload, PER ≤ 0.01");
  await expect(requirements).toContainText("5 dB (for plausibility where a vendor states none");
  await signOut(page);
});
