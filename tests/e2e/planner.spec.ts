import AxeBuilder from "@axe-core/playwright";
import { expect as baseExpect, test, type Page } from "@playwright/test";
import { newAccount, signIn, signUp, unique } from "./support";

// Pages wait on the server and the engine; a busy CI runner can make that slow.
const expect = baseExpect.configure({ timeout: 30_000 });

// Logins of the invented demo scenario (apps/api/src/seed/README.md).
const programmer = { email: "teodor@quillfeather.example", password: "demo-programmer-2026" };
// Callum works for two shops and keeps imperial units; Quillfeather is his first shop.
const contractor = { email: "callum@contract-cam.example", password: "demo-contractor-2026" };

async function violations(page: Page, include: string) {
  const results = await new AxeBuilder({ page }).withTags(["wcag2a", "wcag2aa", "wcag21a", "wcag21aa"]).include(include).analyze();
  return results.violations.map((v) => `${v.id} (${v.impact}): ${v.help} — ${v.nodes.map((n) => n.target.join(" ")).join(", ")}`);
}

/**
 * Other specs add machines to the demo shop (a new one has no cutter assemblies yet), so the
 * planner's first machine is not always one it can plan on: choose the demo router explicitly.
 */
async function chooseDemoRouter(page: Page) {
  const select = page.getByLabel("Machine", { exact: true });
  const value = await select.locator("option", { hasText: "Heron" }).first().getAttribute("value");
  await select.selectOption(value!);
}

/** Signs in as the demo programmer and opens the planner on the demo router. */
async function openPlannerOnDemoRouter(page: Page) {
  await page.goto("/sign-in");
  await signIn(page, programmer.email, programmer.password);
  await expect(page.getByRole("heading", { level: 1, name: "Planner" })).toBeVisible();
  await chooseDemoRouter(page);
}

test("a shop without machines gets an empty planner that points to Machines", async ({ page }) => {
  await signUp(page, newAccount());
  await expect(page.getByRole("heading", { level: 2, name: "No machines in this shop yet" })).toBeVisible();
  await page.getByRole("link", { name: "Go to Machines" }).click();
  await expect(page.getByRole("heading", { level: 1, name: "Machines" })).toBeVisible();
});

test("the planner works from the keyboard alone, from the first field to a saved recipe", async ({ page }) => {
  test.setTimeout(180_000);
  await openPlannerOnDemoRouter(page);
  const readout = page.getByRole("region", { name: "Recipe read-out" });
  // The first read-out waits for the shop library to load.
  await expect(readout.getByRole("button", { name: "Spindle speed: why?" })).toBeVisible();

  // Start at the first field; from there on only keys.
  await page.getByLabel("Machine", { exact: true }).focus();
  await page.keyboard.press("Tab"); // cutter assembly
  await expect(page.getByLabel("Cutter assembly", { exact: true })).toBeFocused();
  await page.keyboard.press("Tab"); // material
  await page.keyboard.press("Tab"); // operation
  await expect(page.getByLabel("Operation", { exact: true })).toBeFocused();
  await page.keyboard.press("Tab"); // axial depth
  await expect(page.getByLabel("Axial depth (mm)")).toBeFocused();
  await page.keyboard.press("Control+A");
  await page.keyboard.type("3");
  await page.keyboard.press("Tab"); // radial depth
  await page.keyboard.press("Control+A");
  await page.keyboard.type("1");
  await expect(page.getByLabel("Axial depth (mm)")).toHaveValue("3");
  await expect(page.getByLabel("Radial depth (mm)")).toHaveValue("1");

  // A number explains itself on focus and closes on Escape.
  await readout.getByRole("button", { name: "Spindle speed: why?" }).focus();
  await expect(page.getByRole("tooltip")).toContainText("Why this spindle speed");
  await page.keyboard.press("Escape");
  await expect(page.getByRole("tooltip")).toHaveCount(0);

  await page.getByRole("button", { name: "Save as recipe…" }).focus();
  await page.keyboard.press("Enter");
  const dialog = page.getByRole("dialog", { name: "Save as recipe" });
  await expect(dialog.getByLabel("Recipe name")).toBeFocused();
  const name = `Keyboard slot ${unique()}`;
  await page.keyboard.press("Control+A");
  await page.keyboard.type(name);
  await page.keyboard.press("Enter");
  await expect(page.getByRole("heading", { level: 1, name })).toBeVisible();
});

test("the planner reads and takes inches for a person who works in imperial units", async ({ page }) => {
  await page.goto("/sign-in");
  await signIn(page, contractor.email, contractor.password);
  await expect(page.getByRole("heading", { level: 1, name: "Planner" })).toBeVisible();
  await chooseDemoRouter(page);
  const readout = page.getByRole("region", { name: "Recipe read-out" });
  await expect(readout.getByRole("button", { name: "Feed: why?" })).toContainText("in/min");
  await expect(readout.getByRole("button", { name: "Chip load, nominal: why?" })).toContainText("in/tooth");
  await page.getByLabel("Axial depth (in)").fill("0.125");
  await expect(page.getByLabel("Axial depth (in)")).toHaveValue("0.125");
  await expect(page.getByRole("list", { name: "Limits" }).getByText(/in\/min/)).toBeVisible();
});

test("the planner and the recipe pages pass axe's WCAG A/AA rules", async ({ page }) => {
  test.setTimeout(180_000);
  await openPlannerOnDemoRouter(page);
  await expect(page.getByRole("region", { name: "Recipe read-out" }).getByRole("button", { name: "Spindle speed: why?" })).toBeVisible();
  await expect(page.getByRole("list", { name: "Limits" })).toBeVisible();
  expect(await violations(page, "main")).toEqual([]);

  const name = `Checked pocket ${unique()}`;
  await page.getByRole("button", { name: "Save as recipe…" }).click();
  await page.getByRole("dialog", { name: "Save as recipe" }).getByLabel("Recipe name").fill(name);
  await page.getByRole("button", { name: "Save recipe" }).click();
  await expect(page.getByRole("heading", { level: 1, name })).toBeVisible();
  await expect(page.getByRole("list", { name: "Limits" })).toBeVisible();
  await expect(page.getByRole("list", { name: "Revisions" })).toBeVisible();
  expect(await violations(page, "main")).toEqual([]);

  await page.getByRole("link", { name: "Setup card" }).click();
  await expect(page.getByRole("img", { name: /QR code/ })).toBeVisible();
  expect(await violations(page, "main")).toEqual([]);

  await page.goto("/recipes");
  await expect(page.getByRole("table", { name: "Recipes" }).getByRole("link", { name })).toBeVisible();
  expect(await violations(page, "main")).toEqual([]);
});

test("the machine's stiffness follows the work position, or the softest spot of a marked region", async ({ page }) => {
  test.setTimeout(180_000);
  await openPlannerOnDemoRouter(page);
  const readout = page.getByRole("region", { name: "Recipe read-out" });
  // The demo router carries 18 lateral dial-indicator readings (9 positions × X and Y).
  await expect(page.getByText("Stiffness is taken from 18 dial-indicator readings at this position.")).toBeVisible();

  // Near a corner of the bed, where the demo router was measured stiffest.
  await page.getByLabel("X (mm)", { exact: true }).fill("100");
  await page.getByLabel("Y (mm)", { exact: true }).fill("100");
  const why = readout.getByRole("button", { name: "Machine: why?" });
  await why.focus();
  await expect(page.getByRole("tooltip")).toContainText("stiffness map at (100, 100) mm");
  const atCorner = Number((await why.innerText()).replace(/[^\d.]/g, ""));
  await page.keyboard.press("Escape");

  // The cut moves over the whole bed: the region starts as the whole table and the softest spot rules.
  await page.getByLabel(/use the softest spot of a region/).check();
  await expect(page.getByLabel("Region X to (mm)")).toHaveValue("2500");
  await expect(page.getByLabel("Region Y to (mm)")).toHaveValue("1250");
  await why.focus();
  await expect(page.getByRole("tooltip")).toContainText("worst case of the stiffness map over X 0–2,500 mm, Y 0–1,250 mm");
  const overBed = Number((await why.innerText()).replace(/[^\d.]/g, ""));
  await page.keyboard.press("Escape");
  expect(overBed).toBeGreaterThan(atCorner);

  // A region whose ends are swapped is refused beside its field.
  await page.getByLabel("Region Y to (mm)").fill("50");
  await page.getByLabel("Region Y from (mm)").fill("200");
  await expect(page.getByText("The region's last Y must not be below its first Y")).toBeVisible();
  await page.getByLabel("Region Y from (mm)").fill("0");
  await page.getByLabel("Region Y to (mm)").fill("1250");

  const name = `Whole-bed profile ${unique()}`;
  await page.getByRole("button", { name: "Save as recipe…" }).click();
  await page.getByRole("dialog", { name: "Save as recipe" }).getByLabel("Recipe name").fill(name);
  await page.getByRole("button", { name: "Save recipe" }).click();
  await expect(page.getByRole("heading", { level: 1, name })).toBeVisible();
  await expect(page.getByText("Stiffness taken over")).toBeVisible();
});
