"use client";
import { RecordWeldMap } from "@/components/weld-map/record-weld-map";
// Visual inspection of a weld joint's round, on the inspector's tablet. Every entry is judged as it is
// typed by the chosen criteria (lib/welding judgeVisual: AWS D1.1:2020 Table 8.1 statically loaded, or
// ISO 5817:2014 level B, C or D), each beside its limit; the inspector then accepts or rejects with photos
// and the PIN. Accepting what the criteria reject is not offered (the server refuses it too); rejecting what
// they accept needs a note saying why. The judgement supports the inspector, who decides.
import { useState } from "react";
import { SafetyNote } from "@/components/safety-note";
import type { JobRecord, JointView, PhotoView, StepView } from "@/lib/jobs/record";
import { readPadNumber } from "@/lib/jobs/units";
import { PHOTO_MAX_BYTES } from "@/lib/jobs/schemas";
import { judgeVisual, VISUAL_CRITERIA, VISUAL_CRITERIA_LABELS, type VisualCriteria, type VisualItem, type VisualItemResult, type VisualObservations } from "@/lib/welding";
import { visualObservationsSchema } from "@/lib/welding/schema";
import { apiJson, ApiError, newKey, uploadPhoto } from "./api";
import { PinDialog } from "./pin-dialog";
import { useSetRecord } from "./use-job";
import { Pill, VerdictBox } from "./verdict";
import { coverageOf, ITEM_LABELS, PassCard, wpsOf, type Weld } from "./weld-control";

type BoolKey = "cracks" | "fusionComplete" | "cratersFilled" | "profileAcceptable" | "arcStrikes" | "spatterAcceptable";
type NumKey = "materialThicknessMm" | "specifiedLegMm" | "weldLengthMm" | "measuredLegMm" | "undersizeLengthMm" | "undercutDepthMm" | "undercutAccumulatedMm" | "porosityMm" | "porosity12Mm";

// Every row reads the same way: a statement of the sound weld, and Pass when it holds. "good" is the
// observation's value when the row passes (no crack is good; full fusion is good).
const QUESTIONS: Record<BoolKey, string> = {
  cracks: "No crack in the weld or beside it",
  fusionComplete: "Fused to the base metal and between passes all along",
  cratersFilled: "Craters filled to the full cross section",
  profileAcceptable: "Profile acceptable (convexity, toes, no overlap)",
  arcStrikes: "No arc strikes outside the weld",
  spatterAcceptable: "Spatter cleaned off as required",
};
const GOOD: Record<BoolKey, boolean> = { cracks: false, fusionComplete: true, cratersFilled: true, profileAcceptable: true, arcStrikes: false, spatterAcceptable: true };

const NUM: Record<NumKey, { label: string; short: string; min: number; max: number; above?: boolean }> = {
  materialThicknessMm: { label: "Material thickness (thinner part)", short: "material thickness", min: 0, max: 300, above: true },
  specifiedLegMm: { label: "Specified leg", short: "specified leg", min: 0, max: 50, above: true },
  weldLengthMm: { label: "Weld length", short: "weld length", min: 0, max: 100_000, above: true },
  measuredLegMm: { label: "Smallest leg measured", short: "smallest leg", min: 0, max: 100 },
  undersizeLengthMm: { label: "Length under size", short: "length under size", min: 0, max: 100_000 },
  undercutDepthMm: { label: "Deepest undercut", short: "deepest undercut", min: 0, max: 20 },
  undercutAccumulatedMm: { label: "Undercut length in any 300 mm (12 in)", short: "undercut length", min: 0, max: 300 },
  porosityMm: { label: "Pores ≥ 0.8 mm: sum in any 25 mm (1 in)", short: "pores in 25 mm", min: 0, max: 25 },
  porosity12Mm: { label: "Pores ≥ 0.8 mm: sum in any 300 mm (12 in)", short: "pores in 300 mm", min: 0, max: 300 },
};

// What each judged item reads, in the order judgeVisual reports them.
const ROWS: { item: VisualItem; bools: BoolKey[]; nums: NumKey[] }[] = [
  { item: "cracks", bools: ["cracks"], nums: [] },
  { item: "fusion", bools: ["fusionComplete"], nums: [] },
  { item: "craters", bools: ["cratersFilled"], nums: [] },
  { item: "profile", bools: ["profileAcceptable"], nums: [] },
  { item: "undersize", bools: [], nums: ["measuredLegMm", "undersizeLengthMm"] },
  { item: "undercut", bools: [], nums: ["undercutDepthMm", "undercutAccumulatedMm"] },
  { item: "porosity", bools: [], nums: ["porosityMm", "porosity12Mm"] },
  { item: "arc-strikes", bools: ["arcStrikes"], nums: [] },
  { item: "spatter", bools: ["spatterAcceptable"], nums: [] },
];
// The joint-wide entries items also depend on.
const SHARED: Partial<Record<VisualItem, NumKey[]>> = { undersize: ["specifiedLegMm", "weldLengthMm"], undercut: ["materialThicknessMm"] };

type Upload = { key: string; file: File; progress: number; status: "uploading" | "failed"; error?: string };

type LengthUnit = "mm" | "in";
const MM_PER_IN = 25.4;
const toMm = (v: number, unit: LengthUnit) => (unit === "in" ? v * MM_PER_IN : v);
/** A length in the chosen unit, as the inspector would type it (inches to 4 decimals, so mm survive a round trip). */
const lengthText = (mm: number, unit: LengthUnit) => (unit === "in" ? String(Math.round((mm / MM_PER_IN) * 10_000) / 10_000) : String(Math.round(mm * 100) / 100));
const lengthShown = (mm: number, unit: LengthUnit) => `${lengthText(mm, unit)} ${unit}`;

/** The typed entry in millimetres (the observations are SI), or why it cannot be read. */
function numberState(text: string, spec: (typeof NUM)[NumKey], unit: LengthUnit): { value?: number; error?: string } {
  const t = text.trim();
  if (!t) return {};
  const typed = readPadNumber(t);
  if (typed === null) return { error: unit === "in" ? "A number in inches, like 0.0625." : "A number in mm, like 1.5." };
  const v = toMm(typed, unit);
  if (spec.above ? v <= spec.min : v < spec.min) return { error: spec.above ? `Above 0 ${unit}.` : `0 ${unit} or more.` };
  if (v > spec.max) return { error: `At most ${lengthShown(spec.max, unit)}.` };
  return { value: v };
}

export function InspectionPanel({ record, step }: { record: JobRecord; step: StepView }) {
  const spec = step.spec as Weld;
  const joint = step.joint as JointView;
  const jobId = record.job.id;
  const viewer = record.viewer;
  const setRecord = useSetRecord(jobId);
  const [criteria, setCriteria] = useState<VisualCriteria>("aws-d1.1-static");
  // Entries in the viewer's units; the record and the judgement are in millimetres.
  const [lenUnit, setLenUnit] = useState<LengthUnit>(viewer.unitSystem === "imperial" ? "in" : "mm");
  const [answers, setAnswers] = useState<Record<BoolKey, boolean | null>>({ cracks: null, fusionComplete: null, cratersFilled: null, profileAcceptable: null, arcStrikes: null, spatterAcceptable: null });
  const [texts, setTexts] = useState<Record<NumKey, string>>({
    materialThicknessMm: "",
    specifiedLegMm: lengthText(spec.sizeMm, viewer.unitSystem === "imperial" ? "in" : "mm"),
    weldLengthMm: lengthText(spec.lengthMm, viewer.unitSystem === "imperial" ? "in" : "mm"),
    measuredLegMm: "",
    undersizeLengthMm: "",
    undercutDepthMm: "",
    undercutAccumulatedMm: "",
    porosityMm: "",
    porosity12Mm: "",
  });
  const [notes, setNotes] = useState("");
  const [detached, setDetached] = useState<string[]>([]);
  const [uploads, setUploads] = useState<Upload[]>([]);
  const [deciding, setDeciding] = useState<null | "accepted" | "rejected">(null);

  const round = joint.rounds[joint.round - 1];
  const passes = record.passes.filter((p) => p.stepId === step.id && p.round === joint.round && !p.removed);
  const wps = wpsOf(record, spec);
  const tempUnit = viewer.unitSystem === "imperial" ? "degF" : "degC";

  if (step.inspectBlock) {
    return (
      <VerdictBox tone="idle" title="Not yours to inspect" testId="inspect-block">
        {step.inspectBlock}
      </VerdictBox>
    );
  }

  // --- entries ---
  const parsed = Object.fromEntries((Object.keys(NUM) as NumKey[]).map((k) => [k, numberState(texts[k], NUM[k], lenUnit)])) as Record<NumKey, { value?: number; error?: string }>;
  const val = (k: NumKey) => parsed[k].value;
  // No undercut means no undercut length; no pore in any 25 mm means none in any 300 mm either.
  const effective: Partial<Record<NumKey, number>> = {};
  for (const k of Object.keys(NUM) as NumKey[]) {
    const v = val(k);
    if (v !== undefined) effective[k] = v;
  }
  if (effective.undercutAccumulatedMm === undefined && effective.undercutDepthMm === 0 && !texts.undercutAccumulatedMm.trim()) effective.undercutAccumulatedMm = 0;
  if (effective.porosity12Mm === undefined && effective.porosityMm === 0 && !texts.porosity12Mm.trim()) effective.porosity12Mm = 0;
  const undersize = effective.measuredLegMm !== undefined && effective.specifiedLegMm !== undefined && effective.measuredLegMm < effective.specifiedLegMm;
  // The length under size is asked only when the leg is under size: AWS D1.1 limits it to 10 % of the weld.
  const optional = (k: NumKey) => k === "undersizeLengthMm" && !undersize;
  const ready = (k: BoolKey | NumKey): boolean => (k in NUM ? effective[k as NumKey] !== undefined || (optional(k as NumKey) && !parsed[k as NumKey].error) : answers[k as BoolKey] !== null);

  const observations: VisualObservations = {
    cracks: answers.cracks ?? false,
    fusionComplete: answers.fusionComplete ?? true,
    cratersFilled: answers.cratersFilled ?? true,
    profileAcceptable: answers.profileAcceptable ?? true,
    specifiedLegMm: effective.specifiedLegMm ?? spec.sizeMm,
    measuredLegMm: effective.measuredLegMm ?? effective.specifiedLegMm ?? spec.sizeMm,
    ...(effective.undersizeLengthMm !== undefined ? { undersizeLengthMm: effective.undersizeLengthMm } : {}),
    weldLengthMm: effective.weldLengthMm ?? spec.lengthMm,
    materialThicknessMm: effective.materialThicknessMm ?? 10,
    undercutDepthMm: effective.undercutDepthMm ?? 0,
    undercutAccumulatedMm: effective.undercutAccumulatedMm ?? 0,
    porosityMm: effective.porosityMm ?? 0,
    porosity12Mm: effective.porosity12Mm ?? 0,
    arcStrikes: answers.arcStrikes ?? false,
    spatterAcceptable: answers.spatterAcceptable ?? true,
  };
  const verdict = judgeVisual(criteria, observations);
  const rowInputs = (r: (typeof ROWS)[number]) => [...r.bools, ...r.nums, ...(SHARED[r.item] ?? [])];
  const rowReady = (r: (typeof ROWS)[number]) => rowInputs(r).every(ready);
  const missing = [
    ...(["materialThicknessMm", "specifiedLegMm", "weldLengthMm"] as const).filter((k) => !ready(k)).map((k) => NUM[k].short),
    ...ROWS.flatMap((r) => [...r.bools, ...r.nums].filter((k) => !ready(k)).map((k) => (k in NUM ? NUM[k as NumKey].short : ITEM_LABELS[r.item].toLowerCase()))),
  ];
  const complete = missing.length === 0 && (Object.keys(NUM) as NumKey[]).every((k) => !parsed[k].error);
  const schemaCheck = complete ? visualObservationsSchema.safeParse(observations) : null;
  const crossErrors = schemaCheck && !schemaCheck.success ? schemaCheck.error.issues.map((i) => i.message) : [];
  const judged: "accept" | "reject" | null = complete && crossErrors.length === 0 ? verdict.verdict : null;

  // --- photos ---
  const caption = `${spec.jointId} round ${joint.round} inspection`;
  const usedPhotos = new Set(record.inspections.flatMap((i) => i.photoIds));
  const candidates = record.photos.filter((p) => p.stepId === null && p.nonconformanceId === null && !p.removed && !usedPhotos.has(p.id) && p.caption === caption);
  const attached = candidates.filter((p) => !detached.includes(p.id));

  const send = async (u: Upload) => {
    setUploads((all) => all.map((x) => (x.key === u.key ? { ...x, status: "uploading", progress: 0, error: undefined } : x)));
    try {
      const result = await uploadPhoto(jobId, u.file, { idempotencyKey: u.key, caption, onProgress: (p) => setUploads((all) => all.map((x) => (x.key === u.key ? { ...x, progress: p } : x))) });
      setRecord(result.record);
      setUploads((all) => all.filter((x) => x.key !== u.key));
    } catch (e) {
      const message = e instanceof ApiError ? e.message : "The upload failed.";
      setUploads((all) => all.map((x) => (x.key === u.key ? { ...x, status: "failed", error: message } : x)));
    }
  };
  const onFiles = (files: FileList | null) => {
    for (const file of Array.from(files ?? [])) {
      const u: Upload = { key: newKey(), file, progress: 0, status: "uploading" };
      if (file.size > PHOTO_MAX_BYTES) {
        setUploads((all) => [...all, { ...u, status: "failed", error: `This file is ${(file.size / 1024 / 1024).toFixed(1)} MB; photos are at most 20 MB.` }]);
        continue;
      }
      setUploads((all) => [...all, u]);
      void send(u);
    }
  };

  // --- deciding ---
  const notesShort = notes.trim().length < 5;
  const acceptWhy = [
    !complete ? `Enter ${missing.length ? missing.join(", ") : "every value as a number"}.` : null,
    crossErrors.length ? crossErrors.join(" ") : null,
    judged === "reject" ? `The entries fail ${VISUAL_CRITERIA_LABELS[criteria]}: the joint cannot be accepted.` : null,
    attached.length === 0 ? "Take at least one photo of the joint as inspected." : null,
  ].filter((x): x is string => !!x);
  const rejectWhy = [
    !complete ? "Every entry is needed to reject too: the rejection records what was found." : null,
    judged === "accept" && notesShort ? "Every entry meets the criteria: say in the notes what makes you reject the joint (at least 5 characters)." : null,
    attached.length === 0 ? "Take at least one photo of the joint as inspected." : null,
  ].filter((x): x is string => !!x);
  const canAccept = judged === "accept" && attached.length > 0;
  const canReject = judged !== null && attached.length > 0 && (judged === "reject" || !notesShort);

  const sign = async (pin: string) => {
    const body = { criteria, observations, decision: deciding!, notes: notes.trim(), photoIds: attached.map((p) => p.id), pin };
    const result = await apiJson<{ record: JobRecord }>(`/api/jobs/${jobId}/steps/${step.id}/inspections`, { body });
    setDeciding(null);
    setRecord(result.record);
  };

  const failedItems = verdict.items.filter((i) => !i.ok);
  // Switching units converts what is typed, so nothing entered is lost.
  const switchUnit = (u: LengthUnit) => {
    if (u === lenUnit) return;
    setTexts((all) => {
      const next = { ...all };
      for (const k of Object.keys(NUM) as NumKey[]) {
        const typed = readPadNumber(all[k].trim());
        if (all[k].trim() && typed !== null) next[k] = lengthText(toMm(typed, lenUnit), u);
      }
      return next;
    });
    setLenUnit(u);
  };
  const setNum = (k: NumKey, t: string) => setTexts((all) => ({ ...all, [k]: t.replace(/[^0-9.,]/g, "") }));
  const numField = (k: NumKey, hint?: string) => (
    <div key={k}>
      <label htmlFor={`obs-${k}`} className="field-label">{NUM[k].label}</label>
      <div className="flex items-center gap-2">
        <input id={`obs-${k}`} className="field-input figures min-h-14 text-xl" inputMode="decimal" autoComplete="off" value={texts[k]} onChange={(e) => setNum(k, e.target.value)} aria-invalid={parsed[k].error ? true : undefined} aria-describedby={`obs-${k}-err`} />
        <span className="figures font-semibold text-graphite-800">{lenUnit}</span>
      </div>
      <p id={`obs-${k}-err`} className="field-error">{parsed[k].error ?? ""}</p>
      {hint ? <p className="-mt-1 text-sm text-graphite-800">{hint}</p> : null}
    </div>
  );

  return (
    <section className="space-y-4 rounded-xl border-4 border-graphite-950 bg-white p-4" aria-labelledby="inspect-h" data-testid="inspection-panel">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h3 id="inspect-h" className="text-xl font-bold">Visual inspection of {spec.jointId}, {joint.round > 1 ? `repair round ${joint.round}` : "round 1"}</h3>
        <Pill tone="wait">Waiting for you</Pill>
      </div>
      <RecordWeldMap record={record} highlight={spec.jointId} testId="inspection-weld-map" title={`Where ${spec.jointId} is`} />
      <VerdictBox tone="info" title="Inspect after the weld has cooled to ambient" testId="cool-note">
        A hot weld hides cracks that open as it cools, and a hot part burns: wait until it is at shop temperature, then inspect and photograph it.
      </VerdictBox>

      <div className="grid gap-4 lg:grid-cols-[minmax(0,1fr)_19rem]">
        <div className="min-w-0 space-y-4">
          <fieldset className="grid gap-x-3 rounded-lg border-2 border-graphite-300 p-3 sm:grid-cols-2">
            <legend className="px-1 font-bold">The joint as inspected</legend>
            <div className="sm:col-span-2">
              <label htmlFor="insp-criteria" className="field-label">Acceptance criteria</label>
              <select id="insp-criteria" className="field-input min-h-14 text-lg" value={criteria} onChange={(e) => setCriteria(e.target.value as VisualCriteria)} data-testid="insp-criteria">
                {VISUAL_CRITERIA.map((c) => <option key={c} value={c}>{VISUAL_CRITERIA_LABELS[c]}</option>)}
              </select>
              <p className="field-error" />
            </div>
            <div className="sm:col-span-2" role="group" aria-labelledby="insp-unit-l">
              <span id="insp-unit-l" className="field-label">Lengths in</span>
              <div className="flex gap-2">
                {(["mm", "in"] as const).map((u) => (
                  <button key={u} type="button" className={`btn min-h-12 min-w-20 ${lenUnit === u ? "btn-primary" : "btn-quiet"}`} aria-pressed={lenUnit === u} onClick={() => switchUnit(u)} data-testid={`insp-unit-${u}`}>
                    {u === "mm" ? "millimetres" : "inches"}
                  </button>
                ))}
              </div>
              <p className="field-error" />
            </div>
            {numField("materialThicknessMm")}
            {numField("specifiedLegMm", `The procedure specifies ${lengthShown(spec.sizeMm, lenUnit)}.`)}
            {numField("weldLengthMm", `The procedure specifies ${lengthShown(spec.lengthMm, lenUnit)}.`)}
          </fieldset>

          <ol className="space-y-3" aria-label="Observations">
            {ROWS.map((r) => {
              const result = verdict.items.find((i) => i.item === r.item) as VisualItemResult;
              const isReady = rowReady(r);
              const needsThickness = r.item === "undercut" && !ready("materialThicknessMm");
              return (
                <li key={r.item} className={`grid gap-3 rounded-lg border-2 p-3 sm:grid-cols-[minmax(0,1fr)_15rem] ${isReady && !result.ok ? "border-[#8a1d15]" : "border-graphite-300"}`} data-testid={`item-${r.item}`}>
                  <div className="min-w-0">
                    <h4 className="font-bold">{ITEM_LABELS[r.item]}</h4>
                    {r.bools.map((b) => (
                      <fieldset key={b} className="mt-1" data-testid={`obs-${b}`}>
                        <legend className="mb-1 text-graphite-950">{QUESTIONS[b]}</legend>
                        <div role="radiogroup" aria-label={QUESTIONS[b]} className="grid grid-cols-2 gap-2">
                          {[true, false].map((passes) => {
                            const v = passes ? GOOD[b] : !GOOD[b];
                            return (
                              <button
                                key={String(passes)}
                                type="button"
                                role="radio"
                                aria-checked={answers[b] === v}
                                onClick={() => setAnswers((all) => ({ ...all, [b]: v }))}
                                className={`min-h-14 rounded-lg border-2 text-lg font-bold ${answers[b] === v ? "border-graphite-950 bg-graphite-900 text-white" : "border-graphite-400 bg-white text-graphite-950"}`}
                              >
                                {answers[b] === v ? <span aria-hidden="true">● </span> : <span aria-hidden="true">○ </span>}
                                {passes ? "Pass" : "Fail"}
                              </button>
                            );
                          })}
                        </div>
                      </fieldset>
                    ))}
                    {r.nums.length ? (
                      <div className="mt-1 grid gap-x-3 sm:grid-cols-2">
                        {r.nums.map((k) =>
                          k === "undersizeLengthMm" && !undersize ? null : numField(k, k === "undercutAccumulatedMm" ? "0 when there is no undercut." : k === "porosity12Mm" ? "0 when there are no pores." : k === "undersizeLengthMm" ? "Over how much of the weld the leg is under size." : undefined),
                        )}
                      </div>
                    ) : null}
                  </div>
                  <div className="rounded-md bg-graphite-50 p-2 text-sm" data-testid={`item-${r.item}-result`} data-verdict={isReady ? (result.ok ? "pass" : "fail") : "idle"}>
                    {isReady ? <Pill tone={result.ok ? "pass" : "fail"}>{result.ok ? "Pass" : "Fail: outside the limit"}</Pill> : <Pill tone="idle">To enter</Pill>}
                    {isReady ? <p className="mt-1 text-graphite-950"><strong>Found:</strong> {result.measured}</p> : null}
                    <p className="mt-1 text-graphite-950" data-testid={`item-${r.item}-limit`}>
                      <strong>Limit:</strong> {needsThickness ? "enter the material thickness to see it." : result.limit}
                    </p>
                    <p className="mt-1 text-graphite-800">{result.source}</p>
                  </div>
                </li>
              );
            })}
          </ol>

          <div data-testid="inspection-verdict-wrap">
            {judged === null ? (
              <VerdictBox tone="idle" title="Not judged yet" testId="inspection-verdict">
                {crossErrors.length ? crossErrors.join(" ") : `Still to enter: ${missing.join(", ")}.`}
              </VerdictBox>
            ) : judged === "accept" ? (
              <VerdictBox tone="pass" title={`Meets ${VISUAL_CRITERIA_LABELS[criteria]}`} testId="inspection-verdict">
                Every entry is within its limit. {verdict.notes.join(" ")}
              </VerdictBox>
            ) : (
              <VerdictBox tone="fail" title={`Fails ${VISUAL_CRITERIA_LABELS[criteria]}: reject for repair`} testId="inspection-verdict">
                <ul className="list-disc pl-5">{failedItems.map((i) => <li key={i.item}><strong>{ITEM_LABELS[i.item]}</strong>: {i.measured} (limit: {i.limit})</li>)}</ul>
              </VerdictBox>
            )}
          </div>

          <div>
            <label htmlFor="insp-notes" className="field-label">Inspector&rsquo;s notes{judged === "accept" ? " (needed to reject a joint that meets the criteria)" : " (optional)"}</label>
            <textarea id="insp-notes" className="field-input min-h-24 text-lg" value={notes} maxLength={4000} onChange={(e) => setNotes(e.target.value)} />
          </div>

          <section aria-labelledby="insp-photos-h" className="space-y-2" data-testid="inspection-photos">
            <div className="flex flex-wrap items-center justify-between gap-2">
              <h4 id="insp-photos-h" className="text-lg font-bold">
                Photos of this inspection <span className="figures" data-testid="inspection-photo-count">{attached.length}</span>
                {attached.length ? <span className="ml-2 text-verdict-pass">● enough</span> : <span className="ml-2 text-graphite-800">○ at least 1</span>}
              </h4>
              <div className="flex flex-wrap gap-2">
                <label className="btn btn-primary min-h-14 cursor-pointer px-5 text-lg">
                  <span aria-hidden="true">▣</span> Take photo
                  <input type="file" accept="image/*" capture="environment" className="sr-only" data-testid="inspection-camera" onChange={(e) => { onFiles(e.target.files); e.target.value = ""; }} />
                </label>
                <label className="btn btn-quiet min-h-14 cursor-pointer px-4">
                  From files
                  <input type="file" accept="image/jpeg,image/png,image/webp,image/heic,image/heif,image/avif" multiple className="sr-only" data-testid="inspection-file" onChange={(e) => { onFiles(e.target.files); e.target.value = ""; }} />
                </label>
              </div>
            </div>
            <p className="text-sm text-graphite-800">Saved with the job as &ldquo;{caption}&rdquo;.</p>
            {uploads.length ? (
              <ul className="space-y-2" aria-label="Uploads">
                {uploads.map((u) => (
                  <li key={u.key} className="flex flex-wrap items-center gap-3 rounded-lg border-2 border-graphite-300 p-2" data-testid="inspection-upload">
                    {u.status === "uploading" ? (
                      <span className="font-semibold">Sending… <span className="figures">{Math.round(u.progress * 100)} %</span></span>
                    ) : (
                      <>
                        <span className="min-w-0 flex-1 font-semibold text-[#8a1d15]"><span aria-hidden="true">✕ </span>{u.error}</span>
                        <button type="button" className="btn btn-quiet min-h-12" onClick={() => void send(u)}>Retry</button>
                        <button type="button" className="btn btn-quiet min-h-12" onClick={() => setUploads((all) => all.filter((x) => x.key !== u.key))}>Dismiss</button>
                      </>
                    )}
                  </li>
                ))}
              </ul>
            ) : null}
            {candidates.length ? (
              <ul className="grid grid-cols-3 gap-3 sm:grid-cols-4" aria-label="Photos taken">
                {candidates.map((p: PhotoView) => {
                  const on = !detached.includes(p.id);
                  return (
                    <li key={p.id} data-testid="inspection-photo">
                      <button type="button" aria-pressed={on} onClick={() => setDetached((d) => (on ? [...d, p.id] : d.filter((x) => x !== p.id)))} className={`block w-full overflow-hidden rounded-lg border-4 ${on ? "border-graphite-950" : "border-graphite-200"}`}>
                        {/* eslint-disable-next-line @next/next/no-img-element -- served by the photos API to members only */}
                        <img src={p.thumbUrl} alt={`${p.caption}, by ${p.uploadedBy.name}`} className="aspect-square w-full object-cover" />
                        <span className="flex min-h-12 items-center justify-center bg-white text-sm font-semibold">{on ? "● Attached" : "○ Attach"}</span>
                      </button>
                    </li>
                  );
                })}
              </ul>
            ) : uploads.length === 0 ? <p className="text-graphite-800">No photo yet.</p> : null}
          </section>

          <div className="grid gap-3 sm:grid-cols-2">
            <div>
              <button type="button" className="btn btn-danger min-h-16 w-full text-xl" disabled={!canReject} onClick={() => setDeciding("rejected")} data-testid="inspect-reject">
                ✕ Reject for repair
              </button>
              {!canReject ? <ul className="mt-1 list-disc pl-5 text-sm text-graphite-900" data-testid="reject-why">{rejectWhy.map((w) => <li key={w}>{w}</li>)}</ul> : null}
            </div>
            <div>
              <button type="button" className="btn btn-primary min-h-16 w-full text-xl disabled:border-graphite-400 disabled:bg-graphite-100 disabled:text-graphite-800 disabled:opacity-100" disabled={!canAccept} onClick={() => setDeciding("accepted")} data-testid="inspect-accept">
                ● Accept the joint
              </button>
              {!canAccept ? <ul className="mt-1 list-disc pl-5 text-sm text-graphite-900" data-testid="accept-why">{acceptWhy.map((w) => <li key={w}>{w}</li>)}</ul> : null}
            </div>
          </div>
          <SafetyNote />
        </div>

        <aside className="min-w-0 space-y-3" aria-labelledby="insp-passes-h" data-testid="inspection-passes">
          <h4 id="insp-passes-h" className="text-lg font-bold">What was welded in this round</h4>
          <p className="text-sm text-graphite-950">
            {wps ? <>Checked against <strong>{wps.reference} revision {wps.number}</strong>.</> : <>WPS {spec.wpsRef} has no published revision.</>}{" "}
            {round?.performed ? <>Signed by <strong>{round.performed.printedName}</strong>, {round.performed.signedAt.slice(0, 16).replace("T", " ")} UTC.</> : null}
          </p>
          {passes.length ? (
            <ul className="space-y-2">
              {passes.map((p) => <PassCard key={p.id} pass={p} tempUnit={tempUnit} coverage={coverageOf(p, joint)} compact />)}
            </ul>
          ) : <p className="text-graphite-800">No passes in this round.</p>}
        </aside>
      </div>

      {deciding ? (
        <PinDialog
          title={`${deciding === "accepted" ? "Accept" : "Reject"} joint ${spec.jointId}, ${joint.round > 1 ? `repair round ${joint.round}` : "round 1"}`}
          signAs={{ name: viewer.name, role: "inspector", meaning: "inspected" }}
          confirmLabel={deciding === "accepted" ? "Sign acceptance" : "Sign rejection"}
          onClose={() => setDeciding(null)}
          onSign={sign}
        >
          <div className="mt-3 space-y-1 text-graphite-950" data-testid="inspection-summary">
            <p><strong>{deciding === "accepted" ? "Accepted" : "Rejected for repair"}</strong> under {VISUAL_CRITERIA_LABELS[criteria]}.</p>
            {failedItems.length ? <p>Outside the limit: {failedItems.map((i) => ITEM_LABELS[i.item].toLowerCase()).join(", ")}.</p> : <p>Every entry within its limit.</p>}
            <p>{attached.length} photo{attached.length === 1 ? "" : "s"}{notes.trim() ? ` · notes: ${notes.trim()}` : ""}</p>
          </div>
        </PinDialog>
      ) : null}
    </section>
  );
}
