"use client";
import { getFormProps, getInputProps, useForm } from "@conform-to/react";
import { parseWithZod } from "@conform-to/zod/v4";
import { startTransition, useActionState } from "react";
import type { z } from "zod";
import { FormMessage } from "@/components/form-message";
import { sectionFormSchema } from "@/lib/procedures/forms";
import { sectionAction } from "../../actions";

// Adds a section (no sectionKey) or renames one.
export function SectionForm({ procedureId, number, sectionKey, title, compact = false }: { procedureId: string; number: number; sectionKey?: string; title?: string; compact?: boolean }) {
  const [state, formAction, pending] = useActionState(sectionAction, undefined);
  const [form, fields] = useForm<z.input<typeof sectionFormSchema>, z.output<typeof sectionFormSchema>>({
    id: `section-${sectionKey ?? "new"}`,
    lastResult: state,
    defaultValue: { title: title ?? "" },
    shouldValidate: "onSubmit",
    shouldRevalidate: "onInput",
    onValidate: ({ formData }) => parseWithZod(formData, { schema: sectionFormSchema }),
    onSubmit(event, { formData }) {
      event.preventDefault();
      startTransition(() => formAction(formData));
    },
  });
  return (
    <form {...getFormProps(form)} action={formAction} className={compact ? "space-y-1" : "card space-y-2 p-3"} data-testid={sectionKey ? `rename-${sectionKey}` : "add-section"}>
      <input type="hidden" name="procedureId" value={procedureId} />
      <input type="hidden" name="number" value={number} />
      {sectionKey ? <input type="hidden" name="sectionKey" value={sectionKey} /> : null}
      <label className="field-label" htmlFor={fields.title.id}>{sectionKey ? "Section title" : "New section"}</label>
      <div className="flex gap-2">
        <input {...getInputProps(fields.title, { type: "text" })} key={fields.title.key} className="field-input" placeholder={sectionKey ? undefined : "e.g. Fit-up"} />
        <button type="submit" className="btn btn-quiet shrink-0" disabled={pending}>{sectionKey ? "Rename" : "Add section"}</button>
      </div>
      <p className="field-error" id={fields.title.errorId}>{fields.title.errors?.[0]}</p>
      <FormMessage errors={form.errors} />
    </form>
  );
}
