import { describe, expect, it } from "vitest";
import { diffIsEmpty, diffVersions, type DiffSide } from "@/lib/procedures/diff";
import { versionContentSchema, type VersionContent } from "@/lib/procedures/schema";

const content = (sections: unknown): VersionContent => versionContentSchema.parse({ sections });

const v1: DiffSide = {
  number: 1,
  title: "Fit a bracket",
  scope: "",
  code: "AWS D1.1",
  content: content([
    {
      key: "prep",
      title: "Prepare",
      steps: [
        { key: "ppe", kind: "caution", title: "PPE", hazards: ["ppe"], acknowledgement: "PPE on." },
        { key: "clean", kind: "check", title: "Clean to bright metal" },
        { key: "old-note", kind: "check", title: "A step that goes away" },
      ],
    },
    {
      key: "weld",
      title: "Weld",
      steps: [
        { key: "w1", kind: "weld", title: "W1", jointId: "W1", jointType: "fillet", sizeMm: 5, lengthMm: 100, position: "2F", process: "GMAW", wpsRef: "WPS-1", filler: "ER70S-6", minPreheatC: 20 },
        { key: "gap", kind: "measure", title: "Gap", quantity: "length", tolerance: { type: "max", max: 2 } },
      ],
    },
  ]),
};

function v2(): DiffSide {
  const c = structuredClone(v1.content);
  const [prep, weld] = c.sections as [VersionContent["sections"][number], VersionContent["sections"][number]];
  prep.steps = prep.steps.filter((s) => s.key !== "old-note");
  const w1 = weld.steps.find((s) => s.key === "w1")!;
  if (w1.kind === "weld") {
    w1.sizeMm = 6;
    w1.minPreheatC = 65;
  }
  // "gap" moves to the preparation section; a hold point is added after the weld.
  const gap = weld.steps.splice(1, 1)[0]!;
  prep.steps.push(gap);
  weld.steps.push({ key: "hold-visual", kind: "hold", title: "Visual inspection", instructions: "", signedBy: "inspector", photos: { required: false, min: 0 }, inspection: "AWS D1.1 Table 8.1" });
  return { number: 2, title: "Fit a bracket", scope: "", code: "AWS D1.1:2020", content: c };
}

describe("diff of two versions", () => {
  it("a version against itself has no differences", () => {
    const d = diffVersions(v1, { ...v1, number: 1 });
    expect(diffIsEmpty(d)).toBe(true);
    expect(d.summary).toEqual({ added: 0, removed: 0, changed: 0, moved: 0, unchanged: 5 });
  });

  it("counts added, removed, changed and moved steps", () => {
    expect(diffVersions(v1, v2()).summary).toEqual({ added: 1, removed: 1, changed: 1, moved: 1, unchanged: 2 });
  });

  it("lists a changed step field by field, in the words on screen", () => {
    const d = diffVersions(v1, v2());
    const row = d.sections.flatMap((s) => s.rows).find((r) => r.key === "w1");
    expect(row?.type).toBe("changed");
    expect(row?.type === "changed" && row.changes).toEqual([
      { field: "sizeMm", label: "Size (mm)", before: "5", after: "6" },
      { field: "minPreheatC", label: "Min preheat (°C)", before: "20", after: "65" },
    ]);
  });

  it("a measure's changed figures carry their unit", () => {
    const c = structuredClone(v1.content);
    const gap = c.sections[1]!.steps[1]!;
    if (gap.kind === "measure") gap.tolerance = { type: "max", max: 1.5 };
    const row = diffVersions(v1, { ...v1, number: 2, content: c }).sections[1]!.rows.find((r) => r.key === "gap");
    expect(row?.type === "changed" && row.changes).toEqual([{ field: "tolerance.max", label: "Max", before: "2 mm", after: "1.5 mm" }]);
  });

  it("a step that moved to another section shows in its new section, saying where it came from", () => {
    const d = diffVersions(v1, v2());
    const prep = d.sections.find((s) => s.key === "prep")!;
    const gap = prep.rows.find((r) => r.key === "gap");
    expect(gap?.type === "same" && gap.moved).toEqual({ kind: "section", fromSection: "Weld" });
    expect(d.sections.find((s) => s.key === "weld")!.rows.some((r) => r.key === "gap")).toBe(false);
  });

  it("a removed step stays where it stood, after the step it followed", () => {
    const prep = diffVersions(v1, v2()).sections.find((s) => s.key === "prep")!;
    expect(prep.rows.map((r) => `${r.type}:${r.key}`)).toEqual(["same:ppe", "same:clean", "removed:old-note", "same:gap"]);
  });

  it("reordering within a section marks only the step that left its place", () => {
    const c = structuredClone(v1.content);
    const steps = c.sections[0]!.steps;
    steps.push(steps.shift()!); // ppe goes from first to last
    const d = diffVersions(v1, { ...v1, number: 2, content: c });
    const moved = d.sections.flatMap((s) => s.rows).filter((r) => (r.type === "same" || r.type === "changed") && r.moved);
    expect(moved.map((r) => r.key)).toEqual(["ppe"]);
  });

  it("reports title, scope and code changes apart from the steps", () => {
    expect(diffVersions(v1, v2()).meta).toEqual([{ field: "code", label: "Code or standard", before: "AWS D1.1", after: "AWS D1.1:2020" }]);
  });

  it("a step whose kind changed lists the kind and each field that appears or disappears", () => {
    const c = structuredClone(v1.content);
    c.sections[0]!.steps[1] = { key: "clean", kind: "photo", title: "Clean to bright metal", instructions: "", signedBy: "welder", photos: { required: true, min: 1 } };
    const row = diffVersions(v1, { ...v1, number: 2, content: c }).sections[0]!.rows.find((r) => r.key === "clean");
    expect(row?.type === "changed" && row.changes.map((x) => [x.field, x.before, x.after])).toEqual([
      ["kind", "Check", "Photo"],
      ["photos.required", "No", "Yes"],
      ["photos.min", "0", "1"],
    ]);
  });

  it("added and removed sections are marked as such; a removed one keeps the place it had", () => {
    const c = structuredClone(v1.content);
    c.sections.splice(0, 1, { key: "safety", title: "Safety first", steps: [] });
    const d = diffVersions(v1, { ...v1, number: 2, content: c });
    expect(d.sections.map((s) => `${s.status}:${s.key}`)).toEqual(["removed:prep", "added:safety", "same:weld"]);
  });
});
