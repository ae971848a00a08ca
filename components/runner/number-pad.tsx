"use client";
// A number pad for gloved hands: keys 64 px high, 8 px apart, nothing to drag or hold. It edits whichever
// field is active; fields show the typed text and their unit, and a unit switch beside them. Keys run 1-2-3 on
// top, as on a phone and a tablet's own number keyboard, which is what hands expect for a PIN and a reading.
import { padUnits, symbolOf, type PadKey, type PadQuantity } from "@/lib/jobs/units";

export { applyKey } from "@/lib/jobs/units";

export function NumberPad({
  onKey,
  decimals = true,
  negative = false,
  disabled = false,
  testId = "number-pad",
}: {
  onKey: (key: PadKey) => void;
  decimals?: boolean;
  negative?: boolean;
  disabled?: boolean;
  testId?: string;
}) {
  const rows: PadKey[] = ["1", "2", "3", "4", "5", "6", "7", "8", "9", decimals ? "." : "clear", "0", "⌫"];
  const label = (k: PadKey) => (k === "⌫" ? "Delete last" : k === "±" ? "Change sign" : k === "." ? "Decimal point" : k === "clear" ? "Clear" : k);
  const key = "figures flex min-h-16 items-center justify-center rounded-lg border-2 border-graphite-700 bg-white text-2xl font-semibold text-graphite-950 active:bg-primer-200 disabled:opacity-50";
  return (
    <div className="grid grid-cols-3 gap-2" data-testid={testId} role="group" aria-label="Number pad">
      {rows.map((k) => (
        <button key={k} type="button" disabled={disabled} aria-label={label(k)} onClick={() => onKey(k)} className={key}>
          {k === "clear" ? "C" : k}
        </button>
      ))}
      {negative ? (
        <button type="button" disabled={disabled} aria-label="Change sign" onClick={() => onKey("±")} className={key}>
          ±
        </button>
      ) : null}
      {decimals || negative ? (
        <button type="button" disabled={disabled} onClick={() => onKey("clear")} className={`${key} text-lg ${negative ? "col-span-2" : "col-span-3"}`}>
          Clear
        </button>
      ) : null}
    </div>
  );
}

export function UnitSwitch({ quantity, unit, onUnit, label, disabled }: { quantity: PadQuantity; unit: string; onUnit: (unit: string) => void; label: string; disabled?: boolean }) {
  const units = padUnits(quantity) as readonly string[];
  if (units.length < 2) return null;
  return (
    <div role="radiogroup" aria-label={`${label}: unit`} className="flex gap-2">
      {units.map((u) => (
        <button
          key={u}
          type="button"
          role="radio"
          aria-checked={u === unit}
          disabled={disabled}
          onClick={() => onUnit(u)}
          className={`min-h-12 min-w-16 rounded-md border-2 px-3 font-semibold ${u === unit ? "border-graphite-950 bg-graphite-900 text-white" : "border-graphite-400 bg-white text-graphite-950"}`}
        >
          {u === unit ? <span aria-hidden="true">● </span> : null}
          {symbolOf(quantity, u)}
        </button>
      ))}
    </div>
  );
}

/** A field the pad types into: tap to make it active. */
export function PadField({
  id,
  label,
  text,
  unitSymbol,
  active,
  onActivate,
  onText,
  invalid,
  hint,
  disabled,
}: {
  id: string;
  label: string;
  text: string;
  unitSymbol?: string;
  active: boolean;
  onActivate: () => void;
  onText?: (text: string) => void;
  invalid?: string | null;
  hint?: React.ReactNode;
  disabled?: boolean;
}) {
  return (
    <div>
      <label htmlFor={id} className="mb-1 block text-sm font-semibold text-graphite-900">{label}</label>
      <div
        className={`flex min-h-14 items-center gap-2 rounded-lg border-2 bg-white px-3 ${active ? "border-graphite-950 ring-4 ring-primer-400" : invalid ? "border-verdict-fail" : "border-graphite-500"}`}
        onClick={() => !disabled && onActivate()}
      >
        <input
          id={id}
          type="text"
          // The on-screen pad types here; a hardware keyboard still works, a tablet keyboard stays down.
          inputMode="none"
          autoComplete="off"
          value={text}
          disabled={disabled}
          aria-invalid={invalid ? true : undefined}
          onFocus={onActivate}
          onChange={(e) => onText?.(e.target.value.replace(/[^0-9.,-]/g, "").replace(",", "."))}
          className="figures min-w-0 flex-1 bg-transparent text-2xl font-semibold text-graphite-950 outline-none"
          placeholder="—"
        />
        {unitSymbol ? <span className="figures text-lg font-semibold text-graphite-700">{unitSymbol}</span> : null}
      </div>
      <p className="field-error" aria-live="polite">{invalid ?? ""}</p>
      {hint ? <div className="-mt-1 text-sm text-graphite-700">{hint}</div> : null}
    </div>
  );
}
