import { createHash } from "node:crypto";
import { readFile } from "node:fs/promises";
import { expect, test, type APIRequestContext, type Browser, type Page } from "@playwright/test";
import { gaugesTenderId, json, pageAs as as, REFERENCE, tenderState as stateOf } from "./gauges";
import { ACCOUNTS, confirmStep, signIn } from "./helpers";

// From recommendation to award on the demo gauges tender (RC-2027-001): two approvals for the
// high-value band, a return and a resubmission on the way, the memo downloaded, its fingerprint
// confirmed on the public Memo check, and the notices in the Mailroom.
//
// Starting state: the demo seed with the demo approval bands. The tender may be in technical
// evaluation (the preparation below marks, signs and opens the envelopes through the API), already
// in commercial evaluation (e.g. after the review journey signed it), or in approval with the
// 250,000 EUR recommendation of the comparison and deadlock journeys.
test.describe.configure({ mode: "serial" });

// 4,000 radios with installation and support: the band from 250,000 EUR needs two approvals.
const VALUE = 250_000;
let tenderId = "";
let memoFile = "";
let fingerprint = "";

const tenderState = (api: APIRequestContext) => stateOf(api, tenderId);

/** Brings the tender to commercial evaluation with its envelopes open (idempotent). */
async function prepare(browser: Browser) {
  const buyer = await as(browser, ACCOUNTS.buyer);
  tenderId = await gaugesTenderId(buyer.request);
  if ((await tenderState(buyer.request)) === "technical") {
    const engineer = (await as(browser, ACCOUNTS.engineer)).request;
    await json(engineer, "post", `/api/v1/tenders/${tenderId}/declaration`, {
      conflict: "none",
      conflictedOrgIds: [],
      statement: "No ties to any invited vendor.",
    });
    const { claims } = (await json(engineer, "get", `/api/v1/claims?tenderId=${tenderId}&mark=unmarked`)).body;
    for (const c of claims as { id: string; verdict: string }[]) {
      const mark =
        c.verdict === "impossible"
          ? { mark: "rejected-impossible", comment: "Beyond the converse bound at this block length." }
          : { mark: "accepted", comment: "" };
      expect((await json(engineer, "post", `/api/v1/claims/${c.id}/marks`, mark)).status).toBeLessThan(300);
    }
    expect((await json(engineer, "post", `/api/v1/tenders/${tenderId}/signoff`, { statement: "Every claim reviewed against the bounds." })).status).toBe(201);
  }
  if ((await tenderState(buyer.request)) === "commercial") {
    await json(buyer.request, "post", `/api/v1/tenders/${tenderId}/envelopes`);
    await recommend(buyer.request, "Best total score with honest claims at both operating points; installation and five years of support included.");
  }
  expect(await tenderState(buyer.request)).toBe("approval");
}

async function recommend(api: APIRequestContext, justification: string) {
  const comparison = (await json(api, "get", `/api/v1/tenders/${tenderId}/comparison`)).body;
  const best = comparison.sheet.offers.find((o: { rank: number | null }) => o.rank === 1);
  const posted = await json(api, "post", `/api/v1/tenders/${tenderId}/recommendation`, {
    offerId: best.offerId,
    quantity: 4000,
    value: VALUE,
    valueReason: "Installation at every gauge site and five years of support.",
    justification,
  });
  expect(posted.status).toBe(201);
}

async function openSignOff(page: Page) {
  await page.goto(`/tenders/${tenderId}/sign-off`);
  const declaration = page.getByRole("form", { name: "Conflict-of-interest declaration" });
  if (await declaration.isVisible()) {
    await declaration.getByLabel("No conflict").check();
    await declaration.getByLabel("Statement").fill("I have no ties to any invited vendor.");
    await declaration.getByRole("button", { name: "Declare" }).click();
    await expect(page.getByRole("region", { name: "Recommendation" }).or(declaration.getByRole("status"))).toBeVisible();
    await page.reload();
    await expect(page.getByRole("region", { name: "Recommendation" })).toBeVisible();
  }
}

async function decide(page: Page, button: "Approve" | "Return to the buyer", comment: string) {
  await openSignOff(page);
  const form = page.getByRole("form", { name: "Decision" });
  await form.getByLabel("Comment (required to return)").fill(comment);
  await form.getByRole("button", { name: button }).click();
  if (button === "Approve") await confirmStep(page, "Approve");
  // The page redraws at once: the decision shows in the list of decisions, with its comment.
  await expect(page.getByRole("region", { name: "Decisions" })).toContainText(comment);
}

test("two approvers sign the high-value award after a return and a resubmission", async ({ browser }) => {
  await prepare(browser);
  const helen = await as(browser, ACCOUNTS.approver);
  const tomas = await as(browser, ACCOUNTS.director);

  await openSignOff(helen);
  await expect(helen.getByLabel("Approval rule")).toContainText("needs 2 approvals");
  await expect(helen.getByRole("region", { name: "Verdicts per offer" })).toContainText("Impossible");
  await expect(helen.locator('iframe[title="Memo preview"]')).toBeVisible();
  await expect(helen.getByRole("main").getByRole("note", { name: "Cautions" })).toBeVisible();
  await decide(helen, "Approve", "Within the budget line for gauges.");

  // A return needs a comment; with one, it goes back to the buyer.
  await openSignOff(tomas);
  const form = tomas.getByRole("form", { name: "Decision" });
  await form.getByRole("button", { name: "Return to the buyer" }).click();
  await expect(form.getByText(/Say why you return it/)).toBeVisible();
  await decide(tomas, "Return to the buyer", "Confirm the lead time in writing before we sign.");

  const buyer = await as(browser, ACCOUNTS.buyer);
  expect(await tenderState(buyer.request)).toBe("commercial");
  await recommend(buyer.request, "Lead time confirmed in writing at ten weeks; installation and five years of support included.");

  await decide(tomas, "Approve", "Lead time confirmed.");
  // The same person cannot give both approvals: the form is gone for Tomas.
  await tomas.reload();
  await expect(tomas.getByRole("form", { name: "Decision" })).toHaveCount(0);
  await decide(helen, "Approve", "Second signature.");

  await helen.reload();
  const memo = helen.getByRole("region", { name: "Award memo" });
  await expect(memo).toContainText(`Award memo ${REFERENCE}-M1`);
  fingerprint = (await helen.getByTestId("memo-fingerprint").textContent())!.trim();
  expect(fingerprint).toMatch(/^[0-9a-f]{64}$/);
  const [download] = await Promise.all([helen.waitForEvent("download"), memo.getByRole("link", { name: "Download the memo (PDF)" }).click()]);
  memoFile = (await download.path())!;
  expect(
    createHash("sha256")
      .update(await readFile(memoFile))
      .digest("hex"),
  ).toBe(fingerprint);
});

test("anyone confirms the memo on Memo check, and a changed copy fails", async ({ page }) => {
  await page.goto("/memo-check");
  await expect(page.getByRole("note", { name: "Cautions" }).first()).toBeVisible();
  await page.getByLabel("Memo file (PDF)").setInputFiles(memoFile);
  await page.getByRole("button", { name: "Check the file" }).click();
  const result = page.getByRole("status", { name: "Check result" });
  await expect(result).toContainText(`Authentic memo ${REFERENCE}-M1`);
  await expect(result).toContainText("River-level gauge radios");
  await expect(result).toContainText("Approved by Helen Strand");
  await expect(result).toContainText("Approved by Tomas Veld");

  const altered = await readFile(memoFile);
  altered[Math.floor(altered.length / 2)] ^= 1;
  await page.getByLabel("Memo file (PDF)").setInputFiles({ name: "memo.pdf", mimeType: "application/pdf", buffer: altered });
  await page.getByRole("button", { name: "Check the file" }).click();
  await expect(result).toContainText("Not an authentic Ratecourt memo");

  await page.getByLabel("SHA-256 fingerprint").fill(fingerprint.toUpperCase());
  await page.getByRole("button", { name: "Check the fingerprint" }).click();
  await expect(result).toContainText(`Authentic memo ${REFERENCE}-M1`);
});

test("the award and regret notices are in the Mailroom", async ({ page }) => {
  await signIn(page, ACCOUNTS.admin);
  // The Mailroom is paged, newest first: the tender's reference in the subject finds every one of its messages.
  await page.goto(`/mailroom?subject=${encodeURIComponent(REFERENCE)}&size=100`);
  await expect(page.getByRole("listitem", { name: `Mail: Award notice: ${REFERENCE} River-level gauge radios` })).toHaveCount(1);
  const regrets = page.getByRole("listitem", { name: `Mail: Outcome of tender ${REFERENCE} River-level gauge radios` });
  await expect(regrets).toHaveCount(3);
  for (const text of await regrets.allTextContents()) expect(text).not.toMatch(/€/);
  await expect(page.getByRole("listitem", { name: new RegExp(`Mail: ${REFERENCE}: recommendation returned by Tomas Veld`) })).toHaveCount(1);
});

test("a losing vendor objects during the standstill period, and the buyer reads it on the Notices tab", async ({ browser }) => {
  const vendor = await as(browser, ACCOUNTS.oxbow);
  await vendor.goto(`/tenders/${tenderId}/notices`);
  const standstill = vendor.getByRole("region", { name: "Standstill and objections" });
  await expect(standstill).toContainText("standstill period of 10 days");
  await standstill.getByLabel("Your objection, in writing").fill("Our lead time was scored against the wrong delivery date; please review it.");
  await standstill.getByRole("button", { name: "Lodge the objection" }).click();
  await expect(vendor.getByRole("status").filter({ hasText: "Objection lodged" })).toBeVisible();

  const buyer = await as(browser, ACCOUNTS.buyer);
  await buyer.goto(`/tenders/${tenderId}/notices`);
  const seen = buyer.getByRole("region", { name: "Standstill and objections" });
  await expect(seen).toContainText("Oxbow Wireless");
  await expect(seen).toContainText("scored against the wrong delivery date");
});
