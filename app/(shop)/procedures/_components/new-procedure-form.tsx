"use client";
import { getFormProps, getInputProps, getTextareaProps, useForm } from "@conform-to/react";
import { parseWithZod } from "@conform-to/zod/v4";
import { startTransition, useActionState, useRef } from "react";
import type { z } from "zod";
import { FormMessage } from "@/components/form-message";
import { newProcedureFormSchema } from "@/lib/procedures/forms";
import { createProcedureAction } from "../actions";

type Template = { slug: string; title: string; scope: string; code: string; steps: number };

export function NewProcedureForm({ templates }: { templates: Template[] }) {
  const [state, formAction, pending] = useActionState(createProcedureAction, undefined);
  const ref = useRef<HTMLFormElement>(null);
  const [form, fields] = useForm<z.input<typeof newProcedureFormSchema>, z.output<typeof newProcedureFormSchema>>({
    id: "new-procedure",
    lastResult: state,
    shouldValidate: "onSubmit",
    shouldRevalidate: "onInput",
    onValidate: ({ formData }) => parseWithZod(formData, { schema: newProcedureFormSchema }),
    onSubmit(event, { formData }) {
      event.preventDefault();
      startTransition(() => formAction(formData));
    },
  });
  // Choosing a starter fills the fields the lead has not typed in yet.
  const pick = (slug: string) => {
    const t = templates.find((x) => x.slug === slug);
    const el = ref.current;
    if (!t || !el) return;
    const set = (name: string, value: string) => {
      const input = el.elements.namedItem(name) as HTMLInputElement | HTMLTextAreaElement | null;
      if (input && !input.value.trim()) input.value = value;
    };
    set("title", t.title);
    set("scope", t.scope);
    set("code", t.code);
  };
  return (
    <form {...getFormProps(form)} ref={ref} action={formAction} className="card max-w-3xl space-y-3 p-4" data-testid="new-procedure-form">
      <div>
        <label className="field-label" htmlFor="template">Start from</label>
        <select id="template" name={fields.template.name} defaultValue="" className="field-input" onChange={(e) => pick(e.currentTarget.value)}>
          <option value="">An empty procedure</option>
          {templates.map((t) => (
            <option key={t.slug} value={t.slug}>Starter: {t.title} ({t.steps} steps)</option>
          ))}
        </select>
        <p className="field-error" id={fields.template.errorId}>{fields.template.errors?.[0]}</p>
      </div>
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
      <FormMessage errors={form.errors} testId="new-procedure" />
      <button className="btn btn-primary" type="submit" disabled={pending}>{pending ? "Creating…" : "Create draft"}</button>
    </form>
  );
}
