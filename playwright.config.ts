import { defineConfig, devices } from "@playwright/test";

// Run by `npm test` against the app it starts; Debian's Chromium, never a downloaded browser.
export default defineConfig({
  testDir: "tests/e2e",
  fullyParallel: false,
  workers: 1,
  retries: process.env.CI ? 1 : 0,
  timeout: 60_000,
  expect: { timeout: 10_000 },
  reporter: [["list"], ["json"]],
  // Per app port, so runs side by side never clear each other's traces.
  outputDir: `.data/test-results-${process.env.TEST_APP_PORT ?? "3100"}`,
  use: {
    baseURL: process.env.GUSSET_TEST_URL ?? "http://127.0.0.1:3100",
    trace: "retain-on-failure",
    screenshot: "only-on-failure",
    launchOptions: {
      executablePath: "/usr/bin/chromium",
      args: ["--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run", "--disable-background-networking", "--disable-component-update", "--disable-sync"],
    },
  },
  projects: [
    { name: "desktop", use: { ...devices["Desktop Chrome"], viewport: { width: 1280, height: 800 } }, testIgnore: /tablet/ },
    { name: "tablet", use: { viewport: { width: 1024, height: 768 }, hasTouch: true, isMobile: false }, testMatch: /tablet/ },
  ],
});
