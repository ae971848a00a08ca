"use client";
// The read side of a weld step: the joint's state, the WPS revision its passes are checked against, the
// welder's qualification, the passes as cards and the inspection results of its rounds.
import { HOT_WORK_CAUTIONS } from "@/components/safety-cautions";
import type { InspectionView, JobRecord, JointRound, JointView, PassView, PhotoView, QualificationSummary, SignOffView, WpsSummary } from "@/lib/jobs/record";
import { show } from "@/lib/jobs/units";
import type { Step } from "@/lib/procedures/schema";
import { visualCriteriaLabel, type VisualItem, type WpsRanges } from "@/lib/welding";
import { Pill, VerdictBox, type VerdictTone } from "./verdict";

export type Weld = Extract<Step, { kind: "weld" }>;


export const ITEM_LABELS: Record<VisualItem, string> = {
  cracks: "Cracks",
  fusion: "Fusion",
  craters: "Craters",
  profile: "Profile",
  undersize: "Leg size",
  undercut: "Undercut",
  porosity: "Porosity",
  "arc-strikes": "Arc strikes",
  spatter: "Spatter",
};

const REPAIR_WORDS = { grinding: "ground out", "air-arc-gouging": "air-arc gouged", machining: "machined out", other: "removed" } as const;
const utc = (iso: string) => `${iso.slice(0, 16).replace("T", " ")} UTC`;
export const roundName = (n: number) => (n > 1 ? `Repair round ${n}` : "Round 1");

export function HotWorkNote() {
  return (
    <section className="rounded-lg border-4 border-graphite-950 bg-primer-100 p-4" aria-labelledby="hotwork-h" data-testid="hot-work-cautions">
      <h3 id="hotwork-h" className="flex items-center gap-2 text-lg font-bold text-graphite-950">
        <span aria-hidden="true" className="inline-flex h-8 w-8 items-center justify-center rounded bg-graphite-950 text-primer-300">!</span>
        Hot work
      </h3>
      <ul className="mt-2 list-disc space-y-1 pl-6 text-graphite-950">
        {HOT_WORK_CAUTIONS.map((c) => <li key={c}>{c}</li>)}
      </ul>
    </section>
  );
}

/** The published WPS revision a weld step is checked against, or undefined when the library has none. */
export function wpsOf(record: Pick<JobRecord, "wps">, spec: Weld): WpsSummary | undefined {
  const ref = spec.wpsRef.trim().toUpperCase();
  return record.wps.find((w) => w.reference === ref);
}

export const wpsRangesOf = (w: WpsSummary): WpsRanges => ({ ...w.ranges, positions: w.positions });

// --- The WPS and its ranges ---------------------------------------------------------------------------

function rangeText(min: number | undefined, max: number | undefined, fmt: (v: number) => string): string | null {
  if (min !== undefined && max !== undefined) return `${fmt(min)} – ${fmt(max)}`;
  if (min !== undefined) return `at least ${fmt(min)}`;
  if (max !== undefined) return `at most ${fmt(max)}`;
  return null;
}

export function WpsPanel({ wps, spec, tempUnit, speedUnit }: { wps: WpsSummary | undefined; spec: Weld; tempUnit: string; speedUnit: string }) {
  if (!wps) {
    return (
      <VerdictBox tone="fail" title={`No published WPS ${spec.wpsRef}`} testId="wps-panel">
        Joint {spec.jointId} is welded to {spec.wpsRef}, which has no published revision in this shop&rsquo;s WPS library. A lead publishes it before the joint is welded.
      </VerdictBox>
    );
  }
  const r = wps.ranges;
  const basis = (r.heatInputBasis ?? "arc-energy") === "iso-q" ? "heat input Q = k × arc energy (ISO/TR 17671-1)" : "arc energy, no efficiency factor (ASME IX QW-409.1)";
  const rows: [string, string | null][] = [
    ["Voltage", rangeText(r.voltsMin, r.voltsMax, (v) => `${v} V`)],
    ["Current", rangeText(r.ampsMin, r.ampsMax, (v) => `${v} A`)],
    ["Travel speed", rangeText(r.travelSpeedMinMmPerMin, r.travelSpeedMaxMmPerMin, (v) => show("speed", v, speedUnit))],
    ["Heat input", r.heatInputMaxKJPerMm !== undefined ? `at most ${r.heatInputMaxKJPerMm} kJ/mm ${basis}` : null],
    ["Interpass", r.interpassMaxC !== undefined ? `at most ${show("temperature", r.interpassMaxC, tempUnit)}` : null],
    ["Positions", wps.positions.length ? wps.positions.join(", ") : null],
  ];
  return (
    <section className="rounded-lg border-2 border-graphite-700 bg-white p-3" aria-labelledby="wps-h" data-testid="wps-panel">
      <h3 id="wps-h" className="flex flex-wrap items-baseline gap-x-2 font-bold">
        <span aria-hidden="true">◆</span> Checked against <span className="figures" data-testid="wps-ref">{wps.reference} revision {wps.number}</span>
        <span className="text-sm font-semibold text-graphite-800">{wps.title}</span>
      </h3>
      <dl className="mt-2 grid grid-cols-2 gap-x-4 gap-y-1 sm:grid-cols-4">
        {rows.filter(([, v]) => v !== null).map(([k, v]) => (
          <div key={k} className={k === "Heat input" ? "col-span-2" : ""}>
            <dt className="text-sm font-semibold text-graphite-800">{k}</dt>
            <dd className="figures text-graphite-950">{v}</dd>
          </div>
        ))}
      </dl>
    </section>
  );
}

// --- The viewer's qualification -----------------------------------------------------------------------

function daysUntil(date: string): number {
  return Math.round((Date.parse(`${date}T00:00:00Z`) - Date.parse(`${new Date().toISOString().slice(0, 10)}T00:00:00Z`)) / 86_400_000);
}

export function QualificationBox({ qualification }: { qualification: QualificationSummary }) {
  if (!qualification.ok) {
    return (
      <VerdictBox tone="fail" title={`You may not weld ${qualification.process} on this joint today`} testId="qualification">
        <p>{qualification.reason}</p>
        {qualification.lapsedOn ? <p className="mt-1">Lapsed on <strong className="figures">{qualification.lapsedOn}</strong>. A lead records the requalification; until then, passes are refused.</p> : null}
      </VerdictBox>
    );
  }
  const soon = qualification.expiresOn !== null && daysUntil(qualification.expiresOn) <= 30;
  return (
    <div className="flex flex-wrap items-start gap-2 rounded-lg border-2 border-graphite-300 bg-white px-3 py-2" data-testid="qualification" data-verdict={soon ? "wait" : "pass"}>
      <Pill tone={soon ? "wait" : "pass"}>{soon ? `${qualification.process} lapses soon` : `${qualification.process} qualification current`}</Pill>
      <p className="min-w-0 flex-1 text-sm text-graphite-950">{qualification.reason}</p>
    </div>
  );
}

// --- Passes -------------------------------------------------------------------------------------------

const METHOD_WORDS: Record<PassView["heatInputMethod"], string> = {
  "voltage-current": "V · A · travel, QW-409.1(a)",
  energy: "machine arc energy, QW-409.1(c)(1)",
  power: "machine average power, QW-409.1(c)(2)",
};

export function failedMessages(p: Pick<PassView, "findings">): string[] {
  return p.findings.filter((f) => !f.ok).map((f) => f.message);
}

/** A pass's WPS verdict: within, or outside with its findings and whether it is covered. */
export function PassWpsVerdict({ pass, coverage }: { pass: PassView; coverage: "override" | "uncovered" | "nc" | "closed" }) {
  const ref = `${pass.wps.reference}${pass.wps.number !== null ? ` rev ${pass.wps.number}` : ""}`;
  if (!pass.outOfRange) return <Pill tone="pass" testId="pass-wps">Within {ref}</Pill>;
  return (
    <div className="space-y-1" data-testid="pass-wps">
      <Pill tone="fail">Outside {ref}</Pill>
      <ul className="list-disc pl-5 text-sm font-semibold text-[#8a1d15]" data-testid="pass-findings">
        {failedMessages(pass).map((m) => <li key={m}>{m}</li>)}
      </ul>
      {pass.override ? (
        <p className="text-sm text-graphite-950" data-testid="pass-override">
          <span aria-hidden="true">● </span>Accepted as welded by <strong>{pass.override.by.name}</strong> ({utc(pass.override.at)}): &ldquo;{pass.override.reason}&rdquo;
        </p>
      ) : coverage === "nc" ? (
        <p className="text-sm text-graphite-950"><span aria-hidden="true">◆ </span>Covered by a dispositioned nonconformance.</p>
      ) : coverage === "uncovered" ? (
        <p className="text-sm font-semibold text-[#5c3d00]"><span aria-hidden="true">▲ </span>The round cannot be signed until a lead accepts this pass as welded or a nonconformance is dispositioned.</p>
      ) : null}
    </div>
  );
}

function passFacts(p: PassView, tempUnit: string): [string, string][] {
  const lengthUnit = p.travelSpeedUnit === "in/min" ? "in" : "mm";
  return [
    ["V · A", `${p.volts} V · ${p.amps} A`],
    ["Travel", show("speed", p.travelSpeedMmPerMin, p.travelSpeedUnit === "in/min" ? "in_min" : "mm_min") + (p.beadLengthMm !== null && p.arcTimeS !== null ? ` (${show("length", p.beadLengthMm, lengthUnit)} in ${p.arcTimeS} s)` : "")],
    ["Position", p.position],
    ["Preheat · interpass", `${show("temperature", p.preheatC, tempUnit)}${p.interpassC !== null ? ` · ${show("temperature", p.interpassC, tempUnit)}` : " · —"}`],
    ["Filler lot", `${p.fillerLot} (${p.fillerClassification})`],
    ["Heat input", `${p.heatInputKJPerMm.toFixed(2)} kJ/mm (arc energy ${p.arcEnergyKJPerMm.toFixed(2)}; ${METHOD_WORDS[p.heatInputMethod]}${p.machineEnergyKJ !== null ? `, ${p.machineEnergyKJ} kJ read` : p.machinePowerW !== null ? `, ${p.machinePowerW} W read` : ""})`],
  ];
}

/** One pass as a card: its figures, its WPS verdict, and what may be done with it. */
export function PassCard({ pass, tempUnit, coverage, actions, compact }: { pass: PassView; tempUnit: string; coverage: "override" | "uncovered" | "nc" | "closed"; actions?: React.ReactNode; compact?: boolean }) {
  return (
    <li className={`rounded-lg border-2 p-3 ${pass.removed ? "border-graphite-300 bg-graphite-50" : pass.outOfRange ? "border-[#8a1d15] bg-white" : "border-graphite-400 bg-white"}`} data-testid={`pass-${pass.passNumber}`}>
      <div className="flex flex-wrap items-start justify-between gap-2">
        <p className={`font-bold ${pass.removed ? "line-through" : ""}`}>
          Pass <span className="figures">{pass.passNumber}</span> · {pass.welder.name} <span className="text-sm font-semibold text-graphite-800">· {utc(pass.recordedAt)}</span>
        </p>
        {pass.removed ? <Pill tone="idle">Struck out</Pill> : null}
      </div>
      <dl className={`mt-1 grid gap-x-4 gap-y-1 ${compact ? "grid-cols-1" : "grid-cols-2 md:grid-cols-3"} ${pass.removed ? "line-through" : ""}`}>
        {passFacts(pass, tempUnit).map(([k, v]) => (
          <div key={k} className={k === "Heat input" && !compact ? "col-span-2 md:col-span-3" : ""}>
            <dt className="text-sm font-semibold text-graphite-800">{k}</dt>
            <dd className="figures text-graphite-950">{v}</dd>
          </div>
        ))}
      </dl>
      {pass.removed ? null : <div className="mt-2"><PassWpsVerdict pass={pass} coverage={coverage} /></div>}
      {actions ? <div className="mt-2">{actions}</div> : null}
    </li>
  );
}

export function coverageOf(pass: PassView, joint: JointView): "override" | "uncovered" | "nc" | "closed" {
  if (pass.override) return "override";
  if (pass.round !== joint.round) return "closed";
  if (joint.uncovered.some((u) => u.passNumber === pass.passNumber)) return "uncovered";
  return "nc";
}

// --- Rounds -------------------------------------------------------------------------------------------

export function PerformedLine({ so }: { so: SignOffView | null }) {
  return so ? (
    <p className="text-graphite-950" data-testid="round-performed">
      <span aria-hidden="true">● </span>Signed as performed by <strong>{so.printedName}</strong>, <span className="capitalize">{so.role}</span>, {utc(so.signedAt)}
    </p>
  ) : (
    <p className="text-graphite-800" data-testid="round-performed"><span aria-hidden="true">○ </span>Not signed by its welder yet.</p>
  );
}

export function InspectionResult({ inspection, photos }: { inspection: InspectionView; photos: PhotoView[] }) {
  const accepted = inspection.decision === "accepted";
  const failed = inspection.items.filter((i) => !i.ok);
  const shots = inspection.photoIds.map((id) => photos.find((p) => p.id === id)).filter((p): p is PhotoView => !!p);
  return (
    <div className={`rounded-lg border-4 p-3 ${accepted ? "border-[#2f4a08] bg-[#eef5d6]" : "border-[#8a1d15] bg-[#fbe9e7]"}`} data-testid="round-inspection" data-decision={inspection.decision}>
      <p className="flex flex-wrap items-center gap-2 font-bold text-graphite-950">
        <Pill tone={accepted ? "pass" : "fail"}>{accepted ? "Accepted" : "Rejected"}</Pill>
        by {inspection.inspector.name}, {utc(inspection.inspectedAt)}
      </p>
      <p className="mt-1 text-graphite-950">Criteria: <strong>{visualCriteriaLabel(inspection.criteria)}</strong> · judged {inspection.judged}</p>
      {failed.length ? (
        <ul className="mt-1 list-disc space-y-1 pl-5 text-graphite-950" data-testid="round-rejected-items">
          {failed.map((i) => (
            <li key={i.item}><strong>{ITEM_LABELS[i.item]}</strong>: {i.measured} (limit: {i.limit})</li>
          ))}
        </ul>
      ) : null}
      {inspection.notes ? <p className="mt-1 text-graphite-950"><strong>Notes:</strong> {inspection.notes}</p> : null}
      {inspection.repair ? (
        <p className="mt-1 text-graphite-950" data-testid="round-repair">
          <strong>Repair:</strong> {REPAIR_WORDS[inspection.repair.method]}{inspection.repair.methodNote ? ` (${inspection.repair.methodNote})` : ""}, <span className="figures">{inspection.repair.depthMm} mm</span> deep over <span className="figures">{inspection.repair.lengthMm} mm</span>, recorded by {inspection.repair.recordedBy.name}, {utc(inspection.repair.recordedAt)}
        </p>
      ) : null}
      {shots.length ? (
        <ul className="mt-2 flex flex-wrap gap-2" aria-label="Inspection photos">
          {shots.map((p) => (
            <li key={p.id}>
              <a href={p.url} target="_blank" rel="noreferrer" className="block h-16 w-16 overflow-hidden rounded border-2 border-graphite-400">
                {/* eslint-disable-next-line @next/next/no-img-element -- served by the photos API to members only */}
                <img src={p.thumbUrl} alt={p.caption || `Inspection photo by ${p.uploadedBy.name}`} className="h-full w-full object-cover" />
              </a>
            </li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}

export function roundTone(r: JointRound, joint: JointView): { tone: VerdictTone; word: string } {
  if (r.inspection) return r.inspection.decision === "accepted" ? { tone: "pass", word: "Accepted" } : { tone: "fail", word: "Rejected" };
  if (r.performed) return { tone: "wait", word: "Waiting for inspection" };
  return { tone: "idle", word: r.round === joint.round ? "Being welded" : "Open" };
}


export function positionChoices(spec: Weld, wps: WpsSummary | undefined): string[] {
  const usual = spec.jointType === "fillet" ? ["1F", "2F", "3F", "4F"] : ["1G", "2G", "3G", "4G", "5G", "6G"];
  const all = new Set([spec.position, ...(wps?.positions ?? []), ...usual]);
  return [...all].filter((p) => /^[1-6](F|G|GR)$/.test(p)).sort();
}
