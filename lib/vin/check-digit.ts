/**
 * VIN check digit, 49 CFR 565.15: transliterate letters to numbers, multiply by position
 * weights, sum, mod 11; remainder 10 is written "X"; the result belongs in position 9.
 *
 * The product warns and never blocks: VINs before model year 1981 are not 17 characters and
 * follow no common rule, and a typo must not stop a repair being recorded.
 */

/** Letter values (49 CFR 565.15). I, O and Q are never used in a VIN. */
export const VIN_TRANSLITERATION: Readonly<Record<string, number>> = {
  A: 1, B: 2, C: 3, D: 4, E: 5, F: 6, G: 7, H: 8,
  J: 1, K: 2, L: 3, M: 4, N: 5, P: 7, R: 9,
  S: 2, T: 3, U: 4, V: 5, W: 6, X: 7, Y: 8, Z: 9,
};

/** Weight per position 1–17; position 9 (the check digit itself) weighs 0. */
export const VIN_WEIGHTS: readonly number[] = [8, 7, 6, 5, 4, 3, 2, 10, 0, 9, 8, 7, 6, 5, 4, 3, 2];

export const VIN_LENGTH = 17;
export const CHECK_DIGIT_POSITION = 9;

const VALID_CHAR = /^[A-HJ-NPR-Z0-9]$/;

/** Numeric value of one VIN character, or undefined for I, O, Q and anything else. */
export function vinCharValue(ch: string): number | undefined {
  if (/^[0-9]$/.test(ch)) return Number(ch);
  return VIN_TRANSLITERATION[ch];
}

/** Upper case, spaces and hyphens removed (people copy VINs from titles as "1G4 AH59H..."). */
export function normalizeVin(vin: string): string {
  return vin.replace(/[\s-]/g, "").toUpperCase();
}

/**
 * Expected check digit ("0"–"9" or "X") of a normalised 17-character VIN; position 9 is ignored,
 * so a "?" placeholder there is fine. Undefined when the length or a character is not valid.
 */
export function vinCheckDigit(vin: string): string | undefined {
  if (vin.length !== VIN_LENGTH) return undefined;
  let sum = 0;
  for (let i = 0; i < VIN_LENGTH; i++) {
    if (i === CHECK_DIGIT_POSITION - 1) continue;
    const value = vinCharValue(vin.charAt(i));
    const weight = VIN_WEIGHTS[i];
    if (value === undefined || weight === undefined) return undefined;
    sum += value * weight;
  }
  const remainder = sum % 11;
  return remainder === 10 ? "X" : String(remainder);
}

export interface VinCheck {
  normalized: string;
  length17: boolean;
  /** only 0–9 and A–Z without I, O, Q (and not empty) */
  validChars: boolean;
  /** present when the check digit could be computed (17 valid characters) */
  expectedCheckDigit?: string;
  actualCheckDigit?: string;
  checkDigitOk?: boolean;
  warnings: string[];
}

/** Check a VIN. Never throws; every problem is a warning for the person to confirm or fix. */
export function checkVin(vin: string): VinCheck {
  const normalized = typeof vin === "string" ? normalizeVin(vin) : "";
  const warnings: string[] = [];
  const length17 = normalized.length === VIN_LENGTH;

  const bad: string[] = [];
  for (let i = 0; i < normalized.length; i++) {
    const ch = normalized.charAt(i);
    if (!VALID_CHAR.test(ch)) bad.push(`${ch} at position ${i + 1}`);
  }
  const validChars = normalized.length > 0 && bad.length === 0;

  if (normalized.length === 0) {
    warnings.push("No VIN entered.");
    return { normalized, length17, validChars, warnings };
  }
  if (!length17) {
    warnings.push(
      `VIN has ${normalized.length} characters; VINs from model year 1981 on have 17. ` +
        "Older VINs can be shorter; the check digit was not checked.",
    );
  }
  if (bad.length > 0) {
    warnings.push(
      `Characters not used in VINs: ${bad.join(", ")}. I, O and Q never appear (they read as 1 and 0); ` +
        "check the plate.",
    );
  }

  const result: VinCheck = { normalized, length17, validChars, warnings };
  if (length17 && validChars) {
    const expected = vinCheckDigit(normalized);
    const actual = normalized.charAt(CHECK_DIGIT_POSITION - 1);
    if (expected !== undefined) {
      result.expectedCheckDigit = expected;
      result.actualCheckDigit = actual;
      result.checkDigitOk = expected === actual;
      if (!result.checkDigitOk) {
        warnings.push(
          `Check digit (position 9) is ${actual} but the other characters give ${expected}; ` +
            "check for a mistyped character.",
        );
      }
    }
  }
  return result;
}
