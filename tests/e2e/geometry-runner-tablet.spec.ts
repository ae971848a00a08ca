// A job's geometry steps on a tablet (1024 × 768, touch): the welder measures the steering-link joints with the
// measuring guide (heights from the floor, distances from the centre line, right-hand drive, mm and inches with
// fractions), signs the before and the after step, and the lead sees both side by side on the job page.
import { request as playwrightRequest, type Page } from "@playwright/test";
import pg from "pg";
import { computeSteeringGeometry, type SteeringInput } from "../../lib/geometry";
import { insertPublishedProcedure, jobBody } from "../fixtures/jobs/procedure";
import { DEMO_PASSWORD, DEMO_PIN, expect, signedInAs, test } from "./support";

const BASE = process.env.GUSSET_TEST_URL ?? "http://127.0.0.1:3100";

const PROCEDURE = {
  sections: [
    {
      key: "geo",
      title: "Steering geometry",
      steps: [
        { key: "g-before", kind: "geometry", title: "Geometry before", instructions: "Vehicle at ride height.", signedBy: "welder", photos: { required: false, min: 0 }, capture: "before" },
        { key: "g-after", kind: "geometry", title: "Geometry after", instructions: "New bracket fitted.", signedBy: "welder", photos: { required: false, min: 0 }, capture: "after" },
      ],
    },
  ],
};

type Entry = { height: string; distance: string; side: "driver" | "passenger" };
// An invented vehicle, right-hand drive: seen from ahead the driver's side is on the drawing's left (−y).
// Inches are 25.4 mm exactly (the international inch): 23 5/8" = 600.075 mm, 16 1/2 in = 419.1 mm, 18-1/2" = 469.9 mm.
const BEFORE: Record<string, Entry> = {
  frameEnd: { height: `23 5/8"`, distance: "16 1/2 in", side: "driver" },
  axleEnd: { height: "480", distance: "480", side: "passenger" },
  pitmanEnd: { height: "570 mm", distance: "400", side: "driver" },
  knuckleEnd: { height: `18-1/2"`, distance: "440", side: "passenger" },
  axleCenter: { height: "420", distance: "0", side: "driver" },
};
// The same coordinates worked by hand: y = ± distance (driver's side −, right-hand drive), z = height, in mm.
const beforeInput = (axleEndZ = 480): SteeringInput => ({
  trackBar: { frameEnd: { y: -419.1, z: 600.075 }, axleEnd: { y: 480, z: axleEndZ } },
  dragLink: { pitmanEnd: { y: -400, z: 570 }, knuckleEnd: { y: 440, z: 469.9 } },
  axleCenter: { y: 0, z: 420 },
  steeringArmLength: 160,
  steeringRatio: 16,
  travel: { bump: 100, droop: 100, step: 5 },
});
// After the work the new axle bracket puts the lateral link's axle end 60 mm higher.
const AFTER: Record<string, Entry> = { ...BEFORE, axleEnd: { height: "540", distance: "480", side: "passenger" } };

let jobId = "";

test.beforeAll(async () => {
  const client = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await client.connect();
  const versionId = await insertPublishedProcedure(client, { shopSlug: "iron-gully", ownerEmail: "lead@irongully.example", title: "Geometry runner procedure", content: PROCEDURE });
  const { rows } = await client.query<{ id: string }>(`select id from "user" where email = 'welder@irongully.example'`);
  await client.end();
  const ip = `10.78.${Math.floor(Math.random() * 250)}.${Math.floor(Math.random() * 250)}`;
  const api = await playwrightRequest.newContext({ baseURL: BASE, extraHTTPHeaders: { origin: BASE, "x-forwarded-for": ip } });
  expect((await api.post("/api/auth/sign-in/email", { data: { email: "lead@irongully.example", password: DEMO_PASSWORD } })).ok()).toBe(true);
  const created = await api.post("/api/jobs", { data: jobBody(versionId, { welderIds: [rows[0]!.id], customerName: "Geometry Test Yard" }) });
  expect(created.status()).toBe(201);
  jobId = (await created.json()).job.id;
  await api.dispose();
});

async function measure(page: Page, entries: Record<string, Entry>) {
  await page.getByTestId("steer-drive-rhd").tap();
  for (const key of ["frameEnd", "axleEnd", "pitmanEnd", "knuckleEnd", "axleCenter"]) {
    await expect(page.getByTestId(`guide-drawing-${key}`)).toBeVisible();
    const e = entries[key]!;
    await page.getByTestId(`st-floor-${key}-height`).fill(e.height);
    await page.getByTestId(`st-floor-${key}-distance`).fill(e.distance);
    await page.getByTestId(`st-floor-${key}-side-${e.side}`).tap();
    if (key !== "axleCenter") await page.getByTestId("guide-next").tap();
  }
  await page.getByTestId("st-steeringArmLength").fill("160");
  await page.getByTestId("st-steeringRatio").fill("16");
  await page.getByTestId("st-travel-bump").fill("100");
  await page.getByTestId("st-travel-droop").fill("100 mm");
}

async function signWithPin(page: Page, signedAfter: number) {
  await expect(page.getByTestId("save-state")).toHaveText(/Saved/);
  await page.getByTestId("sign-step").tap();
  const dialog = page.getByTestId("pin-dialog");
  await expect(dialog).toBeVisible();
  for (const d of DEMO_PIN) await dialog.getByTestId("pin-pad").getByRole("button", { name: d, exact: true }).tap();
  await dialog.getByTestId("pin-submit").tap();
  await expect(dialog).toBeHidden();
  await expect(page.getByTestId("runner-progress")).toHaveText(`${signedAfter} of 2 signed`);
}

const steer = (input: SteeringInput) => computeSteeringGeometry(input).worst.heave;

test("a welder captures before and after from floor measurements and signs them; the lead sees both on the job page", async ({ page, browser }) => {
  test.setTimeout(180_000);
  await signedInAs(page, "welder@irongully.example");
  await page.goto(`/run/${jobId}`);
  await expect(page.getByRole("heading", { name: /Geometry before/ })).toBeVisible();

  // The guide is what the step opens with; a joint below the floor is refused on its field, with a reason.
  await expect(page.getByTestId("measure-guide")).toBeVisible();
  await page.getByTestId("st-floor-frameEnd-height").fill("-20");
  await expect(page.getByTestId("st-floor-frameEnd-height-error")).toContainText("below the floor");
  await expect(page.getByTestId("sign-step")).toBeDisabled();

  await measure(page, BEFORE);
  const before = steer(beforeInput());
  await expect(page.getByTestId("geometry-results")).toContainText(`Worst bump steer ${before.wheelSteerDeg.toFixed(2)}°`);
  await expect(page.getByTestId("geometry-results")).toContainText(`Steering wheel ${(before.wheelSteerDeg * 16).toFixed(1)}°`);

  // A joint typed on the wrong side makes the lateral link stay on one side of the vehicle: said, not refused.
  await page.getByTestId("guide-back").tap();
  await page.getByTestId("guide-back").tap();
  await page.getByTestId("guide-back").tap();
  await page.getByTestId("guide-back").tap();
  await page.getByTestId("st-floor-frameEnd-side-passenger").tap();
  await expect(page.getByTestId("geometry-plausibility")).toContainText("same side of the centre line");
  await page.getByTestId("st-floor-frameEnd-side-driver").tap();
  await expect(page.getByTestId("geometry-plausibility")).toHaveCount(0);

  // Every control of the capture is big enough for a gloved finger.
  const small = await page.evaluate(() =>
    [...document.querySelectorAll("[data-testid=geometry-capture] :is(button, input:not([type=radio]), label:has(> input[type=radio]))")]
      .map((el) => ({ el, box: el.getBoundingClientRect() }))
      .filter(({ box }) => box.width > 0 && box.height > 0 && box.height < 48)
      .map(({ el, box }) => `${el.tagName} ${(el.textContent || el.getAttribute("data-testid") || "").trim().slice(0, 30)} ${Math.round(box.height)}px`),
  );
  expect(small).toEqual([]);
  expect(await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth)).toBeLessThanOrEqual(0);
  await page.getByTestId("geometry-capture").screenshot({ path: `.data/screens-${process.env.TEST_APP_PORT ?? "3100"}/runner-geometry.png` });
  await signWithPin(page, 1);

  // Stored as front-view coordinates from the floor and the centre line, as every geometry value is.
  const db = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await db.connect();
  try {
    const { rows } = await db.query<{ value: { before: { input: SteeringInput; unit: string; drive?: string } } }>(
      `select value from job_step where job_id = $1 and step_key = 'g-before'`,
      [jobId],
    );
    const stored = rows[0]!.value.before;
    const want = beforeInput();
    expect(stored.drive).toBe("rhd");
    for (const [got, exp] of [
      [stored.input.trackBar.frameEnd, want.trackBar.frameEnd],
      [stored.input.trackBar.axleEnd, want.trackBar.axleEnd],
      [stored.input.dragLink.pitmanEnd, want.dragLink.pitmanEnd],
      [stored.input.dragLink.knuckleEnd, want.dragLink.knuckleEnd],
      [stored.input.axleCenter, want.axleCenter],
    ] as const) {
      expect(got.y).toBeCloseTo(exp.y, 6);
      expect(got.z).toBeCloseTo(exp.z, 6);
    }
  } finally {
    await db.end();
  }

  // The runner has moved on to the after step; back on the before step, the signed step shows the joints as
  // measured, sides by word.
  await expect(page.getByRole("heading", { name: /Geometry after/ })).toBeVisible();
  await page.getByTestId("prev-step").tap();
  await expect(page.getByTestId("step-status")).toHaveText(/Signed/);
  await expect(page.getByTestId("geometry-summary")).toContainText("driver's side");
  await page.getByTestId("next-step").tap();

  await expect(page.getByRole("heading", { name: /Geometry after/ })).toBeVisible();
  await measure(page, AFTER);
  const after = steer(beforeInput(540));
  await expect(page.getByTestId("geometry-results")).toContainText(`Worst bump steer ${after.wheelSteerDeg.toFixed(2)}°`);
  await signWithPin(page, 2);
  await expect(page.getByTestId("step-status")).toHaveText(/Signed/);

  // The lead's view of the job: before and after side by side, one chart, and the road-test note.
  const lead = await browser.newContext({ viewport: { width: 1024, height: 768 }, hasTouch: true });
  const leadPage = await lead.newPage();
  try {
    await signedInAs(leadPage, "lead@irongully.example");
    await leadPage.goto(`/jobs/${jobId}?tab=measurements`);
    const table = leadPage.getByTestId("geometry-table");
    await expect(table).toContainText("Before · Geometry before");
    await expect(table).toContainText("After · Geometry after");
    await expect(leadPage.getByTestId("geo-before-lateral-axle-end")).toContainText("480");
    await expect(leadPage.getByTestId("geo-after-lateral-axle-end")).toContainText("540");
    await expect(leadPage.getByTestId("geo-before-worst")).toContainText(`${before.wheelSteerDeg.toFixed(2)}°`);
    await expect(leadPage.getByTestId("geo-after-worst")).toContainText(`${after.wheelSteerDeg.toFixed(2)}°`);
    await expect(leadPage.getByTestId("geo-before-wheel")).toHaveText(`${(before.wheelSteerDeg * 16).toFixed(1)}°`);
    await expect(leadPage.getByTestId("geo-after-wheel")).toHaveText(`${(after.wheelSteerDeg * 16).toFixed(1)}°`);
    await expect(leadPage.getByTestId("geometry-chart")).toHaveAttribute("aria-label", /before and after/);
    await expect(leadPage.getByTestId("road-test-note")).toContainText(
      `at most ${Math.abs(after.wheelSteerDeg * 16).toFixed(1)}° at the steering wheel over −100 to +100 mm of travel, against ${Math.abs(before.wheelSteerDeg * 16).toFixed(1)}° at the steering wheel before the work`,
    );
    await expect(leadPage.getByRole("note").first()).toBeVisible();
  } finally {
    await lead.close();
  }
});
