import { randomInt } from "node:crypto";
import { expect, type Page, test as base } from "@playwright/test";

export const DEMO_PASSWORD = "demo-gusset-2026";
export const DEMO_PIN = "2468";

// The app keys its limits by the socket's address and ignores this header (TRUSTED_PROXY_HOPS=0); it stays so
// that a run against an app behind a trusted proxy still gives each test its own client address.
export const test = base.extend({
  extraHTTPHeaders: async ({}, provide) => {
    await provide({ "x-forwarded-for": `10.${randomInt(0, 255)}.${randomInt(0, 255)}.${randomInt(1, 254)}` });
  },
});
export { expect };

export async function signInAs(page: Page, email: string, password = DEMO_PASSWORD) {
  await page.goto("/sign-in");
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
}

export async function signedInAs(page: Page, email: string) {
  await signInAs(page, email);
  await expect(page.getByTestId("account-menu")).toBeVisible();
}
