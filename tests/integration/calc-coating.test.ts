import { describe, expect, it } from "vitest";
import { api } from "./support";

describe("POST /api/calc/dew-point", () => {
  // REFERENCES "Coatings": Magnus with Alduchov & Eskridge 1996 coefficients (calc; 10/80 and 5/90 also pub).
  const table: [number, number, number][] = [
    [20, 50, 9.26],
    [10, 80, 6.71],
    [5, 90, 3.5],
    [25, 60, 16.7],
    [30, 85, 27.2],
  ];
  it.each(table)("Magnus (Alduchov & Eskridge 1996); REFERENCES worked example %d °C / %d %% RH → dew point %d °C", async (air, rh, dew) => {
    const r = await api("/api/calc/dew-point", { body: { airTempC: air, relativeHumidity: rh, surfaceTempC: air } });
    expect(r.status).toBe(200);
    expect(r.json.dewPointC).toBeCloseTo(dew, 2);
    expect(r.json.marginC).toBeCloseTo(air - r.json.dewPointC, 12);
  });

  it("3 °C rule (REFERENCES: steel at least 3 °C above the dew point): 20 °C / 50 % with steel at 13 °C passes, at 12 °C holds", async () => {
    const go = await api("/api/calc/dew-point", { body: { airTempC: 20, relativeHumidity: 50, surfaceTempC: 13 } });
    expect(go.json.ok).toBe(true); // 13 − 9.26 = 3.74 °C
    expect(go.json.rhWarning).toBe(false);
    const hold = await api("/api/calc/dew-point", { body: { airTempC: 20, relativeHumidity: 50, surfaceTempC: 12 } });
    expect(hold.json.ok).toBe(false); // 12 − 9.26 = 2.74 °C
    expect(hold.json.marginC).toBeCloseTo(12 - 9.26, 2);
  });

  it("RH above 85 % is flagged (REFERENCES, ISO 8502-4 / ISO 12944-7 via secondary sources)", async () => {
    const r = await api("/api/calc/dew-point", { body: { airTempC: 30, relativeHumidity: 90, surfaceTempC: 40 } });
    expect(r.status).toBe(200);
    expect(r.json.rhWarning).toBe(true);
    expect(r.json.ok).toBe(true);
  });

  it("RH outside 0–100 or non-numbers answer 400 with the field", async () => {
    for (const relativeHumidity of [0, -5, 100.5, 150]) {
      const r = await api("/api/calc/dew-point", { body: { airTempC: 20, relativeHumidity, surfaceTempC: 15 } });
      expect(r.status, `RH ${relativeHumidity}`).toBe(400);
      expect(Object.keys(r.json.error.fields)).toEqual(["relativeHumidity"]);
    }
    const text = await api("/api/calc/dew-point", { body: { airTempC: "20", relativeHumidity: "fifty", surfaceTempC: null } });
    expect(text.status).toBe(400);
    expect(Object.keys(text.json.error.fields).sort()).toEqual(["airTempC", "relativeHumidity", "surfaceTempC"]);
    // RH exactly 100 % is a real reading: dew point = air temperature.
    const saturated = await api("/api/calc/dew-point", { body: { airTempC: 12, relativeHumidity: 100, surfaceTempC: 12 } });
    expect(saturated.status).toBe(200);
    expect(saturated.json.dewPointC).toBeCloseTo(12, 9);
  });
});

describe("POST /api/calc/dft", () => {
  it("SSPC-PA 2; REFERENCES worked example 4–6 mil → spot limits 3.2–7.2; spots 5.0, 4.0, 5.67, 4.5, 5.1 → area 4.85, conforms", async () => {
    const spots = [
      [4.8, 5.0, 5.2], // 5.0
      [3.9, 4.0, 4.1], // 4.0
      [5.5, 5.7, 5.8], // 5.67
      [4.4, 4.5, 4.6], // 4.5
      [5.0, 5.1, 5.2], // 5.1
    ];
    const r = await api("/api/calc/dft", { body: { specMin: 4, specMax: 6, unit: "mil", spots } });
    expect(r.status).toBe(200);
    expect(r.json.spotLimits.min).toBeCloseTo(3.2, 12);
    expect(r.json.spotLimits.max).toBeCloseTo(7.2, 12);
    expect(r.json.spots.map((s: { average: number }) => Number(s.average.toFixed(2)))).toEqual([5, 4, 5.67, 4.5, 5.1]);
    expect(r.json.areaAverage).toBeCloseTo(4.85, 2);
    expect(r.json.ok).toBe(true);
    expect(r.json.unit).toBe("mil");
  });

  it("SSPC-PA 2 (REFERENCES: 8–12 mil → spot limits 6.4 and 14.4): a spot averaging 6.3 fails though the area average passes", async () => {
    const r = await api("/api/calc/dft", {
      body: { specMin: 8, specMax: 12, spots: [[6.2, 6.3, 6.4], [10, 10, 10], [11, 11, 11], [10, 10, 10], [11, 11, 11]] },
    });
    expect(r.status).toBe(200);
    expect(r.json.spotLimits.min).toBeCloseTo(6.4, 12);
    expect(r.json.spotLimits.max).toBeCloseTo(14.4, 12);
    expect(r.json.spots[0].ok).toBe(false);
    expect(r.json.spots[0].reason).toBe("below-spot-minimum");
    expect(r.json.areaOk).toBe(true); // (6.3 + 10 + 11 + 10 + 11) / 5 = 9.66
    expect(r.json.ok).toBe(false);
  });

  it("bad input answers 400 with the field paths", async () => {
    const r = await api("/api/calc/dft", { body: { specMin: 6, specMax: 4, spots: [[5, 5], [5, -1, 5]] } });
    expect(r.status).toBe(400);
    expect(Object.keys(r.json.error.fields)).toEqual(expect.arrayContaining(["spots.0", "spots.1.1"]));
    const range = await api("/api/calc/dft", { body: { specMin: 6, specMax: 4, spots: [[5, 5, 5]] } });
    expect(range.status).toBe(400);
    expect(range.json.error.fields.specMax).toBeDefined();
  });
});
