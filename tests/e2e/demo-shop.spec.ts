import { expect, test } from "@playwright/test";
import { accountMenu, shopInList, shopSwitcher, signIn } from "./support";

// Logins of the invented demo scenario, as listed in the README (seeded with SEED_DEMO=true).
const owner = { email: "maren@quillfeather.example", password: "demo-owner-2026" };
const contractor = { email: "callum@contract-cam.example", password: "demo-contractor-2026" };

test("the demo shop's owner signs in and reaches every main area from the rail", async ({ page }) => {
  await page.goto("/sign-in");
  await signIn(page, owner.email, owner.password);

  await expect(page.getByRole("heading", { level: 1, name: "Planner" })).toBeVisible();
  await expect(shopSwitcher(page)).toContainText("Quillfeather Fixture Works");
  await expect(shopSwitcher(page)).toContainText("Owner");
  await expect(accountMenu(page)).toContainText("Maren Tolliver");

  const nav = page.getByRole("navigation", { name: "Main areas" });
  for (const area of ["Planner", "Recipes", "Cutters", "Materials", "Machines", "Team", "Billing"]) {
    await nav.getByRole("link", { name: area }).click();
    await expect(page.getByRole("heading", { level: 1, name: area })).toBeVisible();
    await expect(nav.getByRole("link", { name: area })).toHaveAttribute("aria-current", "page");
  }
});

test("the demo contractor works for two shops and switches between them", async ({ page }) => {
  await page.goto("/sign-in");
  await signIn(page, contractor.email, contractor.password);
  await expect(shopSwitcher(page)).toContainText("Quillfeather Fixture Works");
  await expect(shopSwitcher(page)).toContainText("Programmer");

  await shopSwitcher(page).click();
  await expect(shopInList(page, "Quillfeather Fixture Works")).toHaveAttribute("aria-current", "true");
  await shopInList(page, "Ostrander Sign & Panel").click();
  await expect(shopSwitcher(page)).toContainText("Ostrander Sign & Panel");
  await page.reload();
  await expect(shopSwitcher(page)).toContainText("Ostrander Sign & Panel");

  // Callum's stored preference is imperial.
  await accountMenu(page).click();
  await expect(page.getByRole("radio", { name: /Imperial/ })).toBeChecked();

  await page.keyboard.press("Escape");
  await shopSwitcher(page).click();
  await shopInList(page, "Quillfeather Fixture Works").click();
  await expect(shopSwitcher(page)).toContainText("Quillfeather Fixture Works");
});
