"use client";
import { useActionState } from "react";
import { FormMessage } from "@/components/form-message";
import { CODE_LABELS, CODE_RULES } from "@/lib/welding/qualification-schema";
import { CONTINUITY_CODES, type ContinuityCode } from "@/lib/welding/continuity";
import { setCodeAction } from "../actions";

export function CodeForm({ current }: { current: ContinuityCode }) {
  const [state, action, pending] = useActionState(setCodeAction, undefined);
  const errors = state?.error ? (Object.values(state.error).flat().filter(Boolean) as string[]) : undefined;
  return (
    <form action={action} className="space-y-2" data-testid="code-form">
      <fieldset className="space-y-2">
        <legend className="field-label">The code the shop&rsquo;s continuity follows</legend>
        {CONTINUITY_CODES.map((c) => (
          <label key={c} className="flex min-h-12 items-start gap-2 rounded-md border-2 border-graphite-300 p-2">
            <input type="radio" name="code" value={c} defaultChecked={current === c} className="mt-1 h-5 w-5" />
            <span>
              <span className="font-semibold">{CODE_LABELS[c]}</span>
              <span className="block text-sm text-graphite-600">{CODE_RULES[c]}</span>
            </span>
          </label>
        ))}
      </fieldset>
      <FormMessage ok={state?.ok} errors={errors} testId="code" />
      <button className="btn btn-quiet" type="submit" disabled={pending}>{pending ? "Saving…" : "Save the code"}</button>
    </form>
  );
}
