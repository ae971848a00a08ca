// The job page's record of welds and materials: the demo's repaired job shows W2 rejected for undercut and
// accepted after repair; a welder records a material, the form refuses an empty heat number beside the field,
// an inspector corrects the entry with a reason (the old one stays, struck through); an auditor only reads.
import pg from "pg";
import { insertPublishedProcedure, jobBody, SHORT_PROCEDURE_CONTENT } from "../fixtures/jobs/procedure";
import { randomInt } from "node:crypto";
import { request as playwrightRequest } from "@playwright/test";
import { DEMO_PASSWORD, expect, signedInAs, test } from "./support";

const base = process.env.GUSSET_TEST_URL ?? "http://127.0.0.1:3100";

async function seededJob(tag: string): Promise<string> {
  const db = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await db.connect();
  try {
    const { rows } = await db.query<{ id: string }>(`select j.id from job j join shop s on s.id = j.shop_id where s.slug = 'iron-gully' and j.axle_tag = $1`, [tag]);
    return rows[0]!.id;
  } finally {
    await db.end();
  }
}

test("the welds tab of a repaired job shows both rounds in order, with the rejected item and its limit", async ({ page }) => {
  const id = await seededJob("AX-0533");
  await signedInAs(page, "auditor@irongully.example");
  await page.goto(`/jobs/${id}?tab=welds`);
  const w2 = page.getByTestId("joint-W2");
  await expect(w2).toContainText("Accepted");
  await expect(w2.getByTestId("round-1")).toContainText("Rejected");
  await expect(w2.getByTestId("round-1").getByTestId("rejected-items")).toContainText(/undercut/i);
  await expect(w2.getByTestId("round-1").getByTestId("rejected-items")).toContainText("1/32 in (0.79 mm)");
  await expect(w2.getByTestId("round-2")).toContainText("Accepted");
  await expect(w2.getByTestId("round-2")).toContainText("GUS-GMAW-02");
  // Materials: the auditor reads them and has nothing to press.
  await page.goto(`/jobs/${id}?tab=materials`);
  await expect(page.getByTestId("materials-table")).toContainText("HT 7731-0530");
  await expect(page.getByTestId("material-add")).toHaveCount(0);
});

test("materials: recorded with field errors shown, corrected with a reason, the old entry kept and struck through", async ({ browser }) => {
  const db = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await db.connect();
  const versionId = await insertPublishedProcedure(db, { shopSlug: "iron-gully", ownerEmail: "lead@irongully.example", title: "Materials test procedure", content: SHORT_PROCEDURE_CONTENT });
  await db.end();
  const lead = await playwrightRequest.newContext({ baseURL: base, extraHTTPHeaders: { origin: base, "x-forwarded-for": `10.67.${randomInt(0, 255)}.${randomInt(1, 254)}` } });
  expect((await lead.post("/api/auth/sign-in/email", { data: { email: "lead@irongully.example", password: DEMO_PASSWORD } })).status()).toBe(200);
  const created = await lead.post("/api/jobs", { data: jobBody(versionId, { customerName: "Materials Test Station" }) });
  expect(created.status()).toBe(201);
  const jobId = ((await created.json()) as { job: { id: string } }).job.id;

  const welder = await (await browser.newContext()).newPage();
  await signedInAs(welder, "welder@irongully.example");
  await welder.goto(`/jobs/${jobId}?tab=materials`);
  await expect(welder.getByTestId("materials-empty")).toBeVisible();
  await welder.getByTestId("material-add").click();
  const form = welder.getByTestId("material-form");
  await form.getByLabel("Description").fill("Bracket plate 10 mm");
  await form.getByRole("button", { name: /record|add|save/i }).click();
  await expect(form).toContainText("Enter the heat (cast) or lot number as marked.");
  await expect(form.getByLabel("Description")).toHaveValue("Bracket plate 10 mm");
  await form.getByLabel("Heat or lot number").fill("HT 7731-0412");
  await form.getByRole("button", { name: /record|add|save/i }).click();
  await expect(welder.getByTestId("material-1")).toContainText("HT 7731-0412");

  const inspector = await (await browser.newContext()).newPage();
  await signedInAs(inspector, "inspector@irongully.example");
  await inspector.goto(`/jobs/${jobId}?tab=materials`);
  await inspector.getByTestId("material-correct-1").click();
  const fix = inspector.getByTestId("material-form");
  await fix.getByLabel("Heat or lot number").fill("HT 7731-0421");
  await fix.getByRole("button", { name: /correct|save|record/i }).click();
  await expect(fix).toContainText("Say why the entry is corrected");
  await fix.getByLabel("Why is it corrected?").fill("Digits swapped; read again off the plate.");
  await fix.getByRole("button", { name: /correct|save|record/i }).click();
  await expect(inspector.getByTestId("material-2")).toContainText("HT 7731-0421");
  await expect(inspector.getByTestId("material-1")).toHaveAttribute("data-superseded", "true");
  await expect(inspector.getByTestId("material-1").getByTestId("superseded-by")).toContainText("Digits swapped");
});
