"use client";
import { getFormProps, getInputProps, getSelectProps, getTextareaProps, useForm, type FieldMetadata } from "@conform-to/react";
import { parseWithZod } from "@conform-to/zod/v4";
import { startTransition, useActionState } from "react";
import type { z } from "zod";
import { FormMessage } from "@/components/form-message";
import { PROCESS_INFO } from "@/lib/welding/processes";
import {
  BASIS_LABELS,
  CURRENT_LABELS,
  CURRENT_TYPES,
  FIELD_LABELS,
  HEAT_INPUT_BASES,
  POLARITIES,
  POLARITY_LABELS,
  WPS_POSITIONS,
  WPS_PROCESSES,
  wpsDraftFormSchema,
  type WpsContent,
} from "@/lib/welding/wps-schema";
import { saveDraftAction } from "../actions";

type Input = z.input<typeof wpsDraftFormSchema>;

// ISO 4063 numbers per family (lib/welding/processes.ts; the numbers are from memory, as noted there).
const ISO_NAMES: Record<number, string> = {
  111: "manual metal arc",
  131: "MIG, inert gas",
  135: "MAG, active gas",
  114: "self-shielded flux-cored",
  136: "flux-cored, active gas",
  138: "metal-cored, active gas",
  141: "TIG",
  121: "submerged arc, single wire",
};

function Text({ field, label, unit, hint, wide }: { field: FieldMetadata<string | number | undefined>; label: string; unit?: string; hint?: string; wide?: boolean }) {
  return (
    <div className={wide ? "sm:col-span-2" : undefined}>
      <label className="field-label" htmlFor={field.id}>{label}</label>
      <div className="flex items-stretch">
        <input
          {...getInputProps(field, { type: "text" })}
          key={field.key}
          inputMode={unit ? "decimal" : undefined}
          autoComplete="off"
          className={`field-input min-w-0 ${unit ? "figures rounded-r-none" : ""}`}
        />
        {unit ? <span className="figures flex items-center rounded-r-md border-2 border-l-0 border-graphite-400 bg-graphite-100 px-2 text-sm">{unit}</span> : null}
      </div>
      {hint ? <p className="text-xs text-graphite-600">{hint}</p> : null}
      <p className="field-error" id={field.errorId}>{field.errors?.[0]}</p>
    </div>
  );
}

function Choice({ field, label, options }: { field: FieldMetadata<string | number | undefined>; label: string; options: [string, string][] }) {
  return (
    <div>
      <label className="field-label" htmlFor={field.id}>{label}</label>
      <select {...getSelectProps(field)} key={field.key} className="field-input">
        <option value="">—</option>
        {options.map(([v, l]) => <option key={v} value={v}>{l}</option>)}
      </select>
      <p className="field-error" id={field.errorId}>{field.errors?.[0]}</p>
    </div>
  );
}

function toDefaults(wpsId: string, number: number, c: WpsContent): Record<string, string | string[]> {
  const out: Record<string, string | string[]> = { wpsId, number: String(number) };
  for (const [k, v] of Object.entries(c)) {
    if (Array.isArray(v)) out[k] = v;
    else out[k] = v === null || v === undefined ? "" : String(v);
  }
  return out;
}

export function DraftEditor({ wpsId, number, content }: { wpsId: string; number: number; content: WpsContent }) {
  const [state, formAction, pending] = useActionState(saveDraftAction, undefined);
  const [form, fields] = useForm<Input, z.output<typeof wpsDraftFormSchema>>({
    id: `wps-draft-${wpsId}-${number}`,
    lastResult: state,
    defaultValue: toDefaults(wpsId, number, content) as never,
    shouldValidate: "onSubmit",
    shouldRevalidate: "onInput",
    onValidate: ({ formData }) => parseWithZod(formData, { schema: wpsDraftFormSchema }),
    onSubmit(event, { formData }) {
      event.preventDefault();
      startTransition(() => formAction(formData));
    },
  });
  const f = fields as unknown as Record<keyof WpsContent | "wpsId" | "number", FieldMetadata<string | number | undefined>>;
  const isoOptions: [string, string][] = WPS_PROCESSES.flatMap((p) => PROCESS_INFO[p].iso4063.map((n) => [String(n), `${n} · ${p} (${ISO_NAMES[n] ?? p})`] as [string, string]));
  const positionsField = fields.positions;
  const checked = new Set(content.positions);
  return (
    <form {...getFormProps(form)} action={formAction} className="space-y-4" noValidate data-testid="draft-editor">
      <input type="hidden" name="wpsId" value={wpsId} />
      <input type="hidden" name="number" value={number} />
      <fieldset className="card grid gap-x-4 p-4 sm:grid-cols-2">
        <legend className="px-1 font-bold">Process and materials</legend>
        <Text field={f.title} label={FIELD_LABELS.title} wide />
        <Choice field={f.process} label={FIELD_LABELS.process} options={WPS_PROCESSES.map((p) => [p, `${p}: ${PROCESS_INFO[p].name}`])} />
        <Choice field={f.iso4063} label={FIELD_LABELS.iso4063} options={isoOptions} />
        <div className="sm:col-span-2">
          <label className="field-label" htmlFor={f.baseMetals.id}>{FIELD_LABELS.baseMetals}</label>
          <textarea {...getTextareaProps(f.baseMetals)} key={f.baseMetals.key} className="field-input min-h-16" />
          <p className="field-error" id={f.baseMetals.errorId}>{f.baseMetals.errors?.[0]}</p>
        </div>
        <Text field={f.thicknessMinMm} label="Thickness, minimum" unit="mm" />
        <Text field={f.thicknessMaxMm} label="Thickness, maximum" unit="mm" />
      </fieldset>

      <fieldset className="card grid gap-x-4 p-4 sm:grid-cols-2">
        <legend className="px-1 font-bold">Filler metal and shielding</legend>
        <Text field={f.fillerClassification} label={FIELD_LABELS.fillerClassification} hint="As the filler specification writes it, e.g. ER70S-6." />
        <Text field={f.fillerDiameterMm} label="Filler diameter" unit="mm" />
        <Text field={f.shieldingGas} label={FIELD_LABELS.shieldingGas} hint="Leave empty for SMAW, SAW and self-shielded FCAW." />
        <Text field={f.gasFlowLPerMin} label="Gas flow" unit="L/min" />
      </fieldset>

      <fieldset className="card grid gap-x-4 p-4 sm:grid-cols-2">
        <legend className="px-1 font-bold">Electrical</legend>
        <Choice field={f.currentType} label={FIELD_LABELS.currentType} options={CURRENT_TYPES.map((c) => [c, CURRENT_LABELS[c]])} />
        <Choice field={f.polarity} label="Polarity (DC only)" options={POLARITIES.map((p) => [p, POLARITY_LABELS[p]])} />
        <Text field={f.voltsMin} label="Voltage, minimum" unit="V" />
        <Text field={f.voltsMax} label="Voltage, maximum" unit="V" />
        <Text field={f.ampsMin} label="Current, minimum" unit="A" />
        <Text field={f.ampsMax} label="Current, maximum" unit="A" />
      </fieldset>

      <fieldset className="card grid gap-x-4 p-4 sm:grid-cols-2">
        <legend className="px-1 font-bold">Travel speed, heat input and temperatures</legend>
        <Text field={f.travelSpeedMinMmPerMin} label="Travel speed, minimum" unit="mm/min" />
        <Text field={f.travelSpeedMaxMmPerMin} label="Travel speed, maximum" unit="mm/min" />
        <Text field={f.heatInputMaxKJPerMm} label="Heat input, maximum" unit="kJ/mm" hint="Optional. Leave empty for no limit." />
        <Choice field={f.heatInputBasis} label={FIELD_LABELS.heatInputBasis} options={HEAT_INPUT_BASES.map((b) => [b, BASIS_LABELS[b]])} />
        <Text field={f.preheatMinC} label="Preheat, minimum" unit="°C" />
        <Text field={f.interpassMaxC} label="Interpass, maximum" unit="°C" hint="Optional. Leave empty for no limit." />
      </fieldset>

      <fieldset className="card p-4">
        <legend className="px-1 font-bold">Positions</legend>
        <div className="flex flex-wrap gap-2" role="group" aria-describedby={positionsField.errorId}>
          {WPS_POSITIONS.map((p) => (
            <label key={p} className="figures flex min-h-11 items-center gap-2 rounded-md border-2 border-graphite-300 px-3">
              <input type="checkbox" name={positionsField.name} value={p} defaultChecked={checked.has(p)} className="h-5 w-5" />
              {p}
            </label>
          ))}
        </div>
        <p className="field-error" id={positionsField.errorId}>{positionsField.errors?.[0]}</p>
      </fieldset>

      <div className="card p-4">
        <label className="field-label" htmlFor={f.notes.id}>{FIELD_LABELS.notes}</label>
        <textarea {...getTextareaProps(f.notes)} key={f.notes.key} className="field-input min-h-24" placeholder="Transfer mode, progression, cleaning, technique" />
        <p className="field-error" id={f.notes.errorId}>{f.notes.errors?.[0]}</p>
      </div>

      <div className="sticky bottom-0 flex flex-wrap items-center gap-3 border-t-2 border-graphite-200 bg-graphite-50 py-3">
        <button className="btn btn-primary" type="submit" disabled={pending}>{pending ? "Saving…" : "Save draft"}</button>
        <div className="min-w-64 flex-1"><FormMessage ok={state?.ok} errors={form.errors} testId="draft" /></div>
      </div>
    </form>
  );
}
