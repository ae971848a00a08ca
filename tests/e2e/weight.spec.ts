// JavaScript each page makes a browser download on first load (gzip, as sent), measured the way
// `npm run weight` does (bench/weight.ts): a fresh context, every script response until the network is quiet.
import { BUDGET_KB, measureScripts, pagesToWeigh, RUNNER_CEILING_KB, signedInContext } from "../../bench/weight";
import { DEMO_PASSWORD, expect, test } from "./support";

const base = process.env.GUSSET_TEST_URL ?? "http://127.0.0.1:3100";

test("the public verify page and the runner stay within their JavaScript budgets", async ({ browser }) => {
  test.setTimeout(120_000);
  const paths = await pagesToWeigh(browser, base, { leadEmail: "lead@irongully.example", password: DEMO_PASSWORD, databaseUrl: process.env.DATABASE_URL! });

  const verify = await measureScripts(await browser.newContext({ baseURL: base }), "verify", paths.verify);
  expect(verify.scripts).toBeGreaterThan(0);
  expect(verify.encodedBytes, JSON.stringify(verify.files)).toBeLessThanOrEqual(BUDGET_KB.verify * 1000);
  // Counted as sent over the wire: compressed, so smaller than the scripts themselves.
  expect(verify.decodedBytes).toBeGreaterThan(verify.encodedBytes);

  const welder = await signedInContext(browser, base, "welder@irongully.example", DEMO_PASSWORD);
  const runner = await measureScripts(welder, "runner", paths.runner);
  expect(runner.scripts).toBeGreaterThan(verify.scripts);
  expect(runner.encodedBytes, JSON.stringify(runner.files)).toBeLessThanOrEqual(RUNNER_CEILING_KB * 1000);
});
