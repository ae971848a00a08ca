// A lead opens a job at the desk: the new-job form (VIN check warns, never blocks), the job page, the list.
import { randomUUID } from "node:crypto";
import pg from "pg";
import { insertPublishedProcedure, SHORT_PROCEDURE_CONTENT } from "../fixtures/jobs/procedure";
import { expect, signedInAs, test } from "./support";

let versionId = "";

test.beforeAll(async () => {
  const client = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await client.connect();
  versionId = await insertPublishedProcedure(client, { shopSlug: "iron-gully", ownerEmail: "lead@irongully.example", title: "Desk test procedure", content: SHORT_PROCEDURE_CONTENT });
  await client.end();
});

test("a lead creates a job with a mistyped VIN: warned, saved, listed and searchable", async ({ page }) => {
  const tag = `E2E-${randomUUID().slice(0, 6).toUpperCase()}`;
  await signedInAs(page, "lead@irongully.example");
  await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Jobs" }).click();
  await page.getByTestId("new-job").click();
  const form = page.getByTestId("new-job-form");

  // Nothing filled: the fields say what they need, before anything is sent.
  await page.getByTestId("create-job").click();
  await expect(form.getByText("Enter the customer's name.")).toBeVisible();
  await expect(form.getByText("Enter the axle's ID tag.")).toBeVisible();

  await form.getByLabel("Name", { exact: true }).fill("Mulga Downs Contracting");
  await form.getByLabel("E-mail").fill("yard@mulgadowns.example");
  await form.getByLabel("Model year").fill("2011");
  await form.getByLabel("Make and model").fill("mid-size pickup, dual cab");
  // 49 CFR 565.15 worked example with its check digit X replaced by 5.
  await form.getByLabel("VIN").fill("1M8GDM9A5KP042788");
  await expect(page.getByTestId("vin-check")).toContainText("Check digit (position 9) is 5 but the other characters give X");
  await form.getByLabel("Axle or frame part").fill("front solid axle housing");
  await form.getByLabel("Axle ID tag").fill(tag);
  await form.getByLabel(/Procedure/).selectOption(versionId);
  await form.getByLabel("Mick Tamsin").check();
  await form.getByLabel("Inspector", { exact: true }).selectOption({ label: "Ines Lindqvist" });
  await page.getByTestId("create-job").click();

  await expect(page).toHaveURL(/\/jobs\/[0-9a-f-]{36}$/);
  const number = (await page.getByRole("heading", { level: 1 }).textContent())!.trim();
  expect(number).toMatch(/^GJ-\d{4}-\d{4,}$/);
  await expect(page.getByTestId("job-state")).toHaveText(/Planned/);
  await expect(page.getByTestId("vin-warning")).toContainText("Check digit");
  await expect(page.getByTestId("job-progress")).toHaveText("0 of 2 steps signed");
  await expect(page.getByTestId("checklist-step-h-one")).toContainText("Hold point");

  await page.goto(`/jobs?q=${tag.toLowerCase()}`);
  await expect(page.getByTestId("job-row")).toHaveCount(1);
  await expect(page.getByTestId("job-row")).toContainText(number);
  await expect(page.getByTestId("job-row")).toContainText("▲ check");
  await page.goto(`/jobs?q=Mulga%20Downs&status=released`);
  await expect(page.getByTestId("job-row")).toHaveCount(0);
});
