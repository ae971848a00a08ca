"use client";
import { getFormProps, getTextareaProps, useForm } from "@conform-to/react";
import { parseWithZod } from "@conform-to/zod/v4";
import { startTransition, useActionState } from "react";
import { z } from "zod";
import { FormMessage } from "@/components/form-message";
import { changeNoteSchema, retireSchema } from "@/lib/welding/wps-schema";
import { newRevisionAction, publishAction, retireAction } from "../actions";

const publishForm = z.object({ changeNote: changeNoteSchema });
const retireForm = z.object({ reason: retireSchema.shape.reason });

export function PublishForm({ wpsId, number, reference, missing }: { wpsId: string; number: number; reference: string; missing: string[] }) {
  const [state, formAction, pending] = useActionState(publishAction, undefined);
  const [form, fields] = useForm<z.input<typeof publishForm>, z.output<typeof publishForm>>({
    id: `publish-${wpsId}-${number}`,
    lastResult: state,
    shouldValidate: "onSubmit",
    shouldRevalidate: "onInput",
    onValidate: ({ formData }) => parseWithZod(formData, { schema: publishForm }),
    onSubmit(event, { formData }) {
      event.preventDefault();
      startTransition(() => formAction(formData));
    },
  });
  return (
    <form {...getFormProps(form)} action={formAction} className="card space-y-2 p-4" noValidate data-testid="publish-form">
      <h2 className="font-bold">Publish revision {number}</h2>
      <p className="text-sm text-graphite-600">
        Publishing takes the saved draft. From then on {reference} revision {number} never changes, and the revision in use before it is retired.
      </p>
      {missing.length ? (
        <div className="rounded-md border-2 border-verdict-warn bg-verdict-warnbg p-3 text-sm text-verdict-warn" data-testid="publish-missing">
          <p className="font-semibold"><span aria-hidden="true">▲ </span>Before it can be published, fill in:</p>
          <ul className="ml-5 list-disc">{missing.map((m) => <li key={m}>{m}</li>)}</ul>
        </div>
      ) : null}
      <input type="hidden" name="wpsId" value={wpsId} />
      <input type="hidden" name="number" value={number} />
      <div>
        <label className="field-label" htmlFor={fields.changeNote.id}>Change note</label>
        <textarea {...getTextareaProps(fields.changeNote)} key={fields.changeNote.key} className="field-input min-h-24" placeholder="What changed, and why" />
        <p className="field-error" id={fields.changeNote.errorId}>{fields.changeNote.errors?.[0]}</p>
      </div>
      <FormMessage ok={state?.ok} errors={form.errors} testId="publish" />
      <button className="btn btn-primary" type="submit" disabled={pending}>{pending ? "Publishing…" : `Publish revision ${number}`}</button>
    </form>
  );
}

export function RetireForm({ wpsId, number }: { wpsId: string; number: number }) {
  const [state, formAction, pending] = useActionState(retireAction, undefined);
  const [form, fields] = useForm<z.input<typeof retireForm>, z.output<typeof retireForm>>({
    id: `retire-${wpsId}-${number}`,
    lastResult: state,
    shouldValidate: "onSubmit",
    shouldRevalidate: "onInput",
    onValidate: ({ formData }) => parseWithZod(formData, { schema: retireForm }),
    onSubmit(event, { formData }) {
      event.preventDefault();
      startTransition(() => formAction(formData));
    },
  });
  return (
    <details className="card p-4" data-testid="retire">
      <summary className="cursor-pointer font-bold">Retire revision {number}</summary>
      <form {...getFormProps(form)} action={formAction} className="mt-2 space-y-2" noValidate data-testid="retire-form">
        <p className="text-sm text-graphite-600">The WPS goes out of use: no new weld may follow it until a new revision is published. Its text stays readable.</p>
        <input type="hidden" name="wpsId" value={wpsId} />
        <input type="hidden" name="number" value={number} />
        <div>
          <label className="field-label" htmlFor={fields.reason.id}>Why it goes out of use</label>
          <textarea {...getTextareaProps(fields.reason)} key={fields.reason.key} className="field-input min-h-20" />
          <p className="field-error" id={fields.reason.errorId}>{fields.reason.errors?.[0]}</p>
        </div>
        <FormMessage ok={state?.ok} errors={form.errors} testId="retire" />
        <button className="btn btn-danger" type="submit" disabled={pending}>{pending ? "Retiring…" : `Retire revision ${number}`}</button>
      </form>
    </details>
  );
}

export function NewRevisionForm({ wpsId, next }: { wpsId: string; next: number }) {
  const [state, formAction, pending] = useActionState(newRevisionAction, undefined);
  const errors = state?.error ? (Object.values(state.error).flat().filter(Boolean) as string[]) : undefined;
  return (
    <form action={formAction} className="space-y-2" data-testid="new-revision-form">
      <input type="hidden" name="wpsId" value={wpsId} />
      <button className="btn btn-primary" type="submit" disabled={pending}>{pending ? "Starting…" : `Start revision ${next}`}</button>
      <FormMessage errors={errors} testId="new-revision" />
    </form>
  );
}
