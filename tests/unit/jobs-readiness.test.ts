import { describe, expect, it } from "vitest";
import { stepReadiness, type StepFacts } from "@/lib/jobs/readiness";
import { stepSchema, type Step } from "@/lib/procedures/schema";

const step = (s: Record<string, unknown>): Step => stepSchema.parse({ key: "k", title: "A step", ...s });
const facts = (spec: Step, value: Record<string, unknown> | null, more: Partial<StepFacts> = {}): StepFacts => ({ spec, value, photoCount: 0, passes: [], ncs: [], ...more });

describe("who may sign what: the step's own completeness", () => {
  it("check: only once confirmed", () => {
    const s = step({ kind: "check" });
    expect(stepReadiness(facts(s, null)).canSign).toBe(false);
    expect(stepReadiness(facts(s, { confirmed: true })).canSign).toBe(true);
  });

  it("caution: every hazard acknowledged", () => {
    const s = step({ kind: "caution", hazards: ["ppe", "fire-watch"], acknowledgement: "I will keep a fire watch." });
    expect(stepReadiness(facts(s, { acknowledged: ["ppe"] })).reasons).toContain("Acknowledge every hazard (1 left).");
    expect(stepReadiness(facts(s, { acknowledged: ["fire-watch", "ppe"] })).canSign).toBe(true);
  });

  it("photo: at least the required number, and at least one on a photo step", () => {
    const s = step({ kind: "photo", photos: { required: true, min: 2 } });
    expect(stepReadiness(facts(s, null, { photoCount: 1 })).canSign).toBe(false);
    expect(stepReadiness(facts(s, null, { photoCount: 2 })).canSign).toBe(true);
    expect(stepReadiness(facts(step({ kind: "photo" }), null)).canSign).toBe(false);
    const m = step({ kind: "check", photos: { required: true, min: 1 } });
    expect(stepReadiness(facts(m, { confirmed: true })).reasons).toContain("Take a photo.");
  });

  it("weld: a pass at least, and no pass below the minimum preheat", () => {
    const s = step({ kind: "weld", jointId: "W1", jointType: "fillet", sizeMm: 6, lengthMm: 80, position: "2F", process: "GMAW", wpsRef: "WPS-1", filler: "ER70S-6", minPreheatC: 10 });
    expect(stepReadiness(facts(s, null)).canSign).toBe(false);
    expect(stepReadiness(facts(s, null, { passes: [{ preheatC: 25 }] })).canSign).toBe(true);
    expect(stepReadiness(facts(s, null, { passes: [{ preheatC: 25 }, { preheatC: 5 }] })).canSign).toBe(false);
  });
});

describe("out of tolerance and nonconformances", () => {
  const s = step({ kind: "measure", quantity: "length", nominal: 100, tolerance: { type: "plusMinus", plus: 1, minus: 1 } });
  const bad = { reading: 101.6, unit: "mm" };

  it("an out-of-tolerance reading cannot be signed as passed", () => {
    const r = stepReadiness(facts(s, bad));
    expect(r.verdict).toBe("fail");
    expect(r.canSign).toBe(false);
    expect(r.reasons.join(" ")).toMatch(/Raise a nonconformance/);
  });

  it("an open nonconformance blocks signing whatever the value", () => {
    const r = stepReadiness(facts(s, { reading: 100 }, { ncs: [{ number: 1, disposition: null, observed: bad }] }));
    expect(r.canSign).toBe(false);
    expect(r.reasons.join(" ")).toMatch(/NC-1 is open/);
  });

  it("'use as is' lets exactly the observed value be signed, under that nonconformance", () => {
    const ncs = [{ number: 1, disposition: "use_as_is" as const, observed: bad }];
    const r = stepReadiness(facts(s, { ...bad }, { ncs }));
    expect(r.canSign).toBe(true);
    expect(r.acceptedUnder).toEqual([1]);
    expect(stepReadiness(facts(s, { reading: 102.5, unit: "mm" }, { ncs })).canSign).toBe(false);
  });

  it("after rework the step is measured again and must pass", () => {
    const ncs = [{ number: 1, disposition: "rework" as const, observed: bad }];
    expect(stepReadiness(facts(s, bad, { ncs })).canSign).toBe(false);
    expect(stepReadiness(facts(s, { reading: 100.2, unit: "mm" }, { ncs })).canSign).toBe(true);
  });
});

describe("coating", () => {
  // DFT worked example (SSPC-PA 2, REFERENCES.md Coatings): 4–6 mil, spot averages 5.0, 4.0, 5.67, 4.5, 5.1
  // → area 4.85 mil, conforms. In µm (×25.4): 101.6–152.4 µm.
  const s = step({ kind: "coating", surfacePrep: "SSPC-SP 11", product: "Zinc primer", dewPointMarginC: 3, dftMinUm: 101.6, dftMaxUm: 152.4 });
  const spot = (avgMil: number) => [avgMil - 0.1, avgMil, avgMil + 0.1].map((m) => m * 25.4);
  const spots = [5.0, 4.0, 5.67, 4.5, 5.1].map(spot);
  // Dew point 20 °C / 50 % RH = 9.26 °C (Magnus, Alduchov & Eskridge 1996; REFERENCES.md).
  const good = { airTempC: 20, relativeHumidity: 50, surfaceTempC: 15, dftSpots: spots };

  it("signs when the surface is 3 °C over the dew point and the DFT conforms", () => {
    const r = stepReadiness(facts(s, good));
    expect(r.dewPoint?.dewPointC).toBeCloseTo(9.26, 2);
    expect(r.dft?.areaAverage).toBeCloseTo(4.854 * 25.4, 1);
    expect(r.canSign).toBe(true);
  });

  it("conditions that fail block signing, even with a 'use as is' disposition", () => {
    const wet = { ...good, surfaceTempC: 11 };
    const r = stepReadiness(facts(s, wet, { ncs: [{ number: 1, disposition: "use_as_is", observed: wet }] }));
    expect(r.dewPoint?.ok).toBe(false);
    expect(r.canSign).toBe(false);
    expect(r.reasons.join(" ")).toMatch(/Conditions fail/);
  });

  it("needs five spots of three readings, and fails a thin spot", () => {
    expect(stepReadiness(facts(s, { ...good, dftSpots: spots.slice(0, 4) })).verdict).toBe("incomplete");
    const thin = [...spots.slice(0, 4), spot(3.0)]; // 3.0 mil is below 80 % of 4 mil (3.2)
    expect(stepReadiness(facts(s, { ...good, dftSpots: thin })).verdict).toBe("fail");
  });
});
