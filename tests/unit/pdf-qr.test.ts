// The traveller's QR code as lib/pdf/qr builds it, checked against the symbol qrcode's create() makes.
import QRCode from "qrcode";
import { describe, expect, it } from "vitest";
import { QR_MAX_MODULE_MM, QR_MIN_MODULE_MM, QR_QUIET_ZONE_MODULES, makeQr, qrLevelOf, qrModuleMm } from "@/lib/pdf/qr";
import { FIXTURE_VERIFY_URL } from "@/tests/fixtures/pdf/traveller-fixture";

const MM_TO_PT = 72 / 25.4;

describe("traveller QR code", () => {
  // ISO/IEC 18004 error correction: L 7 %, M 15 %, Q 25 %, H 30 % of codewords restorable.
  it("uses error correction level M (or Q), as qrcode's create() reports it", () => {
    expect(["M", "Q"]).toContain(qrLevelOf(QRCode.create(FIXTURE_VERIFY_URL, { errorCorrectionLevel: "M" })));
    expect(makeQr(FIXTURE_VERIFY_URL).errorCorrection).toBe("M");
    expect(makeQr(FIXTURE_VERIFY_URL, "Q").errorCorrection).toBe("Q");
    expect(qrLevelOf(QRCode.create(FIXTURE_VERIFY_URL, { errorCorrectionLevel: "L" }))).toBe("L");
  });

  // ISO/IEC 18004: quiet zone 4 modules; version V has 17 + 4V modules a side.
  // GS1 General Specifications: X-dimension 0.396–0.990 mm; we print at least 0.5 mm.
  it("prints modules between 0.5 and 0.99 mm with a 4-module quiet zone, and a width to match", () => {
    const qr = makeQr(FIXTURE_VERIFY_URL);
    const ref = QRCode.create(FIXTURE_VERIFY_URL, { errorCorrectionLevel: "M" });
    expect(qr.modules).toBe(ref.modules.size);
    expect(qr.modules).toBe(17 + 4 * qr.version);
    expect(qr.quietZoneModules).toBe(4);
    expect(QR_QUIET_ZONE_MODULES).toBe(4);
    expect(qr.moduleMm).toBeGreaterThanOrEqual(0.4);
    expect(qr.moduleMm).toBeGreaterThanOrEqual(QR_MIN_MODULE_MM);
    expect(qr.moduleMm).toBeLessThanOrEqual(QR_MAX_MODULE_MM);
    expect(qr.viewBoxSize).toBe(qr.modules + 8);
    expect(qr.widthMm).toBeCloseTo((qr.modules + 8) * qr.moduleMm, 9);
    expect(qr.widthPt).toBeCloseTo((qr.modules + 8) * qr.moduleMm * MM_TO_PT, 9);
  });

  it("keeps modules ≥ 0.5 mm for long URLs (the code grows instead) and ≤ 0.99 mm for short ones", () => {
    const long = makeQr(`https://gusset.example/verify/${"x".repeat(250)}`);
    expect(long.moduleMm).toBe(0.5);
    expect(long.widthMm).toBeCloseTo((long.modules + 8) * 0.5, 9);
    expect(makeQr("https://g.example/v/1").moduleMm).toBeLessThanOrEqual(0.99);
    expect(qrModuleMm(21, 1000)).toBe(QR_MAX_MODULE_MM);
    expect(qrModuleMm(177)).toBe(QR_MIN_MODULE_MM);
  });

  it("draws exactly the dark modules of the symbol, offset by the quiet zone", () => {
    const qr = makeQr(FIXTURE_VERIFY_URL);
    const ref = QRCode.create(FIXTURE_VERIFY_URL, { errorCorrectionLevel: "M" });
    const n = ref.modules.size;
    const drawn = new Set<string>();
    for (const m of qr.path.matchAll(/M(\d+) (\d+)H(\d+)V\d+H\d+Z/g)) {
      const [x0, y, x1] = [Number(m[1]), Number(m[2]), Number(m[3])];
      for (let x = x0; x < x1; x++) drawn.add(`${y - 4},${x - 4}`);
    }
    let dark = 0;
    for (let r = 0; r < n; r++) {
      for (let c = 0; c < n; c++) {
        const on = Boolean(ref.modules.get(r, c));
        if (on) dark++;
        expect(drawn.has(`${r},${c}`)).toBe(on);
      }
    }
    expect(drawn.size).toBe(dark);
  });
});
