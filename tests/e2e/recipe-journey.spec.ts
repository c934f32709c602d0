import { expect as baseExpect, test, type Browser, type Page } from "@playwright/test";
import { signIn, unique } from "./support";

// Pages wait on the server and the engine; a busy CI runner can make that slow.
const expect = baseExpect.configure({ timeout: 30_000 });

// Logins of the invented demo scenario (apps/api/src/seed/README.md), seeded with SEED_DEMO=true.
const programmer = { email: "teodor@quillfeather.example", password: "demo-programmer-2026" };
const toolingManager = { email: "imke@quillfeather.example", password: "demo-tooling-2026" };
const operator = { email: "sunniva@quillfeather.example", password: "demo-operator-2026" };

/** A valid 1 × 1 PNG (a single pixel). */
const ONE_PIXEL_PNG = "iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mNk+M9QDwADhgGAWjR9awAAAABJRU5ErkJggg==";

async function signedIn(browser: Browser, who: { email: string; password: string }): Promise<Page> {
  const context = await browser.newContext();
  const page = await context.newPage();
  await page.goto("/sign-in");
  await signIn(page, who.email, who.password);
  await expect(page.getByRole("heading", { level: 1, name: "Planner" })).toBeVisible();
  return page;
}

/** Picks the option whose text contains `text` in a labelled <select>. */
async function selectOptionContaining(page: Page, label: string, text: string) {
  const select = page.getByLabel(label, { exact: true });
  const value = await select.locator("option", { hasText: text }).first().getAttribute("value");
  expect(value, `an option with "${text}" in ${label}`).toBeTruthy();
  await select.selectOption(value!);
}

async function takeStep(page: Page, label: string, comment = "") {
  await page.getByRole("button", { name: label, exact: true }).click();
  const dialog = page.getByRole("dialog");
  await expect(dialog).toBeVisible();
  if (comment) await dialog.getByLabel(/Comment/).fill(comment);
  await dialog.getByRole("button", { name: label, exact: true }).click();
  await expect(dialog).toBeHidden();
}

async function scoreRung(page: Page, rung: number, scores: { edge: number; chips: string; sound: number; heat: number }) {
  await page.getByRole("button", { name: `Score rung ${rung}` }).click();
  const dialog = page.getByRole("dialog", { name: `Score rung ${rung}` });
  await expect(dialog).toBeVisible();
  const pick = async (group: string, choice: string) => {
    await dialog.getByRole("group", { name: group }).locator("label").filter({ hasText: new RegExp(`^${choice}$`) }).click();
    await expect(dialog.getByRole("group", { name: group }).getByRole("radio", { name: choice, exact: true })).toBeChecked();
  };
  await pick("Edge quality", String(scores.edge));
  await pick("What came off", scores.chips);
  await pick("Sound", String(scores.sound));
  await pick("Heat", String(scores.heat));
  await dialog.getByRole("button", { name: "Save score" }).click();
  await expect(dialog).toBeHidden();
}

test("a recipe goes from the planner through a test-cut ladder, proof and approval to the operator's phone", async ({ browser }) => {
  // Four people and a phone in one test: a generous budget.
  test.setTimeout(420_000);
  const name = `Journey profile ${unique()}`;

  // ---- The programmer plans a cut in the planner and saves it.
  const prog = await signedIn(browser, programmer);
  await selectOptionContaining(prog, "Machine", "Heron");
  await selectOptionContaining(prog, "Cutter assembly", "6 mm flat, 2-flute carbide");
  await selectOptionContaining(prog, "Material", "Birch plywood");
  await prog.getByLabel("Operation", { exact: true }).selectOption("profile");
  await prog.getByLabel("Axial depth (mm)").fill("6");
  await prog.getByLabel("Radial depth (mm)").fill("1.5");

  const readout = prog.getByRole("region", { name: "Recipe read-out" });
  await expect(readout.getByText(/Held back by:|Nothing held this cut back/)).toBeVisible();
  await expect(readout.getByRole("button", { name: "Spindle speed: why?" })).toContainText("rpm");
  await expect(readout.getByRole("button", { name: "Feed: why?" })).toContainText("mm/min");
  // The why of a number opens on focus: its formula, inputs and what bound it.
  await readout.getByRole("button", { name: "Feed: why?" }).focus();
  await expect(prog.getByRole("tooltip")).toContainText("Bound by:");
  await prog.keyboard.press("Escape");
  await expect(readout.getByRole("complementary", { name: "Safety" })).toContainText("Starting points only");
  await expect(prog.getByRole("list", { name: "Limits" }).getByRole("meter").first()).toBeVisible();

  // Every keystroke recomputes: a tenth of the stepover moves the feed.
  const feedBefore = await readout.getByRole("button", { name: "Feed: why?" }).textContent();
  await prog.getByLabel("Radial depth (mm)").fill("0.3");
  await expect(readout.getByRole("button", { name: "Feed: why?" })).not.toHaveText(feedBefore ?? "");

  await prog.getByRole("button", { name: "Save as recipe…" }).click();
  const save = prog.getByRole("dialog", { name: "Save as recipe" });
  await save.getByLabel("Recipe name").fill(name);
  await save.getByRole("button", { name: "Save recipe" }).click();
  await expect(prog.getByRole("heading", { level: 1, name })).toBeVisible();
  await expect(prog).toHaveURL(/\/recipes\/[0-9a-f-]{36}$/);
  const recipeUrl = prog.url();
  await expect(prog.getByText("Draft", { exact: true }).first()).toBeVisible();

  // ---- On trial: "Mark proven" waits for a logged cut.
  await takeStep(prog, "Start trial");
  await expect(prog.getByRole("status").filter({ hasText: "is now on trial" })).toBeVisible();
  await expect(prog.getByRole("button", { name: "Mark proven" })).toBeDisabled();
  await expect(prog.getByText(/Log a clean cut of this recipe on Heron/)).toBeVisible();

  // ---- A test-cut ladder on the feed: plan, score two rungs, choose the better one.
  const ladder = prog.getByRole("region", { name: "Test-cut ladder" });
  await ladder.getByLabel("Parameter to step").selectOption("feed");
  await ladder.getByLabel("Rungs").selectOption("5");
  await ladder.getByRole("button", { name: "Plan the ladder" }).click();
  const rungs = ladder.getByRole("region", { name: "Ladder rungs" });
  await expect(rungs.getByRole("row")).not.toHaveCount(0);
  expect(await rungs.getByRole("row").count()).toBeGreaterThanOrEqual(4); // header + at least 3 rungs
  await scoreRung(prog, 1, { edge: 3, chips: "Dust", sound: 3, heat: 3 });
  await scoreRung(prog, 2, { edge: 5, chips: "Chips", sound: 5, heat: 1 });
  await expect(rungs.getByRole("row").nth(2)).toContainText("edge 5/5");
  await ladder.getByRole("button", { name: "Choose rung 2" }).click();
  const choose = prog.getByRole("dialog", { name: "Choose rung 2" });
  await choose.getByRole("button", { name: /Make rung 2 revision 2/ }).click();
  await expect(ladder.getByText("Rung 2 was chosen")).toBeVisible();
  const revisions = prog.getByRole("list", { name: "Revisions" });
  await expect(revisions.getByText("Revision 2", { exact: true })).toBeVisible();
  await expect(revisions).toContainText("Test-cut ladder");

  // ---- Log a cut, then mark the recipe proven.
  await prog.getByRole("link", { name: "Log a cut" }).first().click();
  await expect(prog.getByRole("heading", { level: 1, name })).toBeVisible();
  await prog.getByRole("group", { name: "How did the cut go?" }).locator("label").filter({ hasText: "Ran clean" }).click();
  await prog.getByLabel("Note (optional)").fill("Clean walls, light fuzz on the top veneer.");
  await prog.getByRole("button", { name: "Log the cut" }).click();
  await expect(prog.getByText("Cut logged. Thank you.")).toBeVisible();
  await prog.getByRole("link", { name: "Open the recipe" }).click();
  await expect(prog.getByRole("list", { name: "Cut log" })).toContainText("Clean walls, light fuzz");
  await expect(prog.getByRole("button", { name: "Mark proven" })).toBeEnabled();
  await takeStep(prog, "Mark proven");
  await expect(prog.getByText("Proven", { exact: true }).first()).toBeVisible();
  await prog.context().close();

  // ---- The tooling manager approves it.
  const tm = await signedIn(browser, toolingManager);
  await tm.goto(recipeUrl);
  await expect(tm.getByRole("heading", { level: 1, name })).toBeVisible();
  await takeStep(tm, "Approve", "Ran clean on scrap and in the ladder.");
  await expect(tm.getByRole("status").filter({ hasText: "is now approved" })).toBeVisible();
  const history = tm.getByRole("list", { name: "Status history" });
  await expect(history).toContainText("Ran clean on scrap and in the ladder.");
  await tm.context().close();

  // ---- The operator finds it in the list and opens its setup card.
  const op = await signedIn(browser, operator);
  await op.getByRole("navigation", { name: "Main areas" }).getByRole("link", { name: "Recipes" }).click();
  await op.getByRole("search", { name: "Filter recipes" }).getByLabel("Search").fill(name);
  // The search applies after a pause in typing and reloads the rows: wait for it before clicking one.
  await expect(op).toHaveURL(/[?&]q=Journey/);
  const table = op.getByRole("table", { name: "Recipes" });
  await expect(table.getByRole("row")).toHaveCount(2);
  await expect(table.getByRole("link", { name })).toBeVisible();
  await expect(table.getByRole("row").filter({ hasText: name })).toContainText("Approved");
  await table.getByRole("link", { name }).click();
  await expect(op.getByRole("heading", { level: 1, name })).toBeVisible();
  await op.getByRole("link", { name: "Setup card" }).click();

  const card = op.getByRole("article", { name });
  await expect(card).toBeVisible();
  await op.emulateMedia({ media: "print" });
  await expect(op.getByRole("button", { name: "Print the card" })).toBeHidden();
  await expect(card).toContainText("Heron — belt gantry router");
  await expect(card).toContainText("ER20 collet, 6 mm");
  await expect(card).toContainText("Birch plywood");
  await expect(card).toContainText("rpm");
  await expect(card).toContainText("mm/min");
  await expect(card.getByRole("complementary", { name: "Safety" })).toContainText("Never exceed the cutter maker's");
  await expect(card.getByRole("list", { name: "Limits" })).toBeVisible();
  const qr = card.getByRole("img", { name: "QR code: open the cut-log form for this recipe" });
  await expect(qr).toBeVisible();
  expect(await qr.getAttribute("src")).toMatch(/^data:image\/png;base64,/);
  // Black on white in print.
  const colours = await card.evaluate((el) => {
    const style = getComputedStyle(el);
    return { color: style.color, background: getComputedStyle(document.body).backgroundColor };
  });
  expect(colours.color).toBe("rgb(0, 0, 0)");
  expect(colours.background).toBe("rgb(255, 255, 255)");
  // One page: the printed PDF has exactly one page object.
  const pdf = (await op.pdf({ preferCSSPageSize: true, printBackground: true })).toString("latin1");
  expect(pdf.match(/\/Type\s*\/Page(?!s)/g)?.length).toBe(1);

  const qrUrl = ((await card.getByText(/^Cut log: /).textContent()) ?? "").replace(/^Cut log: /, "").trim();
  expect(qrUrl).toMatch(/^http:\/\/localhost:\d+\/log\/[0-9a-f-]{36}\?shop=[0-9a-f-]{36}$/);
  await op.context().close();

  // ---- On a phone, the QR link asks for sign-in, then opens the form; one tap logs the cut.
  const phoneContext = await browser.newContext({ viewport: { width: 375, height: 740 }, isMobile: true, hasTouch: true, deviceScaleFactor: 2 });
  const phone = await phoneContext.newPage();
  await phone.goto(qrUrl);
  await expect(phone).toHaveURL(/\/sign-in\?next=/);
  await signIn(phone, operator.email, operator.password);
  await expect(phone.getByRole("heading", { level: 1, name })).toBeVisible();
  expect(new URL(phone.url()).pathname).toBe(new URL(qrUrl).pathname);
  await expect(phone.getByLabel("Spindle speed (rpm)")).not.toHaveValue("");
  await phone.getByRole("group", { name: "How did the cut go?" }).locator("label").filter({ hasText: "Ran clean" }).tap();
  // A photo of the cut (a 1 × 1 PNG stands in for the camera).
  await phone.getByLabel("Choose photos").setInputFiles({ name: "cut.png", mimeType: "image/png", buffer: Buffer.from(ONE_PIXEL_PNG, "base64") });
  await expect(phone.getByRole("list", { name: "Photos to send" }).getByRole("img")).toHaveCount(1);
  const overflow = await phone.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
  expect(overflow).toBeLessThanOrEqual(0);
  await phone.getByRole("button", { name: "Log the cut" }).tap();
  await expect(phone.getByText("Cut logged. Thank you.")).toBeVisible();
  await expect(phone.getByRole("status")).toContainText("1 photo");

  // The recipe's cut log shows the operator's cut with its photo, served back by the API.
  await phone.getByRole("link", { name: "Open the recipe" }).tap();
  const log = phone.getByRole("list", { name: "Cut log" });
  const photo = log.getByRole("img", { name: /Photo 1 of the cut logged by Sunniva Brack/ });
  await expect(photo).toBeVisible();
  // Thumbnails load lazily: bring it on screen first.
  await photo.scrollIntoViewIfNeeded();
  await expect.poll(() => photo.evaluate((img: HTMLImageElement) => img.complete && img.naturalWidth)).toBe(1);
  await phoneContext.close();
});
