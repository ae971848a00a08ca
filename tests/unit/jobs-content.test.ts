import { createHash } from "node:crypto";
import canonicalize from "canonicalize";
import { describe, expect, it } from "vitest";
import { stepContent, type StepContentInput } from "@/lib/jobs/content";
import { stepContentHash } from "@/lib/jobs/hash";

const base: StepContentInput = {
  jobId: "job-1",
  jobNumber: "GJ-2026-0001",
  stepId: "step-1",
  stepKey: "fit-gap",
  kind: "measure",
  specHash: "a".repeat(64),
  meaning: "performed",
  value: { reading: 1.2, unit: "mm", note: undefined } as Record<string, unknown>,
  photos: [
    { id: "p2", sha256: "f".repeat(64) },
    { id: "p1", sha256: "0".repeat(64) },
  ],
  passes: [],
  acceptedUnder: [],
};

describe("signed step content (RFC 8785 JSON, SHA-256)", () => {
  it("hashes the canonical JSON of the content, computed independently here", () => {
    const { content, hash } = stepContentHash(base);
    const expected = createHash("sha256").update(canonicalize(content)!, "utf8").digest("hex");
    expect(hash).toBe(expected);
    expect(hash).toMatch(/^[0-9a-f]{64}$/);
  });

  it("does not depend on the order photos were taken in", () => {
    const swapped = { ...base, photos: [...base.photos].reverse() };
    expect(stepContentHash(swapped).hash).toBe(stepContentHash(base).hash);
  });

  it("changes when the value, a photo or the meaning changes", () => {
    const h = stepContentHash(base).hash;
    expect(stepContentHash({ ...base, value: { reading: 1.3, unit: "mm" } }).hash).not.toBe(h);
    expect(stepContentHash({ ...base, photos: [{ id: "p1", sha256: "1".repeat(64) }] }).hash).not.toBe(h);
    expect(stepContentHash({ ...base, meaning: "inspected" }).hash).not.toBe(h);
  });

  it("keeps only JSON in the stored content (undefined members dropped) and names an amendment", () => {
    const c = stepContent({ ...base, amends: { signOffId: "so-1", reason: "Misread the gauge" } });
    expect(c.value).toEqual({ reading: 1.2, unit: "mm" });
    expect(c.amends).toEqual({ signOffId: "so-1", reason: "Misread the gauge" });
    expect((c.photos as { id: string }[]).map((p) => p.id)).toEqual(["p1", "p2"]);
  });
});
