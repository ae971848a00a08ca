// The traveller's QR code, drawn as vectors so it prints sharp at any printer resolution.
// Sizes follow ISO/IEC 18004 (quiet zone of 4 modules) and the GS1 General Specifications' X-dimension
// range for QR codes off paper, 0.396–0.990 mm (REFERENCES.md "Printing and records").
import QRCode from "qrcode";

/** ISO/IEC 18004: a clear margin of 4 modules on every side. */
export const QR_QUIET_ZONE_MODULES = 4;
/** Our floor for one printed module; GS1's lower bound is 0.396 mm, phones want ≥ 0.4 mm off paper. */
export const QR_MIN_MODULE_MM = 0.5;
/** GS1's upper bound for the X-dimension. */
export const QR_MAX_MODULE_MM = 0.99;
/** Printed width we aim for, quiet zone included; big enough for an old phone at arm's length. */
export const QR_TARGET_WIDTH_MM = 36;

const MM_TO_PT = 72 / 25.4;

export type QrLevel = "M" | "Q";

export type TravellerQr = {
  text: string;
  version: number;
  /** modules per side of the symbol, quiet zone excluded (21 + 4 × (version − 1)) */
  modules: number;
  errorCorrection: QrLevel;
  quietZoneModules: number;
  /** printed size of one module */
  moduleMm: number;
  /** printed width of the whole code, quiet zone included */
  widthMm: number;
  widthPt: number;
  /** side of the square the path is drawn in: modules + 2 × quiet zone, in module units */
  viewBoxSize: number;
  /** SVG path data of the dark modules, in module units, offset by the quiet zone */
  path: string;
};

// qrcode's ErrorCorrectionLevel objects carry the two-bit indicator of ISO/IEC 18004 Table 12.
const LEVEL_BY_BIT: Record<number, "L" | "M" | "Q" | "H"> = { 1: "L", 0: "M", 3: "Q", 2: "H" };

export function qrLevelOf(code: QRCode.QRCode): "L" | "M" | "Q" | "H" {
  const level = LEVEL_BY_BIT[code.errorCorrectionLevel.bit];
  if (!level) throw new Error(`unknown QR error-correction indicator ${code.errorCorrectionLevel.bit}`);
  return level;
}

/** The printed module size for a symbol of `modules` modules: aim at the target width, within GS1's range. */
export function qrModuleMm(modules: number, targetWidthMm = QR_TARGET_WIDTH_MM): number {
  const fit = targetWidthMm / (modules + 2 * QR_QUIET_ZONE_MODULES);
  return Math.min(QR_MAX_MODULE_MM, Math.max(QR_MIN_MODULE_MM, fit));
}

export function makeQr(text: string, level: QrLevel = "M"): TravellerQr {
  const code = QRCode.create(text, { errorCorrectionLevel: level });
  const got = qrLevelOf(code);
  if (got !== "M" && got !== "Q") throw new Error(`QR came out at level ${got}`);
  const n = code.modules.size;
  const q = QR_QUIET_ZONE_MODULES;
  // One sub-path per horizontal run of dark modules keeps the path short (a few hundred runs).
  const parts: string[] = [];
  for (let row = 0; row < n; row++) {
    let col = 0;
    while (col < n) {
      if (!code.modules.get(row, col)) {
        col++;
        continue;
      }
      const start = col;
      while (col < n && code.modules.get(row, col)) col++;
      const x0 = start + q;
      const x1 = col + q;
      const y0 = row + q;
      parts.push(`M${x0} ${y0}H${x1}V${y0 + 1}H${x0}Z`);
    }
  }
  const moduleMm = qrModuleMm(n);
  const viewBoxSize = n + 2 * q;
  const widthMm = viewBoxSize * moduleMm;
  return {
    text,
    version: code.version,
    modules: n,
    errorCorrection: got,
    quietZoneModules: q,
    moduleMm,
    widthMm,
    widthPt: widthMm * MM_TO_PT,
    viewBoxSize,
    path: parts.join(""),
  };
}
