// Turns the rows of one job into its record: locks, effective values, readiness and, for the person
// asking, whether they may sign each step. Pure, so the API, the pages and the tests agree.
import type { Step } from "@/lib/procedures/schema";
import type { JobStateName } from "./labels";
import { stepReadiness, type StepNc } from "./readiness";
import { inspectionSeparation, jointView } from "./joint";
import type { InspectionView, JobHeader, JobRecord, JointView, MaterialView, NonconformanceView, PassView, PhotoView, QualificationSummary, SignOffView, StepView, WeldMapView, WpsSummary } from "./record";
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
  inspections: InspectionView[];
  materials: MaterialView[];
  wps: WpsSummary[];
  qualifications: QualificationSummary[];
  weldMap?: WeldMapView | null;
};

/** Why the steps before a hold point keep it from being signed, in words ("" when none do). */
export function holdWaitingReason(waiting: readonly { kind: string; title: string }[], joints: ReadonlyMap<string, JointView>, ids: readonly string[]): string {
  if (!waiting.length) return "";
  const welds = ids.map((id) => joints.get(id)).filter((j): j is JointView => !!j);
  if (welds.length) {
    const names = welds.map((j) => j.jointId).join(", ");
    return `Every weld before a hold point is accepted first: ${names} ${welds.length === 1 ? "is" : "are"} not accepted yet.`;
  }
  return `A hold point is signed once the work before it is done: ${waiting.length} ${waiting.length === 1 ? "step is" : "steps are"} not signed yet (first: "${waiting[0]!.title}").`;
}

/** The sign-offs of a step in order, and the one that counts now (the end of its amendment chain). */
export function stepSignOffs(signOffs: readonly SignOffView[], stepId: string): { all: SignOffView[]; latest: SignOffView | null } {
  const all = signOffs.filter((s) => s.stepId === stepId).sort((a, b) => (a.signedAt < b.signedAt ? -1 : a.signedAt > b.signedAt ? 1 : a.id < b.id ? -1 : 1));
  const amended = new Set(all.map((s) => s.amendsSignOffId).filter(Boolean));
  const heads = all.filter((s) => !amended.has(s.id));
  return { all, latest: heads[heads.length - 1] ?? null };
}

export function assembleRecord(parts: JobParts, viewer: Viewer): JobRecord {
  const joints = new Map<string, JointView>();
  for (const s of parts.steps) {
    if (s.spec.kind !== "weld") continue;
    joints.set(s.id, jointView({ stepId: s.id, jointId: s.spec.jointId, passes: parts.passes, signOffs: parts.signOffs, inspections: parts.inspections, nonconformances: parts.nonconformances }));
  }
  // A weld step counts as done when its joint is accepted at inspection, not when its passes are signed.
  const checklist: ChecklistStep[] = parts.steps.map((s) => ({
    id: s.id,
    key: s.stepKey,
    title: s.title,
    kind: s.kind,
    position: s.position,
    sectionKey: s.sectionKey,
    signed: s.kind === "weld" ? joints.get(s.id)?.state === "accepted" : s.signedAt !== null,
  }));
  const locks = holdLocks(checklist);
  const prior = priorWorkFrom(parts.steps, parts.signOffs, parts.passes);
  const openNcs = parts.nonconformances.filter((n) => n.disposition === null).length;

  const steps: StepView[] = parts.steps.map((s, i) => {
    const { all, latest } = stepSignOffs(parts.signOffs, s.id);
    const photoIds = parts.photos.filter((p) => p.stepId === s.id && !p.removed).map((p) => p.id);
    const joint = joints.get(s.id) ?? null;
    const passes = parts.passes.filter((p) => p.stepId === s.id && !p.removed && (!joint || p.round === joint.round));
    const ncs: StepNc[] = parts.nonconformances
      .filter((n) => n.stepId === s.id)
      .map((n) => ({ number: n.number, disposition: n.disposition?.disposition ?? null, observed: n.observed }));
    const effectiveValue = latest?.value ?? s.value;
    const readiness = stepReadiness({ spec: s.spec, value: effectiveValue, photoCount: photoIds.length, passes, ncs, joint: joint ?? undefined });
    const lock = locks.get(s.id) ?? null;
    let signBlock: string | null = null;
    const role = signingRole(s.spec, viewer.roles);
    if ("refuse" in role) signBlock = role.refuse;
    else if (s.kind === "hold") {
      const waiting = unsignedBefore(checklist, s);
      if (waiting.length) signBlock = holdWaitingReason(waiting, joints, waiting.map((w) => w.id));
      else {
        const earlierOpen = parts.nonconformances.filter((n) => n.disposition === null && (parts.steps.find((x) => x.id === n.stepId)?.position ?? 0) < s.position);
        if (earlierOpen.length) signBlock = `NC-${earlierOpen[0]!.number} before this hold point is still open.`;
        else signBlock = holdSeparation({ signerId: viewer.userId, hold: s, prior });
      }
    }
    let inspectBlock: string | null = null;
    if (joint) {
      if (!viewer.roles.includes("inspector")) inspectBlock = "Only an inspector inspects welds.";
      else if (joint.state !== "awaiting_inspection") inspectBlock = joint.state === "accepted" ? "This joint is accepted." : `Round ${joint.round} is still being welded; it is inspected once its welder signs it.`;
      else inspectBlock = inspectionSeparation(joint, viewer.userId);
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
      joint,
      inspectBlock,
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
    weldMap: parts.weldMap ?? null,
    steps,
    photos: parts.photos,
    passes: parts.passes,
    nonconformances: parts.nonconformances,
    inspections: parts.inspections,
    materials: parts.materials,
    wps: parts.wps,
    qualifications: parts.qualifications,
    releaseSignOff: parts.signOffs.find((o) => o.meaning === "released") ?? null,
    releaseBlockers: releaseBlockers({ status: header.status, steps: checklist, openNonconformances: openNcs, releaserId: viewer.userId, holdSigners }),
    viewer,
  };
}
