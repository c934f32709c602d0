import { expect, test } from "@playwright/test";
import { accountMenu, newAccount, shopInList, shopSwitcher, signIn, signOut, signUp, unique } from "./support";

test("sign up, sign out, sign in again, then create a second shop and switch between the shops", async ({ page }) => {
  const account = newAccount();
  const secondShop = `Tamsin Edge Routing ${unique()}`;

  // Signed out, the app sends the browser to the sign-in page.
  await page.goto("/");
  await expect(page).toHaveURL(/\/sign-in$/);
  await page.getByRole("link", { name: "Create an account" }).click();
  await expect(page.getByRole("heading", { level: 1, name: "Create an account" })).toBeVisible();

  await signUp(page, account);
  await expect(shopSwitcher(page)).toContainText(account.shopName);
  await expect(shopSwitcher(page)).toContainText("Owner");
  await expect(accountMenu(page)).toContainText(account.email);

  await signOut(page);

  // A signed-in page asked for while signed out returns there after signing in.
  await page.goto("/machines");
  await expect(page).toHaveURL(/\/sign-in\?next=%2Fmachines$/);
  await signIn(page, account.email, account.password);
  await expect(page.getByRole("heading", { level: 1, name: "Machines" })).toBeVisible();
  await expect(shopSwitcher(page)).toContainText(account.shopName);

  // A second shop: the caller owns it and it becomes the active shop.
  await shopSwitcher(page).click();
  await page.getByRole("button", { name: "New shop…" }).click();
  const dialog = page.getByRole("dialog", { name: "New shop" });
  await dialog.getByLabel("Shop name").fill(secondShop);
  await dialog.getByRole("button", { name: "Create shop" }).click();
  await expect(dialog).toBeHidden();
  await expect(shopSwitcher(page)).toContainText(secondShop);
  await page.reload();
  await expect(shopSwitcher(page)).toContainText(secondShop);

  // Switch back to the first shop; the choice is stored, so it survives a reload.
  await shopSwitcher(page).click();
  await shopInList(page, account.shopName).click();
  await expect(shopSwitcher(page)).toContainText(account.shopName);
  await expect(shopSwitcher(page)).not.toContainText(secondShop);
  await page.reload();
  await expect(shopSwitcher(page)).toContainText(account.shopName);

  // And once more to the second shop.
  await shopSwitcher(page).click();
  await shopInList(page, secondShop).click();
  await expect(shopSwitcher(page)).toContainText(secondShop);
  await page.reload();
  await expect(shopSwitcher(page)).toContainText(secondShop);
});

test("sign-up shows the shared validation messages beside their fields", async ({ page }) => {
  await page.goto("/sign-up");
  await page.getByLabel("E-mail").fill("not-an-address");
  await page.getByLabel("Password", { exact: true }).fill("short");
  await page.getByRole("button", { name: "Create account and shop" }).click();

  await expect(page.getByLabel("Your name")).toHaveAccessibleDescription("Enter your name");
  await expect(page.getByLabel("E-mail")).toHaveAccessibleDescription("Enter a valid e-mail address");
  await expect(page.getByLabel("Password", { exact: true })).toHaveAccessibleDescription("Use at least 10 characters");
  await expect(page.getByLabel("Shop name")).toHaveAttribute("aria-invalid", "true");
  await expect(page).toHaveURL(/\/sign-up$/);
});

test("signing up twice with one e-mail address is refused with a clear message", async ({ page }) => {
  const account = newAccount();
  await signUp(page, account);
  await signOut(page);

  await page.goto("/sign-up");
  await page.getByLabel("Your name").fill("Someone Else");
  await page.getByLabel("E-mail").fill(account.email);
  await page.getByLabel("Password", { exact: true }).fill("another-long-password");
  await page.getByLabel("Shop name").fill(`Other Bench ${unique()}`);
  await page.getByRole("button", { name: "Create account and shop" }).click();

  const email = page.getByLabel("E-mail");
  await expect(email).toHaveAccessibleDescription(/already exists/);
  await expect(email).toHaveAttribute("aria-invalid", "true");
  await expect(email).toBeFocused();
  await expect(page).toHaveURL(/\/sign-up$/);
});

test("a wrong password is refused without saying which part was wrong", async ({ page }) => {
  const account = newAccount();
  await signUp(page, account);
  await signOut(page);

  await signIn(page, account.email, "not-the-password");
  await expect(page.getByRole("alert")).toHaveText("The e-mail address or password is incorrect.");
  await expect(page).toHaveURL(/\/sign-in$/);
  await expect(page.getByLabel("Password", { exact: true })).toHaveValue("not-the-password");
});

test("the metric/imperial preference is stored for the person", async ({ page }) => {
  await signUp(page, newAccount());
  await accountMenu(page).click();
  const metric = page.getByRole("radio", { name: /Metric/ });
  const imperial = page.getByRole("radio", { name: /Imperial/ });
  await expect(metric).toBeChecked();
  await imperial.check();
  await expect(imperial).toBeChecked();

  await page.reload();
  await accountMenu(page).click();
  await expect(page.getByRole("radio", { name: /Imperial/ })).toBeChecked();
});
