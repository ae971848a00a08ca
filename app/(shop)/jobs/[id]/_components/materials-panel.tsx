"use client";
// The job's material entries with, for a lead, welder or inspector on an open job, a form to add one and,
// per entry in use, "Correct" (a new entry pre-filled from it, with a reason) and "Withdraw" (a new entry
// saying it is no longer used, with a reason). Nothing is edited in place. The form is checked with the
// API's own schema on submit and again on each input after that; the server's field errors land on the
// same fields, and what was typed stays put whatever goes wrong.
import { getFormProps, getInputProps, getSelectProps, getTextareaProps, useForm, type SubmissionResult } from "@conform-to/react";
import { parseWithZod } from "@conform-to/zod/v4";
import { useRouter } from "next/navigation";
import { useRef, useState } from "react";
import type { z } from "zod";
import { FormMessage } from "@/components/form-message";
import { MaterialTable } from "@/components/material-table";
import { apiJson, ApiError } from "@/components/runner/api";
import type { MaterialView } from "@/lib/jobs/record";
import { MATERIAL_KIND_VALUES, materialSchema } from "@/lib/jobs/schemas";
import { MATERIAL_KIND_LABELS } from "@/lib/traveller/labels";

type Mode = { kind: "add" } | { kind: "correct"; entry: MaterialView; no: number } | { kind: "withdraw"; entry: MaterialView; no: number };

export function MaterialsPanel({ jobId, materials, canRecord }: { jobId: string; materials: MaterialView[]; canRecord: boolean }) {
  const [mode, setMode] = useState<Mode | null>(null);
  const [saved, setSaved] = useState<string | null>(null);
  const [forms, setForms] = useState(0); // a new key gives a fresh, empty form after a save
  const formRef = useRef<HTMLDivElement>(null);
  const open = (m: Mode) => {
    setSaved(null);
    setMode(m);
    setForms((n) => n + 1);
    // The form sits under the table; bring it into view for a row far up the list.
    requestAnimationFrame(() => formRef.current?.scrollIntoView({ block: "nearest" }));
  };
  const usable = (m: MaterialView) => !m.superseded && !m.withdrawn;
  return (
    <section className="card" aria-labelledby="materials-h" data-testid="materials">
      <div className="flex flex-wrap items-center justify-between gap-2 px-4 pt-3">
        <h3 id="materials-h" className="font-bold">Materials</h3>
        {canRecord && mode?.kind !== "add" ? (
          <button type="button" className="btn btn-quiet" onClick={() => open({ kind: "add" })} data-testid="material-add">
            Add a material entry
          </button>
        ) : null}
      </div>
      <p className="px-4 text-sm text-graphite-700">Base metal, filler and other parts that went into the job, by heat or lot number (ISO 3834-2 traceability). Entries are never changed: a correction or withdrawal is a new entry, and the old one stays on the record.</p>
      <div className="mt-2">
        <MaterialTable
          materials={materials}
          actions={
            canRecord
              ? (m, no) =>
                  usable(m) ? (
                    <span className="flex flex-wrap gap-2">
                      <button type="button" className="btn btn-quiet min-h-11 text-sm" onClick={() => open({ kind: "correct", entry: m, no })} data-testid={`material-correct-${no}`} aria-label={`Correct entry ${no}, ${m.description}`}>
                        Correct
                      </button>
                      <button type="button" className="btn btn-danger min-h-11 text-sm" onClick={() => open({ kind: "withdraw", entry: m, no })} data-testid={`material-withdraw-${no}`} aria-label={`Withdraw entry ${no}, ${m.description}`}>
                        Withdraw
                      </button>
                    </span>
                  ) : null
              : undefined
          }
        />
      </div>
      <div ref={formRef} className="px-4 pb-4">
        {saved ? <div className="mt-3"><FormMessage ok={saved} testId="material" /></div> : null}
        {canRecord && mode ? (
          <MaterialForm
            key={forms}
            jobId={jobId}
            mode={mode}
            onCancel={() => setMode(null)}
            onSaved={(message) => {
              setMode(null);
              setSaved(message);
            }}
          />
        ) : null}
      </div>
    </section>
  );
}

function MaterialForm({ jobId, mode, onCancel, onSaved }: { jobId: string; mode: Mode; onCancel: () => void; onSaved: (message: string) => void }) {
  const router = useRouter();
  const [lastResult, setLastResult] = useState<SubmissionResult<string[]> | undefined>(undefined);
  const [busy, setBusy] = useState(false);
  const entry = mode.kind === "add" ? null : mode.entry;
  const [form, fields] = useForm<z.input<typeof materialSchema>, z.output<typeof materialSchema>>({
    id: `material-${mode.kind}-${entry?.id ?? "new"}`,
    lastResult,
    shouldValidate: "onSubmit",
    shouldRevalidate: "onInput",
    defaultValue: entry ? { kind: entry.kind, description: entry.description, specification: entry.specification, heatNumber: entry.heatNumber, certificate: entry.certificate } : { kind: "base" },
    onValidate: ({ formData }) => parseWithZod(formData, { schema: materialSchema }),
    onSubmit(event, { submission }) {
      event.preventDefault();
      if (submission?.status !== "success") return;
      setBusy(true);
      apiJson(`/api/jobs/${jobId}/materials`, { body: submission.value })
        .then(() => {
          router.refresh();
          onSaved(mode.kind === "add" ? `Entry for ${submission.value.heatNumber} recorded.` : mode.kind === "correct" ? `Entry #${mode.no} corrected; the old entry stays on the record.` : `Entry #${mode.no} withdrawn; it stays on the record.`);
        })
        .catch((e: unknown) => {
          const err = e instanceof ApiError ? e : null;
          setLastResult(submission.reply({ formErrors: [err?.message ?? "Not saved; try again."], fieldErrors: err?.fields ?? {} }));
          // Someone else corrected the entry meanwhile: show the list as it is now, the form keeps its text.
          if (err?.status === 409) router.refresh();
        })
        .finally(() => setBusy(false));
    },
  });
  const title = mode.kind === "add" ? "Add a material entry" : mode.kind === "correct" ? `Correct entry #${mode.no}` : `Withdraw entry #${mode.no}`;
  const withdrawing = mode.kind === "withdraw";
  return (
    <form {...getFormProps(form)} className="mt-3 space-y-1 rounded-lg border-2 border-graphite-700 p-3" data-testid="material-form" aria-labelledby={`${form.id}-h`}>
      <h4 id={`${form.id}-h`} className="font-bold">{title}</h4>
      {entry ? (
        <p className="text-sm text-graphite-800">
          {withdrawing
            ? `Withdrawing says ${entry.description} (${entry.heatNumber}) is no longer used on this job. The entry stays on the record, struck through.`
            : "The corrected entry stays on the record, struck through, with your reason beside it."}
        </p>
      ) : null}
      {entry ? <input type="hidden" name={fields.correctsId.name} value={entry.id} /> : null}
      {withdrawing ? <input type="hidden" name={fields.withdrawn.name} value="on" /> : null}
      {withdrawing && entry ? (
        <>
          {/* The withdrawal repeats the entry as it stands; only the reason is new. */}
          <input type="hidden" name={fields.kind.name} value={entry.kind} />
          <input type="hidden" name={fields.description.name} value={entry.description} />
          <input type="hidden" name={fields.specification.name} value={entry.specification} />
          <input type="hidden" name={fields.heatNumber.name} value={entry.heatNumber} />
          <input type="hidden" name={fields.certificate.name} value={entry.certificate} />
        </>
      ) : (
        <div className="grid gap-x-4 sm:grid-cols-2">
          <div>
            <label className="field-label" htmlFor={fields.kind.id}>Kind</label>
            <select {...getSelectProps(fields.kind)} key={fields.kind.key} className="field-input">
              {MATERIAL_KIND_VALUES.map((k) => <option key={k} value={k}>{MATERIAL_KIND_LABELS[k]}</option>)}
            </select>
            <p className="field-error" id={fields.kind.errorId}>{fields.kind.errors?.[0]}</p>
          </div>
          <div>
            <label className="field-label" htmlFor={fields.description.id}>Description</label>
            <input {...getInputProps(fields.description, { type: "text" })} key={fields.description.key} className="field-input" placeholder="e.g. bracket plate 10 mm" />
            <p className="field-error" id={fields.description.errorId}>{fields.description.errors?.[0]}</p>
          </div>
          <div>
            <label className="field-label" htmlFor={fields.specification.id}>Specification <span className="font-normal text-graphite-700">(optional)</span></label>
            <input {...getInputProps(fields.specification, { type: "text" })} key={fields.specification.key} className="field-input" placeholder="e.g. ASTM A36, AWS A5.18 ER70S-6" />
            <p className="field-error" id={fields.specification.errorId}>{fields.specification.errors?.[0]}</p>
          </div>
          <div>
            <label className="field-label" htmlFor={fields.heatNumber.id}>Heat or lot number</label>
            <input {...getInputProps(fields.heatNumber, { type: "text" })} key={fields.heatNumber.key} className="field-input figures" autoComplete="off" />
            <p className="field-error" id={fields.heatNumber.errorId}>{fields.heatNumber.errors?.[0]}</p>
          </div>
          <div className="sm:col-span-2">
            <label className="field-label" htmlFor={fields.certificate.id}>Certificate <span className="font-normal text-graphite-700">(optional: mill or test certificate reference)</span></label>
            <input {...getInputProps(fields.certificate, { type: "text" })} key={fields.certificate.key} className="field-input figures" autoComplete="off" />
            <p className="field-error" id={fields.certificate.errorId}>{fields.certificate.errors?.[0]}</p>
          </div>
        </div>
      )}
      {entry ? (
        <div>
          <label className="field-label" htmlFor={fields.reason.id}>{withdrawing ? "Why is it withdrawn?" : "Why is it corrected?"}</label>
          <textarea {...getTextareaProps(fields.reason)} key={fields.reason.key} className="field-input min-h-20" maxLength={1000} />
          <p className="field-error" id={fields.reason.errorId}>{fields.reason.errors?.[0]}</p>
        </div>
      ) : null}
      {fields.withdrawn.errors?.length ? <p className="field-error">{fields.withdrawn.errors[0]}</p> : null}
      <FormMessage errors={form.errors} testId="material-form" />
      <div className="flex flex-wrap gap-2 pt-1">
        <button type="button" className="btn btn-quiet" onClick={onCancel}>Cancel</button>
        <button type="submit" className={withdrawing ? "btn btn-danger" : "btn btn-primary"} disabled={busy}>
          {busy ? "Saving…" : mode.kind === "add" ? "Record the entry" : mode.kind === "correct" ? "Record the correction" : "Withdraw the entry"}
        </button>
      </div>
    </form>
  );
}
