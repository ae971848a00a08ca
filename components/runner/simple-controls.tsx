"use client";
// Controls of the check, caution and note-only steps: big toggles, one tap each, nothing to hold or drag.
import { HAZARD_LABELS } from "@/lib/procedures/labels";
import type { Step } from "@/lib/procedures/schema";
import { HAZARD_CONFIRMATIONS } from "@/lib/jobs/labels";
import type { CautionValue, CheckValue } from "@/lib/jobs/values";

type Caution = Extract<Step, { kind: "caution" }>;

export function CheckControl({ value, readOnly, onChange }: { value: CheckValue; readOnly: boolean; onChange: (v: CheckValue) => void }) {
  const on = value.confirmed === true;
  return (
    <button
      type="button"
      aria-pressed={on}
      disabled={readOnly}
      onClick={() => onChange({ ...value, confirmed: !on })}
      data-testid="check-confirm"
      className={`flex min-h-20 w-full items-center gap-4 rounded-xl border-4 px-5 text-left text-xl font-bold ${on ? "border-[#2f4a08] bg-[#eef5d6] text-[#1f3305]" : "border-graphite-700 bg-white text-graphite-950"}`}
    >
      <span aria-hidden="true" className={`flex h-10 w-10 shrink-0 items-center justify-center rounded-md border-4 text-2xl ${on ? "border-[#2f4a08] bg-[#2f4a08] text-white" : "border-graphite-700"}`}>{on ? "✓" : ""}</span>
      {on ? "Done as described" : "Tap when done as described"}
    </button>
  );
}

export function CautionControl({ spec, value, readOnly, onChange }: { spec: Caution; value: CautionValue; readOnly: boolean; onChange: (v: CautionValue) => void }) {
  const acked = new Set(value.acknowledged ?? []);
  const toggle = (h: (typeof spec.hazards)[number]) => {
    const next = new Set(acked);
    if (next.has(h)) next.delete(h);
    else next.add(h);
    onChange({ ...value, acknowledged: spec.hazards.filter((x) => next.has(x)) });
  };
  return (
    <div className="space-y-3">
      <ul className="space-y-2" aria-label="Hazards to acknowledge">
        {spec.hazards.map((h) => {
          const on = acked.has(h);
          return (
            <li key={h}>
              <button
                type="button"
                aria-pressed={on}
                disabled={readOnly}
                onClick={() => toggle(h)}
                data-testid={`hazard-${h}`}
                className={`flex min-h-16 w-full items-center gap-4 rounded-lg border-4 px-4 text-left ${on ? "border-graphite-950 bg-primer-100" : "border-graphite-700 bg-white"}`}
              >
                <span aria-hidden="true" className={`flex h-9 w-9 shrink-0 items-center justify-center rounded border-4 text-xl font-bold ${on ? "border-graphite-950 bg-graphite-950 text-primer-300" : "border-graphite-700"}`}>{on ? "✓" : ""}</span>
                <span>
                  <span className="block text-lg font-bold text-graphite-950">{HAZARD_LABELS[h]}</span>
                  <span className="block text-graphite-900">{HAZARD_CONFIRMATIONS[h]}</span>
                </span>
              </button>
            </li>
          );
        })}
      </ul>
      <p className="rounded-lg border-2 border-graphite-950 bg-white px-4 py-3 text-lg font-semibold text-graphite-950">
        <span aria-hidden="true">△ </span>
        {spec.acknowledgement}
      </p>
    </div>
  );
}

export function NoteControl({ value, readOnly, onChange, label = "Note (optional)" }: { value: { note?: string }; readOnly: boolean; onChange: (v: { note?: string }) => void; label?: string }) {
  return (
    <div>
      <label htmlFor="step-note" className="field-label">{label}</label>
      <textarea
        id="step-note"
        className="field-input min-h-24 text-lg"
        value={value.note ?? ""}
        readOnly={readOnly}
        maxLength={2000}
        onChange={(e) => onChange({ ...value, note: e.target.value || undefined })}
      />
    </div>
  );
}
