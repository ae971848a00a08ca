import { describe, expect, it } from "vitest";

import { dftAreasToMeasure, dftSpotLimits, evaluateDftArea } from "@/lib/coating";
import { dftRequestSchema } from "@/lib/coating/schemas";

// Source: SSPC-PA 2 (2015, editorial revision 2018), as summarised in REFERENCES.md (Coatings).
describe("dftSpotLimits — spot ≥ 80 % of min, ≤ 120 % of max (SSPC-PA 2, pub)", () => {
  it("4–6 mil → 3.2 and 7.2 mil (calc, REFERENCES.md worked example)", () => {
    expect(dftSpotLimits({ specMin: 4, specMax: 6 })).toEqual({ min: 3.2, max: 7.2 });
  });
  it("8–12 mil → 6.4 and 14.4 mil (pub, SSPC-PA 2 example in REFERENCES.md)", () => {
    expect(dftSpotLimits({ specMin: 8, specMax: 12 })).toEqual({ min: 6.4, max: 14.4 });
  });
});

describe("evaluateDftArea (SSPC-PA 2)", () => {
  // calc (REFERENCES.md): spots 5.0, 4.0, 5.67, 4.5, 5.1 → area 4.85, conforms to 4–6 mil.
  // Each spot is 3 gauge readings (PA 2: ≥ 3 per spot) chosen to average to the worked values.
  const worked = [
    [4.9, 5.0, 5.1],
    [3.8, 4.0, 4.2],
    [5.5, 5.7, 5.8], // 5.667
    [4.5, 4.4, 4.6],
    [5.0, 5.1, 5.2],
  ];

  it("worked example: spot averages 5.0, 4.0, 5.67, 4.5, 5.1 → area 4.85, conforms", () => {
    const r = evaluateDftArea({ specMin: 4, specMax: 6 }, worked);
    expect(r.spots.map((s) => s.average)).toEqual([
      expect.closeTo(5.0, 2),
      expect.closeTo(4.0, 2),
      expect.closeTo(5.67, 2),
      expect.closeTo(4.5, 2),
      expect.closeTo(5.1, 2),
    ]);
    expect(r.areaAverage).toBeCloseTo(4.85, 2);
    expect(r.spotsOk).toBe(true);
    expect(r.areaOk).toBe(true);
    expect(r.ok).toBe(true);
    expect(r.warnings).toEqual([]);
  });

  it("a spot averaging below 80 % of the minimum fails even if the area average conforms", () => {
    // 4–6 mil: spot limit 3.2 (calc); spot 3.1 fails; area (5.5·4 + 3.1)/5 = 5.02 is within 4–6.
    const r = evaluateDftArea({ specMin: 4, specMax: 6 }, [[5.5, 5.5, 5.5], [5.5, 5.5, 5.5], [3.0, 3.1, 3.2], [5.5, 5.5, 5.5], [5.5, 5.5, 5.5]]);
    expect(r.spots[2]).toMatchObject({ ok: false, reason: "below-spot-minimum" });
    expect(r.areaOk).toBe(true);
    expect(r.ok).toBe(false);
  });

  it("a spot averaging above 120 % of the maximum fails", () => {
    const r = evaluateDftArea({ specMin: 4, specMax: 6 }, [[7.3, 7.3, 7.3], [5, 5, 5], [5, 5, 5], [5, 5, 5], [5, 5, 5]]);
    expect(r.spots[0]).toMatchObject({ ok: false, reason: "above-spot-maximum" });
    expect(r.ok).toBe(false);
  });

  it("spots exactly on 3.2 and 7.2 mil conform (limits are inclusive)", () => {
    const r = evaluateDftArea({ specMin: 4, specMax: 6 }, [[3.2, 3.2, 3.2], [7.2, 7.2, 7.2], [5, 5, 5], [4.9, 4.9, 4.9], [4.7, 4.7, 4.7]]);
    expect(r.spotsOk).toBe(true);
  });

  it("every spot within 80 %/120 % but an area average below the minimum fails the area", () => {
    // 4–6 mil, all spots 3.5: each ≥ 3.2 (spot ok) but area 3.5 < 4 (area fails).
    const spots = Array.from({ length: 5 }, () => [3.5, 3.5, 3.5]);
    const r = evaluateDftArea({ specMin: 4, specMax: 6 }, spots);
    expect(r.spotsOk).toBe(true);
    expect(r.areaOk).toBe(false);
    expect(r.ok).toBe(false);
  });

  it("a spot with fewer than 3 readings is refused (PA 2: spot = average of ≥ 3 readings)", () => {
    expect(() => evaluateDftArea({ specMin: 4, specMax: 6 }, [[5, 5]])).toThrow(/at least 3/);
  });

  it("warns when an area has other than 5 spots", () => {
    const r = evaluateDftArea({ specMin: 4, specMax: 6 }, [[5, 5, 5], [5, 5, 5]]);
    expect(r.ok).toBe(true);
    expect(r.warnings.join(" ")).toMatch(/5 spot/);
  });

  it("rejects an inverted specification", () => {
    expect(() => dftSpotLimits({ specMin: 6, specMax: 4 })).toThrow(RangeError);
  });
});

describe("dftAreasToMeasure (SSPC-PA 2: 10 m² / 100 ft² areas)", () => {
  it("12,500 ft² → 15 areas (pub, REFERENCES.md: 3 in the first 1,000 ft² + 12 for the other 11,500)", () => {
    expect(dftAreasToMeasure(12_500, "ft2")).toBe(15);
  });
  it("< 30 m²: one area per 10 m² or part (pub)", () => {
    expect(dftAreasToMeasure(4)).toBe(1);
    expect(dftAreasToMeasure(10)).toBe(1);
    expect(dftAreasToMeasure(25)).toBe(3);
    expect(dftAreasToMeasure(250, "ft2")).toBe(3);
  });
  it("30–100 m²: 3 areas (pub)", () => {
    expect(dftAreasToMeasure(30)).toBe(3);
    expect(dftAreasToMeasure(75)).toBe(3);
    expect(dftAreasToMeasure(100)).toBe(3);
  });
  it("> 100 m²: 3 in the first 100 m² then one per further 100 m² or part (pub; 'or part' as in the 12,500 ft² example)", () => {
    expect(dftAreasToMeasure(200)).toBe(4);
    expect(dftAreasToMeasure(250)).toBe(5);
  });
  it("rejects a non-positive area", () => {
    expect(() => dftAreasToMeasure(0)).toThrow(RangeError);
  });
});

describe("dftRequestSchema", () => {
  it("accepts the worked example", () => {
    const body = { specMin: 4, specMax: 6, unit: "mil", spots: [[5, 5, 5], [4, 4, 4], [5.5, 5.7, 5.8]] };
    expect(dftRequestSchema.parse(body)).toEqual(body);
  });
  it("names the spot with fewer than 3 readings", () => {
    const r = dftRequestSchema.safeParse({ specMin: 4, specMax: 6, spots: [[5, 5, 5], [5, 5]] });
    expect(r.success).toBe(false);
    expect(r.error?.issues.map((i) => i.path.join("."))).toEqual(["spots.1"]);
  });
  it("names a non-numeric reading, an inverted range and an unknown key", () => {
    const bad = dftRequestSchema.safeParse({ specMin: 4, specMax: 6, spots: [[5, "5", 5]] });
    expect(bad.error?.issues.map((i) => i.path.join("."))).toEqual(["spots.0.1"]);
    const inverted = dftRequestSchema.safeParse({ specMin: 6, specMax: 4, spots: [[5, 5, 5]] });
    expect(inverted.error?.issues.map((i) => i.path.join("."))).toEqual(["specMax"]);
    expect(dftRequestSchema.safeParse({ specMin: 4, specMax: 6, spots: [[5, 5, 5]], extra: 1 }).success).toBe(false);
  });
});
