"use client";
import { useMemo, useState } from "react";
import { FixList, Segmented, SelectField, TextField } from "@/components/calc/fields";
import { Figure } from "@/components/calc/figure";
import { HeatTintGauge } from "@/components/calc/heat-tint-gauge";
import { useTouched } from "@/components/calc/use-touched";
import { fieldErrors, figure, numberText, type FieldErrors, type UnitSystem } from "@/components/calc/values";
import { heatInput, passHeatInput, PROCESS_INFO, PROCESSES, type WeldingProcess } from "@/lib/welding";
import { heatInputRequestSchema, passHeatInputRequestSchema } from "@/lib/welding/schema";

type Method = "arc" | "power" | "energy";

type State = {
  method: Method;
  process: WeldingProcess;
  volts: string;
  amps: string;
  speed: string;
  speedUnit: "mm/min" | "in/min";
  powerW: string;
  energyJ: string;
  arcTimeS: string;
  bead: string;
  beadUnit: "mm" | "in";
};

type Out = { jPerIn: number; arcEnergyKJPerMm: number; heatInputKJPerMm: number | null; k: number | null; clause: string; travelSpeedMmPerMin: number | null };

const LABELS: Record<string, string> = {
  process: "Process",
  volts: "Arc voltage",
  amps: "Current",
  speed: "Travel speed",
  speedUnit: "Travel speed unit",
  powerW: "Average power",
  energyJ: "Arc energy",
  arcTimeS: "Arc time",
  bead: "Bead length",
  _: "Input",
};

// Computes in the browser with lib/welding (pure), through the same zod schemas as POST /api/calc/heat-input.
function compute(s: State): { ok: true; out: Out } | { ok: false; errors: FieldErrors } {
  const errors: FieldErrors = {};
  const num = (key: keyof State, label: string): number => {
    const r = numberText(label).safeParse(s[key]);
    if (r.success) return r.data;
    errors[key] ??= fieldErrors(r.error.issues)._ ?? "Check this value.";
    return Number.NaN;
  };
  if (s.method === "arc") {
    const body = { process: s.process, volts: num("volts", "the arc voltage"), amps: num("amps", "the current"), travelSpeed: { value: num("speed", "the travel speed"), unit: s.speedUnit } };
    const r = heatInputRequestSchema.safeParse(body);
    if (!r.success) for (const [k, m] of Object.entries(fieldErrors(r.error.issues, (p) => (p === "travelSpeed.value" ? "speed" : p === "travelSpeed.unit" ? "speedUnit" : p)))) errors[k] ??= m;
    if (Object.keys(errors).length || !r.success) return { ok: false, errors };
    const h = heatInput(r.data);
    return { ok: true, out: { jPerIn: h.jPerIn, arcEnergyKJPerMm: h.arcEnergyKJPerMm, heatInputKJPerMm: h.heatInputKJPerMm, k: h.efficiencyFactor, clause: "ASME IX QW-409.1(a)", travelSpeedMmPerMin: r.data.travelSpeed.unit === "in/min" ? r.data.travelSpeed.value * 25.4 : r.data.travelSpeed.value } };
  }
  const bead = { value: num("bead", "the bead length"), unit: s.beadUnit };
  const body =
    s.method === "power"
      ? { method: "power" as const, process: s.process, powerW: num("powerW", "the average power"), arcTimeS: num("arcTimeS", "the arc time"), beadLength: bead }
      : { method: "energy" as const, process: s.process, energyJ: num("energyJ", "the arc energy"), beadLength: bead, ...(s.arcTimeS.trim() ? { arcTimeS: num("arcTimeS", "the arc time") } : {}) };
  const r = passHeatInputRequestSchema.safeParse(body);
  if (!r.success) for (const [k, m] of Object.entries(fieldErrors(r.error.issues, (p) => (p.startsWith("beadLength") ? "bead" : p)))) errors[k] ??= m;
  if (Object.keys(errors).length || !r.success) return { ok: false, errors };
  const h = passHeatInput(r.data);
  return { ok: true, out: { jPerIn: h.jPerIn, arcEnergyKJPerMm: h.arcEnergyKJPerMm, heatInputKJPerMm: h.heatInputKJPerMm, k: h.efficiencyFactor, clause: h.clause, travelSpeedMmPerMin: h.travelSpeedMmPerMin } };
}

const blank = (units: UnitSystem): State => ({
  method: "arc",
  process: "GMAW",
  volts: "",
  amps: "",
  speed: "",
  speedUnit: units === "imperial" ? "in/min" : "mm/min",
  powerW: "",
  energyJ: "",
  arcTimeS: "",
  bead: "",
  beadUnit: units === "imperial" ? "in" : "mm",
});

export function HeatInputCalculator({ initialUnits }: { initialUnits: UnitSystem }) {
  const [s, setS] = useState<State>(() => blank(initialUnits));
  const { touch, reset, visible } = useTouched();
  const result = useMemo(() => compute(s), [s]);
  const errors = result.ok ? {} : result.errors;
  const set = (patch: Partial<State>) => setS((v) => ({ ...v, ...patch }));
  const field = (key: keyof State, label: string, unit: string, hint?: React.ReactNode) => (
    <TextField
      id={`hi-${key}`}
      testId={`hi-${key}`}
      label={label}
      unit={unit}
      value={s[key] as string}
      onChange={(v) => set({ [key]: v } as Partial<State>)}
      onBlur={() => touch(key)}
      error={visible(errors, key, s[key] as string)}
      hint={hint}
    />
  );
  const out = result.ok ? result.out : null;
  const anyTyped = [s.volts, s.amps, s.speed, s.powerW, s.energyJ, s.arcTimeS, s.bead].some((v) => v.trim() !== "");
  const imperialFirst = initialUnits === "imperial";

  const asme = (
    <Figure
      size="lg"
      label={`ASME IX ${out?.clause.replace("ASME IX ", "") ?? "QW-409.1"}`}
      value={out ? figure(out.jPerIn, 0) : "—"}
      unit="J/in"
      testId="hi-j-per-in"
      source={out ? `= ${figure(out.jPerIn / 1000, 2)} kJ/in · no efficiency factor` : "V × A × 60 / travel speed (in/min)"}
    />
  );
  const iso = (
    <>
      <Figure
        size="lg"
        label="ISO/TR 17671-1 heat input Q"
        value={out?.heatInputKJPerMm != null ? figure(out.heatInputKJPerMm, 3) : "—"}
        unit="kJ/mm"
        testId="hi-q"
        source={out?.k != null ? `k = ${figure(out.k, 1)} for ${s.process} × arc energy` : "k × U × I / v × 10⁻³"}
      />
      <Figure
        label="ISO/TR 17671-1 arc energy"
        value={out ? figure(out.arcEnergyKJPerMm, 3) : "—"}
        unit="kJ/mm"
        testId="hi-arc-energy"
        source="U × I / v × 10⁻³, v in mm/s: the ASME figure in SI"
      />
    </>
  );

  return (
    <div className="grid gap-6 xl:grid-cols-[minmax(0,24rem)_minmax(0,1fr)]">
      <form className="card space-y-4 p-4" onSubmit={(e) => e.preventDefault()} aria-label="Heat input inputs" noValidate>
        <Segmented
          legend="How the pass was measured"
          value={s.method}
          onChange={(method) => set({ method })}
          testId="hi-method"
          options={[
            { value: "arc", label: "V × A × speed" },
            { value: "power", label: "Power × time" },
            { value: "energy", label: "Energy" },
          ]}
        />
        <p className="text-sm text-graphite-700">
          {s.method === "arc"
            ? "QW-409.1(a): arc voltage and current from the meters, travel speed from a timed bead."
            : s.method === "power"
              ? "QW-409.1(c)(2): average instantaneous power from a waveform-capable source, × arc time / bead length. Use (b) or (c) for waveform-controlled welding."
              : "QW-409.1(c)(1): total instantaneous energy the source reports for the bead / bead length."}
        </p>
        <SelectField
          label="Process"
          testId="hi-process"
          value={s.process}
          onChange={(process) => set({ process })}
          options={PROCESSES.map((p) => ({ value: p, label: `${p} (${PROCESS_INFO[p].iso4063.join("/")}) · k ${figure(PROCESS_INFO[p].efficiencyFactor, 1)}` }))}
          hint={PROCESS_INFO[s.process].name}
        />
        {s.method === "arc" ? (
          <>
            <div className="grid grid-cols-2 gap-x-3">
              {field("volts", "Arc voltage", "V")}
              {field("amps", "Current", "A")}
            </div>
            <div className="grid grid-cols-[minmax(0,1fr)_auto] items-start gap-x-3">
              {field("speed", "Travel speed", s.speedUnit)}
              <div className="pt-6">
                <Segmented legend="Travel speed unit" hideLegend testId="hi-speed-unit" value={s.speedUnit} onChange={(speedUnit) => set({ speedUnit })} options={[{ value: "in/min", label: "in/min" }, { value: "mm/min", label: "mm/min" }]} />
              </div>
            </div>
          </>
        ) : (
          <>
            <div className="grid grid-cols-2 gap-x-3">
              {s.method === "power" ? field("powerW", "Average power", "W") : field("energyJ", "Arc energy", "J")}
              {field("arcTimeS", s.method === "energy" ? "Arc time (optional)" : "Arc time", "s")}
            </div>
            <div className="grid grid-cols-[minmax(0,1fr)_auto] items-start gap-x-3">
              {field("bead", "Bead length", s.beadUnit)}
              <div className="pt-6">
                <Segmented legend="Bead length unit" hideLegend value={s.beadUnit} onChange={(beadUnit) => set({ beadUnit })} options={[{ value: "in", label: "in" }, { value: "mm", label: "mm" }]} />
              </div>
            </div>
          </>
        )}
        <div className="flex flex-wrap gap-2">
          <button
            type="button"
            className="btn btn-quiet"
            onClick={() => setS({ ...blank(initialUnits), method: "arc", process: "GMAW", volts: "24", amps: "180", speed: "8", speedUnit: "in/min" })}
          >
            Worked example
          </button>
          <button type="button" className="btn btn-quiet" onClick={() => { setS(blank(initialUnits)); reset(); }}>Clear</button>
        </div>
      </form>

      <section className="min-w-0 space-y-4" aria-labelledby="hi-results-h">
        <h2 id="hi-results-h" className="text-lg font-bold">Heat input of the pass</h2>
        {!result.ok && anyTyped ? (
          <FixList testId="hi-fix-list" items={Object.entries(errors).map(([key, message]) => ({ id: `hi-${key}`, label: LABELS[key] ?? key, message }))} />
        ) : null}
        <dl className="grid gap-3 sm:grid-cols-2 2xl:grid-cols-3" data-testid="hi-results" aria-live="polite">
          {imperialFirst ? <>{asme}{iso}</> : <>{iso}{asme}</>}
          {out?.travelSpeedMmPerMin != null ? (
            <Figure
              label="Travel speed"
              value={`${figure(out.travelSpeedMmPerMin, 1)} mm/min`}
              source={`${figure(out.travelSpeedMmPerMin / 25.4, 2)} in/min · ${figure(out.travelSpeedMmPerMin / 60, 2)} mm/s`}
            />
          ) : null}
        </dl>
        <HeatTintGauge
          value={out ? (out.heatInputKJPerMm ?? out.arcEnergyKJPerMm) : null}
          basis={out?.heatInputKJPerMm != null ? "Pointer: ISO/TR 17671-1 heat input Q (k applied)." : "Pointer: arc energy (no k)."}
        />
        <p className="text-sm text-graphite-700">
          ASME IX reports heat input per inch with no efficiency factor; EN ISO 15614-1 WPSs usually state Q with k. Compare each with the WPS on its own basis.
        </p>
      </section>
    </div>
  );
}
