// The auditor's bulk CSV of released jobs: parsed with a CSV library (csv-parse), checked column by column
// against the same jobs read through the job API.
import { parse } from "csv-parse/sync";
import { beforeAll, describe, expect, it } from "vitest";
import { api, session, type Session } from "./support";

const COLUMNS = ["job_number", "axle_tag", "released_at", "section", "step_key", "step_title", "kind", "item", "value", "unit", "limit", "verdict", "signer", "signed_at"] as const;

type Row = Record<(typeof COLUMNS)[number], string>;
const rowsOf = (text: string): Row[] => parse(text, { columns: true, skip_empty_lines: true, record_delimiter: "\r\n" });

let auditor: Session;
let csvText: string;
let rows: Row[];

beforeAll(async () => {
  auditor = await session("auditor@irongully.example");
  const res = await api("/api/records/export.csv", { session: auditor });
  expect(res.status, res.text).toBe(200);
  expect(res.headers.get("content-type")).toMatch(/^text\/csv/);
  expect(res.headers.get("content-disposition")).toMatch(/attachment; filename="released-jobs\.csv"/);
  csvText = res.text;
  rows = rowsOf(csvText);
});

describe("GET /api/records/export.csv", () => {
  it("has the named columns, CRLF line ends, and only the shop's released jobs", async () => {
    const header = parse(csvText, { to_line: 1 })[0] as string[];
    expect(header).toEqual([...COLUMNS]);
    expect(csvText.split("\r\n")[0]).toBe(COLUMNS.join(","));
    const list = await api("/api/records?pageSize=100", { session: auditor });
    const released = new Set((list.json.records as { number: string }[]).map((r) => r.number));
    expect(released.size).toBeGreaterThan(0);
    expect(new Set(rows.map((r) => r.job_number))).toEqual(released);
  });

  it("a measure step's reading, unit, limit and verdict stand in their own columns", async () => {
    type MeasureStep = { key: string; kind: string; spec: { tolerance: { type: string; min?: number; max?: number; plus?: number; minus?: number }; nominal?: number; quantity: string }; effectiveValue: { reading?: number } | null };
    const list = await api("/api/records?pageSize=100", { session: auditor });
    // The first released job that has measured readings (not every procedure measures something).
    let first: { id: string; number: string } | undefined;
    let rec: { job: { axleTag: string }; steps: MeasureStep[] } | undefined;
    let measures: MeasureStep[] = [];
    for (const r of list.json.records as { id: string; number: string }[]) {
      const candidate = (await api(`/api/jobs/${r.id}`, { session: auditor })).json;
      measures = (candidate.steps as MeasureStep[]).filter((s) => s.kind === "measure" && typeof s.effectiveValue?.reading === "number");
      if (measures.length > 0) {
        first = r;
        rec = candidate as typeof rec;
        break;
      }
    }
    expect(measures.length, "a released job with measured readings").toBeGreaterThan(0);
    for (const s of measures) {
      const row = rows.find((r) => r.job_number === first!.number && r.step_key === s.key);
      expect(row, s.key).toBeDefined();
      const reading = s.effectiveValue!.reading!;
      expect(Number(row!.value)).toBeCloseTo(reading, 4);
      expect(row!.unit).toBe({ length: "mm", angle: "°", temperature: "°C", thickness: "µm", torque: "N·m", pressure: "kPa" }[s.spec.quantity]);
      // The limit and verdict worked out here from the step's own tolerance.
      const t = s.spec.tolerance;
      const [low, high] =
        t.type === "plusMinus" ? [(s.spec.nominal ?? 0) - t.minus!, (s.spec.nominal ?? 0) + t.plus!] : t.type === "range" ? [t.min!, t.max!] : t.type === "min" ? [t.min!, null] : [null, t.max!];
      const shown = (n: number) => String(Math.round(n * 10_000) / 10_000);
      expect(row!.limit).toBe(low !== null && high !== null ? `between ${shown(low)} and ${shown(high)}` : low !== null ? `≥ ${shown(low)}` : `≤ ${shown(high!)}`);
      const inside = (low === null || reading >= low) && (high === null || reading <= high);
      expect(row!.verdict).toBe(inside ? "pass" : "fail");
      expect(row!.signer).not.toBe("");
      expect(Number.isNaN(Date.parse(row!.signed_at))).toBe(false);
      expect(row!.axle_tag).toBe(rec!.job.axleTag);
    }
  });

  it("each weld pass figure is a row with the WPS range as its limit, signed by the welder who recorded it", async () => {
    const list = await api("/api/records?pageSize=100", { session: auditor });
    let checked = 0;
    for (const r of list.json.records as { id: string; number: string }[]) {
      const rec = (await api(`/api/jobs/${r.id}`, { session: auditor })).json;
      for (const p of rec.passes as { stepId: string; passNumber: number; round: number; volts: number; amps: number; welder: { name: string }; recordedAt: string; findings: { field: string; value: number | null; unit: string; min?: number; max?: number; ok: boolean }[] }[]) {
        const step = (rec.steps as { id: string; key: string }[]).find((s) => s.id === p.stepId)!;
        const mine = rows.filter((x) => x.job_number === r.number && x.step_key === step.key && x.item.includes(`round ${p.round} pass ${p.passNumber}`));
        const volts = p.findings.find((f) => f.field === "volts");
        if (!volts) continue;
        const row = mine.find((x) => x.item.endsWith(": volts"));
        expect(row, `${r.number} ${step.key} pass ${p.passNumber}`).toBeDefined();
        expect(Number(row!.value)).toBeCloseTo(p.volts, 4);
        expect(row!.unit).toBe("V");
        expect(row!.verdict).toBe(volts.ok ? "pass" : "fail");
        if (volts.min !== undefined && volts.max !== undefined) expect(row!.limit).toBe(`between ${volts.min} and ${volts.max}`);
        expect(row!.signer).toBe(p.welder.name);
        expect(row!.signed_at).toBe(p.recordedAt);
        checked++;
      }
    }
    expect(checked).toBeGreaterThan(0);
  });

  it("takes the records list's date range and search", async () => {
    const future = await api("/api/records/export.csv?from=2999-01-01&to=2999-12-31", { session: auditor });
    expect(future.status).toBe(200);
    expect(rowsOf(future.text)).toEqual([]);
    expect(future.headers.get("content-disposition")).toContain("released-jobs_2999-01-01_2999-12-31.csv");
    const one = rows[0]!.job_number;
    const searched = rowsOf((await api(`/api/records/export.csv?q=${encodeURIComponent(one)}`, { session: auditor })).text);
    expect(searched.length).toBeGreaterThan(0);
    expect(new Set(searched.map((r) => r.job_number))).toEqual(new Set([one]));
  });

  it("refuses a reversed range with the reason, and people without the records desk", async () => {
    const reversed = await api("/api/records/export.csv?from=2026-12-01&to=2026-01-01", { session: auditor });
    expect([400, 422]).toContain(reversed.status);
    expect(reversed.json.error.message + JSON.stringify(reversed.json.error.fields ?? {})).toMatch(/end date is before the start date/);
    const welder = await session("welder@irongully.example");
    expect((await api("/api/records/export.csv", { session: welder })).status).toBe(403);
    expect((await api("/api/records/export.csv")).status).toBe(401);
    // Another shop's lead gets that shop's jobs only.
    const other = await session("lead@saltpan.example");
    const theirs = rowsOf((await api("/api/records/export.csv", { session: other })).text);
    expect(theirs.some((r) => rows.some((mine) => mine.job_number === r.job_number && mine.released_at === r.released_at))).toBe(false);
  });
});
