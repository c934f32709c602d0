import { expect as baseExpect, test } from "@playwright/test";
import { signIn, unique } from "./support";

// Shared two-core runners answer slowly under load; these journeys wait longer for each step.
const expect = baseExpect.configure({ timeout: 30_000 });
test.slow();

// The demo tooling manager (invented demo scenario; logins in apps/api/src/seed/README.md).
const toolingManager = { email: "imke@quillfeather.example", password: "demo-tooling-2026" };

test("a machine created from the defaults for its kind shows each default as an estimate until it is changed", async ({ page }) => {
  const name = `Bench mill ${unique()}`;
  await page.goto("/sign-in");
  await signIn(page, toolingManager.email, toolingManager.password);
  await page.getByRole("navigation", { name: "Main areas" }).getByRole("link", { name: "Machines" }).click();
  await expect(page.getByRole("heading", { level: 1, name: "Machines" })).toBeVisible();

  await page.getByRole("button", { name: "Add machine" }).first().click();
  const dialog = page.getByRole("dialog", { name: "Add a machine" });
  await dialog.getByRole("radio", { name: /Bench mill/ }).check();
  await dialog.getByRole("button", { name: "Continue" }).click();

  await expect(page.getByRole("heading", { level: 1, name: "New machine" })).toBeVisible();
  const fastest = page.getByLabel(/^Fastest speed/);
  await expect(fastest).not.toHaveValue("");
  await expect(page.getByRole("button", { name: "Estimate: mark the fastest speed as checked" })).toBeVisible();
  await expect(page.getByRole("button", { name: "Estimate: mark the slowest speed as checked" })).toBeVisible();
  await expect(page.getByRole("button", { name: "Estimate: mark Y stiffness at the tool as checked" })).toBeVisible();
  await expect(page.getByRole("button", { name: "Estimate: mark mode 1 as checked" })).toBeVisible();

  // Changing a value makes it the shop's own; marking one checked keeps the value.
  await page.getByLabel("Name", { exact: true }).fill(name);
  await fastest.fill("6000");
  await expect(page.getByRole("button", { name: "Estimate: mark the fastest speed as checked" })).toHaveCount(0);
  await page.getByRole("button", { name: "Estimate: mark the rated power as checked" }).click();
  await expect(page.getByRole("button", { name: "Estimate: mark the rated power as checked" })).toHaveCount(0);
  await page.getByRole("button", { name: "Add machine" }).click();

  await expect(page.getByRole("heading", { level: 1, name })).toBeVisible();
  await expect(page.getByText(/\d+ values are estimates/).first()).toBeVisible();
  await expect(page.getByLabel(/^Fastest speed/)).toHaveValue("6000");
  await expect(page.getByRole("button", { name: "Estimate: mark the fastest speed as checked" })).toHaveCount(0);
  await expect(page.getByRole("button", { name: "Estimate: mark the rated power as checked" })).toHaveCount(0);
  await expect(page.getByRole("button", { name: "Estimate: mark the slowest speed as checked" })).toBeVisible();

  // The list shows it with what is left to measure.
  await page.getByRole("link", { name: "Machines" }).first().click();
  const row = page.getByRole("table", { name: "Machines" }).getByRole("row").filter({ hasText: name });
  await expect(row).toContainText("Bench mill");
  await expect(row).toContainText("to measure");
});
