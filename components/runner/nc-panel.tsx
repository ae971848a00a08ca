"use client";
// Nonconformances on a step: raising one (description, photos, proposed disposition) and, for a lead or
// inspector who did not raise it, the signed disposition.
import { useState } from "react";
import { DISPOSITION_LABELS, DISPOSITION_VALUES, type DispositionName } from "@/lib/jobs/labels";
import type { JobRecord, NonconformanceView, PhotoView } from "@/lib/jobs/record";
import { apiJson, ApiError } from "./api";
import { PinDialog } from "./pin-dialog";
import { useSetRecord } from "./use-job";
import { Pill } from "./verdict";

function DispositionChoice({ name, value, onChange, testId }: { name: string; value: DispositionName | null; onChange: (d: DispositionName) => void; testId: string }) {
  return (
    <div role="radiogroup" aria-label={name} className="grid gap-2 sm:grid-cols-2" data-testid={testId}>
      {DISPOSITION_VALUES.map((d) => (
        <button
          key={d}
          type="button"
          role="radio"
          aria-checked={value === d}
          onClick={() => onChange(d)}
          className={`min-h-16 rounded-lg border-4 px-3 py-2 text-left ${value === d ? "border-graphite-950 bg-primer-100" : "border-graphite-500 bg-white"}`}
        >
          <span className="block text-lg font-bold">{value === d ? "● " : "○ "}{DISPOSITION_LABELS[d].label}</span>
          <span className="block text-sm text-graphite-900">{DISPOSITION_LABELS[d].explain}</span>
        </button>
      ))}
    </div>
  );
}

export function RaiseNcForm({ jobId, stepId, suggested, photos, onDone, onCancel }: { jobId: string; stepId: string; suggested: string; photos: PhotoView[]; onDone: () => void; onCancel: () => void }) {
  const setRecord = useSetRecord(jobId);
  const [description, setDescription] = useState(suggested);
  const [proposed, setProposed] = useState<DispositionName | null>(null);
  const [photoIds, setPhotoIds] = useState<string[]>(photos.map((p) => p.id));
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [busy, setBusy] = useState(false);
  const submit = async () => {
    const e: Record<string, string> = {};
    if (description.trim().length < 5) e.description = "Describe what is wrong (at least 5 characters).";
    if (!proposed) e.proposed = "Propose a disposition.";
    setErrors(e);
    if (Object.keys(e).length) return;
    setBusy(true);
    try {
      const result = await apiJson<{ record: JobRecord }>(`/api/jobs/${jobId}/nonconformances`, { body: { stepId, description: description.trim(), proposedDisposition: proposed, photoIds } });
      setRecord(result.record);
      onDone();
    } catch (err) {
      setErrors({ form: err instanceof ApiError ? err.message : "Not raised; try again." });
    } finally {
      setBusy(false);
    }
  };
  return (
    <section className="space-y-3 rounded-lg border-4 border-[#8a1d15] bg-white p-4" aria-labelledby="nc-new-h" data-testid="raise-nc-form">
      <h3 id="nc-new-h" className="text-xl font-bold text-[#8a1d15]">✕ Raise a nonconformance</h3>
      <div>
        <label htmlFor="nc-description" className="field-label">What is wrong</label>
        <textarea id="nc-description" className="field-input min-h-24 text-lg" value={description} onChange={(e) => setDescription(e.target.value)} aria-invalid={errors.description ? true : undefined} />
        <p className="field-error">{errors.description ?? ""}</p>
      </div>
      <div>
        <p className="field-label">Proposed disposition</p>
        <DispositionChoice name="Proposed disposition" value={proposed} onChange={setProposed} testId="nc-proposed" />
        <p className="field-error">{errors.proposed ?? ""}</p>
      </div>
      {photos.length ? (
        <fieldset>
          <legend className="field-label">Photos as evidence (tap to attach or leave off)</legend>
          <ul className="grid grid-cols-3 gap-2 sm:grid-cols-4">
            {photos.map((p) => {
              const on = photoIds.includes(p.id);
              return (
                <li key={p.id}>
                  <button type="button" aria-pressed={on} onClick={() => setPhotoIds((ids) => (on ? ids.filter((x) => x !== p.id) : [...ids, p.id]))} className={`block w-full overflow-hidden rounded-lg border-4 ${on ? "border-graphite-950" : "border-graphite-300"}`}>
                    {/* eslint-disable-next-line @next/next/no-img-element -- member-only photo */}
                    <img src={p.thumbUrl} alt="" className="aspect-square w-full object-cover" />
                    <span className="block bg-white py-1 text-sm font-semibold">{on ? "● Attached" : "○ Not attached"}</span>
                  </button>
                </li>
              );
            })}
          </ul>
        </fieldset>
      ) : <p className="text-graphite-900">Take a photo on this step first to attach it as evidence.</p>}
      <p className="field-error" data-testid="raise-nc-error">{errors.form ?? ""}</p>
      <div className="grid grid-cols-2 gap-3">
        <button type="button" className="btn btn-quiet min-h-14 text-lg" onClick={onCancel}>Cancel</button>
        <button type="button" className="btn btn-primary min-h-14 text-lg" disabled={busy} onClick={() => void submit()} data-testid="raise-nc-submit">{busy ? "Raising…" : "Raise nonconformance"}</button>
      </div>
    </section>
  );
}

export function NcCard({ jobId, nc, viewer, photos, onChanged }: { jobId: string; nc: NonconformanceView; viewer: JobRecord["viewer"]; photos: PhotoView[]; onChanged?: (record: JobRecord) => void }) {
  const setRecord = useSetRecord(jobId);
  const [choice, setChoice] = useState<DispositionName | null>(null);
  const [notes, setNotes] = useState("");
  const [signing, setSigning] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const mayDisposition = (viewer.roles.includes("lead") || viewer.roles.includes("inspector")) && nc.raisedBy.id !== viewer.userId;
  const own = photos.filter((p) => nc.photoIds.includes(p.id));
  return (
    <article className={`space-y-2 rounded-lg border-4 p-4 ${nc.disposition ? "border-graphite-500 bg-white" : "border-[#8a1d15] bg-[#fbe9e7]"}`} data-testid={`nc-${nc.number}`}>
      <header className="flex flex-wrap items-center justify-between gap-2">
        <h3 className="text-lg font-bold">NC-{nc.number} · {nc.stepTitle}</h3>
        {nc.disposition ? <Pill tone="pass">Closed: {DISPOSITION_LABELS[nc.disposition.disposition].label}</Pill> : <Pill tone="fail">Open</Pill>}
      </header>
      <p className="text-graphite-950">{nc.description}</p>
      <p className="text-sm text-graphite-900">
        Raised by {nc.raisedBy.name} at <span className="figures">{nc.raisedAt.slice(0, 16).replace("T", " ")} UTC</span> · proposed: {DISPOSITION_LABELS[nc.proposedDisposition].label}
      </p>
      {own.length ? (
        <ul className="flex flex-wrap gap-2">
          {own.map((p) => (
            <li key={p.id}>
              <a href={p.url} target="_blank" rel="noreferrer">
                {/* eslint-disable-next-line @next/next/no-img-element -- member-only photo */}
                <img src={p.thumbUrl} alt="Evidence photo" className="h-20 w-20 rounded border-2 border-graphite-700 object-cover" />
              </a>
            </li>
          ))}
        </ul>
      ) : null}
      {nc.disposition ? (
        <p className="font-semibold text-graphite-950" data-testid={`nc-${nc.number}-disposition`}>
          {DISPOSITION_LABELS[nc.disposition.disposition].label} — signed by {nc.disposition.decidedBy.name} at <span className="figures">{nc.disposition.decidedAt.slice(0, 16).replace("T", " ")} UTC</span>
          {nc.disposition.notes ? `: ${nc.disposition.notes}` : ""}
        </p>
      ) : mayDisposition ? (
        <div className="space-y-3 rounded-lg bg-white p-3" data-testid={`nc-${nc.number}-disposition-form`}>
          <p className="font-bold">Disposition</p>
          <DispositionChoice name={`Disposition of NC-${nc.number}`} value={choice} onChange={setChoice} testId={`nc-${nc.number}-choice`} />
          <div>
            <label htmlFor={`nc-notes-${nc.id}`} className="field-label">Notes for the welder</label>
            <textarea id={`nc-notes-${nc.id}`} className="field-input min-h-20" value={notes} onChange={(e) => setNotes(e.target.value)} maxLength={4000} />
          </div>
          <p className="field-error">{error ?? ""}</p>
          <button type="button" className="btn btn-primary min-h-14 w-full text-lg" disabled={!choice} onClick={() => setSigning(true)} data-testid={`nc-${nc.number}-sign`}>
            Sign disposition
          </button>
        </div>
      ) : (
        <p className="font-semibold text-graphite-950">
          <span aria-hidden="true">▲ </span>
          {nc.raisedBy.id === viewer.userId ? "You raised it: another lead or inspector dispositions it." : "Waiting for a lead or inspector to disposition it."}
        </p>
      )}
      {signing && choice ? (
        <PinDialog
          title={`Disposition NC-${nc.number}: ${DISPOSITION_LABELS[choice].label}`}
          signAs={{ name: viewer.name, role: viewer.roles.includes("lead") ? "lead" : "inspector", meaning: "dispositioned" }}
          onClose={() => setSigning(false)}
          onSign={async (pin) => {
            const result = await apiJson<{ record: JobRecord }>(`/api/jobs/${jobId}/nonconformances/${nc.id}/disposition`, { body: { disposition: choice, notes: notes.trim(), pin } });
            setRecord(result.record);
            onChanged?.(result.record);
            setSigning(false);
            setError(null);
          }}
        />
      ) : null}
    </article>
  );
}
