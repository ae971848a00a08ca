// A tablet on the shop's network: it reaches the shop computer by a LAN name (mapped to 127.0.0.1 here, as the
// network's name service would), over HTTPS with the shop certificate, which this browser has not installed.
import { expect, test } from "@playwright/test";
import config from "../../playwright.config";
import { DEMO_PASSWORD } from "./support";

const httpsUrl = new URL(process.env.GUSSET_TEST_HTTPS_URL ?? "https://shop-pc.test:3543");
const httpPort = new URL(process.env.GUSSET_TEST_URL ?? "http://127.0.0.1:3100").port;
const defaultArgs = config.use?.launchOptions?.args ?? [];

test.use({
  // Only here: the certificate is the shop's own and not installed in this browser profile.
  ignoreHTTPSErrors: true,
  launchOptions: {
    executablePath: "/usr/bin/chromium",
    args: [...defaultArgs, `--host-resolver-rules=MAP ${httpsUrl.hostname} 127.0.0.1`],
  },
});

test("the welder opens the LAN address over http, is sent to HTTPS, signs in and sees the bench", async ({ page }) => {
  await page.goto(`http://${httpsUrl.hostname}:${httpPort}/sign-in`);
  await expect(page).toHaveURL(`${httpsUrl.origin}/sign-in`);
  expect(await page.evaluate(() => window.isSecureContext)).toBe(true);
  await page.getByLabel("E-mail").fill("welder@irongully.example");
  await page.getByLabel("Password").fill(DEMO_PASSWORD);
  await page.getByRole("button", { name: "Sign in" }).tap();
  await expect(page.getByRole("heading", { level: 1, name: "Bench" })).toBeVisible();
  await expect(page).toHaveURL(`${httpsUrl.origin}/home/welder`);
  const cookies = await page.context().cookies();
  const session = cookies.find((c) => c.name.endsWith("session_token"));
  expect(session?.name).toMatch(/^__Secure-/);
  expect(session?.secure).toBe(true);
});

test("a lead finds the Devices page: the address, its QR code and the shop certificate to install", async ({ page }, info) => {
  await page.goto(`${httpsUrl.origin}/sign-in`);
  await page.getByLabel("E-mail").fill("lead@irongully.example");
  await page.getByLabel("Password").fill(DEMO_PASSWORD);
  await page.getByRole("button", { name: "Sign in" }).tap();
  await expect(page.getByRole("heading", { level: 1, name: "Lead desk" })).toBeVisible();
  await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Devices" }).tap();
  await expect(page.getByRole("heading", { level: 1, name: "Devices" })).toBeVisible();
  await expect(page.getByText("A signed record needs a private line")).toBeVisible();
  await expect(page.getByTestId("device-address")).toHaveText(httpsUrl.origin);
  await expect(page.getByTestId("device-qr").locator("svg")).toBeVisible();
  await expect(page.getByTestId("ca-fingerprint")).toContainText(/SHA-256 ([0-9A-F]{2}:){31}[0-9A-F]{2}/);
  for (const h of ["Android tablets", "iPad and iPhone", "Desktop browsers"]) await expect(page.getByRole("heading", { level: 3, name: h })).toBeVisible();
  const download = page.waitForEvent("download");
  await page.getByRole("link", { name: "Download certificate (.crt)" }).tap();
  expect((await download).suggestedFilename()).toBe("gusset-shop-certificate.crt");
  // Controls a gloved hand can hit on a tablet.
  const box = await page.getByRole("link", { name: "Download certificate (.crt)" }).boundingBox();
  expect(box!.height).toBeGreaterThanOrEqual(48);
  await page.screenshot({ path: info.outputPath("devices-tablet.png"), fullPage: true });
});
