import { describe, expect, it } from "vitest";
import { api } from "./support";

// Exact factors, NIST SP 811 (2008) App. B: 1 in = 25.4 mm, 1 lbf = 4.448 221 615 260 5 N (1 kip in kN).
const IN = 25.4;
const KN_PER_KIP = 4.4482216152605;

describe("POST /api/calc/heat-input", () => {
  const worked = { volts: 24, amps: 180, travelSpeed: { value: 8, unit: "in/min" } };

  it("ASME IX QW-409.1(a); REFERENCES worked example 24 V 180 A 8 in/min → 32,400 J/in = 1.276 kJ/mm arc energy; GMAW Q = 1.020 kJ/mm (ISO/TR 17671-1, k 0.8)", async () => {
    const r = await api("/api/calc/heat-input", { body: { process: "GMAW", ...worked } });
    expect(r.status).toBe(200);
    expect(Object.keys(r.json).sort()).toEqual(["arcEnergyKJPerMm", "efficiencyFactor", "heatInputKJPerMm", "jPerIn"]);
    expect(r.json.jPerIn).toBeCloseTo(32_400, 6); // QW-409.1(a): 24 × 180 × 60 / 8
    expect(r.json.arcEnergyKJPerMm).toBeCloseTo(1.276, 3); // REFERENCES: 1.276 kJ/mm
    expect(r.json.efficiencyFactor).toBe(0.8); // ISO/TR 17671-1: GMAW 0.8
    expect(r.json.heatInputKJPerMm).toBeCloseTo(1.02, 3); // REFERENCES: 1.020 kJ/mm
  });

  it("REFERENCES worked example: GTAW Q = 0.765 kJ/mm (k 0.6); SAW k 1.0 (ISO/TR 17671-1)", async () => {
    const gtaw = await api("/api/calc/heat-input", { body: { process: "GTAW", ...worked } });
    expect(gtaw.json.efficiencyFactor).toBe(0.6);
    expect(gtaw.json.heatInputKJPerMm).toBeCloseTo(0.765, 3);
    const saw = await api("/api/calc/heat-input", { body: { process: "SAW", ...worked } });
    expect(saw.json.heatInputKJPerMm).toBeCloseTo(saw.json.arcEnergyKJPerMm, 12);
  });

  it("the same pass given in mm/min (8 in/min = 203.2 mm/min, NIST SP 811) gives the same figures", async () => {
    const r = await api("/api/calc/heat-input", { body: { process: "GMAW", volts: 24, amps: 180, travelSpeed: { value: 8 * IN, unit: "mm/min" } } });
    expect(r.status).toBe(200);
    expect(r.json.jPerIn).toBeCloseTo(32_400, 6);
    expect(r.json.heatInputKJPerMm).toBeCloseTo(1.02, 3);
  });

  it("bad input answers 400 with the field paths", async () => {
    const r = await api("/api/calc/heat-input", { body: { process: "MIG", volts: -24, amps: "180", travelSpeed: { value: 8, unit: "ft/min" } } });
    expect(r.status).toBe(400);
    expect(Object.keys(r.json.error.fields)).toEqual(expect.arrayContaining(["process", "volts", "amps", "travelSpeed.unit"]));
    const missing = await api("/api/calc/heat-input", { body: { process: "GMAW", volts: 24, amps: 180 } });
    expect(missing.status).toBe(400);
    expect(missing.json.error.fields.travelSpeed).toBeDefined();
    const zero = await api("/api/calc/heat-input", { body: { process: "GMAW", volts: 24, amps: 180, travelSpeed: { value: 0, unit: "in/min" } } });
    expect(zero.status).toBe(400);
    expect(zero.json.error.fields["travelSpeed.value"]).toBeDefined();
  });
});

describe("POST /api/calc/fillet-weld", () => {
  // REFERENCES worked example (calc): 1/4 in E70, 3 in long, longitudinal: 4 × 1.392 × 3 = 16.70 kip (LRFD).
  const quarterInch = { legMm: 0.25 * IN, lengthMm: 3 * IN, electrodeClass: "E70", method: "LRFD" };

  it("AISC 360-16 J2.4; REFERENCES worked example 1/4 in E70 × 3 in longitudinal → 16.70 kip LRFD; throat 0.707 × leg (J2.2a)", async () => {
    const r = await api("/api/calc/fillet-weld", { body: quarterInch });
    expect(r.status).toBe(200);
    expect(r.json.designStrengthKN / KN_PER_KIP).toBeCloseTo(16.7, 2);
    expect(r.json.throatMm).toBeCloseTo(0.707 * 0.25 * IN, 9);
    expect(r.json.directionalFactor).toBe(1);
    expect(r.json.minimumLegMm).toBeNull();
    expect(r.json.legOk).toBeNull();
  });

  it("REFERENCES worked example: transverse (90°) × 1.5 = 25.06 kip; ASD 0.928 kip/in per 1/16 in → 11.14 kip (AISC 360-16 J2.4, Ω 2.00)", async () => {
    const transverse = await api("/api/calc/fillet-weld", { body: { ...quarterInch, angleDeg: 90 } });
    expect(transverse.json.directionalFactor).toBeCloseTo(1.5, 12);
    expect(transverse.json.designStrengthKN / KN_PER_KIP).toBeCloseTo(25.06, 1);
    const asd = await api("/api/calc/fillet-weld", { body: { ...quarterInch, method: "ASD" } });
    expect(asd.json.designStrengthKN / KN_PER_KIP).toBeCloseTo(4 * 0.928 * 3, 1);
  });

  it("AWS D1.1:2020 Table 7.7: 5/8 in base metal needs a 1/4 in fillet; 3/16 in on it is undersize and fails the bracket check", async () => {
    // T = 5/8 in lies in 1/2 < T ≤ 3/4 → 1/4 in (REFERENCES "Fillet welds", pub).
    const ok = await api("/api/calc/fillet-weld", { body: { ...quarterInch, thinnerPartMm: 0.375 * IN, thickerPartMm: 0.625 * IN, loadKN: 50 } });
    expect(ok.status).toBe(200);
    expect(ok.json.minimumLegMm).toBeCloseTo(0.25 * IN, 9);
    expect(ok.json.legOk).toBe(true);
    expect(ok.json.utilisation).toBeCloseTo(50 / (16.7 * KN_PER_KIP), 2);
    expect(ok.json.ok).toBe(true);
    const under = await api("/api/calc/fillet-weld", { body: { ...quarterInch, legMm: (3 / 16) * IN, thinnerPartMm: 0.375 * IN, thickerPartMm: 0.625 * IN, loadKN: 10 } });
    expect(under.json.legOk).toBe(false);
    expect(under.json.ok).toBe(false);
    const over = await api("/api/calc/fillet-weld", { body: { ...quarterInch, loadKN: 100 } });
    expect(over.json.utilisation).toBeGreaterThan(1);
    expect(over.json.ok).toBe(false);
  });

  it("bad input answers 400 with the field paths", async () => {
    const r = await api("/api/calc/fillet-weld", { body: { legMm: 0, lengthMm: "3 in", electrodeClass: "E71", method: "LFRD", angleDeg: 120 } });
    expect(r.status).toBe(400);
    expect(Object.keys(r.json.error.fields)).toEqual(expect.arrayContaining(["legMm", "lengthMm", "electrodeClass", "method", "angleDeg"]));
    const both = await api("/api/calc/fillet-weld", { body: { ...quarterInch, electrodeMPa: 480 } });
    expect(both.status).toBe(400);
    expect(both.json.error.fields.electrodeMPa).toBeDefined();
  });
});
