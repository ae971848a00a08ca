"use client";
// The checklist runner: one step at a time, a progress bar, a section map to jump around, Previous/Next.
// Everything comes from GET /api/jobs/{id} through the TanStack Query cache; every write answers with the
// new record, which replaces the cached one.
import Link from "next/link";
import { useEffect, useMemo, useState } from "react";
import { StatusBadge } from "@/components/status-badge";
import { JOB_STATE_LABELS, type Tone } from "@/lib/jobs/labels";
import { waitingHold } from "@/lib/jobs/state";
import type { JobRecord, StepView } from "@/lib/jobs/record";
import { kindGlyph } from "./glyph";
import { StepPanel } from "./step-panel";
import { jointStateWord } from "./joint-state";
import { useJob } from "./use-job";

function stepStatus(s: StepView, record: JobRecord): { word: string; shape: string; cls: string } {
  if (s.joint && s.joint.state !== "welding") {
    // A weld joint says where it stands: accepted, waiting for inspection, or in repair.
    const word = jointStateWord(s.joint);
    if (s.joint.state === "accepted") return { word, shape: "●", cls: "text-[#1f3305]" };
    if (s.joint.state === "repair") return { word, shape: "↺", cls: "text-[#8a1d15]" };
    return { word, shape: "◐", cls: "text-[#5c3d00]" };
  }
  if (s.signed) return { word: "Signed", shape: "●", cls: "text-[#1f3305]" };
  if (s.kind === "hold" && waitingHold(record.steps)?.id === s.id) return { word: "Waiting for inspection", shape: "◐", cls: "text-[#5c3d00]" };
  if (record.nonconformances.some((n) => n.stepId === s.id && !n.disposition)) return { word: "NC open", shape: "✕", cls: "text-[#8a1d15]" };
  if (s.lockedBy) return { word: "Locked", shape: "▲", cls: "text-[#5c3d00]" };
  return { word: "Open", shape: "○", cls: "text-graphite-900" };
}

/**
 * The job's state for the runner's header. A job stopped only because a hold point waits for its
 * inspector says "Waiting for inspection" (◆), not "On hold" (▲), which is kept for an open nonconformance.
 */
export function shownJobState(record: JobRecord): { label: string; tone: Tone } {
  const base = JOB_STATE_LABELS[record.job.status];
  if (record.job.status === "released" || record.job.status === "void") return base;
  const ncOpen = record.nonconformances.some((n) => !n.disposition);
  if (!ncOpen && record.job.status === "on_hold" && waitingHold(record.steps)) return { label: "Waiting for inspection", tone: "info" };
  return base;
}

function firstToDo(record: JobRecord): StepView | undefined {
  return record.steps.find((s) => !s.signed && !s.lockedBy) ?? record.steps.find((s) => !s.signed) ?? record.steps[0];
}

export function Runner({ jobId, initial, initialStepKey }: { jobId: string; initial: JobRecord; initialStepKey?: string }) {
  const { data, error, isFetching } = useJob(jobId, initial);
  const record = data ?? initial;
  const [stepId, setStepId] = useState<string>(() => (record.steps.find((s) => s.key === initialStepKey) ?? firstToDo(record))?.id ?? "");
  const [mapOpen, setMapOpen] = useState(false);
  const index = Math.max(0, record.steps.findIndex((s) => s.id === stepId));
  const step = record.steps[index];

  // The URL names the step, so a reload or a shared link lands on it; no navigation, no refetch.
  useEffect(() => {
    if (!step) return;
    const url = new URL(window.location.href);
    if (url.searchParams.get("step") !== step.key) {
      url.searchParams.set("step", step.key);
      window.history.replaceState(null, "", url);
    }
  }, [step]);

  const go = (i: number) => {
    const next = record.steps[Math.min(record.steps.length - 1, Math.max(0, i))];
    if (next) {
      setStepId(next.id);
      setMapOpen(false);
      window.scrollTo({ top: 0 });
    }
  };

  // After a sign-off the runner moves on by itself to the next step that is open to work (no second Next).
  const advance = (after: JobRecord, from: number) => {
    const open = (s: StepView) => !s.signed && !s.lockedBy && !(s.joint && s.joint.state === "awaiting_inspection");
    const next = after.steps.slice(from + 1).find(open) ?? after.steps.find(open);
    if (next && next.id !== after.steps[from]?.id) {
      setStepId(next.id);
      window.scrollTo({ top: 0 });
    }
  };

  const sections = useMemo(() => {
    const out: { key: string; title: string; steps: StepView[] }[] = [];
    for (const s of record.steps) {
      const last = out[out.length - 1];
      if (last && last.key === s.sectionKey) last.steps.push(s);
      else out.push({ key: s.sectionKey, title: s.sectionTitle, steps: [s] });
    }
    return out;
  }, [record.steps]);

  const signed = record.steps.filter((s) => s.signed).length;
  const total = record.steps.length;
  const pct = total ? Math.round((signed / total) * 100) : 0;
  const state = shownJobState(record);

  return (
    <div className="flex min-h-screen flex-col" data-testid="runner">
      <header className="sticky top-0 z-30 border-b-4 border-graphite-950 bg-graphite-900 text-white">
        <div className="flex flex-wrap items-center gap-3 px-4 py-2">
          <Link href={`/jobs/${jobId}`} className="flex min-h-12 items-center rounded-md border-2 border-graphite-400 px-3 font-semibold text-white">← Job</Link>
          <div className="min-w-0 flex-1">
            <p className="figures text-lg font-bold" data-testid="runner-job-number">{record.job.number}</p>
            <p className="truncate text-sm text-graphite-100">{record.job.customerName} · {[record.job.vehicleYear, record.job.vehicleMakeModel].filter(Boolean).join(" ")} · axle {record.job.axleTag}</p>
          </div>
          <span className="rounded bg-white p-0.5" data-testid="runner-state"><StatusBadge tone={state.tone}>{state.label}</StatusBadge></span>
          <button type="button" className="flex min-h-12 items-center gap-2 rounded-md bg-primer-500 px-4 font-bold text-graphite-950" aria-expanded={mapOpen} aria-controls="section-map" onClick={() => setMapOpen((o) => !o)} data-testid="open-section-map">
            <span aria-hidden="true">☰</span> Section map
          </button>
        </div>
        <div className="flex items-center gap-3 px-4 pb-2">
          <div className="h-4 flex-1 overflow-hidden rounded-full border-2 border-graphite-400 bg-graphite-800" role="progressbar" aria-valuemin={0} aria-valuemax={total} aria-valuenow={signed} aria-label="Steps signed">
            <div className="h-full bg-primer-400" style={{ width: `${pct}%` }} />
          </div>
          <p className="figures shrink-0 font-semibold" data-testid="runner-progress">{signed} of {total} signed</p>
          {isFetching ? <span className="text-sm text-graphite-100" aria-live="polite">updating…</span> : null}
        </div>
      </header>

      {error ? (
        <p className="bg-[#fdf1d6] px-4 py-2 font-semibold text-[#5c3d00]" role="status">▲ {error.message}</p>
      ) : null}
      {record.job.status === "released" || record.job.status === "void" ? (
        <p className="border-b-2 border-graphite-900 bg-graphite-100 px-4 py-2 font-semibold" role="status">
          {record.job.status === "released" ? "● This job is released: its record is closed and read-only." : `✕ This job is void: ${record.job.voidReason ?? ""}`}
        </p>
      ) : null}

      {mapOpen ? (
        <div className="fixed inset-0 z-40 flex bg-graphite-950/60" onClick={() => setMapOpen(false)} role="presentation">
          <nav id="section-map" aria-label="Section map" className="h-full w-full max-w-md overflow-y-auto bg-white p-4 shadow-xl" onClick={(e) => e.stopPropagation()} data-testid="section-map">
            <div className="mb-3 flex items-center justify-between">
              <h2 className="text-xl font-bold">Section map</h2>
              <button type="button" className="btn btn-quiet min-h-12" onClick={() => setMapOpen(false)}>Close</button>
            </div>
            <ol className="space-y-4">
              {sections.map((sec) => {
                const done = sec.steps.filter((s) => s.signed).length;
                return (
                  <li key={sec.key}>
                    <h3 className="font-bold text-graphite-950">{sec.title} <span className="figures font-semibold text-graphite-800">({done}/{sec.steps.length})</span></h3>
                    <ol className="mt-2 space-y-2">
                      {sec.steps.map((s) => {
                        const st = stepStatus(s, record);
                        const current = s.id === step?.id;
                        return (
                          <li key={s.id}>
                            <button
                              type="button"
                              onClick={() => go(record.steps.indexOf(s))}
                              aria-current={current ? "step" : undefined}
                              className={`flex min-h-12 w-full items-center gap-3 rounded-md border-2 px-3 text-left ${current ? "border-graphite-950 bg-primer-100" : "border-graphite-300 bg-white"}`}
                              data-testid={`map-step-${s.key}`}
                            >
                              <span aria-hidden="true" className="w-5 text-center">{kindGlyph(s.kind)}</span>
                              <span className="min-w-0 flex-1 font-semibold">{s.title}</span>
                              <span className={`shrink-0 text-sm font-bold ${st.cls}`}><span aria-hidden="true">{st.shape} </span>{st.word}</span>
                            </button>
                          </li>
                        );
                      })}
                    </ol>
                  </li>
                );
              })}
            </ol>
          </nav>
        </div>
      ) : null}

      <main className="mx-auto w-full max-w-6xl flex-1 px-4 pb-32 pt-4">
        {step ? (
          <StepPanel key={step.id} record={record} step={step} nav={{ index, total, onPrev: () => go(index - 1), onNext: () => go(index + 1), onSigned: (after) => advance(after, index) }} />
        ) : <p>This job has no steps.</p>}
      </main>

    </div>
  );
}
