"use client";
// A lead changes who works the job, when it is due and its notes. The edit names the version it was based
// on; if someone else saved in between, their version is shown instead of being overwritten.
import { useRouter } from "next/navigation";
import { useState } from "react";
import { apiJson, ApiError } from "@/components/runner/api";
import type { JobHeader } from "@/lib/jobs/record";

type Options = { welders: { id: string; name: string }[]; inspectors: { id: string; name: string }[] };

export function EditJob({ job, options }: { job: JobHeader; options: Options }) {
  const router = useRouter();
  const [open, setOpen] = useState(false);
  const [welders, setWelders] = useState<string[]>(job.welders.map((w) => w.id));
  const [inspector, setInspector] = useState(job.inspector?.id ?? "");
  const [due, setDue] = useState(job.dueDate ?? "");
  const [notes, setNotes] = useState(job.notes);
  const [error, setError] = useState<{ message: string; fields: Record<string, string[]> } | null>(null);
  const [busy, setBusy] = useState(false);
  if (!open) return <button type="button" className="btn btn-quiet min-h-12" onClick={() => setOpen(true)} data-testid="edit-job">Edit assignees, due date, notes</button>;
  const save = async () => {
    setBusy(true);
    setError(null);
    try {
      await apiJson(`/api/jobs/${job.id}`, { method: "PATCH", body: { baseVersion: job.version, welderIds: welders, inspectorId: inspector || null, dueDate: due || null, notes } });
      setOpen(false);
      router.refresh();
    } catch (e) {
      if (e instanceof ApiError) {
        setError({ message: e.message, fields: e.fields });
        if (e.status === 409) router.refresh();
      } else setError({ message: "Not saved; try again.", fields: {} });
    } finally {
      setBusy(false);
    }
  };
  return (
    <form className="card space-y-3 p-3" onSubmit={(e) => { e.preventDefault(); void save(); }} data-testid="edit-job-form">
      <fieldset>
        <legend className="field-label">Welders</legend>
        <div className="flex flex-wrap gap-2">
          {options.welders.map((w) => (
            <label key={w.id} className="flex min-h-11 items-center gap-2 rounded-md border-2 border-graphite-300 px-3">
              <input type="checkbox" className="h-5 w-5" checked={welders.includes(w.id)} onChange={(e) => setWelders((all) => (e.target.checked ? [...all, w.id] : all.filter((x) => x !== w.id)))} />
              {w.name}
            </label>
          ))}
        </div>
        <p className="field-error">{error?.fields.welderIds?.[0] ?? ""}</p>
      </fieldset>
      <div>
        <label htmlFor="edit-inspector" className="field-label">Inspector</label>
        <select id="edit-inspector" className="field-input" value={inspector} onChange={(e) => setInspector(e.target.value)}>
          <option value="">Not yet</option>
          {options.inspectors.map((i) => <option key={i.id} value={i.id}>{i.name}</option>)}
        </select>
        <p className="field-error">{error?.fields.inspectorId?.[0] ?? ""}</p>
      </div>
      <div>
        <label htmlFor="edit-due" className="field-label">Due date</label>
        <input id="edit-due" type="date" className="field-input" value={due} onChange={(e) => setDue(e.target.value)} />
        <p className="field-error">{error?.fields.dueDate?.[0] ?? ""}</p>
      </div>
      <div>
        <label htmlFor="edit-notes" className="field-label">Notes</label>
        <textarea id="edit-notes" className="field-input min-h-20" value={notes} maxLength={4000} onChange={(e) => setNotes(e.target.value)} />
      </div>
      <p className="field-error" data-testid="edit-job-error">{error?.message ?? ""}</p>
      <div className="flex gap-2">
        <button type="button" className="btn btn-quiet" onClick={() => setOpen(false)}>Cancel</button>
        <button type="submit" className="btn btn-primary" disabled={busy}>{busy ? "Saving…" : "Save"}</button>
      </div>
    </form>
  );
}
