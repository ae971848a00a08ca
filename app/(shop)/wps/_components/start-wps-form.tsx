"use client";
import { getFormProps, getInputProps, getSelectProps, useForm } from "@conform-to/react";
import { parseWithZod } from "@conform-to/zod/v4";
import { startTransition, useActionState } from "react";
import type { z } from "zod";
import { FormMessage } from "@/components/form-message";
import { PROCESS_INFO } from "@/lib/welding/processes";
import { WPS_PROCESSES, wpsCreateSchema } from "@/lib/welding/wps-schema";
import { startWpsAction } from "../actions";

export function StartWpsForm() {
  const [state, formAction, pending] = useActionState(startWpsAction, undefined);
  const [form, fields] = useForm<z.input<typeof wpsCreateSchema>, z.output<typeof wpsCreateSchema>>({
    id: "start-wps",
    lastResult: state,
    shouldValidate: "onSubmit",
    shouldRevalidate: "onInput",
    onValidate: ({ formData }) => parseWithZod(formData, { schema: wpsCreateSchema }),
    onSubmit(event, { formData }) {
      event.preventDefault();
      startTransition(() => formAction(formData));
    },
  });
  return (
    <form {...getFormProps(form)} action={formAction} className="card h-fit space-y-2 p-4" noValidate data-testid="start-wps-form">
      <h2 className="font-bold">Start a WPS</h2>
      <p className="text-sm text-graphite-600">Revision 1 starts as a draft; fill in the rest in the editor, then publish it.</p>
      <div>
        <label className="field-label" htmlFor={fields.reference.id}>Reference</label>
        <input {...getInputProps(fields.reference, { type: "text" })} key={fields.reference.key} className="field-input figures uppercase" placeholder="GX-WPS-04" autoComplete="off" />
        <p className="field-error" id={fields.reference.errorId}>{fields.reference.errors?.[0]}</p>
      </div>
      <div>
        <label className="field-label" htmlFor={fields.title.id}>Title</label>
        <input {...getInputProps(fields.title, { type: "text" })} key={fields.title.key} className="field-input" placeholder="What, on what, in which positions" />
        <p className="field-error" id={fields.title.errorId}>{fields.title.errors?.[0]}</p>
      </div>
      <div>
        <label className="field-label" htmlFor={fields.process.id}>Process</label>
        <select {...getSelectProps(fields.process)} key={fields.process.key} className="field-input">
          <option value="">Choose…</option>
          {WPS_PROCESSES.map((p) => <option key={p} value={p}>{p}: {PROCESS_INFO[p].name}</option>)}
        </select>
        <p className="field-error" id={fields.process.errorId}>{fields.process.errors?.[0]}</p>
      </div>
      <FormMessage ok={state?.ok} errors={form.errors} testId="start-wps" />
      <button className="btn btn-primary" type="submit" disabled={pending}>{pending ? "Starting…" : "Start the draft"}</button>
    </form>
  );
}
