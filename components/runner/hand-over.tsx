"use client";
// Handing the welder's tablet to an inspector for one sign-off: choose who takes it, then they type their
// own PIN. The server checks that person's role, PIN and separation of duties and records who held the
// tablet; the hand-over ends with that one sign-off (nothing of it is kept on the tablet).
import { useEffect, useState } from "react";
import { apiJson, ApiError } from "./api";

type Person = { membershipId: string; name: string };

export function HandOverPicker({ jobId, onChoose, onClose }: { jobId: string; onChoose: (p: Person) => void; onClose: () => void }) {
  const [people, setPeople] = useState<Person[] | null>(null);
  const [error, setError] = useState<string | null>(null);
  useEffect(() => {
    let live = true;
    apiJson<{ inspectors: Person[] }>(`/api/jobs/${jobId}/hand-over`)
      .then((r) => live && setPeople(r.inspectors))
      .catch((e: unknown) => live && setError(e instanceof ApiError ? e.message : "The inspectors could not be listed."));
    return () => {
      live = false;
    };
  }, [jobId]);
  return (
    <div className="fixed inset-0 z-50 flex items-center justify-center bg-graphite-950/70 p-4" role="presentation">
      <div role="dialog" aria-modal="true" aria-labelledby="handover-title" className="max-h-full w-full max-w-md overflow-y-auto rounded-xl border-4 border-graphite-950 bg-white p-5" data-testid="handover-picker">
        <h2 id="handover-title" className="text-xl font-bold text-graphite-950">Hand the tablet to an inspector</h2>
        <p className="mt-1 text-graphite-900">The inspector signs this one step with their own PIN; then the tablet is yours again.</p>
        {error ? <p className="field-error mt-3">{error}</p> : null}
        {people === null && !error ? <p className="mt-3" aria-live="polite">Loading the inspectors…</p> : null}
        {people && people.length === 0 ? <p className="mt-3 font-semibold">No other inspector in this shop has a signing PIN set.</p> : null}
        <ul className="mt-3 space-y-2">
          {(people ?? []).map((p) => (
            <li key={p.membershipId}>
              <button type="button" className="btn btn-quiet min-h-14 w-full justify-start text-lg" onClick={() => onChoose(p)} data-testid="handover-person">
                {p.name}
              </button>
            </li>
          ))}
        </ul>
        <button type="button" className="btn btn-quiet mt-4 min-h-14 w-full text-lg" onClick={onClose}>Cancel</button>
      </div>
    </div>
  );
}
