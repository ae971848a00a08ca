// Each chart's numbers as CSV (RFC 4180, via the record CSV's field rules), for the download beside it.
import { csvRow } from "@/lib/records/csv";
import { defectLabel, dispositionLabel, jobStateLabel } from "./labels";
import type { QualityFigures } from "./schema";

const lines = (rows: unknown[][]): string => `${rows.map(csvRow).join("\r\n")}\r\n`;
const r3 = (v: number | null) => (v === null ? "" : Math.round(v * 1000) / 1000);

export function yieldCsv(f: QualityFigures["firstPassYield"]): string {
  return lines([
    ["group", "name", "inspected", "accepted_first", "ratio"],
    ["all", "All joints", f.overall.inspected, f.overall.acceptedFirst, r3(f.overall.ratio)],
    ...f.byWelder.map((w) => ["welder", w.welderName, w.inspected, w.acceptedFirst, r3(w.ratio)]),
    ...f.byWps.map((w) => ["wps", w.reference, w.inspected, w.acceptedFirst, r3(w.ratio)]),
  ]);
}

export function defectsCsv(d: QualityFigures["defects"]): string {
  return lines([["criterion", "label", "count"], ...d.map((x) => [x.criterion, defectLabel(x.criterion), x.count])]);
}

export function heatCsv(series: QualityFigures["heatInput"]): string {
  return lines([
    ["wps", "at", "kj_per_mm", "limit_kj_per_mm", "within_limit", "job", "joint", "round", "pass", "welder"],
    ...series.flatMap((s) => s.points.map((p) => [s.reference, p.at, p.kJPerMm, p.limitKJPerMm ?? "", p.within ? "yes" : "no", p.jobNumber, p.jointId, p.round, p.passNumber, p.welderName])),
  ]);
}

export function nonconformanceCsv(n: QualityFigures["nonconformances"]): string {
  return lines([["disposition", "count", "median_days", "max_days"], ...n.byDisposition.map((x) => [dispositionLabel(x.disposition), x.count, x.medianDays ?? "", x.maxDays ?? ""])]);
}

export function waitCsv(w: QualityFigures["inspectionWait"]): string {
  return lines([
    ["measure", "value"],
    ["rounds_inspected", w.inspected],
    ["median_hours", w.medianHours ?? ""],
    ["p90_hours", w.p90Hours ?? ""],
    ["max_hours", w.maxHours ?? ""],
    ["waiting_now", w.waitingNow],
    ["oldest_waiting_hours", w.oldestWaitingHours ?? ""],
  ]);
}

export function jobsCsv(j: QualityFigures["jobs"]): string {
  return lines([["state", "count", "median_days_in_state", "max_days_in_state"], ...j.map((x) => [jobStateLabel(x.state), x.count, x.medianDays ?? "", x.maxDays ?? ""])]);
}

export function qualificationsCsv(q: QualityFigures["qualifications"]): string {
  return lines([["welder", "process", "expires_on", "days_left"], ...q.lapsing.map((x) => [x.welderName, x.process, x.expiresOn, x.daysLeft])]);
}

export const csvHref = (csv: string): string => `data:text/csv;charset=utf-8,${encodeURIComponent(csv)}`;
