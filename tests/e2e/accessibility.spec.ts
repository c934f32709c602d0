import AxeBuilder from "@axe-core/playwright";
import { expect, test, type Page } from "@playwright/test";
import { accountMenu, newAccount, shopSwitcher, signUp } from "./support";

// axe-core checks the rendered pages against WCAG 2.x A and AA rules. Each analysis is CPU-heavy
// (seconds on a busy two-core runner), so these tests get the longer "slow" timeout.
test.slow();

async function violations(page: Page, include?: string) {
  let builder = new AxeBuilder({ page }).withTags(["wcag2a", "wcag2aa", "wcag21a", "wcag21aa"]);
  if (include) builder = builder.include(include);
  const results = await builder.analyze();
  return results.violations.map((v) => `${v.id} (${v.impact}): ${v.help} — ${v.nodes.map((n) => n.target.join(" ")).join(", ")}`);
}

test("the sign-in and sign-up pages pass axe's WCAG A/AA rules", async ({ page }) => {
  await page.goto("/sign-in");
  await expect(page.getByRole("heading", { level: 1, name: "Sign in" })).toBeVisible();
  expect(await violations(page)).toEqual([]);

  await page.goto("/sign-up");
  await page.getByRole("button", { name: "Create account and shop" }).click();
  await expect(page.getByLabel("Your name")).toHaveAttribute("aria-invalid", "true");
  expect(await violations(page)).toEqual([]);
});

// The rail only: each area's page brings its own checks.
test("the rail, its shop list and its account menu pass axe's WCAG A/AA rules", async ({ page }) => {
  await signUp(page, newAccount());
  expect(await violations(page, "#app-rail")).toEqual([]);

  await shopSwitcher(page).click();
  await expect(page.getByRole("button", { name: "New shop…" })).toBeVisible();
  expect(await violations(page, "#app-rail")).toEqual([]);
  await page.keyboard.press("Escape");

  await accountMenu(page).click();
  await expect(page.getByRole("button", { name: "Sign out" })).toBeVisible();
  expect(await violations(page, "#app-rail")).toEqual([]);
});
