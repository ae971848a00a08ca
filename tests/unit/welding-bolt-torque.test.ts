import { describe, expect, it } from "vitest";
import {
  KN_PER_KIP,
  MPA_PER_KSI,
  NM_PER_LBF_FT,
  boltTorque,
  fToC,
  lbfFtToNm,
  preloadFromTorque,
} from "@/lib/welding";

describe("bolt torque T = K·D·F (Shigley eq. 8-27)", () => {
  it("worked: 0.2 × 12 mm × 40 kN = 96 N·m = 70.8 lbf·ft (REFERENCES calc)", () => {
    const r = boltTorque({ diameterMm: 12, preloadKN: 40, condition: "plain" });
    expect(r.torqueNm).toBeCloseTo(96, 9);
    expect(Math.abs(r.torqueLbfFt - 70.8)).toBeLessThan(0.05);
    expect(r.nutFactor).toBe(0.2);
  });
  it("K 0.10 waxed, 0.25 galvanised (Shigley; REFERENCES pub/mem)", () => {
    expect(boltTorque({ diameterMm: 12, preloadKN: 40, condition: "waxed" }).torqueNm).toBeCloseTo(48, 9);
    expect(boltTorque({ diameterMm: 12, preloadKN: 40, condition: "galvanised" }).torqueNm).toBeCloseTo(120, 9);
  });
  it("an explicit nut factor wins; the inverse gives the preload back", () => {
    expect(boltTorque({ diameterMm: 12, preloadKN: 40, condition: "waxed", nutFactor: 0.2 }).torqueNm).toBeCloseTo(96, 9);
    expect(preloadFromTorque(96, 12, 0.2)).toBeCloseTo(40, 9);
  });
  it("rejects non-positive inputs", () => {
    expect(() => boltTorque({ diameterMm: 0, preloadKN: 40 })).toThrow(RangeError);
  });
});

describe("units (NIST SP 811, 2008, Appendix B)", () => {
  it("1 kip = 4.4482216152605 kN; 1 lbf·ft = 1.355 818 N·m; 1 psi = 6.894 757 kPa", () => {
    expect(KN_PER_KIP).toBe(4.4482216152605);
    expect(NM_PER_LBF_FT).toBeCloseTo(1.3558179483, 9);
    expect(MPA_PER_KSI).toBeCloseTo(6.894757, 6);
  });
  it("worked: 100 lbf·ft = 135.58 N·m; 300 °F = 148.9 °C (calc)", () => {
    expect(Math.abs(lbfFtToNm(100) - 135.58)).toBeLessThan(0.005);
    expect(Math.abs(fToC(300) - 148.9)).toBeLessThan(0.05);
  });
});
