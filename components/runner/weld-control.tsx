"use client";
// A weld step, welder first: the pass form at the top, then the joint as the procedure specifies it, its
// place on the weld map, the hot-work cautions, the WPS revision its passes are checked against, and the
// joint's rounds (the first welding, then one per repair after a rejection) with their passes, sign-offs
// and inspections. The pieces live in pass-form.tsx (writing) and weld-parts.tsx (reading).
import { useState } from "react";
import { RecordWeldMap } from "@/components/weld-map/record-weld-map";
import { governingPreheat } from "@/lib/jobs/preheat";
import type { JobRecord, PassView, StepView } from "@/lib/jobs/record";
import { defaultPadUnit, show } from "@/lib/jobs/units";
import { apiJson, ApiError } from "./api";
import { PassForm } from "./pass-form";
import { PinDialog } from "./pin-dialog";
import { RebaseWeldMap } from "./rebase-weld-map";
import { RepairForm } from "./repair-form";
import { useSetRecord } from "./use-job";
import { JointStatePill } from "./joint-state";
import { Pill } from "./verdict";
import { coverageOf, failedMessages, HotWorkNote, InspectionResult, PassCard, PerformedLine, QualificationBox, roundName, roundTone, type Weld, WpsPanel, wpsOf } from "./weld-parts";

export { coverageOf, ITEM_LABELS, PassCard, wpsOf, type Weld } from "./weld-parts";

export function WeldControl({ record, step, jobOpen }: { record: JobRecord; step: StepView; jobOpen: boolean }) {
  const spec = step.spec as Weld;
  const joint = step.joint!;
  const jobId = record.job.id;
  const viewer = record.viewer;
  const me = viewer.userId;
  const setRecord = useSetRecord(jobId);
  const tempUnit = defaultPadUnit("temperature", viewer.unitSystem);
  const speedUnit = defaultPadUnit("speed", viewer.unitSystem);
  const [error, setError] = useState<string | null>(null);
  const [striking, setStriking] = useState<string | null>(null);
  const [overriding, setOverriding] = useState<PassView | null>(null);
  const [overrideReason, setOverrideReason] = useState("");
  const [overridePin, setOverridePin] = useState(false);

  const wps = wpsOf(record, spec);
  const roundOpen = joint.state === "welding" || joint.state === "repair";
  const isWelder = viewer.roles.includes("welder");
  const isLead = viewer.roles.includes("lead");
  const qualification = isWelder ? record.qualifications.find((q) => q.process === spec.process) : undefined;
  const mayRecord = jobOpen && roundOpen && !step.lockedBy && isWelder;
  const allPasses = record.passes.filter((p) => p.stepId === step.id);
  const current = allPasses.filter((p) => p.round === joint.round && !p.removed);
  // A repair round opens on the record of how the rejected weld was removed.
  const needsRepair = joint.state === "repair" && !joint.rounds[joint.round - 2]?.inspection?.repair;
  const preheat = governingPreheat(spec.minPreheatC, wps?.ranges.preheatMinC);

  const strike = async (passId: string) => {
    setError(null);
    try {
      setRecord(await apiJson<JobRecord>(`/api/jobs/${jobId}/steps/${step.id}/passes/${passId}`, { method: "DELETE" }));
    } catch (e) {
      setError(e instanceof ApiError ? e.message : "The pass was not struck out.");
    } finally {
      setStriking(null);
    }
  };

  const passActions = (p: PassView) => {
    if (p.removed || !jobOpen || !roundOpen || p.round !== joint.round) return null;
    const out: React.ReactNode[] = [];
    if (isLead && p.outOfRange && !p.override && coverageOf(p, joint) === "uncovered") {
      out.push(
        p.welder.id === me ? (
          <p key="own" className="text-sm font-semibold text-graphite-900">You welded this pass, so another lead decides on it.</p>
        ) : overriding?.id === p.id ? null : (
          <button key="ovr" type="button" className="btn btn-quiet min-h-12 border-graphite-950" onClick={() => { setOverriding(p); setOverrideReason(""); }} data-testid={`override-${p.passNumber}`}>
            ◆ Accept as welded
          </button>
        ),
      );
    }
    if (p.welder.id === me) {
      out.push(
        striking === p.id ? (
          <span key="strike" className="flex gap-2">
            <button type="button" className="btn btn-danger min-h-12" onClick={() => void strike(p.id)}>Confirm strike out</button>
            <button type="button" className="btn btn-quiet min-h-12" onClick={() => setStriking(null)}>Keep</button>
          </span>
        ) : (
          <button key="strike" type="button" className="btn btn-quiet min-h-12" onClick={() => setStriking(p.id)}>Strike out</button>
        ),
      );
    }
    const form =
      overriding?.id === p.id ? (
        <div className="mt-2 space-y-2 rounded-lg border-4 border-graphite-950 bg-graphite-50 p-3" data-testid="override-form">
          <p className="font-bold">Accept pass {p.passNumber} as welded</p>
          <p className="text-sm text-graphite-950">The pass stays outside {p.wps.reference} on the record; your reason and signature say why it is fit to stay.</p>
          <label htmlFor="override-reason" className="field-label">Reason</label>
          <textarea id="override-reason" className="field-input min-h-20 text-lg" value={overrideReason} maxLength={1000} onChange={(e) => setOverrideReason(e.target.value)} aria-invalid={overrideReason.trim().length > 0 && overrideReason.trim().length < 5 ? true : undefined} />
          <p className="field-error">{overrideReason.trim().length > 0 && overrideReason.trim().length < 5 ? "At least 5 characters." : ""}</p>
          <div className="grid grid-cols-2 gap-3">
            <button type="button" className="btn btn-quiet min-h-14 text-lg" onClick={() => setOverriding(null)}>Cancel</button>
            <button type="button" className="btn btn-primary min-h-14 text-lg" disabled={overrideReason.trim().length < 5} onClick={() => setOverridePin(true)} data-testid="override-sign">Sign acceptance</button>
          </div>
        </div>
      ) : null;
    if (!out.length && !form) return null;
    return (
      <>
        {out.length ? <div className="flex flex-wrap gap-2">{out}</div> : null}
        {form}
      </>
    );
  };

  return (
    <div className="space-y-4">
      {qualification && !qualification.ok && roundOpen && jobOpen ? <QualificationBox qualification={qualification} /> : null}
      {mayRecord && needsRepair ? <RepairForm record={record} step={step} /> : null}
      {mayRecord && !needsRepair ? <PassForm key={`${step.id}:${joint.round}`} record={record} step={step} wps={wps} qualification={qualification} /> : null}
      {error ? <p className="field-error" role="alert">{error}</p> : null}
      <dl className="grid grid-cols-2 gap-2 rounded-lg border-2 border-graphite-700 bg-white p-3 sm:grid-cols-4" data-testid="joint-spec">
        {[
          ["Joint", `${spec.jointId} · ${spec.jointType}`],
          ["Size × length", `${show("length", spec.sizeMm, defaultPadUnit("length", viewer.unitSystem))} × ${show("length", spec.lengthMm, defaultPadUnit("length", viewer.unitSystem))}`],
          ["Position · process", `${spec.position} · ${spec.process}`],
          ["WPS · filler", `${spec.wpsRef} · ${spec.filler}`],
          ["Minimum preheat", `${show("temperature", preheat.minC, tempUnit)} (${preheat.source === "both" ? "procedure and WPS" : preheat.source === "wps" ? "WPS" : "procedure"})`],
        ].map(([k, v]) => (
          <div key={k}>
            <dt className="text-sm font-semibold text-graphite-800">{k}</dt>
            <dd className="figures font-semibold text-graphite-950">{v}</dd>
          </div>
        ))}
        <div>
          <dt className="text-sm font-semibold text-graphite-800">Joint state</dt>
          <dd><JointStatePill joint={joint} testId="joint-state" /></dd>
        </div>
      </dl>
      <RecordWeldMap record={record} highlight={spec.jointId} testId="runner-weld-map" title={`Where ${spec.jointId} is`} />
      {record.weldMap && jobOpen && (viewer.roles.includes("lead") || viewer.roles.includes("welder")) ? <RebaseWeldMap record={record} /> : null}
      <HotWorkNote />
      <WpsPanel wps={wps} spec={spec} tempUnit={tempUnit} speedUnit={speedUnit} />
      {qualification && qualification.ok && roundOpen && jobOpen ? <QualificationBox qualification={qualification} /> : null}

      <section aria-labelledby="rounds-h" className="space-y-3">
        <h3 id="rounds-h" className="text-lg font-bold">
          Rounds of joint {spec.jointId} · passes in this round: <span className="figures" data-testid="pass-count">{current.length}</span>
        </h3>
        <ol className="space-y-4" data-testid="joint-rounds">
          {joint.rounds.map((r) => {
            const t = roundTone(r, joint);
            const passes = allPasses.filter((p) => p.round === r.round);
            return (
              <li key={r.round} className="rounded-xl border-2 border-graphite-300 bg-graphite-50 p-3" data-testid={`round-${r.round}`}>
                <div className="flex flex-wrap items-center justify-between gap-2">
                  <h4 className="text-lg font-bold">{roundName(r.round)}</h4>
                  <Pill tone={t.tone}>{t.word}</Pill>
                </div>
                {r.round > 1 ? <p className="text-sm text-graphite-900">Repair after the rejection of {roundName(r.round - 1).toLowerCase()}: grind out, bring back to preheat, weld, sign, and it is inspected again.</p> : null}
                {passes.length ? (
                  <ul className="mt-2 space-y-2">
                    {passes.map((p) => <PassCard key={p.id} pass={p} tempUnit={tempUnit} coverage={coverageOf(p, joint)} actions={passActions(p)} />)}
                  </ul>
                ) : <p className="mt-2 text-graphite-800">No passes yet.</p>}
                <div className="mt-2 space-y-2">
                  <PerformedLine so={r.performed} />
                  {r.inspection ? <InspectionResult inspection={r.inspection} photos={record.photos} /> : null}
                </div>
              </li>
            );
          })}
        </ol>
      </section>

      {overriding && overridePin ? (
        <PinDialog
          title={`Accept pass ${overriding.passNumber} of ${spec.jointId} as welded`}
          signAs={{ name: viewer.name, role: "lead", meaning: "dispositioned" }}
          confirmLabel="Sign acceptance"
          onClose={() => setOverridePin(false)}
          onSign={async (pin) => {
            const result = await apiJson<{ record: JobRecord }>(`/api/jobs/${jobId}/steps/${step.id}/passes/${overriding.id}/override`, { body: { reason: overrideReason.trim(), pin } });
            setRecord(result.record);
            setOverridePin(false);
            setOverriding(null);
            setOverrideReason("");
          }}
        >
          <div className="mt-3 text-graphite-950">
            <p className="font-semibold">Outside {overriding.wps.reference}:</p>
            <ul className="list-disc pl-5">{failedMessages(overriding).map((m) => <li key={m}>{m}</li>)}</ul>
            <p className="mt-1"><strong>Reason:</strong> {overrideReason.trim()}</p>
          </div>
        </PinDialog>
      ) : null}
    </div>
  );
}
