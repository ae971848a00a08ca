import { describe, expect, it } from "vitest";
import { deriveJobState, holdLocks, holdSeparation, releaseBlockers, unsignedBefore, waitingHold, type ChecklistStep } from "@/lib/jobs/state";

function checklist(kinds: string, signed: number[] = []): ChecklistStep[] {
  // "c" check, "h" hold, "w" weld; sections of three steps.
  return [...kinds].map((k, i) => ({
    id: `s${i + 1}`,
    key: `k${i + 1}`,
    title: `Step ${i + 1}`,
    kind: k === "h" ? "hold" : k === "w" ? "weld" : "check",
    position: i + 1,
    sectionKey: `sec${Math.floor(i / 3)}`,
    signed: signed.includes(i + 1),
  }));
}

describe("job state follows the checklist", () => {
  it("planned until the first sign-off, then in progress", () => {
    expect(deriveJobState({ status: "planned", steps: checklist("ccc"), openNonconformances: 0 })).toBe("planned");
    expect(deriveJobState({ status: "planned", steps: checklist("ccc", [1]), openNonconformances: 0 })).toBe("in_progress");
  });

  it("on hold while waiting at a hold point, in progress again once the inspector signs", () => {
    const steps = checklist("cchc", [1, 2]);
    expect(waitingHold(steps)?.key).toBe("k3");
    expect(deriveJobState({ status: "in_progress", steps, openNonconformances: 0 })).toBe("on_hold");
    expect(deriveJobState({ status: "on_hold", steps: checklist("cchc", [1, 2, 3]), openNonconformances: 0 })).toBe("in_progress");
  });

  it("not on hold while work before the hold point is still open", () => {
    expect(deriveJobState({ status: "in_progress", steps: checklist("cchc", [1]), openNonconformances: 0 })).toBe("in_progress");
  });

  it("an open nonconformance holds the job, even when every step is signed", () => {
    expect(deriveJobState({ status: "in_progress", steps: checklist("cc", [1]), openNonconformances: 1 })).toBe("on_hold");
    expect(deriveJobState({ status: "in_progress", steps: checklist("cc", [1, 2]), openNonconformances: 1 })).toBe("on_hold");
  });

  it("ready for release when all is signed and nothing is open; released and void never move", () => {
    expect(deriveJobState({ status: "in_progress", steps: checklist("chc", [1, 2, 3]), openNonconformances: 0 })).toBe("ready_for_release");
    expect(deriveJobState({ status: "released", steps: checklist("cc"), openNonconformances: 1 })).toBe("released");
    expect(deriveJobState({ status: "void", steps: checklist("cc", [1, 2]), openNonconformances: 0 })).toBe("void");
  });
});

describe("hold points lock what follows", () => {
  it("every step after an unsigned hold is locked by the first such hold; steps before are free", () => {
    const steps = checklist("chchc", [1]);
    const locks = holdLocks(steps);
    expect(locks.get("s1")).toBeNull();
    expect(locks.get("s2")).toBeNull();
    expect(locks.get("s3")?.key).toBe("k2");
    expect(locks.get("s5")?.key).toBe("k2");
  });

  it("signing the first hold moves the lock to the next one", () => {
    const locks = holdLocks(checklist("chchc", [1, 2]));
    expect(locks.get("s3")).toBeNull();
    expect(locks.get("s4")).toBeNull();
    expect(locks.get("s5")?.key).toBe("k4");
  });

  it("lists the unsigned steps before a hold", () => {
    const steps = checklist("cch", [2]);
    expect(unsignedBefore(steps, steps[2]!).map((s) => s.key)).toEqual(["k1"]);
  });
});

describe("separation of duties at a hold point", () => {
  const hold = { sectionKey: "b", position: 5 };
  const prior = [
    { sectionKey: "a", position: 1, performedBy: ["ann"], passWelders: [] },
    { sectionKey: "b", position: 3, performedBy: ["ben"], passWelders: ["ann"] },
    { sectionKey: "b", position: 4, performedBy: ["cat"], passWelders: [] },
    { sectionKey: "b", position: 6, performedBy: ["dan"], passWelders: ["dan"] },
  ];
  it("refuses the welder of any earlier pass", () => {
    expect(holdSeparation({ signerId: "ann", hold, prior })).toMatch(/weld pass/);
  });
  it("refuses whoever signed earlier work in the hold's section", () => {
    expect(holdSeparation({ signerId: "cat", hold, prior })).toMatch(/this section/);
    expect(holdSeparation({ signerId: "ben", hold, prior })).toMatch(/this section/);
  });
  it("allows someone who did none of it (work after the hold and in other sections does not count)", () => {
    expect(holdSeparation({ signerId: "dan", hold, prior })).toBeNull();
    expect(holdSeparation({ signerId: "eve", hold, prior })).toBeNull();
  });
});

describe("release", () => {
  const done = checklist("chc", [1, 2, 3]);
  it("needs every step signed and no open nonconformance", () => {
    expect(releaseBlockers({ status: "in_progress", steps: checklist("chc", [1, 2]), openNonconformances: 1, releaserId: "lee", holdSigners: [] })).toEqual([
      "1 step is not signed yet.",
      "1 nonconformance is still open.",
    ]);
    expect(releaseBlockers({ status: "ready_for_release", steps: done, openNonconformances: 0, releaserId: "lee", holdSigners: [{ stepId: "s2", userId: "ivy" }] })).toEqual([]);
  });
  it("nobody releases a job whose hold points they alone signed", () => {
    expect(releaseBlockers({ status: "ready_for_release", steps: done, openNonconformances: 0, releaserId: "ivy", holdSigners: [{ stepId: "s2", userId: "ivy" }] })[0]).toMatch(/another lead/);
  });
});

describe("a job with weld work recorded", () => {
  it("is in progress once a pass or a weld round is on the record, though no step counts as done yet", () => {
    const derive = deriveJobState;
    const steps = [{ id: "w", key: "w", title: "W1", kind: "weld" as const, position: 1, sectionKey: "s", signed: false }];
    expect(derive({ status: "planned", steps, openNonconformances: 0 })).toBe("planned");
    expect(derive({ status: "planned", steps, openNonconformances: 0, workRecorded: true })).toBe("in_progress");
  });
});
