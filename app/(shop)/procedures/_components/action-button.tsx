"use client";
import { useActionState, useState } from "react";
import { FormMessage } from "@/components/form-message";
import type { FormState } from "@/lib/api/action";

type Action = (state: FormState | undefined, formData: FormData) => Promise<FormState>;

function errorsOf(state: FormState | undefined): string[] | undefined {
  if (!state?.error) return undefined;
  const list = Object.values(state.error).flat().filter(Boolean) as string[];
  return list.length ? list : undefined;
}

// One button that posts a few hidden values to a server action; with `confirm`, a second click is asked first.
export function ActionButton({
  action,
  fields,
  label,
  pendingLabel,
  confirm,
  tone = "quiet",
  testId,
  showOk = true,
}: {
  action: Action;
  fields: Record<string, string | number>;
  label: string;
  pendingLabel?: string;
  confirm?: string;
  tone?: "quiet" | "primary" | "danger";
  testId?: string;
  showOk?: boolean;
}) {
  const [state, formAction, pending] = useActionState(action, undefined);
  const [armed, setArmed] = useState(false);
  const cls = tone === "primary" ? "btn btn-primary" : tone === "danger" ? "btn btn-danger" : "btn btn-quiet";
  return (
    <form action={formAction} className="space-y-2" data-testid={testId}>
      {Object.entries(fields).map(([k, v]) => <input key={k} type="hidden" name={k} value={String(v)} />)}
      {confirm && !armed ? (
        <button type="button" className={cls} onClick={() => setArmed(true)}>{label}</button>
      ) : confirm ? (
        <div className="flex flex-wrap items-center gap-2 rounded-md border-2 border-verdict-warn bg-verdict-warnbg p-2" role="group" aria-label="Confirm">
          <span className="text-sm font-semibold text-verdict-warn"><span aria-hidden="true">▲ </span>{confirm}</span>
          <button type="submit" className={cls} disabled={pending}>{pending ? pendingLabel ?? "Working…" : `Yes, ${label.toLowerCase()}`}</button>
          <button type="button" className="btn btn-quiet" onClick={() => setArmed(false)}>Cancel</button>
        </div>
      ) : (
        <button type="submit" className={cls} disabled={pending}>{pending ? pendingLabel ?? "Working…" : label}</button>
      )}
      <FormMessage ok={showOk ? state?.ok : undefined} errors={errorsOf(state)} testId={testId} />
    </form>
  );
}
