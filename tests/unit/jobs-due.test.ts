import { describe, expect, it } from "vitest";
import { DUE_CUE_LABELS, dueCue } from "@/lib/jobs/due";

describe("due-date cue on the job lists", () => {
  const today = "2026-12-05";
  it("an open job due today is marked, one due yesterday is overdue, one due tomorrow is not marked", () => {
    expect(dueCue("2026-12-05", today, "in_progress")).toBe("today");
    expect(dueCue("2026-12-04", today, "planned")).toBe("overdue");
    expect(dueCue("2026-12-06", today, "on_hold")).toBeNull();
  });
  it("released and void jobs, and jobs without a date, carry no cue", () => {
    expect(dueCue("2026-12-01", today, "released")).toBeNull();
    expect(dueCue("2026-12-05", today, "void")).toBeNull();
    expect(dueCue(null, today, "planned")).toBeNull();
  });
  it("says it in words with a shape, not by colour alone", () => {
    expect(DUE_CUE_LABELS.today).toMatch(/^● due today$/);
    expect(DUE_CUE_LABELS.overdue).toMatch(/^▲ overdue$/);
  });
});
