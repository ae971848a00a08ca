import { describe, expect, it } from "vitest";
import { recordContent, STEP_CONTENT_SCHEMA } from "@/lib/jobs/content";
import { sealedWeldMap } from "@/lib/weld-map";
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

describe("the weld map sealed at release against the stored map", () => {
  const imageId = "0b5a3a9e-4a34-4c43-9a59-0d6f4a1e2b10";
  const stored = () => ({
    images: [{ id: imageId, procedureImageId: "5d7e6a55-1c1b-4d7c-8a0e-3f2b1c4d5e6f", sha256: "a".repeat(64), width: 1600, height: 1200 }],
    joints: [
      { jointId: "W2", imageId, x: 0.58, y: 0.46 },
      { jointId: "W1", imageId, x: 0.42, y: 0.46, path: [{ x: 0.36, y: 0.46 }, { x: 0.5, y: 0.46 }] },
    ],
  });
  // The release content as the release writes it: the map in joint order, each image by its source and hash.
  const release = { id: "r", stepId: null, content: recordContent("release", { weldMap: sealedWeldMap(stored()) }) };

  it("agrees while the map is as released", () => {
    expect(firstRowDifference([release], { ...rows(), weldMap: stored() })).toBeNull();
  });

  it("names a marker moved, a seam line dropped and a map removed after release", () => {
    const moved = stored();
    moved.joints[0]!.x = 0.6;
    expect(firstRowDifference([release], { ...rows(), weldMap: moved })).toMatchObject({ signOffId: "r", reason: expect.stringMatching(/weld map/) });
    const noSeam = stored();
    delete noSeam.joints[1]!.path;
    expect(firstRowDifference([release], { ...rows(), weldMap: noSeam })?.reason).toMatch(/weld map differs/);
    expect(firstRowDifference([release], { ...rows(), weldMap: null })?.reason).toMatch(/weld map differs/);
  });

  it("a release made without a map stays intact while the job has none, and not once one is added", () => {
    const plainRelease = { id: "r0", stepId: null, content: recordContent("release", {}) };
    expect(firstRowDifference([plainRelease], { ...rows(), weldMap: null })).toBeNull();
    expect(firstRowDifference([plainRelease], { ...rows(), weldMap: stored() })?.signOffId).toBe("r0");
  });
});
