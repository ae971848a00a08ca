import { expect, signInAs, test } from "./support";

const homes = [
  ["lead@irongully.example", "Lead desk", "Nell Corrigan"],
  ["welder@irongully.example", "Bench", "Mick Tamsin"],
  ["inspector@irongully.example", "Inspection desk", "Ines Lindqvist"],
  ["auditor@irongully.example", "Record lookup", "Theo Marsh"],
] as const;

for (const [email, heading, name] of homes) {
  test(`${email} signs in and lands on the ${heading}`, async ({ page }) => {
    await signInAs(page, email);
    await expect(page.getByRole("heading", { level: 1, name: heading })).toBeVisible();
    await expect(page.getByTestId("account-menu")).toContainText(name);
    await expect(page.getByRole("main")).toContainText("Iron Gully 4x4 Fabrication");
    // `/home` is the address people bookmark: it leads to the same desk.
    await page.goto("/home");
    await expect(page.getByRole("heading", { level: 1, name: heading })).toBeVisible();
  });
}

test("a wrong password shows a clear message and stays on sign-in", async ({ page }) => {
  await signInAs(page, "lead@irongully.example", "wrong-password-here");
  await expect(page.getByTestId("sign-in-error")).toContainText("do not match an account");
  await expect(page).toHaveURL(/\/sign-in/);
});

test("empty fields are named before anything is sent", async ({ page }) => {
  await page.goto("/sign-in");
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page.getByText("Enter your e-mail address.")).toBeVisible();
  await expect(page.getByText("Enter your password.")).toBeVisible();
});

test("navigation follows the roles: a welder has no People link, a lead does", async ({ page }) => {
  await signInAs(page, "welder@irongully.example");
  await expect(page.getByRole("heading", { level: 1, name: "Bench" })).toBeVisible();
  const nav = page.getByRole("navigation", { name: "Main" });
  await expect(nav.getByRole("link", { name: "People" })).toHaveCount(0);
  await page.goto("/people");
  await expect(page.getByTestId("denied")).toContainText("Only a lead may open that screen.");
});

test("sign-out ends the session", async ({ page }) => {
  await signInAs(page, "lead@irongully.example");
  await expect(page.getByRole("heading", { level: 1, name: "Lead desk" })).toBeVisible();
  await page.getByTestId("account-menu").locator("summary").click();
  await page.getByRole("button", { name: "Sign out" }).click();
  await expect(page).toHaveURL(/\/sign-in/);
  await page.goto("/home/lead");
  await expect(page).toHaveURL(/\/sign-in/);
});

test("a person in two shops switches between them", async ({ page }) => {
  await signInAs(page, "auditor@irongully.example");
  await expect(page.getByRole("heading", { level: 1, name: "Record lookup" })).toBeVisible();
  await expect(page.getByRole("main")).toContainText("Iron Gully 4x4 Fabrication");
  await page.getByLabel("Shop").selectOption({ label: "Saltpan Chassis & Axle" });
  await page.getByRole("button", { name: "Go" }).click();
  await expect(page.getByRole("main")).toContainText("Saltpan Chassis & Axle");
});
