"use client";
import { getFormProps, useForm } from "@conform-to/react";
import { parseWithZod } from "@conform-to/zod/v4";
import Link from "next/link";
import { startTransition, useActionState, useState } from "react";
import type { z } from "zod";
import { FormMessage } from "@/components/form-message";
import { fieldLabel, CAPTURE_LABELS, HAZARD_LABELS, KIND_HINTS, KIND_LABELS, QUANTITY_LABELS, QUANTITY_SYMBOLS, SIGNER_LABELS, TOLERANCE_LABELS, TORQUE_UNIT_LABELS } from "@/lib/procedures/labels";
import { stepFormSchema, TORQUE_TO_NM } from "@/lib/procedures/forms";
import { Markdown } from "@/lib/procedures/markdown-view";
import { GEOMETRY_CAPTURES, HAZARDS, JOINT_TYPES, MEASURE_QUANTITIES, SIGNER_ROLES, STEP_KINDS, WELD_PROCESSES, type StepKind } from "@/lib/procedures/schema";
import { saveStepAction } from "../../actions";
import { Checkbox, CheckboxGroup, SelectField, TextArea, TextField, type Errors } from "./fields";

type Draft = { kind: StepKind; key: string } & Record<string, unknown>;

const POSITIONS = ["1F", "2F", "3F", "4F", "1G", "2G", "3G", "4G", "5G", "6G", "6GR"] as const;
const opts = <T extends string>(values: readonly T[], labels?: Partial<Record<T, string>>) => values.map((v) => [v, labels?.[v] ?? v] as const);

function str(v: unknown): string | undefined {
  return typeof v === "string" ? v : undefined;
}
function num(v: unknown): number | undefined {
  return typeof v === "number" && Number.isFinite(v) ? v : undefined;
}

export function StepForm({
  procedureId,
  number,
  sectionKey,
  sectionTitle,
  originalKey,
  initial,
  suggestedJointId,
  cancelHref,
}: {
  procedureId: string;
  number: number;
  sectionKey: string;
  sectionTitle: string;
  originalKey?: string;
  initial: Draft;
  suggestedJointId: string;
  cancelHref: string;
}) {
  const [state, formAction, pending] = useActionState(saveStepAction, undefined);
  const [kind, setKind] = useState<StepKind>(initial.kind);
  const [instructions, setInstructions] = useState(str(initial.instructions) ?? "");
  const [preview, setPreview] = useState(false);
  const initialTolerance = (initial.tolerance ?? {}) as Record<string, unknown>;
  const [tolType, setTolType] = useState(str(initialTolerance.type) ?? "plusMinus");
  const initialPhotos = (initial.photos ?? { required: false, min: 0 }) as { required: boolean; min: number };
  const [form] = useForm<z.input<typeof stepFormSchema>, z.output<typeof stepFormSchema>>({
    id: `step-${originalKey ?? "new"}`,
    lastResult: state,
    shouldValidate: "onSubmit",
    shouldRevalidate: "onInput",
    onValidate: ({ formData }) => parseWithZod(formData, { schema: stepFormSchema }),
    onSubmit(event, { formData }) {
      event.preventDefault();
      startTransition(() => formAction(formData));
    },
  });
  const errors = form.allErrors as Errors;
  const f = form.id;
  // Values of the kind the step had when the form opened; a changed kind starts from blanks.
  const same = kind === initial.kind;
  const v = (name: string) => (same ? initial[name] : undefined);
  const torqueUnit = (same ? str(initial.torqueUnit) : undefined) ?? "N_m";
  const torqueValue = same && num(initial.torqueNm) !== undefined ? Number((num(initial.torqueNm)! / TORQUE_TO_NM[torqueUnit as "N_m" | "lbf_ft"]).toFixed(2)) : undefined;
  const quantity = (same ? str(initial.quantity) : undefined) ?? "length";
  const unitOf = (q: string) => QUANTITY_SYMBOLS[q as keyof typeof QUANTITY_SYMBOLS] ?? "";
  const [qty, setQty] = useState(quantity);
  const shown = new Set<string>();
  const mark = (name: string) => (shown.add(name), name);
  // Called last in the markup, once every rendered field has been marked: errors no field shows are listed here.
  const leftover = () => Object.entries(errors).filter(([name, list]) => name && list?.length && !shown.has(name));

  return (
    <form
      {...getFormProps(form)}
      action={formAction}
      className="card space-y-4 p-4"
      data-testid="step-form"
      aria-labelledby={`${f}-h`}
    >
      <input type="hidden" name="procedureId" value={procedureId} />
      <input type="hidden" name="number" value={number} />
      <input type="hidden" name="sectionKey" value={sectionKey} />
      {originalKey ? <input type="hidden" name="originalKey" value={originalKey} /> : null}
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 id={`${f}-h`} className="text-lg font-bold">{originalKey ? "Edit step" : "New step"}</h2>
        <span className="text-sm text-graphite-600">in section “{sectionTitle}”</span>
      </div>

      <div className="grid gap-3 sm:grid-cols-2">
        <SelectField formId={f} name={mark("step.kind")} label="Kind" errors={errors} options={opts(STEP_KINDS, KIND_LABELS)} value={kind} onChange={(k) => setKind(k as StepKind)} hint={KIND_HINTS[kind]} />
        {kind === "hold" ? (
          <div>
            <p className="field-label">Signed by</p>
            <input type="hidden" name="step.signedBy" value="inspector" />
            <p className="flex min-h-11 items-center font-semibold">Inspector (always, at a hold point)</p>
          </div>
        ) : (
          <SelectField formId={f} name={mark("step.signedBy")} label="Signed by" errors={errors} options={opts(SIGNER_ROLES, SIGNER_LABELS)} defaultValue={str(initial.signedBy) ?? "welder"} />
        )}
        <TextField formId={f} name={mark("step.title")} label="Title" errors={errors} defaultValue={str(initial.title)} className="sm:col-span-2" />
        {/* The key is the editor's: made from the title when the step is first saved, then kept for good. The
            step schema wants one, so the form carries the one it has; the server decides which is stored. */}
        <input type="hidden" name={mark("step.key")} value={initial.key} />
        <p className="text-sm text-graphite-600 sm:col-span-2" data-testid="step-key">
          {originalKey ? (
            <>Step key <span className="figures font-semibold text-graphite-900">{originalKey}</span>: kept across versions, whatever the title becomes.</>
          ) : (
            <>The step key is made from the title when you add the step, and kept from then on.</>
          )}
        </p>
      </div>

      <div>
        <div className="flex items-center justify-between">
          <span className="field-label">Instructions (Markdown: **bold**, lists, links)</span>
          <button type="button" className="btn btn-quiet min-h-9 px-2 text-sm" onClick={() => setPreview((p) => !p)} aria-pressed={preview}>
            {preview ? "Hide preview" : "Preview"}
          </button>
        </div>
        <TextArea formId={f} name={mark("step.instructions")} label="Instructions" errors={errors} defaultValue={instructions} rows={6} onInput={setInstructions} className="[&>label]:sr-only" />
        {preview ? (
          <div className="rounded-md border-2 border-dashed border-graphite-300 p-3" data-testid="instructions-preview">
            {instructions.trim() ? <Markdown source={instructions} /> : <p className="text-graphite-600">Nothing to preview.</p>}
          </div>
        ) : null}
      </div>

      <fieldset className="grid gap-3 rounded-md border border-graphite-200 p-3 sm:grid-cols-2">
        <legend className="px-1 text-sm font-bold">Photos</legend>
        <Checkbox formId={f} name="step.photos.required" label="Photos required before signing" defaultChecked={initialPhotos.required} />
        <TextField formId={f} name={mark("step.photos.min")} label="At least" type="number" unit="photos" errors={errors} defaultValue={initialPhotos.min} />
      </fieldset>

      <fieldset className="space-y-3 rounded-md border-2 border-graphite-300 p-3" data-testid={`kind-fields-${kind}`}>
        <legend className="px-1 text-sm font-bold">{KIND_LABELS[kind]}</legend>
        {kind === "measure" ? (
          <div className="grid gap-3 sm:grid-cols-2">
            <SelectField formId={f} name={mark("step.quantity")} label="Quantity" errors={errors} options={opts(Object.keys(MEASURE_QUANTITIES), QUANTITY_LABELS)} value={qty} onChange={setQty} />
            <SelectField formId={f} name={mark("step.tolerance.type")} label="Tolerance" errors={errors} options={opts(Object.keys(TOLERANCE_LABELS), TOLERANCE_LABELS)} value={tolType} onChange={setTolType} />
            <TextField
              formId={f}
              name={mark("step.nominal")}
              label={tolType === "plusMinus" ? "Nominal" : "Nominal (optional)"}
              type="number"
              unit={unitOf(qty)}
              errors={errors}
              defaultValue={num(v("nominal"))}
            />
            {tolType === "plusMinus" ? (
              <>
                <div className="grid grid-cols-2 gap-2">
                  <TextField formId={f} name={mark("step.tolerance.plus")} label="Plus" type="number" unit={unitOf(qty)} errors={errors} defaultValue={num(initialTolerance.plus)} />
                  <TextField formId={f} name={mark("step.tolerance.minus")} label="Minus" type="number" unit={unitOf(qty)} errors={errors} defaultValue={num(initialTolerance.minus)} />
                </div>
              </>
            ) : null}
            {tolType === "range" || tolType === "min" ? (
              <TextField formId={f} name={mark("step.tolerance.min")} label="Min" type="number" unit={unitOf(qty)} errors={errors} defaultValue={num(initialTolerance.min)} />
            ) : null}
            {tolType === "range" || tolType === "max" ? (
              <TextField formId={f} name={mark("step.tolerance.max")} label="Max" type="number" unit={unitOf(qty)} errors={errors} defaultValue={num(initialTolerance.max)} />
            ) : null}
          </div>
        ) : null}
        {kind === "caution" ? (
          <>
            <CheckboxGroup formId={f} name={mark("step.hazards")} label="Hazards" errors={errors} options={opts(HAZARDS, HAZARD_LABELS)} defaultValue={(same ? (initial.hazards as string[] | undefined) : undefined) ?? ["ppe"]} />
            <TextArea formId={f} name={mark("step.acknowledgement")} label="What the signer acknowledges" errors={errors} defaultValue={str(v("acknowledgement"))} rows={2} />
          </>
        ) : null}
        {kind === "weld" ? (
          <div className="grid gap-3 sm:grid-cols-3">
            <TextField formId={f} name={mark("step.jointId")} label="Joint id" errors={errors} defaultValue={str(v("jointId")) ?? suggestedJointId} placeholder="W1" />
            <SelectField formId={f} name={mark("step.jointType")} label="Joint type" errors={errors} options={opts(JOINT_TYPES)} defaultValue={str(v("jointType")) ?? "fillet"} />
            <SelectField formId={f} name={mark("step.position")} label="Position" errors={errors} options={opts(POSITIONS)} defaultValue={str(v("position")) ?? "2F"} />
            <TextField formId={f} name={mark("step.sizeMm")} label="Size" type="number" unit="mm" errors={errors} defaultValue={num(v("sizeMm"))} />
            <TextField formId={f} name={mark("step.lengthMm")} label="Length" type="number" unit="mm" errors={errors} defaultValue={num(v("lengthMm"))} />
            <SelectField formId={f} name={mark("step.process")} label="Process" errors={errors} options={opts(WELD_PROCESSES)} defaultValue={str(v("process")) ?? "GMAW"} />
            <TextField formId={f} name={mark("step.wpsRef")} label="WPS" errors={errors} defaultValue={str(v("wpsRef"))} />
            <TextField formId={f} name={mark("step.filler")} label="Filler metal" errors={errors} defaultValue={str(v("filler"))} />
            <TextField formId={f} name={mark("step.minPreheatC")} label="Min preheat" type="number" unit="°C" errors={errors} defaultValue={num(v("minPreheatC"))} />
          </div>
        ) : null}
        {kind === "hold" ? (
          <TextArea formId={f} name={mark("step.inspection")} label="What the inspector checks" errors={errors} defaultValue={str(v("inspection"))} rows={4} hint="Later steps stay locked until an inspector signs this hold point." />
        ) : null}
        {kind === "torque" ? (
          <div className="grid gap-3 sm:grid-cols-2">
            <TextField formId={f} name={mark("step.fastener")} label="Fastener" errors={errors} defaultValue={str(v("fastener"))} className="sm:col-span-2" />
            <TextField formId={f} name={mark("step.torqueValue")} label="Specified torque" type="number" errors={errors} defaultValue={torqueValue} />
            <SelectField formId={f} name={mark("step.torqueUnit")} label="Unit (as the maker gives it)" errors={errors} options={opts(Object.keys(TORQUE_UNIT_LABELS), TORQUE_UNIT_LABELS)} defaultValue={torqueUnit} hint="Stored in N·m; shown in both." />
            <TextField formId={f} name={mark("step.tolerancePct")} label="Tolerance" type="number" unit="± %" errors={errors} defaultValue={num(v("tolerancePct")) ?? 10} />
            <TextField formId={f} name={mark("step.pattern")} label="Pattern or sequence" errors={errors} defaultValue={str(v("pattern"))} />
          </div>
        ) : null}
        {kind === "coating" ? (
          <div className="grid gap-3 sm:grid-cols-2">
            <TextField formId={f} name={mark("step.surfacePrep")} label="Surface preparation grade" errors={errors} defaultValue={str(v("surfacePrep"))} placeholder="SSPC-SP 11" />
            <TextField formId={f} name={mark("step.product")} label="Product" errors={errors} defaultValue={str(v("product"))} />
            <TextField formId={f} name={mark("step.dewPointMarginC")} label="Steel above dew point by at least" type="number" unit="°C" errors={errors} defaultValue={num(v("dewPointMarginC")) ?? 3} />
            <div className="grid grid-cols-2 gap-2">
              <TextField formId={f} name={mark("step.dftMinUm")} label="DFT min" type="number" unit="µm" errors={errors} defaultValue={num(v("dftMinUm"))} />
              <TextField formId={f} name={mark("step.dftMaxUm")} label="DFT max" type="number" unit="µm" errors={errors} defaultValue={num(v("dftMaxUm"))} />
            </div>
          </div>
        ) : null}
        {kind === "geometry" ? (
          <SelectField formId={f} name={mark("step.capture")} label="Capture the steering-link points" errors={errors} options={opts(GEOMETRY_CAPTURES, CAPTURE_LABELS)} defaultValue={str(v("capture")) ?? "both"} />
        ) : null}
        {kind === "check" || kind === "photo" ? <p className="text-sm text-graphite-600">{KIND_HINTS[kind]} No further fields.</p> : null}
      </fieldset>

      {leftover().length ? (
        <ul className="space-y-1 rounded-md border-2 border-verdict-fail bg-verdict-failbg p-3 text-sm text-verdict-fail" data-testid="step-form-other-errors">
          {leftover().map(([name, list]) => (
            <li key={name}><span aria-hidden="true">✕ </span><strong>{fieldLabel(name.replace(/^step\./, ""))}:</strong> {list![0]}</li>
          ))}
        </ul>
      ) : null}
      <FormMessage ok={state?.ok} errors={form.errors} testId="step-form" />
      <div className="flex flex-wrap gap-2">
        <button type="submit" className="btn btn-primary" disabled={pending}>{pending ? "Saving…" : originalKey ? "Save step" : "Add step"}</button>
        <Link href={cancelHref} className="btn btn-quiet">Cancel</Link>
      </div>
    </form>
  );
}
