// The job's state follows from what has happened on its checklist; nobody sets it by hand except release
// and void. Hold points lock every step after them until an inspector signs them.
import type { StepKind } from "@/lib/procedures/schema";
import type { JobStateName } from "./labels";

export type ChecklistStep = { id: string; key: string; title: string; kind: StepKind; position: number; sectionKey: string; signed: boolean };

/** For every step: the first unsigned hold point before it, which keeps it locked; null when free. */
export function holdLocks<S extends ChecklistStep>(steps: readonly S[]): Map<string, S | null> {
  const ordered = [...steps].sort((a, b) => a.position - b.position);
  const locks = new Map<string, S | null>();
  let blocking: S | null = null;
  for (const s of ordered) {
    locks.set(s.id, blocking);
    if (!blocking && s.kind === "hold" && !s.signed) blocking = s;
  }
  return locks;
}

/** The hold point the job is waiting at: the first unsigned step is a hold whose every predecessor is signed. */
export function waitingHold<S extends ChecklistStep>(steps: readonly S[]): S | null {
  const first = [...steps].sort((a, b) => a.position - b.position).find((s) => !s.signed);
  return first && first.kind === "hold" ? first : null;
}

/**
 * `workRecorded`: weld work is on the record though no step counts as done yet (a pass, a signed round waiting
 * for inspection, a rejected round in repair): the job has started.
 */
export function deriveJobState(input: { status: JobStateName; steps: readonly ChecklistStep[]; openNonconformances: number; workRecorded?: boolean }): JobStateName {
  const { status, steps, openNonconformances } = input;
  if (status === "released" || status === "void") return status;
  const signed = steps.filter((s) => s.signed).length;
  if (openNonconformances > 0) return "on_hold";
  if (steps.length > 0 && signed === steps.length) return "ready_for_release";
  if (waitingHold(steps)) return "on_hold";
  return signed > 0 || input.workRecorded ? "in_progress" : "planned";
}

/** Steps before a hold point that are still unsigned: an inspector signs a hold only after all of them. */
export function unsignedBefore<S extends ChecklistStep>(steps: readonly S[], hold: { position: number }): S[] {
  return steps.filter((s) => s.position < hold.position && !s.signed).sort((a, b) => a.position - b.position);
}

export type PriorWork = { sectionKey: string; position: number; performedBy: readonly string[]; passWelders: readonly string[] };

/** Who performed and who welded each step, from a job's sign-offs and (not struck out) weld passes. */
export function priorWorkFrom(
  steps: readonly { id: string; sectionKey: string; position: number }[],
  signOffs: readonly { stepId: string | null; meaning: string; userId: string }[],
  passes: readonly { stepId: string; removed: boolean; welder: { id: string } }[],
): PriorWork[] {
  return steps.map((s) => ({
    sectionKey: s.sectionKey,
    position: s.position,
    performedBy: signOffs.filter((o) => o.stepId === s.id && o.meaning === "performed").map((o) => o.userId),
    passWelders: passes.filter((p) => p.stepId === s.id && !p.removed).map((p) => p.welder.id),
  }));
}

/**
 * Separation of duties at a hold point: nobody inspects what they made. The inspector must have signed
 * none of the preceding steps of the hold's section and recorded no weld pass anywhere before it.
 * Returns the refusal, or null when the person may sign.
 */
export function holdSeparation(args: { signerId: string; hold: { sectionKey: string; position: number }; prior: readonly PriorWork[] }): string | null {
  const before = args.prior.filter((p) => p.position < args.hold.position);
  if (before.some((p) => p.passWelders.includes(args.signerId))) {
    return "You recorded a weld pass before this hold point, so another inspector must sign it: nobody inspects their own weld.";
  }
  if (before.some((p) => p.sectionKey === args.hold.sectionKey && p.performedBy.includes(args.signerId))) {
    return "You signed work in this section before the hold point, so another inspector must sign it: nobody inspects their own work.";
  }
  return null;
}

/** Why a job cannot be released by this person yet (empty when it can). */
export function releaseBlockers(args: {
  status: JobStateName;
  steps: readonly ChecklistStep[];
  openNonconformances: number;
  releaserId: string;
  holdSigners: readonly { stepId: string; userId: string }[];
}): string[] {
  const out: string[] = [];
  if (args.status === "released") return ["This job is already released."];
  if (args.status === "void") return ["A void job cannot be released."];
  const unsigned = args.steps.filter((s) => !s.signed).length;
  if (unsigned > 0) out.push(`${unsigned} ${unsigned === 1 ? "step is" : "steps are"} not signed yet.`);
  if (args.openNonconformances > 0) out.push(`${args.openNonconformances} ${args.openNonconformances === 1 ? "nonconformance is" : "nonconformances are"} still open.`);
  const holds = args.steps.filter((s) => s.kind === "hold");
  if (holds.length > 0 && args.holdSigners.length > 0 && args.holdSigners.every((h) => h.userId === args.releaserId)) {
    out.push("You signed every hold point of this job yourself, so another lead must release it.");
  }
  return out;
}
