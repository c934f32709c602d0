import { expect, test } from "@playwright/test";
import { newAccount, signIn, signUp, unique } from "./support";

/**
 * The owner's team journey against the local stand-ins: upgrade through the payment provider's
 * checkout page (the local fake), invite a programmer, who reads the invitation from the captured
 * mail, accepts it and signs in with the right role; then the owner adds a seat.
 */
test("owner upgrades, invites a programmer who joins from the e-mail, then adds a seat", async ({ page, browser }) => {
  // A long journey with two browsers (bcrypt on sign-up, accept and sign-in) on a shared 2-core machine.
  test.setTimeout(240_000);
  const owner = newAccount();
  await signUp(page, owner);

  // Free plan: one paid seat, taken by the owner.
  await page.goto("/billing");
  await expect(page.getByRole("heading", { name: "Free plan", exact: true })).toBeVisible();
  await expect(page.getByTestId("seats-used")).toHaveText("1 of 1");

  // Upgrade with 2 seats on the provider's (fake) checkout page.
  await page.getByLabel("Paid seats").fill("2");
  await page.getByRole("button", { name: "Continue to payment" }).click();
  await expect(page.getByText("LOCAL STAND-IN — NO MONEY MOVES")).toBeVisible();
  await expect(page.getByRole("heading", { name: `Checkout for ${owner.shopName}` })).toBeVisible();
  await page.getByRole("button", { name: "Complete test payment" }).click();

  await expect(page).toHaveURL(/\/billing$/);
  await expect(page.getByText(/Payment received: .* is on the team plan with 2 paid seats\./)).toBeVisible();
  await expect(page.getByRole("heading", { name: "Team plan", exact: true })).toBeVisible();
  await expect(page.getByTestId("seats-used")).toHaveText("1 of 2");
  await expect(page.getByTestId("renewal")).not.toBeEmpty();

  // Invite a programmer.
  const programmerEmail = `quill.ostby.${unique()}@example.test`;
  await page.goto("/team");
  const invite = page.getByRole("form", { name: "Invite someone" });
  await invite.getByLabel("E-mail").fill(programmerEmail);
  await invite.getByLabel("Role").selectOption("programmer");
  await invite.getByRole("button", { name: "Send invitation" }).click();
  await expect(page.getByText(`Invitation sent to ${programmerEmail}.`)).toBeVisible();
  await expect(page.getByRole("region", { name: "Pending invitations" }).getByText(programmerEmail)).toBeVisible();

  // The programmer, in their own browser, reads the message from the capture server's page.
  const programmerContext = await browser.newContext();
  const programmer = await programmerContext.newPage();
  await programmer.goto("/dev/mail");
  const message = programmer.getByRole("article", { name: new RegExp(`^Message to ${programmerEmail.replace(/\./g, "\\.")}:`) });
  await expect(message.getByRole("heading", { name: /invited you to/ })).toBeVisible();
  await message.getByRole("link", { name: /\/invitations\// }).click();

  await expect(programmer.getByText(/as programmer/)).toBeVisible();
  await programmer.getByLabel("Your name").fill("Quill Ostby");
  await programmer.getByLabel("Choose a password", { exact: true }).fill("chatter-free-2026");
  await programmer.getByRole("button", { name: "Create account and join" }).click();
  await expect(programmer.getByRole("heading", { level: 1, name: "Planner" })).toBeVisible();

  // Signs in again with the chosen password and holds the programmer role in the owner's shop.
  await programmer.context().clearCookies();
  await programmer.goto("/sign-in");
  await signIn(programmer, programmerEmail, "chatter-free-2026");
  await expect(programmer.getByRole("heading", { level: 1, name: "Planner" })).toBeVisible();
  const me = (await (await programmer.request.get("/api/me")).json()) as { memberships: Array<{ shopName: string; role: string }> };
  expect(me.memberships).toEqual([{ shopId: expect.any(String), shopName: owner.shopName, role: "programmer" }]);
  await programmer.goto("/team");
  await expect(programmer.getByRole("row", { name: /Quill Ostby/ })).toContainText("Programmer");
  await programmerContext.close();

  // Both seats are taken now; the owner adds one.
  await page.goto("/billing");
  await expect(page.getByTestId("seats-used")).toHaveText("2 of 2");
  const seats = page.getByRole("form", { name: "Change seats" });
  await seats.getByLabel("Paid seats").fill("3");
  await seats.getByRole("button", { name: "Update seats" }).click();
  await expect(page.getByText("The team plan now has 3 paid seats.")).toBeVisible();
  await expect(page.getByTestId("seats-used")).toHaveText("2 of 3");
});
