import AxeBuilder from "@axe-core/playwright";
import { expect as baseExpect, test, type Page } from "@playwright/test";
import { signIn } from "./support";

// Shared two-core runners answer slowly under load; these journeys wait longer for each step.
const expect = baseExpect.configure({ timeout: 30_000 });

// The demo tooling manager (invented demo scenario; logins in apps/api/src/seed/README.md).
const toolingManager = { email: "imke@quillfeather.example", password: "demo-tooling-2026" };

// axe-core analyses are CPU-heavy on a shared two-core runner.
test.slow();

async function violations(page: Page) {
  const results = await new AxeBuilder({ page }).include("#main").withTags(["wcag2a", "wcag2aa", "wcag21a", "wcag21aa"]).analyze();
  return results.violations.map((v) => `${v.id} (${v.impact}): ${v.help} — ${v.nodes.map((n) => n.target.join(" ")).join(", ")}`);
}

async function dialogViolations(page: Page) {
  const results = await new AxeBuilder({ page }).include("dialog[open]").withTags(["wcag2a", "wcag2aa", "wcag21a", "wcag21aa"]).analyze();
  return results.violations.map((v) => `${v.id} (${v.impact}): ${v.help} — ${v.nodes.map((n) => n.target.join(" ")).join(", ")}`);
}

test("the library pages (cutters, materials, machines, a machine with its assemblies) pass axe's WCAG A/AA rules", async ({ page }) => {
  await page.goto("/sign-in");
  await signIn(page, toolingManager.email, toolingManager.password);
  const nav = page.getByRole("navigation", { name: "Main areas" });

  await nav.getByRole("link", { name: "Cutters" }).click();
  await expect(page.getByRole("table", { name: "Cutters" }).getByRole("row").nth(1)).toBeVisible();
  expect(await violations(page)).toEqual([]);
  await page.getByRole("button", { name: "Add cutter" }).click();
  await page.getByRole("dialog", { name: "Add a cutter" }).getByRole("button", { name: "Add cutter" }).click();
  await expect(page.getByRole("dialog", { name: "Add a cutter" }).getByText("Enter a name")).toBeVisible();
  expect(await dialogViolations(page)).toEqual([]);
  await page.keyboard.press("Escape");

  await nav.getByRole("link", { name: "Materials" }).click();
  await expect(page.getByRole("table", { name: "Materials" }).getByRole("row").nth(1)).toBeVisible();
  expect(await violations(page)).toEqual([]);
  await page.getByRole("button", { name: /^Aluminium 6061/ }).click();
  await expect(page.getByRole("heading", { name: "Where these values come from" })).toBeVisible();
  expect(await dialogViolations(page)).toEqual([]);
  await page.keyboard.press("Escape");

  await nav.getByRole("link", { name: "Machines" }).click();
  await page.getByRole("table", { name: "Machines" }).getByRole("link", { name: /Heron/ }).click();
  await expect(page.getByRole("table", { name: /Cutter assemblies on Heron/ }).getByRole("row").nth(1)).toBeVisible();
  expect(await violations(page)).toEqual([]);
});

test("a large runout in a cutter assembly is called out, on the machine and in the form", async ({ page }) => {
  await page.goto("/sign-in");
  await signIn(page, toolingManager.email, toolingManager.password);
  await page.getByRole("navigation", { name: "Main areas" }).getByRole("link", { name: "Machines" }).click();
  await page.getByRole("table", { name: "Machines" }).getByRole("link", { name: /Heron/ }).click();

  // The demo shop's 1/8 in cutter sits in a sleeve adapter with 0.08 mm of runout.
  const table = page.getByRole("table", { name: /Cutter assemblies on Heron/ });
  const sleeved = table.getByRole("row").filter({ hasText: "sleeve adapter" });
  await expect(sleeved).toContainText("large");
  await expect(page.getByText(/large runout for the cutter's size/)).toBeVisible();

  await sleeved.getByRole("button", { name: /^Edit assembly/ }).click();
  const sheet = page.getByRole("dialog", { name: "Edit cutter assembly" });
  await expect(sheet.getByText(/of runout is large next to the chip load/)).toBeVisible();
  // 0.005 mm is fine even for a 1/8 in cutter: the warning goes away as the person types.
  await sheet.getByLabel(/^Runout \(TIR\)/).fill("0.005");
  await expect(sheet.getByText(/of runout is large next to the chip load/)).toHaveCount(0);
  await sheet.getByRole("button", { name: "Cancel" }).click();
});
