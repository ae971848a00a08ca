import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";

import { describe, expect, it } from "vitest";

import { checkDewPoint, dewPointC } from "@/lib/coating";
import { dewPointRequestSchema } from "@/lib/coating/schemas";

// Sources: /work/shared/REFERENCES.md, section Coatings.
describe("dewPointC — Magnus with Alduchov & Eskridge 1996 coefficients (a = 17.625, b = 243.04 °C)", () => {
  // calc: worked from the Magnus formula with A&E coefficients (REFERENCES.md, Coatings), to 0.01 °C.
  it.each([
    [20, 50, 9.26],
    [10, 80, 6.71],
    [5, 90, 3.5],
    [25, 60, 16.7],
    [30, 85, 27.2],
  ])("%d °C / %d %% RH → %d °C (calc, REFERENCES.md Coatings)", (t, rh, expected) => {
    expect(dewPointC(t, rh)).toBeCloseTo(expected, 2);
  });

  // pub: a published dew-point table (REFERENCES.md, Coatings) gives 10/80 → 6.71 and 5/90 → 3.49.
  it("agrees with a published table to ±0.01 °C at 10 °C/80 % and 5 °C/90 % (pub)", () => {
    expect(Math.abs(dewPointC(10, 80) - 6.71)).toBeLessThanOrEqual(0.01);
    expect(Math.abs(dewPointC(5, 90) - 3.49)).toBeLessThanOrEqual(0.01);
    expect(Math.abs(dewPointC(5, 90, "sonntag-1990") - 3.49)).toBeLessThanOrEqual(0.01);
  });

  // calc: with RH = 100 %, γ = aT/(b+T) and Td = bγ/(a−γ) reduces to T, for either coefficient set.
  it("equals the air temperature at 100 % RH (calc from the Magnus formula)", () => {
    expect(dewPointC(17.3, 100)).toBeCloseTo(17.3, 10);
    expect(dewPointC(-4, 100, "sonntag-1990")).toBeCloseTo(-4, 10);
  });

  it("Sonntag 1990 (17.62, 243.12) is a different curve from A&E (pub: the coefficients differ)", () => {
    expect(dewPointC(20, 50, "sonntag-1990")).not.toBe(dewPointC(20, 50));
  });

  // ln(0) is undefined; RH over 100 % is not a reading.
  it("rejects RH of 0, below 0, above 100 and non-finite input", () => {
    expect(() => dewPointC(20, 0)).toThrow(RangeError);
    expect(() => dewPointC(20, -5)).toThrow(RangeError);
    expect(() => dewPointC(20, 100.5)).toThrow(RangeError);
    expect(() => dewPointC(Number.NaN, 50)).toThrow(RangeError);
  });
});

describe("checkDewPoint — 3 °C rule (REFERENCES.md Coatings, pub)", () => {
  it("20 °C/50 % air, steel at 15 °C: margin 5.74 °C ≥ 3 → ok (dew point 9.26 calc)", () => {
    const r = checkDewPoint({ airTempC: 20, relativeHumidity: 50, surfaceTempC: 15 });
    expect(r.dewPointC).toBeCloseTo(9.26, 2);
    expect(r.marginC).toBeCloseTo(5.74, 2);
    expect(r.requiredMarginC).toBe(3);
    expect(r.ok).toBe(true);
    expect(r.rhWarning).toBe(false);
    expect(r.warnings).toEqual([]);
  });

  it("steel at 12 °C is only 2.74 °C above a 9.26 °C dew point → not ok", () => {
    const r = checkDewPoint({ airTempC: 20, relativeHumidity: 50, surfaceTempC: 12 });
    expect(r.marginC).toBeCloseTo(2.74, 2);
    expect(r.ok).toBe(false);
    expect(r.warnings.join(" ")).toMatch(/dew point/);
  });

  it("a margin exactly on the 3 °C limit passes (the rule is 'at least 3 °C')", () => {
    const dp = dewPointC(10, 80);
    expect(checkDewPoint({ airTempC: 10, relativeHumidity: 80, surfaceTempC: dp + 3 }).ok).toBe(true);
    expect(checkDewPoint({ airTempC: 10, relativeHumidity: 80, surfaceTempC: dp + 2.99 }).ok).toBe(false);
  });

  it("uses a given margin instead of 3 °C", () => {
    // margin 5.74 °C (from the 20 °C/50 % dew point, calc)
    expect(checkDewPoint({ airTempC: 20, relativeHumidity: 50, surfaceTempC: 15, requiredMarginC: 5 }).ok).toBe(true);
    expect(checkDewPoint({ airTempC: 20, relativeHumidity: 50, surfaceTempC: 15, requiredMarginC: 6 }).ok).toBe(false);
  });

  // RH commonly ≤ 85 % (ISO 8502-4 / ISO 12944-7 via secondary sources; exact clause from memory).
  it("warns above 85 % RH but not at 85 %, without changing the margin verdict", () => {
    const at85 = checkDewPoint({ airTempC: 30, relativeHumidity: 85, surfaceTempC: 35 });
    expect(at85.rhWarning).toBe(false);
    const at86 = checkDewPoint({ airTempC: 30, relativeHumidity: 86, surfaceTempC: 40 });
    expect(at86.rhWarning).toBe(true);
    expect(at86.ok).toBe(true);
    expect(at86.warnings.join(" ")).toMatch(/85 %/);
  });
});

describe("dewPointRequestSchema — POST /api/calc/dew-point body", () => {
  const valid = { airTempC: 20, relativeHumidity: 50, surfaceTempC: 15 };

  function issuePaths(body: unknown): string[] {
    const r = dewPointRequestSchema.safeParse(body);
    return r.success ? [] : r.error.issues.map((i) => i.path.join("."));
  }

  it("accepts the three fields, and the optional margin", () => {
    expect(dewPointRequestSchema.parse(valid)).toEqual(valid);
    expect(dewPointRequestSchema.parse({ ...valid, requiredMarginC: 5 }).requiredMarginC).toBe(5);
  });

  it("accepts 100 % RH and RH just above 0", () => {
    expect(dewPointRequestSchema.safeParse({ ...valid, relativeHumidity: 100 }).success).toBe(true);
    expect(dewPointRequestSchema.safeParse({ ...valid, relativeHumidity: 0.1 }).success).toBe(true);
  });

  it("rejects RH 0 (ln 0 undefined), negative RH and RH over 100 at path relativeHumidity", () => {
    expect(issuePaths({ ...valid, relativeHumidity: 0 })).toEqual(["relativeHumidity"]);
    expect(issuePaths({ ...valid, relativeHumidity: -1 })).toEqual(["relativeHumidity"]);
    expect(issuePaths({ ...valid, relativeHumidity: 100.01 })).toEqual(["relativeHumidity"]);
  });

  it("rejects non-numbers with their field path", () => {
    expect(issuePaths({ ...valid, airTempC: "20" })).toEqual(["airTempC"]);
    expect(issuePaths({ ...valid, surfaceTempC: null })).toEqual(["surfaceTempC"]);
    expect(issuePaths({ ...valid, relativeHumidity: Number.NaN })).toEqual(["relativeHumidity"]);
    expect(issuePaths({ ...valid, requiredMarginC: "3" })).toEqual(["requiredMarginC"]);
  });

  it("rejects missing fields and unknown keys", () => {
    expect(issuePaths({ airTempC: 20, relativeHumidity: 50 })).toEqual(["surfaceTempC"]);
    expect(dewPointRequestSchema.safeParse({ ...valid, surfaceTemp: 15 }).success).toBe(false);
    expect(dewPointRequestSchema.safeParse(null).success).toBe(false);
  });

  it("a parsed body feeds checkDewPoint, which returns { dewPointC, marginC, ok }", () => {
    const r = checkDewPoint(dewPointRequestSchema.parse(valid));
    expect(r).toMatchObject({ ok: true });
    expect(typeof r.dewPointC).toBe("number");
    expect(typeof r.marginC).toBe("number");
  });
});

describe("lib/coating is browser-safe", () => {
  it("imports no Node-only module", () => {
    const dir = path.resolve(import.meta.dirname, "../../lib/coating");
    for (const file of readdirSync(dir, { recursive: true, encoding: "utf8" }).filter((f) => f.endsWith(".ts"))) {
      const text = readFileSync(path.join(dir, file), "utf8");
      expect(text, file).not.toMatch(/from\s+["'](?:node:|fs|path|crypto|os|child_process)["'/]|require\(/);
    }
  });
});
