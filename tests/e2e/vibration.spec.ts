import AxeBuilder from "@axe-core/playwright";
import { expect as baseExpect, test, type Page } from "@playwright/test";
import { fileURLToPath } from "node:url";
import { FAKE_CUT, writeFakeMicrophoneWav } from "./fake-microphone";
import { newAccount, signIn, signUp, unique } from "./support";

// The analysis runs in a background job; on a busy runner it can take a while.
const expect = baseExpect.configure({ timeout: 30_000 });

// Logins of the invented demo scenario (apps/api/src/seed/README.md).
const toolingManager = { email: "imke@quillfeather.example", password: "demo-tooling-2026" };

// Chromium's fake microphone plays this file (written before the browser starts).
const fakeMicrophone = writeFakeMicrophoneWav(fileURLToPath(new URL("../.tmp/fake-microphone.wav", import.meta.url)));

async function violations(page: Page, include: string) {
  const results = await new AxeBuilder({ page }).withTags(["wcag2a", "wcag2aa", "wcag21a", "wcag21aa"]).include(include).analyze();
  return results.violations.map((v) => `${v.id} (${v.impact}): ${v.help} — ${v.nodes.map((n) => n.target.join(" ")).join(", ")}`);
}

async function openProfile(page: Page, machineName: RegExp) {
  await page.getByRole("navigation", { name: "Main areas" }).getByRole("link", { name: "Machines" }).click();
  await page.getByRole("link", { name: machineName }).first().click();
  await page.getByRole("navigation", { name: "Machine" }).getByRole("link", { name: "Vibration profile" }).click();
  await expect(page.getByRole("tab", { name: "Stiffness and backlash" })).toHaveAttribute("aria-selected", "true");
}

// Same browser as the other specs (tests/playwright.config.ts), plus a fake microphone playing the
// synthetic cut (launch options can only be set for a whole file).
test.use({
  launchOptions: {
    executablePath: process.env.RINGDOWN_CHROMIUM ?? "/usr/bin/chromium",
    args: [
      "--no-sandbox",
      "--disable-gpu",
      "--disable-quic",
      "--no-first-run",
      "--disable-background-networking",
      "--disable-component-update",
      "--disable-sync",
      "--disable-dev-shm-usage",
      "--use-fake-ui-for-media-stream",
      "--use-fake-device-for-media-stream",
      `--use-file-for-fake-audio-capture=${fakeMicrophone}`,
    ],
  },
});

test("a tooling manager records a cut with the microphone, uploads it, and reads the suggested stable speeds", async ({ page }) => {
  test.setTimeout(180_000);
  await page.goto("/sign-in");
  await signIn(page, toolingManager.email, toolingManager.password);
  await expect(page.getByRole("heading", { level: 1, name: "Planner" })).toBeVisible();
  await openProfile(page, /^Heron/);
  await page.getByRole("tab", { name: "Recordings" }).click();
  await page.getByRole("button", { name: "Record", exact: true }).click();

  const sheet = page.getByRole("dialog", { name: "New recording" });
  await expect(sheet.getByRole("radio", { name: "Record with the microphone" })).toHaveAttribute("aria-checked", "true");
  await sheet.getByRole("button", { name: "Start recording" }).click();

  // The level meter moves off the floor once the fake microphone's sound arrives.
  const meter = sheet.getByRole("meter", { name: "Input level" });
  await expect(meter).toBeVisible();
  await expect.poll(async () => Number(await meter.getAttribute("aria-valuenow"))).toBeGreaterThan(-40);
  // Record until the counter passes 3 s of captured sound (counted in samples, not wall-clock time).
  await expect(sheet.getByText(/^Recording [3-9]\.\d\s?s$/)).toBeVisible();
  await sheet.getByRole("button", { name: "Stop" }).click();
  await expect(sheet.getByRole("status").filter({ hasText: /^Recorded \d/ })).toContainText("as WAV");

  await sheet.getByLabel("What was recorded").selectOption("cut");
  await sheet.getByLabel("Spindle speed").fill(String(FAKE_CUT.rpm));
  await sheet.getByLabel("Flutes").fill(String(FAKE_CUT.flutes));
  await sheet.getByLabel("Note").fill(`Fake microphone ${unique()}`);
  await sheet.getByRole("button", { name: "Upload and analyse" }).click();

  // The recording's page follows the analysis until it is done.
  await expect(page.getByRole("heading", { level: 1, name: "Recording" })).toBeVisible();
  await expect(page.getByText("Analysed", { exact: true })).toBeVisible({ timeout: 90_000 });
  await expect(page.getByText(/possible chatter at 1[ \u2009]?3[67]\d(\.\d)?\u202fHz/i)).toBeVisible();

  const speeds = page.getByRole("list", { name: "Suggested stable speeds" }).getByRole("listitem");
  await expect(speeds.first()).toBeVisible();
  // n = 60 · f_chatter / (flutes · j), nearest to 12 000 rpm first: 13 700 rpm (j = 3) for a 1370 Hz tone.
  const first = (await speeds.first().textContent()) ?? "";
  const rpm = Number(/([\d\u2009 ]+)\s?rpm/.exec(first)?.[1]?.replace(/[\u2009 ]/g, ""));
  const j = Math.round((60 * FAKE_CUT.chatterHz) / (FAKE_CUT.flutes * rpm));
  expect(Math.abs(rpm - (60 * FAKE_CUT.chatterHz) / (FAKE_CUT.flutes * j)) / rpm).toBeLessThan(0.01);
  // The tooth-passing tone (400 Hz) is named as such, not as chatter.
  await expect(page.getByRole("row", { name: /^(399\.\d|400(\.\d)?)\s?Hz Tooth passing · harmonic 1 / })).toBeVisible();
});

test("a new shop measures its machine: stiffness readings with refused values, the bed map, an estimated mode and ceilings", async ({ page }) => {
  test.setTimeout(180_000);
  const account = newAccount();
  await signUp(page, account);
  // A machine from the gantry-router defaults, created through the API the machine page uses.
  const me = (await (await page.request.get("/api/me")).json()) as { activeShopId: string };
  const defaults = (await (await page.request.get(`/api/shops/${me.activeShopId}/machines/defaults?kind=gantry_router`)).json()) as Record<string, unknown>;
  const created = await page.request.post(`/api/shops/${me.activeShopId}/machines`, { data: { ...defaults, name: "Kestrel test router" } });
  expect(created.status()).toBe(201);

  await page.reload();
  await openProfile(page, /^Kestrel test router/);
  await expect(page.getByText("No stiffness readings yet")).toBeVisible();

  // A reading whose dial did not move is refused with the reason.
  await page.getByRole("button", { name: "Add the first reading" }).click();
  const sheet = page.getByRole("dialog", { name: "Add a stiffness reading" });
  await sheet.getByLabel("Direction of the push").selectOption("y");
  await sheet.getByLabel("Force").fill("40");
  await sheet.getByLabel("Deflection").fill("0");
  await sheet.getByRole("button", { name: "Add reading" }).click();
  await expect(sheet.getByText(/Deflection must be more than 0 mm/)).toBeVisible();
  await sheet.getByLabel("Deflection").fill("0.08");
  // F / δ = 40 N / 0.08 mm = 500 N/mm, shown before saving.
  await expect(sheet.getByText(/k = F \/ δ = 500\s?N\/mm/)).toBeVisible();
  await sheet.getByRole("button", { name: "Add reading" }).click();
  await expect(sheet).toBeHidden();
  await expect(page.getByRole("status").filter({ hasText: "Added a reading of 500" })).toBeVisible();
  await expect(page.getByRole("table", { name: /Stiffness readings on Kestrel/ }).getByRole("row")).toHaveCount(2);

  await page.getByRole("group", { name: "Direction shown" }).getByRole("button", { name: "Y" }).click();
  await expect(page.getByRole("img", { name: /Stiffness in Y across the bed/ })).toBeVisible();
  expect(await violations(page, "main")).toEqual([]);

  // A mode estimated from the gantry's moving mass and the measured stiffness:
  // fn = √(k/m)/2π = √(500 000 N/m / 30 kg)/2π ≈ 20.5 Hz (worked by hand).
  await page.getByRole("tab", { name: "Modes and ceilings" }).click();
  await page.getByRole("button", { name: "Add mode" }).click();
  const modeSheet = page.getByRole("dialog", { name: "Add a mode" });
  await modeSheet.getByRole("radio", { name: "Estimate from mass" }).click();
  await modeSheet.getByLabel("Direction").selectOption("y");
  await modeSheet.getByLabel("Moving mass").fill("30");
  await expect(modeSheet.getByRole("status")).toContainText(/≈\s?20\.5\s?Hz/);
  await modeSheet.getByRole("button", { name: "Add estimated mode" }).click();
  await expect(modeSheet).toBeHidden();
  await expect(page.getByRole("status").filter({ hasText: /Added the 20\.5\d?\s?Hz Y mode/ })).toBeVisible();

  // A band to keep tooth passing out of.
  await page.getByRole("button", { name: "Add band" }).click();
  await page.getByLabel("Band 1 from").fill("300");
  await page.getByLabel("Band 1 to").fill("280");
  await page.getByRole("button", { name: "Save ceilings" }).click();
  await expect(page.getByText("Band end must be above its start")).toBeVisible();
  await page.getByLabel("Band 1 to").fill("340");
  await page.getByLabel("Band 1: why").fill("dust hood panel rings");
  await page.getByRole("button", { name: "Save ceilings" }).click();
  await expect(page.getByRole("status").filter({ hasText: "Saved the ceilings." })).toBeVisible();
});
