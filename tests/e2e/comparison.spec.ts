import { readFile } from "node:fs/promises";
import { expect, test, type Page } from "@playwright/test";
import { ACCOUNTS, confirmStep, signIn } from "./helpers";
import { AWARD_VALUE, AWARD_VALUE_REASON, JOURNEY_TENDERS } from "./journey-tenders";

// Starting state (written by prepare.ts before the server starts): the tender below, a copy of the
// demo gauges tender, is in commercial evaluation, its technical evaluation signed, its envelopes
// still sealed, with at least two offers in the ranking.
const REFERENCE = process.env.E2E_COMMERCIAL_TENDER ?? JOURNEY_TENDERS.comparison.reference;

/** The grid's rows in display order, each as { col-id: text }, merging the pinned and scrolling parts of a row. */
async function gridRows(page: Page): Promise<Record<string, string>[]> {
  const grid = page.getByRole("region", { name: "Comparison grid" });
  return grid.evaluate((root) => {
    const rows = new Map<number, Record<string, string>>();
    for (const row of Array.from(root.querySelectorAll('[role="row"][row-index]'))) {
      const index = Number(row.getAttribute("row-index"));
      const cells = rows.get(index) ?? {};
      for (const cell of Array.from(row.querySelectorAll('[role="gridcell"][col-id]'))) cells[cell.getAttribute("col-id")!] = (cell.textContent ?? "").trim();
      rows.set(index, cells);
    }
    return [...rows.entries()].sort((a, b) => a[0] - b[0]).map(([, cells]) => cells);
  });
}

/** AG Grid quotes every value; no value of this grid holds a quote. */
const csvRows = (text: string) =>
  text
    .replace(/^\uFEFF/, "")
    .trim()
    .split(/\r?\n/)
    .map((line) => line.replace(/^"|"$/g, "").split('","'));

test("a buyer opens the envelopes, sorts, exports, tries other weights and recommends an award", async ({ page }) => {
  await page.setViewportSize({ width: 1440, height: 900 });
  await signIn(page, ACCOUNTS.buyer);
  await page.goto("/tenders");
  // The list names the tender by its title; its row carries the reference.
  await page
    .getByRole("row", { name: new RegExp(REFERENCE) })
    .getByRole("link")
    .first()
    .click();
  await page.getByRole("link", { name: "Comparison", exact: true }).click();
  await expect(page.getByRole("region", { name: "Comparison grid" })).toBeVisible();
  // The caution sits beside the verdicts, once (the signed-in pages have no footer copy of it).
  await expect(page.getByRole("note", { name: "Cautions" })).toHaveCount(1);
  await expect(page.getByRole("note", { name: "Cautions" })).toContainText("do not replace qualification testing");

  // Sealed: no prices, no totals, no ranks.
  await expect(page.getByText(/Envelopes sealed/)).toBeVisible();
  for (const row of await gridRows(page)) {
    expect(row.totalPrice).toBe("–");
    expect(row.rank).toBe("–");
  }

  await page.getByRole("button", { name: "Open envelopes" }).click();
  await confirmStep(page, "Open the envelopes");
  await expect(page.getByRole("status").filter({ hasText: "Envelopes opened" })).toBeVisible();
  await expect(page.getByRole("button", { name: "Open envelopes" })).toHaveCount(0);
  await expect.poll(async () => (await gridRows(page)).some((r) => r.rank === "1")).toBe(true);

  // Sort by total, highest first (AG Grid cycles ascending, descending).
  const totalHeader = page.getByRole("region", { name: "Comparison grid" }).locator('[role="columnheader"][col-id="total"]');
  await totalHeader.click();
  await totalHeader.click();
  await expect(totalHeader).toHaveAttribute("aria-sort", "descending");
  const sorted = await gridRows(page);
  const totals = sorted.map((r) => (r.total === "–" ? -1 : Number(r.total)));
  expect(totals).toEqual([...totals].sort((a, b) => b - a));
  expect(sorted[0].rank).toBe("1");
  // A disqualified offer shows no score at all; every other score is within 0..100.
  for (const row of sorted) {
    const scores = Object.entries(row)
      .filter(([col]) => col.startsWith("score-") || col === "total")
      .map(([, v]) => v);
    if (row.status.includes("Disqualified")) expect(scores.every((v) => v === "–")).toBe(true);
    else for (const v of scores) expect(Number(v)).toBeLessThanOrEqual(100);
  }
  // At 1,440 px the total price, total score and rank stay in view (pinned).
  const grid = page.getByRole("region", { name: "Comparison grid" });
  for (const col of ["totalPrice", "total", "rank"]) await expect(grid.locator(`[role="columnheader"][col-id="${col}"]`)).toBeInViewport();

  // CSV export: one header row, then the grid's rows in the grid's order.
  const downloading = page.waitForEvent("download");
  await page.getByRole("button", { name: "Export CSV" }).click();
  const download = await downloading;
  expect(download.suggestedFilename()).toBe(`${REFERENCE}-comparison.csv`);
  const [header, ...lines] = csvRows(await readFile((await download.path())!, "utf8"));
  expect(header[0]).toBe("Vendor");
  expect(lines).toHaveLength(sorted.length);
  const vendorAt = header.indexOf("Vendor");
  const totalAt = header.indexOf("Total");
  const rankAt = header.indexOf("Rank");
  expect(lines.map((l) => l[vendorAt])).toEqual(sorted.map((r) => r.vendorName));
  // Numbers as numbers: the grid's "81.2" is 81.2xxx in the file, and no value is an empty cell.
  expect(lines.map((l) => (l[totalAt] === "" ? "–" : Number(l[totalAt]).toFixed(1)))).toEqual(sorted.map((r) => r.total));
  expect(lines.map((l) => (l[rankAt] === "" ? "–" : l[rankAt]))).toEqual(sorted.map((r) => r.rank));
  const priceAt = header.findIndex((h) => h.startsWith("Total price"));
  for (const l of lines) expect(l[priceAt]).toMatch(/^\d+(\.\d+)?$/);

  // The score sheet of the selected offer.
  await page.getByRole("gridcell", { name: sorted[0].vendorName }).click();
  await expect(page.getByRole("region", { name: `Score sheet of ${sorted[0].vendorName}` })).toContainText("Contribution");

  // What-if: price alone decides; the cheapest offer still in the ranking comes first.
  const whatIf = page.getByRole("region", { name: "What-if weights" });
  await expect(whatIf.getByRole("note")).toHaveText("What-if only: the frozen weights of the tender do not change.");
  for (const label of ["Technical", "Evidence", "Lead time", "Warranty"]) await whatIf.getByLabel(`${label} weight`).fill("0");
  await whatIf.getByLabel("Price weight").fill("100");
  const cheapest = sorted.filter((r) => r.rank !== "–" && r["score-price"] === "100.0").map((r) => r.vendorName);
  expect(cheapest.length).toBeGreaterThan(0);
  const whatIfRanking = whatIf.getByRole("table", { name: "What-if ranking" });
  await expect(whatIfRanking.getByRole("row").nth(1)).toContainText(cheapest[0]);
  // The grid keeps the frozen weights' ranking.
  expect((await gridRows(page)).map((r) => r.rank)).toEqual(sorted.map((r) => r.rank));
  await whatIf.getByRole("button", { name: "Reset to the tender's weights" }).click();

  // The recommendation: the top offer, the award value prefilled with its total price.
  const form = page.getByRole("form", { name: "Recommend an award" });
  await expect(form.getByLabel(/Award value/)).not.toHaveValue("");
  await expect(form.getByLabel(/Award value/)).not.toHaveValue("0");
  // 4,000 radios with installation and support: 250,000 EUR, the band that needs two approvals.
  await form.getByLabel(/Award value/).fill(String(AWARD_VALUE));
  // A value other than the offer's prices give needs a stated reason, shown beside the computed one.
  await expect(form.getByText(/The offer's prices give €/)).toBeVisible();
  await form.getByLabel("Why the award value differs from the offer's prices").fill(AWARD_VALUE_REASON);
  await form.getByLabel("Justification").fill("Highest total score; plausible at both operating points, lab evidence on file and a short lead time.");
  await form.getByRole("button", { name: "Submit recommendation" }).click();
  // The tender moves to approval: the page shows the new state (the form's own notice goes with the form).
  await expect(page.getByRole("region", { name: "Recommendation" })).toContainText("pending");
  await expect(page.getByRole("main").getByText("In approval", { exact: true })).toBeVisible();
  await expect(page.getByRole("form", { name: "Recommend an award" })).toHaveCount(0);
});
