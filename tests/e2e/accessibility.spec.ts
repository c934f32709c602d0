import AxeBuilder from "@axe-core/playwright";
import { expect, test, type Page } from "@playwright/test";
import { accountMenu, newAccount, shopSwitcher, signIn, signUp } from "./support";

// The demo shop's owner (invented demo scenario; logins in apps/api/src/seed/README.md).
const owner = { email: "maren@quillfeather.example", password: "demo-owner-2026" };

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
  // A dialog's field marked to take the focus keeps it (the dialog does not hand it to its Close button).
  await page.getByRole("button", { name: "New shop…" }).click();
  await expect(page.getByRole("dialog").getByLabel("Shop name")).toBeFocused();
  await page.keyboard.press("Escape");
  await expect(page.getByRole("dialog")).toBeHidden();

  await accountMenu(page).click();
  await expect(page.getByRole("button", { name: "Sign out" })).toBeVisible();
  expect(await violations(page, "#app-rail")).toEqual([]);
});

// Every signed-in page no other spec analyses, in one visit of the demo shop as its owner.
test("team, billing, a new machine, a machine's vibration profile and recording, the phone cut log and the bin pass axe's WCAG A/AA rules", async ({
  page,
}) => {
  test.setTimeout(240_000);
  await page.goto("/sign-in");
  await signIn(page, owner.email, owner.password);
  await expect(page.getByRole("heading", { level: 1, name: "Planner" })).toBeVisible();
  const nav = page.getByRole("navigation", { name: "Main areas" });

  await nav.getByRole("link", { name: "Team" }).click();
  await expect(page.getByRole("heading", { level: 2, name: /^Members/ })).toBeVisible();
  await expect(page.getByText("Sunniva Brack")).toBeVisible();
  expect(await violations(page, "main")).toEqual([]);

  await nav.getByRole("link", { name: "Billing" }).click();
  await expect(page.getByRole("heading", { name: /^(Free|Team) plan$/ })).toBeVisible();
  expect(await violations(page, "main")).toEqual([]);

  await page.goto("/machines/new");
  await expect(page.getByRole("heading", { level: 1, name: "New machine" })).toBeVisible();
  await expect(page.getByLabel("Name", { exact: true })).toBeVisible();
  expect(await violations(page, "main")).toEqual([]);

  await nav.getByRole("link", { name: "Machines" }).click();
  await page.getByRole("table", { name: "Machines" }).getByRole("link", { name: /^Heron/ }).click();
  await page.getByRole("navigation", { name: "Machine" }).getByRole("link", { name: "Vibration profile" }).click();
  await expect(page.getByRole("img", { name: /across the bed/ }).first()).toBeVisible();
  expect(await violations(page, "main")).toEqual([]);
  for (const tab of ["Modes and ceilings", "Stability lobes", "Recordings"]) {
    await page.getByRole("tab", { name: tab }).click();
    await expect(page.getByRole("tab", { name: tab })).toHaveAttribute("aria-selected", "true");
    await expect(page.getByRole("tabpanel").getByRole("status", { name: /Loading/ })).toHaveCount(0);
    expect(await violations(page, "main"), tab).toEqual([]);
  }
  await page.getByRole("tabpanel").getByRole("table").getByRole("link").first().click();
  await expect(page.getByRole("heading", { level: 1, name: "Recording" })).toBeVisible();
  await expect(page.getByText("Analysed", { exact: true })).toBeVisible();
  expect(await violations(page, "main")).toEqual([]);

  await page.goto("/recipes?deleted=true");
  await expect(page.getByRole("table", { name: "Deleted recipes" })).toBeVisible();
  await expect(page.getByRole("table", { name: "Deleted recipes" }).getByRole("status")).toHaveCount(0);
  expect(await violations(page, "main")).toEqual([]);

  await page.goto("/no-such-page");
  await expect(page.getByRole("heading", { name: "There is no page at this address" })).toBeVisible();
  expect(await violations(page, "main")).toEqual([]);

  // The operator's phone form (the setup card's QR target) for an approved recipe.
  const me = (await (await page.request.get("/api/me")).json()) as { activeShopId: string };
  const approved = (await (await page.request.get(`/api/shops/${me.activeShopId}/recipes?status=approved&pageSize=1`)).json()) as {
    items: Array<{ id: string; name: string }>;
  };
  const recipe = approved.items[0]!;
  await page.goto(`/log/${recipe.id}`);
  await expect(page.getByRole("heading", { level: 1, name: recipe.name })).toBeVisible();
  // Sent without an outcome: refused in the form (nothing is logged), with the message beside it.
  await page.getByRole("button", { name: "Log the cut" }).click();
  await expect(page.getByText("Choose how the cut went")).toBeVisible();
  expect(await violations(page)).toEqual([]);
});

test("the password-reset and invitation pages pass axe's WCAG A/AA rules, with good and bad links", async ({ page }) => {
  const account = newAccount();
  expect((await page.request.post("/api/auth/signup", { data: account })).status()).toBe(201);
  await page.context().clearCookies();

  await page.goto("/forgot-password");
  await expect(page.getByLabel("E-mail")).toBeFocused();
  expect(await violations(page)).toEqual([]);
  await page.getByLabel("E-mail").fill(account.email);
  await page.getByRole("button", { name: "Send the link" }).click();
  await expect(page.getByRole("status").filter({ hasText: `Sent to: ${account.email}` })).toBeVisible();
  expect(await violations(page)).toEqual([]);

  await page.goto("/dev/mail");
  const message = page.getByRole("article", { name: new RegExp(`^Message to ${account.email.replace(/\./g, "\\.")}:`) });
  await message.getByRole("link", { name: /\/reset-password\// }).click();
  await expect(page.getByRole("textbox", { name: "New password" })).toBeFocused();
  expect(await violations(page)).toEqual([]);

  await page.goto("/reset-password/not-a-real-link");
  await expect(page.getByRole("alert")).toContainText("This password-reset link is not valid");
  expect(await violations(page)).toEqual([]);

  await page.goto("/invitations/not-a-real-link");
  await expect(page.getByRole("alert")).toContainText("This invitation link is not valid");
  expect(await violations(page)).toEqual([]);
});
