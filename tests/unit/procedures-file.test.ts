import { describe, expect, it } from "vitest";
import { parseProcedureFile, PROCEDURE_FILE_MAX_BYTES, toProcedureFile } from "@/lib/procedures/file";
import { duplicateMembers } from "@/lib/procedures/json-scan";

const good = () => ({
  format: "gusset-procedure",
  formatVersion: 1,
  procedure: { title: "Tack and weld a tab", scope: "", code: "AWS D1.1" },
  content: {
    sections: [
      {
        key: "safety",
        title: "Safety",
        steps: [{ key: "ppe", kind: "caution", title: "PPE", hazards: ["ppe"], acknowledgement: "PPE on." }],
      },
      {
        key: "weld",
        title: "Weld",
        steps: [
          { key: "w1", kind: "weld", title: "Tab", jointId: "W1", jointType: "fillet", sizeMm: 5, lengthMm: 40, position: "2F", process: "GMAW", wpsRef: "WPS-1", filler: "ER70S-6", minPreheatC: 20 },
          { key: "gap", kind: "measure", title: "Gap", quantity: "length", tolerance: { type: "max", max: 1.5 } },
        ],
      },
    ],
  },
});

type Mutable = ReturnType<typeof good> & Record<string, unknown>;
const withChange = (change: (f: Mutable) => void) => {
  const f = good() as Mutable;
  change(f);
  return JSON.stringify(f);
};
const step = (f: Mutable, si: number, ti: number) => f.content.sections[si]!.steps[ti] as Record<string, unknown>;

describe("procedure file: a valid file", () => {
  it("parses and applies the schema's defaults", () => {
    const r = parseProcedureFile(JSON.stringify(good()));
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    const weld = r.file.content.sections[1]!.steps[0]!;
    expect(weld.signedBy).toBe("welder");
    expect(weld.photos).toEqual({ required: false, min: 0 });
  });

  it("round-trips through export: the content read back equals the content written", () => {
    const first = parseProcedureFile(JSON.stringify(good()));
    if (!first.ok) throw new Error("fixture invalid");
    const exported = JSON.stringify(toProcedureFile({ ...first.file.procedure, content: first.file.content }, { version: 3, status: "published" }));
    const again = parseProcedureFile(exported);
    expect(again.ok && again.file.content).toEqual(first.file.content);
  });

  it("accepts a byte-order mark at the start (editors on some systems write one)", () => {
    expect(parseProcedureFile(`\uFEFF${JSON.stringify(good())}`).ok).toBe(true);
  });
});

// Each malformed file is refused, with what is wrong and where.
const malformed: { name: string; text: string; status: number; path: string; message: RegExp }[] = [
  { name: "not JSON", text: "{ format: gusset-procedure", status: 400, path: "", message: /Not valid JSON/ },
  { name: "empty", text: "   ", status: 400, path: "", message: /empty/ },
  { name: "a JSON array instead of an object", text: "[1,2,3]", status: 422, path: "", message: /expected object/i },
  { name: "another program's format", text: withChange((f) => (f.format = "some-other-format")), status: 422, path: "format", message: /format must be "gusset-procedure"/ },
  { name: "a future formatVersion", text: withChange((f) => (f.formatVersion = 3)), status: 422, path: "formatVersion", message: /formatVersion must be 1 or 2/ },
  { name: "an unknown step kind", text: withChange((f) => (step(f, 1, 1).kind = "laser")), status: 422, path: "content.sections[1].steps[1].kind", message: /Unknown step kind/ },
  { name: "a wrong type (size as text)", text: withChange((f) => (step(f, 1, 0).sizeMm = "5")), status: 422, path: "content.sections[1].steps[0].sizeMm", message: /The weld size must be a number/ },
  { name: "a missing required field (no WPS)", text: withChange((f) => delete step(f, 1, 0).wpsRef), status: 422, path: "content.sections[1].steps[0].wpsRef", message: /Name the WPS/ },
  { name: "a missing title", text: withChange((f) => delete (f.procedure as Record<string, unknown>).title), status: 422, path: "procedure.title", message: /title is required/i },
  { name: "duplicate step keys", text: withChange((f) => (step(f, 1, 1).key = "ppe")), status: 422, path: "content.sections[1].steps[1].key", message: /Duplicate step key "ppe"/ },
  { name: "duplicate weld joint ids", text: withChange((f) => f.content.sections[1]!.steps.push({ ...step(f, 1, 0), key: "w2" } as never)), status: 422, path: "content.sections[1].steps[2].jointId", message: /Duplicate weld joint "W1"/ },
  { name: "a member name twice in one object", text: JSON.stringify(good()).replace('"title":"Tab"', '"title":"Tab","title":"Tab again"'), status: 422, path: "content.sections[1].steps[0].title", message: /appears more than once/ },
  { name: "an unknown field", text: withChange((f) => (step(f, 0, 0).colour = "red")), status: 422, path: "content.sections[0].steps[0]", message: /Unrecognized key.*colour/ },
  { name: "an unknown hazard", text: withChange((f) => (step(f, 0, 0).hazards = ["lasers"])), status: 422, path: "content.sections[0].steps[0].hazards[0]", message: /Unknown hazard/ },
  { name: "a ± tolerance without a nominal", text: withChange((f) => (step(f, 1, 1).tolerance = { type: "plusMinus", plus: 1, minus: 1 })), status: 422, path: "content.sections[1].steps[1].nominal", message: /needs a nominal/ },
  { name: "an impossible weld position", text: withChange((f) => (step(f, 1, 0).position = "overhead")), status: 422, path: "content.sections[1].steps[0].position", message: /Position like/ },
  { name: "over 1 MB", text: JSON.stringify({ ...good(), $schema: "x".repeat(PROCEDURE_FILE_MAX_BYTES) }), status: 413, path: "", message: /1024 KB/ },
];

describe("procedure file: malformed files are refused with what is wrong and where", () => {
  it.each(malformed)("$name", ({ text, status, path, message }) => {
    const r = parseProcedureFile(text);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.status).toBe(status);
    const hit = r.problems.find((p) => p.path === path && message.test(p.message));
    expect(hit, JSON.stringify(r.problems)).toBeDefined();
  });

  it("names the section and step a problem is in, by number and title", () => {
    const r = parseProcedureFile(withChange((f) => (step(f, 1, 0).sizeMm = -2)));
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.problems[0]!.where).toBe("section 2 “Weld”, step 1 “Tab”, sizeMm");
  });

  it("lists every problem, not only the first", () => {
    const r = parseProcedureFile(
      withChange((f) => {
        f.formatVersion = 7;
        step(f, 1, 0).process = "laser";
        step(f, 1, 1).quantity = "mood";
      }),
    );
    expect(!r.ok && r.problems.map((p) => p.path)).toEqual(
      expect.arrayContaining(["formatVersion", "content.sections[1].steps[0].process", "content.sections[1].steps[1].quantity"]),
    );
  });

  it("reports duplicate keys even when other fields are wrong too", () => {
    const r = parseProcedureFile(
      withChange((f) => {
        step(f, 1, 1).key = "ppe";
        step(f, 1, 0).sizeMm = "five";
      }),
    );
    expect(!r.ok && r.problems.map((p) => [p.path, p.message])).toEqual([
      ["content.sections[1].steps[0].sizeMm", "The weld size must be a number."],
      ["content.sections[1].steps[1].key", 'Duplicate step key "ppe" (also in safety).'],
    ]);
  });

  it("counts bytes, not characters: 600 k three-byte characters are over 1 MB", () => {
    const r = parseProcedureFile(JSON.stringify({ ...good(), $schema: "€".repeat(600_000) }));
    expect(!r.ok && r.status).toBe(413);
  });
});

describe("duplicate member scan", () => {
  it("finds repeated names at any depth and ignores braces inside strings", () => {
    const text = '{"a":{"b":1,"b":2},"s":"{\\"x\\":1,\\"x\\":2}","list":[{"k":1},{"k":2,"k":3}]}';
    expect(duplicateMembers(text)).toEqual([
      { path: ["a", "b"], name: "b" },
      { path: ["list", 1, "k"], name: "k" },
    ]);
  });
});
