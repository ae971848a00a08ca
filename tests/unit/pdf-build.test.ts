// The traveller filled from a job's record (lib/traveller/build): weld rounds come from the joint's visual
// inspections (not from hold-point sign-offs), each pass is judged as its WPS revision judged it, and the
// materials print as they stand after corrections.
import { describe, expect, it } from "vitest";
import { renderTraveller } from "@/lib/pdf/traveller";
import { parseTravellerData } from "@/lib/pdf/traveller-data";
import { extractText, getDocumentProxy } from "unpdf";
import { buildTravellerData } from "@/lib/traveller/build";
import { EXTRAS, at, repairedJobRecord } from "@/tests/fixtures/pdf/job-record-fixture";

describe("traveller built from the record", () => {
  const data = parseTravellerData(buildTravellerData(repairedJobRecord(), EXTRAS));
  const w1 = data.welds[0]!;

  it("takes a joint's rounds from its visual inspections, not from the hold point after it", () => {
    expect(data.welds).toHaveLength(1);
    expect(w1.state).toBe("accepted");
    expect(w1.rounds.map((r) => [r.round, r.inspection?.result, r.inspection?.inspectorName, r.inspection?.at.toISOString()])).toEqual([
      [1, "reject", "Ines Lindqvist", at(40)],
      [2, "accept", "Ines Lindqvist", at(80)],
    ]);
    // AWS D1.1:2020 Table 8.1: undercut over 1/16 in (1.59 mm) on material under 1 in rejects at any length.
    expect(w1.rounds[0]!.inspection).toMatchObject({ criteria: "AWS D1.1:2020 Table 8.1, statically loaded nontubular", note: "Undercut at the toe." });
    expect(w1.rounds[0]!.inspection!.rejected).toEqual([expect.objectContaining({ item: "undercut", measured: expect.stringContaining("2 mm deep") })]);
    expect(w1.rounds[0]!.inspection!.rejected[0]!.limit).toContain("1/16 in (1.59 mm)");
    expect(w1.rounds[1]!.inspection!.rejected).toEqual([]);
  });

  it("judges each pass against the WPS revision it was welded to, using the findings recorded with it", () => {
    const [p1, p2, p3] = w1.rounds[0]!.passes;
    // 24 V × 180 A × 60 / 300 mm/min / 1000 = 0.864 kJ/mm arc energy (ASME IX QW-409.1), under revision 1's 1.2.
    expect(p1).toMatchObject({ passNumber: 1, wpsRef: "WPS-T1", wpsRevision: 1, heatInputVerdict: "within", heatInputMaxKJPerMm: 1.2 });
    expect(p1!.heatInputKJPerMm).toBeCloseTo(0.864, 3);
    // 25 V × 250 A × 60 / 280 = 1.339 kJ/mm: over revision 1's 1.2, though the library's revision 2 would allow it.
    expect(p2).toMatchObject({ wpsRevision: 1, heatInputVerdict: "over", heatInputMaxKJPerMm: 1.2 });
    expect(p2!.heatInputKJPerMm).toBeCloseTo(1.339, 3);
    expect(p2!.outOfRange).toEqual(["Current 250 A is above the WPS maximum of 240 A."]);
    expect(p2!.override).toMatchObject({ reason: "Tie-in at the end; profile checked.", by: "Ada Brennan" });
    expect(p3).toMatchObject({ passNumber: 3, struckOut: true });
    // A pass without recorded findings is judged against its revision as the record carries it: 0.912 under 1.6.
    const [p4] = w1.rounds[1]!.passes;
    expect(p4).toMatchObject({ passNumber: 4, wpsRevision: 2, heatInputVerdict: "within", heatInputMaxKJPerMm: 1.6 });
    // The joint's summary: the highest live pass, and "over" because one pass was.
    expect(w1).toMatchObject({ passes: 3, heatInputVerdict: "over", welderName: "Mick Tamsin", fillerLot: "L-4471" });
    expect(w1.heatInputKJPerMm).toBeCloseTo(1.339, 3);
  });

  it("labels each weld-step sign-off with its round", () => {
    const weldStepData = data.sections[0]!.steps.find((s) => s.key === "w-1")!;
    expect(weldStepData.signOffs.map((o) => [o.meaning, o.round])).toEqual([
      ["performed", 1],
      ["inspected", 1],
      ["performed", 2],
      ["inspected", 2],
    ]);
    expect(data.sections[0]!.steps.find((s) => s.key === "h-visual")!.signOffs[0]!.round).toBeUndefined();
  });

  it("prints materials as they stand: a corrected entry replaced by its correction, a withdrawn one marked withdrawn", () => {
    expect(data.materials.entries.map((m) => [m.kind, m.description, m.heatNumber, m.withdrawn, m.corrects, m.reason])).toEqual([
      ["base", "Bracket plate 10 mm", "HT-1902", false, true, "Letter O typed for a zero."],
      ["filler", "Wire spool 1.0 mm", "L-4471", false, false, ""],
      ["other", "Shim 2 mm", "SH-7", true, true, "Not fitted after all."],
    ]);
    expect(data.materials.entries.find((m) => m.heatNumber === "HT-19O2")).toBeUndefined();
    expect(data.materials.entries[1]).toMatchObject({ specification: "AWS A5.18 ER70S-6", certificate: "3.1 W-88", recordedBy: "Mick Tamsin" });
    // The passes' filler lot, with the joint it went into (the struck-out pass does not count).
    expect(data.materials.fillers).toEqual([{ classification: "AWS A5.18 ER70S-6", lot: "L-4471", joints: ["W1"] }]);
  });

  it("prints both rounds of the repaired joint on the PDF", async () => {
    const pdf = await renderTraveller(buildTravellerData(repairedJobRecord(), EXTRAS));
    const { text } = await extractText(await getDocumentProxy(new Uint8Array(pdf)), { mergePages: true });
    const t = (text as string).replace(/\s+/g, " ");
    expect(t).toMatch(/W1 Weld joint W1 Mick Tamsin .*? 1\.34 max 1\.20 over accepted 2 rounds/);
    expect(t).toMatch(/Round 1 first welding Pass 1 Mick Tamsin · WPS-T1 rev 1 heat input 0\.86 kJ\/mm \(max 1\.20\) within WPS .*?Inspection round 1 reject Ines Lindqvist · 2026-04-01 08:40 UTC/);
    expect(t).toMatch(/Round 2 repair after rejection Pass 4 Mick Tamsin · WPS-T1 rev 2 heat input 0\.91 kJ\/mm \(max 1\.60\) within WPS Inspection round 2 accept Ines Lindqvist · 2026-04-01 09:20 UTC/);
    expect(t).toMatch(/Base metal Bracket plate 10 mm Corrects an earlier entry: Letter O typed for a zero\. ASTM A36 HT-1902/);
    expect(t).not.toContain("HT-19O2");
  }, 30_000);
});
