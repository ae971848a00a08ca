"use client";
import { getFormProps, getInputProps, useForm } from "@conform-to/react";
import { parseWithZod } from "@conform-to/zod/v4";
import { startTransition, useActionState } from "react";
import type { z } from "zod";
import { FormMessage } from "@/components/form-message";
import { pinFormSchema } from "@/lib/schemas/account";
import { savePin } from "../actions";

const schema = pinFormSchema;

export function PinForm() {
  const [state, formAction, pending] = useActionState(savePin, undefined);
  const [form, fields] = useForm<z.input<typeof schema>, z.output<typeof schema>>({
    id: "pin",
    lastResult: state,
    shouldValidate: "onSubmit",
    shouldRevalidate: "onInput",
    onValidate: ({ formData }) => parseWithZod(formData, { schema }),
    onSubmit(event, { formData }) {
      event.preventDefault();
      startTransition(() => formAction(formData));
    },
  });
  return (
    <form {...getFormProps(form)} action={formAction} className="card max-w-md space-y-1 p-4" noValidate data-testid="pin-form">
      <h2 className="mb-2 font-bold">Signing PIN</h2>
      <p className="mb-3 text-sm text-graphite-600">4 to 8 digits. Every sign-off asks for it; 5 wrong tries lock signing until a lead resets it.</p>
      {(["password", "pin", "confirm"] as const).map((name) => (
        <div key={name}>
          <label className="field-label" htmlFor={fields[name].id}>
            {name === "password" ? "Account password" : name === "pin" ? "New PIN" : "New PIN again"}
          </label>
          <input
            {...getInputProps(fields[name], { type: "password" })}
            key={fields[name].key}
            className="field-input figures"
            inputMode={name === "password" ? undefined : "numeric"}
            autoComplete={name === "password" ? "current-password" : "off"}
          />
          <p className="field-error" id={fields[name].errorId}>{fields[name].errors?.[0]}</p>
        </div>
      ))}
      <FormMessage ok={state?.ok} errors={form.errors} testId="pin" />
      <button className="btn btn-primary" type="submit" disabled={pending}>{pending ? "Saving…" : "Save PIN"}</button>
    </form>
  );
}
