import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";

import fc from "fast-check";
import { describe, expect, it } from "vitest";

import { VIN_TRANSLITERATION, VIN_WEIGHTS, checkVin, vinCheckDigit } from "@/lib/vin";

// Source: 49 CFR 565.15 (check digit), via REFERENCES.md (VIN check digit).
describe("49 CFR 565.15 tables", () => {
  it("weights 8 7 6 5 4 3 2 10 0 9 8 7 6 5 4 3 2 (pub)", () => {
    expect(VIN_WEIGHTS).toEqual([8, 7, 6, 5, 4, 3, 2, 10, 0, 9, 8, 7, 6, 5, 4, 3, 2]);
  });
  it("transliteration A1 … Z9 without I, O, Q (pub)", () => {
    expect(VIN_TRANSLITERATION).toEqual({
      A: 1, B: 2, C: 3, D: 4, E: 5, F: 6, G: 7, H: 8, J: 1, K: 2, L: 3, M: 4, N: 5, P: 7, R: 9,
      S: 2, T: 3, U: 4, V: 5, W: 6, X: 7, Y: 8, Z: 9,
    });
  });
});

describe("vinCheckDigit", () => {
  it("1G4AH59H?5G118341 → 4 (calc, REFERENCES.md: weighted sum 411, 411 mod 11 = 4)", () => {
    expect(vinCheckDigit("1G4AH59H?5G118341")).toBe("4");
  });
  it("1M8GDM9AXKP042788 → remainder 10 → X (calc, REFERENCES.md)", () => {
    expect(vinCheckDigit("1M8GDM9AXKP042788")).toBe("X");
  });
  it("is undefined for a wrong length or a forbidden character", () => {
    expect(vinCheckDigit("1G4AH59H45G11834")).toBeUndefined();
    expect(vinCheckDigit("1G4AH59H45G1I8341")).toBeUndefined();
  });
});

describe("checkVin", () => {
  it("1G4AH59H45G118341 is valid (calc, REFERENCES.md)", () => {
    expect(checkVin("1G4AH59H45G118341")).toEqual({
      normalized: "1G4AH59H45G118341",
      length17: true,
      validChars: true,
      expectedCheckDigit: "4",
      actualCheckDigit: "4",
      checkDigitOk: true,
      warnings: [],
    });
  });

  it("1M8GDM9AXKP042788 with X in position 9 is valid (calc, REFERENCES.md)", () => {
    const r = checkVin("1M8GDM9AXKP042788");
    expect(r.checkDigitOk).toBe(true);
    expect(r.expectedCheckDigit).toBe("X");
    expect(r.warnings).toEqual([]);
  });

  it("a one-character change is flagged as a mismatch, not an error", () => {
    // Last character 1 → 2 adds 1 × weight 2: 411 + 2 = 413, 413 mod 11 = 6 (calc from 565.15 weights).
    const r = checkVin("1G4AH59H45G118342");
    expect(r.length17).toBe(true);
    expect(r.validChars).toBe(true);
    expect(r.checkDigitOk).toBe(false);
    expect(r.expectedCheckDigit).toBe("6");
    expect(r.actualCheckDigit).toBe("4");
    expect(r.warnings).toHaveLength(1);
    expect(r.warnings[0]).toMatch(/position 9/);
  });

  it("I, O and Q are flagged with their positions; the check digit is not computed", () => {
    const r = checkVin("1G4AH59H45G1I8341");
    expect(r.validChars).toBe(false);
    expect(r.checkDigitOk).toBeUndefined();
    expect(r.expectedCheckDigit).toBeUndefined();
    expect(r.warnings.join(" ")).toMatch(/I at position 13/);
    expect(checkVin("1G4AH59H45GO18341").warnings.join(" ")).toMatch(/O at position 12/);
    expect(checkVin("1G4AH59H45GQ18341").validChars).toBe(false);
  });

  it("lower case, spaces and hyphens are normalised", () => {
    const r = checkVin(" 1g4ah59h45g118341 ");
    expect(r.normalized).toBe("1G4AH59H45G118341");
    expect(r.checkDigitOk).toBe(true);
    expect(checkVin("1G4-AH59H4-5G118341").checkDigitOk).toBe(true);
  });

  it("a short (pre-1981 style) VIN gets a length warning and no check-digit verdict", () => {
    const r = checkVin("7K56H123456");
    expect(r.length17).toBe(false);
    expect(r.validChars).toBe(true);
    expect(r.checkDigitOk).toBeUndefined();
    expect(r.warnings.join(" ")).toMatch(/11 characters.*17/);
  });

  it("an empty VIN is a warning too", () => {
    const r = checkVin("");
    expect(r.validChars).toBe(false);
    expect(r.warnings).toEqual(["No VIN entered."]);
  });

  it("never throws, and any valid 17-character VIN with its computed digit checks out (property test)", () => {
    fc.assert(fc.property(fc.string({ maxLength: 30 }), (s) => Array.isArray(checkVin(s).warnings)));
    const vinChar = fc.constantFrom(..."0123456789ABCDEFGHJKLMNPRSTUVWXYZ");
    fc.assert(
      fc.property(fc.array(vinChar, { minLength: 17, maxLength: 17 }), (chars) => {
        const draft = chars.join("");
        const digit = vinCheckDigit(draft) as string;
        const vin = draft.slice(0, 8) + digit + draft.slice(9);
        return checkVin(vin).checkDigitOk === true;
      }),
    );
    expect(() => checkVin(undefined as unknown as string)).not.toThrow();
  });
});

describe("lib/vin is browser-safe", () => {
  it("imports no Node-only module", () => {
    const dir = path.resolve(import.meta.dirname, "../../lib/vin");
    for (const file of readdirSync(dir, { recursive: true, encoding: "utf8" }).filter((f) => f.endsWith(".ts"))) {
      const text = readFileSync(path.join(dir, file), "utf8");
      expect(text, file).not.toMatch(/from\s+["'](?:node:|fs|path|crypto|os|child_process)["'/]|require\(/);
    }
  });
});
