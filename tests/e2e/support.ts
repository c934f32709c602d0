import { expect, type Page } from "@playwright/test";

/** A suffix that keeps names unique across workers and repeated runs on one database. */
export function unique(): string {
  return `${Date.now().toString(36)}${Math.random().toString(36).slice(2, 7)}`;
}

export interface NewAccount {
  name: string;
  email: string;
  password: string;
  shopName: string;
}

export function newAccount(): NewAccount {
  const id = unique();
  return {
    name: "Pell Marrow",
    email: `pell.marrow.${id}@example.test`,
    password: "gantry-ringing-42",
    shopName: `Marrow Pattern Works ${id}`,
  };
}

/** The shop switcher at the top of the rail (its name starts with "Shop"). */
export function shopSwitcher(page: Page) {
  return page.getByRole("button", { name: /^Shop\b/ });
}

/** A shop in the switcher's open list. */
export function shopInList(page: Page, shopName: string) {
  return page.getByRole("list", { name: "Your shops" }).getByRole("button", { name: new RegExp(`^${escapeRegExp(shopName)}(?:\\s|$)`) });
}

function escapeRegExp(text: string): string {
  return text.replace(/[.*+?^${}()|[\]\\]/g, "\\$&");
}

export function accountMenu(page: Page) {
  return page.getByRole("button", { name: /^Account:/ });
}

export async function signUp(page: Page, account: NewAccount) {
  await page.goto("/sign-up");
  await page.getByLabel("Your name").fill(account.name);
  await page.getByLabel("E-mail").fill(account.email);
  await page.getByLabel("Password", { exact: true }).fill(account.password);
  await page.getByLabel("Shop name").fill(account.shopName);
  await page.getByRole("button", { name: "Create account and shop" }).click();
  await expect(page.getByRole("heading", { level: 1, name: "Planner" })).toBeVisible();
}

export async function signIn(page: Page, email: string, password: string) {
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password", { exact: true }).fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
}

export async function signOut(page: Page) {
  await accountMenu(page).click();
  await page.getByRole("button", { name: "Sign out" }).click();
  await expect(page).toHaveURL(/\/sign-in$/);
}
