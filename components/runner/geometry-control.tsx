"use client";
// A job's geometry step: the steering-link joints at ride height, measured the way the calculator's guide asks
// (height from the floor, distance from the centre line, which side) or as coordinates, in mm or inches with
// fractions. Stored as the same front-view input as ever (floor = z 0, centre line = y 0); results are computed
// as they are typed (lib/geometry) and recomputed by the server from that input when saving.
import { useEffect, useState } from "react";
import { FixList, Segmented, TextField } from "@/components/calc/fields";
import { EntryChoice, MeasureGuide, type LengthFieldRenderer } from "@/components/calc/measure-guide";
import {
  captureMeta,
  convertSteeringForm,
  emptySteeringForm,
  floorFromPoints,
  fromSteeringRequest,
  plausibility,
  POINT_KEYS,
  POINT_LABELS,
  sideSign,
  steeringFieldLabel,
  toSteeringRequest,
  type PointKey,
  type SteeringFormState,
} from "@/components/calc/steering-request";
import { symbolFor, type UnitSystem } from "@/components/calc/values";
import type { SteeringInput } from "@/lib/geometry";
import { geometryResults, requiredCaptures } from "@/lib/jobs/geometry";
import { show } from "@/lib/jobs/units";
import type { Step } from "@/lib/procedures/schema";
import type { GeometryCapture, GeometryValue } from "@/lib/jobs/values";
import { Pill, VerdictBox } from "./verdict";

type Geometry = Extract<Step, { kind: "geometry" }>;
type Which = "before" | "after";

// A job records heave at the fitted bracket every 5 mm; the step is not asked of the welder.
const STEP_MM = 5;
// Inputs, radio labels and buttons at least 48 px high for a gloved finger (the calculator's own are 44 px).
const LARGE = "[&_.field-input]:min-h-12 [&_fieldset_label]:min-h-12 [&_.btn]:min-h-12";

/** The form a stored capture was typed in: floor entries when it carries a drive, coordinates otherwise (older captures). */
function stateFrom(c: GeometryCapture | undefined, unitSystem: UnitSystem): SteeringFormState {
  if (!c) return { ...emptySteeringForm(unitSystem), travel: { bump: "", droop: "", step: String(STEP_MM) } };
  const s = fromSteeringRequest(c.input, c.unit === "in" ? "imperial" : "metric");
  return c.drive ? { ...s, entry: "floor", drive: c.drive, floor: floorFromPoints(s, c.drive) } : { ...s, entry: "coordinates", drive: "lhd" };
}

/** The stored input: what the form reads as, heave only, every 5 mm. Null while something is missing or wrong. */
function inputOf(state: SteeringFormState): { input: SteeringInput | null; errors: Record<string, string> } {
  const outcome = toSteeringRequest({ ...state, travel: { ...state.travel, step: `${STEP_MM} mm` } });
  if (!outcome.ok) return { input: null, errors: outcome.errors };
  const { travel, ...rest } = outcome.request;
  return { input: { ...rest, travel: { ...travel, step: STEP_MM } } as SteeringInput, errors: {} };
}

export function GeometryControl({ stepId, spec, value, readOnly, unitSystem, onChange }: { stepId: string; spec: Geometry; value: GeometryValue; readOnly: boolean; unitSystem: UnitSystem; onChange: (v: GeometryValue) => void }) {
  const captures = requiredCaptures(spec.capture);
  const [which, setWhich] = useState<Which>(captures.find((c) => !value[c]) ?? captures[0]!);
  return (
    <div className="space-y-3">
      {captures.length > 1 ? (
        <div role="tablist" aria-label="Capture" className="flex gap-2">
          {captures.map((c) => (
            <button key={c} type="button" role="tab" aria-selected={which === c} data-testid={`geometry-tab-${c}`} onClick={() => setWhich(c)} className={`min-h-12 rounded-md border-2 px-4 font-bold ${which === c ? "border-graphite-950 bg-graphite-900 text-white" : "border-graphite-500 bg-white"}`}>
              {c === "before" ? "Before" : "After"} {value[c] ? "● captured" : "○ to capture"}
            </button>
          ))}
        </div>
      ) : (
        <p className="font-bold">Capture: {which === "before" ? "before the work" : "after the work"}</p>
      )}
      <CaptureForm key={which} stepId={stepId} which={which} capture={value[which]} readOnly={readOnly} unitSystem={unitSystem} onCapture={(c) => onChange({ ...value, [which]: c })} other={which === "after" ? value.before : undefined} />
    </div>
  );
}

function CaptureForm({ stepId, which, capture, readOnly, unitSystem, onCapture, other }: { stepId: string; which: Which; capture: GeometryCapture | undefined; readOnly: boolean; unitSystem: UnitSystem; onCapture: (c: GeometryCapture | undefined) => void; other?: GeometryCapture | undefined }) {
  const storeKey = `gusset:geometry:${stepId}:${which}`;
  const [state, setState] = useState<SteeringFormState>(() => stateFrom(capture, unitSystem));
  const [touched, setTouched] = useState<ReadonlySet<string>>(() => new Set());
  // Half-typed points survive a reload on this tablet; only a complete capture goes to the server.
  useEffect(() => {
    if (capture || readOnly) return;
    try {
      const saved = JSON.parse(localStorage.getItem(storeKey) ?? "null") as SteeringFormState | null;
      // eslint-disable-next-line react-hooks/set-state-in-effect -- restoring a local draft once, after mount
      if (saved?.version === 1 && saved.travel) setState(saved);
    } catch {
      /* no local draft, or one from before the guide */
    }
  }, [capture, readOnly, storeKey]);

  const update = (next: SteeringFormState) => {
    setState(next);
    try {
      localStorage.setItem(storeKey, JSON.stringify(next));
    } catch {
      /* storage full or off: the server copy still follows once complete */
    }
    const { input } = inputOf(next);
    if (!input) return onCapture(undefined);
    try {
      onCapture({ input, ...captureMeta(next), results: geometryResults(input) });
    } catch {
      onCapture(undefined);
    }
  };

  const { input, errors } = inputOf(state);
  let results: GeometryCapture["results"] | null = null;
  let problem: string | null = null;
  if (input) {
    try {
      results = geometryResults(input);
    } catch (e) {
      problem = e instanceof Error ? e.message : "These points cannot be computed.";
    }
  }
  const warnings = input ? plausibility(input, state) : [];
  const floorMode = state.entry === "floor" && state.floor !== undefined;
  const lenUnit = symbolFor("length", state.units);
  const unitText = state.units === "imperial" ? "in" : "mm";

  if (readOnly) return <CaptureSummary state={state} results={results} unit={unitText} other={other} />;

  const errorFor = (key: string) => (touched.has(key) || textAt(state, key).trim() !== "" ? errors[key] : undefined);
  const lengthField: LengthFieldRenderer = (key, label, value, set, opts = {}) => (
    <TextField id={`geo-${key.replace(/\./g, "-")}`} testId={`st-${key.replace(/\./g, "-")}`} label={label} value={value} onChange={set} onBlur={() => setTouched((t) => new Set(t).add(key))} unit={lenUnit} error={errorFor(key)} hint={opts.hint} inputMode="text" />
  );
  const set = (patch: Partial<SteeringFormState>) => update({ ...state, ...patch });
  const fixList = Object.entries(errors)
    .filter(([key]) => errorFor(key))
    .map(([key, message]) => ({ id: `geo-${key.replace(/\./g, "-")}`, label: steeringFieldLabel(key), message }));

  return (
    <div className={`grid gap-4 lg:grid-cols-[minmax(0,1fr)_minmax(0,1fr)] ${LARGE}`} data-testid="geometry-capture">
      <div className="min-w-0 space-y-3">
        <div className="card flex flex-wrap items-end gap-3 p-4">
          <EntryChoice state={state} onState={update} />
          <Segmented legend="Units" testId="steer-units" value={state.units} onChange={(u) => update(convertSteeringForm(state, u))} options={[{ value: "metric", label: "mm" }, { value: "imperial", label: "in" }]} />
        </div>
        {floorMode && state.floor ? (
          <MeasureGuide floor={state.floor} state={state} onState={update} lengthField={lengthField} />
        ) : (
          <fieldset className="card space-y-2 p-4">
            <legend className="px-1 text-lg font-bold">Joints, front view at ride height</legend>
            <p className="text-sm text-graphite-700">From one datum on the frame: y across the vehicle (+ to the right seen from ahead), z up.</p>
            {POINT_KEYS.map((k) => (
              <div key={k} className="grid grid-cols-2 gap-x-3" role="group" aria-label={POINT_LABELS[k]}>
                <p className="col-span-2 text-sm font-bold">{POINT_LABELS[k]}</p>
                {lengthField(`${k}.y`, "y", state[k].y, (v) => set({ [k]: { ...state[k], y: v } }))}
                {lengthField(`${k}.z`, "z", state[k].z, (v) => set({ [k]: { ...state[k], z: v } }))}
              </div>
            ))}
          </fieldset>
        )}
      </div>
      <div className="min-w-0 space-y-3">
        <fieldset className="card space-y-2 p-4">
          <legend className="px-1 text-lg font-bold">Steering arm and travel</legend>
          <div className="grid grid-cols-2 gap-x-3">
            {lengthField("steeringArmLength", "Steering arm length", state.steeringArmLength, (v) => set({ steeringArmLength: v }), { hint: "ball to steering axis" })}
            <TextField id="geo-steeringRatio" testId="st-steeringRatio" label="Steering ratio (optional)" value={state.steeringRatio} onChange={(v) => set({ steeringRatio: v })} unit=": 1" error={errorFor("steeringRatio")} inputMode="decimal" />
            {lengthField("travel.bump", "Bump travel", state.travel.bump, (v) => set({ travel: { ...state.travel, bump: v } }))}
            {lengthField("travel.droop", "Droop travel", state.travel.droop, (v) => set({ travel: { ...state.travel, droop: v } }))}
          </div>
        </fieldset>
        {fixList.length ? <FixList items={fixList} testId="geometry-fix-list" /> : null}
        {warnings.length ? (
          <div className="rounded-md border-2 border-graphite-900 bg-verdict-warnbg p-3" data-testid="geometry-plausibility">
            <p className="font-bold"><span aria-hidden="true">▲ </span>Check these readings</p>
            <ul className="ml-5 list-disc text-sm">{warnings.map((w) => <li key={w}>{w}</li>)}</ul>
          </div>
        ) : null}
        <Results results={results} problem={problem} unit={unitText} other={other} />
      </div>
    </div>
  );
}

function textAt(state: SteeringFormState, key: string): string {
  const v = key.split(".").reduce<unknown>((o, k) => (o && typeof o === "object" ? (o as Record<string, unknown>)[k] : undefined), state);
  return typeof v === "string" ? v : "";
}

function Results({ results, problem, unit, other }: { results: GeometryCapture["results"] | null; problem: string | null; unit: string; other?: GeometryCapture | undefined }) {
  if (problem) return <VerdictBox tone="fail" title="These points cannot be computed" testId="geometry-results">{problem}</VerdictBox>;
  if (!results) return <VerdictBox tone="idle" title="Measure every joint, the arm length and the travel" testId="geometry-results" />;
  const better = other?.results ? Math.abs(results.worstHeave.wheelSteerDeg) <= Math.abs(other.results.worstHeave.wheelSteerDeg) : null;
  // No acceptance limit is set by the step, so the result is information, not a verdict.
  return (
    <VerdictBox tone="info" title={`Worst bump steer ${results.worstHeave.wheelSteerDeg.toFixed(2)}° at ${show("length", results.worstHeave.travel, unit)}`} testId="geometry-results">
      Lateral link {results.trackBarAngleDeg.toFixed(2)}°, drag link {results.dragLinkAngleDeg.toFixed(2)}°, difference {results.angleDifferenceDeg.toFixed(2)}°.
      {results.steeringWheelDeg !== null ? ` Steering wheel ${results.steeringWheelDeg.toFixed(1)}°.` : ""}
      {other?.results ? (
        <span className="mt-1 block">
          Before: worst {other.results.worstHeave.wheelSteerDeg.toFixed(2)}°, difference {other.results.angleDifferenceDeg.toFixed(2)}°{" "}
          <Pill tone={better ? "pass" : "fail"}>{better ? "better or equal" : "worse than before"}</Pill>
        </span>
      ) : null}
    </VerdictBox>
  );
}

/** A signed capture: the joints as they were entered, and the results. */
function CaptureSummary({ state, results, unit, other }: { state: SteeringFormState; results: GeometryCapture["results"] | null; unit: string; other?: GeometryCapture | undefined }) {
  const floor = state.entry === "floor" ? state.floor : undefined;
  const sideOf = (k: PointKey) => (floor ? (floor[k].distance.trim() === "0" ? "on the centre line" : floor[k].side === "driver" ? "driver's side" : "passenger side") : "");
  return (
    <div className="space-y-3">
      <table className="w-full text-left text-sm" data-testid="geometry-summary">
        <thead className="bg-graphite-100">
          <tr>
            <th scope="col" className="px-2 py-1">Joint</th>
            <th scope="col" className="px-2 py-1 text-right">{floor ? "Up from the floor" : "y"}, {unit}</th>
            <th scope="col" className="px-2 py-1 text-right">{floor ? "From the centre line" : "z"}, {unit}</th>
          </tr>
        </thead>
        <tbody className="figures">
          {POINT_KEYS.map((k) => (
            <tr key={k} className="border-t border-graphite-200">
              <th scope="row" className="px-2 py-1 font-sans font-semibold">{POINT_LABELS[k]}</th>
              <td className="px-2 py-1 text-right">{floor ? floor[k].height : state[k].y}</td>
              <td className="px-2 py-1 text-right">{floor ? `${floor[k].distance} ${sideOf(k)}` : state[k].z}</td>
            </tr>
          ))}
        </tbody>
      </table>
      {floor ? <p className="text-sm text-graphite-700">{state.drive === "rhd" ? "Right-hand drive" : "Left-hand drive"}; driver&apos;s side at {sideSign("driver", state.drive ?? "lhd") > 0 ? "+" : "−"}y.</p> : null}
      <Results results={results} problem={null} unit={unit} other={other} />
    </div>
  );
}
