"use client";
import { getFormProps, getInputProps, getSelectProps, getTextareaProps, useForm, type FieldMetadata } from "@conform-to/react";
import { parseWithZod } from "@conform-to/zod/v4";
import { startTransition, useActionState } from "react";
import type { z } from "zod";
import { FormMessage } from "@/components/form-message";
import { qualificationFormSchema } from "@/lib/welding/qualification-schema";
import { WPS_POSITIONS, WPS_PROCESSES } from "@/lib/welding/wps-schema";
import { saveQualificationAction } from "../actions";

type Input = z.input<typeof qualificationFormSchema>;
type AnyField = FieldMetadata<string | number | undefined>;

type QualificationDefaults = {
  id?: string;
  welderUserId?: string;
  process?: string;
  positions: string[];
  thicknessMinMm?: number;
  thicknessMaxMm?: number | null;
  diameterMinMm?: number | null;
  diameterMaxMm?: number | null;
  fillerFNumber?: number;
  testDate?: string;
  wpsId?: string | null;
  notes?: string;
};

function Num({ field, label, unit, hint }: { field: AnyField; label: string; unit?: string; hint?: string }) {
  return (
    <div>
      <label className="field-label" htmlFor={field.id}>{label}</label>
      <div className="flex items-stretch">
        <input {...getInputProps(field, { type: "text" })} key={field.key} inputMode="decimal" autoComplete="off" className={`field-input figures min-w-0 ${unit ? "rounded-r-none" : ""}`} />
        {unit ? <span className="figures flex items-center rounded-r-md border-2 border-l-0 border-graphite-400 bg-graphite-100 px-2 text-sm">{unit}</span> : null}
      </div>
      {hint ? <p className="text-xs text-graphite-600">{hint}</p> : null}
      <p className="field-error" id={field.errorId}>{field.errors?.[0]}</p>
    </div>
  );
}

function str(v: unknown): string {
  return v === null || v === undefined ? "" : String(v);
}

export function QualificationForm({
  defaults,
  welders,
  wpsOptions,
  fixedWelderName,
}: {
  defaults: QualificationDefaults;
  welders: { userId: string; name: string }[];
  wpsOptions: { wpsId: string; reference: string; title: string; process: string | null }[];
  fixedWelderName?: string;
}) {
  const editing = Boolean(defaults.id);
  const [state, formAction, pending] = useActionState(saveQualificationAction, undefined);
  const [form, fields] = useForm<Input, z.output<typeof qualificationFormSchema>>({
    id: `qualification-${defaults.id ?? "new"}`,
    lastResult: state,
    defaultValue: {
      id: defaults.id,
      welderUserId: str(defaults.welderUserId),
      process: str(defaults.process),
      positions: defaults.positions,
      thicknessMinMm: str(defaults.thicknessMinMm),
      thicknessMaxMm: str(defaults.thicknessMaxMm),
      diameterMinMm: str(defaults.diameterMinMm),
      diameterMaxMm: str(defaults.diameterMaxMm),
      fillerFNumber: str(defaults.fillerFNumber),
      testDate: str(defaults.testDate),
      wpsId: str(defaults.wpsId),
      notes: str(defaults.notes),
    } as never,
    shouldValidate: "onSubmit",
    shouldRevalidate: "onInput",
    onValidate: ({ formData }) => parseWithZod(formData, { schema: qualificationFormSchema }),
    onSubmit(event, { formData }) {
      event.preventDefault();
      startTransition(() => formAction(formData));
    },
  });
  const f = fields as unknown as Record<string, AnyField>;
  const checked = new Set(defaults.positions);
  return (
    <form {...getFormProps(form)} action={formAction} className="card space-y-3 p-4" noValidate data-testid="qualification-form">
      <h2 className="font-bold">{editing ? "Edit the qualification" : "Add a qualification"}</h2>
      {defaults.id ? <input type="hidden" name="id" value={defaults.id} /> : null}
      <div className="grid gap-x-4 sm:grid-cols-2">
        {editing ? (
          <>
            <input type="hidden" name="welderUserId" value={defaults.welderUserId} />
            <input type="hidden" name="process" value={defaults.process} />
            <p className="sm:col-span-2 mb-3">
              <span className="font-semibold">{fixedWelderName}</span>, {defaults.process}. The welder and the process of a qualification never change; add another for a different one.
            </p>
          </>
        ) : (
          <>
            <div>
              <label className="field-label" htmlFor={f.welderUserId!.id}>Welder</label>
              <select {...getSelectProps(f.welderUserId!)} key={f.welderUserId!.key} className="field-input">
                <option value="">Choose…</option>
                {welders.map((w) => <option key={w.userId} value={w.userId}>{w.name}</option>)}
              </select>
              <p className="field-error" id={f.welderUserId!.errorId}>{f.welderUserId!.errors?.[0]}</p>
            </div>
            <div>
              <label className="field-label" htmlFor={f.process!.id}>Process</label>
              <select {...getSelectProps(f.process!)} key={f.process!.key} className="field-input">
                <option value="">Choose…</option>
                {WPS_PROCESSES.map((p) => <option key={p} value={p}>{p}</option>)}
              </select>
              <p className="field-error" id={f.process!.errorId}>{f.process!.errors?.[0]}</p>
            </div>
          </>
        )}
        <Num field={f.thicknessMinMm!} label="Thickness qualified, minimum" unit="mm" />
        <Num field={f.thicknessMaxMm!} label="Thickness qualified, maximum" unit="mm" hint="Empty: unlimited." />
        <Num field={f.diameterMinMm!} label="Pipe or tube diameter, minimum" unit="mm" hint="Empty: plate, or any diameter." />
        <Num field={f.diameterMaxMm!} label="Pipe or tube diameter, maximum" unit="mm" hint="Empty: unlimited." />
        <Num field={f.fillerFNumber!} label="Filler F-No." hint="ASME IX QW-432 grouping, e.g. 6 for solid steel wire." />
        <div>
          <label className="field-label" htmlFor={f.testDate!.id}>Test date</label>
          <input {...getInputProps(f.testDate!, { type: "date" })} key={f.testDate!.key} className="field-input figures" />
          <p className="field-error" id={f.testDate!.errorId}>{f.testDate!.errors?.[0]}</p>
        </div>
        <div>
          <label className="field-label" htmlFor={f.wpsId!.id}>WPS followed on the test</label>
          <select {...getSelectProps(f.wpsId!)} key={f.wpsId!.key} className="field-input">
            <option value="">None from the library</option>
            {wpsOptions.map((w) => <option key={w.wpsId} value={w.wpsId}>{w.reference} · {w.process ?? "?"} · {w.title}</option>)}
          </select>
          <p className="field-error" id={f.wpsId!.errorId}>{f.wpsId!.errors?.[0]}</p>
        </div>
        <div>
          <label className="field-label" htmlFor={f.lastUsedOn!.id}>Used on a job on (paper records)</label>
          <input {...getInputProps(f.lastUsedOn!, { type: "date" })} key={f.lastUsedOn!.key} className="field-input figures" />
          <p className="text-xs text-graphite-600">Optional: a use before the shop logged passes in Gusset. The last use only ever moves forward.</p>
          <p className="field-error" id={f.lastUsedOn!.errorId}>{f.lastUsedOn!.errors?.[0]}</p>
        </div>
      </div>
      <fieldset>
        <legend className="field-label">Positions qualified</legend>
        <div className="flex flex-wrap gap-2">
          {WPS_POSITIONS.map((p) => (
            <label key={p} className="figures flex min-h-11 items-center gap-2 rounded-md border-2 border-graphite-300 px-3">
              <input type="checkbox" name={f.positions!.name} value={p} defaultChecked={checked.has(p)} className="h-5 w-5" />
              {p}
            </label>
          ))}
        </div>
        <p className="field-error" id={f.positions!.errorId}>{f.positions!.errors?.[0]}</p>
      </fieldset>
      <div>
        <label className="field-label" htmlFor={f.notes!.id}>Notes</label>
        <textarea {...getTextareaProps(f.notes!)} key={f.notes!.key} className="field-input min-h-16" placeholder="Coupon, test type, certifying body" />
        <p className="field-error" id={f.notes!.errorId}>{f.notes!.errors?.[0]}</p>
      </div>
      <FormMessage ok={state?.ok} errors={form.errors} testId="qualification" />
      <button className="btn btn-primary" type="submit" disabled={pending}>{pending ? "Saving…" : editing ? "Save changes" : "Add the qualification"}</button>
    </form>
  );
}
