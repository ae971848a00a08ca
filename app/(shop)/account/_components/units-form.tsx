"use client";
import { useActionState } from "react";
import { FormMessage } from "@/components/form-message";
import { saveUnits } from "../actions";

export function UnitsForm({ current }: { current: "metric" | "imperial" }) {
  const [state, action, pending] = useActionState(saveUnits, undefined);
  return (
    <form action={action} className="card max-w-md space-y-3 p-4" data-testid="units-form">
      <h2 className="font-bold">Units on screen</h2>
      <fieldset className="flex flex-wrap gap-2">
        <legend className="sr-only">Unit system</legend>
        {(
          [
            ["metric", "Metric: mm, °C, N·m, kPa"],
            ["imperial", "Imperial: in, °F, lbf·ft, psi"],
          ] as const
        ).map(([value, label]) => (
          <label key={value} className="flex min-h-12 items-center gap-2 rounded-md border-2 border-graphite-300 px-3">
            <input type="radio" name="unitSystem" value={value} defaultChecked={current === value} className="h-5 w-5" />
            {label}
          </label>
        ))}
      </fieldset>
      <p className="text-sm text-graphite-600">Values are always stored in SI; this only changes how they are shown and entered.</p>
      <FormMessage ok={state?.ok} errors={state?.error ? (Object.values(state.error).flat() as string[]) : undefined} />
      <button className="btn btn-primary" type="submit" disabled={pending}>Save units</button>
    </form>
  );
}
