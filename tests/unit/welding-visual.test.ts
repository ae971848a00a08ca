import { describe, expect, it } from "vitest";
import {
  awsUndersizeAllowanceMm,
  isoUndercutLimitMm,
  judgeVisual,
  type VisualItem,
  type VisualObservations,
} from "@/lib/welding";

const IN = 25.4; // NIST SP 811

// A clean 3/8 in (9.525 mm) bracket fillet: every item passes.
const GOOD: VisualObservations = {
  cracks: false,
  fusionComplete: true,
  cratersFilled: true,
  profileAcceptable: true,
  specifiedLegMm: 6,
  measuredLegMm: 6.5,
  weldLengthMm: 300,
  materialThicknessMm: (3 * IN) / 8,
  undercutDepthMm: 0,
  undercutAccumulatedMm: 0,
  porosityMm: 0,
  porosity12Mm: 0,
  arcStrikes: false,
  spatterAcceptable: true,
};

const item = (criteria: Parameters<typeof judgeVisual>[0], o: Partial<VisualObservations>, name: VisualItem) => {
  const r = judgeVisual(criteria, { ...GOOD, ...o });
  const found = r.items.find((i) => i.item === name);
  if (!found) throw new Error(`no item ${name}`);
  return found;
};

describe("AWS D1.1:2020 Table 8.1, statically loaded nontubular", () => {
  it("a clean weld is accepted, every item listed with a limit", () => {
    const r = judgeVisual("aws-d1.1-static", GOOD);
    expect(r.verdict).toBe("accept");
    expect(r.accepted).toBe(true);
    expect(r.items.map((i) => i.item).sort()).toEqual(
      ["arc-strikes", "cracks", "craters", "fusion", "porosity", "profile", "spatter", "undercut", "undersize"],
    );
    expect(r.items.every((i) => i.limit.length > 0 && i.source.length > 0)).toBe(true);
  });

  it("cracks: none (Table 8.1; pub)", () => {
    const r = judgeVisual("aws-d1.1-static", { ...GOOD, cracks: true });
    expect(r.verdict).toBe("reject");
    expect(r.rejectedItems).toEqual(["cracks"]);
  });

  it("fusion complete, craters filled (Table 8.1; pub)", () => {
    expect(judgeVisual("aws-d1.1-static", { ...GOOD, fusionComplete: false }).rejectedItems).toEqual(["fusion"]);
    expect(judgeVisual("aws-d1.1-static", { ...GOOD, cratersFilled: false }).rejectedItems).toEqual(["craters"]);
  });

  describe("undercut (Table 8.1; pub)", () => {
    const bracket = { materialThicknessMm: (3 * IN) / 8, undercutDepthMm: IN / 16 };
    it("worked: 3/8 in bracket, 1/16 in undercut over 1.5 in in 12 in → accepted (calc)", () => {
      const u = item("aws-d1.1-static", { ...bracket, undercutAccumulatedMm: 1.5 * IN }, "undercut");
      expect(u.ok).toBe(true);
      expect(u.limit).toMatch(/1\/32 in/);
      expect(u.limit).toMatch(/mm/);
    });
    it("worked: same undercut over 2.5 in in 12 in → rejected (calc)", () => {
      expect(item("aws-d1.1-static", { ...bracket, undercutAccumulatedMm: 2.5 * IN }, "undercut").ok).toBe(false);
    });
    it("material < 1 in: up to 1/32 in accepted over any length; deeper than 1/16 in never", () => {
      expect(item("aws-d1.1-static", { undercutDepthMm: IN / 32, undercutAccumulatedMm: 300 }, "undercut").ok).toBe(true);
      expect(item("aws-d1.1-static", { undercutDepthMm: IN / 16 + 0.05, undercutAccumulatedMm: 10 }, "undercut").ok).toBe(false);
    });
    it("material ≥ 1 in: ≤ 1/16 in for any length", () => {
      const thick = { materialThicknessMm: IN };
      expect(item("aws-d1.1-static", { ...thick, undercutDepthMm: IN / 16, undercutAccumulatedMm: 300 }, "undercut").ok).toBe(true);
      expect(item("aws-d1.1-static", { ...thick, undercutDepthMm: 1.7, undercutAccumulatedMm: 10 }, "undercut").ok).toBe(false);
    });
  });

  describe("undersize (Table 8.1; pub)", () => {
    it("allowance bands: L ≤ 3/16 in → 1/16; L = 1/4 in → 3/32; L ≥ 5/16 in → 1/8", () => {
      expect(awsUndersizeAllowanceMm((3 * IN) / 16)).toBeCloseTo(IN / 16, 12);
      expect(awsUndersizeAllowanceMm(IN / 8)).toBeCloseTo(IN / 16, 12);
      expect(awsUndersizeAllowanceMm(IN / 4)).toBeCloseTo((3 * IN) / 32, 12);
      expect(awsUndersizeAllowanceMm((5 * IN) / 16)).toBeCloseTo(IN / 8, 12);
      expect(awsUndersizeAllowanceMm(IN / 2)).toBeCloseTo(IN / 8, 12);
    });
    const cases: Array<[string, number, number]> = [
      ["3/16 in", (3 * IN) / 16, IN / 16],
      ["1/4 in", IN / 4, (3 * IN) / 32],
      ["5/16 in", (5 * IN) / 16, IN / 8],
    ];
    for (const [label, spec, allowance] of cases) {
      it(`${label} leg: exactly the allowance under over 10 % of length accepted; more under rejected`, () => {
        const at = { specifiedLegMm: spec, measuredLegMm: spec - allowance, weldLengthMm: 300, undersizeLengthMm: 30 };
        expect(item("aws-d1.1-static", at, "undersize").ok).toBe(true);
        expect(item("aws-d1.1-static", { ...at, measuredLegMm: spec - allowance - 0.1 }, "undersize").ok).toBe(false);
      });
    }
    it("undersize over more than 10 % of the length → rejected", () => {
      const o = { specifiedLegMm: IN / 4, measuredLegMm: IN / 4 - 1, weldLengthMm: 300, undersizeLengthMm: 31 };
      expect(item("aws-d1.1-static", o, "undersize").ok).toBe(false);
    });
    it("undersize without its length recorded is not accepted", () => {
      const u = item("aws-d1.1-static", { specifiedLegMm: IN / 4, measuredLegMm: IN / 4 - 1 }, "undersize");
      expect(u.ok).toBe(false);
      expect(u.measured).toMatch(/not recorded/);
    });
  });

  describe("porosity (Table 8.1; from memory)", () => {
    it("≤ 3/8 in in any inch and ≤ 3/4 in in any 12 in", () => {
      expect(item("aws-d1.1-static", { porosityMm: (3 * IN) / 8, porosity12Mm: (3 * IN) / 4 }, "porosity").ok).toBe(true);
      expect(item("aws-d1.1-static", { porosityMm: 9.6, porosity12Mm: 12 }, "porosity").ok).toBe(false);
      expect(item("aws-d1.1-static", { porosityMm: 5, porosity12Mm: 19.1 }, "porosity").ok).toBe(false);
    });
  });

  it("arc strikes present reject until ground and checked (D1.1:2020 clause from memory)", () => {
    expect(judgeVisual("aws-d1.1-static", { ...GOOD, arcStrikes: true }).rejectedItems).toEqual(["arc-strikes"]);
  });
});

describe("ISO 5817:2014 undercut 5011/5012 (from memory)", () => {
  it("worked t = 6 mm: D 1.0, C 0.5, B 0.3 mm (calc)", () => {
    expect(isoUndercutLimitMm("D", 6)).toBeCloseTo(1.0, 12);
    expect(isoUndercutLimitMm("C", 6)).toBeCloseTo(0.5, 12);
    expect(isoUndercutLimitMm("B", 6)).toBeCloseTo(0.3, 12);
  });
  it("t > 3 mm caps: D 1 mm, C and B 0.5 mm (t = 20 mm)", () => {
    expect(isoUndercutLimitMm("D", 20)).toBe(1);
    expect(isoUndercutLimitMm("C", 20)).toBe(0.5);
    expect(isoUndercutLimitMm("B", 20)).toBe(0.5);
  });
  it("t 0.5–3 mm: D 0.2t, C 0.1t, B not permitted", () => {
    expect(isoUndercutLimitMm("D", 2)).toBeCloseTo(0.4, 12);
    expect(isoUndercutLimitMm("C", 2)).toBeCloseTo(0.2, 12);
    expect(isoUndercutLimitMm("B", 2)).toBe(0);
    expect(isoUndercutLimitMm("B", 3)).toBe(0);
    expect(() => isoUndercutLimitMm("D", 0.4)).toThrow(RangeError);
  });
  it("0.4 mm undercut on 6 mm: B rejects, C and D accept", () => {
    const o = { materialThicknessMm: 6, undercutDepthMm: 0.4 };
    expect(judgeVisual("iso5817-B", { ...GOOD, ...o }).verdict).toBe("reject");
    expect(judgeVisual("iso5817-C", { ...GOOD, ...o }).verdict).toBe("accept");
    expect(judgeVisual("iso5817-D", { ...GOOD, ...o }).verdict).toBe("accept");
    expect(item("iso5817-B", o, "undercut").limit).toMatch(/0\.3 mm/);
  });
  it("0.6 mm on 6 mm: C rejects, D accepts", () => {
    const o = { materialThicknessMm: 6, undercutDepthMm: 0.6 };
    expect(item("iso5817-C", o, "undercut").ok).toBe(false);
    expect(item("iso5817-D", o, "undercut").ok).toBe(true);
  });
  it("cracks reject at every ISO level", () => {
    for (const c of ["iso5817-B", "iso5817-C", "iso5817-D"] as const) {
      expect(judgeVisual(c, { ...GOOD, cracks: true }).rejectedItems).toContain("cracks");
    }
  });
});
