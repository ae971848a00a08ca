"use client";
import { useDeferredValue, useMemo, useState } from "react";
import { Checkbox, FixList, Segmented, TextField } from "@/components/calc/fields";
import { Figure } from "@/components/calc/figure";
import { EntryChoice, MeasureGuide } from "@/components/calc/measure-guide";
import {
  convertSteeringForm,
  plausibility,
  emptySteeringForm,
  exampleSteeringForm,
  POINT_LABELS,
  steeringFieldLabel,
  toSteeringRequest,
  type PointKey,
  type SteeringFormState,
  withEntry,
} from "@/components/calc/steering-request";
import type { SteeringRequest } from "@/lib/calc/steering-request";
import { figure, shown, symbolFor, type UnitSystem } from "@/components/calc/values";
import { StatusBadge } from "@/components/status-badge";
import { computeSteeringGeometry, isGeometryError, toeAtRim, type OptimumResult, type SteeringInput, type SteeringResult } from "@/lib/geometry";
import { fromSI, preferredUnit } from "@/lib/units";
import { HoleTable } from "./hole-table";
import { nearestIndex, poseAt, type SweepMode } from "./pose";
import { SteerCharts } from "./steer-charts";
import { SteeringDiagram } from "./steering-diagram";

type Computed =
  | { kind: "invalid"; errors: Record<string, string> }
  | { kind: "impossible"; message: string; reason: string }
  | { kind: "ok"; input: SteeringInput; result: SteeringResult };

// The steering calculator computes in the browser with lib/geometry (pure), from the very request
// toSteeringRequest builds for POST /api/calc/steering: the screen and the API cannot disagree.
function compute(state: SteeringFormState): Computed {
  const outcome = toSteeringRequest(state);
  if (!outcome.ok) return { kind: "invalid", errors: outcome.errors };
  const input = outcome.request as SteeringInput;
  try {
    return { kind: "ok", input, result: computeSteeringGeometry(input) };
  } catch (error) {
    if (isGeometryError(error)) return { kind: "impossible", message: error.message, reason: error.reason };
    throw error;
  }
}

const fieldId = (key: string) => `st-${key.replace(/\./g, "-")}`;

function getText(state: SteeringFormState, key: string): unknown {
  return key.split(".").reduce<unknown>((o, k) => (o && typeof o === "object" ? (o as Record<string, unknown>)[k] : undefined), state);
}

const L = { metric: 1, imperial: 3 } as const;
const E = { metric: 2, imperial: 3 } as const;

let holeSeq = 100;

/** The best height on the hole line, how much better it is than the joint as fitted, and the other end's best. */
function OptimumCard({ optimum, other, units, ratio, rim }: { optimum: OptimumResult; other: OptimumResult; units: UnitSystem; ratio: number | undefined; rim: number | undefined }) {
  const gain = optimum.currentWorstWheelSteerDeg - optimum.worstWheelSteerDeg;
  const at = (v: number) => [
    ratio !== undefined ? `${figure(v * ratio, 1)}° at the steering wheel` : null,
    rim !== undefined ? `${shown("length", toeAtRim(v, rim), units, { metric: 1, imperial: 3 })} toe at the rim` : null,
  ].filter(Boolean).join(", ");
  const endName = (o: OptimumResult) => (o.end === "axle" ? "axle-end" : "frame-end");
  return (
    <div className="card space-y-2 border-graphite-900 p-4" data-testid="optimum-card">
      <p className="flex flex-wrap items-center gap-2">
        <StatusBadge tone="info">drill here</StatusBadge>
        <span className="font-bold">
          New {endName(optimum)} hole at height <span className="figures" data-testid="optimum-card-z">{shown("length", optimum.z, units, L)}</span>
        </span>
      </p>
      <p className="text-sm text-graphite-950">
        On the vertical through the {endName(optimum)} joint as fitted (<span className="figures">y {shown("length", optimum.y, units, L)}</span>), with the bar set to <span className="figures">{shown("length", optimum.barLength, units, L)}</span>:
        largest wheel steer over the heave and roll points <strong className="figures" data-testid="optimum-steer">{figure(optimum.worstWheelSteerDeg, 2)}°</strong>
        {at(optimum.worstWheelSteerDeg) ? <> ({at(optimum.worstWheelSteerDeg)})</> : null}, against <span className="figures">{figure(optimum.currentWorstWheelSteerDeg, 2)}°</span> as fitted
        {gain > 0.005 ? <>: <strong className="figures">{figure(gain, 2)}°</strong> less.</> : ": the joint is already at its best height."}
      </p>
      <p className="text-sm text-graphite-700">
        Or move the {endName(other)} instead: height <span className="figures" data-testid="optimum-other-z">{shown("length", other.z, units, L)}</span> gives <span className="figures">{figure(other.worstWheelSteerDeg, 2)}°</span>.
        The link reaches over the whole sweep from <span className="figures">{shown("length", optimum.feasibleZ.min, units, L)}</span> to <span className="figures">{shown("length", optimum.feasibleZ.max, units, L)}</span> on this line; outside that it cannot be fitted.
      </p>
    </div>
  );
}

/**
 * `initial` and `onStateChange` are for a job's geometry step (before/after), to be wired later: the state is
 * plain JSON, and toSteeringRequest(state) gives the body of POST /api/calc/steering.
 */
export function SteeringCalculator({
  initialUnits,
  initial,
  onStateChange,
}: {
  initialUnits: UnitSystem;
  initial?: SteeringFormState;
  onStateChange?: (state: SteeringFormState) => void;
}) {
  const [state, setStateRaw] = useState<SteeringFormState>(() => initial ?? exampleSteeringForm(initialUnits));
  const setState = (next: SteeringFormState) => {
    setStateRaw(next);
    onStateChange?.(next);
  };
  const [touched, setTouched] = useState<ReadonlySet<string>>(() => new Set());
  const [mode, setMode] = useState<SweepMode>("heave");
  const [travelAt, setTravelAt] = useState(0);
  const [rollAt, setRollAt] = useState(0);
  const deferred = useDeferredValue(state);
  const computed = useMemo(() => compute(deferred), [deferred]);
  const units = state.units;
  const lenUnit = symbolFor("length", units);
  const errors = computed.kind === "invalid" ? computed.errors : {};
  const floorMode = state.entry === "floor" && state.floor !== undefined;

  // An empty field says so once it has been visited; anything typed and wrong says so at once.
  const errorFor = (key: string): string | undefined => {
    const message = errors[key];
    if (!message) return undefined;
    const text = getText(state, key);
    return touched.has(key) || (typeof text === "string" && text.trim() !== "") || typeof text !== "string" ? message : undefined;
  };
  const touch = (key: string) => setTouched((t) => (t.has(key) ? t : new Set(t).add(key)));
  // One change per event, computed from the state on screen, so the caller sees exactly what is shown.
  const update = (fn: (s: SteeringFormState) => SteeringFormState) => setState(fn(state));

  const lengthField = (key: string, label: React.ReactNode, value: string, set: (v: string) => void, opts: { hint?: React.ReactNode; signed?: boolean } = {}) => (
    <TextField
      id={fieldId(key)}
      testId={fieldId(key)}
      label={label}
      value={value}
      onChange={set}
      onBlur={() => touch(key)}
      unit={lenUnit}
      error={errorFor(key)}
      hint={opts.hint}
      inputMode={opts.signed === false ? "decimal" : "text"}
    />
  );

  const pointRow = (key: PointKey, hint?: string) => (
    <div className="grid grid-cols-[minmax(0,1fr)_minmax(0,1fr)] gap-x-3" role="group" aria-labelledby={`${fieldId(key)}-legend`}>
      <p id={`${fieldId(key)}-legend`} className="col-span-2 mb-1 text-sm font-bold text-graphite-950">
        {POINT_LABELS[key]}
        {hint ? <span className="font-normal text-graphite-700"> · {hint}</span> : null}
      </p>
      {(["y", "z"] as const).map((axis) =>
        <div key={axis}>
          {lengthField(
            `${key}.${axis}`,
            <><span className="sr-only">{POINT_LABELS[key]} </span>{axis}</>,
            state[key][axis],
            (v) => update((s) => ({ ...s, [key]: { ...s[key], [axis]: v } })),
          )}
        </div>,
      )}
    </div>
  );

  const ok = computed.kind === "ok" ? computed : null;
  const heaveIdx = ok ? nearestIndex(ok.result.heave.map((p) => p.travel), travelAt) : 0;
  const rollIdx = ok && ok.result.roll.length ? nearestIndex(ok.result.roll.map((p) => p.rollDeg), rollAt) : 0;
  const activeMode: SweepMode = ok && mode === "roll" && ok.result.roll.length ? "roll" : "heave";
  const index = activeMode === "roll" ? rollIdx : heaveIdx;
  const count = ok ? (activeMode === "roll" ? ok.result.roll.length : ok.result.heave.length) : 0;
  const pose = ok ? poseAt(ok.input, ok.result, activeMode, index) : null;
  const goTo = (i: number) => {
    if (!ok) return;
    const j = Math.max(0, Math.min(count - 1, i));
    if (activeMode === "roll") setRollAt(ok.result.roll[j]!.rollDeg);
    else setTravelAt(ok.result.heave[j]!.travel);
  };
  const home = () => (activeMode === "roll" ? setRollAt(0) : setTravelAt(0));
  const atLabel = (mm: number) =>
    mm === 0 ? "ride height" : `${shown("length", mm, units, { metric: 1, imperial: 2 }, { sign: true })} ${mm > 0 ? "bump" : "droop"}`;
  const poseText = pose ? (pose.mode === "heave" ? atLabel(pose.at) : `${figure(pose.at, 1, { sign: true })}° roll`) : "";
  const best = ok?.result.holes?.[0];
  // The best height for the end the holes are for; the other end's best is offered beside it.
  const optimum = ok ? (ok.input.candidateEnd === "frame" ? ok.result.optimumFrame : ok.result.optimum) : null;
  const otherOptimum = ok ? (ok.input.candidateEnd === "frame" ? ok.result.optimum : ok.result.optimumFrame) : null;
  const warnings = ok ? plausibility(ok.input as SteeringRequest, state) : [];
  const ratio = ok?.input.steeringRatio;
  const fixList = Object.entries(errors).map(([key, message]) => ({ id: typeof getText(state, key) === "string" ? fieldId(key) : undefined, label: steeringFieldLabel(key), message }));

  return (
    <div className="space-y-6">
      <section className="min-w-0 space-y-4" aria-labelledby="steer-results-h">
        <h2 id="steer-results-h" className="sr-only">Front view</h2>
        {computed.kind === "invalid" ? <FixList items={fixList} testId="steer-fix-list" /> : null}
        {warnings.length ? (
          <div className="rounded-md border-2 border-graphite-900 bg-verdict-warnbg p-3" data-testid="steer-plausibility">
            <p className="font-bold"><span aria-hidden="true">▲ </span>Check these readings</p>
            <ul className="ml-5 list-disc text-sm">
              {warnings.map((w) => <li key={w}>{w}</li>)}
            </ul>
          </div>
        ) : null}
        {computed.kind === "impossible" ? (
          <div className="rounded-md border-2 border-verdict-fail bg-white p-4" data-testid="steer-impossible">
            <StatusBadge tone="fail">Cannot be computed</StatusBadge>
            <p className="mt-2 text-graphite-950">{computed.message}.</p>
            <p className="mt-1 text-sm text-graphite-700">Figures in this message are in mm. Check the points against the drawing or the vehicle; the API answers the same layout with 422.</p>
          </div>
        ) : null}
        {ok && pose ? (
          <div className="grid items-start gap-4 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]" data-testid="steer-side-by-side">
            <div className="card min-w-0 space-y-3 p-4">
            <div className="flex flex-wrap items-center justify-between gap-2">
              <h3 className="font-bold">Front view at <span className="figures" data-testid="pose-label">{poseText}</span></h3>
              {ok.result.roll.length ? (
                <Segmented
                  legend="Sweep shown"
                  hideLegend
                  testId="steer-mode"
                  value={activeMode}
                  onChange={setMode}
                  options={[
                    { value: "heave", label: "Heave" },
                    { value: "roll", label: "Roll" },
                  ]}
                />
              ) : null}
            </div>
            <SteeringDiagram input={ok.input} result={ok.result} pose={pose} units={units} bestHole={best} optimum={optimum!} />
            <p className="text-xs text-graphite-700">
              To scale; <span aria-hidden="true">━</span> lateral link (solid), <span aria-hidden="true">▭</span> drag link (open), ◆ best hole, dashed: ride height.
              Housing and brackets are drawn only to place the points.
            </p>
            <div className="space-y-2">
              <label htmlFor="steer-slider" className="field-label">{activeMode === "roll" ? "Body roll" : "Heave travel"}</label>
              <input
                id="steer-slider"
                data-testid="steer-slider"
                type="range"
                className="h-11 w-full cursor-pointer accent-graphite-900"
                min={0}
                max={Math.max(0, count - 1)}
                step={1}
                value={index}
                aria-valuetext={poseText}
                onChange={(e) => goTo(Number(e.target.value))}
              />
              <div className="flex flex-wrap gap-2">
                <button type="button" className="btn btn-quiet" data-testid="steer-step-down" onClick={() => goTo(index - 1)} disabled={index === 0}>
                  <span aria-hidden="true">◀</span> {activeMode === "roll" ? "Roll −" : "Droop"} one step
                </button>
                <button type="button" className="btn btn-quiet" data-testid="steer-home" onClick={home}>{activeMode === "roll" ? "Level" : "Ride height"}</button>
                <button type="button" className="btn btn-quiet" data-testid="steer-step-up" onClick={() => goTo(index + 1)} disabled={index >= count - 1}>
                  {activeMode === "roll" ? "Roll +" : "Bump"} one step <span aria-hidden="true">▶</span>
                </button>
              </div>
              <dl className="grid grid-cols-2 gap-2 text-sm sm:grid-cols-4" data-testid="pose-readout">
                <div><dt className="text-graphite-700">Axle moves sideways</dt><dd className="figures font-semibold">{shown("length", pose.axleShift, units, L, { sign: true })}</dd></div>
                <div><dt className="text-graphite-700">Drag-link error</dt><dd className="figures font-semibold">{shown("length", pose.dragLinkError, units, E, { sign: true })}</dd></div>
                <div><dt className="text-graphite-700">Wheel steer</dt><dd className="figures font-semibold" data-testid="pose-steer">{figure(pose.wheelSteerDeg, 2, { sign: true })}°</dd></div>
                {ratio !== undefined ? <div><dt className="text-graphite-700">Steering wheel</dt><dd className="figures font-semibold">{figure(pose.wheelSteerDeg * ratio, 1, { sign: true })}°</dd></div> : null}
              </dl>
            </div>
          </div>
          <div className="min-w-0 space-y-3">
            {ok.result.holes?.length ? (
              <section aria-labelledby="ranking-h" className="min-w-0 space-y-2" data-testid="ranking-panel">
                <div className="flex flex-wrap items-center justify-between gap-2">
                  <h3 id="ranking-h" className="text-lg font-bold">Hole ranking</h3>
                  {ok.result.roll.length ? (
                    <Segmented
                      legend="Rank by"
                      testId="steer-rank-by"
                      value={ok.result.rankBy ?? "heave"}
                      onChange={(rankBy) => update((s) => ({ ...s, rankBy }))}
                      options={[
                        { value: "heave", label: "Heave" },
                        { value: "heaveAndRoll", label: "Heave, roll" },
                        ...(ok.result.worst.combined ? [{ value: "combined" as const, label: "Both together" }] : []),
                      ]}
                    />
                  ) : null}
                </div>
                <p className="text-sm text-graphite-700">
                  Largest wheel steer over {ok.result.rankBy === "combined" ? "heave and roll together (each heave point at each roll angle)" : ok.result.rankBy === "heaveAndRoll" ? "the heave sweep and the roll sweep" : `the heave sweep (${atLabel(-ok.input.travel.droop)} to ${atLabel(ok.input.travel.bump)})`}, smallest first.
                  {best ? <> Best: <strong data-testid="best-hole">{best.label}</strong>.</> : null}
                </p>
                <HoleTable
                  result={ok.result}
                  units={units}
                  ratio={ratio}
                  rimDiameter={ok.input.rimDiameter}
                  optimum={optimum!}
                  fixedEnd={ok.input.candidateEnd === "frame" ? ok.input.trackBar.axleEnd : ok.input.trackBar.frameEnd}
                  currentEnd={ok.input.candidateEnd === "frame" ? ok.input.trackBar.frameEnd : ok.input.trackBar.axleEnd}
                />
                {ok.result.combinedSkipped ? <p className="text-sm text-graphite-700">Combined articulation not worked out: {ok.result.combinedSkipped}.</p> : null}
              </section>
            ) : (
              <section className="min-w-0 space-y-2" data-testid="ranking-panel">
                <h3 className="text-lg font-bold">Best height</h3>
                <p className="text-sm text-graphite-700">Add candidate holes to rank bracket positions.</p>
              </section>
            )}
            <OptimumCard optimum={optimum!} other={otherOptimum!} units={units} ratio={ratio} rim={ok.input.rimDiameter} />

          </div>
          </div>
        ) : null}
      </section>

      <div className="grid gap-6 xl:grid-cols-[minmax(22rem,26rem)_minmax(0,1fr)]">
      {/* Inputs */}
      <form className="space-y-5" onSubmit={(e) => e.preventDefault()} aria-label="Steering layout" noValidate>
        <div className="card flex flex-wrap items-end gap-3 p-4">
          <Segmented
            legend="Entry units"
            testId="steer-units"
            value={units}
            onChange={(u) => update((s) => convertSteeringForm(s, u))}
            options={[
              { value: "metric", label: "mm" },
              { value: "imperial", label: "in" },
            ]}
          />
          <button type="button" className="btn btn-quiet" onClick={() => { setState(withEntry(exampleSteeringForm(units), floorMode ? "floor" : "coordinates")); setTouched(new Set()); }}>Load example</button>
          <button type="button" className="btn btn-quiet" onClick={() => { setState(emptySteeringForm(units, floorMode ? "floor" : "coordinates", state.drive)); setTouched(new Set()); }}>Clear</button>
          <p className="w-full text-sm text-graphite-700">
            {floorMode
              ? "Measured at ride height on a level floor: each joint's height from the floor and its distance from the vehicle's centre line; candidate holes are heights from the floor on the end's own vertical line."
              : "Front view from ahead of the vehicle, frame-fixed, at ride height: y across (+ to the right of the drawing), z up. Any datum will do if every point uses it."}{" "}
            Fractions and units are read too: <span className="figures">3 1/4&quot;</span>, <span className="figures">82,5 mm</span>.
          </p>
        </div>

        <div className="card space-y-3 p-4">
          <EntryChoice state={state} onState={(next) => update(() => next)} />
        </div>

        {floorMode && state.floor ? (
          <MeasureGuide floor={state.floor} state={state} onState={(next) => update(() => next)} lengthField={lengthField} />
        ) : null}

        {floorMode ? null : (
        <>
        <fieldset className="card space-y-3 p-4">
          <legend className="px-1 text-lg font-bold">Lateral link (track bar)</legend>
          {pointRow("frameEnd", "fixed to the frame")}
          {pointRow("axleEnd", "on the axle bracket")}
        </fieldset>

        <fieldset className="card space-y-3 p-4">
          <legend className="px-1 text-lg font-bold">Drag link</legend>
          {pointRow("pitmanEnd", "pitman arm ball")}
          {pointRow("knuckleEnd", "steering arm ball")}
        </fieldset>

        </>
        )}

        <fieldset className="card space-y-3 p-4">
          <legend className="px-1 text-lg font-bold">Axle and steering</legend>
          {floorMode ? null : pointRow("axleCenter", "roll turns the axle about it")}
          <div className="grid grid-cols-2 gap-x-3">
            {lengthField("steeringArmLength", "Steering arm length", state.steeringArmLength, (v) => update((s) => ({ ...s, steeringArmLength: v })), { signed: false, hint: "ball to steering axis" })}
            <TextField
              id={fieldId("steeringRatio")}
              testId={fieldId("steeringRatio")}
              label="Steering ratio (optional)"
              value={state.steeringRatio}
              onChange={(v) => update((s) => ({ ...s, steeringRatio: v }))}
              onBlur={() => touch("steeringRatio")}
              unit=": 1"
              error={errorFor("steeringRatio")}
              hint="wheel ° per road-wheel °"
            />
          </div>
          {lengthField("rimDiameter", "Rim diameter (optional)", state.rimDiameter ?? "", (v) => update((s) => ({ ...s, rimDiameter: v })), { signed: false, hint: "for toe at the rim, e.g. 17 in" })}
        </fieldset>

        <fieldset className="card space-y-3 p-4">
          <legend className="px-1 text-lg font-bold">Travel</legend>
          <div className="grid grid-cols-3 gap-x-3">
            {lengthField("travel.bump", "Bump", state.travel.bump, (v) => update((s) => ({ ...s, travel: { ...s.travel, bump: v } })), { signed: false })}
            {lengthField("travel.droop", "Droop", state.travel.droop, (v) => update((s) => ({ ...s, travel: { ...s.travel, droop: v } })), { signed: false })}
            {lengthField("travel.step", "Step", state.travel.step, (v) => update((s) => ({ ...s, travel: { ...s.travel, step: v } })), { signed: false })}
          </div>
          <Checkbox testId="st-roll-on" label="Also sweep body roll about the roll centre" checked={state.roll.on} onChange={(on) => update((s) => ({ ...s, roll: { ...s.roll, on, maxDeg: s.roll.maxDeg || "5", stepDeg: s.roll.stepDeg || "0.5" } }))} />
          {state.roll.on ? (
            <div className="grid grid-cols-2 gap-x-3">
              <TextField id={fieldId("roll.maxDeg")} testId={fieldId("roll.maxDeg")} label="Roll either way" unit="°" value={state.roll.maxDeg} onChange={(v) => update((s) => ({ ...s, roll: { ...s.roll, maxDeg: v } }))} onBlur={() => touch("roll.maxDeg")} error={errorFor("roll.maxDeg")} />
              <TextField id={fieldId("roll.stepDeg")} testId={fieldId("roll.stepDeg")} label="Roll step" unit="°" value={state.roll.stepDeg} onChange={(v) => update((s) => ({ ...s, roll: { ...s.roll, stepDeg: v } }))} onBlur={() => touch("roll.stepDeg")} error={errorFor("roll.stepDeg")} />
            </div>
          ) : null}
        </fieldset>

        <fieldset className="card space-y-3 p-4" data-testid="hole-editor">
          <legend className="px-1 text-lg font-bold">Candidate holes</legend>
          <Segmented
            legend="The holes are for"
            value={state.candidateEnd}
            onChange={(candidateEnd) => update((s) => ({ ...s, candidateEnd }))}
            options={[
              { value: "axle", label: "a new axle bracket" },
              { value: "frame", label: "a new frame bracket" },
            ]}
          />
          <p className="text-sm text-graphite-700">Each hole is ranked with the bar re-set to its own length, as an adjustable bar is set to centre the axle at ride height.</p>
          {state.holes.map((h, i) => (
            <div key={h.id} className="grid grid-cols-[4.5rem_minmax(0,1fr)_minmax(0,1fr)_auto] items-start gap-x-2" role="group" aria-label={`Hole ${i + 1}`}>
              <TextField
                id={fieldId(`holes.${i}.label`)}
                label={<><span className="sr-only">Hole {i + 1} </span>Label</>}
                value={h.label}
                inputMode="text"
                onChange={(v) => update((s) => ({ ...s, holes: s.holes.map((x, j) => (j === i ? { ...x, label: v } : x)) }))}
                error={errorFor(`holes.${i}.label`)}
              />
              {floorMode ? <p className="mt-8 text-sm text-graphite-700">on the {state.candidateEnd === "frame" ? "frame" : "axle"} end&apos;s line</p> : lengthField(`holes.${i}.y`, <><span className="sr-only">Hole {i + 1} </span>y</>, h.y, (v) => update((s) => ({ ...s, holes: s.holes.map((x, j) => (j === i ? { ...x, y: v } : x)) })))}
              {lengthField(`holes.${i}.z`, <><span className="sr-only">Hole {i + 1} </span>{floorMode ? "height" : "z"}</>, h.z, (v) => update((s) => ({ ...s, holes: s.holes.map((x, j) => (j === i ? { ...x, z: v } : x)) })))}
              <button
                type="button"
                className="btn btn-quiet mt-6 px-3"
                aria-label={`Remove hole ${h.label || i + 1}`}
                onClick={() => update((s) => ({ ...s, holes: s.holes.filter((_, j) => j !== i) }))}
              >
                ✕
              </button>
            </div>
          ))}
          <button
            type="button"
            className="btn btn-quiet"
            onClick={() => {
              const id = `h${++holeSeq}`;
              update((s) => {
                const last = s.holes.at(-1);
                const end = s.candidateEnd === "frame" ? s.frameEnd : s.axleEnd;
                return { ...s, holes: [...s.holes, { id, label: `H${s.holes.length + 1}`, y: last?.y ?? end.y, z: "" }] };
              });
            }}
          >
            + Add a hole
          </button>
          <Checkbox testId="st-column-on" label="Add a column of holes" checked={state.holeColumn.on} onChange={(on) => update((s) => ({ ...s, holeColumn: { ...s.holeColumn, on } }))} />
          {state.holeColumn.on ? (
            <div className="grid grid-cols-2 gap-x-3">
              {lengthField("holeColumn.zMin", "Lowest z", state.holeColumn.zMin, (v) => update((s) => ({ ...s, holeColumn: { ...s.holeColumn, zMin: v } })))}
              {lengthField("holeColumn.zMax", "Highest z", state.holeColumn.zMax, (v) => update((s) => ({ ...s, holeColumn: { ...s.holeColumn, zMax: v } })))}
              {lengthField("holeColumn.pitch", "Pitch", state.holeColumn.pitch, (v) => update((s) => ({ ...s, holeColumn: { ...s.holeColumn, pitch: v } })), { signed: false })}
              {lengthField("holeColumn.y", "On the line y (optional)", state.holeColumn.y, (v) => update((s) => ({ ...s, holeColumn: { ...s.holeColumn, y: v } })), { hint: "blank: the end's own y" })}
            </div>
          ) : null}
          {errorFor("holes") ? <p className="field-error">✕ {errorFor("holes")}</p> : null}
        </fieldset>
      </form>

        <section className="min-w-0 space-y-4" aria-labelledby="steer-figures-h">
          <h2 id="steer-figures-h" className="sr-only">Results</h2>
          {ok ? (
            <>
            <dl className="grid gap-3 sm:grid-cols-3" data-testid="steer-summary">
              <Figure label="Lateral link angle" value={`${figure(ok.result.trackBarAngleDeg, 2, { sign: true })}°`} testId="track-bar-angle" source="from horizontal, + rising toward +y" />
              <Figure label="Drag link angle" value={`${figure(ok.result.dragLinkAngleDeg, 2, { sign: true })}°`} testId="drag-link-angle" />
              <Figure label="Difference (drag − lateral)" value={`${figure(ok.result.angleDifferenceDeg, 2, { sign: true })}°`} testId="angle-difference" source="0° = parallel: no first-order bump steer" />
              <Figure
                label={`Worst over heave (at ${atLabel(ok.result.worst.heave.travel)})`}
                value={`${figure(ok.result.worst.heave.wheelSteerDeg, 2, { sign: true })}°`}
                testId="worst-heave"
                source={`drag-link error ${shown("length", ok.result.worst.heave.dragLinkError, units, E, { sign: true })}${ratio !== undefined ? ` · steering wheel ${figure(ok.result.worst.heave.wheelSteerDeg * ratio, 1, { sign: true })}°` : ""}`}
              />
              {ok.result.worst.roll ? (
                <Figure
                  label={`Worst over roll (at ${figure(ok.result.worst.roll.rollDeg, 1, { sign: true })}°)`}
                  value={`${figure(ok.result.worst.roll.wheelSteerDeg, 2, { sign: true })}°`}
                  testId="worst-roll"
                  source={`drag-link error ${shown("length", ok.result.worst.roll.dragLinkError, units, E, { sign: true })}`}
                />
              ) : null}
              {ok.result.parallelHeightZ !== undefined ? (
                <Figure
                  label="Parallel to the drag link at"
                  value={`z ${shown("length", ok.result.parallelHeightZ, units, L)}`}
                  testId="parallel-height"
                  source={`on the ${ok.input.candidateEnd === "frame" ? "frame" : "axle"} end's hole line: first-order zero bump steer`}
                />
              ) : null}
            </dl>

            <SteerCharts result={ok.result} units={units} mode={activeMode} at={pose?.at ?? 0} />

            </>
          ) : (
            <p className="text-graphite-700">Results show here once the layout reads and computes.</p>
          )}
        </section>
      </div>

      {ok ? (
        <section className="min-w-0 space-y-4" aria-label="Hole ranking and sweep figures">
            <details className="card p-4">
              <summary className="flex min-h-11 cursor-pointer items-center font-semibold">
                Every point of the heave sweep ({ok.result.heave.length.toLocaleString("en-US")}{ok.result.heave.length > 2001 ? ", the first 2,001 listed" : ""})
              </summary>
              <div className="mt-2 max-h-96 overflow-auto">
                <table className="w-full text-right text-sm">
                  <thead className="sticky top-0 bg-graphite-100">
                    <tr>
                      <th scope="col" className="px-2 py-1">Travel, {lenUnit}</th>
                      <th scope="col" className="px-2 py-1">Axle shift, {lenUnit}</th>
                      <th scope="col" className="px-2 py-1">Drag-link error, {lenUnit}</th>
                      <th scope="col" className="px-2 py-1">Wheel steer</th>
                      {ratio !== undefined ? <th scope="col" className="px-2 py-1">Steering wheel</th> : null}
                    </tr>
                  </thead>
                  <tbody className="figures">
                    {ok.result.heave.slice(0, 2001).map((p) => (
                      <tr key={p.travel} className="border-t border-graphite-200">
                        <td className="px-2 py-0.5">{figure(fromSI("length", p.travel, preferredUnit("length", units)), L[units], { sign: true })}</td>
                        <td className="px-2 py-0.5">{figure(fromSI("length", p.axleShift, preferredUnit("length", units)), L[units], { sign: true })}</td>
                        <td className="px-2 py-0.5">{figure(fromSI("length", p.dragLinkError, preferredUnit("length", units)), E[units], { sign: true })}</td>
                        <td className="px-2 py-0.5">{figure(p.wheelSteerDeg, 3, { sign: true })}°</td>
                        {ratio !== undefined ? <td className="px-2 py-0.5">{figure(p.wheelSteerDeg * ratio, 1, { sign: true })}°</td> : null}
                      </tr>
                    ))}
                  </tbody>
                </table>
              </div>
            </details>
        </section>
      ) : null}
    </div>
  );
}
