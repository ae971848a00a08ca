// The runner on the shop floor: a tablet at 1024 × 768 with touch, on the shop's LAN name over HTTPS. The
// sign action of a caution, a measurement and a weld step is on screen without scrolling; a weld pass is
// typed and recorded without scrolling; at a hold point the welder hands the tablet to an inspector, who
// signs with their own PIN, and the tablet is the welder's again after that one sign-off.
import { request as playwrightRequest, type Browser, type Page } from "@playwright/test";
import pg from "pg";
import config from "../../playwright.config";
import { gmawWeldStep, insertPublishedProcedure, jobBody } from "../fixtures/jobs/procedure";
import { DEMO_PASSWORD, DEMO_PIN, expect, test } from "./support";

const BASE = process.env.GUSSET_TEST_URL ?? "http://127.0.0.1:3100";
const httpsUrl = new URL(process.env.GUSSET_TEST_HTTPS_URL ?? "https://shop-pc.test:3543");
const defaultArgs = config.use?.launchOptions?.args ?? [];
const TABLET = { viewport: { width: 1024, height: 768 }, hasTouch: true };

test.use({
  ...TABLET,
  // The shop's own certificate is not installed in this browser profile.
  ignoreHTTPSErrors: true,
  launchOptions: { executablePath: "/usr/bin/chromium", args: [...defaultArgs, `--host-resolver-rules=MAP ${httpsUrl.hostname} 127.0.0.1`] },
});

const FLOOR = {
  sections: [
    {
      key: "weld",
      title: "Weld the bracket",
      steps: [
        { key: "hot", kind: "caution", title: "Before hot work", instructions: "Extinguisher within reach.", signedBy: "welder", photos: { required: false, min: 0 }, hazards: ["ppe", "fire-watch"], acknowledgement: "I wear the PPE and keep a fire watch." },
        { key: "height", kind: "measure", title: "Bracket height", instructions: "From the tube's lower edge.", signedBy: "welder", photos: { required: false, min: 0 }, quantity: "length", nominal: 100, tolerance: { type: "plusMinus", plus: 1, minus: 1 } },
        gmawWeldStep({ key: "w-1", title: "Weld joint W1, bracket to tube", instructions: "Clean to bright metal 25 mm back; tack at the ends first." }),
      ],
    },
  ],
};
const HOLD = {
  sections: [
    { key: "fit", title: "Fit", steps: [{ key: "fit", kind: "check", title: "Bracket clamped square", instructions: "", signedBy: "welder", photos: { required: false, min: 0 } }] },
    {
      key: "gate",
      title: "Gate",
      steps: [
        { key: "hold", kind: "hold", title: "Fit-up inspected", instructions: "", signedBy: "inspector", photos: { required: false, min: 0 }, inspection: "Bracket square to the tube within 1 mm." },
        { key: "after", kind: "check", title: "Tack the bracket", instructions: "", signedBy: "welder", photos: { required: false, min: 0 } },
      ],
    },
  ],
};

let floorJob = "";
let holdJob = "";
const names = { welder: "", inspector: "" };

test.beforeAll(async () => {
  const client = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await client.connect();
  const floorVersion = await insertPublishedProcedure(client, { shopSlug: "iron-gully", ownerEmail: "lead@irongully.example", title: "Floor runner test", content: FLOOR });
  const holdVersion = await insertPublishedProcedure(client, { shopSlug: "iron-gully", ownerEmail: "lead@irongully.example", title: "Hand-over test", content: HOLD });
  const { rows } = await client.query<{ id: string; email: string; legal_name: string }>(
    `select u.id, u.email, m.legal_name from "user" u join membership m on m.user_id = u.id join shop s on s.id = m.shop_id
      where s.slug = 'iron-gully' and u.email in ('welder@irongully.example', 'inspector@irongully.example')`,
  );
  await client.end();
  const person = (email: string) => rows.find((r) => r.email === email)!;
  names.welder = person("welder@irongully.example").legal_name;
  names.inspector = person("inspector@irongully.example").legal_name;
  const ip = `10.81.${Math.floor(Math.random() * 250)}.${Math.floor(Math.random() * 250)}`;
  const api = await playwrightRequest.newContext({ baseURL: BASE, extraHTTPHeaders: { origin: BASE, "x-forwarded-for": ip } });
  expect((await api.post("/api/auth/sign-in/email", { data: { email: "lead@irongully.example", password: DEMO_PASSWORD } })).ok()).toBe(true);
  const make = async (versionId: string) => {
    const created = await api.post("/api/jobs", { data: jobBody(versionId, { welderIds: [person("welder@irongully.example").id], inspectorId: person("inspector@irongully.example").id }) });
    expect(created.status()).toBe(201);
    return ((await created.json()) as { job: { id: string } }).job.id;
  };
  floorJob = await make(floorVersion);
  holdJob = await make(holdVersion);
  await api.dispose();
});

async function tablet(browser: Browser, email: string): Promise<Page> {
  const context = await browser.newContext({ ...TABLET, ignoreHTTPSErrors: true, extraHTTPHeaders: { "x-forwarded-for": `10.82.${Math.floor(Math.random() * 250)}.${Math.floor(Math.random() * 250)}` } });
  const page = await context.newPage();
  await page.goto(`${httpsUrl.origin}/sign-in`);
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(DEMO_PASSWORD);
  await page.getByRole("button", { name: "Sign in" }).tap();
  await expect(page.getByTestId("account-menu")).toBeVisible();
  return page;
}

/** The element is wholly on screen at the page's top (nothing scrolled) and not under the step bar unless in it. */
async function onScreenUnscrolled(page: Page, testId: string) {
  expect(await page.evaluate(() => window.scrollY)).toBe(0);
  const box = await page.getByTestId(testId).boundingBox();
  const bar = await page.getByTestId("step-bar").boundingBox();
  expect(box).not.toBeNull();
  expect(box!.y).toBeGreaterThanOrEqual(0);
  expect(box!.y + box!.height).toBeLessThanOrEqual(768);
  const inBar = await page.getByTestId("step-bar").getByTestId(testId).count();
  if (!inBar) expect(box!.y + box!.height).toBeLessThanOrEqual(bar!.y);
}

async function pin(page: Page, dialogId: string, digits: string) {
  const dialog = page.getByTestId(dialogId);
  await expect(dialog).toBeVisible();
  for (const d of digits) await dialog.getByTestId("pin-pad").getByRole("button", { name: d, exact: true }).tap();
  await dialog.getByTestId("pin-submit").tap();
}

/** Taps a pad field and types on the pass form's pad; tapping must not scroll the page. */
async function padType(page: Page, fieldId: string, text: string) {
  await page.locator(`#${fieldId}`).tap();
  const pad = page.getByTestId("new-pass").getByTestId("number-pad");
  for (const ch of text) await pad.getByRole("button", { name: ch === "." ? "Decimal point" : ch, exact: true }).tap();
}

test("the sign action of a caution, a measurement and a weld step is on screen, and a pass is recorded, without scrolling", async ({ browser }, info) => {
  const page = await tablet(browser, "welder@irongully.example");
  await page.goto(`${httpsUrl.origin}/run/${floorJob}`);
  expect(await page.evaluate(() => window.isSecureContext)).toBe(true);

  // Caution: the sign button is on screen from the start; nothing claims "Saved" before anything is done.
  await expect(page.getByTestId("caution-banner")).toBeVisible();
  await onScreenUnscrolled(page, "sign-step");
  await expect(page.getByTestId("save-state")).toHaveCount(0);
  await page.getByTestId("hazard-ppe").tap();
  await page.getByTestId("hazard-fire-watch").tap();
  await expect(page.getByTestId("sign-step")).toBeEnabled();
  await page.evaluate(() => window.scrollTo({ top: 0 }));
  await page.getByTestId("sign-step").tap();
  await pin(page, "pin-dialog", DEMO_PIN);

  // Signing moves on to the measurement by itself.
  await expect(page.getByRole("heading", { name: /Bracket height/ })).toBeVisible();
  await expect(page.getByTestId("runner-progress")).toHaveText("1 of 3 signed");
  await onScreenUnscrolled(page, "sign-step");
  for (const ch of "100.2") await page.getByTestId("number-pad").getByRole("button", { name: ch === "." ? "Decimal point" : ch, exact: true }).tap();
  await expect(page.getByTestId("tolerance-verdict")).toHaveAttribute("data-verdict", "pass");
  await page.evaluate(() => window.scrollTo({ top: 0 }));
  await page.getByTestId("sign-step").tap();
  await pin(page, "pin-dialog", DEMO_PIN);

  // Weld step: the pass form first, the round's sign button in the bar.
  await expect(page.getByRole("heading", { name: /Weld joint W1/ })).toBeVisible();
  await onScreenUnscrolled(page, "sign-step");
  await expect(page.getByTestId("sign-step")).toHaveText("Sign round 1");
  await expect(page.getByTestId("governing-preheat")).toContainText("Preheat at least 10.0 °C from the procedure and the WPS");
  await padType(page, "pass-volts", "19");
  await padType(page, "pass-amps", "140");
  await padType(page, "pass-speed", "300");
  await padType(page, "pass-preheat", "20");
  await page.getByLabel(/Filler lot/).fill("L-7781");
  // 19 V × 140 A at 300 mm/min: 19 × 140 × 60 / 300 = 532 J/mm = 0.53 kJ/mm arc energy (ASME IX QW-409.1(a)),
  // beside GUS-GMAW-02's 1.2 kJ/mm arc-energy limit.
  await expect(page.getByTestId("heat-input")).toContainText("0.53 of 1.2 kJ/mm arc energy");
  await onScreenUnscrolled(page, "record-pass");
  await page.screenshot({ path: info.outputPath("weld-step-1024x768.png") });
  await page.getByTestId("record-pass").tap();
  await expect(page.getByTestId("round-1").getByTestId("pass-1")).toContainText("19 V · 140 A");
  expect(await page.evaluate(() => window.scrollY)).toBe(0);

  // The next pass at the same settings: one tap, and the filler lot stays the job's.
  await page.getByTestId("same-as-last").tap();
  await expect(page.locator("#pass-volts")).toHaveValue("19");
  await expect(page.locator("#pass-speed")).toHaveValue("300");
  await expect(page.getByLabel(/Filler lot/)).toHaveValue("L-7781");
  await page.setViewportSize({ width: 768, height: 1024 });
  await page.screenshot({ path: info.outputPath("weld-step-768x1024.png") });
  await page.setViewportSize({ width: 1024, height: 768 });

  await page.evaluate(() => window.scrollTo({ top: 0 }));
  await page.getByTestId("sign-step").tap();
  await pin(page, "pin-dialog", DEMO_PIN);
  await expect(page.getByTestId("step-status")).toHaveText(/Waiting for inspection/);

  // The inspector's view of the joint, for the record of how it looks on both orientations.
  const inspector = await tablet(browser, "inspector@irongully.example");
  await inspector.goto(`${httpsUrl.origin}/run/${floorJob}?step=w-1`);
  await expect(inspector.getByTestId("inspection-panel")).toBeVisible();
  await inspector.screenshot({ path: info.outputPath("inspection-1024x768.png") });
  await inspector.setViewportSize({ width: 768, height: 1024 });
  await inspector.screenshot({ path: info.outputPath("inspection-768x1024.png") });
});

test("an inspector signs a hold point on the welder's tablet with their own PIN, then the tablet is the welder's again", async ({ browser }) => {
  const page = await tablet(browser, "welder@irongully.example");
  await page.goto(`${httpsUrl.origin}/run/${holdJob}`);
  await page.getByTestId("check-confirm").tap();
  await page.getByTestId("sign-step").tap();
  await pin(page, "pin-dialog", DEMO_PIN);

  // At the hold point: waiting for inspection, said apart from "On hold".
  await expect(page.getByRole("heading", { name: /Fit-up inspected/ })).toBeVisible();
  await expect(page.getByTestId("runner-state")).toHaveText(/Waiting for inspection/);
  await expect(page.getByTestId("sign-step")).toHaveCount(0);
  await onScreenUnscrolled(page, "handover-start");
  await page.getByTestId("handover-start").tap();
  const picker = page.getByTestId("handover-picker");
  await expect(picker.getByTestId("handover-person").filter({ hasText: names.welder })).toHaveCount(0);
  await picker.getByTestId("handover-person").filter({ hasText: names.inspector }).tap();

  const dialog = page.getByTestId("handover-pin");
  await expect(dialog.getByTestId("sign-as-name")).toHaveText(names.inspector);
  await expect(dialog.getByTestId("sign-as-meaning")).toHaveText("Inspected");
  await expect(dialog.getByLabel(`${names.inspector}'s signing PIN`)).toBeVisible();
  // A wrong PIN is refused and nothing is signed.
  await pin(page, "handover-pin", "9999");
  await expect(dialog.getByTestId("pin-error")).toContainText("Wrong PIN");
  await pin(page, "handover-pin", DEMO_PIN);
  await expect(dialog).toBeHidden();

  // Signed under the inspector's name; the runner moves on, and the next sign-off is the welder's own.
  await expect(page.getByRole("heading", { name: /Tack the bracket/ })).toBeVisible();
  await expect(page.getByTestId("runner-progress")).toHaveText("2 of 3 signed");
  await expect(page.getByTestId("runner-state")).not.toHaveText(/Waiting for inspection/);
  await page.getByTestId("check-confirm").tap();
  await page.getByTestId("sign-step").tap();
  await expect(page.getByTestId("pin-dialog").getByTestId("sign-as-name")).toHaveText(names.welder);
  await page.getByTestId("pin-dialog").getByRole("button", { name: "Cancel" }).tap();
  await page.getByTestId("prev-step").tap();
  await expect(page.getByRole("heading", { name: /Fit-up inspected/ })).toBeVisible();
  await expect(page.getByTestId("bar-signed")).toBeVisible();
  await expect(page.getByText(names.inspector).first()).toBeVisible();
});
