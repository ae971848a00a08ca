import { describe, expect, it } from "vitest";
import { STEP_CONTENT_SCHEMA } from "@/lib/jobs/content";
import { firstRowDifference, type LiveRows } from "@/lib/records/rows-check";

const pass = { stepId: "s2", passNumber: 1, welderId: "w", process: "GMAW", volts: 19, amps: 140, travelSpeedMmPerMin: 300, preheatC: 20, interpassC: null, fillerLot: "L1", heatInputKJPerMm: 0.53 };
const signOffs = [
  { id: "a", stepId: "s1", content: { schema: STEP_CONTENT_SCHEMA, value: { confirmed: true }, photos: [{ id: "p1", sha256: "ab" }], passes: [] } },
  { id: "b", stepId: "s2", content: { schema: STEP_CONTENT_SCHEMA, value: {}, photos: [], passes: [{ ...pass, stepId: undefined }] } },
  { id: "c", stepId: "s1", content: { schema: STEP_CONTENT_SCHEMA, value: { confirmed: false }, amends: { signOffId: "a", reason: "typo" }, photos: [], passes: [] } },
];
const rows = (): LiveRows => ({
  steps: [
    { id: "s1", title: "Check", value: { confirmed: true } },
    { id: "s2", title: "Weld", value: null },
  ],
  passes: [{ ...pass }],
  photos: [{ id: "p1", sha256: "ab" }],
  inspections: [],
});

describe("stored rows against the sealed sign-offs", () => {
  it("finds nothing when every row says what was signed (an amendment's own value excepted)", () => {
    expect(firstRowDifference(signOffs, rows())).toBeNull();
  });

  it("names a step value, a pass and a photo changed after signing", () => {
    const v = rows();
    v.steps[0]!.value = { confirmed: false };
    expect(firstRowDifference(signOffs, v)).toMatchObject({ signOffId: "a", reason: expect.stringMatching(/stored value of "Check"/) });
    const p = rows();
    p.passes[0]!.amps = 90;
    expect(firstRowDifference(signOffs, p)).toMatchObject({ signOffId: "b", reason: expect.stringMatching(/pass 1 .* amps/) });
    const f = rows();
    f.photos[0]!.sha256 = "cd";
    expect(firstRowDifference(signOffs, f)).toMatchObject({ signOffId: "a", reason: expect.stringMatching(/photo/) });
  });
});
