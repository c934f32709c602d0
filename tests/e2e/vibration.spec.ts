import AxeBuilder from "@axe-core/playwright";
import { expect as baseExpect, test, type Page } from "@playwright/test";
import { fileURLToPath } from "node:url";
import { FAKE_CUT, toneWav, writeFakeMicrophoneWav } from "./fake-microphone";
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

/** Signs up a new shop (its owner) with one machine from the gantry-router defaults, created through the API the machine page uses. */
async function newShopWithMachine(page: Page, name: string, spindle: Record<string, unknown> = {}) {
  await signUp(page, newAccount());
  const me = (await (await page.request.get("/api/me")).json()) as { activeShopId: string };
  const defaults = (await (await page.request.get(`/api/shops/${me.activeShopId}/machines/defaults?kind=gantry_router`)).json()) as Record<string, unknown>;
  const created = await page.request.post(`/api/shops/${me.activeShopId}/machines`, {
    data: { ...defaults, name, spindle: { ...(defaults.spindle as Record<string, unknown>), ...spindle } },
  });
  expect(created.status()).toBe(201);
  await page.reload();
}

/**
 * A measured frequency response as CSV: one mode, G(f) = 1 / (k · (1 − r² + 2iζr)), r = f / fn
 * (single-degree-of-freedom receptance, Schmitz & Smith, Machining Dynamics, 2009, ch. 2 — from
 * memory), with fn = 180 Hz, ζ = 0.04, k = 900 N/mm, from 20 to 600 Hz in 1 Hz steps [mm/N].
 */
function frfCsv(): string {
  const [fn, zeta, k] = [180, 0.04, 900];
  const lines = ["frequency_hz,real,imag"];
  for (let f = 20; f <= 600; f++) {
    const r = f / fn;
    const a = 1 - r * r;
    const b = 2 * zeta * r;
    const d = k * (a * a + b * b);
    lines.push(`${f},${(a / d).toExponential(8)},${(-b / d).toExponential(8)}`);
  }
  return lines.join("\n") + "\n";
}

test("a new shop measures its machine: stiffness readings with refused values, the bed map, an estimated mode and ceilings", async ({ page }) => {
  test.setTimeout(180_000);
  await newShopWithMachine(page, "Kestrel test router");
  await openProfile(page, /^Kestrel test router/);
  await expect(page.getByText("No stiffness readings yet")).toBeVisible();

  // A reading whose dial did not move is refused with the reason.
  await page.getByRole("button", { name: "Add the first stiffness reading" }).click();
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

test("a frequency response uploaded as CSV is fitted, and its mode is added to the machine in one click", async ({ page }) => {
  test.setTimeout(180_000);
  await newShopWithMachine(page, "Merlin test router");
  await openProfile(page, /^Merlin test router/);
  await page.getByRole("tab", { name: "Recordings" }).click();
  await page.getByRole("button", { name: "Upload a file" }).click();

  const sheet = page.getByRole("dialog", { name: "New recording" });
  await sheet.getByLabel("File", { exact: true }).setInputFiles({ name: "merlin-frf-y.csv", mimeType: "text/csv", buffer: Buffer.from(frfCsv()) });
  await sheet.getByLabel("What was recorded").selectOption("frf");
  // The direction is required for a frequency response: the form says so before anything is sent.
  await sheet.getByRole("button", { name: "Upload and analyse" }).click();
  await expect(sheet.getByText("Choose the direction the recording measured")).toBeVisible();
  await sheet.getByLabel("Direction").selectOption("y");
  await sheet.getByRole("button", { name: "Upload and analyse" }).click();

  await expect(page.getByText("Analysed", { exact: true })).toBeVisible({ timeout: 90_000 });
  const found = page.getByRole("region", { name: "Mode found in Y" });
  // Half-power fit of the synthetic mode: fn ≈ 180 Hz (the magnitude peaks at fn·√(1 − 2ζ²) = 179.7 Hz).
  await expect(found.getByText(/^1(79|80)(\.\d)?\s?Hz$/)).toBeVisible();
  await found.getByRole("button", { name: "Add to this machine's modes" }).click();
  await expect(found.getByText("Added to this machine's modes.")).toBeVisible();
  await expect(page.getByRole("status").filter({ hasText: /Added the 1(79|80)(\.\d+)?\s?Hz Y mode to Merlin test router/ })).toBeVisible();

  await page.getByRole("link", { name: /Merlin test router: recordings/ }).click();
  await page.getByRole("tab", { name: "Modes and ceilings" }).click();
  await expect(page.getByRole("table", { name: /Modes of Merlin/ }).getByRole("row").filter({ hasText: "Fitted" })).toHaveCount(1);
});

test("a recording of the spindle running free sets the real speed of a dial setting", async ({ page }) => {
  test.setTimeout(180_000);
  await newShopWithMachine(page, "Osprey test router", {
    dialSettings: [
      { label: "1", rpm: 10_000, measured: false },
      { label: "3", rpm: 18_000, measured: false },
    ],
  });
  await openProfile(page, /^Osprey test router/);
  await page.getByRole("tab", { name: "Recordings" }).click();
  await page.getByRole("button", { name: "Upload a file" }).click();

  // Dial 3 actually turns at 290 Hz = 17 400 rpm (an invented 3.3 % slip): the rotation and its
  // 2nd and 3rd harmonics, as a spindle with a little unbalance sounds.
  const wav = toneWav({
    sampleRateHz: 16_000,
    durationS: 3,
    tones: [
      { hz: 290, amplitude: 0.3 },
      { hz: 580, amplitude: 0.12 },
      { hz: 870, amplitude: 0.05 },
    ],
    noiseAmplitude: 0.01,
  });
  const sheet = page.getByRole("dialog", { name: "New recording" });
  await sheet.getByLabel("File", { exact: true }).setInputFiles({ name: "osprey-dial-3.wav", mimeType: "audio/wav", buffer: Buffer.from(wav) });
  await sheet.getByLabel("What was recorded").selectOption("spindle_free");
  await sheet.getByLabel("Dial setting running").selectOption("3");
  await sheet.getByRole("button", { name: "Upload and analyse" }).click();

  await expect(page.getByText("Analysed", { exact: true })).toBeVisible({ timeout: 90_000 });
  // 290 Hz × 60 = 17 400 rpm, within the analysis's frequency resolution.
  // (accessible names fold the thin and narrow no-break spaces into plain spaces)
  const apply = page.getByRole("button", { name: /^Use 17\s?(39\d|40\d)\s?rpm as the real speed of dial setting 3$/ });
  await apply.click();
  await expect(page.getByText(/Dial setting 3 now runs at 17\s?(39\d|40\d)\s?rpm on this machine/)).toBeVisible();
  await expect(page.getByRole("status").filter({ hasText: /was 18\s?000\s?rpm/ })).toBeVisible();
});
