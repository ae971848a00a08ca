"use client";
import { getFormProps, getInputProps, useForm } from "@conform-to/react";
import { parseWithZod } from "@conform-to/zod/v4";
import Link from "next/link";
import { startTransition, useActionState } from "react";
import type { z } from "zod";
import { FormMessage } from "@/components/form-message";
import { acceptInviteSchema } from "@/lib/schemas/auth";
import { acceptInvite } from "../actions";

export function AcceptForm({ token }: { token: string }) {
  const [state, formAction, pending] = useActionState(acceptInvite, undefined);
  const [form, fields] = useForm<z.input<typeof acceptInviteSchema>, z.output<typeof acceptInviteSchema>>({
    id: "accept",
    lastResult: state,
    shouldValidate: "onSubmit",
    shouldRevalidate: "onInput",
    onValidate: ({ formData }) => parseWithZod(formData, { schema: acceptInviteSchema }),
    onSubmit(event, { formData }) {
      event.preventDefault();
      startTransition(() => formAction(formData));
    },
  });
  if (state?.ok) {
    return (
      <div className="space-y-3">
        <FormMessage ok={state.ok} testId="accept" />
        <Link className="btn btn-primary w-full" href="/sign-in">Go to sign-in</Link>
      </div>
    );
  }
  return (
    <form {...getFormProps(form)} action={formAction} className="space-y-1" noValidate>
      <input type="hidden" name="token" value={token} />
      {(
        [
          ["name", "Your name as it appears on sign-offs", "text", "name"],
          ["password", "Choose a password (10+ characters)", "password", "new-password"],
          ["confirm", "Password again", "password", "new-password"],
        ] as const
      ).map(([name, label, type, autoComplete]) => (
        <div key={name}>
          <label className="field-label" htmlFor={fields[name].id}>{label}</label>
          <input {...getInputProps(fields[name], { type })} key={fields[name].key} className="field-input" autoComplete={autoComplete} />
          <p className="field-error" id={fields[name].errorId}>{fields[name].errors?.[0]}</p>
        </div>
      ))}
      <FormMessage errors={form.errors} testId="accept" />
      <button className="btn btn-primary w-full" type="submit" disabled={pending}>{pending ? "Joining…" : "Join the shop"}</button>
    </form>
  );
}
