import { expect, signedInAs, signInAs, test } from "./support";

test("a lead invites a welder; the mail shows in the local mailbox; the invitee joins and lands on the bench", async ({ page, browser }) => {
  const email = `fitter-${Date.now()}@irongully.example`;
  await signInAs(page, "lead@irongully.example");
  await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "People" }).click();
  const form = page.getByTestId("invite-form");
  await form.getByLabel("E-mail").fill("not an address");
  await form.getByRole("button", { name: "Send invitation" }).click();
  await expect(form.getByText("That is not an e-mail address.")).toBeVisible();
  await form.getByLabel("E-mail").fill(email);
  await form.getByRole("button", { name: "Send invitation" }).click();
  await expect(page.getByTestId("invite-ok")).toContainText(`Invitation sent to ${email}`);
  await expect(page.getByTestId("open-invitations")).toContainText(email);

  await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Local mailbox" }).click();
  const mail = page.getByTestId("mailbox").locator("li").filter({ hasText: email }).first();
  await expect(mail).toContainText("invited to Iron Gully 4x4 Fabrication");
  await mail.locator("summary").click();
  const text = await mail.locator("pre").innerText();
  const link = /https?:\/\/\S+\/invite\/[A-Za-z0-9_-]+/.exec(text)?.[0];
  expect(link).toBeTruthy();

  const guest = await browser.newContext({ extraHTTPHeaders: { "x-forwarded-for": "10.77.1.2" } });
  const invitee = await guest.newPage();
  await invitee.goto(new URL(link!).pathname);
  await expect(invitee.getByRole("heading", { name: "Join Iron Gully 4x4 Fabrication" })).toBeVisible();
  await invitee.getByLabel("Your name as it appears on sign-offs").fill("Ari Fenwick");
  await invitee.getByLabel("Choose a password (10+ characters)").fill("short");
  await invitee.getByLabel("Password again").fill("different");
  await invitee.getByRole("button", { name: "Join the shop" }).click();
  await expect(invitee.getByText("At least 10 characters.")).toBeVisible();
  await invitee.getByLabel("Choose a password (10+ characters)").fill("brackets-and-gussets");
  await invitee.getByLabel("Password again").fill("brackets-and-gussets");
  await invitee.getByRole("button", { name: "Join the shop" }).click();
  await expect(invitee.getByTestId("accept-ok")).toBeVisible();
  await invitee.getByRole("link", { name: "Go to sign-in" }).click();
  await invitee.getByLabel("E-mail").fill(email);
  await invitee.getByLabel("Password").fill("brackets-and-gussets");
  await invitee.getByRole("button", { name: "Sign in" }).click();
  await expect(invitee.getByRole("heading", { level: 1, name: "Bench" })).toBeVisible();
  await expect(invitee.getByText("Not set: you cannot sign steps yet")).toBeVisible();
  await guest.close();
});

test("a person sets their signing PIN; a short PIN is refused beside the field", async ({ page }) => {
  await signInAs(page, "inspector@irongully.example");
  await expect(page.getByRole("heading", { level: 1, name: "Inspection desk" })).toBeVisible();
  await page.goto("/account");
  const form = page.getByTestId("pin-form");
  await form.getByLabel("Account password").fill("demo-gusset-2026");
  await form.getByLabel("New PIN", { exact: true }).fill("12");
  await form.getByLabel("New PIN again").fill("12");
  await form.getByRole("button", { name: "Save PIN" }).click();
  await expect(form.getByText("A PIN is 4 to 8 digits, nothing else.")).toBeVisible();
  await form.getByLabel("New PIN", { exact: true }).fill("2468");
  await form.getByLabel("New PIN again").fill("2468");
  await form.getByRole("button", { name: "Save PIN" }).click();
  await expect(page.getByTestId("pin-ok")).toContainText("Signing PIN saved.");
});

test("a lead changes two people's roles with one Save; the last lead cannot drop the lead role", async ({ page }) => {
  await signedInAs(page, "lead@irongully.example");
  await page.goto("/people");
  const table = page.getByTestId("members-table");
  const row = (email: string) => table.getByRole("row").filter({ hasText: email });
  const save = page.getByRole("button", { name: "Save roles" });
  await expect(save).toHaveCount(1);

  await row("welder@irongully.example").getByLabel("Auditor", { exact: true }).check();
  await row("inspector@irongully.example").getByLabel("Auditor", { exact: true }).check();
  await save.click();
  await expect(page.getByTestId("roles-ok")).toHaveText(/Roles of 2 people saved\./);
  await page.reload();
  await expect(row("welder@irongully.example").getByLabel("Auditor", { exact: true })).toBeChecked();
  await expect(row("inspector@irongully.example").getByLabel("Auditor", { exact: true })).toBeChecked();
  await expect(row("auditor@irongully.example").getByLabel("Welder", { exact: true })).not.toBeChecked();

  // Put them back, again with one Save.
  await row("welder@irongully.example").getByLabel("Auditor", { exact: true }).uncheck();
  await row("inspector@irongully.example").getByLabel("Auditor", { exact: true }).uncheck();
  await save.click();
  await expect(page.getByTestId("roles-ok")).toHaveText(/Roles of 2 people saved\./);

  // The only lead swaps their own lead role for welder: refused with the reason, nothing changed.
  await row("lead@irongully.example").getByLabel("Welder", { exact: true }).check();
  await row("lead@irongully.example").getByLabel("Lead", { exact: true }).uncheck();
  await save.click();
  await expect(page.getByTestId("roles-error")).toContainText("at least one active lead");
  await page.reload();
  await expect(row("lead@irongully.example").getByLabel("Lead", { exact: true })).toBeChecked();
  await expect(row("lead@irongully.example").getByLabel("Welder", { exact: true })).not.toBeChecked();
});
