import { describe, expect, it } from "vitest";
import { CSV_COLUMNS, csvField, csvRow, recordCsv } from "@/lib/records/csv";
import { repairedJobRecord } from "@/tests/fixtures/pdf/job-record-fixture";

// RFC 4180 section 2: fields with commas, quotes or line breaks are enclosed in double quotes; quotes doubled.
describe("CSV fields (RFC 4180 §2)", () => {
  it("quotes commas, quotes and line breaks", () => {
    expect(csvField("plain")).toBe("plain");
    expect(csvField("a,b")).toBe('"a,b"');
    expect(csvField('12" bar')).toBe('"12"" bar"');
    expect(csvField("line\nbreak")).toBe('"line\nbreak"');
    expect(csvRow(["x", 1.5, null, true])).toBe("x,1.5,,true");
  });
  it("keeps a spreadsheet from running a field as a formula (OWASP CSV injection guidance)", () => {
    expect(csvField("=HYPERLINK(1)")).toBe("'=HYPERLINK(1)");
    expect(csvField("-5")).toBe("'-5");
  });
});

/** Reads RFC 4180 text back into rows of fields, the way a spreadsheet would. */
function parseCsv(text: string): string[][] {
  const rows: string[][] = [];
  let row: string[] = [];
  let field = "";
  let quoted = false;
  for (let i = 0; i < text.length; i++) {
    const ch = text[i]!;
    if (quoted) {
      if (ch === '"' && text[i + 1] === '"') {
        field += '"';
        i++;
      } else if (ch === '"') quoted = false;
      else field += ch;
    } else if (ch === '"') quoted = true;
    else if (ch === ",") {
      row.push(field);
      field = "";
    } else if (ch === "\r" && text[i + 1] === "\n") {
      row.push(field);
      rows.push(row);
      row = [];
      field = "";
      i++;
    } else field += ch;
  }
  return rows;
}

describe("a job's record as CSV", () => {
  const record = repairedJobRecord();
  const rows = parseCsv(recordCsv(record, { intact: true, entries: 9, seal: "c".repeat(64) }));
  const [head, ...body] = rows;
  const col = (r: string[], name: (typeof CSV_COLUMNS)[number]) => r[CSV_COLUMNS.indexOf(name)] ?? "";
  const of = (kind: string) => body.filter((r) => col(r, "record") === kind);

  it("has one header and the same number of fields on every row, ending CRLF", () => {
    expect(head).toEqual(CSV_COLUMNS);
    for (const r of body) expect(r).toHaveLength(CSV_COLUMNS.length);
    expect(recordCsv(record, { intact: true, entries: 9, seal: null }).endsWith("\r\n")).toBe(true);
  });

  it("lists each visual inspection once, with joint, round, decision, inspector, time and its sign-off's content hash", () => {
    const inspections = of("inspection");
    expect(inspections.map((r) => [col(r, "step"), col(r, "joint"), col(r, "round"), col(r, "meaning"), col(r, "signer"), col(r, "signed_at")])).toEqual([
      ["w-1", "W1", "1", "rejected", "Ines Lindqvist", record.inspections[0]!.inspectedAt],
      ["w-1", "W1", "2", "accepted", "Ines Lindqvist", record.inspections[1]!.inspectedAt],
    ]);
    const signOffs = record.steps[0]!.signOffs;
    expect(col(inspections[0]!, "content_hash")).toBe(signOffs.find((o) => o.id === record.inspections[0]!.signOffId)!.contentHash);
    expect(col(inspections[1]!, "content_hash")).toBe(signOffs.find((o) => o.id === record.inspections[1]!.signOffId)!.contentHash);
    const detail = JSON.parse(col(inspections[0]!, "value"));
    expect(detail).toMatchObject({ criteria: "AWS D1.1:2020 Table 8.1, statically loaded nontubular", judged: "reject", notes: "Undercut at the toe." });
    expect(detail.rejectedItems).toEqual([expect.objectContaining({ item: "undercut", measured: expect.stringContaining("2 mm deep") })]);
  });

  it("keeps the inspection sign-offs among the weld step's signatures, each labelled with its joint and round", () => {
    const weldRows = of("step").filter((r) => col(r, "step") === "w-1");
    expect(weldRows.map((r) => [col(r, "meaning"), col(r, "joint"), col(r, "round")])).toEqual([
      ["performed", "W1", "1"],
      ["inspected", "W1", "1"],
      ["performed", "W1", "2"],
      ["inspected", "W1", "2"],
    ]);
    // The same signature as the inspection row: one content hash, not two different records.
    const inspectedHashes = weldRows.filter((r) => col(r, "meaning") === "inspected").map((r) => col(r, "content_hash"));
    expect(inspectedHashes).toEqual(of("inspection").map((r) => col(r, "content_hash")));
    // The hold point is not a weld joint: no joint, no round.
    const hold = of("step").find((r) => col(r, "step") === "h-visual")!;
    expect([col(hold, "joint"), col(hold, "round")]).toEqual(["", ""]);
  });

  it("gives each pass its joint, round, WPS revision and what was outside the WPS", () => {
    const passes = of("weld pass");
    expect(passes.map((r) => [col(r, "title"), col(r, "joint"), col(r, "round"), col(r, "meaning")])).toEqual([
      ["pass 1", "W1", "1", ""],
      ["pass 2", "W1", "1", ""],
      ["pass 3", "W1", "1", "struck out"],
      ["pass 4", "W1", "2", ""],
    ]);
    const p2 = JSON.parse(col(passes[1]!, "value"));
    expect(p2).toMatchObject({ wps: "WPS-T1", wpsRevision: 1, override: { reason: "Tie-in at the end; profile checked.", by: "Ada Brennan" } });
    expect(p2.outsideWps).toContain("Current 250 A is above the WPS maximum of 240 A.");
  });

  it("lists every material entry, the corrected and withdrawn ones too, each correction naming the entry it replaces and why", () => {
    const materials = of("material");
    expect(materials.map((r) => [col(r, "kind"), col(r, "title"), JSON.parse(col(r, "value")).heatNumber, col(r, "meaning"), col(r, "amends"), col(r, "reason")])).toEqual([
      ["base", "Bracket plate 10 mm", "HT-19O2", "recorded", "", ""],
      ["base", "Bracket plate 10 mm", "HT-1902", "corrected", "m-1", "Letter O typed for a zero."],
      ["filler", "Wire spool 1.0 mm", "L-4471", "recorded", "", ""],
      ["other", "Shim 2 mm", "SH-7", "recorded", "", ""],
      ["other", "Shim 2 mm", "SH-7", "withdrawn", "m-4", "Not fitted after all."],
    ]);
    expect(JSON.parse(col(materials[0]!, "value"))).toMatchObject({ id: "m-1", superseded: true });
    expect(JSON.parse(col(materials[2]!, "value"))).toMatchObject({ specification: "AWS A5.18 ER70S-6", certificate: "3.1 W-88", superseded: false });
    expect(col(materials[1]!, "signer")).toBe("Ines Lindqvist");
  });
});
