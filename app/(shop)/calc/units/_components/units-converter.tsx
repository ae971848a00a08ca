"use client";
import { useState } from "react";
import { SelectField, TextField } from "@/components/calc/fields";
import { inchFraction, MINUS } from "@/components/calc/values";
import { defaultDigits, formatInUnit, fromSI, parseQuantity, preferredUnit, QUANTITIES, UNITS, unitSymbol, type Quantity, type UnitOf, type UnitSystem } from "@/lib/units";

const QUANTITY_NAMES: Record<Quantity, string> = {
  length: "Length",
  angle: "Angle",
  temperature: "Temperature",
  thickness: "Coating thickness",
  torque: "Torque",
  pressure: "Pressure",
  speed: "Travel speed",
  force: "Force",
};

const EXAMPLES = [`3 1/4"`, "65 ft-lb", "300F", `5' 6"`, "6 mil", "30 psi", "82,5 mm", "8 ipm"];

type Choice = Quantity | "auto";

// Reads what people say on the shop floor with lib/units parseQuantity (pure, never throws) and shows the
// value in every unit of its quantity, with extra decimals so nothing is rounded away before it is used.
export function UnitsConverter({ initialUnits }: { initialUnits: UnitSystem }) {
  const [text, setText] = useState(`3 1/4"`);
  const [quantity, setQuantity] = useState<Choice>("auto");
  const parsed = text.trim() === "" ? null : parseQuantity(text, quantity === "auto" ? undefined : quantity);
  const ok = parsed?.ok ? parsed : null;
  const units = ok ? (Object.keys(UNITS[ok.quantity]) as UnitOf<Quantity>[]) : [];
  const preferred = ok ? preferredUnit(ok.quantity, initialUnits) : null;

  return (
    <div className="grid gap-6 xl:grid-cols-[minmax(0,26rem)_minmax(0,1fr)]">
      <form className="card space-y-3 p-4" onSubmit={(e) => e.preventDefault()} aria-label="Value to convert" noValidate>
        <TextField
          id="units-text"
          testId="units-text"
          label="Value with its unit"
          inputMode="text"
          value={text}
          onChange={setText}
          error={parsed && !parsed.ok ? parsed.message : undefined}
          hint="Fractions, feet and inches, comma decimals and the usual shop spellings are read."
        />
        <SelectField<Choice>
          label="Quantity"
          testId="units-quantity"
          value={quantity}
          onChange={setQuantity}
          options={[{ value: "auto", label: "From the unit" }, ...QUANTITIES.map((q) => ({ value: q, label: QUANTITY_NAMES[q] }))]}
          hint="Pick one when a symbol is shared (mm is a length or a thickness)."
        />
        <div>
          <p className="field-label">Try</p>
          <div className="flex flex-wrap gap-2">
            {EXAMPLES.map((e) => (
              <button key={e} type="button" className="btn btn-quiet figures px-3" onClick={() => setText(e)}>{e}</button>
            ))}
          </div>
        </div>
      </form>
      <section className="min-w-0 space-y-3" aria-labelledby="units-results-h" aria-live="polite">
        <h2 id="units-results-h" className="text-lg font-bold">
          {ok ? <>Read as {QUANTITY_NAMES[ok.quantity].toLowerCase()}: <span className="figures" data-testid="units-read">{formatInUnit(ok.quantity, ok.valueSI, ok.unit as never, { digits: Math.max(defaultDigits(ok.quantity, ok.unit as never), 3) }).replace("-", MINUS)}</span></> : "Type a value to convert"}
        </h2>
        {ok ? (
          <div className="card overflow-x-auto">
            <table className="w-full text-left" data-testid="units-table">
              <caption className="sr-only">The value in every unit of its quantity</caption>
              <thead className="bg-graphite-100 text-sm">
                <tr>
                  <th scope="col" className="px-3 py-2">Unit</th>
                  <th scope="col" className="px-3 py-2 text-right">Value</th>
                  <th scope="col" className="px-3 py-2">Shop form</th>
                </tr>
              </thead>
              <tbody>
                {units.map((u) => {
                  const digits = defaultDigits(ok.quantity, u as never) + 2;
                  const v = fromSI(ok.quantity, ok.valueSI, u as never);
                  return (
                    <tr key={u} className="border-t border-graphite-200" data-testid={`units-row-${u}`}>
                      <th scope="row" className="px-3 py-2 font-semibold">
                        {unitSymbol(ok.quantity, u as never)}
                        {u === preferred ? <span className="ml-2 text-sm font-normal text-graphite-700">(your units)</span> : null}
                      </th>
                      <td className="figures px-3 py-2 text-right">{formatInUnit(ok.quantity, ok.valueSI, u as never, { digits }).replace("-", MINUS)}</td>
                      <td className="figures px-3 py-2">{ok.quantity === "length" && u === "in" ? inchFraction(v, 32) : ok.quantity === "length" && u === "ft" ? feetAndInches(v * 12) : ""}</td>
                    </tr>
                  );
                })}
              </tbody>
            </table>
          </div>
        ) : null}
        <p className="text-sm text-graphite-700">Exact factors, NIST SP 811 (2008) Appendix B: 1 in = 25.4 mm; 1 lbf·ft = 1.355 818 N·m; 1 psi = 6.894 757 kPa; t(°C) = (t(°F) − 32)/1.8. Values are stored in SI and shown in each person&apos;s units.</p>
      </section>
    </div>
  );
}

/** 66.5 in → 5' 6 1/2": rounded to 1/16 in first, so 11.99 in never shows as 0' 12". */
function feetAndInches(inches: number): string {
  const sixteenths = Math.round(Math.abs(inches) * 16);
  const feet = Math.floor(sixteenths / 192);
  const rest = (sixteenths - feet * 192) / 16;
  return `${inches < 0 ? MINUS : ""}${feet}' ${inchFraction(rest, 16)}`;
}
