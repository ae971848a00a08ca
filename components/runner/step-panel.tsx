"use client";
// One step of the checklist: what to do, its kind's controls, photos, the live verdict, and signing.
import dynamic from "next/dynamic";
import { useState } from "react";
import { Markdown } from "@/lib/procedures/markdown-view";
import { KIND_LABELS } from "@/lib/procedures/labels";
import { kindGlyph } from "./glyph";
import { SafetyNote } from "@/components/safety-note";
import { photosNeeded, stepReadiness } from "@/lib/jobs/readiness";
import type { JobRecord, JointView, SignOffView, StepView } from "@/lib/jobs/record";
import { signingRole } from "@/lib/jobs/roles";
import { outOfToleranceText, valueSummary } from "@/lib/jobs/summary";
import { measureBounds, measureVerdict, torqueVerdict } from "@/lib/jobs/tolerance";
import { show, type PadQuantity } from "@/lib/jobs/units";
import type { CautionValue, CheckValue, CoatingValue, GeometryValue, MeasureValue, TorqueValue } from "@/lib/jobs/values";
import { apiJson, ApiError } from "./api";
import { PhotoStrip } from "./photo-strip";
import { PinDialog } from "./pin-dialog";
import { boundsText, ReadingControl } from "./reading-control";
import { CautionControl, CheckControl, NoteControl } from "./simple-controls";
import { SignOffList } from "./sign-off-list";
import { useSetRecord } from "./use-job";
import { useStepDraft, type SaveState } from "./use-step-draft";
import { Pill, VerdictBox } from "./verdict";
import { HandOverPicker } from "./hand-over";
import { StepBar } from "./step-bar";
import { JointStatePill } from "./joint-state";

// The weld, coating and geometry controls, the inspection form (with the zod check it runs) and the
// nonconformance forms load when a step needs them, keeping the runner's first load light on a shop tablet.
const WeldControl = dynamic(() => import("./weld-control").then((m) => m.WeldControl));
const InspectionPanel = dynamic(() => import("./inspection-panel").then((m) => m.InspectionPanel));
const CoatingControl = dynamic(() => import("./coating-control").then((m) => m.CoatingControl));
const GeometryControl = dynamic(() => import("./geometry-control").then((m) => m.GeometryControl));
const NcCard = dynamic(() => import("./nc-panel").then((m) => m.NcCard));
const RaiseNcForm = dynamic(() => import("./nc-panel").then((m) => m.RaiseNcForm));

const SAVE_WORDS: Record<SaveState, { text: string; tone: "pass" | "wait" | "fail" | "idle" }> = {
  saved: { text: "Saved", tone: "pass" },
  pending: { text: "Not sent yet", tone: "idle" },
  saving: { text: "Saving…", tone: "idle" },
  offline: { text: "Kept on this tablet: retrying", tone: "wait" },
  conflict: { text: "Changed elsewhere: choose", tone: "fail" },
  refused: { text: "Not saved", tone: "fail" },
};

function weldSignOffSummary(s: SignOffView, joint: JointView): string {
  const n = s.round ?? 1;
  const round = joint.rounds.find((r) => r.round === n);
  const name = n > 1 ? `Repair round ${n}` : "Round 1";
  if (s.meaning === "inspected") {
    const i = round?.inspection;
    return i ? `${name}: ${i.decision === "accepted" ? "accepted" : "rejected for repair"}` : name;
  }
  const count = round?.passes.filter((p) => !p.removed).length ?? 0;
  return `${name}: ${count} pass${count === 1 ? "" : "es"} welded`;
}

export type StepNav = { index: number; total: number; onPrev: () => void; onNext: () => void; onSigned: (record: JobRecord) => void };

export function StepPanel({ record, step, nav }: { record: JobRecord; step: StepView; nav: StepNav }) {
  const jobId = record.job.id;
  const viewer = record.viewer;
  const setRecord = useSetRecord(jobId);
  const jobOpen = record.job.status !== "released" && record.job.status !== "void";
  const role = signingRole(step.spec, viewer.roles);
  const mayWork = !("refuse" in role);
  const joint = step.joint;
  // A weld joint is worked while its round is open: before its welder signs it, or in repair after a rejection.
  const roundOpen = !joint || joint.state === "welding" || joint.state === "repair";
  const editable = jobOpen && !step.signed && !step.lockedBy && mayWork && roundOpen;
  const draft = useStepDraft(jobId, step, editable);
  const [amending, setAmending] = useState(false);
  const [amendValue, setAmendValue] = useState<Record<string, unknown>>(step.effectiveValue ?? {});
  const [reason, setReason] = useState("");
  const [signing, setSigning] = useState<null | "sign" | "amend">(null);
  // The inspector the tablet is handed to for one sign-off; cleared when it is signed or cancelled.
  const [handOver, setHandOver] = useState<null | "choose" | { membershipId: string; name: string }>(null);
  // "Saved" is said only after something was saved on this visit, never before anything is typed.
  const [touched, setTouched] = useState(false);
  if (!touched && draft.state !== "saved") setTouched(true);
  const [raising, setRaising] = useState(false);
  const [message, setMessage] = useState<string | null>(null);

  const photos = record.photos.filter((p) => p.stepId === step.id && !p.removed);
  // Weld steps: the passes of the joint's current round, as the server counts them for signing.
  const passes = record.passes.filter((p) => p.stepId === step.id && (!joint || p.round === joint.round));
  const ncs = record.nonconformances.filter((n) => n.stepId === step.id);
  const openNc = ncs.find((n) => !n.disposition);
  const value = amending ? amendValue : step.signed ? (step.effectiveValue ?? {}) : draft.draft;
  const live = stepReadiness({
    spec: step.spec,
    value,
    photoCount: photos.length,
    passes: passes.filter((p) => !p.removed),
    ncs: ncs.map((n) => ({ number: n.number, disposition: n.disposition?.disposition ?? null, observed: n.observed })),
    joint: joint ?? undefined,
  });
  const controlsEditable = editable || amending;
  const onChange = (v: Record<string, unknown>) => (amending ? setAmendValue(v) : draft.setDraft(v));
  const mayRaise = jobOpen && (viewer.roles.includes("welder") || viewer.roles.includes("inspector") || viewer.roles.includes("lead")) && !openNc;
  const outOfTolerance = live.verdict === "fail";
  // Cutting, grinding and welding sections carry the hot-work reminder on every step, not only at the weld.
  // A hold point or inspector-signed step on a tablet whose holder may not sign it: an inspector signs on it.
  const inspectorStep = step.meaning === "inspected" && !joint;
  const mayHandOver = jobOpen && inspectorStep && !step.signed && !step.lockedBy && (!mayWork || !!step.signBlock) && live.canSign;
  const hotSection = record.steps.some((s) => s.sectionKey === step.sectionKey && (s.kind === "weld" || (s.spec.kind === "caution" && s.spec.hazards.includes("fire-watch"))));

  const removePhoto = async (photoId: string) => {
    try {
      setRecord(await apiJson<JobRecord>(`/api/jobs/${jobId}/photos/${photoId}`, { method: "DELETE" }));
    } catch (e) {
      setMessage(e instanceof ApiError ? e.message : "The photo was not taken off.");
    }
  };

  const startSign = async () => {
    setMessage(null);
    if (draft.isDirty() && !(await draft.save())) {
      setMessage("Your value is not saved yet, so it cannot be signed. See the message above.");
      return;
    }
    setSigning("sign");
  };

  const kindControls = () => {
    const key = `${step.id}:${draft.resetToken}:${amending ? "amend" : "work"}`;
    const spec = step.spec;
    switch (spec.kind) {
      case "check":
        return <CheckControl key={key} value={value as CheckValue} readOnly={!controlsEditable} onChange={onChange} />;
      case "caution":
        return <CautionControl key={key} spec={spec} value={value as CautionValue} readOnly={!controlsEditable} onChange={onChange} />;
      case "measure": {
        const q = spec.quantity as PadQuantity;
        const v = value as MeasureValue;
        return (
          <ReadingControl
            key={key}
            id="reading"
            label="Reading"
            quantity={q}
            stored={v.reading}
            storedUnit={v.unit}
            unitSystem={viewer.unitSystem}
            readOnly={!controlsEditable}
            verdict={(r) => measureVerdict(spec, r)}
            onChange={(reading, unit) => onChange({ ...v, reading, unit })}
            specLine={(unit) => (
              <>
                {spec.nominal !== undefined ? <>Nominal <strong className="figures">{show(q, spec.nominal, unit)}</strong>; limits </> : "Limits: "}
                <strong className="figures">{boundsText(q, measureBounds(spec), unit)}</strong>
              </>
            )}
          />
        );
      }
      case "torque": {
        const v = value as TorqueValue;
        return (
          <ReadingControl
            key={key}
            id="achieved-torque"
            label="Achieved torque"
            quantity="torque"
            stored={v.achievedNm}
            storedUnit={v.unit}
            unitSystem={viewer.unitSystem}
            readOnly={!controlsEditable}
            verdict={(t) => torqueVerdict(spec, t)}
            defaultUnit={spec.torqueUnit}
            onChange={(achievedNm, unit) => onChange({ ...v, achievedNm, unit })}
            specLine={(unit) => (
              <>
                {spec.fastener}: <strong className="figures">{show("torque", spec.torqueNm, unit)}</strong> ± {spec.tolerancePct} %{spec.pattern ? ` · ${spec.pattern}` : ""}
              </>
            )}
          />
        );
      }
      case "coating":
        return <CoatingControl key={key} spec={spec} value={value as CoatingValue} readOnly={!controlsEditable} unitSystem={viewer.unitSystem} onChange={onChange} />;
      case "geometry":
        return <GeometryControl key={key} stepId={step.id} spec={spec} value={value as GeometryValue} readOnly={!controlsEditable} unitSystem={viewer.unitSystem} onChange={onChange} />;
      case "weld":
        return (
          <>
            <WeldControl record={record} step={step} jobOpen={jobOpen} />
            {/* The note is signed with the first round and stays (the server refuses a later change). */}
            {(controlsEditable && step.signOffs.length === 0) || (value as { note?: string }).note ? (
              <NoteControl key={key} value={value as { note?: string }} readOnly={!controlsEditable || step.signOffs.length > 0} onChange={onChange} />
            ) : null}
          </>
        );
      case "hold":
        return (
          <>
            <div className="rounded-lg border-4 border-graphite-950 bg-white p-4">
              <p className="text-lg font-bold">‖ Inspection at this hold point</p>
              <Markdown source={spec.inspection} className="mt-1 text-lg text-graphite-950" />
              <p className="mt-2 text-graphite-900">Every step after this one stays locked until an inspector signs it.</p>
            </div>
            <NoteControl key={key} value={value as { note?: string }} readOnly={!controlsEditable} onChange={onChange} label="Inspector's note (optional)" />
          </>
        );
      case "photo":
        return <NoteControl key={key} value={value as { note?: string }} readOnly={!controlsEditable} onChange={onChange} />;
    }
  };

  const meaningLabel = joint ? `Sign round ${joint.round}` : step.meaning === "inspected" ? "Sign as inspected" : "Sign as performed";
  const needed = photosNeeded(step.spec);
  const save = SAVE_WORDS[draft.state];
  const latest = step.signOffs.filter((o) => !step.signOffs.some((x) => x.amendsSignOffId === o.id)).at(-1);

  return (
    <article className="space-y-5" aria-labelledby="step-title" data-testid="step-panel" data-step-key={step.key}>
      <header className="space-y-2">
        <p className="text-base font-semibold text-graphite-900">
          {step.sectionTitle} · <span className="figures">Step {step.position} of {record.steps.length}</span>
        </p>
        <div className="flex flex-wrap items-start justify-between gap-3">
          <h2 id="step-title" className="text-2xl font-bold text-graphite-950 md:text-3xl">
            <span aria-hidden="true" className="mr-2">{kindGlyph(step.kind)}</span>
            {step.title}
          </h2>
          <div className="flex flex-wrap gap-2">
            <Pill tone="info">{KIND_LABELS[step.kind]}</Pill>
            {joint && !step.lockedBy ? (
              <>
                <JointStatePill joint={joint} testId="step-status" />
                {openNc ? <Pill tone="fail">NC-{openNc.number} open</Pill> : null}
              </>
            ) : step.signed ? <Pill tone="pass" testId="step-status">Signed</Pill> : step.lockedBy ? <Pill tone="wait" testId="step-status">Locked</Pill> : openNc ? <Pill tone="fail" testId="step-status">NC-{openNc.number} open</Pill> : <Pill tone="idle" testId="step-status">Open</Pill>}
          </div>
        </div>
      </header>

      {step.lockedBy ? (
        <VerdictBox tone="wait" title="Locked behind a hold point" testId="locked-banner">
          &ldquo;{step.lockedBy.title}&rdquo; is signed by an inspector first; then this step opens.
        </VerdictBox>
      ) : null}

      {step.kind === "caution" ? (
        <div className="rounded-xl border-[6px] border-graphite-950 bg-primer-300 p-1" data-testid="caution-banner">
          <div className="rounded-lg bg-white p-4">
            <p className="flex items-center gap-2 text-xl font-bold uppercase tracking-wide text-graphite-950"><span aria-hidden="true" className="text-3xl">△</span> Safety caution</p>
            {step.spec.instructions ? <Markdown source={step.spec.instructions} className="mt-2 text-lg text-graphite-950" /> : null}
          </div>
        </div>
      ) : step.spec.instructions && step.kind !== "weld" ? (
        <Markdown source={step.spec.instructions} className="text-lg text-graphite-950" testId="instructions" />
      ) : null}

      {hotSection && step.kind !== "weld" && step.kind !== "caution" ? (
        <p className="rounded-lg border-2 border-graphite-950 bg-primer-100 px-4 py-2 font-semibold text-graphite-950" data-testid="hot-work-reminder">
          <span aria-hidden="true">! </span>Hot work in this section: PPE on, fumes extracted, extinguisher in reach, fire watch kept for 30 minutes after.
        </p>
      ) : null}

      {draft.conflict && !step.signed ? (
        <section className="space-y-3 rounded-lg border-4 border-[#8a1d15] bg-[#fbe9e7] p-4" role="alert" data-testid="conflict-banner">
          <p className="text-lg font-bold text-[#8a1d15]">✕ {draft.conflict.message}</p>
          <dl className="grid gap-2 sm:grid-cols-2">
            <div className="rounded bg-white p-2">
              <dt className="font-semibold">Their value ({draft.conflict.by})</dt>
              <dd data-testid="conflict-theirs">{valueSummary(step.spec, draft.conflict.theirs, viewer.unitSystem, passes.length) || "—"}</dd>
            </div>
            <div className="rounded bg-white p-2">
              <dt className="font-semibold">Yours on this tablet</dt>
              <dd>{valueSummary(step.spec, draft.draft, viewer.unitSystem, passes.length) || "—"}</dd>
            </div>
          </dl>
          <div className="grid grid-cols-2 gap-3">
            <button type="button" className="btn btn-quiet min-h-14 text-lg" onClick={draft.useTheirs} data-testid="conflict-use-theirs">Use their value</button>
            <button type="button" className="btn btn-primary min-h-14 text-lg" onClick={draft.keepMine} data-testid="conflict-keep-mine">Keep mine and save</button>
          </div>
        </section>
      ) : null}

      {kindControls()}

      {/* A weld step opens on its pass form; what the procedure says about the joint follows it. */}
      {step.kind === "weld" && step.spec.instructions ? <Markdown source={step.spec.instructions} className="text-lg text-graphite-950" testId="instructions" /> : null}

      {step.kind === "geometry" ? <SafetyNote /> : null}

      {needed > 0 || step.kind === "photo" || photos.length > 0 || editable ? (
        <PhotoStrip jobId={jobId} stepId={step.id} photos={photos} needed={needed} canAdd={editable} canRemove={editable} onRemove={removePhoto} />
      ) : null}

      {ncs.length ? (
        <section className="space-y-3" aria-label="Nonconformances on this step">
          {ncs.map((n) => <NcCard key={n.id} jobId={jobId} nc={n} viewer={viewer} photos={record.photos} />)}
        </section>
      ) : null}

      {raising ? (
        <RaiseNcForm
          jobId={jobId}
          stepId={step.id}
          photos={photos}
          suggested={outOfTolerance ? `Out of tolerance: ${outOfToleranceText(step.spec, value, viewer.unitSystem)}` : ""}
          onDone={() => setRaising(false)}
          onCancel={() => setRaising(false)}
        />
      ) : null}

      {step.signed ? (
        <section className="space-y-3" aria-labelledby="signed-h">
          <h3 id="signed-h" className="text-lg font-bold">Signed record</h3>
          <SignOffList signOffs={step.signOffs} summary={(s) => (joint ? weldSignOffSummary(s, joint) : valueSummary(step.spec, s.value, viewer.unitSystem, passes.filter((p) => !p.removed).length))} />
          {joint ? (
            <p className="text-graphite-900">A weld joint is not amended: a problem found later is raised as a nonconformance on this step.</p>
          ) : null}
          {jobOpen && mayWork && !amending && !joint ? (
            <button type="button" className="btn btn-quiet min-h-14 text-lg" onClick={() => { setAmendValue(step.effectiveValue ?? {}); setAmending(true); }} data-testid="amend-start">
              Correct with an amendment
            </button>
          ) : null}
          {amending ? (
            <div className="space-y-3 rounded-lg border-4 border-graphite-950 bg-white p-4" data-testid="amend-form">
              <p className="font-bold">Amendment: the signed value stays; your correction is signed beside it.</p>
              <div>
                <label htmlFor="amend-reason" className="field-label">Reason for the correction</label>
                <textarea id="amend-reason" className="field-input min-h-20 text-lg" value={reason} onChange={(e) => setReason(e.target.value)} />
                <p className="field-error">{reason.trim().length > 0 && reason.trim().length < 5 ? "At least 5 characters." : ""}</p>
              </div>
              <p className="field-error">{live.canSign ? "" : live.reasons.join(" ")}</p>
              <div className="grid grid-cols-2 gap-3">
                <button type="button" className="btn btn-quiet min-h-14 text-lg" onClick={() => setAmending(false)}>Cancel</button>
                <button type="button" className="btn btn-primary min-h-14 text-lg" disabled={reason.trim().length < 5 || !live.canSign} onClick={() => setSigning("amend")} data-testid="amend-sign">Sign amendment</button>
              </div>
            </div>
          ) : null}
        </section>
      ) : joint && joint.state === "awaiting_inspection" ? (
        viewer.roles.includes("inspector") ? (
          <InspectionPanel key={`${step.id}:${joint.round}`} record={record} step={step} />
        ) : (
          <VerdictBox tone="wait" title={`${joint.round > 1 ? `Repair round ${joint.round}` : "Round 1"} is signed and waits for inspection`} testId="awaiting-inspection">
            {joint.rounds[joint.round - 1]?.performed ? <p>Signed by {joint.rounds[joint.round - 1]!.performed!.printedName}, {joint.rounds[joint.round - 1]!.performed!.signedAt.slice(0, 16).replace("T", " ")} UTC.</p> : null}
            <p>An inspector who made no pass of this joint inspects it once it has cooled. If it is rejected, a repair round opens here.</p>
          </VerdictBox>
        )
      ) : (
        <section className="space-y-3 rounded-xl border-2 border-graphite-300 bg-white p-4" aria-labelledby="sign-h" data-testid="sign-panel">
          <div className="flex flex-wrap items-center justify-between gap-2">
            <h3 id="sign-h" className="text-lg font-bold">Sign-off</h3>
            {editable && touched ? <Pill tone={save.tone} testId="save-state">{save.text}</Pill> : null}
          </div>
          {draft.problem ? <p className="field-error" data-testid="save-problem">{draft.problem}</p> : null}
          {live.canSign && !step.signBlock ? (
            <VerdictBox tone="pass" title={live.acceptedUnder.length ? `Ready to sign under NC-${live.acceptedUnder.join(", NC-")} (use as is)` : "Ready to sign"} testId="readiness" />
          ) : (
            <VerdictBox tone={outOfTolerance ? "fail" : "idle"} title={outOfTolerance ? "Cannot be signed as passed" : step.signBlock && live.canSign ? "Not yours to sign" : "Not ready to sign"} testId="readiness">
              <ul className="list-disc pl-5">
                {[...live.reasons, ...(step.signBlock ? [step.signBlock] : [])].map((r) => <li key={r}>{r}</li>)}
              </ul>
            </VerdictBox>
          )}
          {message ? <p className="field-error" data-testid="sign-message">{message}</p> : null}
          {!outOfTolerance && mayRaise && !raising && !step.lockedBy ? (
            <button type="button" className="btn btn-quiet min-h-12" onClick={() => setRaising(true)} data-testid="report-problem">Report a problem (nonconformance)</button>
          ) : null}
        </section>
      )}


      <StepBar index={nav.index} total={nav.total} onPrev={nav.onPrev} onNext={nav.onNext}>
        {step.signed ? (
          <p className="flex min-h-14 flex-1 items-center justify-center rounded-md border-2 border-[#2f4a08] bg-[#eef5d6] px-3 text-lg font-bold text-[#1f3305]" data-testid="bar-signed"><span aria-hidden="true">●&nbsp;</span>Signed</p>
        ) : mayHandOver ? (
          <button type="button" className="btn btn-primary min-h-14 flex-1 px-4 text-lg" onClick={() => setHandOver("choose")} data-testid="handover-start">
            Hand to an inspector to sign
          </button>
        ) : jobOpen && !step.lockedBy && !step.signBlock && !(joint && joint.state === "awaiting_inspection") && !amending ? (
          <button type="button" className="btn btn-primary min-h-14 flex-1 px-4 text-lg disabled:border-graphite-400 disabled:bg-graphite-100 disabled:text-graphite-800 disabled:opacity-100" disabled={!live.canSign || draft.state === "conflict"} onClick={() => void startSign()} data-testid="sign-step">
            {meaningLabel}
          </button>
        ) : null}
        {!step.signed && outOfTolerance && mayRaise && !raising ? (
          <button type="button" className="btn btn-danger min-h-14 flex-1 px-4 text-lg" onClick={() => setRaising(true)} data-testid="raise-nc">
            ✕ Raise nonconformance
          </button>
        ) : null}
      </StepBar>

      {handOver === "choose" ? <HandOverPicker jobId={jobId} onClose={() => setHandOver(null)} onChoose={(p) => setHandOver(p)} /> : null}
      {handOver && handOver !== "choose" ? (
        <PinDialog
          title={`${handOver.name} signs: “${step.title}”`}
          signAs={{ name: handOver.name, role: "inspector", meaning: step.meaning }}
          pinLabel={`${handOver.name}'s signing PIN`}
          testId="handover-pin"
          onClose={() => setHandOver(null)}
          onSign={async (pin) => {
            const result = await apiJson<{ record: JobRecord }>(`/api/jobs/${jobId}/steps/${step.id}/sign`, { body: { pin, baseVersion: draft.baseVersion(), handOver: { membershipId: handOver.membershipId } } });
            setHandOver(null);
            setRecord(result.record);
            nav.onSigned(result.record);
          }}
        >
          <p className="mt-3 font-semibold text-graphite-950">Signed under {handOver.name}&rsquo;s name; the tablet goes back to {viewer.name} after this one sign-off.</p>
        </PinDialog>
      ) : null}

      {signing ? (
        <PinDialog
          title={signing === "amend" ? `Amend “${step.title}”` : `${meaningLabel}: “${step.title}”`}
          signAs={{ name: viewer.name, role: "refuse" in role ? "" : role.role, meaning: step.meaning }}
          onClose={() => setSigning(null)}
          onSign={async (pin) => {
            if (signing === "amend") {
              const result = await apiJson<{ record: JobRecord }>(`/api/jobs/${jobId}/steps/${step.id}/amend`, { body: { pin, amendsSignOffId: latest!.id, reason: reason.trim(), value: amendValue } });
              setRecord(result.record);
              setAmending(false);
              setReason("");
            } else {
              const result = await apiJson<{ record: JobRecord }>(`/api/jobs/${jobId}/steps/${step.id}/sign`, { body: { pin, baseVersion: draft.baseVersion() } });
              setRecord(result.record);
              setSigning(null);
              nav.onSigned(result.record);
              return;
            }
            setSigning(null);
          }}
        >
          <p className="mt-3 text-graphite-950">{valueSummary(step.spec, value, viewer.unitSystem, passes.filter((p) => !p.removed).length) || step.title}</p>
        </PinDialog>
      ) : null}
    </article>
  );
}
