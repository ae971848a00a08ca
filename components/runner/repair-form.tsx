"use client";
// Before a repair round is welded: how the rejected weld was taken out (method, depth and length removed)
// and a photo of the prepared groove. The server refuses repair passes until this is on the record.
import { useState } from "react";
import type { JobRecord, StepView } from "@/lib/jobs/record";
import { readPadNumber } from "@/lib/jobs/units";
import { apiJson, ApiError, newKey, uploadPhoto } from "./api";
import { useSetRecord } from "./use-job";

const METHODS = [
  ["grinding", "Grinding"],
  ["air-arc-gouging", "Air-arc gouging"],
  ["machining", "Machining"],
  ["other", "Other (say which)"],
] as const;
type Method = (typeof METHODS)[number][0];

export function RepairForm({ record, step }: { record: JobRecord; step: StepView }) {
  const joint = step.joint!;
  const jobId = record.job.id;
  const setRecord = useSetRecord(jobId);
  const [method, setMethod] = useState<Method | null>(null);
  const [note, setNote] = useState("");
  const [depth, setDepth] = useState("");
  const [length, setLength] = useState("");
  const [photoId, setPhotoId] = useState<string | null>(null);
  const [uploading, setUploading] = useState(false);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [busy, setBusy] = useState(false);
  const shot = record.photos.find((p) => p.id === photoId);
  const caption = `${joint.jointId} repair round ${joint.round}: groove prepared`;

  const onFile = async (file: File | undefined) => {
    if (!file) return;
    setUploading(true);
    try {
      const r = await uploadPhoto(jobId, file, { idempotencyKey: newKey(), stepId: step.id, caption });
      setRecord(r.record);
      setPhotoId(r.photoId);
      setErrors((e) => ({ ...e, photoId: "" }));
    } catch (e) {
      setErrors((x) => ({ ...x, photoId: e instanceof ApiError ? e.message : "The photo was not sent; try again." }));
    } finally {
      setUploading(false);
    }
  };

  const submit = async () => {
    const e: Record<string, string> = {};
    const d = readPadNumber(depth.trim());
    const l = readPadNumber(length.trim());
    if (!method) e.method = "Choose how the weld was removed.";
    if (method === "other" && note.trim().length < 3) e.methodNote = "Say which method was used.";
    if (d === null || d <= 0) e.depthMm = "Depth removed, in mm, above 0.";
    if (l === null || l <= 0) e.lengthMm = "Length removed, in mm, above 0.";
    if (!photoId) e.photoId = "Take a photo of the prepared groove.";
    setErrors(e);
    if (Object.values(e).some(Boolean)) return;
    setBusy(true);
    try {
      const r = await apiJson<{ record: JobRecord }>(`/api/jobs/${jobId}/steps/${step.id}/repairs`, { body: { method, methodNote: note.trim(), depthMm: d, lengthMm: l, photoId } });
      setRecord(r.record);
    } catch (err) {
      setErrors({ form: err instanceof ApiError ? err.message : "Not recorded; try again." });
    } finally {
      setBusy(false);
    }
  };

  const input = "field-input figures min-h-14 text-xl";
  return (
    <section className="space-y-3 rounded-lg border-4 border-[#8a1d15] bg-white p-4" aria-labelledby="repair-h" data-testid="repair-form">
      <h3 id="repair-h" className="text-xl font-bold">Repair record before repair round {joint.round}</h3>
      <p className="text-graphite-950">Say how the rejected weld was taken out, how deep and how long, with a photo of the prepared groove. Repair passes are recorded after this.</p>
      <div role="radiogroup" aria-label="Removed by" className="grid grid-cols-2 gap-2 sm:grid-cols-4">
        {METHODS.map(([k, label]) => (
          <button key={k} type="button" role="radio" aria-checked={method === k} onClick={() => setMethod(k)} className={`min-h-14 rounded-md border-2 px-3 font-semibold ${method === k ? "border-graphite-950 bg-graphite-900 text-white" : "border-graphite-400 bg-white text-graphite-950"}`} data-testid={`repair-method-${k}`}>
            {method === k ? "● " : "○ "}{label}
          </button>
        ))}
      </div>
      <p className="field-error">{errors.method ?? ""}</p>
      {method === "other" ? (
        <div>
          <label htmlFor="repair-note" className="field-label">Method used</label>
          <input id="repair-note" className="field-input min-h-14 text-lg" value={note} maxLength={500} onChange={(e) => setNote(e.target.value)} />
          <p className="field-error">{errors.methodNote ?? ""}</p>
        </div>
      ) : null}
      <div className="grid grid-cols-2 gap-3">
        <div>
          <label htmlFor="repair-depth" className="field-label">Depth removed (mm)</label>
          <input id="repair-depth" className={input} inputMode="decimal" autoComplete="off" value={depth} onChange={(e) => setDepth(e.target.value.replace(/[^0-9.,]/g, ""))} />
          <p className="field-error">{errors.depthMm ?? ""}</p>
        </div>
        <div>
          <label htmlFor="repair-length" className="field-label">Length removed (mm)</label>
          <input id="repair-length" className={input} inputMode="decimal" autoComplete="off" value={length} onChange={(e) => setLength(e.target.value.replace(/[^0-9.,]/g, ""))} />
          <p className="field-error">{errors.lengthMm ?? ""}</p>
        </div>
      </div>
      <div className="flex flex-wrap items-center gap-3">
        <label className="btn btn-quiet min-h-14 cursor-pointer text-lg">
          {shot ? "Retake the groove photo" : uploading ? "Sending…" : "Photo of the groove"}
          <input type="file" accept="image/*" capture="environment" className="sr-only" onChange={(e) => void onFile(e.target.files?.[0])} data-testid="repair-photo" />
        </label>
        {shot ? (
          // eslint-disable-next-line @next/next/no-img-element -- member-only photo
          <img src={shot.thumbUrl} alt={caption} className="h-16 w-16 rounded border-2 border-graphite-700 object-cover" />
        ) : null}
      </div>
      <p className="field-error">{errors.photoId ?? ""}</p>
      <p className="field-error" data-testid="repair-error">{errors.form ?? ""}</p>
      <button type="button" className="btn btn-primary min-h-14 w-full text-lg" disabled={busy || uploading} onClick={() => void submit()} data-testid="repair-submit">{busy ? "Recording…" : "Record the repair"}</button>
    </section>
  );
}
