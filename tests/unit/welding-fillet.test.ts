import { describe, expect, it } from "vitest";
import {
  directionalFactor,
  filletStrengthPerMm,
  filletThroatMm,
  filletWeld,
  kNToKip,
  minimumFilletLeg,
} from "@/lib/welding";

const IN = 25.4; // NIST SP 811: exact
const KIP = 4.4482216152605; // kN per kip, NIST SP 811
const kipPerIn = (kNPerMm: number) => (kNPerMm * IN) / KIP;

// REFERENCES.md worked example (calc): 1/4 in E70 fillet, 3 in long.
const QUARTER = { legMm: IN / 4, lengthMm: 3 * IN, electrodeClass: "E70" as const };

describe("fillet weld strength — AISC 360-16 J2.2a, J2.4", () => {
  it("effective throat = 0.707 × leg (AISC 360-16 J2.2a)", () => {
    expect(filletThroatMm(10)).toBeCloseTo(7.07, 12);
    expect(filletWeld({ ...QUARTER, method: "LRFD" }).throatMm).toBeCloseTo(0.707 * 6.35, 12);
  });

  it("E70 LRFD: 1.392 kip/in per 1/16 in of leg (AISC 360-16 J2.4, φ = 0.75; REFERENCES pub/mem)", () => {
    const q = filletStrengthPerMm({ legMm: IN / 16, electrodeMPa: 70 * (KIP / IN ** 2) * 1000, method: "LRFD" });
    expect(Math.abs(kipPerIn(q) - 1.392)).toBeLessThan(0.0005);
  });

  it("E70 ASD: 0.928 kip/in per 1/16 in of leg (AISC 360-16 J2.4, Ω = 2.00; REFERENCES pub/mem)", () => {
    const q = filletStrengthPerMm({ legMm: IN / 16, electrodeMPa: 70 * (KIP / IN ** 2) * 1000, method: "ASD" });
    expect(Math.abs(kipPerIn(q) - 0.928)).toBeLessThan(0.0005);
  });

  it("1/4 in E70, 3 in longitudinal: 4 × 1.392 × 3 = 16.70 kip LRFD (AISC 360-16 J2.4; calc)", () => {
    const r = filletWeld({ ...QUARTER, method: "LRFD" });
    expect(Math.abs(kNToKip(r.designStrengthKN) - 16.7)).toBeLessThan(0.01);
    // Rn = φRn / 0.75 (J2.4)
    expect(r.nominalStrengthKN).toBeCloseTo(r.designStrengthKN / 0.75, 9);
  });

  it("same weld transverse: × 1.5 = 25.06 kip LRFD (AISC 360-16 J2.4 directional increase at θ = 90°; calc)", () => {
    const r = filletWeld({ ...QUARTER, method: "LRFD", angleDeg: 90 });
    expect(r.directionalFactor).toBeCloseTo(1.5, 12);
    expect(Math.abs(kNToKip(r.designStrengthKN) - 25.06)).toBeLessThan(0.01);
  });

  it("same weld ASD: 4 × 0.928 × 3 = 11.14 kip (AISC 360-16 J2.4, Ω = 2.00; calc)", () => {
    const r = filletWeld({ ...QUARTER, method: "ASD" });
    expect(Math.abs(kNToKip(r.designStrengthKN) - 11.14)).toBeLessThan(0.01);
  });

  it("directional factor 1.0 + 0.50 sin^1.5 θ (AISC 360-16 J2.4): 0° → 1.0, 45° → 1.297, 90° → 1.5", () => {
    expect(directionalFactor(0)).toBe(1);
    expect(directionalFactor(45)).toBeCloseTo(1 + 0.5 * Math.SQRT1_2 ** 1.5, 12);
    expect(directionalFactor(45)).toBeCloseTo(1.2973, 4);
    expect(directionalFactor(90)).toBeCloseTo(1.5, 12);
  });

  it("directionalIncrease: false keeps 0.60 FEXX at any angle (AISC 360-16 J2.4)", () => {
    const r = filletWeld({ ...QUARTER, method: "LRFD", angleDeg: 90, directionalIncrease: false });
    expect(Math.abs(kNToKip(r.designStrengthKN) - 16.7)).toBeLessThan(0.01);
    expect(r.notes.join(" ")).not.toMatch(/Directional increase/);
  });

  it("accepts FEXX in MPa: strength scales with FEXX (AISC 360-16 J2.4 Fnw = 0.60 FEXX)", () => {
    const a = filletWeld({ legMm: 6, lengthMm: 100, electrodeMPa: 490, method: "LRFD" });
    // 0.75 × 0.60 × 490 × 0.707 × 6 × 100 / 1000 = 93.53 kN (calc)
    expect(a.designStrengthKN).toBeCloseTo(0.75 * 0.6 * 490 * 0.707 * 6 * 100 / 1000, 9);
    expect(a.fnwMPa).toBeCloseTo(294, 9);
  });

  it("needs exactly one electrode input", () => {
    expect(() => filletWeld({ legMm: 6, lengthMm: 100, method: "LRFD" })).toThrow(/electrode/);
    expect(() =>
      filletWeld({ legMm: 6, lengthMm: 100, electrodeClass: "E70", electrodeMPa: 490, method: "LRFD" }),
    ).toThrow(/electrode/);
  });
});

describe("minimum fillet size — AWS D1.1:2020 Table 7.7 (= AISC 360-16 Table J2.4)", () => {
  const min = (t: number) => minimumFilletLeg({ thicknessMm: t }).minimumLegMm;
  it("T ≤ 1/4 in → 1/8 in, at the 1/4 in boundary (Table 7.7; pub)", () => {
    expect(min(3)).toBeCloseTo(IN / 8, 12);
    expect(min(IN / 4)).toBeCloseTo(IN / 8, 12);
  });
  it("1/4 < T ≤ 1/2 in → 3/16 in (Table 7.7; pub)", () => {
    expect(min(IN / 4 + 0.01)).toBeCloseTo((3 * IN) / 16, 12);
    expect(min(IN / 2)).toBeCloseTo((3 * IN) / 16, 12);
  });
  it("1/2 < T ≤ 3/4 in → 1/4 in (Table 7.7; pub)", () => {
    expect(min(IN / 2 + 0.01)).toBeCloseTo(IN / 4, 12);
    expect(min((3 * IN) / 4)).toBeCloseTo(IN / 4, 12);
  });
  it("T > 3/4 in → 5/16 in (Table 7.7; pub)", () => {
    expect(min((3 * IN) / 4 + 0.01)).toBeCloseTo((5 * IN) / 16, 12);
    expect(min(100)).toBeCloseTo((5 * IN) / 16, 12);
  });
  it("need not exceed the thinner part (Table 7.7; pub)", () => {
    const r = minimumFilletLeg({ thicknessMm: 25, thinnerPartMm: 4 });
    expect(r.minimumLegMm).toBe(4);
    expect(r.limitedByThinnerPart).toBe(true);
    expect(minimumFilletLeg({ thicknessMm: 25, thinnerPartMm: 10 }).minimumLegMm).toBeCloseTo((5 * IN) / 16, 12);
  });
  it("metric column 3/5/6/8 mm (sizes pub; thickness edges 6/12/20 mm from memory)", () => {
    const m = (t: number) => minimumFilletLeg({ thicknessMm: t, sizeSystem: "mm" }).minimumLegMm;
    expect([m(6), m(6.1), m(12), m(12.1), m(20), m(20.1)]).toEqual([3, 5, 5, 6, 6, 8]);
  });
});

describe("bracket check — AISC 360-16 J2.4 utilisation", () => {
  it("10 kip factored on the 16.70 kip weld → utilisation 0.599, passes (calc)", () => {
    const r = filletWeld({ ...QUARTER, method: "LRFD", loadKN: 10 * KIP, thickerPartMm: 12, thinnerPartMm: 10 });
    expect(r.utilisation).toBeCloseTo(10 / 16.7, 3);
    expect(r.legOk).toBe(true); // 12 mm → 3/16 in minimum (Table 7.7), 1/4 in leg is enough
    expect(r.ok).toBe(true);
  });

  it("20 kip factored exceeds 16.70 kip → fails (calc)", () => {
    const r = filletWeld({ ...QUARTER, method: "LRFD", loadKN: 20 * KIP });
    expect(r.utilisation).toBeGreaterThan(1);
    expect(r.ok).toBe(false);
  });

  it("1/4 in leg on 1 in housing wall is under the 5/16 in minimum → fails at any load (Table 7.7)", () => {
    const r = filletWeld({ ...QUARTER, method: "ASD", loadKN: 1, thickerPartMm: IN, thinnerPartMm: IN / 2 });
    expect(r.minimumLegMm).toBeCloseTo((5 * IN) / 16, 12);
    expect(r.legOk).toBe(false);
    expect(r.ok).toBe(false);
  });

  it("without load or thickness: no utilisation, no verdict, minimum not checked; base-metal note always", () => {
    const r = filletWeld({ ...QUARTER, method: "LRFD" });
    expect(r.utilisation).toBeUndefined();
    expect(r.ok).toBeUndefined();
    expect(r.minimumLegMm).toBeNull();
    expect(r.legOk).toBeNull();
    expect(r.notes.some((n) => /Base metal/.test(n) && /J4/.test(n))).toBe(true);
  });
});
