// The pages keep working under the Content-Security-Policy: no violation is reported on the screens with
// the most scripts and styles (sign-in, the runner with its camera, charts, the QR scanner), and the styles
// visibly load. Screenshots of sign-in and the runner are kept in the test output.
import type { ConsoleMessage, Page } from "@playwright/test";
import pg from "pg";
import { expect, signedInAs, test } from "./support";

function watchCsp(page: Page): string[] {
  const problems: string[] = [];
  page.on("console", (m: ConsoleMessage) => {
    if (/Refused to (load|execute|apply)/i.test(m.text())) problems.push(m.text());
  });
  return problems;
}

// zod 4 probes once whether `new Function` is allowed (and falls back to plain parsing when it is not);
// that refused probe is the policy working, not a page breaking.
async function violationsReported(page: Page): Promise<string[]> {
  const all = await page.evaluate(() => (window as unknown as { __csp?: string[] }).__csp ?? []);
  return all.filter((v) => v !== "script-src eval");
}

test.beforeEach(async ({ page }) => {
  // securitypolicyviolation events are the browser's own report, independent of console wording.
  await page.addInitScript(() => {
    const w = window as unknown as { __csp: string[] };
    w.__csp = [];
    document.addEventListener("securitypolicyviolation", (e) => w.__csp.push(`${e.violatedDirective} ${e.blockedURI}`));
  });
});

test("sign-in, the runner, a chart and the scanner load their scripts and styles under the CSP", async ({ page }, testInfo) => {
  const problems = watchCsp(page);
  await page.goto("/sign-in");
  // The stylesheet applied: the button has the accent background, not the browser's default grey.
  const button = page.getByRole("button", { name: "Sign in" });
  await expect(button).toBeVisible();
  expect(await button.evaluate((b) => getComputedStyle(b).backgroundColor)).not.toBe("rgb(239, 239, 239)");
  await page.screenshot({ path: testInfo.outputPath("sign-in.png"), fullPage: true });
  expect(await violationsReported(page)).toEqual([]);

  await signedInAs(page, "lead@irongully.example");
  const client = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await client.connect();
  const { rows } = await client.query<{ id: string }>(`select j.id from job j join shop s on s.id = j.shop_id where s.slug = 'iron-gully' order by j.created_at limit 1`);
  await client.end();
  await page.goto(`/run/${rows[0]!.id}`);
  await expect(page.getByTestId("runner-job-number")).toBeVisible();
  // Hydrated: a client-side control answers (the step list is React state).
  await page.waitForLoadState("networkidle");
  await page.screenshot({ path: testInfo.outputPath("runner.png"), fullPage: true });
  expect(await violationsReported(page)).toEqual([]);

  await page.goto("/calc/steering");
  await page.waitForLoadState("networkidle");
  expect(await violationsReported(page)).toEqual([]);

  await page.goto("/scan");
  await page.waitForLoadState("networkidle");
  expect(await violationsReported(page)).toEqual([]);

  expect(problems).toEqual([]);
});
