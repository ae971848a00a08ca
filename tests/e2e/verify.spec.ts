import { randomInt } from "node:crypto";
import { request as playwrightRequest, type APIRequestContext } from "@playwright/test";
import pg from "pg";
import { insertPublishedProcedure, jobBody, SHORT_PROCEDURE_CONTENT } from "../fixtures/jobs/procedure";
import { DEMO_PASSWORD, DEMO_PIN, expect, signInAs, test } from "./support";

const base = process.env.GUSSET_TEST_URL ?? "http://127.0.0.1:3100";

async function apiAs(email: string): Promise<APIRequestContext> {
  const ctx = await playwrightRequest.newContext({ baseURL: base, extraHTTPHeaders: { origin: base, "x-forwarded-for": `10.66.${randomInt(0, 255)}.${randomInt(1, 254)}` } });
  const r = await ctx.post("/api/auth/sign-in/email", { data: { email, password: DEMO_PASSWORD } });
  expect(r.status()).toBe(200);
  return ctx;
}

async function sign(who: APIRequestContext, jobId: string, key: string, value?: Record<string, unknown>) {
  const find = async () => ((await (await who.get(`/api/jobs/${jobId}`)).json()) as { steps: { key: string; id: string; version: number }[] }).steps.find((s) => s.key === key)!;
  let s = await find();
  if (value) {
    expect((await who.put(`/api/jobs/${jobId}/steps/${s.id}/value`, { data: { baseVersion: s.version, value } })).status()).toBe(200);
    s = await find();
  }
  expect((await who.post(`/api/jobs/${jobId}/steps/${s.id}/sign`, { data: { pin: DEMO_PIN, baseVersion: s.version } })).status()).toBe(201);
}

test("an auditor scans a released job's traveller and sees the record intact; a stranger sees nothing personal", async ({ page, browser }) => {
  const db = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await db.connect();
  const versionId = await insertPublishedProcedure(db, { shopSlug: "iron-gully", ownerEmail: "lead@irongully.example", title: "Verify test procedure", content: SHORT_PROCEDURE_CONTENT });
  const [lead, welder, inspector] = await Promise.all([apiAs("lead@irongully.example"), apiAs("welder@irongully.example"), apiAs("inspector@irongully.example")]);
  const body = jobBody(versionId);
  const created = await lead.post("/api/jobs", { data: body });
  expect(created.status()).toBe(201);
  const { job } = (await created.json()) as { job: { id: string; number: string } };
  await sign(welder, job.id, "c-one", { confirmed: true });
  await sign(inspector, job.id, "h-one");
  expect((await lead.post(`/api/jobs/${job.id}/release`, { data: { pin: DEMO_PIN } })).status()).toBe(200);
  expect((await lead.get(`/api/jobs/${job.id}/traveller`)).status()).toBe(200);
  const token = (await db.query("select token from job_token where job_id = $1", [job.id])).rows[0].token as string;
  await db.end();

  await signInAs(page, "auditor@irongully.example");
  await expect(page.getByRole("heading", { level: 1, name: "Record lookup" })).toBeVisible();
  await page.getByRole("link", { name: "Scan a traveller" }).first().click();
  await page.getByLabel("Or type the code printed under the QR").fill("not a code");
  await page.getByRole("button", { name: "Check the record" }).click();
  await expect(page.getByText("That is not a traveller code")).toBeVisible();
  await page.getByLabel("Or type the code printed under the QR").fill(`${base}/verify/${token}`);
  await page.getByRole("button", { name: "Check the record" }).click();
  await expect(page.getByTestId("verdict")).toContainText("Record intact");
  await expect(page.getByTestId("job-number")).toHaveText(job.number);
  await expect(page.getByTestId("job-state")).toContainText("Released");
  await expect(page.getByTestId("member-record")).toBeVisible();

  await page.goto("/home/auditor");
  await page.getByLabel("Job no., VIN, axle tag or customer").fill(body.axleTag as string);
  await page.getByRole("button", { name: "Search" }).click();
  await expect(page.getByTestId("records-table")).toContainText(job.number);

  const stranger = await browser.newContext();
  const anon = await stranger.newPage();
  await anon.goto(`/verify/${token}`);
  await expect(anon.getByTestId("verdict")).toContainText("Record intact");
  await expect(anon.locator("body")).not.toContainText(body.customerName as string);
  await expect(anon.getByTestId("member-record")).toHaveCount(0);
  await expect(anon.getByTestId("axle-tag")).toHaveText(body.axleTag as string);
  await expect(anon.getByTestId("vin-last6")).toHaveText("042788");

  // The seal typed from the paper, with its printed spacing: the paper and the record agree; a wrong one disagrees.
  const seal = (((await (await anon.request.get(`/api/verify/${token}`)).json()) as { integrity: { seal: string } }).integrity.seal).slice(0, 16);
  for (const [typed, word, verdict] of [[seal.match(/.{4}/g)!.join(" ").toUpperCase(), "Paper and record agree", "agrees"], ["0123 4567 89ab cdef", "Paper and record disagree", "disagrees"]] as const) {
    await anon.goto("/scan");
    await anon.getByLabel("Or type the code printed under the QR").fill(token);
    await anon.getByTestId("typed-seal").fill(typed);
    await anon.getByRole("button", { name: "Check the record" }).click();
    await expect(anon.getByTestId("paper-verdict")).toContainText(word);
    await expect(anon.getByTestId("paper-verdict")).toHaveAttribute("data-verdict", verdict);
  }
  await anon.goto("/scan");
  await anon.getByLabel("Or type the code printed under the QR").fill(token);
  await anon.getByTestId("typed-seal").fill("12ab");
  await anon.getByRole("button", { name: "Check the record" }).click();
  await expect(anon.getByText("The seal is at least the first 16")).toBeVisible();
  await stranger.close();
  await Promise.all([lead.dispose(), welder.dispose(), inspector.dispose()]);
});
