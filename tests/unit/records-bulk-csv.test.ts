// Rows of the auditors' bulk CSV for one job (lib/records/bulk-csv), on the repaired-weld record fixture:
// W1 round 1 has pass 2 at 250 A against a 120–240 A WPS range, round 2's pass was stored without findings.
import { parse } from "csv-parse/sync";
import { describe, expect, it } from "vitest";
import { BULK_CSV_COLUMNS, bulkCsvHeader, bulkCsvLines, jobCsvRows, limitText } from "@/lib/records/bulk-csv";
import { repairedJobRecord, WELDER } from "@/tests/fixtures/pdf/job-record-fixture";

describe("bulk CSV rows", () => {
  it("writes limits as inclusive ranges or one-sided bounds", () => {
    expect(limitText({ low: 98, high: 102 })).toBe("between 98 and 102");
    expect(limitText({ low: -1, high: 1 })).toBe("between -1 and 1");
    expect(limitText({ low: 6, high: null })).toBe("≥ 6");
    expect(limitText({ low: null, high: 1.5 })).toBe("≤ 1.5");
    expect(limitText({ low: null, high: null })).toBe("");
  });

  it("gives each pass figure a row: value, unit, the WPS range and the verdict from the pass's own check", () => {
    const rows = jobCsvRows(repairedJobRecord());
    const amps2 = rows.find((r) => r.item === "joint W1 round 1 pass 2: amps")!;
    expect(amps2).toMatchObject({ value: 250, unit: "A", limit: "between 120 and 240", verdict: "fail", signer: WELDER.name, step_key: "w-1", job_number: "J-0042" });
    const amps1 = rows.find((r) => r.item === "joint W1 round 1 pass 1: amps")!;
    expect(amps1).toMatchObject({ value: 180, limit: "between 120 and 240", verdict: "pass" });
    // Struck out passes stay, marked as such.
    expect(rows.some((r) => r.item === "joint W1 round 1 pass 3 (struck out): volts")).toBe(true);
    // A pass stored without findings still shows its figures, with no limit or verdict it was never given.
    const volts4 = rows.find((r) => r.item === "joint W1 round 2 pass 4: volts")!;
    expect(volts4).toMatchObject({ value: 24, unit: "V", limit: "", verdict: "" });
  });

  it("reads back through a CSV parser with the header's columns", () => {
    const text = bulkCsvHeader() + bulkCsvLines(repairedJobRecord());
    const parsed = parse(text, { columns: true }) as Record<string, string>[];
    expect(Object.keys(parsed[0]!)).toEqual([...BULK_CSV_COLUMNS]);
    expect(parsed.length).toBe(jobCsvRows(repairedJobRecord()).length);
    expect(parsed.find((r) => r.item === "joint W1 round 1 pass 2: amps")).toMatchObject({ value: "250", unit: "A", limit: "between 120 and 240", verdict: "fail" });
  });
});
