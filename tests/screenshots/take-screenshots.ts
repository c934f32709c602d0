/**
 * README screenshots, taken from a running Ringdown with the demo shop loaded: the planner with a
 * computed recipe, a machine's vibration profile (stiffness map, a recorded cut's spectrum,
 * stability lobes) and the recipe list. Fixed viewport and scale, animations off, carets hidden,
 * and every picture waits for its data, so two runs on the same demo data give the same images
 * (but for the anti-aliasing of a few edge pixels, which Chromium does not always repeat).
 *
 *   SCREENSHOTS_URL=http://localhost:3000 npx tsx tests/screenshots/take-screenshots.ts
 *
 * `npm run screenshots` (scripts/screenshots.sh) starts a server of its own when no URL is given.
 * Not part of `npm test`: the pictures are documentation, not checks.
 */
import { chromium, expect, type Locator, type Page } from "@playwright/test";
import { mkdir } from "node:fs/promises";
import { fileURLToPath } from "node:url";

const baseURL = (process.env.SCREENSHOTS_URL ?? "http://localhost:3000").replace(/\/$/, "");
const outDir = fileURLToPath(new URL("../../docs/images/", import.meta.url));
// The demo programmer (apps/api/src/seed/README.md): plans recipes, reads machines.
const programmer = { email: "teodor@quillfeather.example", password: "demo-programmer-2026" };
const viewport = { width: 1440, height: 960 };

// No transitions, no animations, no blinking caret: the same pixels every run.
const STILL_CSS = `*, *::before, *::after {
  transition: none !important; animation: none !important; caret-color: transparent !important;
  scroll-behavior: auto !important;
}`;

async function settle(page: Page) {
  // Nothing still loading: no loading status left, and every chart drawn (uPlot's canvas).
  await expect(page.getByRole("status").filter({ hasText: /Loading/ })).toHaveCount(0);
  for (const chart of await page.locator("main .uplot").all()) await expect(chart.locator("canvas")).toBeVisible();
  await page.evaluate(() => document.fonts.ready);
  await page.mouse.move(0, 0);
  await page.evaluate(() => (document.activeElement as HTMLElement | null)?.blur());
}

async function shoot(page: Page, name: string) {
  await settle(page);
  const path = `${outDir}${name}.png`;
  await page.screenshot({ path, animations: "disabled", caret: "hide", style: STILL_CSS });
  console.log(`saved docs/images/${name}.png`);
}

async function scrollToTop(target: Locator) {
  await target.evaluate((el) => el.scrollIntoView({ block: "start" }));
}

const browser = await chromium.launch({
  executablePath: process.env.RINGDOWN_CHROMIUM ?? "/usr/bin/chromium",
  args: ["--no-sandbox", "--disable-gpu", "--disable-dev-shm-usage", "--font-render-hinting=none"],
});
try {
  await mkdir(outDir, { recursive: true });
  const context = await browser.newContext({ baseURL, viewport, deviceScaleFactor: 1, reducedMotion: "reduce", locale: "en-GB", timezoneId: "UTC", colorScheme: "light" });
  context.setDefaultTimeout(60_000);
  const page = await context.newPage();

  await page.goto("/sign-in");
  await page.getByLabel("E-mail").fill(programmer.email);
  await page.getByLabel("Password", { exact: true }).fill(programmer.password);
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page.getByRole("heading", { level: 1, name: "Planner" })).toBeVisible({ timeout: 60_000 });

  // Planner: the demo router, its first cutter and material, the read-out computed.
  const machine = page.getByLabel("Machine", { exact: true });
  const heron = await machine.locator("option", { hasText: "Heron" }).first().getAttribute("value");
  await machine.selectOption(heron!);
  const readout = page.getByRole("region", { name: "Recipe read-out" });
  await expect(readout.getByRole("button", { name: "Spindle speed: why?" })).toBeVisible({ timeout: 60_000 });
  await page.getByLabel("Axial depth (mm)").fill("6");
  await page.getByLabel("Radial depth (mm)").fill("2");
  // The read-out follows the typing (deferred): wait until it shows the cut asked for.
  await expect(readout.getByText(/^asked 6\s?mm$/)).toBeVisible();
  await expect(readout.getByRole("button", { name: "Radial depth: why?" })).toHaveText(/^2\s?mm$/);
  await expect(page.getByRole("list", { name: "Limits" })).toBeVisible();
  await shoot(page, "planner");

  // The demo router's vibration profile: stiffness map, its recorded cut, stability lobes.
  await page.getByRole("navigation", { name: "Main areas" }).getByRole("link", { name: "Machines" }).click();
  await page.getByRole("link", { name: /Heron/ }).first().click();
  await page.getByRole("navigation", { name: "Machine" }).getByRole("link", { name: "Vibration profile" }).click();
  await expect(page.getByRole("tab", { name: "Stiffness and backlash" })).toHaveAttribute("aria-selected", "true");
  await expect(page.getByRole("img", { name: /across the bed/ })).toBeVisible();
  await expect(page.getByRole("table", { name: /Stiffness readings on Heron/ }).getByRole("row").nth(1)).toBeVisible();
  await scrollToTop(page.getByRole("heading", { name: "Stiffness across the bed" }));
  await shoot(page, "vibration-stiffness");

  await page.getByRole("tab", { name: "Stability lobes" }).click();
  await expect(page.getByText(/^At [\d\s,.]+rpm the boundary is/)).toBeVisible();
  await expect(page.locator("main .uplot canvas").first()).toBeVisible();
  await scrollToTop(page.getByRole("heading", { name: /^Resonance and chatter on Heron/ }));
  await shoot(page, "vibration-lobes");

  // The demo router's recorded cut: its spectrum, the peaks named, the stable speeds suggested.
  await page.getByRole("tab", { name: "Recordings" }).click();
  await page.getByRole("table").getByRole("link").first().click();
  await expect(page.getByRole("heading", { level: 1, name: "Recording" })).toBeVisible();
  await expect(page.getByRole("list", { name: "Suggested stable speeds" })).toBeVisible();
  await expect(page.locator("main .uplot canvas").first()).toBeVisible();
  await shoot(page, "recording-spectrum");

  await page.getByRole("navigation", { name: "Main areas" }).getByRole("link", { name: "Recipes" }).click();
  await expect(page.getByRole("table", { name: "Recipes" }).getByRole("link").first()).toBeVisible();
  await shoot(page, "recipes");
} finally {
  await browser.close();
}
