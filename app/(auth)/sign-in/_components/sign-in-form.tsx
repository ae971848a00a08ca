"use client";
import { getFormProps, getInputProps, useForm } from "@conform-to/react";
import { parseWithZod } from "@conform-to/zod/v4";
import { useRouter, useSearchParams } from "next/navigation";
import { useState } from "react";
import { authClient } from "@/lib/auth/client";
import { signInSchema } from "@/lib/schemas/auth";

function messageFor(status: number, fallback?: string) {
  if (status === 429) return fallback ?? "Too many sign-in attempts from here. Wait a few minutes, then try again.";
  if (status === 401 || status === 400) return "That e-mail and password do not match an account. Check both and try again.";
  if (status === 403) return fallback ?? "This account cannot sign in.";
  return "Sign-in is not available right now. Try again in a moment.";
}

export function SignInForm() {
  const router = useRouter();
  const next = useSearchParams().get("next");
  const [error, setError] = useState<string | null>(null);
  const [pending, setPending] = useState(false);
  const [form, fields] = useForm({
    id: "sign-in",
    shouldValidate: "onSubmit",
    shouldRevalidate: "onInput",
    onValidate: ({ formData }) => parseWithZod(formData, { schema: signInSchema }),
    onSubmit: async (event, { submission }) => {
      event.preventDefault();
      if (submission?.status !== "success") return;
      setPending(true);
      setError(null);
      const { error: failure } = await authClient.signIn.email({ email: submission.value.email, password: submission.value.password });
      if (failure) {
        setPending(false);
        setError(messageFor(failure.status, failure.message));
        return;
      }
      router.replace(next && next.startsWith("/") && !next.startsWith("//") ? next : "/");
      router.refresh();
    },
  });
  return (
    <form {...getFormProps(form)} className="space-y-1" noValidate>
      <div>
        <label className="field-label" htmlFor={fields.email.id}>E-mail</label>
        <input {...getInputProps(fields.email, { type: "email" })} key={fields.email.key} className="field-input" autoComplete="username" />
        <p className="field-error" id={fields.email.errorId}>{fields.email.errors?.[0]}</p>
      </div>
      <div>
        <label className="field-label" htmlFor={fields.password.id}>Password</label>
        <input {...getInputProps(fields.password, { type: "password" })} key={fields.password.key} className="field-input" autoComplete="current-password" />
        <p className="field-error" id={fields.password.errorId}>{fields.password.errors?.[0]}</p>
      </div>
      <div className="min-h-12" aria-live="polite">
        {error ? (
          <p data-testid="sign-in-error" className="rounded-md border-2 border-verdict-fail bg-verdict-failbg px-3 py-2 text-sm font-semibold text-verdict-fail">
            <span aria-hidden="true">✕ </span>{error}
          </p>
        ) : null}
      </div>
      <button type="submit" className="btn btn-primary w-full" disabled={pending}>
        {pending ? "Signing in…" : "Sign in"}
      </button>
    </form>
  );
}
