"use client";
// Signing asks for the person's PIN, shows exactly what they sign (printed name, role, meaning), and says
// why a try was refused (wrong PIN and the tries left, or locked).
import { useEffect, useRef, useState } from "react";
import { MEANING_LABELS } from "@/lib/jobs/labels";
import { ApiError } from "./api";
import { applyKey, NumberPad } from "./number-pad";

export type SignAs = { name: string; role: string; meaning: keyof typeof MEANING_LABELS };

export function PinDialog({
  title,
  signAs,
  children,
  confirmLabel = "Sign",
  onSign,
  onClose,
  testId = "pin-dialog",
  pinLabel = "Your signing PIN",
}: {
  title: string;
  signAs: SignAs;
  children?: React.ReactNode;
  confirmLabel?: string;
  onSign: (pin: string) => Promise<void>;
  onClose: () => void;
  testId?: string;
  pinLabel?: string;
}) {
  const [pin, setPin] = useState("");
  const [error, setError] = useState<string | null>(null);
  const [locked, setLocked] = useState(false);
  const [busy, setBusy] = useState(false);
  const input = useRef<HTMLInputElement>(null);
  useEffect(() => input.current?.focus(), []);
  useEffect(() => {
    const onEsc = (e: KeyboardEvent) => e.key === "Escape" && !busy && onClose();
    window.addEventListener("keydown", onEsc);
    return () => window.removeEventListener("keydown", onEsc);
  }, [busy, onClose]);

  const submit = async () => {
    if (!/^\d{4,8}$/.test(pin)) {
      setError("A PIN is 4 to 8 digits.");
      return;
    }
    setBusy(true);
    setError(null);
    try {
      await onSign(pin);
    } catch (e) {
      setPin("");
      if (e instanceof ApiError) {
        setError(e.message);
        if (e.code === "locked" && /PIN/i.test(e.message)) setLocked(true);
      } else setError("Something went wrong; nothing was signed.");
    } finally {
      setBusy(false);
    }
  };

  return (
    <div className="fixed inset-0 z-50 flex items-center justify-center bg-graphite-950/70 p-4" role="presentation">
      <div role="dialog" aria-modal="true" aria-labelledby="pin-title" className="max-h-full w-full max-w-md overflow-y-auto rounded-xl border-4 border-graphite-950 bg-white p-5" data-testid={testId}>
        <h2 id="pin-title" className="text-xl font-bold text-graphite-950">{title}</h2>
        <dl className="mt-3 grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 rounded-lg bg-graphite-50 p-3 text-graphite-950">
          <dt className="font-semibold">Printed name</dt>
          <dd data-testid="sign-as-name">{signAs.name}</dd>
          <dt className="font-semibold">Role</dt>
          <dd className="capitalize">{signAs.role}</dd>
          <dt className="font-semibold">Meaning</dt>
          <dd data-testid="sign-as-meaning">{MEANING_LABELS[signAs.meaning]}</dd>
        </dl>
        {children}
        <form
          className="mt-4"
          onSubmit={(e) => {
            e.preventDefault();
            void submit();
          }}
        >
          <label htmlFor="signing-pin" className="block font-semibold text-graphite-950">{pinLabel}</label>
          <input
            ref={input}
            id="signing-pin"
            type="password"
            inputMode="none"
            autoComplete="off"
            value={pin}
            maxLength={8}
            disabled={locked || busy}
            onChange={(e) => setPin(e.target.value.replace(/\D/g, "").slice(0, 8))}
            className="figures mt-1 min-h-14 w-full rounded-lg border-2 border-graphite-700 px-3 text-center text-3xl tracking-[0.5em]"
            aria-describedby="pin-error"
          />
          <p id="pin-error" className="field-error min-h-10" data-testid="pin-error" aria-live="assertive">{error ?? ""}</p>
          <NumberPad decimals={false} disabled={locked || busy} onKey={(k) => setPin((p) => applyKey(p, k, { decimals: false, maxLength: 8 }))} testId="pin-pad" />
          <div className="mt-4 grid grid-cols-2 gap-3">
            <button type="button" className="btn btn-quiet min-h-14 text-lg" onClick={onClose} disabled={busy}>Cancel</button>
            <button type="submit" className="btn btn-primary min-h-14 text-lg" disabled={busy || locked || pin.length < 4} data-testid="pin-submit">
              {busy ? "Signing…" : confirmLabel}
            </button>
          </div>
        </form>
      </div>
    </div>
  );
}
