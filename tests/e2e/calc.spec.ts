import { expect, signedInAs, test } from "./support";

// The steering calculator and the heat-input calculator in the browser. Expected figures are worked here
// from the layout (first-order parallel height, travel in mm) or quoted from REFERENCES.md, never read
// off the screen first.

test("every role reaches the calculators from the main navigation", async ({ page }) => {
  await signedInAs(page, "auditor@irongully.example");
  await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Calculators" }).click();
  await expect(page.getByRole("heading", { level: 1, name: "Calculators" })).toBeVisible();
  await page.getByTestId("calc-index").getByRole("link", { name: /Steering links/ }).click();
  await expect(page.getByRole("heading", { level: 1, name: "Steering links" })).toBeVisible();
  await expect(page.getByRole("note")).toContainText("never replace, the vehicle maker's specifications");
  await expect(page.getByTestId("calc-cautions")).toContainText("off the road");
});

test("steering links: a layout entered by hand ranks its holes and the diagram moves with the slider and the step buttons", async ({ page }) => {
  await signedInAs(page, "lead@irongully.example");
  await page.goto("/calc/steering");
  // The measuring guide is the default entry; this layout is given as coordinates.
  await page.getByTestId("steer-entry-coordinates").click();
  await page.getByRole("button", { name: "Clear" }).click();

  // An invented layout in mm. Drag link slope = (60 − 170) / (420 − (−430)) = −0.12941; the lateral link is
  // parallel to it (no first-order bump steer, DESIGN.md item 1) with its axle end at
  // z = 200 − 0.12941 × (450 − (−450)) = 83.5 mm on the line y = 450.
  const fill = async (id: string, value: string) => page.getByTestId(id).fill(value);
  await fill("st-frameEnd-y", "-450");
  await fill("st-frameEnd-z", "200");
  await fill("st-axleEnd-y", "450");
  await fill("st-axleEnd-z", "120");
  await fill("st-pitmanEnd-y", "-430");
  await fill("st-pitmanEnd-z", "170");
  await fill("st-knuckleEnd-y", "420");
  await fill("st-knuckleEnd-z", "60");
  await fill("st-steeringArmLength", "152.4");
  await fill("st-steeringRatio", "16");
  await fill("st-travel-bump", "100");
  await fill("st-travel-droop", "100");
  await fill("st-travel-step", "10");
  for (const [label, z] of [["HIGH", "120"], ["MATCH", "83.5"], ["LOW", "20"]] as const) {
    await page.getByRole("button", { name: "+ Add a hole" }).click();
    const i = await page.getByTestId("hole-editor").getByRole("group", { name: /^Hole \d+$/ }).count();
    await page.getByLabel(`Hole ${i} Label`).fill(label);
    await page.getByTestId(`st-holes-${i - 1}-z`).fill(z);
  }

  // Ranking: the parallel hole first, then the one 36.5 mm above it, then the one 63.5 mm below.
  await expect(page.getByTestId("best-hole")).toHaveText("MATCH");
  await expect(page.getByTestId("hole-row-1")).toContainText("MATCH");
  await expect(page.getByTestId("hole-row-2")).toContainText("HIGH");
  await expect(page.getByTestId("hole-row-3")).toContainText("LOW");
  await expect(page.getByTestId("parallel-height")).toContainText("83.5 mm");

  // The diagram is in mm (svg y = −z): the axle end sits at −120 at ride height and follows the travel.
  const axleEndY = async () => Number(await page.getByTestId("axle-end").getAttribute("cy"));
  await expect(page.getByTestId("pose-label")).toHaveText("ride height");
  await expect.poll(axleEndY).toBeCloseTo(-120, 6);
  const slider = page.getByTestId("steer-slider");
  await slider.focus();
  await page.keyboard.press("End");
  await expect(page.getByTestId("pose-label")).toHaveText("+100.0 mm bump");
  await expect.poll(axleEndY).toBeCloseTo(-220, 6);
  await expect(page.getByTestId("steering-diagram")).toHaveAttribute("data-at", "100");
  await page.getByTestId("steer-step-down").click();
  await expect(page.getByTestId("pose-label")).toHaveText("+90.0 mm bump");
  await expect.poll(axleEndY).toBeCloseTo(-210, 6);
  await slider.focus();
  await page.keyboard.press("Home");
  await expect(page.getByTestId("pose-label")).toHaveText("−100.0 mm droop");
  await expect.poll(axleEndY).toBeCloseTo(-20, 6);
  await expect(page.getByTestId("ride-ghost")).toBeVisible();
  await page.getByTestId("steer-home").click();
  await expect.poll(axleEndY).toBeCloseTo(-120, 6);
  await expect(page.getByTestId("ride-ghost")).toHaveCount(0);
  await expect(page.getByTestId("chart-heave").locator("svg.recharts-surface")).toBeVisible();

  // Inches: every length field is rewritten (−450 mm = −17.7165 in, NIST SP 811) and results follow.
  await page.getByTestId("steer-units-imperial").click();
  await expect(page.getByTestId("st-frameEnd-y")).toHaveValue("-17.7165");
  await expect(page.getByTestId("parallel-height")).toContainText(" in");
  await expect(page.getByTestId("best-hole")).toHaveText("MATCH");

  // A typo is named beside its field and in the list, and results wait for it.
  await page.getByTestId("st-knuckleEnd-z").fill("2..5");
  await expect(page.getByTestId("st-knuckleEnd-z-error")).not.toBeEmpty();
  await expect(page.getByTestId("steer-fix-list")).toContainText("Drag link, steering arm end z");
  await expect(page.getByTestId("hole-ranking")).toHaveCount(0);
});

test("steering links: an impossible layout says why instead of drawing", async ({ page }) => {
  await signedInAs(page, "welder@irongully.example");
  await page.goto("/calc/steering");
  // A vertical lateral link (same y at both ends) locates nothing sideways.
  await page.getByTestId("steer-entry-coordinates").click();
  await page.getByTestId("st-axleEnd-y").fill("-420");
  await expect(page.getByTestId("steer-impossible")).toContainText("vertical");
  await expect(page.getByTestId("steering-diagram")).toHaveCount(0);
});

test("heat input: REFERENCES worked example 24 V 180 A 8 in/min shows 32,400 J/in (ASME IX QW-409.1(a)), 1.276 kJ/mm arc energy and GMAW Q 1.020 kJ/mm (ISO/TR 17671-1)", async ({ page }) => {
  await signedInAs(page, "welder@irongully.example");
  await page.goto("/calc/heat-input");
  await expect(page.getByTestId("hi-j-per-in")).toHaveText("—");
  await page.getByTestId("hi-speed-unit-in/min").click();
  await page.getByTestId("hi-volts").fill("24");
  await page.getByTestId("hi-amps").fill("18");
  await page.getByTestId("hi-speed").fill("8");
  // Live as you type: 18 A first, then the last digit.
  await expect(page.getByTestId("hi-j-per-in")).toHaveText("3,240");
  await page.getByTestId("hi-amps").press("End");
  await page.getByTestId("hi-amps").pressSequentially("0");
  await expect(page.getByTestId("hi-j-per-in")).toHaveText("32,400");
  await expect(page.getByTestId("hi-arc-energy")).toHaveText("1.276");
  await expect(page.getByTestId("hi-q")).toHaveText("1.020");
  // The gauge says it in a word and a shape, not only a colour.
  await expect(page.getByTestId("heat-band")).toContainText("Moderate");
  await expect(page.getByTestId("heat-band")).toContainText("▲");
  // REFERENCES: GTAW Q = 0.765 kJ/mm (k 0.6).
  await page.getByTestId("hi-process").selectOption("GTAW");
  await expect(page.getByTestId("hi-q")).toHaveText("0.765");
  await expect(page.getByTestId("hi-j-per-in")).toHaveText("32,400");
  // A wrong entry is named next to its field; the figures wait for it.
  await page.getByTestId("hi-volts").fill("24 V?");
  await expect(page.getByTestId("hi-volts-error")).toContainText("must be a number");
  await expect(page.getByTestId("hi-j-per-in")).toHaveText("—");
});

test("the calculators open in the person's own units", async ({ page }) => {
  await signedInAs(page, "auditor@irongully.example");
  await page.goto("/account");
  const units = page.getByTestId("units-form");
  await units.getByLabel(/Imperial/).check();
  await units.getByRole("button", { name: "Save units" }).click();
  await expect(units).toContainText("Showing inches");
  try {
    await page.goto("/calc/steering");
    await expect(page.getByTestId("steer-units-imperial")).toContainText("●");
    await expect(page.getByTestId("st-floor-frameEnd-distance")).toHaveValue("16.5");
    await expect(page.getByTestId("worst-heave")).toBeVisible();
    await page.goto("/calc/heat-input");
    await expect(page.getByTestId("hi-speed-unit-in/min")).toContainText("●");
  } finally {
    await page.goto("/account");
    await page.getByTestId("units-form").getByLabel(/Metric/).check();
    await page.getByTestId("units-form").getByRole("button", { name: "Save units" }).click();
    await expect(page.getByTestId("units-form")).toContainText("Showing millimetres");
  }
});
