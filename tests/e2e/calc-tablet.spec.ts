import { expect, signedInAs, test } from "./support";

// Tablet (1024 × 768, touch): the calculators fit the width and every control is at least 44 px high
// (a radio or checkbox counts by its label, which is what a finger presses).
test("steering and heat input fit a tablet and their controls are big enough to tap", async ({ page }) => {
  await signedInAs(page, "welder@irongully.example");
  for (const path of ["/calc/steering", "/calc/heat-input", "/calc/fillet-weld", "/calc/coating", "/calc/dft", "/calc/units"]) {
    await page.goto(path);
    await expect(page.getByRole("note")).toBeVisible();
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow, `${path} scrolls sideways`).toBeLessThanOrEqual(0);
    const small = await page.evaluate(() =>
      [...document.querySelectorAll("main button, main input:not([type=radio]):not([type=checkbox]), main select, main label:has(> input[type=radio]), main label:has(> input[type=checkbox])")]
        .map((el) => ({ el, box: el.getBoundingClientRect() }))
        .filter(({ box }) => box.width > 0 && box.height > 0 && box.height < 44)
        .map(({ el, box }) => `${el.tagName} ${(el.textContent || el.getAttribute("data-testid") || "").trim().slice(0, 30)} ${Math.round(box.height)}px`),
    );
    expect(small, `${path}: controls under 44 px`).toEqual([]);
  }
  await page.goto("/calc/steering");
  await page.getByTestId("steer-step-up").tap();
  await expect(page.getByTestId("pose-label")).toHaveText("+5.0 mm bump");
  await page.getByTestId("steer-mode-roll").tap();
  await page.getByTestId("steer-step-up").tap();
  await expect(page.getByTestId("pose-label")).toHaveText("+0.5° roll");
});
