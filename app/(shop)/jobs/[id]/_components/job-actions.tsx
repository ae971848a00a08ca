"use client";
// Release (a lead's signed "released") and void (with a reason). Both call the jobs API, then refresh the page.
import { useRouter } from "next/navigation";
import { useState } from "react";
import { apiJson, ApiError } from "@/components/runner/api";
import { PinDialog } from "@/components/runner/pin-dialog";

export function ReleaseButton({ jobId, number, me, blockers }: { jobId: string; number: string; me: string; blockers: string[] }) {
  const router = useRouter();
  const [open, setOpen] = useState(false);
  return (
    <div className="space-y-2">
      <button type="button" className="btn btn-primary min-h-12" disabled={blockers.length > 0} onClick={() => setOpen(true)} data-testid="release-job">
        Release job
      </button>
      {blockers.length ? (
        <ul className="text-sm text-graphite-800" data-testid="release-blockers">
          {blockers.map((b) => <li key={b}>▲ {b}</li>)}
        </ul>
      ) : null}
      {open ? (
        <PinDialog
          title={`Release ${number}`}
          signAs={{ name: me, role: "lead", meaning: "released" }}
          confirmLabel="Release"
          onClose={() => setOpen(false)}
          onSign={async (pin) => {
            await apiJson(`/api/jobs/${jobId}/release`, { body: { pin } });
            setOpen(false);
            router.refresh();
          }}
        >
          <p className="mt-3">Every step is signed and no nonconformance is open. Releasing closes the record for good.</p>
        </PinDialog>
      ) : null}
    </div>
  );
}

export function VoidForm({ jobId }: { jobId: string }) {
  const router = useRouter();
  const [open, setOpen] = useState(false);
  const [reason, setReason] = useState("");
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  if (!open) return <button type="button" className="btn btn-danger min-h-12" onClick={() => setOpen(true)} data-testid="void-job">Void job…</button>;
  return (
    <form
      className="card max-w-md space-y-2 p-3"
      onSubmit={async (e) => {
        e.preventDefault();
        if (reason.trim().length < 5) return setError("Say why the job is void (at least 5 characters).");
        setBusy(true);
        try {
          await apiJson(`/api/jobs/${jobId}/void`, { body: { reason: reason.trim() } });
          router.refresh();
        } catch (err) {
          setError(err instanceof ApiError ? err.message : "Not voided; try again.");
        } finally {
          setBusy(false);
        }
      }}
    >
      <label htmlFor="void-reason" className="field-label">Why is this job void?</label>
      <textarea id="void-reason" className="field-input min-h-20" value={reason} onChange={(e) => setReason(e.target.value)} />
      <p className="field-error">{error ?? ""}</p>
      <div className="flex gap-2">
        <button type="button" className="btn btn-quiet" onClick={() => setOpen(false)}>Cancel</button>
        <button type="submit" className="btn btn-danger" disabled={busy}>Void the job</button>
      </div>
    </form>
  );
}
