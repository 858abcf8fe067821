import { expect, type Page } from "@playwright/test";

export const PASSWORD = "ratecourt-demo";

export { DEMO_ACCOUNTS as ACCOUNTS } from "../support/accounts";

export async function signIn(page: Page, email: string, password = PASSWORD) {
  await page.goto("/sign-in");
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page.getByRole("heading", { name: "Desk", level: 1 })).toBeVisible();
}

export async function signOut(page: Page) {
  await page.getByRole("button", { name: "Sign out" }).click();
  await expect(page.getByRole("heading", { name: "Sign in" })).toBeVisible();
}

/** Confirms an irreversible step in the dialog that asks first, by the confirming button's label. */
export async function confirmStep(page: Page, action: string) {
  const dialog = page.getByRole("dialog");
  await expect(dialog).toBeVisible();
  await dialog.getByRole("button", { name: action, exact: true }).click();
  await expect(dialog).toBeHidden();
}

export const nav = (page: Page) => page.getByRole("navigation", { name: "Main" });
