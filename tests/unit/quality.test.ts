import { describe, expect, it } from "vitest";
import { IMR_FACTOR, individualsChart, outOfControl } from "@/lib/quality/control-chart";
import { defectsCsv, heatCsv, yieldCsv } from "@/lib/quality/csv";
import { defaultRange, qualityQuerySchema, ratio } from "@/lib/quality/schema";

describe("individuals chart (I-MR)", () => {
  it("moving ranges as in the SAS/QC IRCHART documentation's illustration: 3.4, 3.7, 3.6 → 0.3 and 0.1", () => {
    // SAS/QC User's Guide, IRCHART statement, "Each point on a moving range chart…": MR₂ = 0.3, MR₃ = 0.1.
    const c = individualsChart([3.4, 3.7, 3.6])!;
    expect(c.mrBar).toBeCloseTo((0.3 + 0.1) / 2, 12);
    expect(c.mean).toBeCloseTo(10.7 / 3, 12);
    expect(c.ucl).toBeCloseTo(10.7 / 3 + 2.66 * 0.2, 12);
    expect(c.lcl).toBeCloseTo(10.7 / 3 - 2.66 * 0.2, 12);
  });

  it("2.66 is 3/d₂ for moving ranges of two, d₂ = 2/√π worked out independently (E|X₁ − X₂| of two standard normals)", () => {
    // Independent computation: X₁ − X₂ ~ N(0, 2), and E|N(0, s²)| = s·√(2/π), so d₂(2) = √2·√(2/π) = 2/√π ≈ 1.1284.
    const d2 = 2 / Math.sqrt(Math.PI);
    expect(d2).toBeCloseTo(1.128, 3); // tabulated d₂ for n = 2 (from memory)
    expect(Math.abs(3 / d2 - IMR_FACTOR) / IMR_FACTOR).toBeLessThan(0.001);
  });

  it("agrees with a brute-force computation from the definitions, 3σ with σ̂ = MR̄/d₂, on pseudo-random heat inputs", () => {
    let seed = 7;
    const rand = () => ((seed = (seed * 16807) % 2147483647) / 2147483647);
    const xs = Array.from({ length: 60 }, () => 0.5 + rand() * 0.3);
    let mean = 0;
    for (const x of xs) mean += x / xs.length;
    const mrs: number[] = [];
    for (let i = 1; i < xs.length; i++) mrs.push(Math.abs(xs[i]! - xs[i - 1]!));
    const sigma = mrs.reduce((a, b) => a + b, 0) / mrs.length / (2 / Math.sqrt(Math.PI));
    const c = individualsChart(xs)!;
    expect(c.mean).toBeCloseTo(mean, 10);
    // 2.66 is rounded, so the limits agree with 3σ̂ to within 0.05 % of the half-width
    expect(Math.abs(c.ucl! - c.mean - 3 * sigma) / (3 * sigma)).toBeLessThan(0.0005);
    expect(Math.abs(c.mean - c.lcl! - 3 * sigma) / (3 * sigma)).toBeLessThan(0.0005);
  });

  it("one value has a mean and no limits; none has no chart; a point past a limit is a signal", () => {
    expect(individualsChart([])).toBeNull();
    expect(individualsChart([0.6])).toEqual({ n: 1, mean: 0.6, mrBar: null, ucl: null, lcl: null });
    const c = individualsChart([1, 1.1, 1, 1.1, 1])!; // mean 1.04, MR̄ 0.1 → UCL 1.306, LCL 0.774
    expect(c.ucl).toBeCloseTo(1.306, 10);
    expect(outOfControl(c, 1.31)).toBe(true);
    expect(outOfControl(c, 1.3)).toBe(false);
    expect(outOfControl(c, 0.77)).toBe(true);
  });
});

describe("quality filters", () => {
  it("accepts dates, ids and empty fields", () => {
    const q = qualityQuerySchema.parse({ from: "2026-01-01", to: "2026-03-31", welderId: "", wpsId: "", procedureId: "" });
    expect(q).toEqual({ from: "2026-01-01", to: "2026-03-31", welderId: undefined, wpsId: undefined, procedureId: undefined });
  });

  it("names the field of each bad filter", () => {
    const r = qualityQuerySchema.safeParse({ from: "2026-02-30", wpsId: "W-1", procedureId: "nope", welderId: "a b" });
    expect(r.success).toBe(false);
    const paths = r.error!.issues.map((i) => i.path[0]);
    expect(paths).toEqual(expect.arrayContaining(["from", "wpsId", "procedureId", "welderId"]));
    const backwards = qualityQuerySchema.safeParse({ from: "2026-03-01", to: "2026-02-01" });
    expect(backwards.error!.issues[0]!.path).toEqual(["to"]);
    expect(qualityQuerySchema.safeParse({ colour: "red" }).success).toBe(false);
  });

  it("the default window is the 90 days up to today", () => {
    expect(defaultRange("2026-12-05")).toEqual({ from: "2026-09-06", to: "2026-12-05" });
    expect(ratio(0, 0)).toBeNull();
    expect(ratio(7, 8)).toBe(0.875);
  });
});

describe("CSV beside each chart", () => {
  it("one row per figure, RFC 4180 line ends, labels beside codes", () => {
    const fpy = yieldCsv({
      overall: { inspected: 8, acceptedFirst: 6, ratio: 0.75 },
      byWelder: [{ welderId: "u1", welderName: "Nell, Welder", inspected: 8, acceptedFirst: 6, ratio: 0.75 }],
      byWps: [{ wpsId: null, reference: "GUS-GMAW-02", inspected: 8, acceptedFirst: 6, ratio: 0.75 }],
    });
    expect(fpy.split("\r\n")).toEqual(["group,name,inspected,accepted_first,ratio", "all,All joints,8,6,0.75", 'welder,"Nell, Welder",8,6,0.75', "wps,GUS-GMAW-02,8,6,0.75", ""]);
    expect(defectsCsv([{ criterion: "undercut", count: 2 }])).toBe("criterion,label,count\r\nundercut,Undercut,2\r\n");
    const heat = heatCsv([{ wpsId: "w", reference: "GUS-GMAW-02", total: 1, points: [{ at: "2026-12-01T10:00:00.000Z", kJPerMm: 1.3, within: false, limitKJPerMm: 1.2, jobNumber: "J-1", jointId: "W2", passNumber: 1, round: 1, welderName: "A" }] }]);
    expect(heat.split("\r\n")[1]).toBe("GUS-GMAW-02,2026-12-01T10:00:00.000Z,1.3,1.2,no,J-1,W2,1,1,A");
  });
});

describe("navigation", () => {
  it("Quality is in the menu of a lead, an inspector and an auditor, not of a welder", async () => {
    const { navFor } = await import("@/lib/nav");
    const has = (roles: string[]) => navFor(roles, false).some((i) => i.href === "/quality" && i.label === "Quality");
    expect(["lead", "inspector", "auditor"].map((r) => has([r]))).toEqual([true, true, true]);
    expect(has(["welder"])).toBe(false);
  });
});
