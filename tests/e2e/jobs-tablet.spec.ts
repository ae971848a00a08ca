// The welder's day on a tablet (1024 × 768, touch): pick up the job from the bench, acknowledge a caution,
// measure on the pad, take a photo, sign each with the PIN; an out-of-tolerance value raises a nonconformance.
import path from "node:path";
import { request as playwrightRequest, type Page } from "@playwright/test";
import pg from "pg";
import { insertPublishedProcedure, jobBody } from "../fixtures/jobs/procedure";
import { DEMO_PIN, expect, signedInAs, test } from "./support";

const BASE = process.env.GUSSET_TEST_URL ?? "http://127.0.0.1:3100";
const FIXTURE = path.resolve(import.meta.dirname, "../fixtures/jobs/bracket.jpg");

const TABLET_PROCEDURE = {
  sections: [
    {
      key: "fit",
      title: "Fit the bracket",
      steps: [
        { key: "hot", kind: "caution", title: "Before hot work", instructions: "Extinguisher within reach.", signedBy: "welder", photos: { required: false, min: 0 }, hazards: ["ppe", "fire-watch"], acknowledgement: "I wear the PPE and keep a fire watch." },
        { key: "height", kind: "measure", title: "Hole centre height", instructions: "From the tube's lower edge.", signedBy: "welder", photos: { required: false, min: 0 }, quantity: "length", nominal: 100, tolerance: { type: "plusMinus", plus: 1, minus: 1 } },
        { key: "fitup", kind: "photo", title: "Photo of the fit-up", instructions: "Square on, tape in view.", signedBy: "welder", photos: { required: true, min: 1 } },
      ],
    },
    {
      key: "gap",
      title: "Check the gap",
      steps: [{ key: "root-gap", kind: "measure", title: "Largest root gap", instructions: "", signedBy: "welder", photos: { required: false, min: 0 }, quantity: "length", tolerance: { type: "max", max: 1.5 } }],
    },
  ],
};

let jobId = "";
let jobNumber = "";

test.beforeAll(async () => {
  const client = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await client.connect();
  const versionId = await insertPublishedProcedure(client, { shopSlug: "iron-gully", ownerEmail: "lead@irongully.example", title: "Tablet test procedure", content: TABLET_PROCEDURE });
  const { rows } = await client.query<{ id: string }>(`select id from "user" where email = 'welder@irongully.example'`);
  await client.end();
  const ip = `10.77.${Math.floor(Math.random() * 250)}.${Math.floor(Math.random() * 250)}`;
  const api = await playwrightRequest.newContext({ baseURL: BASE, extraHTTPHeaders: { origin: BASE, "x-forwarded-for": ip } });
  const signIn = await api.post("/api/auth/sign-in/email", { data: { email: "lead@irongully.example", password: "demo-gusset-2026" } });
  expect(signIn.ok()).toBe(true);
  const created = await api.post("/api/jobs", { data: jobBody(versionId, { welderIds: [rows[0]!.id], dueDate: "2020-01-01", customerName: "Tablet Test Station" }) });
  expect(created.status()).toBe(201);
  const body = await created.json();
  jobId = body.job.id;
  jobNumber = body.job.number;
  await api.dispose();
});

async function typeOnPad(page: Page, text: string) {
  const pad = page.getByTestId("number-pad");
  for (const ch of text) await pad.getByRole("button", { name: ch === "." ? "Decimal point" : ch, exact: true }).click();
}

async function signWithPin(page: Page) {
  await page.getByTestId("sign-step").click();
  const dialog = page.getByTestId("pin-dialog");
  await expect(dialog).toBeVisible();
  await expect(dialog.getByTestId("sign-as-name")).toHaveText("Mick Tamsin");
  await expect(dialog.getByTestId("sign-as-meaning")).toHaveText("Performed");
  for (const d of DEMO_PIN) await dialog.getByTestId("pin-pad").getByRole("button", { name: d, exact: true }).click();
  await dialog.getByTestId("pin-submit").click();
  await expect(dialog).toBeHidden();
}

test("a welder completes a section with a caution, a measurement and a photo, then an out-of-tolerance gap raises a nonconformance", async ({ page }) => {
  await signedInAs(page, "welder@irongully.example");
  await page.goto("/home/welder");
  await page.getByTestId("my-jobs").getByRole("link", { name: new RegExp(jobNumber) }).click();
  await expect(page).toHaveURL(new RegExp(`/run/${jobId}`));
  await expect(page.getByTestId("runner-job-number")).toHaveText(jobNumber);
  await expect(page.getByTestId("runner-progress")).toHaveText("0 of 4 signed");

  // Caution: prominent, each hazard acknowledged by a tap, then signed. Nothing says "Saved" before a save.
  await expect(page.getByTestId("caution-banner")).toBeVisible();
  await expect(page.getByTestId("save-state")).toHaveCount(0);
  await expect(page.getByTestId("sign-step")).toBeDisabled();
  await page.getByTestId("hazard-ppe").click();
  await page.getByTestId("hazard-fire-watch").click();
  await expect(page.getByTestId("save-state")).toHaveText(/Saved/);
  await signWithPin(page);
  // Signing moves on to the next open step by itself; there is no second Next button.
  await expect(page.getByTestId("runner-progress")).toHaveText("1 of 4 signed");
  await expect(page.getByTestId("next-after-sign")).toHaveCount(0);

  // Measurement on the pad with a live verdict.
  await expect(page.getByRole("heading", { name: /Hole centre height/ })).toBeVisible();
  await typeOnPad(page, "100.4");
  await expect(page.locator("#reading")).toHaveValue("100.4");
  await expect(page.getByTestId("tolerance-verdict")).toHaveAttribute("data-verdict", "pass");
  await expect(page.getByTestId("save-state")).toHaveText(/Saved/);
  await signWithPin(page);
  await expect(page.getByTestId("runner-progress")).toHaveText("2 of 4 signed");

  // Photo straight from the camera input, with its upload and thumbnail.
  await expect(page.getByRole("heading", { name: /Photo of the fit-up/ })).toBeVisible();
  await expect(page.getByTestId("photos-camera")).toHaveAttribute("capture", "environment");
  await page.getByTestId("photos-caption").fill("Fit-up, tape at the upper toe");
  await page.getByTestId("photos-camera").setInputFiles(FIXTURE);
  await expect(page.getByTestId("photo-thumb")).toHaveCount(1);
  await expect(page.getByTestId("photo-thumb").getByTestId("photo-caption")).toHaveText("Fit-up, tape at the upper toe");
  await expect(page.getByTestId("photos-count")).toHaveText("1 of 1");
  await signWithPin(page);
  await expect(page.getByTestId("runner-progress")).toHaveText("3 of 4 signed");

  // The section map shows the section done, by word as well as shape.
  await page.getByTestId("open-section-map").click();
  const map = page.getByTestId("section-map");
  await expect(map.getByText("Fit the bracket (3/3)")).toBeVisible();
  await expect(map.getByTestId("map-step-fitup")).toContainText("Signed");
  await map.getByTestId("map-step-root-gap").click();

  // Out of tolerance: cannot be signed as passed; it raises a nonconformance and the job goes on hold.
  await typeOnPad(page, "2.4");
  await expect(page.getByTestId("tolerance-verdict")).toHaveAttribute("data-verdict", "fail");
  await expect(page.getByTestId("tolerance-verdict")).toContainText("above the limit");
  await expect(page.getByTestId("sign-step")).toBeDisabled();
  await expect(page.getByTestId("readiness")).toContainText("Cannot be signed as passed");
  await page.getByTestId("raise-nc").click();
  const form = page.getByTestId("raise-nc-form");
  await expect(form.getByLabel("What is wrong")).toHaveValue("Out of tolerance: 2.4 mm is above the upper limit of 1.5 mm.");
  await form.getByTestId("nc-proposed").getByRole("radio", { name: /Rework/ }).click();
  await form.getByTestId("raise-nc-submit").click();
  await expect(page.getByTestId("nc-1")).toContainText("Open");
  await expect(page.getByTestId("nc-1")).toContainText("You raised it: another lead or inspector dispositions it.");
  await expect(page.getByTestId("runner-state")).toHaveText(/On hold/);
  await expect(page.getByTestId("step-status")).toHaveText(/NC-1 open/);

  // Every control on the runner is at least 48 px tall (the pad's keys, the sign and navigation buttons).
  const small = await page.evaluate(() =>
    Array.from(document.querySelectorAll<HTMLElement>("[data-testid=runner] button, [data-testid=runner] label.btn"))
      .filter((el) => el.offsetParent !== null)
      .map((el) => ({ h: el.getBoundingClientRect().height, text: el.textContent?.trim().slice(0, 30) }))
      .filter((b) => b.h < 48),
  );
  expect(small).toEqual([]);
});
