import { describe, expect, it } from "vitest";
import { VISUAL_CRITERIA, judgeVisual, type VisualObservations } from "@/lib/welding/visual-acceptance";
import { minimumFilletLeg } from "@/lib/welding/fillet-weld";
import { suggestPreheat } from "@/lib/welding/preheat";

// What the inspector and the traveller show: a limit and a source for every item. Values that were not
// checked against the standard's text stay as notes in the code and tests, never on a signed screen.
const sound: VisualObservations = {
  cracks: false, fusionComplete: true, cratersFilled: true, profileAcceptable: true, specifiedLegMm: 6,
  measuredLegMm: 6, weldLengthMm: 100, undercutDepthMm: 0, undercutAccumulatedMm: 0, materialThicknessMm: 10, porosityMm: 0,
  porosity12Mm: 0, arcStrikes: false, spatterAcceptable: true,
};

describe("labels shown to people carry no unchecked clause numbers", () => {
  for (const criteria of VISUAL_CRITERIA) {
    it(`${criteria}: no "from memory" in any limit, source or note`, () => {
      const v = judgeVisual(criteria, sound);
      const text = JSON.stringify(v);
      expect(text).not.toMatch(/memory/i);
      // ISO 6520-1 reference numbers and the D1.1:2020 clause numbers were not checked here.
      expect(text).not.toMatch(/\b(100|401|104|2025|503|505|5213|2017|601|602|5011|5012)\b/);
      expect(text).not.toMatch(/clause 7\.(23|29)/);
    });
  }
  it("the fillet and preheat sources name only checked tables", () => {
    expect(minimumFilletLeg({ thicknessMm: 10, sizeSystem: "mm" }).source).not.toMatch(/memory/i);
    expect(suggestPreheat({ category: "B", thicknessMm: 10 }).source).not.toMatch(/memory/i);
  });
});
