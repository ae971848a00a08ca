"use client";
// A weld step: the joint as the procedure specifies it, the hot-work cautions, the WPS revision its passes
// are checked against, and the joint's rounds (the first welding, then one per repair after a rejection),
// each with its passes, the welder's sign-off and the inspection. Passes of the open round are recorded
// one by one with heat input (ASME IX QW-409.1 / ISO/TR 17671-1) and the WPS check worked out as the
// numbers are typed (lib/welding), so nothing the server would flag or refuse comes as a surprise.
import { useState } from "react";
import { HOT_WORK_CAUTIONS } from "@/components/safety-cautions";
import { RecordWeldMap } from "@/components/weld-map/record-weld-map";
import { RebaseWeldMap } from "./rebase-weld-map";
import { JOINT_STATE_LABELS } from "@/lib/jobs/joint";
import type { InspectionView, JobRecord, JointRound, JointView, PassView, PhotoView, QualificationSummary, SignOffView, StepView, WpsSummary } from "@/lib/jobs/record";
import { defaultPadUnit, readPadNumber, show, symbolOf } from "@/lib/jobs/units";
import type { Step } from "@/lib/procedures/schema";
import { checkPassAgainstWps, passHeatInput, type PassHeatInputResult, visualCriteriaLabel, type VisualItem, type WpsCheckResult, type WpsRanges } from "@/lib/welding";
import { apiJson, ApiError, newKey } from "./api";
import { applyKey, NumberPad, PadField, UnitSwitch } from "./number-pad";
import { storedFrom } from "./pad-state";
import { PinDialog } from "./pin-dialog";
import { useSetRecord } from "./use-job";
import { Pill, VerdictBox, type VerdictTone } from "./verdict";

export type Weld = Extract<Step, { kind: "weld" }>;
type Field = "volts" | "amps" | "speed" | "bead" | "arcTime" | "energy" | "power" | "preheat" | "interpass";
type Travel = "speed" | "bead";
type Machine = "none" | "energy" | "power";


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

const utc = (iso: string) => `${iso.slice(0, 16).replace("T", " ")} UTC`;
const roundName = (n: number) => (n > 1 ? `Repair round ${n}` : "Round 1");

// Heat-tint words for the gauge: always a word beside the colour.
function tint(kJmm: number) {
  if (kJmm < 1) return { word: "Low", colour: "bg-tint-straw" };
  if (kJmm < 2) return { word: "Moderate", colour: "bg-tint-bronze" };
  if (kJmm < 3) return { word: "High", colour: "bg-tint-purple" };
  return { word: "Very high", colour: "bg-tint-blue" };
}

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

// --- Joint state --------------------------------------------------------------------------------------

const STATE_TONE: Record<JointView["state"], VerdictTone> = { welding: "idle", awaiting_inspection: "wait", repair: "fail", accepted: "pass" };

export function jointStateWord(joint: Pick<JointView, "state" | "round">): string {
  return joint.state === "repair" ? `Repair round ${joint.round}` : JOINT_STATE_LABELS[joint.state];
}

export function JointStatePill({ joint, testId }: { joint: Pick<JointView, "state" | "round">; testId?: string }) {
  return <Pill tone={STATE_TONE[joint.state]} testId={testId}>{jointStateWord(joint)}</Pill>;
}

/** The published WPS revision a weld step is checked against, or undefined when the library has none. */
export function wpsOf(record: Pick<JobRecord, "wps">, spec: Weld): WpsSummary | undefined {
  const ref = spec.wpsRef.trim().toUpperCase();
  return record.wps.find((w) => w.reference === ref);
}

const wpsRangesOf = (w: WpsSummary): WpsRanges => ({ ...w.ranges, positions: w.positions });

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
    ["Preheat", r.preheatMinC !== undefined ? `at least ${show("temperature", r.preheatMinC, tempUnit)}` : null],
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

function failedMessages(p: Pick<PassView, "findings">): string[] {
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

function PerformedLine({ so }: { so: SignOffView | null }) {
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

function roundTone(r: JointRound, joint: JointView): { tone: VerdictTone; word: string } {
  if (r.inspection) return r.inspection.decision === "accepted" ? { tone: "pass", word: "Accepted" } : { tone: "fail", word: "Rejected" };
  if (r.performed) return { tone: "wait", word: "Waiting for inspection" };
  return { tone: "idle", word: r.round === joint.round ? "Being welded" : "Open" };
}

// --- The control --------------------------------------------------------------------------------------

export function WeldControl({ record, step, jobOpen }: { record: JobRecord; step: StepView; jobOpen: boolean }) {
  const spec = step.spec as Weld;
  const joint = step.joint!;
  const jobId = record.job.id;
  const viewer = record.viewer;
  const me = viewer.userId;
  const setRecord = useSetRecord(jobId);
  const [speedUnit, setSpeedUnit] = useState<string>(defaultPadUnit("speed", viewer.unitSystem));
  const [lengthUnit, setLengthUnit] = useState<string>(defaultPadUnit("length", viewer.unitSystem));
  const [tempUnit, setTempUnit] = useState<string>(defaultPadUnit("temperature", viewer.unitSystem));
  const [texts, setTexts] = useState<Record<Field, string>>({ volts: "", amps: "", speed: "", bead: "", arcTime: "", energy: "", power: "", preheat: "", interpass: "" });
  const [travel, setTravel] = useState<Travel>("speed");
  const [machine, setMachine] = useState<Machine>("none");
  const [position, setPosition] = useState<string>(spec.position);
  const [filler, setFiller] = useState("");
  const [active, setActive] = useState<Field>("volts");
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const [striking, setStriking] = useState<string | null>(null);
  const [overriding, setOverriding] = useState<PassView | null>(null);
  const [overrideReason, setOverrideReason] = useState("");
  const [overridePin, setOverridePin] = useState(false);

  const wps = wpsOf(record, spec);
  const roundOpen = joint.state === "welding" || joint.state === "repair";
  const isWelder = viewer.roles.includes("welder");
  const isLead = viewer.roles.includes("lead");
  const qualification = isWelder ? record.qualifications.find((q) => q.process === spec.process) : undefined;
  const mayRecord = jobOpen && roundOpen && !step.lockedBy && isWelder;
  const allPasses = record.passes.filter((p) => p.stepId === step.id);
  const current = allPasses.filter((p) => p.round === joint.round && !p.removed);
  const nextNumber = allPasses.reduce((n, p) => Math.max(n, p.passNumber), 0) + 1;

  // --- the pass being typed ---
  const needBead = travel === "bead" || machine !== "none";
  const needArc = travel === "bead" || machine === "power";
  const volts = storedFrom(texts.volts, { quantity: null, unit: "V" });
  const amps = storedFrom(texts.amps, { quantity: null, unit: "A" });
  const speedMmMin = storedFrom(texts.speed, { quantity: "speed", unit: speedUnit });
  const beadMm = storedFrom(texts.bead, { quantity: "length", unit: lengthUnit });
  const arcTimeS = storedFrom(texts.arcTime, { quantity: null, unit: "s" });
  const energyKJ = storedFrom(texts.energy, { quantity: null, unit: "kJ" });
  const powerW = storedFrom(texts.power, { quantity: null, unit: "W" });
  const preheatC = storedFrom(texts.preheat, { quantity: "temperature", unit: tempUnit });
  const interpassC = storedFrom(texts.interpass, { quantity: "temperature", unit: tempUnit });
  const pos = (n: number | undefined): n is number => n !== undefined && n > 0;

  // The same routes the server takes (db/queries/jobs-steps passFigures): a machine reading wins over V·A/v.
  let a: PassHeatInputResult | null = null;
  let c: PassHeatInputResult | null = null;
  try {
    if (pos(volts) && pos(amps)) {
      if (travel === "speed" && pos(speedMmMin)) a = passHeatInput({ method: "voltage-current", process: spec.process, volts, amps, travelSpeed: { value: speedMmMin, unit: "mm/min" } });
      if (travel === "bead" && pos(beadMm) && pos(arcTimeS)) a = passHeatInput({ method: "voltage-current", process: spec.process, volts, amps, beadLength: { value: beadMm, unit: "mm" }, arcTimeS });
    }
    if (machine === "energy" && pos(energyKJ) && pos(beadMm)) c = passHeatInput({ method: "energy", process: spec.process, energyJ: energyKJ * 1000, beadLength: { value: beadMm, unit: "mm" }, ...(needArc && pos(arcTimeS) ? { arcTimeS } : {}) });
    if (machine === "power" && pos(powerW) && pos(beadMm) && pos(arcTimeS)) c = passHeatInput({ method: "power", process: spec.process, powerW, arcTimeS, beadLength: { value: beadMm, unit: "mm" } });
  } catch {
    a = null;
    c = null;
  }
  const used = machine === "none" ? a : c;
  const travelMmMin = a?.travelSpeedMmPerMin ?? c?.travelSpeedMmPerMin ?? null;
  const basis = wps?.ranges.heatInputBasis ?? "arc-energy";
  const check: WpsCheckResult | null = wps
    ? checkPassAgainstWps(wpsRangesOf(wps), {
        process: spec.process,
        ...(pos(volts) ? { volts } : {}),
        ...(pos(amps) ? { amps } : {}),
        ...(travelMmMin !== null ? { travelSpeedMmPerMin: travelMmMin } : {}),
        ...(used && used.method !== "voltage-current" ? { heatInputKJPerMm: basis === "iso-q" ? (used.heatInputKJPerMm ?? used.arcEnergyKJPerMm) : used.arcEnergyKJPerMm } : {}),
        ...(preheatC !== undefined ? { preheatC } : {}),
        ...(interpassC !== undefined ? { interpassC } : {}),
        position,
      })
    : null;
  const coldSpec = preheatC !== undefined && preheatC < spec.minPreheatC;
  const coldWps = preheatC !== undefined && !!check?.blocked;
  const flagged = check ? check.findings.filter((f) => !f.ok && f.field !== "preheat" && (f.value !== null || f.shown !== undefined)) : [];
  const refused = qualification !== undefined && !qualification.ok;
  const ready = used !== null && travelMmMin !== null && preheatC !== undefined && !coldSpec && !coldWps && filler.trim().length > 0 && !!wps && !refused;
  const negative = active === "preheat" || active === "interpass";
  const missing = [
    !pos(volts) && "volts",
    !pos(amps) && "amps",
    travel === "speed" && !pos(speedMmMin) && "travel speed",
    needBead && !pos(beadMm) && "bead length",
    needArc && !pos(arcTimeS) && "arc time",
    machine === "energy" && !pos(energyKJ) && "the machine's arc energy",
    machine === "power" && !pos(powerW) && "the machine's average power",
    preheatC === undefined && "measured preheat",
    filler.trim().length === 0 && "filler lot",
  ].filter((m): m is string => typeof m === "string");

  const setText = (f: Field, t: string) => setTexts((all) => ({ ...all, [f]: t }));

  const recordPass = async () => {
    if (!ready || !pos(volts) || !pos(amps) || preheatC === undefined) return;
    setBusy(true);
    setError(null);
    try {
      const typed = (t: string) => readPadNumber(t) ?? 0;
      const result = await apiJson<{ record: JobRecord }>(`/api/jobs/${jobId}/steps/${step.id}/passes`, {
        body: {
          clientKey: newKey(),
          volts,
          amps,
          ...(travel === "speed" ? { travelSpeed: { value: typed(texts.speed), unit: speedUnit === "in_min" ? "in/min" : "mm/min" } } : {}),
          ...(needBead ? { beadLength: { value: typed(texts.bead), unit: lengthUnit === "in" ? "in" : "mm" } } : {}),
          ...(needArc && arcTimeS !== undefined ? { arcTimeS } : {}),
          ...(machine === "energy" && energyKJ !== undefined ? { machineEnergyKJ: energyKJ } : {}),
          ...(machine === "power" && powerW !== undefined ? { machinePowerW: powerW } : {}),
          position,
          preheatC,
          ...(interpassC !== undefined ? { interpassC } : {}),
          fillerLot: filler.trim(),
        },
      });
      setRecord(result.record);
      // The next pass usually runs at the same settings: keep them, clear what is measured per pass.
      setTexts((t) => ({ ...t, arcTime: "", energy: "", power: "", preheat: "", interpass: "" }));
      setActive("interpass");
    } catch (e) {
      setError(e instanceof ApiError ? e.message : "The pass was not recorded; try again.");
    } finally {
      setBusy(false);
    }
  };

  const strike = async (passId: string) => {
    setError(null);
    try {
      setRecord(await apiJson<JobRecord>(`/api/jobs/${jobId}/steps/${step.id}/passes/${passId}`, { method: "DELETE" }));
    } catch (e) {
      setError(e instanceof ApiError ? e.message : "The pass was not struck out.");
    } finally {
      setStriking(null);
    }
  };

  const passActions = (p: PassView) => {
    if (p.removed || !jobOpen || !roundOpen || p.round !== joint.round) return null;
    const out: React.ReactNode[] = [];
    if (isLead && p.outOfRange && !p.override && coverageOf(p, joint) === "uncovered") {
      out.push(
        p.welder.id === me ? (
          <p key="own" className="text-sm font-semibold text-graphite-900">You welded this pass, so another lead decides on it.</p>
        ) : overriding?.id === p.id ? null : (
          <button key="ovr" type="button" className="btn btn-quiet min-h-12 border-graphite-950" onClick={() => { setOverriding(p); setOverrideReason(""); }} data-testid={`override-${p.passNumber}`}>
            ◆ Accept as welded
          </button>
        ),
      );
    }
    if (p.welder.id === me) {
      out.push(
        striking === p.id ? (
          <span key="strike" className="flex gap-2">
            <button type="button" className="btn btn-danger min-h-12" onClick={() => void strike(p.id)}>Confirm strike out</button>
            <button type="button" className="btn btn-quiet min-h-12" onClick={() => setStriking(null)}>Keep</button>
          </span>
        ) : (
          <button key="strike" type="button" className="btn btn-quiet min-h-12" onClick={() => setStriking(p.id)}>Strike out</button>
        ),
      );
    }
    const form =
      overriding?.id === p.id ? (
        <div className="mt-2 space-y-2 rounded-lg border-4 border-graphite-950 bg-graphite-50 p-3" data-testid="override-form">
          <p className="font-bold">Accept pass {p.passNumber} as welded</p>
          <p className="text-sm text-graphite-950">The pass stays outside {p.wps.reference} on the record; your reason and signature say why it is fit to stay.</p>
          <label htmlFor="override-reason" className="field-label">Reason</label>
          <textarea id="override-reason" className="field-input min-h-20 text-lg" value={overrideReason} maxLength={1000} onChange={(e) => setOverrideReason(e.target.value)} aria-invalid={overrideReason.trim().length > 0 && overrideReason.trim().length < 5 ? true : undefined} />
          <p className="field-error">{overrideReason.trim().length > 0 && overrideReason.trim().length < 5 ? "At least 5 characters." : ""}</p>
          <div className="grid grid-cols-2 gap-3">
            <button type="button" className="btn btn-quiet min-h-14 text-lg" onClick={() => setOverriding(null)}>Cancel</button>
            <button type="button" className="btn btn-primary min-h-14 text-lg" disabled={overrideReason.trim().length < 5} onClick={() => setOverridePin(true)} data-testid="override-sign">Sign acceptance</button>
          </div>
        </div>
      ) : null;
    if (!out.length && !form) return null;
    return (
      <>
        {out.length ? <div className="flex flex-wrap gap-2">{out}</div> : null}
        {form}
      </>
    );
  };

  return (
    <div className="space-y-4">
      <dl className="grid grid-cols-2 gap-2 rounded-lg border-2 border-graphite-700 bg-white p-3 sm:grid-cols-4" data-testid="joint-spec">
        {[
          ["Joint", `${spec.jointId} · ${spec.jointType}`],
          ["Size × length", `${show("length", spec.sizeMm, defaultPadUnit("length", viewer.unitSystem))} × ${show("length", spec.lengthMm, defaultPadUnit("length", viewer.unitSystem))}`],
          ["Position · process", `${spec.position} · ${spec.process}`],
          ["WPS · filler", `${spec.wpsRef} · ${spec.filler}`],
          ["Minimum preheat", show("temperature", spec.minPreheatC, tempUnit)],
        ].map(([k, v]) => (
          <div key={k}>
            <dt className="text-sm font-semibold text-graphite-800">{k}</dt>
            <dd className="figures font-semibold text-graphite-950">{v}</dd>
          </div>
        ))}
        <div>
          <dt className="text-sm font-semibold text-graphite-800">Joint state</dt>
          <dd><JointStatePill joint={joint} testId="joint-state" /></dd>
        </div>
      </dl>
      <RecordWeldMap record={record} highlight={spec.jointId} testId="runner-weld-map" title={`Where ${spec.jointId} is`} />
      {record.weldMap && jobOpen && (viewer.roles.includes("lead") || viewer.roles.includes("welder")) ? <RebaseWeldMap record={record} /> : null}
      <HotWorkNote />
      <WpsPanel wps={wps} spec={spec} tempUnit={tempUnit} speedUnit={speedUnit} />
      {qualification && roundOpen && jobOpen ? <QualificationBox qualification={qualification} /> : null}

      <section aria-labelledby="rounds-h" className="space-y-3">
        <h3 id="rounds-h" className="text-lg font-bold">
          Rounds of joint {spec.jointId} · passes in this round: <span className="figures" data-testid="pass-count">{current.length}</span>
        </h3>
        <ol className="space-y-4" data-testid="joint-rounds">
          {joint.rounds.map((r) => {
            const t = roundTone(r, joint);
            const passes = allPasses.filter((p) => p.round === r.round);
            return (
              <li key={r.round} className="rounded-xl border-2 border-graphite-300 bg-graphite-50 p-3" data-testid={`round-${r.round}`}>
                <div className="flex flex-wrap items-center justify-between gap-2">
                  <h4 className="text-lg font-bold">{roundName(r.round)}</h4>
                  <Pill tone={t.tone}>{t.word}</Pill>
                </div>
                {r.round > 1 ? <p className="text-sm text-graphite-900">Repair after the rejection of {roundName(r.round - 1).toLowerCase()}: grind out, bring back to preheat, weld, sign, and it is inspected again.</p> : null}
                {passes.length ? (
                  <ul className="mt-2 space-y-2">
                    {passes.map((p) => <PassCard key={p.id} pass={p} tempUnit={tempUnit} coverage={coverageOf(p, joint)} actions={passActions(p)} />)}
                  </ul>
                ) : <p className="mt-2 text-graphite-800">No passes yet.</p>}
                <div className="mt-2 space-y-2">
                  <PerformedLine so={r.performed} />
                  {r.inspection ? <InspectionResult inspection={r.inspection} photos={record.photos} /> : null}
                </div>
              </li>
            );
          })}
        </ol>
      </section>

      {mayRecord ? (
        <section aria-labelledby="newpass-h" className="rounded-lg border-2 border-graphite-700 bg-graphite-50 p-3" data-testid="new-pass">
          <h3 id="newpass-h" className="text-lg font-bold">Record pass {nextNumber}{joint.round > 1 ? ` (repair round ${joint.round})` : ""}</h3>
          <div className="mt-2 grid gap-4 md:grid-cols-[minmax(0,1fr)_18rem]">
            <div className="grid content-start gap-x-3 sm:grid-cols-2">
              <PadField id="pass-volts" label="Volts" text={texts.volts} unitSymbol="V" active={active === "volts"} onActivate={() => setActive("volts")} onText={(t) => setText("volts", t)} />
              <PadField id="pass-amps" label="Amps" text={texts.amps} unitSymbol="A" active={active === "amps"} onActivate={() => setActive("amps")} onText={(t) => setText("amps", t)} />

              <fieldset className="sm:col-span-2 mb-3">
                <legend className="mb-1 text-sm font-semibold text-graphite-900">Travel measured by</legend>
                <div role="radiogroup" aria-label="Travel measured by" className="grid grid-cols-2 gap-2">
                  {([["speed", "Travel speed"], ["bead", "Bead length and arc time"]] as const).map(([k, label]) => (
                    <button key={k} type="button" role="radio" aria-checked={travel === k} onClick={() => { setTravel(k); setActive(k === "speed" ? "speed" : "bead"); }} className={`min-h-12 rounded-md border-2 px-3 font-semibold ${travel === k ? "border-graphite-950 bg-graphite-900 text-white" : "border-graphite-400 bg-white text-graphite-950"}`} data-testid={`travel-${k}`}>
                      {travel === k ? <span aria-hidden="true">● </span> : <span aria-hidden="true">○ </span>}{label}
                    </button>
                  ))}
                </div>
              </fieldset>
              {travel === "speed" ? (
                <div className="sm:col-span-2 grid gap-x-3 sm:grid-cols-2">
                  <PadField id="pass-speed" label="Travel speed" text={texts.speed} unitSymbol={symbolOf("speed", speedUnit)} active={active === "speed"} onActivate={() => setActive("speed")} onText={(t) => setText("speed", t)} />
                  <div className="sm:pt-6"><UnitSwitch quantity="speed" unit={speedUnit} label="Travel speed" onUnit={setSpeedUnit} /></div>
                </div>
              ) : null}
              {needBead ? (
                <div>
                  <PadField id="pass-bead" label="Bead length" text={texts.bead} unitSymbol={symbolOf("length", lengthUnit)} active={active === "bead"} onActivate={() => setActive("bead")} onText={(t) => setText("bead", t)} />
                  <UnitSwitch quantity="length" unit={lengthUnit} label="Bead length" onUnit={setLengthUnit} />
                </div>
              ) : null}
              {needArc ? (
                <PadField id="pass-arc-time" label="Arc time" text={texts.arcTime} unitSymbol="s" active={active === "arcTime"} onActivate={() => setActive("arcTime")} onText={(t) => setText("arcTime", t)} />
              ) : null}

              <fieldset className="sm:col-span-2 mb-3 mt-2">
                <legend className="mb-1 text-sm font-semibold text-graphite-900">Reading from the welding machine (optional; pulsed or waveform-controlled sources, QW-409.1(c))</legend>
                <div role="radiogroup" aria-label="Reading from the welding machine" className="grid grid-cols-3 gap-2">
                  {([["none", "None"], ["energy", "Arc energy kJ"], ["power", "Average power W"]] as const).map(([k, label]) => (
                    <button key={k} type="button" role="radio" aria-checked={machine === k} onClick={() => { setMachine(k); if (k !== "none") setActive(k); }} className={`min-h-12 rounded-md border-2 px-3 font-semibold ${machine === k ? "border-graphite-950 bg-graphite-900 text-white" : "border-graphite-400 bg-white text-graphite-950"}`} data-testid={`machine-${k}`}>
                      {machine === k ? <span aria-hidden="true">● </span> : <span aria-hidden="true">○ </span>}{label}
                    </button>
                  ))}
                </div>
              </fieldset>
              {machine === "energy" ? <PadField id="pass-energy" label="Arc energy read (machine)" text={texts.energy} unitSymbol="kJ" active={active === "energy"} onActivate={() => setActive("energy")} onText={(t) => setText("energy", t)} /> : null}
              {machine === "power" ? <PadField id="pass-power" label="Average power read (machine)" text={texts.power} unitSymbol="W" active={active === "power"} onActivate={() => setActive("power")} onText={(t) => setText("power", t)} /> : null}
              {machine !== "none" ? <div className="hidden sm:block" /> : null}

              <div>
                <PadField id="pass-preheat" label="Preheat measured" text={texts.preheat} unitSymbol={symbolOf("temperature", tempUnit)} active={active === "preheat"} onActivate={() => setActive("preheat")} onText={(t) => setText("preheat", t)} invalid={coldSpec || coldWps ? "Below the minimum: see below" : null} />
                <UnitSwitch quantity="temperature" unit={tempUnit} label="Temperatures" onUnit={setTempUnit} />
              </div>
              <PadField id="pass-interpass" label="Interpass (optional on a first pass)" text={texts.interpass} unitSymbol={symbolOf("temperature", tempUnit)} active={active === "interpass"} onActivate={() => setActive("interpass")} onText={(t) => setText("interpass", t)} />

              <fieldset className="sm:col-span-2 mb-3 mt-2">
                <legend className="mb-1 text-sm font-semibold text-graphite-900">Position welded (the procedure says {spec.position})</legend>
                <div role="radiogroup" aria-label="Position welded" className="flex flex-wrap gap-2">
                  {positionChoices(spec, wps).map((p) => (
                    <button key={p} type="button" role="radio" aria-checked={position === p} onClick={() => setPosition(p)} className={`min-h-12 min-w-16 rounded-md border-2 px-3 font-semibold ${position === p ? "border-graphite-950 bg-graphite-900 text-white" : "border-graphite-400 bg-white text-graphite-950"}`} data-testid={`position-${p}`}>
                      {position === p ? <span aria-hidden="true">● </span> : null}{p}{wps && wps.positions.length && !wps.positions.includes(p) ? " (not in WPS)" : ""}
                    </button>
                  ))}
                </div>
              </fieldset>

              <div className="sm:col-span-2">
                <label htmlFor="pass-filler" className="mb-1 block text-sm font-semibold">Filler lot / heat no. ({spec.filler})</label>
                <input id="pass-filler" className="field-input min-h-14 text-lg" value={filler} maxLength={60} onChange={(e) => setFiller(e.target.value)} autoComplete="off" />
              </div>

              <div className="sm:col-span-2 mt-3 space-y-3">
                {used ? (
                  <div data-testid="heat-input">
                    <p className="text-lg font-bold">
                      Heat input <span className="figures">{(used.heatInputKJPerMm ?? used.arcEnergyKJPerMm).toFixed(2)} kJ/mm</span>{" "}
                      <span className="text-base font-semibold">(arc energy {used.arcEnergyKJPerMm.toFixed(2)} kJ/mm, <span className="figures">{Math.round(used.jPerIn).toLocaleString("en")}</span> J/in{used.efficiencyFactor !== null ? `, k = ${used.efficiencyFactor}` : ""}; {used.clause})</span>
                    </p>
                    {travel === "bead" && travelMmMin !== null ? <p className="text-sm text-graphite-900">Travel speed worked out: <span className="figures">{show("speed", travelMmMin, speedUnit)}</span></p> : null}
                    <div className="mt-1 flex items-center gap-3">
                      <div className="h-4 flex-1 overflow-hidden rounded border-2 border-graphite-700 bg-white" aria-hidden="true">
                        <div className={`h-full ${tint(used.heatInputKJPerMm ?? used.arcEnergyKJPerMm).colour}`} style={{ width: `${Math.min(100, ((used.heatInputKJPerMm ?? used.arcEnergyKJPerMm) / 4) * 100)}%` }} />
                      </div>
                      <Pill tone="info">{tint(used.heatInputKJPerMm ?? used.arcEnergyKJPerMm).word}</Pill>
                    </div>
                  </div>
                ) : (
                  <p className="text-graphite-800" data-testid="heat-input">
                    Heat input shows once {machine === "none" ? (travel === "speed" ? "volts, amps and travel speed" : "volts, amps, bead length and arc time") : machine === "energy" ? "the machine's arc energy and the bead length" : "the machine's average power, the bead length and the arc time"} are in.
                  </p>
                )}

                {coldSpec || coldWps ? (
                  <VerdictBox tone="fail" title="Preheat below the minimum: do not weld" testId="preheat-block">
                    {coldSpec ? <p>{show("temperature", preheatC!, tempUnit)} measured; joint {spec.jointId} needs at least {show("temperature", spec.minPreheatC, tempUnit)}.</p> : null}
                    {coldWps && check?.blockedReason ? <p>{check.blockedReason} ({wps!.reference} revision {wps!.number})</p> : null}
                    <p>Heat the joint and measure again before welding. A pass this cold is not recorded.</p>
                  </VerdictBox>
                ) : null}
                {wps && check ? (
                  flagged.length ? (
                    <VerdictBox tone="wait" title={`Will be flagged: outside ${wps.reference} revision ${wps.number}`} testId="wps-check">
                      <ul className="list-disc pl-5">{flagged.map((f) => <li key={f.field}>{f.message}</li>)}</ul>
                      <p className="mt-1">It can be recorded, but the round is not signed until a lead accepts the pass as welded or a nonconformance is dispositioned.</p>
                    </VerdictBox>
                  ) : check.ok ? (
                    <VerdictBox tone="pass" title={`Within ${wps.reference} revision ${wps.number}`} testId="wps-check" />
                  ) : (
                    <VerdictBox tone="idle" title={`Checked against ${wps.reference} revision ${wps.number} as you type`} testId="wps-check">
                      {missing.length ? `Still to enter: ${missing.join(", ")}.` : "Every value entered is within the WPS so far."}
                    </VerdictBox>
                  )
                ) : null}

                <p className="field-error min-h-6" aria-live="polite" data-testid="pass-error">{error ?? ""}</p>
                <button type="button" className="btn btn-primary min-h-14 w-full text-lg" disabled={!ready || busy} onClick={() => void recordPass()} data-testid="record-pass">
                  {busy ? "Recording…" : refused ? "Recording refused: qualification lapsed" : `Record pass ${nextNumber}`}
                </button>
                {!ready && !refused && missing.length ? <p className="text-sm text-graphite-900">To record: {missing.join(", ")}.</p> : null}
              </div>
            </div>
            <div className="md:sticky md:top-28 md:self-start">
              <NumberPad negative={negative} onKey={(k) => setTexts((all) => ({ ...all, [active]: applyKey(all[active], k, { negative }) }))} />
            </div>
          </div>
        </section>
      ) : null}

      {overriding && overridePin ? (
        <PinDialog
          title={`Accept pass ${overriding.passNumber} of ${spec.jointId} as welded`}
          signAs={{ name: viewer.name, role: "lead", meaning: "dispositioned" }}
          confirmLabel="Sign acceptance"
          onClose={() => setOverridePin(false)}
          onSign={async (pin) => {
            const result = await apiJson<{ record: JobRecord }>(`/api/jobs/${jobId}/steps/${step.id}/passes/${overriding.id}/override`, { body: { reason: overrideReason.trim(), pin } });
            setRecord(result.record);
            setOverridePin(false);
            setOverriding(null);
            setOverrideReason("");
          }}
        >
          <div className="mt-3 text-graphite-950">
            <p className="font-semibold">Outside {overriding.wps.reference}:</p>
            <ul className="list-disc pl-5">{failedMessages(overriding).map((m) => <li key={m}>{m}</li>)}</ul>
            <p className="mt-1"><strong>Reason:</strong> {overrideReason.trim()}</p>
          </div>
        </PinDialog>
      ) : null}
    </div>
  );
}

function positionChoices(spec: Weld, wps: WpsSummary | undefined): string[] {
  const usual = spec.jointType === "fillet" ? ["1F", "2F", "3F", "4F"] : ["1G", "2G", "3G", "4G", "5G", "6G"];
  const all = new Set([spec.position, ...(wps?.positions ?? []), ...usual]);
  return [...all].filter((p) => /^[1-6](F|G|GR)$/.test(p)).sort();
}
