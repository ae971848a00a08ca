"use client";
import { getFormProps, getInputProps, getSelectProps, getTextareaProps, useForm } from "@conform-to/react";
import { parseWithZod } from "@conform-to/zod/v4";
import { startTransition, useActionState, useState } from "react";
import type { z } from "zod";
import { FormMessage } from "@/components/form-message";
import type { JobFormOptions } from "@/db/queries/jobs";
import { createJobSchema } from "@/lib/jobs/schemas";
import { checkVin } from "@/lib/vin";
import { createJobAction } from "../actions";

function Field({ label, htmlFor, error, errorId, children, hint }: { label: string; htmlFor: string; error?: string; errorId: string; children: React.ReactNode; hint?: React.ReactNode }) {
  return (
    <div>
      <label className="field-label" htmlFor={htmlFor}>{label}</label>
      {children}
      {hint}
      <p className="field-error" id={errorId}>{error}</p>
    </div>
  );
}

export function NewJobForm({ options }: { options: JobFormOptions }) {
  const [state, formAction, pending] = useActionState(createJobAction, undefined);
  const [vin, setVin] = useState("");
  const [form, fields] = useForm<z.input<typeof createJobSchema>, z.output<typeof createJobSchema>>({
    id: "new-job",
    lastResult: state,
    shouldValidate: "onSubmit",
    shouldRevalidate: "onInput",
    onValidate: ({ formData }) => parseWithZod(formData, { schema: createJobSchema }),
    onSubmit(event, { formData }) {
      event.preventDefault();
      startTransition(() => formAction(formData));
    },
  });
  const vinCheck = vin.trim() ? checkVin(vin) : null;
  return (
    <form {...getFormProps(form)} action={formAction} noValidate className="space-y-6" data-testid="new-job-form">
      <section className="card grid gap-x-4 p-4 md:grid-cols-3" aria-labelledby="cust-h">
        <h2 id="cust-h" className="mb-2 font-bold md:col-span-3">Customer</h2>
        <Field label="Name" htmlFor={fields.customerName.id} error={fields.customerName.errors?.[0]} errorId={fields.customerName.errorId}>
          <input {...getInputProps(fields.customerName, { type: "text" })} key={fields.customerName.key} className="field-input" autoComplete="off" />
        </Field>
        <Field label="Phone" htmlFor={fields.customerPhone.id} error={fields.customerPhone.errors?.[0]} errorId={fields.customerPhone.errorId}>
          <input {...getInputProps(fields.customerPhone, { type: "tel" })} key={fields.customerPhone.key} className="field-input" autoComplete="off" />
        </Field>
        <Field label="E-mail" htmlFor={fields.customerEmail.id} error={fields.customerEmail.errors?.[0]} errorId={fields.customerEmail.errorId}>
          <input {...getInputProps(fields.customerEmail, { type: "email" })} key={fields.customerEmail.key} className="field-input" autoComplete="off" />
        </Field>
      </section>
      <section className="card grid gap-x-4 p-4 md:grid-cols-3" aria-labelledby="veh-h">
        <h2 id="veh-h" className="mb-2 font-bold md:col-span-3">Vehicle and axle</h2>
        <Field label="Model year" htmlFor={fields.vehicleYear.id} error={fields.vehicleYear.errors?.[0]} errorId={fields.vehicleYear.errorId}>
          <input {...getInputProps(fields.vehicleYear, { type: "text" })} key={fields.vehicleYear.key} inputMode="numeric" className="field-input" />
        </Field>
        <div className="md:col-span-2">
          <Field label="Make and model" htmlFor={fields.vehicleMakeModel.id} error={fields.vehicleMakeModel.errors?.[0]} errorId={fields.vehicleMakeModel.errorId}>
            <input {...getInputProps(fields.vehicleMakeModel, { type: "text" })} key={fields.vehicleMakeModel.key} className="field-input" placeholder="e.g. mid-size pickup, 4-door" />
          </Field>
        </div>
        <div className="md:col-span-3">
          <Field
            label="VIN"
            htmlFor={fields.vin.id}
            error={fields.vin.errors?.[0]}
            errorId={fields.vin.errorId}
            hint={
              <p className="mt-1 min-h-5 text-sm font-semibold" aria-live="polite" data-testid="vin-check">
                {vinCheck ? (vinCheck.warnings.length ? <span className="text-verdict-warn">▲ {vinCheck.warnings.join(" ")} The job can still be saved.</span> : <span className="text-verdict-pass">● Check digit matches (49 CFR 565.15).</span>) : null}
              </p>
            }
          >
            <input {...getInputProps(fields.vin, { type: "text" })} key={fields.vin.key} className="field-input figures uppercase" maxLength={40} onInput={(e) => setVin(e.currentTarget.value)} autoComplete="off" />
          </Field>
        </div>
        <div className="md:col-span-2">
          <Field label="Axle or frame part" htmlFor={fields.axleDescription.id} error={fields.axleDescription.errors?.[0]} errorId={fields.axleDescription.errorId}>
            <input {...getInputProps(fields.axleDescription, { type: "text" })} key={fields.axleDescription.key} className="field-input" placeholder="e.g. front solid axle housing, passenger-side tube" />
          </Field>
        </div>
        <Field label="Axle ID tag" htmlFor={fields.axleTag.id} error={fields.axleTag.errors?.[0]} errorId={fields.axleTag.errorId}>
          <input {...getInputProps(fields.axleTag, { type: "text" })} key={fields.axleTag.key} className="field-input figures" />
        </Field>
      </section>
      <section className="card grid gap-x-4 p-4 md:grid-cols-3" aria-labelledby="work-h">
        <h2 id="work-h" className="mb-2 font-bold md:col-span-3">Work</h2>
        <div className="md:col-span-3">
          <Field label="Procedure (published version, pinned for the life of the job)" htmlFor={fields.procedureVersionId.id} error={fields.procedureVersionId.errors?.[0]} errorId={fields.procedureVersionId.errorId}>
            <select {...getSelectProps(fields.procedureVersionId)} key={fields.procedureVersionId.key} className="field-input">
              <option value="">Choose…</option>
              {options.versions.map((v) => <option key={v.id} value={v.id}>{v.title} — v{v.number} ({v.steps} steps)</option>)}
            </select>
          </Field>
        </div>
        <fieldset className="md:col-span-2">
          <legend className="field-label">Welders</legend>
          <div className="flex flex-wrap gap-2">
            {options.welders.map((w) => (
              <label key={w.id} className="flex min-h-11 items-center gap-2 rounded-md border-2 border-graphite-300 px-3">
                <input type="checkbox" name={fields.welderIds.name} value={w.id} className="h-5 w-5" />
                {w.name}
              </label>
            ))}
          </div>
          <p className="field-error" id={fields.welderIds.errorId}>{fields.welderIds.errors?.[0]}</p>
        </fieldset>
        <Field label="Inspector" htmlFor={fields.inspectorId.id} error={fields.inspectorId.errors?.[0]} errorId={fields.inspectorId.errorId}>
          <select {...getSelectProps(fields.inspectorId)} key={fields.inspectorId.key} className="field-input">
            <option value="">Not yet</option>
            {options.inspectors.map((i) => <option key={i.id} value={i.id}>{i.name}</option>)}
          </select>
        </Field>
        <Field label="Due date" htmlFor={fields.dueDate.id} error={fields.dueDate.errors?.[0]} errorId={fields.dueDate.errorId}>
          <input {...getInputProps(fields.dueDate, { type: "date" })} key={fields.dueDate.key} className="field-input" />
        </Field>
        <div className="md:col-span-2">
          <Field label="Notes" htmlFor={fields.notes.id} error={fields.notes.errors?.[0]} errorId={fields.notes.errorId}>
            <textarea {...getTextareaProps(fields.notes)} key={fields.notes.key} className="field-input min-h-20" />
          </Field>
        </div>
      </section>
      <FormMessage ok={state?.ok} errors={form.errors} testId="new-job" />
      <button className="btn btn-primary min-h-12 px-6" type="submit" disabled={pending} data-testid="create-job">{pending ? "Creating…" : "Create job"}</button>
    </form>
  );
}
