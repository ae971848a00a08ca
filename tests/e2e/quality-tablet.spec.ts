import fs from "node:fs";
import { expect, signedInAs, test } from "./support";

// The Quality screen on a tablet, landscape (1024 × 768) and portrait (768 × 1024), by touch: the charts load,
// each has its table and CSV, nothing scrolls sideways and every control is at least 48 px high.
const shots = `.data/screenshots-${process.env.TEST_APP_PORT ?? "3100"}`;

for (const viewport of [{ width: 1024, height: 768 }, { width: 768, height: 1024 }]) {
  test(`quality screen at ${viewport.width} × ${viewport.height}`, async ({ page }) => {
    fs.mkdirSync(shots, { recursive: true });
    await page.setViewportSize(viewport);
    await signedInAs(page, "lead@irongully.example");
    await page.goto("/home/lead");
    await expect(page.getByTestId("tile-fpy")).toContainText("joints");
    await page.getByTestId("tile-fpy").tap();
    await expect(page).toHaveURL(/\/quality/);
    await expect(page.getByRole("heading", { name: "Quality", level: 1 })).toBeVisible();

    // Charts arrive after the page (loaded on demand); their numbers are in the tables beside them.
    await expect(page.getByTestId("yield-welder-chart").locator("svg").first()).toBeVisible();
    await expect(page.getByTestId("defects-table")).toContainText("Undercut");
    await expect(page.getByTestId("defects-chart").locator("svg").first()).toBeVisible();
    const heat = page.locator("[data-testid^='heat-chart-']").first();
    await expect(heat.locator("svg").first()).toBeVisible();
    await expect(heat.locator("[data-mark]").first()).toBeAttached();
    await expect(page.getByTestId("section-heat")).toContainText("2.66 × average moving range");
    await expect(page.getByTestId("fpy-counts")).toHaveText(/\d+ of \d+ joints accepted first time/);
    for (const id of ["yield", "defects", "heat", "nc", "wait", "jobs", "quals"]) {
      await expect(page.getByTestId(`csv-${id}`)).toHaveAttribute("href", /^data:text\/csv/);
    }

    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow, "scrolls sideways").toBeLessThanOrEqual(0);
    const small = await page.evaluate(() =>
      [...document.querySelectorAll("main form button, main form input, main form select, main form a, main a.btn")]
        .map((el) => ({ el, box: el.getBoundingClientRect() }))
        .filter(({ box }) => box.width > 0 && box.height > 0 && box.height < 48)
        .map(({ el, box }) => `${el.tagName} ${(el.textContent || el.getAttribute("name") || "").trim().slice(0, 30)} ${Math.round(box.height)}px`),
    );
    expect(small, "controls under 48 px").toEqual([]);
    await page.screenshot({ path: `${shots}/quality-${viewport.width}x${viewport.height}.png`, fullPage: true });

    // A filter by touch: a range before any work shows empty figures, not an error.
    await page.getByLabel("From").fill("2001-01-01");
    await page.getByLabel("To").fill("2001-12-31");
    await page.getByRole("button", { name: "Show" }).tap();
    await expect(page.getByTestId("fpy-counts")).toHaveText("0 of 0 joints accepted first time");
    // A backwards range is named at its field.
    await page.goto("/quality?from=2026-03-01&to=2026-01-01");
    await expect(page.getByTestId("error-to")).toHaveText("The end date is before the start date.");
  });
}
