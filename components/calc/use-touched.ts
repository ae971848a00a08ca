"use client";
import { useCallback, useState } from "react";

/**
 * Live calculators check on every change. A field left empty says so once it has been visited (or after
 * "show all"); anything typed and wrong says so at once. Every error is also in the fix list, so none hides.
 */
export function useTouched() {
  const [touched, setTouched] = useState<ReadonlySet<string>>(() => new Set());
  const touch = useCallback((key: string) => setTouched((t) => (t.has(key) ? t : new Set(t).add(key))), []);
  const reset = useCallback(() => setTouched(new Set()), []);
  const visible = useCallback(
    (errors: Record<string, string>, key: string, text: string | undefined): string | undefined => {
      const message = errors[key];
      if (!message) return undefined;
      return touched.has(key) || (text ?? "").trim() !== "" ? message : undefined;
    },
    [touched],
  );
  return { touch, reset, visible };
}
