import fc from "fast-check";
import { describe, expect, it } from "vitest";

import { parseQuantity } from "@/lib/units";

// Expected SI values: 1 in = 25.4 mm, 1 lbf·ft = 1.3558179483314004 N·m, 1 psi = 6.894757 kPa,
// t(°C) = (t(°F) − 32)/1.8 (NIST SP 811 (2008) App. B, REFERENCES.md Units), worked by hand (calc).
describe("parseQuantity — entries people type", () => {
  it.each([
    ['3 1/4"', "length", "in", 3.25, 82.55],
    ["3-1/4 in", "length", "in", 3.25, 82.55],
    ["1/2\"", "length", "in", 0.5, 12.7],
    ["82.5 mm", "length", "mm", 82.5, 82.5],
    ["82,5 mm", "length", "mm", 82.5, 82.5],
    ["5'", "length", "ft", 5, 1524],
    ["65 ft-lb", "torque", "lbf_ft", 65, 88.128],
    ["65 lb-ft", "torque", "lbf_ft", 65, 88.128],
    ["65 lbf·ft", "torque", "lbf_ft", 65, 88.128],
    ["90 N·m", "torque", "N_m", 90, 90],
    ["90 Nm", "torque", "N_m", 90, 90],
    ["300 °F", "temperature", "degF", 300, 148.889],
    ["300F", "temperature", "degF", 300, 148.889],
    ["-5 °C", "temperature", "degC", -5, -5],
    ["30 psi", "pressure", "psi", 30, 206.843],
    ["207 kPa", "pressure", "kPa", 207, 207],
    ["6 mil", "thickness", "mil", 6, 152.4],
    ["150 µm", "thickness", "um", 150, 150],
    ["150 um", "thickness", "um", 150, 150],
    ["8 in/min", "speed", "in_min", 8, 203.2],
    ["12°", "angle", "deg", 12, 12],
  ])("%s → %s %s %d (SI %d)", (text, quantity, unit, value, valueSI) => {
    const r = parseQuantity(text);
    expect(r.ok, JSON.stringify(r)).toBe(true);
    if (!r.ok) return;
    expect(r.quantity).toBe(quantity);
    expect(r.unit).toBe(unit);
    expect(r.value).toBeCloseTo(value, 9);
    expect(r.valueSI).toBeCloseTo(valueSI, 3);
  });

  it("accepts look-alike characters: Greek mu, typographic quotes and primes, Unicode minus, ½, º", () => {
    expect(parseQuantity("150 μm")).toMatchObject({ ok: true, unit: "um", value: 150 });
    expect(parseQuantity("3 1/4″")).toMatchObject({ ok: true, unit: "in", value: 3.25 });
    expect(parseQuantity("5′")).toMatchObject({ ok: true, unit: "ft", value: 5 });
    expect(parseQuantity("−5 °C")).toMatchObject({ ok: true, unit: "degC", value: -5 });
    expect(parseQuantity("3½ in")).toMatchObject({ ok: true, unit: "in", value: 3.5 });
    expect(parseQuantity("½\"")).toMatchObject({ ok: true, unit: "in", value: 0.5 });
    expect(parseQuantity("300 ºF")).toMatchObject({ ok: true, unit: "degF", value: 300 });
    expect(parseQuantity("300 deg F")).toMatchObject({ ok: true, unit: "degF", value: 300 });
  });

  it("feet and inches together come back in inches: 5' 6\" = 66 in = 1676.4 mm (calc)", () => {
    expect(parseQuantity("5' 6\"")).toMatchObject({ ok: true, quantity: "length", unit: "in", value: 66 });
    expect(parseQuantity("5'6\"")).toMatchObject({ ok: true, value: 66 });
    const r = parseQuantity("2 ft 3 1/2 in");
    expect(r).toMatchObject({ ok: true, unit: "in", value: 27.5 });
    if (r.ok) expect(r.valueSI).toBeCloseTo(698.5, 9);
  });

  it("comma or point decimals, with grouping when both appear", () => {
    expect(parseQuantity("0,5 mm")).toMatchObject({ ok: true, value: 0.5 });
    expect(parseQuantity(",5 mm")).toMatchObject({ ok: true, value: 0.5 });
    expect(parseQuantity("1,234.5 psi")).toMatchObject({ ok: true, value: 1234.5 });
    expect(parseQuantity("1.234,5 kPa")).toMatchObject({ ok: true, value: 1234.5 });
    expect(parseQuantity("1,000,000 psi")).toMatchObject({ ok: true, value: 1_000_000 });
    expect(parseQuantity("1.2.3 mm").ok).toBe(false);
    // "1,000" could be a thousand or one: refused, with both readings offered.
    const ambiguous = parseQuantity("1,000 psi");
    expect(ambiguous.ok).toBe(false);
    if (!ambiguous.ok) expect(ambiguous.message).toMatch(/ambiguous.*1000.*1\.000/);
    const negZero = parseQuantity("-0 °C");
    expect(negZero.ok && Object.is(negZero.value, 0)).toBe(true);
  });

  it("a quantity hint resolves shared symbols and refuses units of another quantity", () => {
    expect(parseQuantity("0.5 mm", "thickness")).toMatchObject({ ok: true, quantity: "thickness", unit: "mm", valueSI: 500 });
    expect(parseQuantity("0.5 mm")).toMatchObject({ ok: true, quantity: "length" });
    const wrong = parseQuantity("82.5 mm", "torque");
    expect(wrong.ok).toBe(false);
    if (!wrong.ok) expect(wrong.message).toMatch(/length unit.*torque/);
  });

  it("a bare number needs a unit unless a default unit is given", () => {
    const r = parseQuantity("12", "length");
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).toMatch(/Add a unit/);
    expect(parseQuantity("12", "length", { defaultUnit: "in" })).toMatchObject({
      ok: true,
      unit: "in",
      valueSI: expect.closeTo(304.8, 9),
    });
  });

  it.each([
    ["", /Enter a value/],
    ["   ", /Enter a value/],
    ["abc", /number/],
    ["12 furlongs", /Unknown unit/],
    ["1/0 in", /divides by zero/],
    ["-500 °C", /absolute zero/],
    ["-2 mil", /negative/],
    ["5' 6 mm", /inches/],
  ])("%j → clear failure message", (text, message) => {
    const r = parseQuantity(text);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).toMatch(message);
  });

  it("a bare degree sign is ambiguous for a temperature", () => {
    const r = parseQuantity("300°", "temperature");
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).toMatch(/°C or °F/);
  });

  it("never throws, whatever is typed (property test)", () => {
    fc.assert(
      fc.property(fc.string({ maxLength: 80 }), (s) => {
        const r = parseQuantity(s);
        return r.ok ? Number.isFinite(r.valueSI) : typeof r.message === "string" && r.message.length > 0;
      }),
      { numRuns: 2000 },
    );
    expect(parseQuantity(undefined as unknown as string).ok).toBe(false);
    expect(parseQuantity(42 as unknown as string).ok).toBe(false);
  });
});
