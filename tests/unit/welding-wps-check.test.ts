import { describe, expect, it } from "vitest";
import { checkPassAgainstWps, type PassValues, type WpsRanges } from "@/lib/welding";

const WPS: WpsRanges = {
  process: "GMAW",
  voltsMin: 22,
  voltsMax: 26,
  ampsMin: 160,
  ampsMax: 200,
  travelSpeedMinMmPerMin: 150,
  travelSpeedMaxMmPerMin: 300,
  heatInputMaxKJPerMm: 1.2,
  preheatMinC: 10,
  interpassMaxC: 250,
};

// The REFERENCES.md worked pass: 24 V, 180 A, 8 in/min = 203.2 mm/min → 1.276 kJ/mm arc energy,
// GMAW Q 1.020 kJ/mm (ASME IX QW-409.1(a) / ISO/TR 17671-1; calc).
const PASS: PassValues = { volts: 24, amps: 180, travelSpeedMmPerMin: 203.2, preheatC: 20 };

describe("WPS range check", () => {
  it("ASME basis: 1.276 kJ/mm arc energy over a 1.2 kJ/mm maximum → out of range, not blocked", () => {
    const r = checkPassAgainstWps(WPS, PASS);
    const hi = r.findings.find((f) => f.field === "heatInput");
    expect(hi?.ok).toBe(false);
    expect(Math.abs((hi?.value ?? 0) - 1.276)).toBeLessThan(0.0005);
    expect(hi?.max).toBe(1.2);
    expect(hi?.message).toMatch(/above the WPS maximum/);
    expect(r.outOfRange).toBe(true);
    expect(r.blocked).toBe(false);
  });

  it("ISO basis: GMAW Q 1.020 kJ/mm within 1.2 kJ/mm → all findings ok", () => {
    const r = checkPassAgainstWps({ ...WPS, heatInputBasis: "iso-q" }, PASS);
    expect(Math.abs((r.findings.find((f) => f.field === "heatInput")?.value ?? 0) - 1.02)).toBeLessThan(0.0005);
    expect(r.ok).toBe(true);
    expect(r.outOfRange).toBe(false);
    expect(r.findings.map((f) => f.field)).toEqual(["volts", "amps", "travelSpeed", "heatInput", "preheat"]);
  });

  it("preheat below the WPS minimum blocks the pass, with the reason", () => {
    const r = checkPassAgainstWps({ ...WPS, heatInputMaxKJPerMm: 2 }, { ...PASS, preheatC: 5 });
    expect(r.blocked).toBe(true);
    expect(r.blockedReason).toMatch(/5 °C.*below.*10 °C/);
    expect(r.outOfRange).toBe(false);
    expect(r.ok).toBe(false);
  });

  it("preheat not recorded blocks when the WPS sets a minimum", () => {
    const { preheatC: _omit, ...noPreheat } = PASS;
    const r = checkPassAgainstWps(WPS, noPreheat);
    expect(r.blocked).toBe(true);
    expect(r.blockedReason).toMatch(/not recorded/);
  });

  it("amps above, volts below and slow travel: one finding each with min/max", () => {
    const r = checkPassAgainstWps(
      { ...WPS, heatInputMaxKJPerMm: 5 },
      { volts: 21, amps: 210, travelSpeedMmPerMin: 140, preheatC: 15 },
    );
    const byField = Object.fromEntries(r.findings.map((f) => [f.field, f]));
    expect(byField.volts).toMatchObject({ ok: false, value: 21, min: 22, max: 26 });
    expect(byField.amps).toMatchObject({ ok: false, value: 210, max: 200 });
    expect(byField.amps?.message).toMatch(/210 A is above the WPS maximum of 200 A/);
    expect(byField.travelSpeed).toMatchObject({ ok: false, value: 140, min: 150 });
    expect(r.outOfRange).toBe(true);
    expect(r.blocked).toBe(false);
  });

  it("values at the limits are within range", () => {
    const r = checkPassAgainstWps(
      { ...WPS, heatInputMaxKJPerMm: undefined },
      { volts: 26, amps: 160, travelSpeedMmPerMin: 300, preheatC: 10, interpassC: 250 },
    );
    expect(r.ok).toBe(true);
  });

  it("interpass: skipped when absent (first pass), out of range when over", () => {
    expect(checkPassAgainstWps(WPS, PASS).findings.some((f) => f.field === "interpass")).toBe(false);
    const r = checkPassAgainstWps({ ...WPS, heatInputBasis: "iso-q" }, { ...PASS, interpassC: 260 });
    expect(r.findings.find((f) => f.field === "interpass")).toMatchObject({ ok: false, value: 260, max: 250 });
    expect(r.outOfRange).toBe(true);
  });

  it("a limited value that was not recorded makes the check incomplete, not out of range", () => {
    const r = checkPassAgainstWps({ ...WPS, heatInputMaxKJPerMm: undefined }, { volts: 24, travelSpeedMmPerMin: 200, preheatC: 20 });
    expect(r.incomplete).toBe(true);
    expect(r.outOfRange).toBe(false);
    expect(r.findings.find((f) => f.field === "amps")).toMatchObject({ ok: false, value: null });
  });

  it("a measured (c)-route heat input wins over V·A/v", () => {
    const r = checkPassAgainstWps(WPS, { ...PASS, heatInputKJPerMm: 1.1 });
    expect(r.findings.find((f) => f.field === "heatInput")).toMatchObject({ ok: true, value: 1.1 });
  });

  it("a position outside the WPS's positions is flagged (out of range, not blocking); an absent position is not judged", () => {
    const wps = { ...WPS, heatInputBasis: "iso-q" as const, positions: ["1F", "2F"] };
    const off = checkPassAgainstWps(wps, { ...PASS, position: "3F" });
    expect(off.findings.find((f) => f.field === "position")).toMatchObject({ ok: false, shown: "3F", message: "Position 3F is not among the WPS positions (1F, 2F)." });
    expect(off).toMatchObject({ outOfRange: true, incomplete: false, blocked: false, ok: false });
    expect(checkPassAgainstWps(wps, { ...PASS, position: "2F" }).ok).toBe(true);
    expect(checkPassAgainstWps(wps, PASS).findings.some((f) => f.field === "position")).toBe(false);
  });
});
