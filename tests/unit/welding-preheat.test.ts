import { describe, expect, it } from "vitest";
import { suggestPreheat } from "@/lib/welding";

const IN = 25.4; // NIST SP 811

// AWS D1.1/D1.1M:2015 Table 3.3 (pub); thickest part at the point of welding.
describe("preheat — AWS D1.1:2015 Table 3.3", () => {
  const b = (t: number) => suggestPreheat({ category: "B", thicknessMm: t });
  const a = (t: number) => suggestPreheat({ category: "A", thicknessMm: t });

  it("Category B: ≤ 3/4 in → 32 °F (0 °C), up to and at the 3/4 in boundary", () => {
    expect([b(10).minPreheatF, b(10).minPreheatC]).toEqual([32, 0]);
    expect([b(0.75 * IN).minPreheatF, b(0.75 * IN).minPreheatC]).toEqual([32, 0]);
  });
  it("Category B: > 3/4 through 1-1/2 in → 50 °F (10 °C)", () => {
    expect([b(0.75 * IN + 0.05).minPreheatF, b(0.75 * IN + 0.05).minPreheatC]).toEqual([50, 10]);
    expect(b(1.5 * IN).minPreheatF).toBe(50);
  });
  it("Category B: > 1-1/2 through 2-1/2 in → 150 °F (65 °C)", () => {
    expect([b(1.5 * IN + 0.05).minPreheatF, b(1.5 * IN + 0.05).minPreheatC]).toEqual([150, 65]);
    expect(b(2.5 * IN).minPreheatF).toBe(150);
  });
  it("Category B: > 2-1/2 in → 225 °F (110 °C)", () => {
    expect([b(2.5 * IN + 0.05).minPreheatF, b(2.5 * IN + 0.05).minPreheatC]).toEqual([225, 110]);
  });
  it("Category A: 32 / 150 / 225 / 300 °F across the same bands", () => {
    expect([a(0.75 * IN).minPreheatF, a(1.5 * IN).minPreheatF, a(2.5 * IN).minPreheatF, a(80).minPreheatF]).toEqual([
      32, 150, 225, 300,
    ]);
  });
  it("base metal below 32 °F (0 °C): preheat to ≥ 70 °F (20 °C) (Table 3.3 note; pub)", () => {
    const r = suggestPreheat({ category: "B", thicknessMm: 10, baseMetalTempC: -5 });
    expect([r.minPreheatF, r.minPreheatC, r.belowZeroRuleApplied]).toEqual([70, 20, true]);
    expect(r.tableF).toBe(32);
  });
  it("below 0 °C on heavy section: the higher table value governs", () => {
    const r = suggestPreheat({ category: "B", thicknessMm: 50, baseMetalTempC: -5 });
    expect(r.minPreheatF).toBe(150);
    expect(r.belowZeroRuleApplied).toBe(false);
  });
  it("at exactly 0 °C the below-zero rule does not apply", () => {
    expect(suggestPreheat({ category: "B", thicknessMm: 10, baseMetalTempC: 0 }).minPreheatC).toBe(0);
  });
  it("names its checked source only: the 2015 table (the 2020 number is from memory, so never shown)", () => {
    const s = b(10).source;
    expect(s).toMatch(/D1\.1.*2015 Table 3\.3/);
    expect(s).not.toMatch(/5\.8|from memory/);
  });
  it("rejects a non-positive thickness", () => {
    expect(() => b(0)).toThrow(RangeError);
  });
});
