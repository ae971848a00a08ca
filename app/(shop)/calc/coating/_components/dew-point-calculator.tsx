"use client";
import { useMemo, useState } from "react";
import { FixList, Segmented, TextField } from "@/components/calc/fields";
import { Figure } from "@/components/calc/figure";
import { useTouched } from "@/components/calc/use-touched";
import { convertText, fieldErrors, figure, numberText, optionalNumberText, quantityText, shown, symbolFor, trimNumber, type FieldErrors, type UnitSystem } from "@/components/calc/values";
import { StatusBadge } from "@/components/status-badge";
import { checkDewPoint, DEFAULT_REQUIRED_MARGIN_C, MAGNUS_VALID_RANGE_C, RH_WARNING_ABOVE_PCT, type DewPointResult, type MagnusCoefficients } from "@/lib/coating";
import { dewPointRequestSchema } from "@/lib/coating/schemas";
import { preferredUnit } from "@/lib/units";

type State = { units: UnitSystem; air: string; rh: string; surface: string; margin: string; coefficients: MagnusCoefficients };

const LABELS: Record<string, string> = { air: "Air temperature", rh: "Relative humidity", surface: "Steel surface temperature", margin: "Required margin", _: "Input" };
const PATH: Record<string, string> = { airTempC: "air", relativeHumidity: "rh", surfaceTempC: "surface", requiredMarginC: "margin" };
const T = { metric: 1, imperial: 1 } as const;
/** A temperature difference: °F steps are 1/1.8 of a °C step (no 32 offset). */
const DELTA_PER_C = { metric: 1, imperial: 1.8 } as const;

// Computes in the browser with lib/coating checkDewPoint (pure), through the schema of POST /api/calc/dew-point.
function compute(s: State): { ok: true; result: DewPointResult } | { ok: false; errors: FieldErrors } {
  const errors: FieldErrors = {};
  const unit = preferredUnit("temperature", s.units);
  const read = (key: string, r: { success: true; data: number | undefined } | { success: false; error: { issues: Parameters<typeof fieldErrors>[0] } }) => {
    if (r.success) return r.data;
    errors[key] ??= fieldErrors(r.error.issues)._ ?? "Check this value.";
    return Number.NaN;
  };
  const airTempC = read("air", quantityText("temperature", unit, "the air temperature").safeParse(s.air)) as number;
  const relativeHumidity = read("rh", numberText("the relative humidity").safeParse(s.rh.replace(/\s*%\s*$/, ""))) as number;
  const surfaceTempC = read("surface", quantityText("temperature", unit, "the steel temperature").safeParse(s.surface)) as number;
  const marginDelta = read("margin", optionalNumberText("the required margin").safeParse(s.margin)) as number | undefined;
  const body = {
    airTempC,
    relativeHumidity,
    surfaceTempC,
    ...(marginDelta !== undefined ? { requiredMarginC: marginDelta / DELTA_PER_C[s.units] } : {}),
  };
  const r = dewPointRequestSchema.safeParse(body);
  if (!r.success) for (const [k, m] of Object.entries(fieldErrors(r.error.issues, (p) => PATH[p] ?? p))) errors[k] ??= words(m, s.units);
  if (Object.keys(errors).length || !r.success) return { ok: false, errors };
  return { ok: true, result: checkDewPoint({ ...r.data, coefficients: s.coefficients }) };
}

/** Dew point, the required line and the steel on one temperature scale, each with its own mark shape. */
function MarginScale({ r, units }: { r: DewPointResult; units: UnitSystem }) {
  const need = r.dewPointC + r.requiredMarginC;
  const lo = Math.min(r.dewPointC, r.dewPointC + r.marginC) - 4;
  const hi = Math.max(need, r.dewPointC + r.marginC) + 4;
  const W = 600;
  const x = (c: number) => 16 + ((c - lo) / (hi - lo)) * (W - 32);
  const steel = r.dewPointC + r.marginC;
  return (
    <figure className="rounded-md border-2 border-graphite-200 bg-white p-3" data-testid="dp-scale">
      <figcaption className="text-sm font-bold">Steel against the dew point</figcaption>
      <svg viewBox={`0 0 ${W} 92`} className="mt-1 h-auto w-full" role="img" aria-label={`Dew point ${shown("temperature", r.dewPointC, units, T)}, coating needs ${shown("temperature", need, units, T)} or warmer, steel at ${shown("temperature", steel, units, T)}`}>
        <rect x={x(lo)} y={34} width={x(need) - x(lo)} height={14} fill="url(#dp-hatch)" stroke="#171b1a" />
        <rect x={x(need)} y={34} width={x(hi) - x(need)} height={14} fill="#ffffff" stroke="#171b1a" />
        <defs>
          <pattern id="dp-hatch" width={8} height={8} patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
            <line x1={0} y1={0} x2={0} y2={8} stroke="#58605d" strokeWidth={3} />
          </pattern>
        </defs>
        {/* dew point: a drop */}
        <path d={`M${x(r.dewPointC)} 16 q6 9 0 14 q-6 -5 0 -14 Z`} fill="#171b1a" />
        <text x={x(r.dewPointC)} y={66} textAnchor="middle" fontSize={13} fill="#171b1a">dew point</text>
        {/* required: a bar */}
        <line x1={x(need)} y1={26} x2={x(need)} y2={56} stroke="#171b1a" strokeWidth={3} />
        <text x={x(need)} y={84} textAnchor="middle" fontSize={13} fill="#171b1a">+{trimNumber(r.requiredMarginC * DELTA_PER_C[units], 1)} {units === "imperial" ? "°F" : "°C"} needed</text>
        {/* steel: a triangle pointing at it */}
        <path d={`M${x(steel) - 9} 6 L${x(steel) + 9} 6 L${x(steel)} 30 Z`} fill={r.ok ? "#aec22b" : "#ffffff"} stroke="#171b1a" strokeWidth={2} />
        <text x={x(steel)} y={66} dy={r.ok ? 0 : 18} textAnchor="middle" fontSize={13} fontWeight={700} fill="#171b1a">steel</text>
      </svg>
      <p className="text-xs text-graphite-700">Hatched: too close to the dew point to coat.</p>
    </figure>
  );
}

function start(units: UnitSystem): State {
  return units === "imperial"
    ? { units, air: "68", rh: "50", surface: "55", margin: "", coefficients: "alduchov-eskridge-1996" }
    : { units, air: "20", rh: "50", surface: "13", margin: "", coefficients: "alduchov-eskridge-1996" };
}

export function DewPointCalculator({ initialUnits }: { initialUnits: UnitSystem }) {
  const [s, setS] = useState<State>(() => start(initialUnits));
  const { touch, visible } = useTouched();
  const out = useMemo(() => compute(s), [s]);
  const errors = out.ok ? {} : out.errors;
  const set = (patch: Partial<State>) => setS((v) => ({ ...v, ...patch }));
  const u = s.units;
  const tSym = symbolFor("temperature", u);
  const dSym = u === "imperial" ? "°F" : "°C";
  const field = (key: "air" | "rh" | "surface" | "margin", label: string, unit: string, hint?: React.ReactNode) => (
    <TextField id={`dp-${key}`} testId={`dp-${key}`} label={label} unit={unit} inputMode="text" value={s[key]} onChange={(v) => set({ [key]: v })} onBlur={() => touch(key)} error={visible(errors, key, s[key])} hint={hint} />
  );
  const switchUnits = (to: UnitSystem) =>
    setS((v) => {
      const m = readMargin(v.margin);
      return {
        ...v,
        units: to,
        air: convertText(v.air, "temperature", v.units, to, T),
        surface: convertText(v.surface, "temperature", v.units, to, T),
        margin: m === null ? v.margin : trimNumber((m / DELTA_PER_C[v.units]) * DELTA_PER_C[to], 2),
      };
    });
  const r = out.ok ? out.result : null;
  const outOfFit = r?.warnings.some((w) => w.includes("Magnus fit")) ?? false;

  return (
    <div className="grid gap-6 xl:grid-cols-[minmax(0,24rem)_minmax(0,1fr)]">
      <form className="card space-y-3 p-4" onSubmit={(e) => e.preventDefault()} aria-label="Coating conditions inputs" noValidate>
        <Segmented legend="Units" value={u} onChange={switchUnits} testId="dp-units" options={[{ value: "metric", label: "°C" }, { value: "imperial", label: "°F" }]} />
        {field("air", "Air temperature", tSym)}
        {field("rh", "Relative humidity", "%", `above ${RH_WARNING_ABOVE_PCT} % is flagged`)}
        {field("surface", "Steel surface temperature", tSym, "contact thermometer on the part to be coated")}
        {field("margin", "Required margin above the dew point", dSym, `blank: ${trimNumber(DEFAULT_REQUIRED_MARGIN_C * DELTA_PER_C[u], 1)} ${dSym} (the 3 °C rule), or the coating's data sheet`)}
        <Segmented
          legend="Magnus coefficients"
          value={s.coefficients}
          onChange={(coefficients) => set({ coefficients })}
          options={[
            { value: "alduchov-eskridge-1996", label: "Alduchov & Eskridge 1996" },
            { value: "sonntag-1990", label: "Sonntag 1990" },
          ]}
        />
      </form>
      <section className="min-w-0 space-y-4" aria-labelledby="dp-results-h">
        <h2 id="dp-results-h" className="text-lg font-bold">May the steel be coated?</h2>
        {!out.ok ? <FixList testId="dp-fix-list" items={Object.entries(errors).map(([key, message]) => ({ id: `dp-${key}`, label: LABELS[key] ?? key, message }))} /> : null}
        {r ? (
          <>
            <div className="flex flex-wrap gap-2" data-testid="dp-verdicts">
              {r.ok ? (
                <StatusBadge tone="pass" testId="dp-verdict">Go: steel {shown("temperature", r.dewPointC + r.marginC, u, T)} is {trimNumber(r.marginC * DELTA_PER_C[u], 1)} {dSym} above the dew point</StatusBadge>
              ) : (
                <StatusBadge tone="fail" testId="dp-verdict">Hold: steel only {trimNumber(r.marginC * DELTA_PER_C[u], 1)} {dSym} above the dew point; {trimNumber(r.requiredMarginC * DELTA_PER_C[u], 1)} {dSym} needed</StatusBadge>
              )}
              {r.rhWarning ? <StatusBadge tone="warn" testId="dp-rh-warning">Humidity above {RH_WARNING_ABOVE_PCT} %: check the data sheet before coating</StatusBadge> : null}
              {outOfFit ? <StatusBadge tone="warn">Air outside {MAGNUS_VALID_RANGE_C.min}…{MAGNUS_VALID_RANGE_C.max} °C: the Magnus fit is less accurate</StatusBadge> : null}
            </div>
            <dl className="grid gap-3 sm:grid-cols-3">
              <Figure size="lg" label="Dew point" value={figure(fromC(r.dewPointC, u), 1)} unit={tSym} testId="dp-dew-point" source={r.coefficients === "sonntag-1990" ? "Magnus, Sonntag 1990: a 17.62, b 243.12 °C" : "Magnus, Alduchov & Eskridge 1996: a 17.625, b 243.04 °C"} />
              <Figure size="lg" label="Margin (steel − dew point)" value={figure(r.marginC * DELTA_PER_C[u], 1, { sign: true })} unit={dSym} testId="dp-margin" />
              <Figure label="Coat only at or above" value={figure(fromC(r.dewPointC + r.requiredMarginC, u), 1)} unit={tSym} source="dew point + required margin" />
            </dl>
            <MarginScale r={r} units={u} />
          </>
        ) : null}
        <p className="text-sm text-graphite-700">
          Steel at least 3 °C (5 °F) above the dew point before coating; relative humidity commonly at most 85 % (ISO 8502-4 / ISO 12944-7, via secondary sources). Measure at the part, not the doorway.
        </p>
      </section>
    </div>
  );
}

/** The schema names its fields as the API spells them; on screen they are words, limits in °C said so. */
function words(message: string, units: UnitSystem): string {
  const named = message
    .replace(/^AirTempC|airTempC/, "Air temperature")
    .replace(/^RelativeHumidity|relativeHumidity/, "Relative humidity")
    .replace(/^SurfaceTempC|surfaceTempC/, "Surface temperature")
    .replace(/^RequiredMarginC|requiredMarginC/, "Required margin");
  return units === "imperial" && /°C/.test(named) ? `${named} (limits are in °C)` : named;
}

function fromC(c: number, units: UnitSystem): number {
  return units === "imperial" ? c * 1.8 + 32 : c;
}

function readMargin(text: string): number | null {
  const r = optionalNumberText("margin").safeParse(text);
  return r.success && r.data !== undefined ? r.data : null;
}
