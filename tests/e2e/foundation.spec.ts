import { expect, test } from "@playwright/test";
import { ACCOUNTS, nav, PASSWORD, signIn, signOut } from "./helpers";

// Each demo role signs in, sees its Desk and the navigation its abilities allow.
const roles = [
  { who: "admin", email: ACCOUNTS.admin, sees: ["Desk", "Tenders", "People", "Mailroom"], hidden: ["Review bench"], section: "Tenders in progress" },
  {
    who: "buyer",
    email: ACCOUNTS.buyer,
    sees: ["Desk", "Tenders", "Bound explorer"],
    hidden: ["People", "Review bench"],
    section: "Drafts to finish and open",
  },
  {
    who: "engineer",
    email: ACCOUNTS.engineer,
    sees: ["Desk", "Tenders", "Review bench", "Bound explorer"],
    hidden: ["People"],
    section: "Technical evaluations to review",
  },
  { who: "approver", email: ACCOUNTS.approver, sees: ["Desk", "Tenders"], hidden: ["People", "Review bench"], section: "Recommendations awaiting approval" },
  {
    who: "vendor",
    email: ACCOUNTS.kestrelink,
    sees: ["Desk", "Tenders", "Bound explorer"],
    hidden: ["People", "Review bench", "Mailroom"],
    section: "Tenders you are invited to",
  },
] as const;

for (const role of roles) {
  test(`${role.who} signs in and sees their desk and navigation`, async ({ page }) => {
    await signIn(page, role.email);
    await expect(page.getByRole("region", { name: role.section })).toBeVisible();
    for (const label of role.sees) await expect(nav(page).getByRole("link", { name: label, exact: true })).toBeVisible();
    for (const label of role.hidden) await expect(nav(page).getByRole("link", { name: label, exact: true })).toHaveCount(0);
    await signOut(page);
  });
}

test("a page opened while signed out returns to itself after sign-in; only same-site paths are followed", async ({ page }) => {
  await page.goto("/tenders?from=mail");
  await expect(page).toHaveURL(/\/sign-in\?next=%2Ftenders%3Ffrom%3Dmail$/);
  await page.getByLabel("E-mail").fill(ACCOUNTS.buyer);
  await page.getByLabel("Password").fill(PASSWORD);
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page).toHaveURL(/\/tenders\?from=mail$/);
  await signOut(page);

  await page.goto("/sign-in?next=/%5Cevil.example");
  await page.getByLabel("E-mail").fill(ACCOUNTS.buyer);
  await page.getByLabel("Password").fill(PASSWORD);
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page.getByRole("heading", { name: "Desk", level: 1 })).toBeVisible();
  await signOut(page);
});

test("a wrong password gets a clear message", async ({ page }) => {
  await page.goto("/sign-in");
  await page.getByLabel("E-mail").fill(ACCOUNTS.buyer);
  await page.getByLabel("Password").fill("not-the-password");
  await page.getByRole("button", { name: "Sign in" }).click();
  // Next.js keeps an empty route announcer with the alert role too: find ours by its text.
  await expect(page.getByRole("alert").filter({ hasText: "Wrong e-mail or password." })).toBeVisible();
  await expect(page).toHaveURL(/\/sign-in/);
});

test("a vendor gets a forbidden page for People and for another organisation's record", async ({ page }) => {
  await signIn(page, ACCOUNTS.admin);
  await page.goto("/people");
  const otherOrg = page.getByRole("region", { name: "Organisations" }).getByRole("link", { name: "Marram Telemetry" });
  const otherOrgUrl = await otherOrg.getAttribute("href");
  expect(otherOrgUrl).toMatch(/^\/organisations\//);
  await signOut(page);

  await signIn(page, ACCOUNTS.kestrelink);
  const people = await page.goto("/people");
  expect(people?.status()).toBe(403);
  await expect(page.getByRole("heading", { name: "Forbidden" })).toBeVisible();
  await expect(page.getByText("Dana Whitlock")).toHaveCount(0);

  const org = await page.goto(otherOrgUrl!);
  expect(org?.status()).toBe(403);
  await expect(page.getByRole("heading", { name: "Forbidden" })).toBeVisible();
  await expect(page.getByText("Marram Telemetry")).toHaveCount(0);
});

test("an admin creates an account, gives it a role, and it signs in", async ({ page }) => {
  await signIn(page, ACCOUNTS.admin);
  await page.goto("/people");
  const form = page.getByRole("form", { name: "New account" });
  await form.getByLabel("Name").fill("Nell Gaskin");
  await form.getByLabel("E-mail").fill("nell@tarnwell.example");
  await form.getByLabel("First password").fill("nell-first-pass");
  await form.getByLabel("Organisation").selectOption({ label: "Tarnwell Water Authority" });
  await form.getByLabel("engineer").check();
  await form.getByRole("button", { name: "Create account" }).click();
  await expect(form.getByRole("status")).toContainText("Account created");
  await expect(page.getByRole("gridcell", { name: "nell@tarnwell.example" })).toBeVisible();
  await signOut(page);
  await signIn(page, "nell@tarnwell.example", "nell-first-pass");
  await expect(nav(page).getByRole("link", { name: "Review bench" })).toBeVisible();
});

test("every page starts with a skip link to its one main landmark, and the navigation marks where you are", async ({ page }) => {
  const skipsToMain = async () => {
    await page.keyboard.press("Tab");
    await expect(page.getByRole("link", { name: "Skip to the main content" })).toBeFocused();
    await page.keyboard.press("Enter");
    await expect(page.getByRole("main")).toBeFocused();
  };
  await page.goto("/sign-in");
  await expect(page.getByRole("main")).toHaveCount(1);
  await skipsToMain();

  await signIn(page, ACCOUNTS.buyer);
  await expect(nav(page).getByRole("link", { name: "Desk", exact: true })).toHaveAttribute("aria-current", "page");
  await page.goto("/tenders");
  await expect(page.getByRole("main")).toHaveCount(1);
  await skipsToMain();
  await expect(nav(page).getByRole("link", { name: "Tenders", exact: true })).toHaveAttribute("aria-current", "page");
  await expect(nav(page).getByRole("link", { name: "Desk", exact: true })).not.toHaveAttribute("aria-current", "page");
  // Each state pill carries its dial as well as its colour.
  await expect(page.locator('[data-state="open"] svg').first()).toBeVisible();

  await page.locator('[data-state="open"]').first().locator("xpath=ancestor::tr").getByRole("link").first().click();
  await expect(page).toHaveURL(/\/tenders\/[^/]+$/);
  await expect(nav(page).getByRole("link", { name: "Tenders", exact: true })).toHaveAttribute("aria-current", "page");
  await expect(page.getByRole("main")).toHaveCount(1);

  for (const address of ["/memo-check", "/no-such-page"]) {
    await page.goto(address);
    await expect(page.getByRole("main"), address).toHaveCount(1);
  }
  await page.goto("/desk");
  await signOut(page);
});
