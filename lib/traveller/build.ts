// Fills the traveller from a job's record: the PDF prints exactly what the record says.
import { checkDewPoint, evaluateDftArea } from "@/lib/coating";
import { measureBounds, measureVerdict, torqueBounds, torqueVerdict } from "@/lib/jobs/tolerance";
import type { InspectionView, JobRecord, PassView, StepView } from "@/lib/jobs/record";
import { roadTestNote } from "@/lib/jobs/geometry";
import type { GeometryCapture } from "@/lib/jobs/values";
import type { TravellerData, TravellerWeldPassInput } from "@/lib/pdf/traveller-data";
import type { Step } from "@/lib/procedures/schema";
import { visualCriteriaLabel } from "@/lib/welding";
import { itemLabel } from "./labels";
import { formatQuantity, fromSI, preferredUnit, unitSymbol, type Quantity, type UnitSystem } from "@/lib/units";

type Extras = {
  shopName: string;
  versionHash: string;
  seal: { sha256: string; entries: number };
  verifyUrl: string;
  paper: "a4" | "letter";
  unitSystem: UnitSystem;
  photos: TravellerData["photos"];
  /** the bytes (JPEG) of each weld-map image, by the map's image id */
  weldMapImages?: ReadonlyMap<string, Buffer>;
  /**
   * heat-input limits of the published WPS each weld step names (missing when none is published); only for
   * passes recorded without WPS findings and whose revision the record does not carry
   */
  timeZone?: string;
};

const num = (v: unknown) => (typeof v === "number" && Number.isFinite(v) ? v : null);

function boundsText(q: Quantity, low: number | null, high: number | null, system: UnitSystem) {
  const f = (v: number) => formatQuantity(q, v, system);
  if (low !== null && high !== null) return `${f(low)} to ${f(high)}`;
  if (low !== null) return `at least ${f(low)}`;
  if (high !== null) return `at most ${f(high)}`;
  return "";
}

function measurementsOf(step: StepView, system: UnitSystem): TravellerData["sections"][number]["steps"][number]["measurements"] {
  const spec = step.spec as Step;
  const v = step.effectiveValue ?? {};
  if (spec.kind === "measure") {
    const reading = num(v.reading);
    if (reading === null) return [];
    const q = spec.quantity as Quantity;
    const unit = preferredUnit(q, system);
    const b = measureBounds(spec);
    const verdict = measureVerdict(spec, reading);
    return [{ value: fromSI(q, reading, unit as never), unit: unitSymbol(q, unit as never), toleranceText: boundsText(q, b.low, b.high, system), verdict: verdict.ok ? "pass" : "fail" }];
  }
  if (spec.kind === "torque") {
    const nm = num(v.achievedNm);
    if (nm === null) return [];
    const unit = preferredUnit("torque", system);
    const b = torqueBounds(spec);
    return [{ label: spec.fastener, value: fromSI("torque", nm, unit), unit: unitSymbol("torque", unit), toleranceText: boundsText("torque", b.low, b.high, system), verdict: torqueVerdict(spec, nm).ok ? "pass" : "fail" }];
  }
  if (spec.kind === "coating") {
    const out: TravellerData["sections"][number]["steps"][number]["measurements"] = [];
    const air = num(v.airTempC), rh = num(v.relativeHumidity), surface = num(v.surfaceTempC);
    if (air !== null && rh !== null && surface !== null) {
      const c = checkDewPoint({ airTempC: air, relativeHumidity: rh, surfaceTempC: surface, requiredMarginC: spec.dewPointMarginC });
      // A margin is a temperature difference: 1 °C of margin is 1.8 °F.
      const imperial = system === "imperial";
      out.push({
        label: "Surface above dew point",
        value: imperial ? c.marginC * 1.8 : c.marginC,
        unit: imperial ? "°F" : "°C",
        decimals: 1,
        toleranceText: imperial ? `at least ${(spec.dewPointMarginC * 1.8).toFixed(1)} °F` : `at least ${spec.dewPointMarginC} °C`,
        verdict: c.ok ? "pass" : "fail",
      });
    }
    const spots = Array.isArray(v.dftSpots) ? (v.dftSpots as number[][]).filter((s) => s.length >= 3) : [];
    if (spots.length) {
      const d = evaluateDftArea({ specMin: spec.dftMinUm, specMax: spec.dftMaxUm }, spots);
      out.push({ label: "DFT area average", value: d.areaAverage, unit: "µm", decimals: 0, toleranceText: `${spec.dftMinUm} to ${spec.dftMaxUm} µm (SSPC-PA 2)`, verdict: d.ok ? "pass" : "fail" });
    }
    return out;
  }
  return [];
}

function resultTextOf(step: StepView): string {
  const spec = step.spec as Step;
  const v = step.effectiveValue ?? {};
  const note = typeof v.note === "string" && v.note ? ` Note: ${v.note}` : "";
  switch (spec.kind) {
    case "check":
      return (v.confirmed ? "Confirmed." : step.signed ? "Signed." : "") + note;
    case "caution":
      return `Acknowledged: ${Array.isArray(v.acknowledged) ? (v.acknowledged as string[]).join(", ") : "—"}.${note}`;
    case "hold":
      return `${spec.inspection}${note}`;
    case "weld":
      return `${spec.jointId} ${spec.jointType} ${spec.sizeMm} mm × ${spec.lengthMm} mm, ${spec.position}, ${spec.process}, WPS ${spec.wpsRef}, ${spec.filler}.${note}`;
    default:
      return note.trim();
  }
}

function geometryOf(record: JobRecord): TravellerData["geometry"] {
  // Procedures capture "before" and "after" in separate steps (or both in one): the before is the first step
  // that holds one, the after the last, so a re-check later in the job is the one printed.
  const steps = [...record.steps].sort((a, b) => a.position - b.position).filter((s) => s.kind === "geometry" && s.effectiveValue);
  const valid = (c: unknown): GeometryCapture | null => {
    const g = c as GeometryCapture | undefined;
    return g?.input && g.results ? g : null;
  };
  const rawBefore = steps.map((s) => valid(s.effectiveValue!.before)).find((c) => c !== null) ?? null;
  const rawAfter = [...steps].reverse().map((s) => valid(s.effectiveValue!.after)).find((c) => c !== null) ?? null;
  if (!rawBefore && !rawAfter) return { before: null, after: null };
  const capture = (g: GeometryCapture | null) => {
    if (!g) return null;
    return {
      lateralLink: g.input.trackBar,
      dragLink: { pitmanEnd: g.input.dragLink.pitmanEnd, knuckleEnd: g.input.dragLink.knuckleEnd },
      axleCenter: g.input.axleCenter,
      lateralLinkAngleDeg: g.results.trackBarAngleDeg,
      dragLinkAngleDeg: g.results.dragLinkAngleDeg,
      worstWheelSteerDeg: g.results.worstHeave.wheelSteerDeg,
      worstAtTravelMm: g.results.worstHeave.travel,
      travelText: `−${g.input.travel.droop} to +${g.input.travel.bump} mm`,
      ...(g.input.steeringRatio !== undefined ? { steeringRatio: g.input.steeringRatio } : {}),
      curve: g.results.curve.slice(0, 401),
    };
  };
  const notes = steps.map((s) => (typeof s.effectiveValue!.note === "string" ? s.effectiveValue!.note.trim() : "")).filter(Boolean);
  const note = [roadTestNote(rawBefore, rawAfter), ...notes.map((n) => `Note: ${n}`)].filter(Boolean).join(" ").slice(0, 1500);
  return { before: capture(rawBefore), after: capture(rawAfter), ...(note ? { roadTestNote: note } : {}) };
}

type WeldRow = NonNullable<TravellerData["welds"]>[number];
type WeldPass = TravellerWeldPassInput;

/** The heat-input limit of the WPS a pass was welded to: its own revision when the record has it, else the published one. */
function limitOf(record: JobRecord, p: PassView): { max?: number; basis: "arc-energy" | "iso-q" } {
  const w = record.wps.find((r) => r.revisionId === p.wps.revisionId) ?? wpsNamed(record, p.wps.reference);
  return { max: w?.ranges.heatInputMaxKJPerMm, basis: w?.ranges.heatInputBasis ?? "arc-energy" };
}

const wpsNamed = (record: JobRecord, reference: string) => record.wps.find((r) => r.reference.toUpperCase() === reference.trim().toUpperCase());

// A pass judged as its WPS revision judged it when it was recorded (the findings the server stored), so the
// print agrees with the runner. Passes recorded before findings were kept are judged against the WPS as the
// record holds it: arc energy (ASME IX QW-409.1) unless the WPS states ISO/TR 17671-1 Q.
function passOf(record: JobRecord, x: Extras, p: PassView): WeldPass {
  const finding = p.findings.find((f) => f.field === "heatInput");
  const others = p.findings.filter((f) => !f.ok && f.field !== "heatInput").map((f) => f.message.slice(0, 300));
  let value: number;
  let max: number | undefined;
  let verdict: WeldPass["heatInputVerdict"];
  if (finding && finding.value !== null) {
    value = finding.value;
    max = finding.max;
    verdict = finding.ok ? "within" : "over";
  } else if (finding || p.findings.length) {
    // Checked against its WPS, which set no heat-input limit (or the value could not be worked out).
    const l = limitOf(record, p);
    value = l.basis === "iso-q" ? p.heatInputKJPerMm : p.arcEnergyKJPerMm;
    max = finding?.max;
    verdict = "na";
    if (finding) others.unshift(finding.message.slice(0, 300));
  } else {
    const l = limitOf(record, p);
    value = l.basis === "iso-q" ? p.heatInputKJPerMm : p.arcEnergyKJPerMm;
    max = l.max;
    verdict = max === undefined ? "na" : value <= max + 1e-9 ? "within" : "over";
  }
  return {
    passNumber: p.passNumber,
    welderName: p.welder.name,
    wpsRef: p.wps.reference || "\u2014",
    wpsRevision: p.wps.number,
    heatInputKJPerMm: value,
    ...(max === undefined ? {} : { heatInputMaxKJPerMm: max }),
    heatInputVerdict: verdict,
    outOfRange: others,
    ...(p.override ? { override: { reason: p.override.reason.slice(0, 1000), by: p.override.by.name, at: p.override.at } } : {}),
    struckOut: p.removed,
  };
}

function inspectionOf(i: InspectionView) {
  return {
    round: i.round,
    result: i.decision === "accepted" ? ("accept" as const) : ("reject" as const),
    inspectorName: i.inspector.name,
    at: i.inspectedAt,
    criteria: visualCriteriaLabel(i.criteria),
    rejected: i.items.filter((it) => !it.ok).map((it) => ({ item: itemLabel(it.item), measured: it.measured.slice(0, 300), limit: it.limit.slice(0, 300) })),
    note: i.notes.slice(0, 1000),
  };
}

function weldOf(record: JobRecord, x: Extras, s: StepView): WeldRow {
  const spec = s.spec as Extract<Step, { kind: "weld" }>;
  const rounds = (s.joint?.rounds ?? []).map((r) => ({ round: r.round, passes: r.passes.map((p) => passOf(record, x, p)), inspection: r.inspection ? inspectionOf(r.inspection) : null }));
  const live = record.passes.filter((p) => p.stepId === s.id && !p.removed);
  const judged = rounds.flatMap((r) => r.passes).filter((p) => !p.struckOut);
  const top = judged.reduce<WeldPass | null>((a, p) => (!a || p.heatInputKJPerMm > a.heatInputKJPerMm ? p : a), null);
  const verdict = judged.some((p) => p.heatInputVerdict === "over") ? "over" : judged.some((p) => p.heatInputVerdict === "within") ? "within" : "na";
  const max = judged.map((p) => p.heatInputMaxKJPerMm).find((m) => m !== undefined) ?? wpsNamed(record, spec.wpsRef)?.ranges.heatInputMaxKJPerMm;
  return {
    jointId: spec.jointId,
    location: s.title,
    ...(s.joint ? { state: s.joint.state } : {}),
    welderName: [...new Set(live.map((p) => p.welder.name))].join(", ") || "\u2014",
    wpsRef: spec.wpsRef,
    process: spec.process,
    filler: spec.filler,
    fillerLot: [...new Set(live.map((p) => p.fillerLot))].join(", ") || "\u2014",
    passes: live.length,
    preheatC: live.length ? Math.min(...live.map((p) => p.preheatC)) : null,
    heatInputKJPerMm: top?.heatInputKJPerMm ?? 0,
    ...(max === undefined ? {} : { heatInputMaxKJPerMm: max }),
    heatInputVerdict: verdict,
    rounds,
  };
}

/** Material entries as they stand: each corrected entry replaced by its correction; withdrawn ones printed as withdrawn. */
function materialsOf(record: JobRecord): NonNullable<TravellerData["materials"]> {
  const entries = record.materials
    .filter((m) => !m.superseded)
    .map((m) => ({
      kind: m.kind,
      description: m.description,
      specification: m.specification,
      heatNumber: m.heatNumber,
      certificate: m.certificate,
      withdrawn: m.withdrawn,
      corrects: m.correctsId !== null,
      reason: (m.reason ?? "").slice(0, 1000),
      recordedBy: m.recordedBy.name,
      recordedAt: m.recordedAt,
    }));
  const lots = new Map<string, { classification: string; lot: string; joints: string[] }>();
  const order = new Map(record.steps.map((s) => [s.id, s.position]));
  const passes = [...record.passes].sort((a, b) => (order.get(a.stepId) ?? 0) - (order.get(b.stepId) ?? 0) || a.round - b.round || a.passNumber - b.passNumber);
  for (const p of passes) {
    if (p.removed) continue;
    const step = record.steps.find((s) => s.id === p.stepId);
    const spec = step?.spec.kind === "weld" ? step.spec : null;
    const key = `${p.fillerClassification}\u0000${p.fillerLot}`;
    const entry = lots.get(key) ?? { classification: p.fillerClassification || spec?.filler || "", lot: p.fillerLot, joints: [] };
    if (spec && !entry.joints.includes(spec.jointId)) entry.joints.push(spec.jointId);
    lots.set(key, entry);
  }
  return { entries, fillers: [...lots.values()] };
}

export function buildTravellerData(record: JobRecord, x: Extras): TravellerData {
  const j = record.job;
  const sections = new Map<string, { key: string; title: string; steps: TravellerData["sections"][number]["steps"] }>();
  for (const s of [...record.steps].sort((a, b) => a.position - b.position)) {
    const section = sections.get(s.sectionKey) ?? { key: s.sectionKey, title: s.sectionTitle, steps: [] };
    section.steps.push({
      key: s.key,
      title: s.title,
      kind: s.kind,
      resultText: resultTextOf(s).slice(0, 4000),
      measurements: measurementsOf(s, x.unitSystem),
      signOffs: s.signOffs.map((o) => ({
        id: o.id,
        printedName: o.printedName,
        role: o.role,
        meaning: o.meaning,
        signedAt: o.signedAt,
        ...(s.kind === "weld" && o.round !== null ? { round: o.round } : {}),
        ...(o.amendsSignOffId ? { amends: { signOffId: o.amendsSignOffId, reason: o.reason ?? "" } } : {}),
      })),
    });
    sections.set(s.sectionKey, section);
  }
  const welds = [...record.steps].sort((a, b) => a.position - b.position).filter((s) => s.kind === "weld").map((s) => weldOf(record, x, s));
  return {
    shopName: x.shopName,
    jobNumber: j.number,
    state: j.status,
    released: j.status === "released",
    customerName: j.customerName,
    vehicle: { year: j.vehicleYear, makeModel: j.vehicleMakeModel, vin: j.vin, vinCheckDigitWarning: j.vinWarning !== null },
    axle: { description: j.axleDescription, idTag: j.axleTag },
    procedure: { title: j.procedureTitle, version: j.procedureVersionNumber, contentHash: x.versionHash },
    dates: { created: j.createdAt, due: j.dueDate, released: j.releasedAt },
    ...(record.releaseSignOff ? { release: { printedName: record.releaseSignOff.printedName, role: record.releaseSignOff.role, signedAt: record.releaseSignOff.signedAt } } : {}),
    seal: x.seal,
    verifyUrl: x.verifyUrl,
    sections: [...sections.values()],
    geometry: geometryOf(record),
    welds,
    nonconformances: record.nonconformances.map((n) => ({
      number: n.number,
      stepKey: n.stepKey,
      description: n.description,
      raisedBy: n.raisedBy.name,
      raisedAt: n.raisedAt,
      disposition: n.disposition?.disposition ?? null,
      dispositionNotes: n.disposition?.notes ?? "",
      ...(n.disposition ? { dispositionedBy: n.disposition.decidedBy.name, dispositionedAt: n.disposition.decidedAt } : {}),
    })),
    materials: materialsOf(record),
    photos: x.photos,
    weldMap: weldMapOf(record, x.weldMapImages),
    paper: x.paper,
    timeZone: x.timeZone ?? "UTC",
  };
}

/** The job's map for print: images whose bytes were found, and every joint's marker with where the joint stands. */
function weldMapOf(record: JobRecord, images: ReadonlyMap<string, Buffer> | undefined): NonNullable<TravellerData["weldMap"]> | null {
  const map = record.weldMap;
  if (!map || !images) return null;
  const shown = map.images.filter((i) => images.has(i.id));
  if (!shown.length) return null;
  const stateOf = new Map(record.steps.flatMap((s) => (s.spec.kind === "weld" ? [[s.spec.jointId, s.joint?.state ?? "welding"] as const] : [])));
  return {
    images: shown.map((i) => ({ id: i.id, image: images.get(i.id)!, width: i.width, height: i.height, sha256: i.sha256, label: i.photoId ? "Photo of this axle" : "" })),
    joints: map.joints.filter((j) => shown.some((i) => i.id === j.imageId)).map((j) => ({ ...j, state: stateOf.get(j.jointId) ?? "planned" })),
  };
}
