import { describe, expect, it } from "vitest";
import type { z } from "zod";
import { heatInput } from "@/lib/welding";
import { continuityRequestSchema, filletWeldRequestSchema, heatInputRequestSchema, passHeatInputRequestSchema, visualObservationsSchema, visualRequestSchema, wpsRangesSchema } from "@/lib/welding/schema";

// Returns the issues as "path: message" so each test can say which field failed and why.
function issues(schema: z.ZodType, input: unknown): string[] {
  const r = schema.safeParse(input);
  if (r.success) return [];
  return r.error.issues.map((i) => `${i.path.join(".")}: ${i.message}`);
}

const HEAT = { process: "GMAW", volts: 24, amps: 180, travelSpeed: { value: 8, unit: "in/min" } };

describe("heatInputRequestSchema (POST /api/calc/heat-input)", () => {
  it("accepts the worked request and its output feeds heatInput → 32,400 J/in (ASME IX QW-409.1(a); calc)", () => {
    const parsed = heatInputRequestSchema.parse(HEAT);
    expect(heatInput(parsed).jPerIn).toBeCloseTo(32_400, 6);
  });

  it("rejects negative, zero, infinite, string and missing numbers with the field path", () => {
    expect(issues(heatInputRequestSchema, { ...HEAT, volts: -1 })).toEqual(["volts: volts must be greater than 0 V"]);
    expect(issues(heatInputRequestSchema, { ...HEAT, amps: 0 })).toEqual(["amps: amps must be greater than 0 A"]);
    expect(issues(heatInputRequestSchema, { ...HEAT, amps: Infinity })[0]).toMatch(/^amps: /);
    expect(issues(heatInputRequestSchema, { ...HEAT, volts: "24" })).toEqual(["volts: volts must be a number in V"]);
    const { volts: _v, ...noVolts } = HEAT;
    expect(issues(heatInputRequestSchema, noVolts)).toEqual(["volts: volts is required"]);
  });

  it("rejects out-of-bound values that betray a unit mix-up", () => {
    expect(issues(heatInputRequestSchema, { ...HEAT, volts: 180 })).toEqual(["volts: volts must be at most 100 V"]);
    expect(issues(heatInputRequestSchema, { ...HEAT, travelSpeed: { value: 500, unit: "in/min" } })).toEqual([
      "travelSpeed.value: travel speed must be at most 400 in/min",
    ]);
    expect(issues(heatInputRequestSchema, { ...HEAT, travelSpeed: { value: 500, unit: "mm/min" } })).toEqual([]);
  });

  it("rejects an unknown process, unit or extra key", () => {
    expect(issues(heatInputRequestSchema, { ...HEAT, process: "MIG" })[0]).toMatch(/^process: process must be one of SMAW/);
    expect(issues(heatInputRequestSchema, { ...HEAT, travelSpeed: { value: 8, unit: "m/s" } })).toEqual([
      'travelSpeed.unit: travel speed unit must be "mm/min" or "in/min"',
    ]);
    expect(issues(heatInputRequestSchema, { ...HEAT, efficiency: 0.8 })[0]).toMatch(/efficiency/);
  });
});

describe("passHeatInputRequestSchema", () => {
  it("needs exactly one travel-speed source for the (a) route", () => {
    const base = { method: "voltage-current", volts: 24, amps: 180 };
    expect(issues(passHeatInputRequestSchema, base)[0]).toMatch(/^beadLength: /);
    expect(
      issues(passHeatInputRequestSchema, { ...base, travelSpeed: { value: 8, unit: "in/min" }, arcTimeS: 60 })[0],
    ).toMatch(/^travelSpeed: .*not both/);
    expect(issues(passHeatInputRequestSchema, { ...base, beadLength: { value: 8, unit: "in" }, arcTimeS: 60 })).toEqual([]);
  });
  it("accepts the (c)(2) worked request; rejects an unknown method", () => {
    expect(
      issues(passHeatInputRequestSchema, { method: "power", powerW: 4300, arcTimeS: 40, beadLength: { value: 6, unit: "in" } }),
    ).toEqual([]);
    expect(issues(passHeatInputRequestSchema, { method: "guess" })[0]).toMatch(/method/);
  });
});

describe("filletWeldRequestSchema (POST /api/calc/fillet-weld)", () => {
  const F = { legMm: 6.35, lengthMm: 76.2, electrodeClass: "E70", method: "LRFD" };
  it("accepts a class or a strength", () => {
    expect(issues(filletWeldRequestSchema, F)).toEqual([]);
    expect(issues(filletWeldRequestSchema, { ...F, electrodeClass: undefined, electrodeMPa: 490 })).toEqual([]);
  });
  it("rejects a missing or doubled electrode, a bad angle, method and thicknesses", () => {
    expect(issues(filletWeldRequestSchema, { ...F, electrodeClass: undefined })[0]).toMatch(/^electrodeClass: /);
    expect(issues(filletWeldRequestSchema, { ...F, electrodeMPa: 490 })[0]).toMatch(/^electrodeMPa: .*not both/);
    expect(issues(filletWeldRequestSchema, { ...F, electrodeClass: "E7018" })[0]).toMatch(/^electrodeClass: electrode class must be one of/);
    expect(issues(filletWeldRequestSchema, { ...F, angleDeg: 120 })).toEqual(["angleDeg: load angle must be at most 90 degrees"]);
    expect(issues(filletWeldRequestSchema, { ...F, method: "WSD" })).toEqual(['method: method must be "LRFD" or "ASD"']);
    expect(issues(filletWeldRequestSchema, { ...F, thinnerPartMm: 12, thickerPartMm: 6 })[0]).toMatch(/^thinnerPartMm: /);
    expect(issues(filletWeldRequestSchema, { ...F, legMm: 0 })).toEqual(["legMm: leg must be greater than 0 mm"]);
    expect(issues(filletWeldRequestSchema, { ...F, loadKN: -5 })).toEqual(["loadKN: load must be at least 0 kN"]);
  });
});

describe("visual, WPS and continuity schemas", () => {
  const OBS = {
    cracks: false, fusionComplete: true, cratersFilled: true, profileAcceptable: true,
    specifiedLegMm: 6, measuredLegMm: 6, weldLengthMm: 300, materialThicknessMm: 9.5,
    undercutDepthMm: 0, undercutAccumulatedMm: 0, porosityMm: 0, porosity12Mm: 0,
    arcStrikes: false, spatterAcceptable: true,
  };
  it("visual observations: complete set accepted; missing boolean and negative depth rejected by path", () => {
    expect(issues(visualObservationsSchema, OBS)).toEqual([]);
    const { cracks: _c, ...noCracks } = OBS;
    expect(issues(visualObservationsSchema, noCracks)).toEqual(["cracks: cracks is required"]);
    expect(issues(visualObservationsSchema, { ...OBS, undercutDepthMm: -0.1 })).toEqual([
      "undercutDepthMm: undercut depth must be at least 0 mm",
    ]);
    expect(issues(visualRequestSchema, { criteria: "iso5817-A", observations: OBS })[0]).toMatch(/^criteria: /);
    expect(issues(visualRequestSchema, { criteria: "aws-d1.1-static", observations: { ...OBS, weldLengthMm: 0 } })).toEqual([
      "observations.weldLengthMm: weld length must be greater than 0 mm",
    ]);
  });
  it("WPS ranges: min above max rejected at the min field", () => {
    expect(issues(wpsRangesSchema, { ampsMin: 200, ampsMax: 150 })).toEqual(["ampsMin: ampsMin must not exceed ampsMax"]);
  });
  it("continuity: impossible date and last use after today rejected by path", () => {
    expect(issues(continuityRequestSchema, { code: "asme-ix", lastUsed: "2025-02-30", today: "2025-03-01" })).toEqual([
      "lastUsed: last use date must be a calendar date YYYY-MM-DD",
    ]);
    expect(issues(continuityRequestSchema, { code: "aws-d1.1", lastUsed: "2025-03-02", today: "2025-03-01" })).toEqual([
      "lastUsed: last use date cannot be after today",
    ]);
    expect(issues(continuityRequestSchema, { code: "api-1104", lastUsed: "2025-01-10", today: "2025-03-01" })[0]).toMatch(/^code: /);
  });
});
