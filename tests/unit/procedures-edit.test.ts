import { describe, expect, it } from "vitest";
import { addSection, blankStep, deleteSection, deleteStep, duplicateStep, moveSection, moveStep, nextJointId, renameSection, uniqueKey, upsertStep } from "@/lib/procedures/edit";
import { AppError } from "@/lib/errors";
import { versionContentSchema, type Step, type VersionContent } from "@/lib/procedures/schema";

const content = (): VersionContent =>
  versionContentSchema.parse({
    sections: [
      { key: "a", title: "A", steps: [{ key: "a1", kind: "check", title: "A1" }, { key: "a2", kind: "check", title: "A2" }] },
      {
        key: "b",
        title: "B",
        steps: [{ key: "w", kind: "weld", title: "Weld", jointId: "W4", jointType: "fillet", sizeMm: 5, lengthMm: 50, position: "2F", process: "GMAW", wpsRef: "X", filler: "Y", minPreheatC: 10 }],
      },
    ],
  });

const order = (c: VersionContent) => c.sections.map((s) => `${s.key}:${s.steps.map((t) => t.key).join(",")}`);

describe("draft edits", () => {
  it("moves a step up and down within its section", () => {
    expect(order(moveStep(content(), "a2", "up"))).toEqual(["a:a2,a1", "b:w"]);
    expect(order(moveStep(content(), "a1", "down"))).toEqual(["a:a2,a1", "b:w"]);
  });

  it("moving past a section's edge carries the step into the next or previous section", () => {
    expect(order(moveStep(content(), "a2", "down"))).toEqual(["a:a1", "b:a2,w"]);
    expect(order(moveStep(content(), "w", "up"))).toEqual(["a:a1,a2,w", "b:"]);
    expect(order(moveStep(content(), "a1", "up"))).toEqual(["a:a1,a2", "b:w"]);
  });

  it("a duplicate gets a new key and, for a weld, the next free joint id, and stays valid", () => {
    const r = duplicateStep(content(), "w");
    const copy = r.content.sections[1]!.steps[1]!;
    expect(r.key).toBe("w-copy");
    expect(copy.kind === "weld" && copy.jointId).toBe("W5");
    expect(copy.title).toBe("Weld (copy)");
    expect(versionContentSchema.safeParse(r.content).success).toBe(true);
  });

  it("never returns a key already used by a step or section", () => {
    const c = content();
    expect(uniqueKey(c, "a1")).toBe("a1-2");
    expect(uniqueKey(c, "Fit up & tack!")).toBe("fit-up-tack");
    expect(nextJointId(c)).toBe("W5");
  });

  it("a new step's key is made from its title, unique in the version, whatever key it came with", () => {
    const step: Step = { key: "typed", kind: "check", title: "Fit up & tack!", instructions: "", signedBy: "welder", photos: { required: false, min: 0 } };
    const added = upsertStep(content(), { sectionKey: "a", step, position: 1 });
    expect(added.key).toBe("fit-up-tack");
    expect(order(added.content)).toEqual(["a:a1,fit-up-tack,a2", "b:w"]);
    // A title that slugs to a key already taken (here the step "a1") gets the next free number.
    const clash = upsertStep(content(), { sectionKey: "b", step: { ...step, title: "A1" } });
    expect(clash.key).toBe("a1-2");
    expect(order(clash.content)).toEqual(["a:a1,a2", "b:w,a1-2"]);
  });

  it("a saved step keeps its key when its title changes", () => {
    const step: Step = { key: "ignored", kind: "check", title: "Renamed entirely", instructions: "", signedBy: "welder", photos: { required: false, min: 0 } };
    const saved = upsertStep(content(), { sectionKey: "a", originalKey: "a2", step });
    expect(saved.key).toBe("a2");
    expect(order(saved.content)).toEqual(["a:a1,a2", "b:w"]);
    expect(saved.content.sections[0]!.steps[1]!.title).toBe("Renamed entirely");
    expect(versionContentSchema.safeParse(saved.content).success).toBe(true);
  });

  it("does not change the content it is given", () => {
    const c = content();
    const before = JSON.stringify(c);
    moveStep(c, "a1", "down");
    deleteStep(c, "a1");
    expect(JSON.stringify(c)).toBe(before);
  });

  it("adds, renames, moves and deletes sections", () => {
    const added = addSection(content(), "Coating");
    expect(added.key).toBe("coating");
    expect(renameSection(added.content, "coating", "Coat").sections[2]!.title).toBe("Coat");
    expect(order(moveSection(content(), "b", "up"))).toEqual(["b:w", "a:a1,a2"]);
    expect(order(deleteSection(content(), "a"))).toEqual(["b:w"]);
  });

  it("refuses, as not found, a step someone else already removed", () => {
    expect(() => deleteStep(content(), "gone")).toThrow(AppError);
  });

  it("a new hold point starts signed by an inspector; a new weld with the next joint id", () => {
    expect(blankStep("hold", content()).signedBy).toBe("inspector");
    expect(blankStep("weld", content()).jointId).toBe("W5");
  });
});
