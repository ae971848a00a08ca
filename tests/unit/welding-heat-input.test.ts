import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  PROCESS_INFO,
  efficiencyFactor,
  heatInput,
  passHeatInput,
  processFromIso4063,
} from "@/lib/welding";

// Worked example, REFERENCES.md "Heat input" (calc): 24 V, 180 A, 8 in/min.
const WORKED = { volts: 24, amps: 180, travelSpeed: { value: 8, unit: "in/min" as const } };

describe("heatInput — ASME IX QW-409.1(a) and ISO/TR 17671-1", () => {
  it("24 V, 180 A, 8 in/min → 32,400 J/in (ASME IX QW-409.1(a); calc)", () => {
    expect(heatInput({ process: "GMAW", ...WORKED }).jPerIn).toBeCloseTo(32_400, 6);
  });

  it("same pass → 1.276 kJ/mm arc energy (ISO/TR 17671-1 arc energy U·I/v × 10⁻³; calc)", () => {
    const r = heatInput({ process: "GMAW", ...WORKED });
    expect(Math.abs(r.arcEnergyKJPerMm - 1.276)).toBeLessThan(0.0005);
  });

  it("GMAW Q = 0.8 × arc energy = 1.020 kJ/mm (ISO/TR 17671-1 k = 0.8; calc)", () => {
    const r = heatInput({ process: "GMAW", ...WORKED });
    expect(r.efficiencyFactor).toBe(0.8);
    expect(Math.abs(r.heatInputKJPerMm - 1.02)).toBeLessThan(0.0005);
  });

  it("GTAW Q = 0.6 × arc energy = 0.765 kJ/mm (ISO/TR 17671-1 k = 0.6; calc)", () => {
    const r = heatInput({ process: "GTAW", ...WORKED });
    expect(r.efficiencyFactor).toBe(0.6);
    expect(Math.abs(r.heatInputKJPerMm - 0.765)).toBeLessThan(0.0005);
  });

  it("k per process: SAW 1.0; SMAW, GMAW, FCAW 0.8; GTAW, plasma 0.6 (ISO/TR 17671-1; pub)", () => {
    expect(efficiencyFactor("SAW")).toBe(1.0);
    expect(efficiencyFactor("SMAW")).toBe(0.8);
    expect(efficiencyFactor("GMAW")).toBe(0.8);
    expect(efficiencyFactor("FCAW")).toBe(0.8);
    expect(efficiencyFactor("GTAW")).toBe(0.6);
    expect(efficiencyFactor("PAW")).toBe(0.6);
  });

  it("SAW heat input equals its arc energy, k = 1.0 (ISO/TR 17671-1)", () => {
    const r = heatInput({ process: "SAW", ...WORKED });
    expect(r.heatInputKJPerMm).toBe(r.arcEnergyKJPerMm);
  });

  it("8 in/min given as 203.2 mm/min gives the same 32,400 J/in (1 in = 25.4 mm, NIST SP 811)", () => {
    const r = heatInput({ process: "GMAW", volts: 24, amps: 180, travelSpeed: { value: 203.2, unit: "mm/min" } });
    expect(r.jPerIn).toBeCloseTo(32_400, 6);
    expect(Math.abs(r.arcEnergyKJPerMm - 1.276)).toBeLessThan(0.0005);
  });

  it("returns exactly the four fields of POST /api/calc/heat-input", () => {
    expect(Object.keys(heatInput({ process: "SMAW", ...WORKED })).sort()).toEqual(
      ["arcEnergyKJPerMm", "efficiencyFactor", "heatInputKJPerMm", "jPerIn"],
    );
  });

  it("rejects non-positive or non-finite inputs", () => {
    expect(() => heatInput({ process: "SMAW", ...WORKED, volts: 0 })).toThrow(RangeError);
    expect(() => heatInput({ process: "SMAW", ...WORKED, amps: Number.NaN })).toThrow(/amps/);
    expect(() => heatInput({ process: "SMAW", ...WORKED, travelSpeed: { value: -1, unit: "mm/min" } })).toThrow(
      /travelSpeed/,
    );
  });

  it("J/in and kJ/mm agree through 1 in = 25.4 mm for any pass (calc, NIST SP 811)", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 5, max: 60, noNaN: true }),
        fc.double({ min: 10, max: 1500, noNaN: true }),
        fc.double({ min: 20, max: 3000, noNaN: true }),
        (volts, amps, mmPerMin) => {
          const r = heatInput({ process: "FCAW", volts, amps, travelSpeed: { value: mmPerMin, unit: "mm/min" } });
          expect(r.jPerIn / 25.4 / 1000).toBeCloseTo(r.arcEnergyKJPerMm, 9);
          // Halving the travel speed doubles the heat input (QW-409.1(a): inversely proportional).
          const slow = heatInput({ process: "FCAW", volts, amps, travelSpeed: { value: mmPerMin / 2, unit: "mm/min" } });
          expect(slow.jPerIn / r.jPerIn).toBeCloseTo(2, 9);
        },
      ),
    );
  });
});

describe("passHeatInput — QW-409.1 (a), (c)(1), (c)(2)", () => {
  it("(c)(2): 4,300 W × 40 s / 6 in = 28,667 J/in (ASME IX QW-409.1(c)(2); calc)", () => {
    const r = passHeatInput({ method: "power", powerW: 4300, arcTimeS: 40, beadLength: { value: 6, unit: "in" } });
    expect(r.clause).toBe("ASME IX QW-409.1(c)(2)");
    expect(Math.abs(r.jPerIn - 28_667)).toBeLessThan(0.5);
    // 6 in in 40 s = 9 in/min = 228.6 mm/min (calc).
    expect(r.travelSpeedMmPerMin).toBeCloseTo(228.6, 9);
  });

  it("(c)(1): 172,000 J over 6 in (the same 4,300 W × 40 s) = 28,667 J/in (QW-409.1(c)(1); calc)", () => {
    const r = passHeatInput({ method: "energy", energyJ: 172_000, beadLength: { value: 152.4, unit: "mm" } });
    expect(r.clause).toBe("ASME IX QW-409.1(c)(1)");
    expect(Math.abs(r.jPerIn - 28_667)).toBeLessThan(0.5);
    expect(r.heatInputKJPerMm).toBeNull();
    expect(r.travelSpeedMmPerMin).toBeNull();
  });

  it("(a) with travel speed from bead length / arc time: 8 in in 60 s → 32,400 J/in (QW-409.1(a); calc)", () => {
    const r = passHeatInput({
      method: "voltage-current",
      process: "GTAW",
      volts: 24,
      amps: 180,
      beadLength: { value: 8, unit: "in" },
      arcTimeS: 60,
    });
    expect(r.jPerIn).toBeCloseTo(32_400, 6);
    expect(r.travelSpeedMmPerMin).toBeCloseTo(203.2, 9);
    expect(Math.abs((r.heatInputKJPerMm ?? 0) - 0.765)).toBeLessThan(0.0005); // GTAW, ISO/TR 17671-1
  });

  it("(a) with a given travel speed matches heatInput (QW-409.1(a))", () => {
    const r = passHeatInput({ method: "voltage-current", volts: 24, amps: 180, travelSpeed: { value: 8, unit: "in/min" } });
    expect(r.jPerIn).toBeCloseTo(32_400, 6);
  });

  it("refuses two travel-speed sources and none", () => {
    expect(() =>
      passHeatInput({
        method: "voltage-current",
        volts: 24,
        amps: 180,
        travelSpeed: { value: 8, unit: "in/min" },
        arcTimeS: 60,
      }),
    ).toThrow(/not both/);
    expect(() => passHeatInput({ method: "voltage-current", volts: 24, amps: 180, arcTimeS: 60 })).toThrow(
      /beadLength/,
    );
  });
});

describe("ISO 4063 process numbers (REFERENCES.md: process numbers from memory)", () => {
  it("maps 111, 131/135, 114/136/138, 141, 121, 15", () => {
    expect(processFromIso4063(111)).toBe("SMAW");
    expect(processFromIso4063(131)).toBe("GMAW");
    expect(processFromIso4063(135)).toBe("GMAW");
    expect(processFromIso4063(114)).toBe("FCAW");
    expect(processFromIso4063(136)).toBe("FCAW");
    expect(processFromIso4063(138)).toBe("FCAW");
    expect(processFromIso4063(141)).toBe("GTAW");
    expect(processFromIso4063(121)).toBe("SAW");
    expect(processFromIso4063(15)).toBe("PAW");
    expect(processFromIso4063(999)).toBeUndefined();
    expect(PROCESS_INFO.SMAW.iso4063).toEqual([111]);
  });
});
