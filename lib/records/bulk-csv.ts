// Released jobs as one CSV for auditors: one row per recorded value (a reading, a torque, a dew-point margin,
// a DFT spot, a geometry capture, each figure of a weld pass against its WPS), with value, unit, limit and
// verdict in columns of their own so a spreadsheet can filter and sum them. Figures are in the stored units
// (mm, °, °C, µm, N·m, kPa, V, A, mm/min, kJ/mm); the unit column says which.
import { checkDewPoint } from "@/lib/coating";
import type { JobRecord, StepView } from "@/lib/jobs/record";
import { measureBounds, measureVerdict, torqueBounds, torqueVerdict, type Bounds } from "@/lib/jobs/tolerance";
import type { CautionValue, CheckValue, CoatingValue, GeometryValue, MeasureValue, TorqueValue } from "@/lib/jobs/values";
import { QUANTITY_SYMBOLS } from "@/lib/procedures/labels";
import type { WpsField } from "@/lib/welding/wps-check";
import { csvField, csvRow } from "./csv";

export const BULK_CSV_COLUMNS = [
  "job_number",
  "axle_tag",
  "released_at",
  "section",
  "step_key",
  "step_title",
  "kind",
  "item",
  "value",
  "unit",
  "limit",
  "verdict",
  "signer",
  "signed_at",
] as const;

const FIELD_WORDS: Record<WpsField, string> = {
  volts: "volts",
  amps: "amps",
  travelSpeed: "travel speed",
  heatInput: "heat input",
  preheat: "preheat",
  interpass: "interpass",
  position: "position",
};

type Row = Record<(typeof BULK_CSV_COLUMNS)[number], string | number | null>;

/** Figures as a spreadsheet reads them: plain decimals, no thousands separator, at most 4 decimals. */
function figure(n: number | null | undefined): string {
  if (n === null || n === undefined || !Number.isFinite(n)) return "";
  return String(Math.round(n * 10_000) / 10_000);
}

/** "between 98 and 102", "≥ 6", "≤ 1.5" (inclusive limits, in the row's unit). Words first, so a negative
 * lower limit never opens the cell with a minus a spreadsheet would take for a formula. */
export function limitText(b: Bounds): string {
  if (b.low !== null && b.high !== null) return `between ${figure(b.low)} and ${figure(b.high)}`;
  if (b.low !== null) return `≥ ${figure(b.low)}`;
  if (b.high !== null) return `≤ ${figure(b.high)}`;
  return "";
}

const verdictWord = (ok: boolean) => (ok ? "pass" : "fail");

function lastSignOff(s: StepView) {
  const performed = s.signOffs.filter((o) => o.meaning !== "released");
  return performed.at(-1) ?? null;
}

/** The rows of one released job, in checklist order; weld passes follow their step. */
export function jobCsvRows(record: JobRecord): Row[] {
  const j = record.job;
  const rows: Row[] = [];
  const passesByStep = new Map<string, typeof record.passes>();
  for (const p of record.passes) passesByStep.set(p.stepId, [...(passesByStep.get(p.stepId) ?? []), p]);
  for (const s of [...record.steps].sort((a, b) => a.position - b.position)) {
    const so = lastSignOff(s);
    const base = {
      job_number: j.number,
      axle_tag: j.axleTag,
      released_at: j.releasedAt ?? "",
      section: s.sectionTitle,
      step_key: s.key,
      step_title: s.title,
      kind: s.kind,
      signer: so?.printedName ?? "",
      signed_at: so?.signedAt ?? "",
    };
    const add = (item: string, value: string | number, unit: string, limit: string, verdict: string, who?: { signer: string; signed_at: string }) =>
      rows.push({ ...base, ...who, item, value, unit, limit, verdict });
    const v = (s.effectiveValue ?? {}) as Record<string, unknown>;
    const spec = s.spec;
    switch (spec.kind) {
      case "measure": {
        const r = (v as MeasureValue).reading;
        const unit = QUANTITY_SYMBOLS[spec.quantity];
        if (typeof r === "number") add(s.title, r, unit, limitText(measureBounds(spec)), verdictWord(measureVerdict(spec, r).ok));
        else add(s.title, "", unit, limitText(measureBounds(spec)), "not recorded");
        break;
      }
      case "torque": {
        const t = (v as TorqueValue).achievedNm;
        if (typeof t === "number") add(spec.fastener || s.title, t, "N·m", limitText(torqueBounds(spec)), verdictWord(torqueVerdict(spec, t).ok));
        else add(spec.fastener || s.title, "", "N·m", limitText(torqueBounds(spec)), "not recorded");
        break;
      }
      case "coating": {
        const c = v as CoatingValue;
        if (c.airTempC !== undefined && c.relativeHumidity !== undefined && c.surfaceTempC !== undefined) {
          const d = checkDewPoint({ airTempC: c.airTempC, relativeHumidity: c.relativeHumidity, surfaceTempC: c.surfaceTempC, requiredMarginC: spec.dewPointMarginC });
          add("surface above dew point", d.marginC, "°C", limitText({ low: spec.dewPointMarginC, high: null }), verdictWord(d.ok));
        }
        (c.dftSpots ?? []).forEach((spot, i) => {
          if (!spot.length) return;
          const mean = spot.reduce((a, b) => a + b, 0) / spot.length;
          const bounds = { low: spec.dftMinUm, high: spec.dftMaxUm };
          add(`DFT spot ${i + 1} (mean of ${spot.length})`, mean, "µm", limitText(bounds), verdictWord(mean >= spec.dftMinUm && mean <= spec.dftMaxUm));
        });
        break;
      }
      case "geometry": {
        const g = v as GeometryValue;
        for (const w of ["before", "after"] as const) {
          const r = g[w]?.results;
          if (!r) continue;
          add(`${w}: worst wheel steer over the heave travel`, r.worstHeave.wheelSteerDeg, "°", "", "");
          add(`${w}: link angle difference`, r.angleDifferenceDeg, "°", "", "");
        }
        break;
      }
      case "check":
        add(s.title, (v as CheckValue).confirmed ? "confirmed" : "not confirmed", "", "", "");
        break;
      case "caution":
        add(s.title, `${(v as CautionValue).acknowledged?.length ?? 0} of ${spec.hazards.length} acknowledged`, "", "", "");
        break;
      case "weld": {
        const passes = [...(passesByStep.get(s.id) ?? [])].sort((a, b) => a.round - b.round || a.passNumber - b.passNumber);
        for (const p of passes) {
          const who = { signer: p.welder.name, signed_at: p.recordedAt };
          const label = `joint ${spec.jointId} round ${p.round} pass ${p.passNumber}${p.removed ? " (struck out)" : ""}`;
          // The pass's own figures always; the WPS range and verdict where the pass was checked against one.
          // Heat input as the WPS check took it (arc energy or heat input, by the WPS); else the pass's own.
          const heat = p.findings.find((x) => x.field === "heatInput")?.value ?? p.heatInputKJPerMm;
          const figures: [WpsField, number | string | null, string][] = [
            ["volts", p.volts, "V"],
            ["amps", p.amps, "A"],
            ["travelSpeed", p.travelSpeedMmPerMin, "mm/min"],
            ["heatInput", heat, "kJ/mm"],
            ["preheat", p.preheatC, "°C"],
            ["interpass", p.interpassC, "°C"],
            ["position", p.position, ""],
          ];
          for (const [field, value, unit] of figures) {
            if (value === null || value === "") continue;
            const f = p.findings.find((x) => x.field === field);
            const limit = f && f.field !== "position" ? limitText({ low: f.min ?? null, high: f.max ?? null }) : "";
            add(`${label}: ${FIELD_WORDS[field]}`, value, unit, limit, f ? (f.ok ? "pass" : "fail") : "", who);
          }
        }
        if (passes.length === 0) add(s.title, "", "", "", "no passes");
        break;
      }
      case "photo":
      case "hold":
        add(s.title, typeof v.note === "string" ? v.note : "", "", "", "");
        break;
    }
  }
  return rows;
}

export function bulkCsvHeader(): string {
  return csvRow([...BULK_CSV_COLUMNS]) + "\r\n";
}

// A number goes out as a plain figure (a negative one too: csvField would guard its minus as a formula).
const cell = (v: string | number | null) => (typeof v === "number" ? figure(v) : csvField(v));

export function bulkCsvLines(record: JobRecord): string {
  return jobCsvRows(record).map((r) => BULK_CSV_COLUMNS.map((c) => cell(r[c])).join(",") + "\r\n").join("");
}
