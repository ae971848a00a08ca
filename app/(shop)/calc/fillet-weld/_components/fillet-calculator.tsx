"use client";
import { useMemo, useState } from "react";
import { Checkbox, FixList, Segmented, SelectField, TextField } from "@/components/calc/fields";
import { Figure } from "@/components/calc/figure";
import { useTouched } from "@/components/calc/use-touched";
import { convertText, fieldErrors, figure, numberText, optionalQuantityText, quantityText, shown, symbolFor, type FieldErrors, type UnitSystem } from "@/components/calc/values";
import { StatusBadge } from "@/components/status-badge";
import { preferredUnit } from "@/lib/units";
import { ELECTRODE_CLASSES, filletWeld, KN_PER_KIP, MM_PER_IN, mpaToKsi, type ElectrodeClass, type FilletWeldResult } from "@/lib/welding";
import { filletWeldRequestSchema } from "@/lib/welding/schema";

type State = {
  units: UnitSystem;
  leg: string;
  length: string;
  electrode: ElectrodeClass;
  angle: string;
  directional: boolean;
  method: "LRFD" | "ASD";
  thinner: string;
  thicker: string;
  sizeSystem: "in" | "mm";
  load: string;
};

const LABELS: Record<string, string> = {
  leg: "Leg size",
  length: "Weld length",
  electrode: "Filler metal",
  angle: "Load angle",
  thinner: "Thinner part",
  thicker: "Thicker part",
  load: "Load",
  _: "Input",
};

const PATH_TO_FIELD: Record<string, string> = {
  legMm: "leg",
  lengthMm: "length",
  electrodeClass: "electrode",
  electrodeMPa: "electrode",
  angleDeg: "angle",
  thinnerPartMm: "thinner",
  thickerPartMm: "thicker",
  loadKN: "load",
};

const LEN = { metric: 2, imperial: 4 } as const;

// Computes in the browser with lib/welding filletWeld (pure), through the schema of POST /api/calc/fillet-weld.
function compute(s: State): { ok: true; result: FilletWeldResult; legMm: number; lengthMm: number } | { ok: false; errors: FieldErrors } {
  const errors: FieldErrors = {};
  const lenUnit = preferredUnit("length", s.units);
  const read = <T,>(key: string, r: { success: true; data: T } | { success: false; error: { issues: Parameters<typeof fieldErrors>[0] } }): T | number => {
    if (r.success) return r.data;
    errors[key] ??= fieldErrors(r.error.issues)._ ?? "Check this value.";
    return Number.NaN;
  };
  const legMm = read("leg", quantityText("length", lenUnit, "the leg size").safeParse(s.leg)) as number;
  const lengthMm = read("length", quantityText("length", lenUnit, "the weld length").safeParse(s.length)) as number;
  const angleDeg = read("angle", numberText("the load angle").safeParse(s.angle)) as number;
  const thinnerPartMm = read("thinner", optionalQuantityText("length", lenUnit).safeParse(s.thinner)) as number | undefined;
  const thickerPartMm = read("thicker", optionalQuantityText("length", lenUnit).safeParse(s.thicker)) as number | undefined;
  const loadKN = read("load", optionalQuantityText("force", preferredUnit("force", s.units)).safeParse(s.load)) as number | undefined;
  const body = {
    legMm,
    lengthMm,
    electrodeClass: s.electrode,
    angleDeg,
    directionalIncrease: s.directional,
    method: s.method,
    sizeSystem: s.sizeSystem,
    ...(thinnerPartMm !== undefined ? { thinnerPartMm } : {}),
    ...(thickerPartMm !== undefined ? { thickerPartMm } : {}),
    ...(loadKN !== undefined ? { loadKN } : {}),
  };
  const r = filletWeldRequestSchema.safeParse(body);
  if (!r.success) for (const [k, m] of Object.entries(fieldErrors(r.error.issues, (p) => PATH_TO_FIELD[p] ?? p))) errors[k] ??= m;
  if (Object.keys(errors).length || !r.success) return { ok: false, errors };
  return { ok: true, result: filletWeld(r.data), legMm: r.data.legMm, lengthMm: r.data.lengthMm };
}

function example(units: UnitSystem): State {
  // REFERENCES.md worked example: 1/4 in E70 fillet, 3 in long, loaded along its axis, LRFD; on a 3/8 in bracket and a 1/2 in wall.
  return units === "imperial"
    ? { units, leg: "1/4", length: "3", electrode: "E70", angle: "0", directional: true, method: "LRFD", thinner: "3/8", thicker: "1/2", sizeSystem: "in", load: "" }
    : { units, leg: "6", length: "75", electrode: "E70", angle: "0", directional: true, method: "LRFD", thinner: "10", thicker: "12", sizeSystem: "mm", load: "" };
}

export function FilletCalculator({ initialUnits }: { initialUnits: UnitSystem }) {
  const [s, setS] = useState<State>(() => example(initialUnits));
  const { touch, reset, visible } = useTouched();
  const out = useMemo(() => compute(s), [s]);
  const errors = out.ok ? {} : out.errors;
  const set = (patch: Partial<State>) => setS((v) => ({ ...v, ...patch }));
  const u = s.units;
  const lenSym = symbolFor("length", u);
  const forceSym = symbolFor("force", u);
  const field = (key: "leg" | "length" | "angle" | "thinner" | "thicker" | "load", label: string, unit: string, hint?: React.ReactNode) => (
    <TextField id={`fw-${key}`} testId={`fw-${key}`} label={label} unit={unit} value={s[key]} onChange={(v) => set({ [key]: v })} onBlur={() => touch(key)} error={visible(errors, key, s[key])} hint={hint} />
  );
  const switchUnits = (to: UnitSystem) =>
    setS((v) => ({
      ...v,
      units: to,
      sizeSystem: to === "imperial" ? "in" : "mm",
      leg: convertText(v.leg, "length", v.units, to, LEN),
      length: convertText(v.length, "length", v.units, to, LEN),
      thinner: convertText(v.thinner, "length", v.units, to, LEN),
      thicker: convertText(v.thicker, "length", v.units, to, LEN),
      load: convertText(v.load, "force", v.units, to, { metric: 3, imperial: 3 }),
    }));

  const r = out.ok ? out.result : null;
  const kNPerMm = out.ok ? out.result.designStrengthKN / out.lengthMm : Number.NaN;
  // kip/in per 1/16 in of leg: the form the AISC manual quotes (E70 LRFD 1.392, ASD 0.928).
  const perSixteenth = out.ok ? (kNPerMm * MM_PER_IN) / KN_PER_KIP / (out.legMm / (MM_PER_IN / 16)) : Number.NaN;

  return (
    <div className="grid gap-6 xl:grid-cols-[minmax(0,24rem)_minmax(0,1fr)]">
      <form className="card space-y-4 p-4" onSubmit={(e) => e.preventDefault()} aria-label="Fillet weld inputs" noValidate>
        <div className="flex flex-wrap items-end gap-3">
          <Segmented legend="Units" value={u} onChange={switchUnits} testId="fw-units" options={[{ value: "metric", label: "mm, kN" }, { value: "imperial", label: "in, kip" }]} />
          <button type="button" className="btn btn-quiet" onClick={() => { setS(example(u)); reset(); }}>Example</button>
        </div>
        <fieldset className="space-y-1">
          <legend className="font-bold">The weld</legend>
          <div className="grid grid-cols-2 gap-x-3">
            {field("leg", "Leg size (equal legs)", lenSym, u === "imperial" ? "fractions read: 1/4, 5/16" : undefined)}
            {field("length", "Effective length, all runs", lenSym)}
          </div>
          <div className="grid grid-cols-2 gap-x-3">
            <SelectField label="Filler metal" testId="fw-electrode" value={s.electrode} onChange={(electrode) => set({ electrode })} options={ELECTRODE_CLASSES.map((c) => ({ value: c, label: `${c}XX · ${c.slice(1)} ksi` }))} />
            {field("angle", "Load angle to the weld axis", "°", "0 along the weld · 90 across it")}
          </div>
          <Checkbox label="Apply the directional increase, J2.4(a)" checked={s.directional} onChange={(directional) => set({ directional })} testId="fw-directional" />
        </fieldset>
        <fieldset className="space-y-1">
          <legend className="font-bold">Parts joined (for the minimum size)</legend>
          <div className="grid grid-cols-2 gap-x-3">
            {field("thinner", "Thinner part (optional)", lenSym, "e.g. the bracket")}
            {field("thicker", "Thicker part (optional)", lenSym, "e.g. the tube wall")}
          </div>
          <Segmented legend="Size table column" value={s.sizeSystem} onChange={(sizeSystem) => set({ sizeSystem })} options={[{ value: "in", label: "inch sizes" }, { value: "mm", label: "metric sizes" }]} />
        </fieldset>
        <fieldset className="space-y-2">
          <legend className="font-bold">Bracket check</legend>
          <Segmented legend="Design basis" value={s.method} onChange={(method) => set({ method })} testId="fw-method" options={[{ value: "LRFD", label: "LRFD φ 0.75" }, { value: "ASD", label: "ASD Ω 2.00" }]} />
          {field("load", s.method === "LRFD" ? "Factored load (optional)" : "Service load (optional)", forceSym, "on the whole weld group")}
        </fieldset>
      </form>

      <section className="min-w-0 space-y-4" aria-labelledby="fw-results-h">
        <h2 id="fw-results-h" className="text-lg font-bold">Weld group</h2>
        {!out.ok ? <FixList testId="fw-fix-list" items={Object.entries(errors).map(([key, message]) => ({ id: `fw-${key}`, label: LABELS[key] ?? key, message }))} /> : null}
        {r ? (
          <>
            <div className="flex flex-wrap gap-2" data-testid="fw-verdicts">
              {r.legOk === null ? (
                <StatusBadge tone="idle" testId="fw-size-verdict">Minimum size not checked: give the part thicknesses</StatusBadge>
              ) : r.legOk ? (
                <StatusBadge tone="pass" testId="fw-size-verdict">Leg meets the minimum {shown("length", r.minimumLegMm!, u, { metric: 1, imperial: 3 })}</StatusBadge>
              ) : (
                <StatusBadge tone="fail" testId="fw-size-verdict">Undersize: minimum {shown("length", r.minimumLegMm!, u, { metric: 1, imperial: 3 })}</StatusBadge>
              )}
              {r.ok === undefined ? (
                <StatusBadge tone="idle" testId="fw-load-verdict">No load given</StatusBadge>
              ) : r.ok ? (
                <StatusBadge tone="pass" testId="fw-load-verdict">Holds the load · {figure((r.utilisation ?? 0) * 100, 0)} % used</StatusBadge>
              ) : (
                <StatusBadge tone="fail" testId="fw-load-verdict">
                  {r.legOk === false && (r.utilisation ?? 0) <= 1 ? "Fails on size" : "Does not hold the load"} · {figure((r.utilisation ?? 0) * 100, 0)} % used
                </StatusBadge>
              )}
            </div>
            <dl className="grid gap-3 sm:grid-cols-2 2xl:grid-cols-3">
              <Figure
                size="lg"
                label={r.method === "LRFD" ? "Design strength φRn" : "Allowable strength Rn/Ω"}
                value={shown("force", r.designStrengthKN, u, { metric: 2, imperial: 2 })}
                testId="fw-design"
                source={`AISC 360-16 J2.4 · ${shown("force", r.designStrengthKN, u === "imperial" ? "metric" : "imperial", { metric: 2, imperial: 2 })}`}
              />
              <Figure label="Nominal strength Rn = Fnw·Awe" value={shown("force", r.nominalStrengthKN, u, { metric: 2, imperial: 2 })} testId="fw-nominal" />
              <Figure
                label="Per unit length"
                value={u === "imperial" ? `${figure((kNPerMm * MM_PER_IN) / KN_PER_KIP, 3)} kip/in` : `${figure(kNPerMm, 3)} kN/mm`}
                source={u === "imperial" ? `${figure(perSixteenth, 3)} kip/in per 1/16 in of leg` : undefined}
              />
              <Figure label="Effective throat 0.707 × leg" value={shown("length", r.throatMm, u, { metric: 2, imperial: 3 })} testId="fw-throat" source="AISC 360-16 J2.2a, equal legs" />
              <Figure
                label="Fnw = 0.60 FEXX × directional factor"
                value={u === "imperial" ? `${figure(mpaToKsi(r.fnwMPa), 1)} ksi` : `${figure(r.fnwMPa, 1)} MPa`}
                source={`directional factor × ${figure(r.directionalFactor, 3)}`}
              />
              <Figure
                label="Minimum leg size"
                value={r.minimumLegMm === null ? "—" : shown("length", r.minimumLegMm, u, { metric: 1, imperial: 3 })}
                testId="fw-minimum"
                source="AWS D1.1:2020 Table 7.7; AISC 360-16 Table J2.4"
              />
            </dl>
            <section className="card p-4" aria-labelledby="fw-notes-h">
              <h3 id="fw-notes-h" className="font-bold">Notes from the check</h3>
              <ul className="mt-2 list-disc space-y-1 pl-5 text-sm text-graphite-900" data-testid="fw-notes">
                {r.notes.map((n) => <li key={n}>{n}</li>)}
              </ul>
            </section>
          </>
        ) : null}
      </section>
    </div>
  );
}
