// Fills the traveller from a job's record: the PDF prints exactly what the record says.
import { checkDewPoint, evaluateDftArea } from "@/lib/coating";
import { measureBounds, measureVerdict, torqueBounds, torqueVerdict } from "@/lib/jobs/tolerance";
import type { JobRecord, StepView } from "@/lib/jobs/record";
import type { GeometryCapture } from "@/lib/jobs/values";
import type { TravellerData } from "@/lib/pdf/traveller-data";
import type { Step } from "@/lib/procedures/schema";
import { formatQuantity, fromSI, preferredUnit, unitSymbol, type Quantity, type UnitSystem } from "@/lib/units";

type Extras = {
  shopName: string;
  versionHash: string;
  seal: { sha256: string; entries: number };
  verifyUrl: string;
  paper: "a4" | "letter";
  unitSystem: UnitSystem;
  photos: TravellerData["photos"];
  /** heat-input limits of the published WPS each weld step names (missing when none is published) */
  wpsLimits: Record<string, { heatInputMaxKJPerMm?: number; heatInputBasis?: "arc-energy" | "iso-q" }>;
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
  const step = record.steps.find((s) => s.kind === "geometry" && s.effectiveValue && (s.effectiveValue.before || s.effectiveValue.after));
  if (!step) return { before: null, after: null };
  const capture = (c: unknown) => {
    const g = c as GeometryCapture | undefined;
    if (!g?.input || !g.results) return null;
    return {
      lateralLink: g.input.trackBar,
      dragLink: { pitmanEnd: g.input.dragLink.pitmanEnd, knuckleEnd: g.input.dragLink.knuckleEnd },
      axleCenter: g.input.axleCenter,
      lateralLinkAngleDeg: g.results.trackBarAngleDeg,
      dragLinkAngleDeg: g.results.dragLinkAngleDeg,
      worstWheelSteerDeg: g.results.worstHeave.wheelSteerDeg,
      worstAtTravelMm: g.results.worstHeave.travel,
      travelText: `−${g.input.travel.droop} to +${g.input.travel.bump} mm`,
    };
  };
  return { before: capture(step.effectiveValue!.before), after: capture(step.effectiveValue!.after) };
}

function basisOf(x: Extras, ref: string) {
  return x.wpsLimits[ref]?.heatInputBasis ?? "arc-energy";
}

// Judged as the WPS states its limit: arc energy (ASME IX QW-409.1) unless it says ISO/TR 17671-1 Q.
function heatVerdict(x: Extras, ref: string, top: { heatInputKJPerMm: number; arcEnergyKJPerMm: number } | null): "within" | "over" | "na" {
  const max = x.wpsLimits[ref]?.heatInputMaxKJPerMm;
  if (max === undefined || !top) return "na";
  const value = basisOf(x, ref) === "iso-q" ? top.heatInputKJPerMm : top.arcEnergyKJPerMm;
  return value <= max + 1e-9 ? "within" : "over";
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
        ...(o.amendsSignOffId ? { amends: { signOffId: o.amendsSignOffId, reason: o.reason ?? "" } } : {}),
      })),
    });
    sections.set(s.sectionKey, section);
  }
  const welds = record.steps
    .filter((s) => s.kind === "weld")
    .map((s) => {
      const spec = s.spec as Extract<Step, { kind: "weld" }>;
      const passes = record.passes.filter((p) => p.stepId === s.id && !p.removed);
      const top = passes.reduce<(typeof passes)[number] | null>((a, p) => (!a || p.heatInputKJPerMm > a.heatInputKJPerMm ? p : a), null);
      const inspector = record.steps.find((h) => h.kind === "hold" && h.position > s.position && h.signed);
      return {
        jointId: spec.jointId,
        location: s.title,
        welderName: [...new Set(passes.map((p) => p.welder.name))].join(", ") || "—",
        wpsRef: spec.wpsRef,
        process: spec.process,
        filler: spec.filler,
        fillerLot: [...new Set(passes.map((p) => p.fillerLot))].join(", ") || "—",
        passes: passes.length,
        preheatC: passes.length ? Math.min(...passes.map((p) => p.preheatC)) : null,
        heatInputKJPerMm: (basisOf(x, spec.wpsRef) === "iso-q" ? top?.heatInputKJPerMm : top?.arcEnergyKJPerMm) ?? 0,
        ...(x.wpsLimits[spec.wpsRef]?.heatInputMaxKJPerMm !== undefined ? { heatInputMaxKJPerMm: x.wpsLimits[spec.wpsRef]!.heatInputMaxKJPerMm } : {}),
        heatInputVerdict: heatVerdict(x, spec.wpsRef, top),
        inspections: inspector
          ? inspector.signOffs.filter((o) => o.meaning === "inspected").map((o) => ({ result: "accept" as const, inspectorName: o.printedName, at: o.signedAt, note: `hold point ${inspector.key}` }))
          : [],
      };
    });
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
    materials: { parts: [], fillers: [...new Set(record.passes.filter((p) => !p.removed).map((p) => p.fillerLot))].map((lot) => ({ classification: welds.find((w) => w.fillerLot.includes(lot))?.filler ?? "", lot })) },
    photos: x.photos,
    paper: x.paper,
    timeZone: x.timeZone ?? "UTC",
  };
}
