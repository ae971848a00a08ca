// Pure edits of a draft's content. Each returns a new content value; the caller validates the whole
// version with versionContentSchema before saving, so an edit can never leave a draft unreadable.
import { AppError } from "@/lib/errors";
import type { Step, StepKind, VersionContent } from "./schema";

type Section = VersionContent["sections"][number];

function clone(content: VersionContent): VersionContent {
  return structuredClone(content);
}

export function locateStep(content: VersionContent, key: string): { si: number; ti: number } | null {
  for (let si = 0; si < content.sections.length; si++) {
    const ti = content.sections[si]!.steps.findIndex((s) => s.key === key);
    if (ti !== -1) return { si, ti };
  }
  return null;
}

function mustLocate(content: VersionContent, key: string) {
  const at = locateStep(content, key);
  if (!at) throw new AppError("not_found", `Step "${key}" is not in this draft (someone may have removed it).`);
  return at;
}

function sectionIndex(content: VersionContent, key: string) {
  const i = content.sections.findIndex((s) => s.key === key);
  if (i === -1) throw new AppError("not_found", `Section "${key}" is not in this draft (someone may have removed it).`);
  return i;
}

function allKeys(content: VersionContent): Set<string> {
  const keys = new Set<string>();
  for (const s of content.sections) {
    keys.add(s.key);
    for (const t of s.steps) keys.add(t.key);
  }
  return keys;
}

export function slugKey(text: string, fallback = "step"): string {
  const slug = text
    .toLowerCase()
    .normalize("NFKD")
    .replace(/[^a-z0-9]+/g, "-")
    .replace(/^-+|-+$/g, "")
    .slice(0, 40)
    .replace(/-+$/, "");
  return slug || fallback;
}

export function uniqueKey(content: VersionContent, base: string): string {
  const taken = allKeys(content);
  const stem = slugKey(base).slice(0, 56);
  if (!taken.has(stem)) return stem;
  for (let i = 2; ; i++) {
    const candidate = `${stem}-${i}`;
    if (!taken.has(candidate)) return candidate;
  }
}

export function nextJointId(content: VersionContent): string {
  let max = 0;
  for (const s of content.sections) for (const t of s.steps) if (t.kind === "weld") max = Math.max(max, Number(t.jointId.slice(1)) || 0);
  return `W${max + 1}`;
}

// Replaces the step saved under `originalKey`, or inserts a new one into `sectionKey` (at `position`, else at the end).
// The editor owns step keys: jobs, diffs and the next version find a step by its key, so a saved step keeps the
// one it has whatever its title becomes, and a new step gets one made from its title, unique in the version.
// A key in `step` is never used. Returns the content and the key the step was saved under.
export function upsertStep(content: VersionContent, args: { sectionKey: string; originalKey?: string; step: Step; position?: number }): { content: VersionContent; key: string } {
  const next = clone(content);
  if (args.originalKey) {
    const { si, ti } = mustLocate(next, args.originalKey);
    next.sections[si]!.steps[ti] = { ...args.step, key: args.originalKey };
    return { content: next, key: args.originalKey };
  }
  const si = sectionIndex(next, args.sectionKey);
  const steps = next.sections[si]!.steps;
  const key = uniqueKey(next, args.step.title || args.step.kind);
  const at = args.position === undefined ? steps.length : Math.max(0, Math.min(steps.length, args.position));
  steps.splice(at, 0, { ...args.step, key });
  return { content: next, key };
}

// Up from the first step of a section goes to the end of the one before; down from the last, to the start of the next.
export function moveStep(content: VersionContent, key: string, direction: "up" | "down"): VersionContent {
  const next = clone(content);
  const { si, ti } = mustLocate(next, key);
  const steps = next.sections[si]!.steps;
  const [step] = steps.splice(ti, 1);
  if (direction === "up") {
    if (ti > 0) steps.splice(ti - 1, 0, step!);
    else if (si > 0) next.sections[si - 1]!.steps.push(step!);
    else steps.splice(0, 0, step!);
  } else if (ti < steps.length) steps.splice(ti + 1, 0, step!);
  else if (si < next.sections.length - 1) next.sections[si + 1]!.steps.unshift(step!);
  else steps.push(step!);
  return next;
}

export function duplicateStep(content: VersionContent, key: string): { content: VersionContent; key: string } {
  const next = clone(content);
  const { si, ti } = mustLocate(next, key);
  const original = next.sections[si]!.steps[ti]!;
  const copy = structuredClone(original) as Step;
  copy.key = uniqueKey(next, `${original.key}-copy`);
  copy.title = `${original.title} (copy)`.slice(0, 200);
  if (copy.kind === "weld") copy.jointId = nextJointId(next);
  next.sections[si]!.steps.splice(ti + 1, 0, copy);
  return { content: next, key: copy.key };
}

export function deleteStep(content: VersionContent, key: string): VersionContent {
  const next = clone(content);
  const { si, ti } = mustLocate(next, key);
  next.sections[si]!.steps.splice(ti, 1);
  return next;
}

export function addSection(content: VersionContent, title: string): { content: VersionContent; key: string } {
  const next = clone(content);
  const key = uniqueKey(next, title || "section");
  next.sections.push({ key, title, steps: [] } satisfies Section);
  return { content: next, key };
}

export function renameSection(content: VersionContent, key: string, title: string): VersionContent {
  const next = clone(content);
  next.sections[sectionIndex(next, key)]!.title = title;
  return next;
}

export function moveSection(content: VersionContent, key: string, direction: "up" | "down"): VersionContent {
  const next = clone(content);
  const i = sectionIndex(next, key);
  const j = direction === "up" ? i - 1 : i + 1;
  if (j < 0 || j >= next.sections.length) return next;
  [next.sections[i], next.sections[j]] = [next.sections[j]!, next.sections[i]!];
  return next;
}

export function deleteSection(content: VersionContent, key: string): VersionContent {
  const next = clone(content);
  next.sections.splice(sectionIndex(next, key), 1);
  return next;
}

// What the new-step form starts from: choices preset to what a lead most often writes, figures left empty.
type StepDraft = { kind: StepKind; key: string } & Record<string, unknown>;

export function blankStep(kind: StepKind, content: VersionContent): StepDraft {
  const base = { key: uniqueKey(content, `new-${kind}`), title: "", instructions: "", signedBy: "welder" as const, photos: { required: false, min: 0 } };
  switch (kind) {
    case "check":
    case "photo":
      return kind === "photo" ? { ...base, kind, photos: { required: true, min: 1 } } : { ...base, kind };
    case "measure":
      return { ...base, kind, quantity: "length", tolerance: { type: "plusMinus" } };
    case "caution":
      return { ...base, kind, hazards: ["ppe"], acknowledgement: "" };
    case "weld":
      return {
        ...base,
        kind,
        jointId: nextJointId(content),
        jointType: "fillet",
        position: "2F",
        process: "GMAW",
        wpsRef: "",
        filler: "",
      };
    case "hold":
      return { ...base, kind, signedBy: "inspector", inspection: "" };
    case "torque":
      return { ...base, kind, fastener: "", torqueUnit: "N_m", tolerancePct: 10, pattern: "" };
    case "coating":
      return { ...base, kind, surfacePrep: "", product: "", dewPointMarginC: 3 };
    case "geometry":
      return { ...base, kind, capture: "both" };
  }
}
