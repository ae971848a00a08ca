import { describe, expect, it } from "vitest";
import { applyKey, defaultPadUnit, fromStored, padText, readPadNumber, show, toStored } from "@/lib/jobs/units";

// Exact factors of NIST SP 811 (2008) Appendix B: 1 in = 25.4 mm; 1 lbf·ft = 1.355 817 948 3 N·m;
// t(°C) = (t(°F) − 32)/1.8; 1 psi = 6.894 757 kPa; 1 mil = 25.4 µm. Worked values from REFERENCES.md (Units).
describe("pad units: stored SI, shown as each person prefers", () => {
  it("length: 3.25 in is stored as 82.55 mm and shown back as 3.25 in", () => {
    const mm = toStored("length", 3.25, "in");
    expect(mm).toBeCloseTo(82.55, 12);
    expect(padText("length", mm, "in")).toBe("3.25");
    expect(show("length", mm, "mm", 2)).toBe("82.55 mm");
  });

  it("temperature: 300 °F is 148.9 °C; −40 is the same on both scales", () => {
    expect(toStored("temperature", 300, "degF")).toBeCloseTo(148.8889, 4);
    expect(toStored("temperature", -40, "degF")).toBeCloseTo(-40, 12);
    expect(fromStored("temperature", 65, "degF")).toBeCloseTo(149, 12);
  });

  it("torque: 100 lbf·ft is 135.58 N·m", () => {
    expect(toStored("torque", 100, "lbf_ft")).toBeCloseTo(135.5818, 4);
    expect(show("torque", toStored("torque", 100, "lbf_ft"), "N_m")).toBe("135.6 N·m");
  });

  it("coating thickness: 6 mil is 152.4 µm; pressure: 30 psi is 206.8 kPa", () => {
    expect(toStored("thickness", 6, "mil")).toBeCloseTo(152.4, 12);
    expect(toStored("pressure", 30, "psi")).toBeCloseTo(206.8427, 4);
  });

  it("a round trip through the displayed unit gives the stored value back", () => {
    for (const [q, u, v] of [["length", "in", 57.15], ["temperature", "degF", 21.5], ["torque", "lbf_ft", 95], ["speed", "in_min", 254]] as const) {
      expect(toStored(q, fromStored(q, v, u), u)).toBeCloseTo(v, 9);
    }
  });

  it("the default pad unit follows the person's unit system", () => {
    expect(defaultPadUnit("length", "imperial")).toBe("in");
    expect(defaultPadUnit("length", "metric")).toBe("mm");
    expect(defaultPadUnit("torque", "imperial")).toBe("lbf_ft");
    expect(defaultPadUnit("angle", "imperial")).toBe("deg");
  });
});

describe("the number pad's typing", () => {
  it("reads only complete numbers, with a point or a comma", () => {
    expect(readPadNumber("82.5")).toBe(82.5);
    expect(readPadNumber("82,5")).toBe(82.5);
    expect(readPadNumber("-12")).toBe(-12);
    expect(readPadNumber(".5")).toBe(0.5);
    for (const t of ["", "-", ".", "1.2.3", "12a", "1e3"]) expect(readPadNumber(t)).toBeNull();
  });

  it("keys build a number: leading zero replaced, one point, sign toggles only where allowed", () => {
    let t = "";
    for (const k of ["0", "8", "2", ".", "5", "."] as const) t = applyKey(t, k);
    expect(t).toBe("82.5");
    expect(applyKey("", ".")).toBe("0.");
    expect(applyKey("12", "±")).toBe("12");
    expect(applyKey("12", "±", { negative: true })).toBe("-12");
    expect(applyKey("-12", "±", { negative: true })).toBe("12");
    expect(applyKey("12", "⌫")).toBe("1");
    expect(applyKey("12", "clear")).toBe("");
    expect(applyKey("1234", ".", { decimals: false })).toBe("1234");
    expect(applyKey("12345678", "9", { maxLength: 8 })).toBe("12345678");
  });
});
