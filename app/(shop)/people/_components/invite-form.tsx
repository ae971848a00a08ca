"use client";
import { getFormProps, getInputProps, useForm } from "@conform-to/react";
import { parseWithZod } from "@conform-to/zod/v4";
import { startTransition, useActionState } from "react";
import type { z } from "zod";
import { FormMessage } from "@/components/form-message";
import { ROLE_LABELS, ROLES } from "@/lib/authz";
import { inviteSchema } from "@/lib/schemas/auth";
import { invitePerson } from "../actions";

export function InviteForm() {
  const [state, formAction, pending] = useActionState(invitePerson, undefined);
  const [form, fields] = useForm<z.input<typeof inviteSchema>, z.output<typeof inviteSchema>>({
    id: "invite",
    lastResult: state,
    shouldValidate: "onSubmit",
    shouldRevalidate: "onInput",
    onValidate: ({ formData }) => parseWithZod(formData, { schema: inviteSchema }),
    onSubmit(event, { formData }) {
      event.preventDefault();
      startTransition(() => formAction(formData));
    },
  });
  return (
    <form {...getFormProps(form)} action={formAction} className="card space-y-2 p-4" noValidate data-testid="invite-form">
      <h2 className="font-bold">Invite someone</h2>
      <div>
        <label className="field-label" htmlFor={fields.email.id}>E-mail</label>
        <input {...getInputProps(fields.email, { type: "email" })} key={fields.email.key} className="field-input" />
        <p className="field-error" id={fields.email.errorId}>{fields.email.errors?.[0]}</p>
      </div>
      <fieldset>
        <legend className="field-label">Roles</legend>
        <div className="flex flex-wrap gap-2">
          {ROLES.map((r) => (
            <label key={r} className="flex min-h-11 items-center gap-2 rounded-md border-2 border-graphite-300 px-3">
              <input type="checkbox" name={fields.roles.name} value={r} className="h-5 w-5" defaultChecked={r === "welder"} />
              {ROLE_LABELS[r]}
            </label>
          ))}
        </div>
        <p className="field-error" id={fields.roles.errorId}>{fields.roles.errors?.[0]}</p>
      </fieldset>
      <FormMessage ok={state?.ok} errors={form.errors} testId="invite" />
      <button className="btn btn-primary" type="submit" disabled={pending}>{pending ? "Sending…" : "Send invitation"}</button>
    </form>
  );
}
