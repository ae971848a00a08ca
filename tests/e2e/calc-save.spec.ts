import { randomInt } from "node:crypto";
import { request as playwrightRequest } from "@playwright/test";
import pg from "pg";
import { insertPublishedProcedure, jobBody, MEASURING_PROCEDURE_CONTENT } from "../fixtures/jobs/procedure";
import { DEMO_PASSWORD, expect, signInAs, test } from "./support";

const base = process.env.GUSSET_TEST_URL ?? "http://127.0.0.1:3100";

test("a lead saves the steering layout to a job's geometry step and sees it on the job page", async ({ page }) => {
  const db = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await db.connect();
  const versionId = await insertPublishedProcedure(db, { shopSlug: "iron-gully", ownerEmail: "lead@irongully.example", title: "Geometry save procedure", content: MEASURING_PROCEDURE_CONTENT });
  await db.end();
  const api = await playwrightRequest.newContext({ baseURL: base, extraHTTPHeaders: { origin: base, "x-forwarded-for": `10.55.${randomInt(0, 255)}.${randomInt(1, 254)}` } });
  expect((await api.post("/api/auth/sign-in/email", { data: { email: "lead@irongully.example", password: DEMO_PASSWORD } })).status()).toBe(200);
  const created = await api.post("/api/jobs", { data: jobBody(versionId) });
  expect(created.status()).toBe(201);
  const { job } = (await created.json()) as { job: { id: string; number: string } };
  await api.dispose();

  await signInAs(page, "lead@irongully.example");
  await expect(page.getByRole("heading", { level: 1, name: "Lead desk" })).toBeVisible();
  await page.goto("/calc/steering");
  const panel = page.getByTestId("save-to-job");
  await panel.getByLabel("Job").selectOption({ value: job.id });
  await expect(panel.getByLabel("Geometry step")).toHaveValue(/.+/);
  await panel.getByLabel("After").check();
  await panel.getByRole("button", { name: "Save to job" }).click();
  await expect(page.getByTestId("save-message")).toContainText("Saved as the after capture of “Geometry after”");
  await page.getByRole("link", { name: "Open the job" }).click();
  await expect(page).toHaveURL(new RegExp(`/jobs/${job.id}\\?tab=measurements`));
  const table = page.getByTestId("geometry-table");
  await expect(table).toBeVisible();
  await expect(table).toContainText(/after/i);
});
