"use client";
// Steering-link points at ride height, front view (y lateral, z up, from one datum on the frame). Results are
// computed as they are typed (lib/geometry); the server recomputes them from the same input when saving.
import { useEffect, useState } from "react";
import type { Step } from "@/lib/procedures/schema";
import { geometryResults, requiredCaptures } from "@/lib/jobs/geometry";
import { defaultPadUnit, show, symbolOf } from "@/lib/jobs/units";
import type { GeometryCapture, GeometryValue } from "@/lib/jobs/values";
import { applyKey, NumberPad, UnitSwitch } from "./number-pad";
import { initialText, storedFrom } from "./pad-state";
import { Pill, VerdictBox } from "./verdict";

type Geometry = Extract<Step, { kind: "geometry" }>;
type Which = "before" | "after";

const POINTS = [
  { id: "F", label: "Lateral link, frame end" },
  { id: "A", label: "Lateral link, axle end" },
  { id: "P", label: "Drag link, pitman-arm end" },
  { id: "K", label: "Drag link, steering-arm end" },
  { id: "C", label: "Axle centre" },
] as const;
const SCALARS = [
  { id: "r", label: "Steering arm length", length: true },
  { id: "bump", label: "Bump travel", length: true },
  { id: "droop", label: "Droop travel", length: true },
  { id: "ratio", label: "Steering ratio (optional)", length: false },
] as const;
function fieldName(id: string): string {
  const [p, axis] = id.split(".");
  const point = POINTS.find((x) => x.id === p);
  if (point) return `${point.label}, ${axis}`;
  return SCALARS.find((x) => x.id === id)?.label ?? id;
}
const FIELD_ORDER = [...POINTS.flatMap((p) => [`${p.id}.y`, `${p.id}.z`]), ...SCALARS.map((s) => s.id)];
const STEP_MM = 5;

function textsFrom(c: GeometryCapture | undefined, unit: string): Record<string, string> {
  const t: Record<string, string> = {};
  const len = (v: number | undefined) => initialText(v, { quantity: "length", unit });
  if (!c) return t;
  const i = c.input;
  const pts = { F: i.trackBar.frameEnd, A: i.trackBar.axleEnd, P: i.dragLink.pitmanEnd, K: i.dragLink.knuckleEnd, C: i.axleCenter };
  for (const [k, p] of Object.entries(pts)) {
    t[`${k}.y`] = len(p.y);
    t[`${k}.z`] = len(p.z);
  }
  t.r = len(i.steeringArmLength);
  t.bump = len(i.travel.bump);
  t.droop = len(i.travel.droop);
  t.ratio = i.steeringRatio === undefined ? "" : String(i.steeringRatio);
  return t;
}

function inputFrom(t: Record<string, string>, unit: string): GeometryCapture["input"] | null {
  const len = (k: string) => storedFrom(t[k] ?? "", { quantity: "length", unit });
  const pt = (k: string) => {
    const y = len(`${k}.y`);
    const z = len(`${k}.z`);
    return y === undefined || z === undefined ? null : { y, z };
  };
  const [F, A, P, K, C] = ["F", "A", "P", "K", "C"].map(pt);
  const r = len("r");
  const bump = len("bump");
  const droop = len("droop");
  const ratio = storedFrom(t.ratio ?? "", { quantity: null, unit: "" });
  if (!F || !A || !P || !K || !C || r === undefined || bump === undefined || droop === undefined) return null;
  return { trackBar: { frameEnd: F, axleEnd: A }, dragLink: { pitmanEnd: P, knuckleEnd: K }, axleCenter: C, steeringArmLength: r, travel: { bump, droop, step: STEP_MM }, ...(ratio ? { steeringRatio: ratio } : {}) };
}

export function GeometryControl({ stepId, spec, value, readOnly, unitSystem, onChange }: { stepId: string; spec: Geometry; value: GeometryValue; readOnly: boolean; unitSystem: "metric" | "imperial"; onChange: (v: GeometryValue) => void }) {
  const captures = requiredCaptures(spec.capture);
  const [which, setWhich] = useState<Which>(captures.find((c) => !value[c]) ?? captures[0]!);
  return (
    <div className="space-y-3">
      {captures.length > 1 ? (
        <div role="tablist" aria-label="Capture" className="flex gap-2">
          {captures.map((c) => (
            <button key={c} type="button" role="tab" aria-selected={which === c} onClick={() => setWhich(c)} className={`min-h-12 rounded-md border-2 px-4 font-bold ${which === c ? "border-graphite-950 bg-graphite-900 text-white" : "border-graphite-500 bg-white"}`}>
              {c === "before" ? "Before" : "After"} {value[c] ? "●" : "○"}
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

function CaptureForm({ stepId, which, capture, readOnly, unitSystem, onCapture, other }: { stepId: string; which: Which; capture: GeometryCapture | undefined; readOnly: boolean; unitSystem: "metric" | "imperial"; onCapture: (c: GeometryCapture | undefined) => void; other?: GeometryCapture }) {
  const storeKey = `gusset:geometry:${stepId}:${which}`;
  const [unit, setUnit] = useState<string>(capture?.unit ?? defaultPadUnit("length", unitSystem));
  const [texts, setTexts] = useState<Record<string, string>>(() => textsFrom(capture, capture?.unit ?? defaultPadUnit("length", unitSystem)));
  const [active, setActive] = useState<string>("F.y");
  // Half-typed points survive a reload on this tablet; only a complete capture goes to the server.
  useEffect(() => {
    if (capture || readOnly) return;
    try {
      const saved = localStorage.getItem(storeKey);
      if (saved) {
        const parsed = JSON.parse(saved) as { unit: string; texts: Record<string, string> };
        // eslint-disable-next-line react-hooks/set-state-in-effect -- restoring a local draft once, after mount
        setTexts(parsed.texts);
        setUnit(parsed.unit);
      }
    } catch {
      /* no local draft */
    }
  }, [capture, readOnly, storeKey]);

  const update = (next: Record<string, string>, u: string) => {
    setTexts(next);
    try {
      localStorage.setItem(storeKey, JSON.stringify({ unit: u, texts: next }));
    } catch {
      /* storage full or off: the server copy still follows once complete */
    }
    const input = inputFrom(next, u);
    if (!input) return onCapture(undefined);
    try {
      onCapture({ input, unit: u === "in" ? "in" : "mm", results: geometryResults(input) });
    } catch {
      onCapture(undefined);
    }
  };
  const input = inputFrom(texts, unit);
  let results: GeometryCapture["results"] | null = null;
  let problem: string | null = null;
  if (input) {
    try {
      results = geometryResults(input);
    } catch (e) {
      problem = e instanceof Error ? e.message : "These points cannot be computed.";
    }
  }
  const isLength = (id: string) => id !== "ratio";
  const cell = (id: string, label: string) => (
    <button
      type="button"
      disabled={readOnly}
      aria-label={label}
      aria-pressed={active === id}
      onClick={() => setActive(id)}
      data-testid={`geo-${id}`}
      className={`figures min-h-12 w-full rounded-md border-2 bg-white px-2 text-right text-lg font-semibold ${!readOnly && active === id ? "border-graphite-950 ring-4 ring-primer-400" : "border-graphite-500"}`}
    >
      {texts[id] || "—"}
    </button>
  );
  return (
    <div className={readOnly ? "space-y-3" : "grid gap-4 md:grid-cols-[minmax(0,1fr)_18rem]"}>
      <div className="space-y-3">
        <p className="text-graphite-900">Front view at ride height, from one datum on the frame: y across the vehicle, z up, in {symbolOf("length", unit)}.</p>
        <table className="w-full border-separate border-spacing-2">
          <thead>
            <tr className="text-left text-sm"><th scope="col">Point</th><th scope="col">y</th><th scope="col">z</th></tr>
          </thead>
          <tbody>
            {POINTS.map((p) => (
              <tr key={p.id}>
                <th scope="row" className="text-left font-semibold">{p.label}</th>
                <td>{cell(`${p.id}.y`, `${p.label} y`)}</td>
                <td>{cell(`${p.id}.z`, `${p.label} z`)}</td>
              </tr>
            ))}
            {SCALARS.map((s) => (
              <tr key={s.id}>
                <th scope="row" className="text-left font-semibold">{s.label}{s.length ? ` (${symbolOf("length", unit)})` : ""}</th>
                <td colSpan={2}>{cell(s.id, s.label)}</td>
              </tr>
            ))}
          </tbody>
        </table>
        {!readOnly ? <UnitSwitch quantity="length" unit={unit} label="Lengths" onUnit={(u) => { setUnit(u); update(texts, u); }} /> : null}
        {results ? (
          // No acceptance limit is set by the step, so the result is information, not a verdict.
          <VerdictBox tone="info" title={`Worst bump steer ${results.worstHeave.wheelSteerDeg.toFixed(2)}° at ${show("length", results.worstHeave.travel, unit)}`} testId="geometry-results">
              Lateral link {results.trackBarAngleDeg.toFixed(2)}°, drag link {results.dragLinkAngleDeg.toFixed(2)}°, difference {results.angleDifferenceDeg.toFixed(2)}°.
              {results.steeringWheelDeg !== null ? ` Steering wheel ${results.steeringWheelDeg.toFixed(1)}°.` : ""}
              {other?.results ? (
                <span className="mt-1 block">
                  Before: worst {other.results.worstHeave.wheelSteerDeg.toFixed(2)}°, difference {other.results.angleDifferenceDeg.toFixed(2)}°{" "}
                  <Pill tone={Math.abs(results.worstHeave.wheelSteerDeg) <= Math.abs(other.results.worstHeave.wheelSteerDeg) ? "pass" : "fail"}>
                    {Math.abs(results.worstHeave.wheelSteerDeg) <= Math.abs(other.results.worstHeave.wheelSteerDeg) ? "better or equal" : "worse than before"}
                  </Pill>
                </span>
              ) : null}
          </VerdictBox>
        ) : problem ? (
          <VerdictBox tone="fail" title="These points cannot be computed" testId="geometry-results">{problem}</VerdictBox>
        ) : (
          <VerdictBox tone="idle" title="Enter every point, the arm length and the travel" testId="geometry-results" />
        )}
      </div>
      {!readOnly ? (
        <div className="md:sticky md:top-28 md:self-start">
          <p className="mb-2 text-sm font-semibold">Typing into: {fieldName(active)}</p>
          <NumberPad negative={isLength(active)} onKey={(k) => update({ ...texts, [active]: applyKey(texts[active] ?? "", k, { negative: isLength(active) }) }, unit)} />
          <button type="button" className="btn btn-quiet mt-2 min-h-14 w-full text-lg" onClick={() => setActive(FIELD_ORDER[(FIELD_ORDER.indexOf(active) + 1) % FIELD_ORDER.length]!)}>
            Next field →
          </button>
        </div>
      ) : null}
    </div>
  );
}
