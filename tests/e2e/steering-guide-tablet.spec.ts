import type { Page } from "@playwright/test";
import { expect, signedInAs, test } from "./support";

// The measuring guide on a tablet (1024 × 768, landscape): joints entered as heights from the floor and
// distances from the centre line rank the holes exactly as the same joints entered as coordinates do. The
// coordinates use the axle centre as datum; the floor entries put the axle centre 420 mm up, so every height is
// its z + 420 mm, and right-hand drive puts the driver's side at −y (front view seen from ahead).

const AXLE_UP = 420;
// [key, y, z] in mm, invented. The knuckle end is typed in inches below: 18-1/2" = 469.9 mm → z 49.9.
const POINTS = [
  ["frameEnd", -419.1, 180],
  ["axleEnd", 480, 60],
  ["pitmanEnd", -400, 150],
  ["knuckleEnd", 440, 49.9],
  ["axleCenter", 0, 0],
] as const;
const HOLES = [60, 85, 110, 135];

async function rankingOf(page: Page) {
  const rows: string[] = [];
  for (let i = 1; i <= HOLES.length; i++) {
    rows.push(`${await page.getByTestId(`hole-label-${i}`).innerText()} ${await page.getByTestId(`hole-steer-${i}`).innerText()}`);
  }
  return { rows, best: await page.getByTestId("optimum-steer").innerText() };
}

/** Neither the page nor the ranking table scrolls sideways; a screenshot of the two is kept to look at. */
async function noSidewaysScroll(page: Page, name: string) {
  expect(await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth), `${name}: page`).toBeLessThanOrEqual(0);
  const table = await page.getByTestId("hole-ranking").evaluate((t) => {
    const box = t.parentElement!;
    return { over: box.scrollWidth - box.clientWidth, tableRight: t.getBoundingClientRect().right, boxRight: box.getBoundingClientRect().right };
  });
  expect(table.over, `${name}: ranking table`).toBeLessThanOrEqual(0);
  expect(table.tableRight, `${name}: ranking table inside its card`).toBeLessThanOrEqual(table.boxRight + 0.5);
  // The drawing is the larger part of the row, not a thumbnail.
  expect((await page.getByTestId("steering-diagram").boundingBox())!.width, `${name}: drawing width`).toBeGreaterThanOrEqual(380);
  await page.getByTestId("steer-side-by-side").screenshot({ path: `.data/screens-${process.env.TEST_APP_PORT ?? "3100"}/steering-${name}.png` });
}

async function common(page: Page) {
  await page.getByTestId("st-steeringArmLength").fill("160");
  await page.getByTestId("st-steeringRatio").fill("16");
  await page.getByTestId("st-travel-bump").fill("100");
  await page.getByTestId("st-travel-droop").fill("100");
  await page.getByTestId("st-travel-step").fill("5");
  for (const [i] of HOLES.entries()) {
    await page.getByRole("button", { name: "+ Add a hole" }).tap();
    await expect(page.getByTestId(`st-holes-${i}-z`)).toBeVisible();
  }
}

test("floor heights and centre-line distances rank the holes as the same joints as coordinates; drawing and ranking side by side", async ({ page }) => {
  test.setTimeout(240_000);
  await signedInAs(page, "lead@irongully.example");
  await page.goto("/calc/steering");

  // The page opens on the measuring guide, with an example measured from the floor.
  await expect(page.getByTestId("measure-guide")).toBeVisible();
  await expect(page.getByTestId("steer-entry-floor")).toContainText("●");

  // 1. As coordinates.
  await page.getByTestId("steer-entry-coordinates").tap();
  await page.getByRole("button", { name: "Clear" }).tap();
  for (const [key, y, z] of POINTS) {
    await page.getByTestId(`st-${key}-y`).fill(String(y));
    await page.getByTestId(`st-${key}-z`).fill(String(z));
  }
  await common(page);
  for (const [i, z] of HOLES.entries()) {
    await page.getByTestId(`st-holes-${i}-y`).fill("480");
    await page.getByTestId(`st-holes-${i}-z`).fill(String(z));
  }
  await expect(page.getByTestId("hole-ranking")).toBeVisible();
  const asCoordinates = await rankingOf(page);

  // 2. The same vehicle through the measuring guide, mixing mm and inches with fractions.
  await page.getByRole("button", { name: "Clear" }).tap();
  await page.getByTestId("steer-entry-floor").tap();
  await page.getByTestId("steer-drive-rhd").tap();
  const titles = ["Lateral link, frame end", "Lateral link, axle end", "Drag link, pitman arm end", "Drag link, steering arm end", "Axle roll centre"];
  for (const [i, [key, y, z]] of POINTS.entries()) {
    await expect(page.getByTestId("guide-title")).toHaveText(titles[i]!);
    await expect(page.getByTestId(`guide-drawing-${key}`)).toBeVisible();
    const height = key === "knuckleEnd" ? `18-1/2"` : key === "frameEnd" ? `${z + AXLE_UP} mm` : String(z + AXLE_UP);
    const across = key === "frameEnd" ? "16 1/2 in" : String(Math.abs(y));
    await page.getByTestId(`st-floor-${key}-height`).fill(height);
    if (y !== 0) await page.getByTestId(`st-floor-${key}-distance`).fill(across);
    if (y !== 0) await page.getByTestId(`st-floor-${key}-side-${y < 0 ? "driver" : "passenger"}`).click();
    if (key !== "axleCenter") await page.getByTestId("guide-next").click();
  }
  await common(page);
  for (const [i, z] of HOLES.entries()) await page.getByTestId(`st-holes-${i}-z`).fill(String(z + AXLE_UP));
  await expect(page.getByTestId("hole-ranking")).toBeVisible();
  const asFloor = await rankingOf(page);
  expect(asFloor).toEqual(asCoordinates);
  // The best height is given from the floor now: the coordinates' z plus 420 mm.
  const zFloor = Number((await page.getByTestId("optimum-z").innerText()).replace(/,/g, ""));
  expect(zFloor).toBeGreaterThan(AXLE_UP);

  // Left-hand drive mirrors the vehicle: the same ranking (steer changes sign only).
  await page.getByTestId("steer-drive-lhd").tap();
  const mirrored = await rankingOf(page);
  expect(mirrored.rows.map((r) => r.split(" ")[0])).toEqual(asCoordinates.rows.map((r) => r.split(" ")[0]));
  expect(mirrored.best).toBe(asCoordinates.best);
  await page.getByTestId("steer-drive-rhd").tap();

  // Landscape tablet: the drawing and the ranking beside each other, nothing scrolling sideways.
  const drawing = (await page.getByTestId("steering-diagram").boundingBox())!;
  const ranking = (await page.getByTestId("ranking-panel").boundingBox())!;
  expect(ranking.x).toBeGreaterThanOrEqual(drawing.x + drawing.width - 1);
  expect(ranking.y).toBeLessThan(drawing.y + drawing.height);
  expect(await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth)).toBeLessThanOrEqual(0);
  await expect(page.getByTestId("diagram-optimum")).toContainText("drill here");
  await expect(page.getByTestId("optimum-row")).toContainText("drill here");
  await page.getByTestId("steer-side-by-side").screenshot({ path: `.data/screens-${process.env.TEST_APP_PORT ?? "3100"}/steering-side-by-side.png` });
  await page.getByTestId("measure-guide").screenshot({ path: `.data/screens-${process.env.TEST_APP_PORT ?? "3100"}/steering-guide.png` });
  await noSidewaysScroll(page, "landscape");

  // Portrait: the drawing and the ranking stacked, still nothing scrolling sideways.
  await page.setViewportSize({ width: 768, height: 1024 });
  const drawingP = (await page.getByTestId("steering-diagram").boundingBox())!;
  const rankingP = (await page.getByTestId("ranking-panel").boundingBox())!;
  expect(rankingP.y).toBeGreaterThanOrEqual(drawingP.y + drawingP.height - 1);
  await noSidewaysScroll(page, "portrait");
  await page.setViewportSize({ width: 1024, height: 768 });

  // Plausibility: a joint below the floor is refused with a message on its field.
  await page.getByTestId("st-floor-axleCenter-height").fill("-20");
  await expect(page.getByTestId("steer-fix-list")).toContainText("below the floor");
});
