import { expect as baseExpect, test } from "@playwright/test";
import { signIn, unique } from "./support";

// Shared two-core runners answer slowly under load; these journeys wait longer for each step.
const expect = baseExpect.configure({ timeout: 30_000 });
test.slow();

// The demo tooling manager (invented demo scenario; logins in apps/api/src/seed/README.md).
const toolingManager = { email: "imke@quillfeather.example", password: "demo-tooling-2026" };

const header = "name,shape,tool_material,diameter_mm,flutes,flute_length_mm,overall_length_mm,shank_diameter_mm,corner_radius_mm,helix_deg,max_rpm";

function csv(prefix: string, flutesOnSecondRow: string): Buffer {
  return Buffer.from(
    [
      header,
      `${prefix} 3 mm flat,flat,carbide,3,2,12,38,3,0,30,24000`,
      `${prefix} 6 mm up-cut,up_spiral,carbide,6,${flutesOnSecondRow},22,50,6,0,30,24000`,
      `${prefix} 1/4 in ball,ball,carbide,6.35,2,19,63.5,6.35,3.175,30,`,
      "",
    ].join("\r\n"),
    "utf8",
  );
}

test("a tooling manager previews a cutter CSV with a bad row, fixes the file and imports it all", async ({ page }) => {
  const prefix = `Import ${unique()}`;
  await page.goto("/sign-in");
  await signIn(page, toolingManager.email, toolingManager.password);
  await page.getByRole("navigation", { name: "Main areas" }).getByRole("link", { name: "Cutters" }).click();
  await expect(page.getByRole("heading", { level: 1, name: "Cutters" })).toBeVisible();

  await page.getByRole("button", { name: "Import CSV" }).first().click();
  const sheet = page.getByRole("dialog", { name: "Import cutters from a CSV file" });
  await expect(sheet).toBeVisible();

  // First attempt: the second cutter's flute count is not a number.
  await sheet.getByLabel("Choose a CSV file").setInputFiles({ name: "shop-cutters.csv", mimeType: "text/csv", buffer: csv(prefix, "two") });
  const preview = sheet.getByRole("table", { name: "Rows of shop-cutters.csv" });
  await expect(preview).toBeVisible();
  await expect(sheet.getByText("2 ready", { exact: true })).toBeVisible();
  await expect(sheet.getByText("1 with problems", { exact: true })).toBeVisible();
  const badRow = preview.getByRole("row").filter({ hasText: `${prefix} 6 mm up-cut` });
  await expect(badRow).toContainText("1 problem");
  await expect(badRow).toContainText("flutes");
  await expect(badRow).toContainText("not a number");
  await expect(preview.getByRole("row").filter({ hasText: `${prefix} 3 mm flat` })).toContainText("Ready");
  await expect(sheet.getByText(/Nothing has been imported/)).toBeVisible();
  await expect(sheet.getByRole("button", { name: /^Import/ })).toBeDisabled();

  // The person fixes the file and chooses it again.
  await sheet.getByLabel("Choose the file again").setInputFiles({ name: "shop-cutters.csv", mimeType: "text/csv", buffer: csv(prefix, "3") });
  await expect(sheet.getByText("3 ready", { exact: true })).toBeVisible();
  await expect(sheet.getByText("0 with problems", { exact: true })).toBeVisible();
  await sheet.getByRole("button", { name: "Import 3 cutters" }).click();
  await expect(sheet.getByText(/Imported 3 cutters from shop-cutters\.csv/)).toBeVisible();
  await sheet.getByRole("button", { name: "Done" }).click();
  await expect(sheet).toBeHidden();

  // The imported cutters are in the table.
  await page.getByRole("searchbox", { name: "Search" }).fill(prefix);
  const table = page.getByRole("table", { name: "Cutters" });
  for (const name of [`${prefix} 3 mm flat`, `${prefix} 6 mm up-cut`, `${prefix} 1/4 in ball`]) {
    await expect(table.getByRole("row").filter({ hasText: name })).toBeVisible();
  }
  await expect(table.getByRole("row")).toHaveCount(4);
  const ball = table.getByRole("row").filter({ hasText: `${prefix} 1/4 in ball` });
  await expect(ball).toContainText("6.35\u202Fmm");
  await expect(ball).toContainText("Ball end");
});
