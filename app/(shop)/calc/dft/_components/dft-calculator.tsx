"use client";
import { useMemo, useState } from "react";
import { FixList, Segmented, TextField } from "@/components/calc/fields";
import { Figure } from "@/components/calc/figure";
import { fieldErrors, figure, numberText, readPlainNumber, trimNumber, type FieldErrors, type UnitSystem } from "@/components/calc/values";
import { StatusBadge } from "@/components/status-badge";
import { dftAreasToMeasure, evaluateDftArea, MIN_READINGS_PER_SPOT, SPOTS_PER_AREA, type DftAreaResult } from "@/lib/coating";
import { dftRequestSchema } from "@/lib/coating/schemas";
import { UM_PER_MIL } from "@/lib/units";

type Unit = "um" | "mil";
type State = { unit: Unit; specMin: string; specMax: string; spots: string[][]; surface: string; surfaceUnit: "m2" | "ft2" };

const SYMBOL: Record<Unit, string> = { um: "µm", mil: "mil" };

// Computes in the browser with lib/coating evaluateDftArea (pure), through the schema of POST /api/calc/dft.
// A spot left wholly blank is not measured; a spot with some readings needs at least three.
function compute(s: State): { ok: true; result: DftAreaResult; measured: number[] } | { ok: false; errors: FieldErrors } {
  const errors: FieldErrors = {};
  const one = (key: string, text: string, label: string) => {
    const r = numberText(label).safeParse(text);
    if (r.success) return r.data;
    errors[key] ??= fieldErrors(r.error.issues)._ ?? "Check this value.";
    return Number.NaN;
  };
  const specMin = one("specMin", s.specMin, "the specified minimum");
  const specMax = one("specMax", s.specMax, "the specified maximum");
  const measured: number[] = [];
  const spots: number[][] = [];
  s.spots.forEach((readings, i) => {
    const filled = readings.map((t, j) => ({ t, j })).filter((x) => x.t.trim() !== "");
    if (filled.length === 0) return;
    if (filled.length < MIN_READINGS_PER_SPOT) errors[`spot.${i}`] ??= `Spot ${i + 1} needs at least ${MIN_READINGS_PER_SPOT} gauge readings (${filled.length} given).`;
    measured.push(i);
    spots.push(filled.map((x) => one(`spot.${i}.${x.j}`, x.t, "a reading")));
  });
  if (measured.length === 0) errors["spots"] ??= `Enter the gauge readings of at least one spot (${SPOTS_PER_AREA} spots make an area).`;
  const r = dftRequestSchema.safeParse({ specMin, specMax, unit: s.unit, spots });
  if (!r.success) {
    const mapped = fieldErrors(r.error.issues, (p) => {
      const m = /^spots\.(\d+)(?:\.(\d+))?$/.exec(p);
      return m ? `spot.${measured[Number(m[1])] ?? 0}` : p;
    });
    for (const [k, m] of Object.entries(mapped)) errors[k] ??= m.replace(/specMax/gi, "the maximum").replace(/specMin/gi, "the minimum").replace(/^the /, "The ");
  }
  if (Object.keys(errors).length || !r.success) return { ok: false, errors };
  return { ok: true, result: evaluateDftArea({ specMin: r.data.specMin, specMax: r.data.specMax }, r.data.spots), measured };
}

const emptySpots = () => Array.from({ length: SPOTS_PER_AREA }, () => Array.from({ length: MIN_READINGS_PER_SPOT }, () => ""));

function start(units: UnitSystem): State {
  return units === "imperial"
    ? { unit: "mil", specMin: "4", specMax: "6", spots: emptySpots(), surface: "", surfaceUnit: "ft2" }
    : { unit: "um", specMin: "100", specMax: "150", spots: emptySpots(), surface: "", surfaceUnit: "m2" };
}

export function DftCalculator({ initialUnits }: { initialUnits: UnitSystem }) {
  const [s, setS] = useState<State>(() => start(initialUnits));
  const out = useMemo(() => compute(s), [s]);
  const errors = out.ok ? {} : out.errors;
  const sym = SYMBOL[s.unit];
  const anyReading = s.spots.some((sp) => sp.some((t) => t.trim() !== ""));
  const setReading = (i: number, j: number, v: string) => setS((x) => ({ ...x, spots: x.spots.map((sp, a) => (a === i ? sp.map((t, b) => (b === j ? v : t)) : sp)) }));
  const switchUnit = (unit: Unit) =>
    setS((x) => {
      if (x.unit === unit) return x;
      const f = unit === "mil" ? 1 / UM_PER_MIL : UM_PER_MIL;
      const c = (t: string) => {
        const v = readPlainNumber(t);
        return Number.isFinite(v) ? trimNumber(v * f, unit === "mil" ? 2 : 1) : t;
      };
      return { ...x, unit, specMin: c(x.specMin), specMax: c(x.specMax), spots: x.spots.map((sp) => sp.map(c)) };
    });
  const r = out.ok ? out.result : null;
  const spotResult = (i: number) => (out.ok ? out.result.spots[out.measured.indexOf(i)] : undefined);
  const areas = (() => {
    const v = readPlainNumber(s.surface);
    if (!(v > 0)) return null;
    const n = dftAreasToMeasure(v, s.surfaceUnit);
    return { areas: n, spots: n * SPOTS_PER_AREA, readings: n * SPOTS_PER_AREA * MIN_READINGS_PER_SPOT };
  })();

  return (
    <div className="grid gap-6 xl:grid-cols-[minmax(0,30rem)_minmax(0,1fr)]">
      <form className="card space-y-4 p-4" onSubmit={(e) => e.preventDefault()} aria-label="Film thickness readings" noValidate>
        <div className="flex flex-wrap items-end gap-3">
          <Segmented legend="Gauge unit" value={s.unit} onChange={switchUnit} testId="dft-unit" options={[{ value: "um", label: "µm" }, { value: "mil", label: "mil" }]} />
          <button type="button" className="btn btn-quiet" onClick={() => setS((x) => ({ ...x, spots: emptySpots() }))}>Clear readings</button>
        </div>
        <fieldset>
          <legend className="font-bold">Specified dry film thickness</legend>
          <div className="mt-1 grid grid-cols-2 gap-x-3">
            <TextField id="dft-specMin" testId="dft-specMin" label="Minimum" unit={sym} value={s.specMin} onChange={(v) => setS((x) => ({ ...x, specMin: v }))} error={errors.specMin} />
            <TextField id="dft-specMax" testId="dft-specMax" label="Maximum" unit={sym} value={s.specMax} onChange={(v) => setS((x) => ({ ...x, specMax: v }))} error={errors.specMax} />
          </div>
        </fieldset>
        <fieldset className="space-y-2">
          <legend className="font-bold">Gauge readings, one row per spot</legend>
          <p className="text-sm text-graphite-700">A spot: at least {MIN_READINGS_PER_SPOT} readings within a 4 cm (1.5 in) circle. An area: {SPOTS_PER_AREA} spots over 10 m² (100 ft²).</p>
          {s.spots.map((readings, i) => {
            const sr = spotResult(i);
            return (
              <div key={i} role="group" aria-label={`Spot ${i + 1}`} className="rounded-md border-2 border-graphite-200 p-2" data-testid={`dft-spot-${i + 1}`}>
                <div className="flex flex-wrap items-center justify-between gap-2">
                  <span className="font-semibold">Spot {i + 1}</span>
                  {sr ? (
                    <StatusBadge tone={sr.ok ? "pass" : "fail"} testId={`dft-spot-${i + 1}-verdict`}>
                      {figure(sr.average, s.unit === "mil" ? 2 : 1)} {sym} · {sr.ok ? "within spot limits" : sr.reason === "below-spot-minimum" ? "below spot minimum" : "above spot maximum"}
                    </StatusBadge>
                  ) : null}
                </div>
                <div className="mt-1 grid grid-cols-3 gap-x-2 sm:grid-cols-4">
                  {readings.map((t, j) => (
                    <TextField
                      key={j}
                      id={`dft-spot-${i}-${j}`}
                      testId={`dft-reading-${i + 1}-${j + 1}`}
                      label={<><span className="sr-only">Spot {i + 1} </span>Reading {j + 1}</>}
                      labelClassName="text-xs"
                      value={t}
                      onChange={(v) => setReading(i, j, v)}
                      error={errors[`spot.${i}.${j}`]}
                    />
                  ))}
                  <div className="flex items-start pt-5">
                    <button type="button" className="btn btn-quiet px-3" aria-label={`Add a reading to spot ${i + 1}`} onClick={() => setS((x) => ({ ...x, spots: x.spots.map((sp, a) => (a === i ? [...sp, ""] : sp)) }))}>+ Add</button>
                  </div>
                </div>
                {errors[`spot.${i}`] ? <p className="field-error" data-testid={`dft-spot-${i + 1}-error`}>✕ {errors[`spot.${i}`]}</p> : null}
              </div>
            );
          })}
          <div className="flex flex-wrap gap-2">
            <button type="button" className="btn btn-quiet" onClick={() => setS((x) => ({ ...x, spots: [...x.spots, Array.from({ length: MIN_READINGS_PER_SPOT }, () => "")] }))}>+ Add a spot</button>
            {s.spots.length > 1 ? <button type="button" className="btn btn-quiet" onClick={() => setS((x) => ({ ...x, spots: x.spots.slice(0, -1) }))}>Remove the last spot</button> : null}
          </div>
        </fieldset>
      </form>

      <section className="min-w-0 space-y-4" aria-labelledby="dft-results-h">
        <h2 id="dft-results-h" className="text-lg font-bold">Area verdict (SSPC-PA 2)</h2>
        {!out.ok && (anyReading || errors.specMin || errors.specMax) ? (
          <FixList
            testId="dft-fix-list"
            items={Object.entries(errors).map(([key, message]) => ({
              id: key.startsWith("spot.") && key.split(".").length === 3 ? `dft-spot-${key.split(".")[1]}-${key.split(".")[2]}` : key.startsWith("spec") ? `dft-${key}` : undefined,
              label: key === "specMin" ? "Specified minimum" : key === "specMax" ? "Specified maximum" : key.startsWith("spot.") ? `Spot ${Number(key.split(".")[1]) + 1}` : "Readings",
              message,
            }))}
          />
        ) : null}
        {!anyReading && !r ? <p className="text-graphite-700">Enter gauge readings to see spot and area averages.</p> : null}
        {r ? (
          <>
            <div className="flex flex-wrap gap-2">
              <StatusBadge tone={r.ok ? "pass" : "fail"} testId="dft-area-verdict">
                {r.ok ? "Area conforms" : "Area does not conform"}
              </StatusBadge>
              <StatusBadge tone={r.areaOk ? "pass" : "fail"} testId="dft-average-verdict">Area average {r.areaOk ? "within" : "outside"} {trimNumber(r.specMin, 2)}–{trimNumber(r.specMax, 2)} {sym}</StatusBadge>
              <StatusBadge tone={r.spotsOk ? "pass" : "fail"}>{r.spotsOk ? "Every spot within its limits" : `${r.spots.filter((x) => !x.ok).length} spot(s) outside the spot limits`}</StatusBadge>
              {r.spots.length !== SPOTS_PER_AREA ? <StatusBadge tone="warn">{r.spots.length} of {SPOTS_PER_AREA} spots measured</StatusBadge> : null}
            </div>
            <dl className="grid gap-3 sm:grid-cols-3">
              <Figure size="lg" label="Area average" value={figure(r.areaAverage, s.unit === "mil" ? 2 : 1)} unit={sym} testId="dft-area-average" source={`mean of ${r.spots.length} spot averages`} />
              <Figure label="Spot limits" value={`${trimNumber(r.spotLimits.min, 3)}–${trimNumber(r.spotLimits.max, 3)}`} unit={sym} testId="dft-spot-limits" source="80 % of the minimum to 120 % of the maximum" />
              <Figure label="Specified range" value={`${trimNumber(r.specMin, 3)}–${trimNumber(r.specMax, 3)}`} unit={sym} source="the area average must fall in it" />
            </dl>
          </>
        ) : null}
        <section className="card space-y-2 p-4" aria-labelledby="dft-areas-h">
          <h3 id="dft-areas-h" className="font-bold">How many areas to measure</h3>
          <div className="grid grid-cols-[minmax(0,1fr)_auto] items-start gap-3">
            <TextField id="dft-surface" testId="dft-surface" label="Coated surface" unit={s.surfaceUnit === "m2" ? "m²" : "ft²"} value={s.surface} onChange={(v) => setS((x) => ({ ...x, surface: v }))} error={s.surface.trim() && !areas ? "Give the surface as a number greater than 0." : undefined} />
            <div className="pt-6">
              <Segmented legend="Surface unit" hideLegend value={s.surfaceUnit} onChange={(surfaceUnit) => setS((x) => ({ ...x, surfaceUnit }))} options={[{ value: "m2", label: "m²" }, { value: "ft2", label: "ft²" }]} />
            </div>
          </div>
          {areas ? (
            <p data-testid="dft-areas">
              <strong className="figures">{areas.areas}</strong> area{areas.areas === 1 ? "" : "s"}, <strong className="figures">{areas.spots}</strong> spots, at least <strong className="figures">{areas.readings}</strong> gauge readings.
            </p>
          ) : (
            <p className="text-sm text-graphite-700">Under 30 m² (300 ft²): every 10 m² (100 ft²); 30–100 m²: 3 areas; beyond: 3 plus one per further 100 m² (1,000 ft²).</p>
          )}
        </section>
      </section>
    </div>
  );
}
