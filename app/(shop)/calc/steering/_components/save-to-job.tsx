"use client";
import Link from "next/link";
import { useEffect, useState } from "react";
import { captureMeta, toSteeringRequest, type SteeringFormState } from "@/components/calc/steering-request";

type JobOption = { id: string; number: string; customerName: string };
type GeometryStep = { id: string; key: string; title: string; version: number; signed: boolean; value: Record<string, unknown> | null };

async function json(url: string, init?: RequestInit) {
  const res = await fetch(url, { ...init, headers: { "content-type": "application/json", ...init?.headers } });
  const body = await res.json().catch(() => ({}));
  return { status: res.status, body };
}

// Puts the layout on the screen into a job's geometry step as its "before" or "after" capture.
export function SaveToJob({ state }: { state: SteeringFormState }) {
  const [jobs, setJobs] = useState<JobOption[] | null>(null);
  const [jobId, setJobId] = useState("");
  const [steps, setSteps] = useState<GeometryStep[]>([]);
  const [stepId, setStepId] = useState("");
  const [which, setWhich] = useState<"before" | "after">("before");
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  const [saving, setSaving] = useState(false);

  useEffect(() => {
    void json("/api/jobs?status=open&needs=geometry&pageSize=100").then((r) => setJobs(r.status === 200 ? (r.body.jobs as JobOption[]) : []));
  }, []);

  useEffect(() => {
    if (!jobId) return;
    void json(`/api/jobs/${jobId}`).then((r) => {
      const found = ((r.body.steps ?? []) as (GeometryStep & { kind: string })[]).filter((s) => s.kind === "geometry" && !s.signed);
      setSteps(found);
      setStepId(found[0]?.id ?? "");
    });
  }, [jobId]);

  async function save() {
    setMessage(null);
    const outcome = toSteeringRequest(state);
    if (!outcome.ok) return setMessage({ ok: false, text: "Fix the fields marked above first." });
    const step = steps.find((s) => s.id === stepId);
    if (!step) return setMessage({ ok: false, text: "Choose a job and one of its unsigned geometry steps." });
    setSaving(true);
    const current = (await json(`/api/jobs/${jobId}`)).body.steps?.find((s: GeometryStep) => s.id === step.id) as GeometryStep | undefined;
    const value = { ...(current?.value ?? {}), [which]: { input: outcome.request, ...captureMeta(state), capturedAt: new Date().toISOString() } };
    const r = await json(`/api/jobs/${jobId}/steps/${step.id}/value`, { method: "PUT", body: JSON.stringify({ baseVersion: current?.version ?? step.version, value }) });
    setSaving(false);
    if (r.status === 200) setMessage({ ok: true, text: `Saved as the ${which} capture of “${step.title}”.` });
    else setMessage({ ok: false, text: r.body?.error?.message ?? "Could not save to the job." });
  }

  return (
    <section className="card mt-6 max-w-4xl space-y-3 p-4" aria-labelledby="save-h" data-testid="save-to-job">
      <h2 id="save-h" className="font-bold">Save to a job</h2>
      <p className="text-sm text-graphite-700">Records this layout in a job&apos;s geometry step; the job page then shows before against after. Only open jobs with a geometry step still to capture are listed.</p>
      <div className="flex flex-wrap items-end gap-3">
        <div>
          <label className="field-label" htmlFor="save-job">Job</label>
          <select id="save-job" className="field-input min-w-64" value={jobId} onChange={(e) => {
              setJobId(e.target.value);
              setSteps([]);
              setStepId("");
            }}>
            <option value="">{jobs === null ? "Loading jobs…" : jobs.length ? "Choose a job" : "No open job has a geometry step to capture"}</option>
            {(jobs ?? []).map((j) => <option key={j.id} value={j.id}>{j.number} · {j.customerName}</option>)}
          </select>
        </div>
        <div>
          <label className="field-label" htmlFor="save-step">Geometry step</label>
          <select id="save-step" className="field-input min-w-64" value={stepId} onChange={(e) => setStepId(e.target.value)} disabled={!steps.length}>
            {steps.length ? steps.map((s) => <option key={s.id} value={s.id}>{s.title}</option>) : <option value="">{jobId ? "No unsigned geometry step" : "—"}</option>}
          </select>
        </div>
        <fieldset className="flex gap-2">
          <legend className="field-label">Capture</legend>
          {(["before", "after"] as const).map((w) => (
            <label key={w} className="flex min-h-11 items-center gap-2 rounded-md border-2 border-graphite-300 px-3">
              <input type="radio" name="capture" value={w} checked={which === w} onChange={() => setWhich(w)} className="h-5 w-5" />
              {w === "before" ? "Before" : "After"}
            </label>
          ))}
        </fieldset>
        <button type="button" className="btn btn-primary" onClick={() => void save()} disabled={saving || !stepId}>{saving ? "Saving…" : "Save to job"}</button>
      </div>
      <div aria-live="polite" className="min-h-8">
        {message ? (
          <p data-testid="save-message" className={`text-sm font-semibold ${message.ok ? "text-verdict-pass" : "text-verdict-fail"}`}>
            <span aria-hidden="true">{message.ok ? "● " : "✕ "}</span>
            {message.text} {message.ok ? <Link className="underline" href={`/jobs/${jobId}?tab=measurements`}>Open the job</Link> : null}
          </p>
        ) : null}
      </div>
    </section>
  );
}
