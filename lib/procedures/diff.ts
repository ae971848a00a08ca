// Side-by-side comparison of two versions: steps matched by their stable key, changed field by field.
import { fieldLabel, FIELD_LABELS, HAZARD_LABELS, KIND_LABELS, QUANTITY_SYMBOLS, SIGNER_LABELS } from "./labels";
import type { Step, VersionContent } from "./schema";

export type DiffSide = { number: number; title: string; scope: string; code: string; content: VersionContent };
export type FieldChange = { field: string; label: string; before: string; after: string };
export type Move = { kind: "section"; fromSection: string } | { kind: "order" };

export type StepRow =
  | { type: "added"; key: string; after: Step }
  | { type: "removed"; key: string; before: Step }
  | { type: "changed"; key: string; before: Step; after: Step; changes: FieldChange[]; moved: Move | null }
  | { type: "same"; key: string; before: Step; after: Step; moved: Move | null };

type SectionBlock = {
  key: string;
  status: "added" | "removed" | "renamed" | "same";
  beforeTitle: string | null;
  afterTitle: string | null;
  rows: StepRow[];
};

export type VersionDiff = {
  from: number;
  to: number;
  meta: FieldChange[];
  sections: SectionBlock[];
  summary: { added: number; removed: number; changed: number; moved: number; unchanged: number };
};

const ORDER = Object.keys(FIELD_LABELS);

function flatten(value: unknown, prefix = "", out: Record<string, unknown> = {}): Record<string, unknown> {
  if (value && typeof value === "object" && !Array.isArray(value)) {
    for (const [k, v] of Object.entries(value)) flatten(v, prefix ? `${prefix}.${k}` : k, out);
  } else {
    out[prefix] = value;
  }
  return out;
}

function displayValue(field: string, value: unknown): string {
  if (value === undefined || value === null || value === "") return "—";
  if (typeof value === "boolean") return value ? "Yes" : "No";
  if (field === "kind" && typeof value === "string") return KIND_LABELS[value as keyof typeof KIND_LABELS] ?? value;
  if (field === "signedBy" && typeof value === "string") return SIGNER_LABELS[value as keyof typeof SIGNER_LABELS] ?? value;
  if (field === "hazards" && Array.isArray(value)) return value.map((h) => HAZARD_LABELS[h as keyof typeof HAZARD_LABELS] ?? String(h)).join(", ");
  if (Array.isArray(value)) return value.map(String).join(", ");
  return String(value);
}

function rank(field: string): number {
  const i = ORDER.indexOf(field);
  return i === -1 ? ORDER.length : i;
}

const MEASURE_FIGURES = new Set(["nominal", "tolerance.plus", "tolerance.minus", "tolerance.min", "tolerance.max"]);

// A measure's figures read with their unit ("2 mm", "1°").
function withUnit(step: Step, field: string, text: string): string {
  if (step.kind !== "measure" || !MEASURE_FIGURES.has(field) || text === "—") return text;
  const unit = QUANTITY_SYMBOLS[step.quantity];
  return unit === "°" ? `${text}°` : `${text} ${unit}`;
}

function stepChanges(before: Step, after: Step): FieldChange[] {
  const a = flatten(before);
  const b = flatten(after);
  const fields = [...new Set([...Object.keys(a), ...Object.keys(b)])].sort((x, y) => rank(x) - rank(y) || x.localeCompare(y));
  const changes: FieldChange[] = [];
  for (const field of fields) {
    const rawBefore = JSON.stringify(a[field] ?? null);
    const rawAfter = JSON.stringify(b[field] ?? null);
    if (rawBefore === rawAfter) continue;
    let left = withUnit(before, field, displayValue(field, a[field]));
    let right = withUnit(after, field, displayValue(field, b[field]));
    if (left === right) [left, right] = [rawBefore, rawAfter];
    changes.push({ field, label: fieldLabel(field), before: left, after: right });
  }
  return changes;
}

// Keys of the longest run of steps kept in the same relative order: the others count as moved.
function longestKeptOrder(keys: string[], indexInBefore: Map<string, number>): Set<string> {
  const seq = keys.map((k) => indexInBefore.get(k)!);
  const tails: number[] = [];
  const tailIdx: number[] = [];
  const prev: number[] = new Array(seq.length).fill(-1);
  seq.forEach((v, i) => {
    let lo = 0;
    let hi = tails.length;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (tails[mid]! < v) lo = mid + 1;
      else hi = mid;
    }
    tails[lo] = v;
    tailIdx[lo] = i;
    prev[i] = lo > 0 ? tailIdx[lo - 1]! : -1;
  });
  const kept = new Set<string>();
  let i = tailIdx[tails.length - 1] ?? -1;
  while (i !== -1) {
    kept.add(keys[i]!);
    i = prev[i]!;
  }
  return kept;
}

export function diffVersions(before: DiffSide, after: DiffSide): VersionDiff {
  const meta: FieldChange[] = [];
  for (const field of ["title", "scope", "code"] as const) {
    if (before[field] !== after[field]) meta.push({ field, label: fieldLabel(field), before: displayValue(field, before[field]), after: displayValue(field, after[field]) });
  }

  const beforeStep = new Map<string, { step: Step; section: string; index: number }>();
  const afterStep = new Map<string, { step: Step; section: string; index: number }>();
  let n = 0;
  for (const s of before.content.sections) for (const step of s.steps) beforeStep.set(step.key, { step, section: s.key, index: n++ });
  n = 0;
  for (const s of after.content.sections) for (const step of s.steps) afterStep.set(step.key, { step, section: s.key, index: n++ });

  const common = [...afterStep.keys()].filter((k) => beforeStep.has(k));
  const kept = longestKeptOrder(
    common,
    new Map(common.map((k) => [k, beforeStep.get(k)!.index])),
  );
  const beforeSectionTitle = new Map(before.content.sections.map((s) => [s.key, s.title]));
  const afterSectionTitle = new Map(after.content.sections.map((s) => [s.key, s.title]));

  // Section order: the newer version's, with removed sections kept where they stood.
  const order: string[] = after.content.sections.map((s) => s.key);
  let anchor = -1;
  for (const s of before.content.sections) {
    const at = order.indexOf(s.key);
    if (at !== -1) anchor = at;
    else {
      order.splice(anchor + 1, 0, s.key);
      anchor += 1;
    }
  }

  const summary = { added: 0, removed: 0, changed: 0, moved: 0, unchanged: 0 };
  const sections: SectionBlock[] = order.map((key) => {
    const beforeSection = before.content.sections.find((s) => s.key === key);
    const afterSection = after.content.sections.find((s) => s.key === key);
    const rows: StepRow[] = (afterSection?.steps ?? []).map((step) => {
      const old = beforeStep.get(step.key);
      if (!old) {
        summary.added += 1;
        return { type: "added", key: step.key, after: step };
      }
      const moved: Move | null =
        old.section !== key
          ? { kind: "section", fromSection: beforeSectionTitle.get(old.section) ?? old.section }
          : kept.has(step.key)
            ? null
            : { kind: "order" };
      if (moved) summary.moved += 1;
      const changes = stepChanges(old.step, step);
      if (changes.length) {
        summary.changed += 1;
        return { type: "changed", key: step.key, before: old.step, after: step, changes, moved };
      }
      if (!moved) summary.unchanged += 1;
      return { type: "same", key: step.key, before: old.step, after: step, moved };
    });
    let at = -1;
    for (const step of beforeSection?.steps ?? []) {
      const idx = rows.findIndex((r) => r.key === step.key);
      if (idx !== -1) at = idx;
      else if (!afterStep.has(step.key)) {
        rows.splice(at + 1, 0, { type: "removed", key: step.key, before: step });
        at += 1;
        summary.removed += 1;
      }
    }
    const status: SectionBlock["status"] = !beforeSection ? "added" : !afterSection ? "removed" : beforeSection.title !== afterSection.title ? "renamed" : "same";
    return { key, status, beforeTitle: beforeSectionTitle.get(key) ?? null, afterTitle: afterSectionTitle.get(key) ?? null, rows };
  });

  return { from: before.number, to: after.number, meta, sections, summary };
}

export function diffIsEmpty(d: VersionDiff): boolean {
  return d.meta.length === 0 && d.summary.added + d.summary.removed + d.summary.changed + d.summary.moved === 0 && d.sections.every((s) => s.status === "same");
}
