"use client";
// Small labelled inputs for conform forms whose field names are nested paths ("step.tolerance.max").
// Errors come from the form's `allErrors` by name; each error line keeps its height so nothing jumps.
import type { ReactNode } from "react";

export type Errors = Record<string, string[] | undefined>;

const idFor = (formId: string, name: string) => `${formId}-${name.replace(/[^a-zA-Z0-9]+/g, "-")}`;

type Common = { formId: string; name: string; label: string; errors: Errors; hint?: string; className?: string };

function Shell({ formId, name, label, errors, hint, className = "", children }: Common & { children: (p: { id: string; describedBy: string; invalid: boolean }) => ReactNode }) {
  const id = idFor(formId, name);
  const list = errors[name];
  const invalid = Boolean(list?.length);
  const describedBy = [hint ? `${id}-hint` : null, `${id}-error`].filter(Boolean).join(" ");
  return (
    <div className={className}>
      <label className="field-label" htmlFor={id}>{label}</label>
      {children({ id, describedBy, invalid })}
      {hint ? <p id={`${id}-hint`} className="mt-0.5 text-xs text-graphite-600">{hint}</p> : null}
      <p className="field-error" id={`${id}-error`} data-testid={`error-${name}`}>{list?.[0]}</p>
    </div>
  );
}

export function TextField(props: Common & { defaultValue?: string | number | null; type?: "text" | "number"; unit?: string; placeholder?: string }) {
  const { name, defaultValue, type = "text", unit, placeholder } = props;
  return (
    <Shell {...props}>
      {({ id, describedBy, invalid }) => (
        <div className="flex items-center gap-2">
          <input
            id={id}
            name={name}
            type={type}
            step={type === "number" ? "any" : undefined}
            inputMode={type === "number" ? "decimal" : undefined}
            defaultValue={defaultValue === null || defaultValue === undefined || Number.isNaN(defaultValue) ? "" : String(defaultValue)}
            placeholder={placeholder}
            aria-invalid={invalid || undefined}
            aria-describedby={describedBy}
            className={`field-input ${type === "number" ? "figures" : ""}`}
          />
          {unit ? <span className="figures shrink-0 text-sm font-semibold text-graphite-700">{unit}</span> : null}
        </div>
      )}
    </Shell>
  );
}

export function TextArea(props: Common & { defaultValue?: string; rows?: number; onInput?: (value: string) => void }) {
  const { name, defaultValue, rows = 3, onInput } = props;
  return (
    <Shell {...props}>
      {({ id, describedBy, invalid }) => (
        <textarea
          id={id}
          name={name}
          rows={rows}
          defaultValue={defaultValue ?? ""}
          aria-invalid={invalid || undefined}
          aria-describedby={describedBy}
          className="field-input"
          onInput={onInput ? (e) => onInput(e.currentTarget.value) : undefined}
        />
      )}
    </Shell>
  );
}

export function SelectField(
  props: Common & { options: readonly (readonly [string, string])[]; defaultValue?: string; value?: string; onChange?: (value: string) => void },
) {
  const { name, options, defaultValue, value, onChange } = props;
  return (
    <Shell {...props}>
      {({ id, describedBy, invalid }) => (
        <select
          id={id}
          name={name}
          {...(value !== undefined ? { value } : { defaultValue })}
          onChange={onChange ? (e) => onChange(e.currentTarget.value) : undefined}
          aria-invalid={invalid || undefined}
          aria-describedby={describedBy}
          className="field-input"
        >
          {options.map(([v, l]) => <option key={v} value={v}>{l}</option>)}
        </select>
      )}
    </Shell>
  );
}

export function CheckboxGroup(props: Common & { options: readonly (readonly [string, string])[]; defaultValue: readonly string[] }) {
  const { formId, name, label, errors, options, defaultValue, hint } = props;
  const id = idFor(formId, name);
  const list = errors[name] ?? Object.entries(errors).find(([k]) => k.startsWith(`${name}[`) || k.startsWith(`${name}.`))?.[1];
  return (
    <fieldset aria-describedby={`${id}-error`}>
      <legend className="field-label">{label}</legend>
      <div className="flex flex-wrap gap-2">
        {options.map(([v, l]) => (
          <label key={v} className="flex min-h-11 items-center gap-2 rounded-md border-2 border-graphite-300 px-3 text-sm">
            <input type="checkbox" name={name} value={v} defaultChecked={defaultValue.includes(v)} className="h-5 w-5" />
            {l}
          </label>
        ))}
      </div>
      {hint ? <p className="mt-0.5 text-xs text-graphite-600">{hint}</p> : null}
      <p className="field-error" id={`${id}-error`} data-testid={`error-${name}`}>{list?.[0]}</p>
    </fieldset>
  );
}

export function Checkbox({ formId, name, label, defaultChecked, onChange }: { formId: string; name: string; label: string; defaultChecked: boolean; onChange?: (checked: boolean) => void }) {
  const id = idFor(formId, name);
  return (
    <label htmlFor={id} className="flex min-h-11 items-center gap-2 font-semibold">
      <input id={id} type="checkbox" name={name} defaultChecked={defaultChecked} className="h-5 w-5" onChange={onChange ? (e) => onChange(e.currentTarget.checked) : undefined} />
      {label}
    </label>
  );
}
