import { expect, test } from "@playwright/test";
import { newAccount, shopSwitcher, signUp } from "./support";

test("at phone width the rail folds into a menu that still reaches every area", async ({ page }) => {
  const account = newAccount();
  await signUp(page, account);

  const nav = page.getByRole("navigation", { name: "Main areas" });
  await expect(nav).toBeHidden();
  const menu = page.getByRole("button", { name: "Menu" });
  await expect(menu).toHaveAttribute("aria-expanded", "false");

  await menu.click();
  await expect(nav).toBeVisible();
  await expect(shopSwitcher(page)).toContainText(account.shopName);
  await nav.getByRole("link", { name: "Cutters" }).click();

  // Choosing an area closes the menu.
  await expect(page.getByRole("heading", { level: 1, name: "Cutters" })).toBeVisible();
  await expect(nav).toBeHidden();

  // Nothing is wider than the screen.
  const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
  expect(overflow).toBeLessThanOrEqual(0);
});

test("the sign-in page fits a phone screen", async ({ page }) => {
  await page.goto("/sign-in");
  await expect(page.getByRole("heading", { level: 1, name: "Sign in" })).toBeVisible();
  await expect(page.getByLabel("E-mail")).toBeVisible();
  const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
  expect(overflow).toBeLessThanOrEqual(0);
});
