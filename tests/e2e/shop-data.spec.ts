import AxeBuilder from "@axe-core/playwright";
import { expect as baseExpect, test, type Page } from "@playwright/test";
import { readFile } from "node:fs/promises";
import { signIn } from "./support";

// Shared two-core runners answer slowly under load; these journeys wait longer for each step.
const expect = baseExpect.configure({ timeout: 30_000 });

// The demo tooling manager and operator (invented demo scenario; logins in apps/api/src/seed/README.md).
const toolingManager = { email: "imke@quillfeather.example", password: "demo-tooling-2026" };
const operator = { email: "sunniva@quillfeather.example", password: "demo-operator-2026" };

// axe-core analyses are CPU-heavy on a shared two-core runner.
test.slow();

async function violations(page: Page) {
  const results = await new AxeBuilder({ page }).include("#main").withTags(["wcag2a", "wcag2aa", "wcag21a", "wcag21aa"]).analyze();
  return results.violations.map((v) => `${v.id} (${v.impact}): ${v.help} — ${v.nodes.map((n) => n.target.join(" ")).join(", ")}`);
}

test("a tooling manager opens the shop's data from the rail and downloads the recipes in inches", async ({ page }) => {
  await page.goto("/sign-in");
  await signIn(page, toolingManager.email, toolingManager.password);
  await page.getByRole("navigation", { name: "Main areas" }).getByRole("link", { name: "Shop data" }).click();
  await expect(page.getByRole("heading", { level: 1, name: "Your shop's data" })).toBeVisible();
  await expect(page.getByRole("link", { name: "Download everything (JSON)" })).toBeVisible();
  expect(await violations(page)).toEqual([]);

  // Imke works in millimetres; she picks inches for the CSV files.
  const main = page.getByRole("main");
  await expect(main.getByRole("radio", { name: /Metric/ })).toBeChecked();
  await main.getByRole("radio", { name: /Imperial/ }).check();
  const recipes = main.getByRole("link", { name: "Download recipes (imperial)" });
  await expect(recipes).toHaveAttribute("href", /\/export\/recipes\.csv\?units=imperial$/);

  const [download] = await Promise.all([page.waitForEvent("download"), recipes.click()]);
  expect(download.suggestedFilename()).toMatch(/^ringdown-quillfeather-fixture-works-recipes-\d{4}-\d{2}-\d{2}-inch\.csv$/);
  const path = await download.path();
  const text = (await readFile(path, "utf8")).replace(/^\uFEFF/, "");
  const header = text.split("\r\n")[0]!.split(",");
  // The measured columns name their unit (docs/shop-export.md): lengths in inches, feed in in/min.
  expect(header).toContain("axial_depth_in");
  expect(header).toContain("feed_in_per_min");
  expect(header).toContain("rpm");
  expect(header.filter((h) => h.endsWith("_mm"))).toEqual([]);
  // The demo shop has saved recipes, so there is more than the header row.
  expect(text.trim().split("\r\n").length).toBeGreaterThan(1);
});

test("an operator has no rail entry for the shop's data or billing and is told who can download the data", async ({ page }) => {
  await page.goto("/sign-in");
  await signIn(page, operator.email, operator.password);
  const nav = page.getByRole("navigation", { name: "Main areas" });
  await expect(nav.getByRole("link", { name: "Recipes" })).toBeVisible();
  await expect(nav.getByRole("link", { name: "Shop data" })).toHaveCount(0);
  // Billing is the owners' alone, so it is not offered either.
  await expect(nav.getByRole("link", { name: "Billing" })).toHaveCount(0);

  await page.goto("/shop-data");
  await expect(page.getByRole("heading", { level: 2, name: "Only owners and tooling managers can download the shop's data" })).toBeVisible();
  await expect(page.getByRole("main").getByRole("link", { name: /^Download/ })).toHaveCount(0);
  expect(await violations(page)).toEqual([]);
});
