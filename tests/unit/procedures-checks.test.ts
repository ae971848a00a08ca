import { describe, expect, it } from "vitest";
import { publishReadiness } from "@/lib/procedures/checks";
import { stepFormStep } from "@/lib/procedures/forms";
import { versionContentSchema } from "@/lib/procedures/schema";

const weld = { key: "w1", kind: "weld", title: "W1", jointId: "W1", jointType: "fillet", sizeMm: 5, lengthMm: 50, position: "2F", process: "GMAW", wpsRef: "W", filler: "F", minPreheatC: 10 };
const caution = { key: "c", kind: "caution", title: "Hot work", hazards: ["ppe", "fire-watch"], acknowledgement: "Understood." };
const hold = { key: "h", kind: "hold", title: "Visual", signedBy: "inspector", inspection: "Per D1.1" };
const body = (steps: unknown[], code = "AWS D1.1") => ({ title: "T", scope: "", code, content: versionContentSchema.parse({ sections: [{ key: "s", title: "S", steps }] }) });

describe("publish readiness", () => {
  it("a weld with a caution before it and a hold point after it is ready", () => {
    expect(publishReadiness(body([caution, weld, hold]))).toEqual({ blockers: [], warnings: [] });
  });

  it("hot work with no caution before the first weld blocks publishing", () => {
    const r = publishReadiness(body([weld, caution, hold]));
    expect(r.blockers.map((b) => b.stepKey)).toEqual(["w1"]);
    expect(r.blockers[0]!.message).toMatch(/caution step before the first weld/);
  });

  it("a hold point signed by anyone but an inspector blocks publishing", () => {
    expect(publishReadiness(body([caution, weld, { ...hold, signedBy: "welder" }])).blockers[0]!.message).toMatch(/signed by an inspector/);
  });

  it("an empty procedure or an empty section blocks publishing", () => {
    expect(publishReadiness(body([])).blockers.map((b) => b.message)).toEqual([
      "A procedure needs at least one step before it is published.",
      "Section “S” has no steps: add steps or delete it.",
    ]);
  });

  it("a photo step that asks for no photo blocks publishing", () => {
    expect(publishReadiness(body([caution, { key: "p", kind: "photo", title: "Photo" }])).blockers[0]!.stepKey).toBe("p");
  });

  it("a weld with no later hold point, or no code named, is a warning only", () => {
    const r = publishReadiness(body([caution, weld], ""));
    expect(r.blockers).toEqual([]);
    expect(r.warnings.map((w) => w.message)).toEqual([
      "No hold point after weld W1: nobody inspects it before the job goes on.",
      "No code or standard is named for this procedure.",
    ]);
  });
});

describe("torque entered in the maker's unit", () => {
  // NIST SP 811 (2008) Appendix B: 1 lbf·ft = 1.355 818 N·m.
  it("130 lbf·ft is stored as 176.26 N·m and keeps lbf·ft as the unit to show", () => {
    const s = stepFormStep.parse({ key: "t", kind: "torque", title: "Bolt", fastener: "M14", torqueValue: 130, torqueUnit: "lbf_ft" });
    expect(s.kind === "torque" && s.torqueNm).toBeCloseTo(176.256, 3);
    expect(s.kind === "torque" && s.torqueUnit).toBe("lbf_ft");
    expect("torqueValue" in s).toBe(false);
  });
});
