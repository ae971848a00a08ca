// One job's record as CSV (RFC 4180: CRLF line ends, fields quoted when they hold a comma, quote or line end).
import type { JobRecord } from "@/lib/jobs/record";

export function csvField(value: unknown): string {
  const text = value === null || value === undefined ? "" : typeof value === "object" ? JSON.stringify(value) : String(value);
  // A leading = + - @ would run as a formula in a spreadsheet; a quote mark in front keeps it text.
  const safe = /^[=+\-@\t\r]/.test(text) ? `'${text}` : text;
  return /[",\r\n]/.test(safe) ? `"${safe.replace(/"/g, '""')}"` : safe;
}

export function csvRow(values: unknown[]): string {
  return values.map(csvField).join(",");
}

export const CSV_COLUMNS = ["record", "section", "step", "kind", "title", "value", "signer", "role", "meaning", "signed_at", "content_hash", "amends", "reason"];

export function recordCsv(record: JobRecord, integrity: { intact: boolean; entries: number; seal: string | null }): string {
  const j = record.job;
  const lines: string[] = [csvRow(CSV_COLUMNS)];
  const meta = (title: string, value: unknown) => lines.push(csvRow(["job", "", "", "", title, value, "", "", "", "", "", "", ""]));
  meta("job number", j.number);
  meta("state", j.status);
  meta("customer", j.customerName);
  meta("vehicle", [j.vehicleYear, j.vehicleMakeModel].filter(Boolean).join(" "));
  meta("VIN", j.vin);
  meta("axle", `${j.axleDescription} (${j.axleTag})`);
  meta("procedure", `${j.procedureTitle} v${j.procedureVersionNumber}`);
  meta("released at", j.releasedAt ?? "");
  meta("record intact", integrity.intact ? "yes" : "no");
  meta("seal", integrity.seal ?? "");
  meta("entries", integrity.entries);
  for (const s of record.steps) {
    if (s.signOffs.length === 0) {
      lines.push(csvRow(["step", s.sectionTitle, s.key, s.kind, s.title, s.effectiveValue, "", "", "unsigned", "", "", "", ""]));
    }
    for (const so of s.signOffs) {
      lines.push(csvRow(["step", s.sectionTitle, s.key, s.kind, s.title, so.value, so.printedName, so.role, so.meaning, so.signedAt, so.contentHash, so.amendsSignOffId, so.reason]));
    }
  }
  for (const p of record.passes) {
    lines.push(
      csvRow([
        "weld pass",
        "",
        record.steps.find((s) => s.id === p.stepId)?.key ?? "",
        "weld",
        `pass ${p.passNumber}`,
        { process: p.process, volts: p.volts, amps: p.amps, travelSpeedMmPerMin: p.travelSpeedMmPerMin, preheatC: p.preheatC, interpassC: p.interpassC, fillerLot: p.fillerLot, heatInputKJPerMm: p.heatInputKJPerMm, removed: p.removed },
        p.welder.name,
        "welder",
        "",
        p.recordedAt,
        "",
        "",
        "",
      ]),
    );
  }
  for (const nc of record.nonconformances) {
    lines.push(csvRow(["nonconformance", "", nc.stepKey, "", `NC ${nc.number}: ${nc.description}`, nc.observed, nc.raisedBy.name, "", "raised", nc.raisedAt, "", "", ""]));
    if (nc.disposition) {
      lines.push(csvRow(["disposition", "", nc.stepKey, "", `NC ${nc.number}: ${nc.disposition.disposition}`, nc.disposition.notes, nc.disposition.decidedBy.name, "", "dispositioned", nc.disposition.decidedAt, "", "", ""]));
    }
  }
  for (const ph of record.photos) {
    lines.push(csvRow(["photo", "", record.steps.find((s) => s.id === ph.stepId)?.key ?? "", "", ph.caption, ph.sha256, ph.uploadedBy.name, "", ph.removed ? "removed" : "", ph.uploadedAt, ph.sha256, "", ""]));
  }
  if (record.releaseSignOff) {
    const r = record.releaseSignOff;
    lines.push(csvRow(["release", "", "", "", "released", "", r.printedName, r.role, r.meaning, r.signedAt, r.contentHash, "", ""]));
  }
  return lines.join("\r\n") + "\r\n";
}
