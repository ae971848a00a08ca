"use client";
// Coating conditions and dry film thickness. Conditions gate the step: the surface must be the step's margin
// above the dew point (Magnus, lib/coating). DFT: 5 spots of 3 gauge readings, judged per SSPC-PA 2.
import { useState } from "react";
import { checkDewPoint, evaluateDftArea, MIN_READINGS_PER_SPOT, SPOTS_PER_AREA } from "@/lib/coating";
import type { Step } from "@/lib/procedures/schema";
import { defaultPadUnit, isPadUnit, show, symbolOf } from "@/lib/jobs/units";
import type { CoatingValue } from "@/lib/jobs/values";
import { applyKey, NumberPad, PadField, UnitSwitch } from "./number-pad";
import { initialText, storedFrom } from "./pad-state";
import { Pill, VerdictBox } from "./verdict";

type Coating = Extract<Step, { kind: "coating" }>;
type FieldId = "air" | "rh" | "surface" | `dft-${number}-${number}`;

export function CoatingControl({ spec, value, readOnly, unitSystem, onChange }: { spec: Coating; value: CoatingValue; readOnly: boolean; unitSystem: "metric" | "imperial"; onChange: (v: CoatingValue) => void }) {
  const [tempUnit, setTempUnit] = useState(value.tempUnit && isPadUnit("temperature", value.tempUnit) ? value.tempUnit : defaultPadUnit("temperature", unitSystem));
  const [dftUnit, setDftUnit] = useState(value.dftUnit && isPadUnit("thickness", value.dftUnit) ? value.dftUnit : defaultPadUnit("thickness", unitSystem));
  const [texts, setTexts] = useState<Record<string, string>>(() => {
    const t: Record<string, string> = {
      air: initialText(value.airTempC, { quantity: "temperature", unit: tempUnit }),
      rh: initialText(value.relativeHumidity, { quantity: null, unit: "%" }),
      surface: initialText(value.surfaceTempC, { quantity: "temperature", unit: tempUnit }),
    };
    for (let s = 0; s < SPOTS_PER_AREA; s++) for (let r = 0; r < MIN_READINGS_PER_SPOT; r++) t[`dft-${s}-${r}`] = initialText(value.dftSpots?.[s]?.[r], { quantity: "thickness", unit: dftUnit });
    return t;
  });
  const [active, setActive] = useState<FieldId>("air");

  const build = (t: Record<string, string>, tu: string, du: string): CoatingValue => {
    const spots: number[][] = [];
    for (let s = 0; s < SPOTS_PER_AREA; s++) {
      const readings: number[] = [];
      for (let r = 0; r < MIN_READINGS_PER_SPOT; r++) {
        const v = storedFrom(t[`dft-${s}-${r}`] ?? "", { quantity: "thickness", unit: du });
        if (v !== undefined) readings.push(v);
      }
      spots.push(readings);
    }
    return {
      ...value,
      airTempC: storedFrom(t.air ?? "", { quantity: "temperature", unit: tu }),
      relativeHumidity: storedFrom(t.rh ?? "", { quantity: null, unit: "%" }),
      surfaceTempC: storedFrom(t.surface ?? "", { quantity: "temperature", unit: tu }),
      dftSpots: spots,
      tempUnit: tu,
      dftUnit: du,
    };
  };
  const setText = (id: string, text: string) => {
    const next = { ...texts, [id]: text };
    setTexts(next);
    onChange(build(next, tempUnit, dftUnit));
  };
  const current = build(texts, tempUnit, dftUnit);
  let dew: ReturnType<typeof checkDewPoint> | null = null;
  if (current.airTempC !== undefined && current.surfaceTempC !== undefined && current.relativeHumidity !== undefined && current.relativeHumidity > 0 && current.relativeHumidity <= 100) {
    dew = checkDewPoint({ airTempC: current.airTempC, relativeHumidity: current.relativeHumidity, surfaceTempC: current.surfaceTempC, requiredMarginC: spec.dewPointMarginC });
  }
  const complete = (current.dftSpots ?? []).filter((s) => s.length >= MIN_READINGS_PER_SPOT);
  const area = complete.length === SPOTS_PER_AREA ? evaluateDftArea({ specMin: spec.dftMinUm, specMax: spec.dftMaxUm }, complete) : null;
  const spotLimits = { min: (spec.dftMinUm * 80) / 100, max: (spec.dftMaxUm * 120) / 100 };
  const activeIsTemp = active === "air" || active === "surface";
  const activeIsDft = active.startsWith("dft");

  return (
    <div className={readOnly ? "space-y-3" : "grid gap-4 md:grid-cols-[minmax(0,1fr)_18rem]"}>
      <div className="space-y-4">
        <p className="text-graphite-950">
          {spec.product} over {spec.surfacePrep}. DFT {show("thickness", spec.dftMinUm, dftUnit)} to {show("thickness", spec.dftMaxUm, dftUnit)}; surface at least {spec.dewPointMarginC} °C above the dew point.
        </p>
        <fieldset className="space-y-2">
          <legend className="text-lg font-bold">Conditions now</legend>
          <div className="grid gap-3 sm:grid-cols-3">
            <PadField id="coat-air" label="Air" text={texts.air ?? ""} unitSymbol={symbolOf("temperature", tempUnit)} active={!readOnly && active === "air"} onActivate={() => setActive("air")} onText={readOnly ? undefined : (t) => setText("air", t)} disabled={readOnly} />
            <PadField id="coat-rh" label="Humidity (RH)" text={texts.rh ?? ""} unitSymbol="%" active={!readOnly && active === "rh"} onActivate={() => setActive("rh")} onText={readOnly ? undefined : (t) => setText("rh", t)} disabled={readOnly} />
            <PadField id="coat-surface" label="Steel surface" text={texts.surface ?? ""} unitSymbol={symbolOf("temperature", tempUnit)} active={!readOnly && active === "surface"} onActivate={() => setActive("surface")} onText={readOnly ? undefined : (t) => setText("surface", t)} disabled={readOnly} />
          </div>
          {!readOnly ? <UnitSwitch quantity="temperature" unit={tempUnit} label="Temperatures" onUnit={(u) => { setTempUnit(u); onChange(build(texts, u, dftUnit)); }} /> : null}
          {dew ? (
            <VerdictBox tone={dew.ok ? "pass" : "fail"} title={dew.ok ? "Conditions suit coating" : "Conditions fail: do not coat"} testId="dew-point-verdict">
              Dew point <span className="figures">{show("temperature", dew.dewPointC, tempUnit)}</span>; the surface is{" "}
              <span className="figures">{(dew.marginC * (tempUnit === "degF" ? 1.8 : 1)).toFixed(1)} {tempUnit === "degF" ? "°F" : "°C"}</span> above it (needs {spec.dewPointMarginC} °C).
              {dew.rhWarning ? " Relative humidity is above 85 %." : ""}
            </VerdictBox>
          ) : (
            <VerdictBox tone="idle" title="Enter air, humidity and surface readings" testId="dew-point-verdict" />
          )}
        </fieldset>
        <fieldset className="space-y-2">
          <legend className="text-lg font-bold">Dry film thickness: {SPOTS_PER_AREA} spots of {MIN_READINGS_PER_SPOT} readings</legend>
          <table className="w-full border-separate border-spacing-2">
            <thead>
              <tr className="text-left text-sm">
                <th scope="col">Spot</th>
                {Array.from({ length: MIN_READINGS_PER_SPOT }, (_, r) => <th key={r} scope="col">Reading {r + 1}</th>)}
                <th scope="col">Average</th>
              </tr>
            </thead>
            <tbody>
              {Array.from({ length: SPOTS_PER_AREA }, (_, s) => {
                const readings = current.dftSpots?.[s] ?? [];
                const avg = readings.length >= MIN_READINGS_PER_SPOT ? readings.reduce((a, b) => a + b, 0) / readings.length : null;
                const ok = avg === null ? null : avg >= spotLimits.min - 1e-9 && avg <= spotLimits.max + 1e-9;
                return (
                  <tr key={s}>
                    <th scope="row" className="figures text-lg">{s + 1}</th>
                    {Array.from({ length: MIN_READINGS_PER_SPOT }, (_, r) => {
                      const id = `dft-${s}-${r}` as const;
                      return (
                        <td key={r}>
                          <button
                            type="button"
                            disabled={readOnly}
                            aria-label={`Spot ${s + 1} reading ${r + 1}`}
                            aria-pressed={active === id}
                            onClick={() => setActive(id)}
                            data-testid={id}
                            className={`figures min-h-12 w-full rounded-md border-2 px-2 text-right text-lg font-semibold ${!readOnly && active === id ? "border-graphite-950 ring-4 ring-primer-400" : "border-graphite-500"} bg-white`}
                          >
                            {texts[id] || "—"}
                          </button>
                        </td>
                      );
                    })}
                    <td className="figures whitespace-nowrap">
                      {avg === null ? "—" : <Pill tone={ok ? "pass" : "fail"}>{show("thickness", avg, dftUnit)}</Pill>}
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
          {!readOnly ? <UnitSwitch quantity="thickness" unit={dftUnit} label="DFT readings" onUnit={(u) => { setDftUnit(u); onChange(build(texts, tempUnit, u)); }} /> : null}
          {area ? (
            <VerdictBox tone={area.ok ? "pass" : "fail"} title={area.ok ? "DFT conforms (SSPC-PA 2)" : "DFT does not conform (SSPC-PA 2)"} testId="dft-verdict">
              Area average <span className="figures">{show("thickness", area.areaAverage, dftUnit)}</span>; spots within{" "}
              <span className="figures">{show("thickness", area.spotLimits.min, dftUnit)}–{show("thickness", area.spotLimits.max, dftUnit)}</span>
              {area.ok ? "." : `: ${area.warnings.join(" ")}`}
            </VerdictBox>
          ) : (
            <VerdictBox tone="idle" title={`${complete.length} of ${SPOTS_PER_AREA} spots complete`} testId="dft-verdict" />
          )}
        </fieldset>
      </div>
      {!readOnly ? (
        <div className="md:sticky md:top-28 md:self-start">
          <p className="mb-2 text-sm font-semibold text-graphite-900">Typing into: {active === "air" ? "air temperature" : active === "rh" ? "relative humidity" : active === "surface" ? "surface temperature" : `spot ${Number(active.split("-")[1]) + 1}, reading ${Number(active.split("-")[2]) + 1}`}</p>
          <NumberPad negative={activeIsTemp} decimals onKey={(k) => setText(active, applyKey(texts[active] ?? "", k, { negative: activeIsTemp && !activeIsDft }))} />
          <button
            type="button"
            className="btn btn-quiet mt-2 min-h-14 w-full text-lg"
            onClick={() => {
              const order: FieldId[] = ["air", "rh", "surface", ...Array.from({ length: SPOTS_PER_AREA * MIN_READINGS_PER_SPOT }, (_, i) => `dft-${Math.floor(i / MIN_READINGS_PER_SPOT)}-${i % MIN_READINGS_PER_SPOT}` as FieldId)];
              const i = order.indexOf(active);
              setActive(order[(i + 1) % order.length]!);
            }}
          >
            Next field →
          </button>
        </div>
      ) : null}
    </div>
  );
}
