import { describe, expect, it } from "vitest";
import { measureBounds, measureVerdict, torqueBounds, torqueVerdict } from "@/lib/jobs/tolerance";
import { toStored } from "@/lib/jobs/units";

// Tolerance rules of lib/procedures/schema.ts (plusMinus about a nominal, range, min, max); limits inclusive.
describe("measure tolerance", () => {
  const pm = { nominal: 100, tolerance: { type: "plusMinus" as const, plus: 1, minus: 0.5 } };

  it("± about a nominal gives nominal − minus … nominal + plus", () => {
    expect(measureBounds(pm)).toEqual({ low: 99.5, high: 101 });
  });

  it("a reading exactly at either limit passes; a hair beyond fails on the right side", () => {
    expect(measureVerdict(pm, 101).ok).toBe(true);
    expect(measureVerdict(pm, 99.5).ok).toBe(true);
    expect(measureVerdict(pm, 101.001)).toMatchObject({ ok: false, side: "high" });
    expect(measureVerdict(pm, 99.499)).toMatchObject({ ok: false, side: "low" });
  });

  it("reports the deviation from the nominal", () => {
    expect(measureVerdict(pm, 100.4).deviation).toBeCloseTo(0.4, 12);
  });

  it("range, min and max are one- or two-sided", () => {
    expect(measureVerdict({ tolerance: { type: "range", min: 5, max: 7 } }, 7).ok).toBe(true);
    expect(measureVerdict({ tolerance: { type: "range", min: 5, max: 7 } }, 4.99).side).toBe("low");
    expect(measureVerdict({ tolerance: { type: "min", min: 6 } }, 1e6).ok).toBe(true);
    expect(measureVerdict({ tolerance: { type: "min", min: 6 } }, 5.9).ok).toBe(false);
    expect(measureVerdict({ tolerance: { type: "max", max: 0.5 } }, -3).ok).toBe(true);
    expect(measureVerdict({ tolerance: { type: "max", max: 0.5 } }, 0.51).side).toBe("high");
  });

  it("a limit met exactly after an inch entry is not failed by conversion noise", () => {
    // 4 in = 101.6 mm exactly (NIST SP 811 Appendix B: 1 in = 25.4 mm); typed in inches, stored in mm.
    const reading = toStored("length", 4, "in");
    expect(measureVerdict({ tolerance: { type: "max", max: 101.6 } }, reading).ok).toBe(true);
    expect(measureVerdict({ tolerance: { type: "max", max: 101.6 } }, toStored("length", 4.001, "in")).ok).toBe(false);
  });

  it("refuses a reading that is not a finite number", () => {
    expect(() => measureVerdict(pm, Number.NaN)).toThrow(RangeError);
  });
});

describe("torque tolerance", () => {
  const spec = { torqueNm: 176.26, tolerancePct: 5 };

  it("± tolerancePct of the specified torque", () => {
    const b = torqueBounds(spec);
    expect(b.low).toBeCloseTo(167.447, 9);
    expect(b.high).toBeCloseTo(185.073, 9);
  });

  it("130 lbf·ft on the wrench is within 176.26 N·m ± 5 % (1 lbf·ft = 1.355 818 N·m, NIST SP 811)", () => {
    const achieved = toStored("torque", 130, "lbf_ft");
    expect(achieved).toBeCloseTo(176.2563, 3);
    expect(torqueVerdict(spec, achieved).ok).toBe(true);
  });

  it("under- and over-torque fail", () => {
    expect(torqueVerdict(spec, 160)).toMatchObject({ ok: false, side: "low" });
    expect(torqueVerdict(spec, 190)).toMatchObject({ ok: false, side: "high" });
  });
});
