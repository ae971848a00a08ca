"use client";
import { useId } from "react";

// Calculator inputs: a label, the input with its unit beside it, and an error line whose height is
// always reserved, so an error appearing never moves the control a finger is about to press.

export function TextField({
  label,
  value,
  onChange,
  onBlur,
  unit,
  error,
  hint,
  inputMode = "decimal",
  testId,
  id,
  placeholder,
  className = "",
  labelClassName = "",
  autoComplete = "off",
}: {
  label: React.ReactNode;
  value: string;
  onChange: (value: string) => void;
  onBlur?: () => void;
  unit?: string;
  error?: string | undefined;
  hint?: React.ReactNode;
  inputMode?: "decimal" | "numeric" | "text";
  testId?: string;
  id?: string;
  placeholder?: string;
  className?: string;
  labelClassName?: string;
  autoComplete?: string;
}) {
  const auto = useId();
  const fieldId = id ?? auto;
  const errorId = `${fieldId}-error`;
  const hintId = `${fieldId}-hint`;
  return (
    <div className={className}>
      <label htmlFor={fieldId} className={`field-label ${labelClassName}`}>{label}</label>
      <div className="flex items-stretch">
        <input
          id={fieldId}
          data-testid={testId}
          type="text"
          inputMode={inputMode}
          autoComplete={autoComplete}
          spellCheck={false}
          placeholder={placeholder}
          className={`field-input figures min-w-0 ${unit ? "rounded-r-none" : ""}`}
          value={value}
          aria-invalid={error ? true : undefined}
          aria-describedby={[error ? errorId : null, hint ? hintId : null].filter(Boolean).join(" ") || undefined}
          onChange={(e) => onChange(e.target.value)}
          onBlur={onBlur}
        />
        {unit ? (
          <span className="flex min-w-12 shrink-0 items-center justify-center rounded-r-md border-2 border-l-0 border-graphite-400 bg-graphite-100 px-2 text-sm font-semibold text-graphite-900">
            {unit}
          </span>
        ) : null}
      </div>
      {hint ? <p id={hintId} className="mt-1 text-xs text-graphite-600">{hint}</p> : null}
      <p id={errorId} className="field-error" data-testid={testId ? `${testId}-error` : undefined} aria-live="polite">
        {error ? <><span aria-hidden="true">✕ </span>{error}</> : null}
      </p>
    </div>
  );
}

export function SelectField<T extends string>({
  label,
  value,
  onChange,
  options,
  testId,
  hint,
  className = "",
}: {
  label: React.ReactNode;
  value: T;
  onChange: (value: T) => void;
  options: readonly { value: T; label: string }[];
  testId?: string;
  hint?: React.ReactNode;
  className?: string;
}) {
  const id = useId();
  return (
    <div className={className}>
      <label htmlFor={id} className="field-label">{label}</label>
      <select id={id} data-testid={testId} className="field-input" value={value} onChange={(e) => onChange(e.target.value as T)}>
        {options.map((o) => <option key={o.value} value={o.value}>{o.label}</option>)}
      </select>
      {hint ? <p className="mt-1 text-xs text-graphite-600">{hint}</p> : null}
      {/* Same reserved line as a text field, so rows of mixed controls stay aligned. */}
      <p className="field-error" aria-hidden="true" />
    </div>
  );
}

/** A choice of a few, as big radio buttons; the chosen one carries a filled mark, not only a colour. */
export function Segmented<T extends string>({
  legend,
  value,
  onChange,
  options,
  testId,
  hideLegend = false,
}: {
  legend: string;
  value: T;
  onChange: (value: T) => void;
  options: readonly { value: T; label: React.ReactNode }[];
  testId?: string;
  hideLegend?: boolean;
}) {
  const name = useId();
  return (
    <fieldset data-testid={testId}>
      <legend className={hideLegend ? "sr-only" : "field-label"}>{legend}</legend>
      <div className="inline-flex flex-wrap gap-1 rounded-lg border-2 border-graphite-300 bg-white p-1">
        {options.map((o) => {
          const on = o.value === value;
          return (
            <label
              key={o.value}
              data-testid={testId ? `${testId}-${o.value}` : undefined}
              className={`flex min-h-11 cursor-pointer items-center gap-2 rounded-md px-3 text-sm font-semibold has-[:focus-visible]:outline has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-primer-700 ${
                on ? "bg-graphite-900 text-white" : "text-graphite-900 hover:bg-graphite-100"
              }`}
            >
              <input type="radio" className="sr-only" name={name} value={o.value} checked={on} onChange={() => onChange(o.value)} />
              <span aria-hidden="true">{on ? "●" : "○"}</span>
              {o.label}
            </label>
          );
        })}
      </div>
    </fieldset>
  );
}

export function Checkbox({ label, checked, onChange, testId }: { label: React.ReactNode; checked: boolean; onChange: (v: boolean) => void; testId?: string }) {
  return (
    <label className="flex min-h-11 cursor-pointer items-center gap-3 font-semibold">
      <input type="checkbox" data-testid={testId} className="h-6 w-6 accent-graphite-900" checked={checked} onChange={(e) => onChange(e.target.checked)} />
      {label}
    </label>
  );
}

/** Fields that are wrong or still empty, as links to them, so none is missed on a long form. */
export function FixList({ items, testId }: { items: { id?: string; label: string; message: string }[]; testId?: string }) {
  if (items.length === 0) return null;
  return (
    <div className="rounded-md border-2 border-verdict-fail bg-white p-3" data-testid={testId}>
      <p className="font-semibold text-verdict-fail"><span aria-hidden="true">✕ </span>{items.length === 1 ? "One field to fix" : `${items.length} fields to fix`} before results show:</p>
      <ul className="mt-1 list-disc space-y-0.5 pl-5 text-sm text-graphite-900">
        {items.slice(0, 12).map((i) => (
          <li key={`${i.label}-${i.message}`}>
            {i.id ? <a className="font-semibold underline" href={`#${i.id}`}>{i.label}</a> : <strong>{i.label}</strong>}: {i.message}
          </li>
        ))}
        {items.length > 12 ? <li>and {items.length - 12} more.</li> : null}
      </ul>
    </div>
  );
}
