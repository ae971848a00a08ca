"use client";
import { getFormProps, getInputProps, getTextareaProps, useForm } from "@conform-to/react";
import { parseWithZod } from "@conform-to/zod/v4";
import { startTransition, useActionState } from "react";
import type { z } from "zod";
import { FormMessage } from "@/components/form-message";
import { metaFormSchema } from "@/lib/procedures/forms";
import { saveMetaAction } from "../../actions";

export function MetaForm({ procedureId, number, title, scope, code }: { procedureId: string; number: number; title: string; scope: string; code: string }) {
  const [state, formAction, pending] = useActionState(saveMetaAction, undefined);
  const [form, fields] = useForm<z.input<typeof metaFormSchema>, z.output<typeof metaFormSchema>>({
    id: "procedure-meta",
    lastResult: state,
    defaultValue: { title, scope, code },
    shouldValidate: "onSubmit",
    shouldRevalidate: "onInput",
    onValidate: ({ formData }) => parseWithZod(formData, { schema: metaFormSchema }),
    onSubmit(event, { formData }) {
      event.preventDefault();
      startTransition(() => formAction(formData));
    },
  });
  return (
    <form {...getFormProps(form)} action={formAction} className="space-y-2" data-testid="meta-form">
      <input type="hidden" name="procedureId" value={procedureId} />
      <input type="hidden" name="number" value={number} />
      <div>
        <label className="field-label" htmlFor={fields.title.id}>Title</label>
        <input {...getInputProps(fields.title, { type: "text" })} key={fields.title.key} className="field-input" />
        <p className="field-error" id={fields.title.errorId}>{fields.title.errors?.[0]}</p>
      </div>
      <div>
        <label className="field-label" htmlFor={fields.code.id}>Code or standard it follows</label>
        <input {...getInputProps(fields.code, { type: "text" })} key={fields.code.key} className="field-input" placeholder="e.g. AWS D1.1 visual acceptance, statically loaded" />
        <p className="field-error" id={fields.code.errorId}>{fields.code.errors?.[0]}</p>
      </div>
      <div>
        <label className="field-label" htmlFor={fields.scope.id}>Scope (Markdown)</label>
        <textarea {...getTextareaProps(fields.scope)} key={fields.scope.key} rows={5} className="field-input" />
        <p className="field-error" id={fields.scope.errorId}>{fields.scope.errors?.[0]}</p>
      </div>
      <FormMessage ok={state?.ok} errors={form.errors} testId="meta" />
      <button type="submit" className="btn btn-quiet" disabled={pending}>{pending ? "Saving…" : "Save details"}</button>
    </form>
  );
}
