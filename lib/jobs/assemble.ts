// Turns the rows of one job into its record: locks, effective values, readiness and, for the person
// asking, whether they may sign each step. Pure, so the API, the pages and the tests agree.
import type { Step } from "@/lib/procedures/schema";
import type { JobStateName } from "./labels";
import { stepReadiness, type StepNc } from "./readiness";
import type { JobHeader, JobRecord, NonconformanceView, PassView, PhotoView, SignOffView, StepView } from "./record";
import { meaningOf, signingRole } from "./roles";
import { holdLocks, holdSeparation, priorWorkFrom, releaseBlockers, unsignedBefore, type ChecklistStep } from "./state";

export type StepRow = {
  id: string;
  position: number;
  sectionKey: string;
  sectionTitle: string;
  sectionPosition: number;
  stepKey: string;
  kind: Step["kind"];
  title: string;
  spec: Step;
  value: Record<string, unknown> | null;
  version: number;
  updatedAt: string | null;
  updatedBy: { id: string; name: string } | null;
  signedAt: string | null;
};

export type Viewer = { userId: string; name: string; roles: string[]; unitSystem: "metric" | "imperial" };

export type JobParts = {
  header: Omit<JobHeader, "stepsTotal" | "stepsSigned" | "openNonconformances"> & { status: JobStateName };
  steps: StepRow[];
  signOffs: SignOffView[];
  photos: PhotoView[];
  passes: PassView[];
  nonconformances: NonconformanceView[];
};

/** The sign-offs of a step in order, and the one that counts now (the end of its amendment chain). */
export function stepSignOffs(signOffs: readonly SignOffView[], stepId: string): { all: SignOffView[]; latest: SignOffView | null } {
  const all = signOffs.filter((s) => s.stepId === stepId).sort((a, b) => (a.signedAt < b.signedAt ? -1 : a.signedAt > b.signedAt ? 1 : a.id < b.id ? -1 : 1));
  const amended = new Set(all.map((s) => s.amendsSignOffId).filter(Boolean));
  const heads = all.filter((s) => !amended.has(s.id));
  return { all, latest: heads[heads.length - 1] ?? null };
}

export function assembleRecord(parts: JobParts, viewer: Viewer): JobRecord {
  const checklist: ChecklistStep[] = parts.steps.map((s) => ({
    id: s.id,
    key: s.stepKey,
    title: s.title,
    kind: s.kind,
    position: s.position,
    sectionKey: s.sectionKey,
    signed: s.signedAt !== null,
  }));
  const locks = holdLocks(checklist);
  const prior = priorWorkFrom(parts.steps, parts.signOffs, parts.passes);
  const openNcs = parts.nonconformances.filter((n) => n.disposition === null).length;

  const steps: StepView[] = parts.steps.map((s, i) => {
    const { all, latest } = stepSignOffs(parts.signOffs, s.id);
    const photoIds = parts.photos.filter((p) => p.stepId === s.id && !p.removed).map((p) => p.id);
    const passes = parts.passes.filter((p) => p.stepId === s.id && !p.removed);
    const ncs: StepNc[] = parts.nonconformances
      .filter((n) => n.stepId === s.id)
      .map((n) => ({ number: n.number, disposition: n.disposition?.disposition ?? null, observed: n.observed }));
    const effectiveValue = latest?.value ?? s.value;
    const readiness = stepReadiness({ spec: s.spec, value: effectiveValue, photoCount: photoIds.length, passes, ncs });
    const lock = locks.get(s.id) ?? null;
    let signBlock: string | null = null;
    const role = signingRole(s.spec, viewer.roles);
    if ("refuse" in role) signBlock = role.refuse;
    else if (s.kind === "hold") {
      const waiting = unsignedBefore(checklist, s);
      if (waiting.length) signBlock = `${waiting.length} ${waiting.length === 1 ? "step" : "steps"} before this hold point ${waiting.length === 1 ? "is" : "are"} not signed yet.`;
      else {
        const earlierOpen = parts.nonconformances.filter((n) => n.disposition === null && (parts.steps.find((x) => x.id === n.stepId)?.position ?? 0) < s.position);
        if (earlierOpen.length) signBlock = `NC-${earlierOpen[0]!.number} before this hold point is still open.`;
        else signBlock = holdSeparation({ signerId: viewer.userId, hold: s, prior });
      }
    }
    return {
      id: s.id,
      position: s.position,
      sectionKey: s.sectionKey,
      sectionTitle: s.sectionTitle,
      sectionPosition: s.sectionPosition,
      key: s.stepKey,
      kind: s.kind,
      title: s.title,
      spec: s.spec,
      value: s.value,
      version: s.version,
      updatedAt: s.updatedAt,
      updatedBy: s.updatedBy,
      signed: checklist[i]!.signed,
      signedAt: s.signedAt,
      lockedBy: lock ? { id: lock.id, title: lock.title } : null,
      effectiveValue,
      signOffs: all,
      photoIds,
      readiness,
      signBlock,
      meaning: meaningOf(s.spec),
    };
  });

  const holdSigners = parts.signOffs
    .filter((o) => o.meaning === "inspected" && o.amendsSignOffId === null && parts.steps.some((s) => s.id === o.stepId && s.kind === "hold"))
    .map((o) => ({ stepId: o.stepId!, userId: o.userId }));
  const header: JobHeader = {
    ...parts.header,
    stepsTotal: steps.length,
    stepsSigned: steps.filter((s) => s.signed).length,
    openNonconformances: openNcs,
  };
  return {
    job: header,
    steps,
    photos: parts.photos,
    passes: parts.passes,
    nonconformances: parts.nonconformances,
    releaseSignOff: parts.signOffs.find((o) => o.meaning === "released") ?? null,
    releaseBlockers: releaseBlockers({ status: header.status, steps: checklist, openNonconformances: openNcs, releaserId: viewer.userId, holdSigners }),
    viewer,
  };
}
