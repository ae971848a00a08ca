// Weld-map images judged by their bytes: SVG refused, a PDF's first page rendered by poppler's pdftoppm,
// then re-encoded like a job photo.
import sharp from "sharp";
import { describe, expect, it } from "vitest";
import { processMapImage } from "@/lib/storage/images";
import { drawingPdf } from "@/tests/fixtures/weld-map/pdf";

describe("weld-map image upload", () => {
  it("refuses SVG, with or without an XML declaration, as 415 with what to do instead", async () => {
    for (const svg of ['<svg xmlns="http://www.w3.org/2000/svg"><script>alert(1)</script></svg>', '\uFEFF<?xml version="1.0"?>\n<svg xmlns="http://www.w3.org/2000/svg"/>']) {
      await expect(processMapImage(Buffer.from(svg))).rejects.toMatchObject({ code: "unsupported_media_type", message: expect.stringMatching(/SVG .*PNG or JPEG/) });
    }
  });

  it("takes a PDF's first page as the image, in the page's proportions, with the page's drawing on it", async () => {
    const out = await processMapImage(drawingPdf({ width: 400, height: 300, pages: 2 }));
    expect(out.originalType).toBe("application/pdf");
    expect(out.contentType).toBe("image/jpeg");
    // 400 × 300 pt scaled to 2000 px on the longer side.
    expect(out.width).toBe(2000);
    expect(out.height).toBe(1500);
    const { data, info } = await sharp(out.main).greyscale().raw().toBuffer({ resolveWithObject: true });
    const at = (fx: number, fy: number) => data[Math.floor(fy * info.height) * info.width + Math.floor(fx * info.width)]!;
    expect(at(0.25, 0.5)).toBeLessThan(40); // the black bar on the left half
    expect(at(0.75, 0.5)).toBeGreaterThan(215); // the blank right half
  });

  it("refuses a damaged PDF as 422 rather than storing nothing or failing with 500", async () => {
    const broken = Buffer.concat([Buffer.from("%PDF-1.4\n"), Buffer.alloc(200, 0x20)]);
    await expect(processMapImage(broken)).rejects.toMatchObject({ code: "unprocessable", message: expect.stringMatching(/first page of this PDF could not be read/) });
  });
});
