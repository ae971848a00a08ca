// The traveller's weld map page, read back as an auditor meets it with poppler's pdftotext: the words, and
// the shapes of the states drawn rather than typed.
import { execFile } from "node:child_process";
import { mkdtemp, rm, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import { promisify } from "node:util";
import sharp from "sharp";
import { beforeAll, describe, expect, it } from "vitest";
import { renderTraveller } from "@/lib/pdf/traveller";
import { buildTravellerFixture } from "@/tests/fixtures/pdf/traveller-fixture";

const run = promisify(execFile);
let pages: string[] = [];
let pdf: Buffer;

beforeAll(async () => {
  const data = await buildTravellerFixture({ released: true, photos: 0, steps: 12 });
  // A plain white 800 × 600 image, so anything dark on it is a printed marker or label.
  const image = await sharp({ create: { width: 800, height: 600, channels: 3, background: "#ffffff" } }).jpeg().toBuffer();
  data.weldMap = {
    images: [{ id: "img-1", image, width: 800, height: 600, label: "Side view", sha256: "c".repeat(64) }],
    joints: [
      { jointId: "J-01", imageId: "img-1", x: 0.25, y: 0.5, state: "accepted" },
      { jointId: "J-02", imageId: "img-1", x: 0.75, y: 0.5, state: "awaiting_inspection", path: [{ x: 0.7, y: 0.5 }, { x: 0.8, y: 0.5 }] },
      { jointId: "J-03", imageId: "img-1", x: 0.5, y: 0.8, state: "repair" },
    ],
  };
  pdf = await renderTraveller(data);
  if (process.env.KEEP_PDF) await writeFile(process.env.KEEP_PDF, pdf);
  const dir = await mkdtemp(path.join(tmpdir(), "gusset-map-pdf-"));
  try {
    await writeFile(path.join(dir, "t.pdf"), pdf);
    pages = (await run("pdftotext", ["-enc", "UTF-8", path.join(dir, "t.pdf"), "-"], { maxBuffer: 16 * 1024 * 1024 })).stdout.split("\f");
  } finally {
    await rm(dir, { recursive: true, force: true });
  }
}, 120_000);

describe("traveller weld map", () => {
  it("prints a weld map page: the image once, each joint labelled, and the table of joints with their state in words", () => {
    const at = pages.findIndex((p) => p.includes("Weld joints on the map"));
    expect(at).toBeGreaterThan(0);
    expect(pages[at]).toContain("Weld map");
    expect(pages[at]!.match(/Image 1 · Side view/gi)).toHaveLength(1);
    // The table of joints may run on to the next page.
    const page = pages.slice(at, at + 2).join("\n");
    for (const id of ["J-01", "J-02", "J-03"]) expect(page.split(id).length - 1, id).toBeGreaterThanOrEqual(2); // label on the image and row of the table
    // The table lists the joints in order, whatever order they were placed in.
    expect(page).toMatch(/J-01[\s\S]*J-02[\s\S]*J-03[\s\S]*25 % across, 50 % down/);
    expect(page).toMatch(/75 % across, 50 % down, seam line/);
    for (const w of ["waiting for inspection", "sent back for repair", "accepted", "welding"]) expect(page).toContain(w);
  });

  it("has no character the embedded fonts cannot draw on that page (the state shapes are drawn, not typed)", () => {
    const page = pages.find((p) => p.includes("Weld joints on the map"))!;
    expect(page).not.toMatch(/[\u25a0-\u25ff\u2022\ufffd]/);
  });
});
