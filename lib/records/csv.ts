// One job's record as CSV (RFC 4180: CRLF line ends, fields quoted when they hold a comma, quote or line end).
import type { JobRecord } from "@/lib/jobs/record";
import { itemLabel } from "@/lib/traveller/labels";
import { visualCriteriaLabel } from "@/lib/welding";

export function csvField(value: unknown): string {
  const text = value === null || value === undefined ? "" : typeof value === "object" ? JSON.stringify(value) : String(value);
  // A leading = + - @ would run as a formula in a spreadsheet; a quote mark in front keeps it text.
  const safe = /^[=+\-@\t\r]/.test(text) ? `'${text}` : text;
  return /[",\r\n]/.test(safe) ? `"${safe.replace(/"/g, '""')}"` : safe;
}

export function csvRow(values: unknown[]): string {
  return values.map(csvField).join(",");
}

// joint and round: weld joints work in rounds (the first welding, then one per repair after a rejection);
// a weld step's sign-offs, passes and inspections each name theirs.
export const CSV_COLUMNS = ["record", "section", "step", "kind", "title", "value", "signer", "role", "meaning", "signed_at", "content_hash", "amends", "reason", "joint", "round"];

export function recordCsv(record: JobRecord, integrity: { intact: boolean; entries: number; seal: string | null }): string {
  const j = record.job;
  const lines: string[] = [csvRow(CSV_COLUMNS)];
  const meta = (title: string, value: unknown) => lines.push(csvRow(["job", "", "", "", title, value, "", "", "", "", "", "", "", "", ""]));
  const jointOf = (stepId: string | null) => {
    const s = record.steps.find((x) => x.id === stepId);
    return s?.spec.kind === "weld" ? s.spec.jointId : "";
  };
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
    const joint = jointOf(s.id);
    if (s.signOffs.length === 0) {
      lines.push(csvRow(["step", s.sectionTitle, s.key, s.kind, s.title, s.effectiveValue, "", "", "unsigned", "", "", "", "", joint, ""]));
    }
    // A weld step's "inspected" sign-offs are the inspections below (same content hash); here they keep their
    // place among the step's signatures, named by joint and round.
    for (const so of s.signOffs) {
      lines.push(csvRow(["step", s.sectionTitle, s.key, s.kind, s.title, so.value, so.printedName, so.role, so.meaning, so.signedAt, so.contentHash, so.amendsSignOffId, so.reason, joint, joint ? (so.round ?? "") : ""]));
    }
  }
  // Passes in checklist order, then round and pass number (the query returns them by step id).
  const position = new Map(record.steps.map((s) => [s.id, s.position]));
  const passes = [...record.passes].sort((a, b) => (position.get(a.stepId) ?? 0) - (position.get(b.stepId) ?? 0) || a.round - b.round || a.passNumber - b.passNumber);
  for (const p of passes) {
    const step = record.steps.find((s) => s.id === p.stepId);
    lines.push(
      csvRow([
        "weld pass",
        step?.sectionTitle ?? "",
        step?.key ?? "",
        "weld",
        `pass ${p.passNumber}`,
        {
          process: p.process,
          position: p.position,
          wps: p.wps.reference,
          wpsRevision: p.wps.number,
          volts: p.volts,
          amps: p.amps,
          travelSpeedMmPerMin: p.travelSpeedMmPerMin,
          preheatC: p.preheatC,
          interpassC: p.interpassC,
          fillerClassification: p.fillerClassification,
          fillerLot: p.fillerLot,
          heatInputMethod: p.heatInputMethod,
          arcEnergyKJPerMm: p.arcEnergyKJPerMm,
          heatInputKJPerMm: p.heatInputKJPerMm,
          outsideWps: p.findings.filter((f) => !f.ok).map((f) => f.message),
          override: p.override ? { reason: p.override.reason, by: p.override.by.name, at: p.override.at } : null,
          removed: p.removed,
        },
        p.welder.name,
        "welder",
        p.removed ? "struck out" : "",
        p.recordedAt,
        "",
        "",
        "",
        jointOf(p.stepId),
        p.round,
      ]),
    );
  }
  for (const i of record.inspections) {
    const step = record.steps.find((s) => s.id === i.stepId);
    const so = step?.signOffs.find((o) => o.id === i.signOffId);
    const joint = jointOf(i.stepId);
    lines.push(
      csvRow([
        "inspection",
        step?.sectionTitle ?? "",
        step?.key ?? "",
        "weld",
        `visual inspection of joint ${joint}, round ${i.round}`,
        {
          criteria: visualCriteriaLabel(i.criteria),
          judged: i.judged,
          rejectedItems: i.items.filter((it) => !it.ok).map((it) => ({ item: itemLabel(it.item), measured: it.measured, limit: it.limit, source: it.source })),
          notes: i.notes,
          photoIds: i.photoIds,
        },
        i.inspector.name,
        so?.role ?? "inspector",
        i.decision,
        i.inspectedAt,
        so?.contentHash ?? "",
        "",
        "",
        joint,
        i.round,
      ]),
    );
  }
  // Material entries are never changed: a correction (or a withdrawal) is a new row naming the one it replaces.
  for (const m of record.materials) {
    lines.push(
      csvRow([
        "material",
        "",
        "",
        m.kind,
        m.description,
        { id: m.id, specification: m.specification, heatNumber: m.heatNumber, certificate: m.certificate, withdrawn: m.withdrawn, superseded: m.superseded },
        m.recordedBy.name,
        "",
        m.withdrawn ? "withdrawn" : m.correctsId ? "corrected" : "recorded",
        m.recordedAt,
        "",
        m.correctsId,
        m.reason,
        "",
        "",
      ]),
    );
  }
  for (const nc of record.nonconformances) {
    lines.push(csvRow(["nonconformance", "", nc.stepKey, "", `NC ${nc.number}: ${nc.description}`, nc.observed, nc.raisedBy.name, "", "raised", nc.raisedAt, "", "", "", jointOf(nc.stepId), ""]));
    if (nc.disposition) {
      lines.push(csvRow(["disposition", "", nc.stepKey, "", `NC ${nc.number}: ${nc.disposition.disposition}`, nc.disposition.notes, nc.disposition.decidedBy.name, "", "dispositioned", nc.disposition.decidedAt, nc.disposition.contentHash, "", "", jointOf(nc.stepId), ""]));
    }
  }
  for (const ph of record.photos) {
    lines.push(csvRow(["photo", "", record.steps.find((s) => s.id === ph.stepId)?.key ?? "", "", ph.caption, ph.sha256, ph.uploadedBy.name, "", ph.removed ? "removed" : "", ph.uploadedAt, ph.sha256, "", "", "", ""]));
  }
  if (record.releaseSignOff) {
    const r = record.releaseSignOff;
    lines.push(csvRow(["release", "", "", "", "released", "", r.printedName, r.role, r.meaning, r.signedAt, r.contentHash, "", "", "", ""]));
  }
  return lines.join("\r\n") + "\r\n";
}
