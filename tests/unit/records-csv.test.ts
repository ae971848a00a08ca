import { describe, expect, it } from "vitest";
import { csvField, csvRow } from "@/lib/records/csv";

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
