// The weld map on tablets (1024 × 768, touch) reaching the shop computer by its LAN name over HTTPS: a lead
// places two joints on a drawing by tapping, no dragging; the welder's runner shows the map with the current
// joint marked; the inspector's form shows it with the joint waiting for inspection. States are words and
// shapes on screen, not colours alone.
import { request as playwrightRequest, type APIRequestContext, type Browser, type Page } from "@playwright/test";
import pg from "pg";
import config from "../../playwright.config";
import { gmawWeldStep, jobBody } from "../fixtures/jobs/procedure";
import { DEMO_PASSWORD, DEMO_PIN, expect, test } from "./support";

const BASE = process.env.GUSSET_TEST_URL ?? "http://127.0.0.1:3100";
const httpsUrl = new URL(process.env.GUSSET_TEST_HTTPS_URL ?? "https://shop-pc.test:3543");
const defaultArgs = config.use?.launchOptions?.args ?? [];
const TABLET = { viewport: { width: 1024, height: 768 }, hasTouch: true, isMobile: false };

test.use({
  ...TABLET,
  // The certificate is the shop's own and not installed in this browser profile.
  ignoreHTTPSErrors: true,
  launchOptions: { executablePath: "/usr/bin/chromium", args: [...defaultArgs, `--host-resolver-rules=MAP ${httpsUrl.hostname} 127.0.0.1`] },
});

const title = `Weld map tablet test ${Date.now()}`;
const PROCEDURE_FILE = {
  format: "gusset-procedure",
  formatVersion: 1,
  procedure: { title, scope: "Bracket to tube, both toes.", code: "" },
  content: {
    sections: [
      {
        key: "weld",
        title: "Weld the bracket",
        steps: [
          { key: "hot", kind: "caution", title: "Before hot work", instructions: "Extinguisher within reach.", signedBy: "welder", hazards: ["ppe", "fire-watch"], acknowledgement: "I wear the PPE and keep a fire watch." },
          gmawWeldStep({ key: "w1", title: "Weld joint W1, front toe", jointId: "W1" }),
          gmawWeldStep({ key: "w2", title: "Weld joint W2, rear toe", jointId: "W2" }),
        ],
      },
    ],
  },
};

let procedureId = "";
let people: Record<string, string> = {};

async function apiAs(email: string): Promise<APIRequestContext> {
  const ip = `10.81.${Math.floor(Math.random() * 250)}.${Math.floor(Math.random() * 250)}`;
  const api = await playwrightRequest.newContext({ baseURL: BASE, extraHTTPHeaders: { origin: BASE, "x-forwarded-for": ip } });
  const signIn = await api.post("/api/auth/sign-in/email", { data: { email, password: DEMO_PASSWORD } });
  expect(signIn.ok()).toBe(true);
  return api;
}

test.beforeAll(async () => {
  const lead = await apiAs("lead@irongully.example");
  const imported = await lead.post("/api/procedures/import", { data: PROCEDURE_FILE });
  expect(imported.status(), await imported.text()).toBe(201);
  procedureId = (await imported.json()).procedure.id;
  await lead.dispose();
  const client = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await client.connect();
  const { rows } = await client.query<{ id: string; email: string }>(`select id, email from "user" where email in ('welder@irongully.example', 'inspector@irongully.example')`);
  await client.end();
  people = Object.fromEntries(rows.map((r) => [r.email, r.id]));
});

async function tablet(browser: Browser, email: string, viewport = TABLET.viewport): Promise<Page> {
  const context = await browser.newContext({ ...TABLET, viewport, ignoreHTTPSErrors: true });
  const page = await context.newPage();
  await page.goto(`${httpsUrl.origin}/sign-in`);
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(DEMO_PASSWORD);
  await page.getByRole("button", { name: "Sign in" }).tap();
  await expect(page.getByTestId("account-menu")).toBeVisible();
  return page;
}

async function enterPin(page: Page) {
  const dialog = page.getByTestId("pin-dialog");
  await expect(dialog).toBeVisible();
  for (const d of DEMO_PIN) await dialog.getByTestId("pin-pad").getByRole("button", { name: d, exact: true }).tap();
  await dialog.getByTestId("pin-submit").tap();
  // Signing a round checks the passes and seals them: allow for a busy shop computer.
  await expect(dialog).toBeHidden({ timeout: 30_000 });
}

async function padType(page: Page, fieldId: string, text: string) {
  await page.locator(`#${fieldId}`).tap();
  const pad = page.getByTestId("new-pass").getByTestId("number-pad");
  await pad.getByRole("button", { name: "Clear", exact: true }).first().tap();
  for (const ch of text) await pad.getByRole("button", { name: ch === "." ? "Decimal point" : ch, exact: true }).tap();
}

test("a lead places two joints by tapping; the welder's runner and the inspector's form show them", async ({ browser }, info) => {
  test.setTimeout(180_000);
  // --- Lead: a drawing on the draft, then W1 and W2 by tapping ---
  const lead = await tablet(browser, "lead@irongully.example");
  await lead.goto(`${httpsUrl.origin}/procedures/${procedureId}/versions/1`);
  await expect(lead.getByTestId("version-weld-map")).toContainText("No joint is placed on a picture of the part yet.");
  await lead.getByTestId("edit-weld-map").tap();
  await expect(lead.getByRole("heading", { level: 1 })).toContainText("Weld map of");
  await lead.getByTestId("weld-map-draw").tap();
  const image = lead.getByTestId("weld-map-edit-image-1");
  await expect(image).toBeVisible();
  await expect(lead.getByTestId("place-W1")).toHaveAttribute("aria-pressed", "true");
  await expect(lead.getByTestId("place-W1")).toContainText("not placed");
  const box = (await image.boundingBox())!;
  await image.tap({ position: { x: box.width * 0.3, y: box.height * 0.6 } });
  await expect(lead.getByTestId("place-W1")).toContainText("placed");
  // The next joint not yet placed is chosen for the next tap.
  await expect(lead.getByTestId("place-W2")).toHaveAttribute("aria-pressed", "true");
  await image.tap({ position: { x: box.width * 0.7, y: box.height * 0.6 } });
  await expect(lead.getByText("Every joint is placed.")).toBeVisible();
  for (const id of ["W1", "W2"]) await expect(lead.getByTestId(`weld-map-edit-joint-${id}`)).toContainText(`${id}not started`);
  for (const b of ["place-W1", "place-W2", "weld-map-save", "weld-map-draw"]) expect((await lead.getByTestId(b).boundingBox())!.height, b).toBeGreaterThanOrEqual(48);
  await lead.getByTestId("weld-map-save").tap();
  await expect(lead.getByTestId("weld-map-message")).toHaveText("✓ Saved.");
  await lead.screenshot({ path: info.outputPath("weld-map-lead-1024x768.png"), fullPage: true });
  await lead.setViewportSize({ width: 768, height: 1024 });
  await lead.reload();
  await expect(lead.getByTestId("weld-map-edit-joint-W2")).toBeVisible();
  await lead.screenshot({ path: info.outputPath("weld-map-lead-768x1024.png"), fullPage: true });

  // What was stored is where the taps landed, as shares of the image.
  const api = await apiAs("lead@irongully.example");
  const version = (await (await api.get(`/api/procedures/${procedureId}/versions/1`)).json()).version;
  const joints = version.content.weldMap.joints as { jointId: string; x: number; y: number }[];
  expect(joints.map((j) => j.jointId).sort()).toEqual(["W1", "W2"]);
  const w1 = joints.find((j) => j.jointId === "W1")!;
  const w2 = joints.find((j) => j.jointId === "W2")!;
  expect(w1.x).toBeCloseTo(0.3, 1);
  expect(w1.y).toBeCloseTo(0.6, 1);
  expect(w2.x).toBeCloseTo(0.7, 1);
  const published = await api.post(`/api/procedures/${procedureId}/versions/1/publish`, { data: { changeNote: "Joints placed on the drawing." } });
  expect(published.status(), await published.text()).toBe(200);
  const created = await api.post("/api/jobs", {
    data: jobBody(version.id, { welderIds: [people["welder@irongully.example"]], inspectorId: people["inspector@irongully.example"], customerName: "Weld Map Station" }),
  });
  expect(created.status(), await created.text()).toBe(201);
  const jobId = (await created.json()).job.id as string;
  await api.dispose();

  // --- Welder: the caution first, then the weld step shows the map, this step's joint marked ---
  const welder = await tablet(browser, "welder@irongully.example");
  await welder.goto(`${httpsUrl.origin}/run/${jobId}?step=hot`);
  await welder.getByTestId("hazard-ppe").tap();
  await welder.getByTestId("hazard-fire-watch").tap();
  await expect(welder.getByTestId("save-state")).toHaveText(/Saved/);
  await welder.getByTestId("sign-step").tap();
  await enterPin(welder);
  // Signed, and the runner moves on to the next step by itself.
  await expect(welder.getByTestId("runner-progress")).toHaveText(/^1 of \d+ signed$/);
  await welder.goto(`${httpsUrl.origin}/run/${jobId}?step=w1`);
  const map = welder.getByTestId("runner-weld-map");
  await expect(map).toBeVisible();
  await expect(welder.getByRole("region", { name: "Where W1 is" })).toBeVisible();
  await expect(map.getByRole("img", { name: /Weld map/ })).toBeVisible();
  await expect(map.getByTestId("runner-weld-map-joint-W1")).toContainText("W1welding(this step)");
  await expect(map.getByTestId("runner-weld-map-joint-W2")).toContainText("W2welding");
  await expect(map.getByTestId("runner-weld-map-joint-W2")).not.toContainText("this step");
  await welder.screenshot({ path: info.outputPath("weld-map-runner-1024x768.png"), fullPage: true });
  await welder.setViewportSize({ width: 768, height: 1024 });
  await welder.screenshot({ path: info.outputPath("weld-map-runner-768x1024.png"), fullPage: true });
  await welder.setViewportSize(TABLET.viewport);

  // One pass inside GUS-GMAW-02, signed: W1 now waits for inspection.
  await padType(welder, "pass-volts", "19");
  await padType(welder, "pass-amps", "140");
  await padType(welder, "pass-speed", "300");
  await padType(welder, "pass-preheat", "20");
  await welder.getByLabel(/Filler lot/).fill("L-5521");
  await welder.getByTestId("record-pass").tap();
  await expect(welder.getByTestId("round-1").getByTestId("pass-1")).toBeVisible();
  await welder.getByTestId("sign-step").tap();
  await enterPin(welder);
  // The runner moves on to W2, whose map shows W1 waiting; back on W1 the step says so too.
  await expect(map.getByTestId("runner-weld-map-joint-W1")).toContainText("◆W1waiting for inspection");
  await expect(map.getByTestId("runner-weld-map-joint-W2")).toContainText("(this step)");
  await welder.goto(`${httpsUrl.origin}/run/${jobId}?step=w1`);
  await expect(welder.getByTestId("step-status")).toHaveText(/Waiting for inspection/);
  await expect(map.getByTestId("runner-weld-map-joint-W1")).toContainText("◆W1waiting for inspection(this step)");

  // --- Inspector: the form shows where the joint is ---
  const inspector = await tablet(browser, "inspector@irongully.example");
  await inspector.goto(`${httpsUrl.origin}/run/${jobId}?step=w1`);
  const panel = inspector.getByTestId("inspection-panel");
  await expect(panel).toContainText("Visual inspection of W1");
  const form = panel.getByTestId("inspection-weld-map");
  await expect(form).toBeVisible();
  await expect(form.getByTestId("inspection-weld-map-joint-W1")).toContainText("◆W1waiting for inspection(this step)");
  await expect(form.getByTestId("inspection-weld-map-joint-W2")).toContainText("●W2welding");
  await inspector.screenshot({ path: info.outputPath("weld-map-inspector-1024x768.png"), fullPage: true });
  await inspector.setViewportSize({ width: 768, height: 1024 });
  await inspector.screenshot({ path: info.outputPath("weld-map-inspector-768x1024.png"), fullPage: true });
});
