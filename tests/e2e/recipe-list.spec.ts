import { expect as baseExpect, test, type Locator, type Page } from "@playwright/test";
import { signIn, unique } from "./support";

// Pages wait on the server; a busy CI runner can make that slow.
const expect = baseExpect.configure({ timeout: 30_000 });

// The demo shop's programmer (invented demo scenario; logins in apps/api/src/seed/README.md).
const programmer = { email: "teodor@quillfeather.example", password: "demo-programmer-2026" };

/** Presses Tab (or Shift+Tab) until `target` has the focus: the way a keyboard user gets there. */
async function tabTo(page: Page, target: Locator, { backwards = false, most = 40 } = {}) {
  for (let i = 0; i < most; i++) {
    if (await target.evaluate((el) => el === document.activeElement).catch(() => false)) return;
    await page.keyboard.press(backwards ? "Shift+Tab" : "Tab");
  }
  await expect(target).toBeFocused();
}

/** The focus ring: the element's own outline, or its ::after's for a link that covers its row. */
async function focusRing(target: Locator): Promise<string> {
  return target.evaluate((el) => {
    const own = getComputedStyle(el);
    const after = getComputedStyle(el, "::after");
    return own.outlineStyle !== "none" ? own.outlineStyle : after.outlineStyle;
  });
}

/** A draft of the programmer's own, saved through the API from one of the shop's drafts. */
async function newDraft(page: Page, name: string) {
  const me = (await (await page.request.get("/api/me")).json()) as { activeShopId: string };
  const base = `/api/shops/${me.activeShopId}/recipes`;
  const drafts = (await (await page.request.get(`${base}?status=draft&pageSize=1`)).json()) as { items: Array<{ id: string }> };
  // The list carries no parameters: the recipe itself does.
  const draft = (await (await page.request.get(`${base}/${drafts.items[0]!.id}`)).json()) as {
    assemblyId: string;
    materialId: string;
    operation: string;
    params: unknown;
  };
  const { assemblyId, materialId, operation, params } = draft;
  const created = await page.request.post(base, { data: { name, assemblyId, materialId, operation, params, notes: "" } });
  expect(created.status()).toBe(201);
}

test("the recipe list works from the keyboard alone: pages, sort, filters and opening a recipe", async ({ page }) => {
  test.setTimeout(150_000);
  await page.goto("/sign-in");
  await signIn(page, programmer.email, programmer.password);
  await expect(page.getByRole("heading", { level: 1, name: "Planner" })).toBeVisible();
  const name = `Keyboard list ${unique()}`;
  await newDraft(page, name);
  await page.goto("/recipes");
  const table = page.getByRole("table", { name: "Recipes" });
  await expect(table.getByRole("row").nth(1)).toBeVisible();

  // Pages: ten rows a page (the demo shop has more than ten recipes), forward and back.
  const pager = page.getByRole("navigation", { name: "Recipes: pages" });
  const perPage = pager.getByLabel("Rows per page");
  await page.getByRole("searchbox", { name: "Search" }).focus();
  await tabTo(page, perPage);
  await page.keyboard.press("ArrowUp"); // from 25 to 10
  await expect(page).toHaveURL(/pageSize=10(&|$)/);
  await expect(pager.getByText(/^Page 1 of [2-9]/)).toBeVisible();
  const next = pager.getByRole("button", { name: "Next" });
  const previous = pager.getByRole("button", { name: "Previous" });
  await tabTo(page, next);
  expect(await focusRing(next)).toBe("solid");
  await page.keyboard.press("Enter");
  await expect(pager.getByText(/^Page 2 of/)).toBeVisible();
  await tabTo(page, previous, { backwards: true });
  await page.keyboard.press("Enter");
  await expect(pager.getByText(/^Page 1 of/)).toBeVisible();
  // Back on the first page "Previous" is disabled: the focus moves to "Next", not to the page's top.
  await expect(next).toBeFocused();

  // Sort by spindle speed, lowest first, then highest first.
  const sortSpeed = table.getByRole("button", { name: "Spindle speed" });
  await tabTo(page, sortSpeed, { backwards: true });
  expect(await focusRing(sortSpeed)).toBe("solid");
  await page.keyboard.press("Enter");
  await expect(table.getByRole("columnheader", { name: "Spindle speed" })).toHaveAttribute("aria-sort", "ascending");
  await expect(page).toHaveURL(/sort=rpm&order=asc/);
  await page.keyboard.press("Enter");
  await expect(table.getByRole("columnheader", { name: "Spindle speed" })).toHaveAttribute("aria-sort", "descending");

  // Filters: a search, then a status picked by typing its name in the closed list.
  const search = page.getByRole("searchbox", { name: "Search" });
  await tabTo(page, search, { backwards: true });
  expect(await focusRing(search)).toBe("solid");
  await page.keyboard.type(name);
  await expect(page).toHaveURL(/q=Keyboard/);
  await expect(table.getByRole("row")).toHaveCount(2);
  const status = page.getByRole("search", { name: "Filter recipes" }).getByLabel("Status");
  await tabTo(page, status);
  await page.keyboard.type("Draft");
  await expect(page).toHaveURL(/status=draft/);
  await expect(status).toHaveValue("draft");

  // Open it: the row's link takes the focus with a visible ring, Enter opens the recipe.
  const link = table.getByRole("link", { name });
  await tabTo(page, link);
  expect(await focusRing(link)).toBe("solid");
  await page.keyboard.press("Enter");
  await expect(page.getByRole("heading", { level: 1, name })).toBeVisible();
});

test("a deleted recipe can be put back with Undo, or restored later from the deleted recipes", async ({ page }) => {
  test.setTimeout(150_000);
  await page.goto("/sign-in");
  await signIn(page, programmer.email, programmer.password);
  await expect(page.getByRole("heading", { level: 1, name: "Planner" })).toBeVisible();
  const name = `Binned pocket ${unique()}`;
  await newDraft(page, name);

  async function deleteFromItsPage() {
    await page.goto(`/recipes?q=${encodeURIComponent(name)}`);
    await page.getByRole("table", { name: "Recipes" }).getByRole("link", { name }).click();
    await expect(page.getByRole("heading", { level: 1, name })).toBeVisible();
    await page.getByRole("button", { name: "Delete", exact: true }).click();
    const confirm = page.getByRole("dialog", { name: `Delete ${name}?` });
    await confirm.getByRole("button", { name: "Delete recipe" }).click();
    await expect(page.getByRole("heading", { level: 1, name: "Recipes" })).toBeVisible();
    await expect(page.getByRole("status").filter({ hasText: `${name} was moved to the bin.` })).toBeVisible();
  }

  // Undo, straight after deleting.
  await deleteFromItsPage();
  await page.getByRole("button", { name: `Undo: restore ${name}` }).click();
  await expect(page.getByRole("status").filter({ hasText: `${name} is back in the shop's recipes.` })).toBeVisible();
  await page.getByRole("searchbox", { name: "Search" }).fill(name);
  await expect(page.getByRole("table", { name: "Recipes" }).getByRole("link", { name })).toBeVisible();

  // Restore, later, from the deleted recipes.
  await deleteFromItsPage();
  await page.getByRole("searchbox", { name: "Search" }).fill(name);
  await page.getByRole("checkbox", { name: "Deleted recipes" }).check();
  const bin = page.getByRole("table", { name: "Deleted recipes" });
  await expect(bin.getByRole("row", { name: new RegExp(name) })).toContainText("Deleted");
  // A deleted recipe has no page to open until it is back.
  await expect(bin.getByRole("link", { name })).toHaveCount(0);
  await bin.getByRole("button", { name: `Restore ${name}` }).click();
  await expect(page.getByRole("status").filter({ hasText: `${name} is back in the shop's recipes.` })).toBeVisible();
  await expect(bin.getByText("No deleted recipe matches these filters")).toBeVisible();
  await page.getByRole("checkbox", { name: "Deleted recipes" }).uncheck();
  // The rows reload once the address has caught up: wait for it before clicking one.
  await expect(page).not.toHaveURL(/deleted=/);
  await page.getByRole("table", { name: "Recipes" }).getByRole("link", { name }).click();
  await expect(page.getByRole("heading", { level: 1, name })).toBeVisible();
});
