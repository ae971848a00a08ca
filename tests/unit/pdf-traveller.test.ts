// The traveller PDF, read back the way an auditor meets it: its text (unpdf / pdf.js), its page size,
// and page 1 rasterised by poppler's pdftoppm with the QR code decoded by jsQR.
import { execFile } from "node:child_process";
import { mkdtemp, readFile, rm, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import { promisify } from "node:util";
import jsQR from "jsqr";
import { PNG } from "pngjs";
import { extractText, getDocumentProxy } from "unpdf";
import { beforeAll, describe, expect, it } from "vitest";
import { SAFETY_NOTE } from "@/lib/safety";
import { makeQr } from "@/lib/pdf/qr";
import { HAZARD_LINE, PAGE_SIZE_PT, VOID_TITLE, WIP_TITLE, renderTraveller } from "@/lib/pdf/traveller";
import type { TravellerData } from "@/lib/pdf/traveller-data";
import { vinCheckDigit } from "@/lib/vin";
import { FIXTURE_JOB_NUMBER, FIXTURE_SEAL, FIXTURE_VERIFY_URL, PEOPLE, buildTravellerFixture } from "@/tests/fixtures/pdf/traveller-fixture";

const run = promisify(execFile);

type Rendered = { data: TravellerData; pdf: Buffer; pages: string[] };

async function pagesText(pdf: Buffer): Promise<string[]> {
  const doc = await getDocumentProxy(new Uint8Array(pdf));
  const { text } = await extractText(doc, { mergePages: false });
  return (text as string[]).map((t) => t.replace(/\s+/g, " ").trim());
}

async function render(data: TravellerData): Promise<Rendered> {
  const pdf = await renderTraveller(data);
  return { data, pdf, pages: await pagesText(pdf) };
}

const all = (r: Rendered) => r.pages.join(" ");
const esc = (s: string) => s.replace(/[.*+?^${}()|[\]\\]/g, "\\$&");

/** Page 1 at `dpi` through poppler, as RGBA. */
async function rasterPage1(pdf: Buffer, dpi: number): Promise<PNG> {
  const dir = await mkdtemp(path.join(tmpdir(), "gusset-traveller-"));
  try {
    await writeFile(path.join(dir, "t.pdf"), pdf);
    await run("pdftoppm", ["-r", String(dpi), "-png", "-f", "1", "-l", "1", "-singlefile", path.join(dir, "t.pdf"), path.join(dir, "page")]);
    return PNG.sync.read(await readFile(path.join(dir, "page.png")));
  } finally {
    await rm(dir, { recursive: true, force: true });
  }
}

let released: Rendered;
let wip: Rendered;
let voided: Rendered;
let letter: Rendered;

beforeAll(async () => {
  released = await render(await buildTravellerFixture({ released: true }));
  wip = await render(await buildTravellerFixture({ released: false }));
  const v = await buildTravellerFixture({ released: false, photos: 1, steps: 4 });
  voided = await render({ ...v, state: "void" });
  letter = await render(await buildTravellerFixture({ released: true, paper: "letter" }));
}, 120_000);

/** Each run of text on every page with the size pdf.js reads from its text matrix (points, rotation-free). */
async function textSizes(pdf: Buffer): Promise<{ page: number; text: string; pt: number }[]> {
  const doc = await getDocumentProxy(new Uint8Array(pdf));
  const out: { page: number; text: string; pt: number }[] = [];
  for (let n = 1; n <= doc.numPages; n++) {
    const content = await (await doc.getPage(n)).getTextContent();
    for (const item of content.items) {
      if (!("str" in item) || !item.str.trim()) continue;
      const [, , c, d] = item.transform as number[];
      out.push({ page: n, text: item.str, pt: Math.hypot(c!, d!) });
    }
  }
  return out;
}

describe("traveller type size", () => {
  it("prints no text under 8 pt on any page, released, in progress or void", async () => {
    for (const r of [released, wip, voided, letter]) {
      const sizes = await textSizes(r.pdf);
      expect(sizes.length).toBeGreaterThan(50);
      const small = sizes.filter((x) => x.pt < 8 - 0.01);
      expect(small.slice(0, 5)).toEqual([]);
    }
  }, 60_000);
});

describe("traveller text", () => {
  it("prints the job number and the page count in the header of every page", () => {
    const n = released.pages.length;
    expect(n).toBeGreaterThan(2);
    released.pages.forEach((p, i) => {
      expect(p).toContain(FIXTURE_JOB_NUMBER);
      expect(p).toContain("AX-IG-0419");
      expect(p).toContain("Iron Gully 4x4 Fabrication"); // the "x" stays an x: contextual alternates are off
      expect(p).toMatch(new RegExp(`page ${i + 1} of ${n}\\b`, "i"));
    });
    expect(released.pages[0]).toMatch(new RegExp(`page 1 of ${n}\\b`, "i"));
  });

  it("shows on page 1 the customer, vehicle, VIN, axle, procedure, dates, state and the seal", () => {
    const p1 = released.pages[0] ?? "";
    const d = released.data;
    for (const s of [d.customerName, d.vehicle.makeModel, d.vehicle.vin, d.axle.description, d.axle.idTag, d.procedure.title, "v4", "2026-03-09", "Released"]) {
      expect(p1).toContain(s);
    }
    expect(p1).toContain("2026-03-06 15:40 UTC Released Sam Okafor · Lead · 2026-03-06 15:40 UTC"); // release time and its sign-off
    // The seal: short form (first 12 hex characters) large, and the full SHA-256 in groups of four.
    expect(p1).toContain(FIXTURE_SEAL.slice(0, 12));
    expect(p1.replace(/ /g, "")).toContain(FIXTURE_SEAL);
    expect(p1).toContain("186 record entries");
    // The verify URL under the QR code (wrapped over lines, so compared without spaces).
    expect(p1.replace(/ /g, "")).toContain(FIXTURE_VERIFY_URL);
  });

  // 21 CFR 11.50: a signed record shows the signer's printed name, the date and time, and the meaning.
  it("prints each sign-off with printed name, role, meaning and time (21 CFR 11.50)", () => {
    const text = all(released);
    const signed = (meaning: string, name: string, role: string) => new RegExp(`${meaning} ${esc(name)} · ${role} · \\d{4}-\\d{2}-\\d{2} \\d{2}:\\d{2} UTC`);
    expect(text).toMatch(signed("Performed", PEOPLE.welder.name, "Welder"));
    expect(text).toMatch(signed("Performed", PEOPLE.welder2.name, "Welder"));
    expect(text).toMatch(signed("Inspected", PEOPLE.inspector.name, "Inspector"));
    expect(text).toMatch(signed("Performed", PEOPLE.lead.name, "Lead"));
    expect(text).toContain("Performed Nell Whitlow · Welder · 2026-03-02 07:47 UTC");
    // 21 CFR 11.10(e): a correction never obscures the entry it corrects; it points at it with a reason.
    expect(text).toMatch(/S(\d+) Performed Nell Whitlow · Welder · [\d-]+ [\d:]+ UTC amended by S(\d+)/);
    expect(text).toContain("Left reading first typed as 521 (digits swapped); re-measured 512 mm.");
    expect(text).toMatch(/Amends S\d+: Left reading first typed/);
  });

  it("prints measured values against their tolerance with a verdict word", () => {
    const text = all(released);
    expect(text).toContain("Top of tube 9.52 mm >= 9.0 mm pass");
    expect(text).toContain("Left 512 mm 510 ± 5 mm pass");
    expect(text).toContain("M16 10.9 bolt 258 N·m 250 ± 5 % pass");
  });

  // ISO 3834-2 (mem): each weld traceable to its welder, WPS and consumable lot.
  it("prints the weld table: joint, welder, WPS, filler lot, preheat, heat input against the WPS and the joint's state", () => {
    const text = all(released);
    expect(text).toMatch(/J-01 .*?Nell Whitlow .*?WPS-IG-012 ER70S-6 1\.0 mm lot L24-0917 95 1\.02 max 1\.40 within accepted 1 round/);
    expect(text).toMatch(/J-03 .*?Teo Marchetti .*?WPS-IG-014 .*?lot L25-0102 — 1\.46 max 1\.40 over accepted/);
  });

  it("prints each pass with its welder, WPS reference and revision, and its heat input judged against that WPS", () => {
    const text = all(released);
    expect(text).toContain("Pass 1 Nell Whitlow · WPS-IG-012 rev 3 heat input 0.94 kJ/mm (max 1.40) within WPS");
    expect(text).toContain("Pass 1 Teo Marchetti · WPS-IG-014 rev 1 heat input 1.46 kJ/mm (max 1.40) over WPS");
    // A struck-out pass stays on the record, without a verdict.
    expect(text).toContain("Pass 3 Nell Whitlow · WPS-IG-012 rev 3 heat input 1.12 kJ/mm (max 1.40) struck out");
    // An out-of-range pass a lead accepted: the finding, then who accepted it, when and why.
    expect(text).toMatch(
      /Pass 2 Teo Marchetti · WPS-IG-014 rev 1 .*? Outside the WPS: Current 262 A is above the WPS maximum of 250 A\. Accepted by lead override Sam Okafor · 2026-03-02 21:40 UTC: Short tie-in/,
    );
  });

  // A rejected joint is repaired in a new round and inspected again; both rounds stay on the record.
  it("prints a repaired weld's two rounds: the rejection with what failed against which limit, then the repair and its acceptance", () => {
    const text = all(released);
    const j02 = text.slice(text.indexOf("J-02 Bracket to tube, rear fillet"), text.indexOf("J-03 Gusset plate to bracket"));
    expect(j02).toMatch(/^J-02 .*?accepted 2 rounds Round 1 first welding Pass 1 /);
    // AWS D1.1:2020 Table 8.1: undercut on material under 1 in is 1/32 in, or 1/16 in (1.59 mm) over at most 2 in in 12 in.
    expect(j02).toMatch(
      /Inspection round 1 reject Priya Halvorsen · 2026-03-02 19:15 UTC · AWS D1\.1:2020 Table 8\.1, statically loaded nontubular Undercut: measured 1\.8 mm deep, 40 mm accumulated in 300 mm; limit .*?1\/16 in \(1\.59 mm\)/,
    );
    expect(j02).toContain("Notes: Undercut at the rear toe; grind out and re-weld (NC-1).");
    expect(j02).toMatch(/Round 2 repair after rejection Pass 4 Nell Whitlow · WPS-IG-012 rev 3 heat input 0\.96 kJ\/mm \(max 1\.40\) within WPS Inspection round 2 accept Priya Halvorsen · 2026-03-02 21:30 UTC/);
    expect(j02.indexOf("Inspection round 1")).toBeLessThan(j02.indexOf("Round 2"));
    // The checklist names the round of each sign-off on the weld step.
    expect(text).toMatch(/Inspected Priya Halvorsen · Inspector · [\d-]+ [\d:]+ UTC · round 1 .*?Performed Nell Whitlow · Welder · [\d-]+ [\d:]+ UTC · round 2 .*?Inspected Priya Halvorsen · Inspector · [\d-]+ [\d:]+ UTC · round 2/);
    expect(released.pages[0]).toContain("3 accepted at their last inspection");
  });

  // ISO 3834-2 (mem): base and filler materials traceable by heat or lot number to the job.
  it("prints the material entries with kind, description, specification, heat or lot number and certificate", () => {
    const text = all(released);
    const materials = text.slice(text.indexOf("Material traceability"));
    expect(materials).toMatch(/Base metal Lateral link bracket, 10 mm plate EN 10025-2 S355J2 H24-77318 EN 10204 3\.1 MTC-55120 Nell Whitlow/);
    expect(materials).toMatch(/Filler metal Solid wire 1\.0 mm, 15 kg spool AWS A5\.18 ER70S-6 L24-0917 EN 10204 3\.1 W-2291/);
    expect(materials).toMatch(/Filler metal Solid wire 0\.9 mm, 5 kg spool AWS A5\.18 ER70S-6 L25-0102 — Teo Marchetti/);
    // A correction names why; a withdrawn entry says so in words.
    expect(materials).toMatch(/Gusset plate, 6 mm Corrects an earlier entry: Heat number first typed as H24-85051; re-read off the plate stamp\. EN 10025-2 S355J2 H24-80551/);
    expect(materials).toMatch(/Gusset plate, 8 mm withdrawn, no longer used on this job Why withdrawn: Cut from the wrong sheet/);
    // The lots the passes logged, beside the entries, with the joints they went into.
    expect(materials).toMatch(/Filler lots logged on the weld passes .*? 1\.0 L24-0917 J-01, J-02 .*? 0\.9 L25-0102 J-03/);
  });

  it("prints nonconformances with their dispositions, photos and the safety note", () => {
    const text = all(released);
    expect(text).toMatch(/NC-1 visual-1 Undercut .*? Repair Grind out .*? Dispositioned by Sam Okafor · 2026-03-02 19:30 UTC/);
    expect(text).toMatch(/NC-2 weld-1 .*? Use as is /);
    expect(text).toContain("P8 dft-1");
    expect(text).toContain("Old bracket before removal");
    expect(text).toContain(HAZARD_LINE);
    expect(text).toContain("Hot work, fumes, cutting and grinding, coatings and steering components can hurt people");
    expect(text).toContain(SAFETY_NOTE);
  });

  it("marks every page of a job that is not released as work in progress, and no page of a released one", () => {
    expect(wip.pages.length).toBeGreaterThan(2);
    for (const p of wip.pages) expect(p).toContain(WIP_TITLE);
    expect(wip.pages[0]).toContain("On hold");
    expect(wip.pages[0]).toContain("not released");
    expect(all(wip)).toContain("open, awaiting disposition");
    expect(all(wip)).toContain("Not signed yet.");
    expect(all(wip)).toMatch(/J-03 .*? over waiting for inspection 1 round Round 1 first welding .*? Inspection round 1 not inspected yet/);
    for (const p of released.pages) {
      expect(p).not.toMatch(/work in progress/i);
      expect(p).not.toMatch(/not released/i);
    }
    for (const p of voided.pages) {
      expect(p).toContain(VOID_TITLE);
      expect(p).not.toContain(WIP_TITLE);
    }
  });

  it("shows a VIN check-digit warning only when the flag is set (49 CFR 565.15: warn, never block)", async () => {
    expect(all(released)).not.toContain("Check digit does not match");
    const data = await buildTravellerFixture({ released: true, vinWarning: true, photos: 0, steps: 2 });
    expect(vinCheckDigit(data.vehicle.vin)).not.toBe(data.vehicle.vin[8]); // the fixture's VIN really is off
    const warned = await render(data);
    expect(warned.pages[0]).toContain("Check digit does not match (49 CFR 565.15)");
    expect(warned.pages[0]).toContain(data.vehicle.vin); // printed as read
  }, 30_000);
});

describe("traveller file", () => {
  // ISO 216 A4 is 210 × 297 mm = 595.28 × 841.89 pt; US Letter 8.5 × 11 in = 612 × 792 pt (1 pt = 1/72 in).
  it("has A4 or Letter pages as asked", async () => {
    for (const [r, [w, h]] of [
      [released, PAGE_SIZE_PT.a4],
      [letter, PAGE_SIZE_PT.letter],
    ] as const) {
      const doc = await getDocumentProxy(new Uint8Array(r.pdf));
      expect(doc.numPages).toBe(r.pages.length);
      for (let i = 1; i <= doc.numPages; i++) {
        const [x0, y0, x1, y1] = (await doc.getPage(i)).view;
        expect([x0, y0]).toEqual([0, 0]);
        expect(x1).toBeCloseTo(w, 2);
        expect(y1).toBeCloseTo(h, 2);
      }
    }
    expect(PAGE_SIZE_PT.a4).toEqual([595.28, 841.89]);
    expect(PAGE_SIZE_PT.letter).toEqual([612, 792]);
  });

  // ISO 19005-2 (PDF/A-2), 6.2.11.4: every font used is embedded; the XMP names the part and level.
  it("is PDF/A-2b with every font embedded", () => {
    const raw = released.pdf.toString("latin1");
    expect(raw).toContain("<pdfaid:part>2</pdfaid:part>");
    expect(raw).toContain("<pdfaid:conformance>B</pdfaid:conformance>");
    const fonts = [...raw.matchAll(/\/BaseFont \/([A-Za-z0-9+-]+)/g)].map((m) => m[1] ?? "");
    expect(fonts.length).toBeGreaterThan(0);
    for (const f of fonts) expect(f).toMatch(/^[A-Z]{6}\+(Inter|IBMPlexMono)-/); // subset-tagged, embedded faces only
    for (const r of [wip, voided, letter]) expect(r.pdf.toString("latin1")).not.toMatch(/\/BaseFont \/(Helvetica|Times|Courier)/);
  });

  it("gives the same bytes for the same data", async () => {
    const again = await renderTraveller(released.data);
    expect(again.equals(released.pdf)).toBe(true);
  }, 30_000);
});

describe("traveller QR code, read off the rasterised page", () => {
  const DPI = 200;

  it("decodes to the verify URL, prints modules ≥ 0.4 mm and keeps a 4-module quiet zone", async () => {
    const png = await rasterPage1(released.pdf, DPI);
    const qr = jsQR(new Uint8ClampedArray(png.data.buffer, png.data.byteOffset, png.data.length), png.width, png.height);
    expect(qr).not.toBeNull();
    if (!qr) return;
    expect(qr.data).toBe(FIXTURE_VERIFY_URL);

    // The printed symbol is the one lib/pdf/qr built (same version, so same module count).
    const built = makeQr(FIXTURE_VERIFY_URL);
    expect(qr.version).toBe(built.version);
    const size = 17 + 4 * qr.version; // ISO/IEC 18004: version V has 17 + 4V modules a side

    // Finder-pattern centres sit 3.5 modules in from the symbol's edges, so they are size − 7 modules apart.
    const { topLeftFinderPattern: tl, topRightFinderPattern: tr, bottomLeftFinderPattern: bl } = qr.location;
    const modulePx = (Math.hypot(tr.x - tl.x, tr.y - tl.y) + Math.hypot(bl.x - tl.x, bl.y - tl.y)) / 2 / (size - 7);
    const moduleMm = (modulePx / DPI) * 25.4;
    // GS1 General Specifications: X-dimension 0.396–0.990 mm for QR codes read off paper; 0.4 mm is our floor.
    expect(moduleMm).toBeGreaterThanOrEqual(0.4);
    expect(moduleMm).toBeLessThanOrEqual(0.99);
    expect(moduleMm).toBeCloseTo(built.moduleMm, 1);

    // ISO/IEC 18004: a light quiet zone 4 modules wide on every side of the symbol.
    const left = tl.x - 3.5 * modulePx;
    const top = tl.y - 3.5 * modulePx;
    const right = tr.x + 3.5 * modulePx;
    const bottom = bl.y + 3.5 * modulePx;
    const inner = 0.6 * modulePx; // leave the anti-aliased symbol edge out
    const outer = 3.6 * modulePx;
    let dark = 0;
    let seen = 0;
    for (let y = Math.floor(top - outer); y <= Math.ceil(bottom + outer); y++) {
      for (let x = Math.floor(left - outer); x <= Math.ceil(right + outer); x++) {
        const inside = x > left - inner && x < right + inner && y > top - inner && y < bottom + inner;
        if (inside) continue;
        const o = (y * png.width + x) * 4;
        const luma = 0.299 * (png.data[o] ?? 0) + 0.587 * (png.data[o + 1] ?? 0) + 0.114 * (png.data[o + 2] ?? 0);
        seen++;
        if (luma < 200) dark++;
      }
    }
    expect(seen).toBeGreaterThan(1000);
    expect(dark).toBe(0);
  }, 60_000);

  it("decodes on Letter paper too", async () => {
    const png = await rasterPage1(letter.pdf, DPI);
    const qr = jsQR(new Uint8ClampedArray(png.data.buffer, png.data.byteOffset, png.data.length), png.width, png.height);
    expect(qr?.data).toBe(FIXTURE_VERIFY_URL);
  }, 60_000);
});
