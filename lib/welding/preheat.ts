// Minimum preheat suggestion from AWS D1.1/D1.1M:2015 Table 3.3 (prequalified minimum preheat and interpass
// temperature), categories A and B, by the thickness of the thickest part at the point of welding.
// The same table is Table 5.8 in D1.1:2020 — that number is from memory, not checked.
// Bands are taken at the exact inch boundaries (3/4 in = 19.05 mm …); the 2015 metric brackets
// (20/38/65 mm) are soft conversions, and the inch edges are the stricter reading.

import { MM_PER_IN } from "./units";

/**
 * A: SMAW with other than low-hydrogen electrodes.
 * B: SMAW with low-hydrogen electrodes, SAW, GMAW, FCAW.
 */
export type PreheatCategory = "A" | "B";

export interface PreheatRequest {
  category: PreheatCategory;
  /** Thickest part at the point of welding, mm. */
  thicknessMm: number;
  /** Base-metal temperature before preheating, °C; enables the below-0 °C rule. */
  baseMetalTempC?: number;
}

export interface PreheatSuggestion {
  /** Governing minimum, °C: the table value, or 20 °C where the below-0 °C rule applies. */
  minPreheatC: number;
  minPreheatF: number;
  /** The table entry itself, °F (the standard's unit) and its metric bracket, °C. */
  tableF: number;
  tableC: number;
  band: string;
  belowZeroRuleApplied: boolean;
  source: string;
  notes: string[];
}

interface Band {
  throughIn: number; // upper edge, inclusive
  label: string;
  // °F per the standard; °C is the standard's own metric bracket.
  A: { f: number; c: number };
  B: { f: number; c: number };
}

const BANDS: readonly Band[] = [
  { throughIn: 0.75, label: "up to 3/4 in (19.05 mm) incl.", A: { f: 32, c: 0 }, B: { f: 32, c: 0 } },
  { throughIn: 1.5, label: "over 3/4 in through 1-1/2 in (38.1 mm)", A: { f: 150, c: 65 }, B: { f: 50, c: 10 } },
  { throughIn: 2.5, label: "over 1-1/2 in through 2-1/2 in (63.5 mm)", A: { f: 225, c: 110 }, B: { f: 150, c: 65 } },
  { throughIn: Infinity, label: "over 2-1/2 in (63.5 mm)", A: { f: 300, c: 150 }, B: { f: 225, c: 110 } },
];

// The 2020 edition's number for this table (5.8) is from memory, so only the checked 2015 number is shown.
export const PREHEAT_SOURCE = "AWS D1.1/D1.1M:2015 Table 3.3";

/** Table 3.3 note: base metal below 32 °F (0 °C) is preheated to at least 70 °F (20 °C) and kept there. */
export const BELOW_ZERO_MIN_C = 20;
export const BELOW_ZERO_MIN_F = 70;

export function suggestPreheat(req: PreheatRequest): PreheatSuggestion {
  if (!Number.isFinite(req.thicknessMm) || req.thicknessMm <= 0) {
    throw new RangeError(`thicknessMm must be a positive finite number (got ${String(req.thicknessMm)})`);
  }
  const tIn = req.thicknessMm / MM_PER_IN;
  // Compare in mm with a hair of slack so 19.05 mm typed in lands in the 3/4 in band, not the next.
  const band = BANDS.find((b) => req.thicknessMm <= b.throughIn * MM_PER_IN + 1e-9) ?? BANDS[BANDS.length - 1]!;
  const entry = band[req.category];
  const notes: string[] = [];

  if (tIn < 0.125) {
    notes.push("Thinner than 1/8 in (3.2 mm): below the range of the prequalified table; qualify the procedure.");
  }
  if (entry.f === 32) {
    notes.push("32 °F (0 °C) means no preheat is required, but the base metal must be at least 0 °C when welded.");
  }
  notes.push("Hold at least this temperature as the minimum interpass temperature too (Table 3.3 is both).");

  const belowZero = req.baseMetalTempC !== undefined && req.baseMetalTempC < 0;
  const ruleApplies = belowZero && BELOW_ZERO_MIN_C > entry.c;
  if (belowZero) {
    notes.push("Base metal below 0 °C (32 °F): preheat to at least 20 °C (70 °F) and maintain it during welding.");
  }

  return {
    minPreheatC: ruleApplies ? BELOW_ZERO_MIN_C : entry.c,
    minPreheatF: ruleApplies ? BELOW_ZERO_MIN_F : entry.f,
    tableF: entry.f,
    tableC: entry.c,
    band: band.label,
    belowZeroRuleApplied: ruleApplies,
    source: PREHEAT_SOURCE,
    notes,
  };
}

