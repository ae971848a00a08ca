import { createHash } from "node:crypto";
import { describe, expect, it } from "vitest";
import { versionHash } from "@/lib/procedures/hash";
import { versionContentSchema } from "@/lib/procedures/schema";

const content = versionContentSchema.parse({ sections: [{ key: "s", title: "S", steps: [{ key: "c", kind: "check", title: "Check it" }] }] });
const body = { title: "T", scope: "", code: "C", content };

describe("version hash", () => {
  // RFC 8785: members sorted by key, no whitespace; the hash is SHA-256 of those UTF-8 bytes.
  it("is SHA-256 of the RFC 8785 canonical JSON of title, scope, code and content", () => {
    const canonical =
      '{"code":"C","content":{"sections":[{"key":"s","steps":[{"instructions":"","key":"c","kind":"check","photos":{"min":0,"required":false},"signedBy":"welder","title":"Check it"}],"title":"S"}]},"scope":"","title":"T"}';
    expect(versionHash(body)).toBe(createHash("sha256").update(canonical, "utf8").digest("hex"));
  });

  it("does not depend on the order members were written in", () => {
    const reordered = JSON.parse(JSON.stringify({ content: body.content, code: "C", scope: "", title: "T" }));
    expect(versionHash(reordered)).toBe(versionHash(body));
  });

  it("changes when any word a signer reads changes", () => {
    const h = versionHash(body);
    expect(versionHash({ ...body, code: "C2" })).not.toBe(h);
    const c2 = structuredClone(content);
    c2.sections[0]!.steps[0]!.title = "Check it twice";
    expect(versionHash({ ...body, content: c2 })).not.toBe(h);
  });
});
