import { expect, test, type Page } from "@playwright/test";
import { ACCOUNTS, signIn, signOut, confirmStep } from "./helpers";
import { chartsFollowTheirWidth, expectChartsApart, WIDTHS } from "./chart-layout";
import { JOURNEY_TENDERS } from "./journey-tenders";

// One journey through the technical evaluation of a copy of the demo gauges tender of its own
// (RC-E2E-REVIEW, written by prepare.ts as the demo has the original: four offers, one claim beyond
// capacity and one needing evidence, in technical evaluation, the engineer not yet declared), in order:
// the engineer declares, reviews, records a lab run at a milder channel (it does not verify) and
// one at the claim's, asks a question, cannot sign while it waits, the vendor answers, the engineer
// gives every claim a final mark and signs; the admin finds the e-mails in the Mailroom.
test.describe.configure({ mode: "serial" });

const { reference: REFERENCE } = JOURNEY_TENDERS.review;
let tenderPath = "";

/** Accepts the claim, or rejects it when the engine found it impossible, unless it already has a final mark. */
async function markIfNotFinal(page: Page, href: string) {
  await page.goto(href);
  await expect(page.getByRole("region", { name: "Findings" })).toBeVisible();
  if (/^(Accepted|Rejected as impossible)/.test((await page.getByTestId("current-mark").textContent()) ?? "")) return;
  const form = page.getByRole("form", { name: "Mark this claim" });
  // No mark is chosen for the engineer.
  await expect(form.getByRole("radio", { checked: true })).toHaveCount(0);
  const impossible = (await page.locator('main header [data-verdict="impossible"]').count()) > 0;
  if (impossible) {
    await form.getByLabel("Rejected as impossible").check();
    await form.getByLabel("Comment").fill("Beyond the converse bound at this operating point.");
  } else {
    await form.getByLabel("Accepted").check();
  }
  await form.getByRole("button", { name: "Record mark" }).click();
  await expect(form.getByRole("status")).toHaveText("Mark recorded.");
}

test("the engineer declares no conflict and sees the verdict badges", async ({ page }) => {
  await signIn(page, ACCOUNTS.engineer);
  await page.goto("/review");
  const declare = page.getByRole("link", { name: `Declare to review ${REFERENCE}` });
  await expect(declare).toBeVisible();
  const href = await declare.getAttribute("href");
  tenderPath = href!.replace(/\/review$/, "");
  await declare.click();
  const form = page.getByRole("form", { name: "Conflict-of-interest declaration" });
  await form.getByLabel("No conflict").check();
  await form.getByLabel("Statement").fill("I have no financial, family or employment ties to any invited vendor.");
  await form.getByRole("button", { name: "Declare" }).click();
  await expect(page.getByRole("region", { name: "Declaration" })).toContainText("You declared no conflict");

  await page.goto("/review");
  const grid = page.getByRole("region", { name: "Claims" });
  // The badges in the grid (the filter above it lists the same words as options).
  const badge = (verdict: string) => grid.getByRole("gridcell").locator(`[data-verdict="${verdict}"]`);
  await expect(badge("impossible").first()).toBeVisible();
  await expect(badge("needs-evidence").first()).toBeVisible();
  await expect(badge("plausible").first()).toBeVisible();
  await page.getByLabel("Verdict").selectOption("needs-evidence");
  await expect(page).toHaveURL(/verdict=needs-evidence/);
  await expect(badge("plausible")).toHaveCount(0);
  await expect(badge("needs-evidence").first()).toBeVisible();
  await expect(page.getByRole("note", { name: "Cautions" }).first()).toBeVisible();
});

test("the engineer records a lab run and asks Marram a question", async ({ page }) => {
  await signIn(page, ACCOUNTS.engineer);
  await page.goto("/review?verdict=needs-evidence");
  await page
    .getByRole("link", { name: /Open claim Marram Telemetry/ })
    .first()
    .click();
  await expect(page.getByRole("region", { name: "Findings" })).toBeVisible();
  await expect(page.getByRole("region", { name: "Numbers" })).toContainText("Least possible BLER");

  const run = page.getByRole("form", { name: "Record a lab run" });
  // A clean run a hundred times milder than the claim's p = 5e-3, typed with a decimal comma: it does not verify.
  await run.getByLabel("Channel condition").fill("0,00005");
  await run.getByLabel("Sent").fill("3000000");
  await run.getByLabel("Errors counted").fill("0");
  await run.getByLabel("Confidence").selectOption("0.95");
  await run.getByRole("button", { name: "Record run" }).click();
  await expect(run.getByRole("status")).toContainText("Lab run recorded: inconclusive.");
  await expect(run.getByRole("status")).toContainText("milder than the claim's p = 5e-3");
  const runs = page.getByRole("table", { name: "Lab runs" });
  await expect(runs.locator('tr[data-status="inconclusive"]', { hasText: "p = 5e-5" })).toHaveCount(1);
  await expect(page.getByRole("region", { name: "Charts" })).toContainText("lab runs");
  // The claim's charts keep titles, marker-line labels and key apart, on a desktop and a phone.
  for (const w of WIDTHS) {
    await page.setViewportSize({ width: w.width, height: w.height });
    await chartsFollowTheirWidth(page.getByRole("region", { name: "Charts" }));
    await expectChartsApart(page, page.getByRole("region", { name: "Charts" }));
    await page.getByRole("region", { name: "Charts" }).screenshot({ path: `test-results/charts/claim-${w.name}.png` });
  }
  await page.setViewportSize({ width: 1280, height: 720 });

  // The same counts at the claim's own channel verify it.
  await run.getByLabel("Channel condition").fill("0.005");
  await run.getByRole("button", { name: "Record run" }).click();
  await expect(run.getByRole("status")).toContainText("Lab run recorded: verified.");
  await expect(runs.locator('tr[data-status="verified"]', { hasText: "0 / 3,000,000" })).toHaveCount(1);

  const mark = page.getByRole("form", { name: "Mark this claim" });
  await mark.getByLabel("Clarification requested").check();
  await mark.getByLabel("Question subject").fill("Decoder iterations at storm fade");
  await mark.getByLabel("Question to the vendor").fill("How many decoder iterations give this BLER at p = 5e-3?");
  await mark.getByRole("button", { name: "Record mark" }).click();
  await expect(mark.getByRole("status")).toHaveText("Mark recorded.");
  await expect(page.getByRole("listitem", { name: "Thread: Decoder iterations at storm fade" })).toBeVisible();

  // The sign-off waits for the answer (or a closing reason): no form, and the reason in words.
  await page.goto(`${tenderPath}/review`);
  const signoff = page.getByRole("region", { name: "Technical sign-off" });
  await expect(signoff.getByRole("alert", { name: "Why it cannot be signed yet" })).toContainText("1 question to a vendor is neither answered nor closed");
  await expect(signoff.getByRole("button", { name: "Sign the technical evaluation" })).toHaveCount(0);
  await signOut(page);
});

test("Marram answers the question; another vendor does not see it", async ({ page }) => {
  await signIn(page, ACCOUNTS.oxbow);
  await page.goto(`${tenderPath}/review`);
  await expect(page.getByText("Decoder iterations at storm fade")).toHaveCount(0);
  await signOut(page);

  await signIn(page, ACCOUNTS.marram);
  await page.goto(`${tenderPath}/review`);
  const questions = page.getByRole("region", { name: "Questions from the evaluators" });
  await expect(questions).toContainText("How many decoder iterations");
  const reply = questions.getByRole("form", { name: "Reply: Decoder iterations at storm fade" });
  await reply.getByLabel("Reply").fill("Twenty iterations, layered schedule, 4-bit messages.");
  await reply.getByRole("button", { name: "Send reply" }).click();
  await expect(reply.getByRole("status")).toHaveText("Message sent.");
  await expect(questions).toContainText("Twenty iterations");
  await signOut(page);
});

test("the engineer marks every claim and signs the technical evaluation", async ({ page }) => {
  await signIn(page, ACCOUNTS.engineer);
  await page.goto(`${tenderPath}/review`);
  const links = page.getByRole("region", { name: "Claims of this tender" }).getByRole("link", { name: /Open claim/ });
  const hrefs = await links.evaluateAll((as) => as.map((a) => a.getAttribute("href")!));
  expect(hrefs.length).toBeGreaterThanOrEqual(8);
  for (const href of hrefs) await markIfNotFinal(page, href);

  await page.goto(`${tenderPath}/review`);
  const signoff = page.getByRole("region", { name: "Technical sign-off" });
  await expect(signoff).toContainText(`${hrefs.length} of ${hrefs.length} claims have a final mark; no question is waiting`);
  await signoff.getByLabel("Statement").fill("Every claim reviewed against the bounds and the lab evidence.");
  await signoff.getByRole("button", { name: "Sign the technical evaluation" }).click();
  await confirmStep(page, "Sign");
  await expect(signoff.getByRole("list", { name: "Signatures" })).toContainText("Every claim reviewed against the bounds and the lab evidence.");
  await expect(signoff.getByRole("list", { name: "Signatures" })).toContainText("Signed by");
  await expect(page.locator('[data-state="commercial"]')).toBeVisible();
  await signOut(page);
});

test("the admin finds the thread and sign-off e-mails in the Mailroom", async ({ page }) => {
  await signIn(page, ACCOUNTS.admin);
  // The Mailroom is paged, newest first: a subject filter finds each message wherever it is.
  await page.goto("/mailroom?subject=Decoder+iterations");
  await expect(page.getByRole("listitem", { name: /question from the evaluators: Decoder iterations/ }).first()).toBeVisible();
  await expect(page.getByRole("listitem", { name: /vendor answer: Decoder iterations/ }).first()).toBeVisible();
  // Other tenders were signed before the server started: this tender's reference picks its own message.
  await page.goto(`/mailroom?subject=${encodeURIComponent(`${REFERENCE}: technical evaluation signed`)}`);
  await expect(page.getByRole("listitem", { name: new RegExp(`${REFERENCE}: technical evaluation signed`) }).first()).toBeVisible();
});
