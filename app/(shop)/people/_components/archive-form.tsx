"use client";
import { getFormProps, getInputProps, useForm } from "@conform-to/react";
import { parseWithZod } from "@conform-to/zod/v4";
import { startTransition, useActionState } from "react";
import type { z } from "zod";
import { FormMessage } from "@/components/form-message";
import { archiveAddressSchema } from "@/lib/schemas/people";
import { saveArchiveAddress } from "../actions";

// Where each release's seal is mailed: a copy outside the database that a rewritten record cannot match.
export function ArchiveForm({ email, recipients }: { email: string | null; recipients: string[] }) {
  const [state, formAction, pending] = useActionState(saveArchiveAddress, undefined);
  const [form, fields] = useForm<z.input<typeof archiveAddressSchema>, z.output<typeof archiveAddressSchema>>({
    id: "archive",
    lastResult: state,
    defaultValue: { email: email ?? "" },
    shouldValidate: "onSubmit",
    shouldRevalidate: "onInput",
    onValidate: ({ formData }) => parseWithZod(formData, { schema: archiveAddressSchema }),
    onSubmit(event, { formData }) {
      event.preventDefault();
      startTransition(() => formAction(formData));
    },
  });
  return (
    <form {...getFormProps(form)} action={formAction} className="card space-y-2 p-4" noValidate data-testid="archive-form">
      <h2 className="font-bold">Seal archive</h2>
      <p className="text-sm text-graphite-700">
        Each release mails its seal here, a copy kept outside Gusset&apos;s database. Empty: the shop&apos;s leads get it
        {email ? "" : <> (now: {recipients.length ? recipients.join(", ") : "no active lead"})</>}.
      </p>
      <div>
        <label className="field-label" htmlFor={fields.email.id}>Archive e-mail</label>
        <input {...getInputProps(fields.email, { type: "email" })} key={fields.email.key} className="field-input" autoComplete="off" />
        <p className="field-error" id={fields.email.errorId}>{fields.email.errors?.[0]}</p>
      </div>
      <FormMessage ok={state?.ok} errors={form.errors} testId="archive" />
      <button className="btn btn-quiet" type="submit" disabled={pending}>Save archive address</button>
    </form>
  );
}
