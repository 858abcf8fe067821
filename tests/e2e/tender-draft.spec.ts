import { expect, test } from "@playwright/test";
import { ACCOUNTS, nav, signIn, signOut, confirmStep } from "./helpers";

// A buyer drafts a tender, invites two vendors and opens it; the invitations reach the Mailroom.
let tenderPath = "";
const inDays = (days: number) => new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);

test("a buyer drafts a tender with two operating points, invites two vendors and opens it", async ({ page }) => {
  const title = `Sluice-gate radios ${Date.now().toString(36)}`;
  await signIn(page, ACCOUNTS.buyer);
  await nav(page).getByRole("link", { name: "Tenders", exact: true }).click();
  await page.getByRole("link", { name: "New tender" }).click();

  const form = page.getByRole("form", { name: "New tender" });
  await form.getByLabel("Title").fill(title);
  await form.getByLabel("Description").fill("Hard-decision radios for sluice-gate controllers.");
  await form.getByLabel("Channel model").selectOption("bsc");
  await form.getByLabel("Point 1 name").fill("Clear sky");
  await form.getByLabel("Point 1 raw BER p").fill("1e-3");
  await form.getByRole("button", { name: "Add operating point" }).click();
  await form.getByLabel("Point 2 name").fill("Storm fade");
  await form.getByLabel("Point 2 raw BER p").fill("6e-3");
  await form.getByLabel("Residual error at most").fill("1e-5");
  await form.getByLabel("Longest frame (bits)").fill("2048");
  await form.getByLabel("Quantity (units)").fill("800");
  await form.getByLabel("Price weight").fill("35");
  await form.getByLabel("Closing date and time").fill(`${inDays(10)}T15:00`);
  await form.getByLabel("Time zone").selectOption("Europe/Berlin");
  await form.getByLabel("Kestrelink Radio").check();
  await form.getByLabel("Oxbow Wireless").check();
  await form.getByRole("button", { name: "Create draft" }).click();

  await expect(page).toHaveURL(/\/tenders\/[0-9a-f-]{36}$/);
  tenderPath = new URL(page.url()).pathname;
  await expect(page.getByRole("heading", { name: title, level: 1 })).toBeVisible();
  const reference = (await page.getByText(/^RC-\d{4}-\d{3}$/).textContent())!.trim();
  const requirements = page.getByRole("region", { name: "Requirements" });
  await expect(requirements).toContainText("Clear sky: p = 1e-3");
  await expect(requirements).toContainText("Storm fade: p = 6e-3");
  await expect(requirements).toContainText("Europe/Berlin");
  await expect(page.getByText("Draft", { exact: true })).toBeVisible();

  await page.getByRole("button", { name: "Open tender" }).click();
  await expect(page.getByRole("dialog")).toContainText("The invited vendors are e-mailed at once");
  await confirmStep(page, "Open the tender");
  await expect(page.getByText("Open for offers", { exact: true })).toBeVisible();
  // Opened: the requirements are locked, so there is nothing left to edit.
  await expect(page.getByRole("link", { name: "Edit" })).toHaveCount(0);

  const tabs = page.getByRole("navigation", { name: "Tender sections" });
  await tabs.getByRole("link", { name: "Ledger" }).click();
  const ledger = page.getByRole("region", { name: "Ledger" });
  // Entries read as sentences, newest first; their details open on request.
  await expect(ledger.getByText(/Ines Calloway created the draft RC-\d{4}-\d+\./)).toBeVisible();
  const opened = ledger.getByRole("listitem").filter({ hasText: /Ines Calloway opened RC-\d{4}-\d+ for offers\./ });
  await opened.getByText(/for offers/).click();
  await expect(opened.getByText("tender.opened")).toBeVisible();

  // The buyer has no Mailroom; the admin has.
  await expect(nav(page).getByRole("link", { name: "Mailroom" })).toHaveCount(0);
  const forbidden = await page.goto("/mailroom");
  expect(forbidden?.status()).toBe(403);
  await page.goto("/desk");
  await signOut(page);

  await signIn(page, ACCOUNTS.admin);
  await expect(nav(page).getByRole("link", { name: "Mailroom" })).toBeVisible();
  await page.goto(`/mailroom?subject=${encodeURIComponent(`Invitation to tender ${reference}`)}`);
  await expect(page.getByRole("heading", { name: "Mailroom", level: 1 })).toBeVisible();
  const invitations = page.getByRole("listitem", { name: `Mail: Invitation to tender ${reference}: ${title}` });
  // Mail leaves in the background after the opening commits: look again until it has arrived.
  await expect(async () => {
    await page.reload();
    await expect(invitations).toHaveCount(2, { timeout: 1_000 });
  }).toPass();
  await expect(invitations.filter({ hasText: ACCOUNTS.kestrelink })).toHaveCount(1);
  await expect(invitations.filter({ hasText: ACCOUNTS.oxbow })).toHaveCount(1);
  await expect(invitations.first()).toContainText("(Europe/Berlin)");
  await signOut(page);
});

test("the buyer publishes an addendum; an invited vendor acknowledges it before submitting", async ({ page }) => {
  await signIn(page, ACCOUNTS.buyer);
  await page.goto(`${tenderPath}/notices`);
  const form = page.getByRole("form", { name: "Publish an addendum" });
  await form.getByLabel("Title").fill("Antenna height");
  await form.getByLabel(/Addendum \(do not name/).fill("Antennas sit 4 m above the gate; quote cables for that run.");
  await form.getByRole("button", { name: "Publish to every invited vendor" }).click();
  await expect(page.getByRole("status").filter({ hasText: "Addendum published" })).toBeVisible();
  await signOut(page);

  await signIn(page, ACCOUNTS.oxbow);
  await page.goto(`${tenderPath}/notices`);
  const addenda = page.getByRole("region", { name: "Addenda" });
  await expect(addenda).toContainText("Addendum 1: Antenna height");
  await addenda.getByRole("button", { name: "Acknowledge addendum 1" }).click();
  await expect(addenda.getByText(/^Acknowledged/)).toBeVisible();
  await signOut(page);
});

test("a buyer cannot cancel without a reason, and cancels a draft with one", async ({ page }) => {
  await signIn(page, ACCOUNTS.buyer);
  // A draft of its own through the API (the session cookie is shared), so the demo data stays as it is.
  // Like a browser, the write names its origin: signed-in writes from elsewhere are refused.
  const created = await page.request.post("/api/v1/tenders", {
    headers: { origin: new URL(page.url()).origin },
    data: {
      title: "Pump-house radios (to be cancelled)",
      channelModel: "biawgn",
      operatingPoints: [{ label: "Nominal", value: 2.5 }],
      targetMetric: "ber",
      targetValue: 1e-6,
      quantity: 40,
      currency: "GBP",
      weights: { technical: 50, evidence: 10, price: 30, leadTime: 5, warranty: 5 },
      closesLocal: `${inDays(20)}T09:00`,
      closesZone: "Europe/London",
    },
  });
  expect(created.status()).toBe(201);
  await page.goto(`/tenders/${(await created.json()).id}`);

  const form = page.getByRole("form", { name: "Cancel tender" });
  await form.getByLabel("Reason for cancelling").fill("too soon");
  await form.getByRole("button", { name: "Cancel tender" }).click();
  await expect(form.getByText("at least 10 characters")).toBeVisible();
  await expect(page.getByText("Draft", { exact: true })).toBeVisible();

  await form.getByLabel("Reason for cancelling").fill("The pump houses move to wired links.");
  await form.getByRole("button", { name: "Cancel tender" }).click();
  await expect(page.getByText("Cancelled", { exact: true })).toBeVisible();
  await expect(page.getByRole("note").filter({ hasText: "The pump houses move to wired links." })).toBeVisible();
});
