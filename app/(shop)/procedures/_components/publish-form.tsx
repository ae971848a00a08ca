"use client";
import { getFormProps, getTextareaProps, useForm } from "@conform-to/react";
import { parseWithZod } from "@conform-to/zod/v4";
import { startTransition, useActionState } from "react";
import type { z } from "zod";
import { FormMessage } from "@/components/form-message";
import { publishFormSchema } from "@/lib/procedures/forms";
import { publishAction } from "../actions";

export function PublishForm({ procedureId, number, currentPublished, blocked }: { procedureId: string; number: number; currentPublished: number | null; blocked: boolean }) {
  const [state, formAction, pending] = useActionState(publishAction, undefined);
  const [form, fields] = useForm<z.input<typeof publishFormSchema>, z.output<typeof publishFormSchema>>({
    id: "publish",
    lastResult: state,
    shouldValidate: "onSubmit",
    shouldRevalidate: "onInput",
    onValidate: ({ formData }) => parseWithZod(formData, { schema: publishFormSchema }),
    onSubmit(event, { formData }) {
      event.preventDefault();
      startTransition(() => formAction(formData));
    },
  });
  return (
    <form {...getFormProps(form)} action={formAction} className="card space-y-3 p-4" data-testid="publish-form">
      <input type="hidden" name="procedureId" value={procedureId} />
      <input type="hidden" name="number" value={number} />
      <h2 className="text-lg font-bold">Publish version {number}</h2>
      <div>
        <label className="field-label" htmlFor={fields.changeNote.id}>Change note (required): what changed and why</label>
        <textarea {...getTextareaProps(fields.changeNote)} key={fields.changeNote.key} rows={4} className="field-input" />
        <p className="field-error" id={fields.changeNote.errorId} data-testid="error-changeNote">{fields.changeNote.errors?.[0]}</p>
      </div>
      {currentPublished ? (
        <label className="flex min-h-11 items-start gap-2">
          <input type="checkbox" name="retirePrevious" defaultChecked className="mt-1 h-5 w-5" />
          <span>
            Retire version {currentPublished} when this one is published
            <span className="block text-sm text-graphite-600">It stays readable for the jobs that pinned it; new jobs take version {number}.</span>
          </span>
        </label>
      ) : null}
      <p className="text-sm text-graphite-700">Publishing seals the version with the SHA-256 of its content. From then on it never changes, for anyone.</p>
      <FormMessage errors={form.errors} testId="publish" />
      <button type="submit" className="btn btn-primary" disabled={pending || blocked}>{pending ? "Publishing…" : `Publish version ${number}`}</button>
    </form>
  );
}
