"use client";
// One reading on the pad against its limits: measure steps (any quantity) and torque steps.
import { useState } from "react";
import type { Bounds, Verdict } from "@/lib/jobs/tolerance";
import { defaultPadUnit, isPadUnit, show, symbolOf, type PadQuantity } from "@/lib/jobs/units";
import { BASE_UNIT } from "@/lib/units";
import { applyKey, NumberPad, PadField, UnitSwitch } from "./number-pad";
import { initialText, storedFrom } from "./pad-state";
import { VerdictBox } from "./verdict";

export function boundsText(quantity: PadQuantity, b: Bounds, unit: string): string {
  if (b.low !== null && b.high !== null) return `${show(quantity, b.low, unit)} to ${show(quantity, b.high, unit)}`;
  if (b.low !== null) return `at least ${show(quantity, b.low, unit)}`;
  if (b.high !== null) return `at most ${show(quantity, b.high, unit)}`;
  return "no limits";
}

export function verdictWords(quantity: PadQuantity, v: Verdict, unit: string): { title: string; detail: string } {
  const limits = boundsText(quantity, v.bounds, unit);
  if (v.ok) return { title: "Within tolerance", detail: `Needs ${limits}.` };
  const limit = v.side === "low" ? v.bounds.low! : v.bounds.high!;
  return {
    title: v.side === "low" ? "Out of tolerance: below the limit" : "Out of tolerance: above the limit",
    detail: `Needs ${limits}; the ${v.side === "low" ? "lower" : "upper"} limit is ${show(quantity, limit, unit)}.`,
  };
}

export function ReadingControl({
  id,
  label,
  quantity,
  stored,
  storedUnit,
  unitSystem,
  readOnly,
  verdict,
  onChange,
  specLine,
  defaultUnit,
}: {
  id: string;
  label: string;
  quantity: PadQuantity;
  stored: number | undefined;
  storedUnit: string | undefined;
  unitSystem: "metric" | "imperial";
  readOnly: boolean;
  verdict: (valueSI: number) => Verdict;
  onChange: (valueSI: number | undefined, unit: string) => void;
  specLine: (unit: string) => React.ReactNode;
  /** the unit the procedure names (a torque wrench set in lbf·ft), before the person's own preference */
  defaultUnit?: string;
}) {
  const [unit, setUnit] = useState<string>(
    storedUnit && isPadUnit(quantity, storedUnit) ? storedUnit : defaultUnit && isPadUnit(quantity, defaultUnit) ? defaultUnit : defaultPadUnit(quantity, unitSystem),
  );
  const [text, setText] = useState(() => initialText(stored, { quantity, unit }));
  const negative = quantity === "temperature" || quantity === "angle";
  const change = (t: string, u = unit) => {
    setText(t);
    onChange(storedFrom(t, { quantity, unit: u }), u);
  };
  const valueSI = storedFrom(text, { quantity, unit });
  const v = valueSI === undefined ? null : verdict(valueSI);
  const words = v ? verdictWords(quantity, v, unit) : null;
  const base = BASE_UNIT[quantity];
  return (
    <div className={readOnly ? "space-y-3" : "grid gap-4 md:grid-cols-[minmax(0,1fr)_18rem]"}>
      <div className="space-y-3">
        <p className="text-lg text-graphite-950" data-testid="spec-line">{specLine(unit)}</p>
        <PadField id={id} label={label} text={text} unitSymbol={symbolOf(quantity, unit)} active={!readOnly} onActivate={() => {}} onText={readOnly ? undefined : (t) => change(t)} disabled={readOnly} />
        {!readOnly ? <UnitSwitch quantity={quantity} unit={unit} label={label} onUnit={(u) => { setUnit(u); change(text, u); }} /> : null}
        {valueSI !== undefined && unit !== base ? (
          <p className="figures text-graphite-800">Stored as {show(quantity, valueSI, base)}</p>
        ) : null}
        {words ? (
          <VerdictBox tone={v!.ok ? "pass" : "fail"} title={words.title} testId="tolerance-verdict">{words.detail}</VerdictBox>
        ) : (
          <VerdictBox tone="idle" title="Enter the reading" testId="tolerance-verdict">The verdict shows as you type.</VerdictBox>
        )}
      </div>
      {!readOnly ? (
        <div className="md:sticky md:top-28 md:self-start">
          <NumberPad negative={negative} onKey={(k) => change(applyKey(text, k, { negative }))} />
        </div>
      ) : null}
    </div>
  );
}
