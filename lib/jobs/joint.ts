// Where a weld joint stands: its rounds (the first welding, then one per repair after a rejection), each
// with its passes, the welder's sign-off and the inspection. Pure, so the server (which enforces it), the
// runner (which explains it) and the traveller agree.
import type { InspectionView, JointRound, JointState, JointView, NonconformanceView, PassView, SignOffView } from "./record";

export function jointView(args: {
  stepId: string;
  jointId: string;
  passes: readonly PassView[];
  signOffs: readonly SignOffView[];
  inspections: readonly InspectionView[];
  nonconformances: readonly NonconformanceView[];
}): JointView {
  const inspections = args.inspections.filter((i) => i.stepId === args.stepId).sort((a, b) => a.round - b.round);
  const last = inspections[inspections.length - 1];
  const accepted = last?.decision === "accepted";
  // After a rejection the next round opens; an accepted joint stays at its last round.
  const round = last ? (accepted ? last.round : last.round + 1) : 1;
  const live = args.passes.filter((p) => p.stepId === args.stepId && !p.removed);
  const performedOf = (r: number) =>
    args.signOffs.find((o) => o.stepId === args.stepId && o.meaning === "performed" && o.amendsSignOffId === null && (o.round ?? 1) === r) ?? null;
  const rounds: JointRound[] = [];
  for (let r = 1; r <= round; r++) {
    rounds.push({
      round: r,
      passes: args.passes.filter((p) => p.stepId === args.stepId && p.round === r),
      performed: performedOf(r),
      inspection: inspections.find((i) => i.round === r) ?? null,
    });
  }
  const current = rounds[rounds.length - 1]!;
  const state: JointState = accepted ? "accepted" : current.performed ? "awaiting_inspection" : round > 1 ? "repair" : "welding";
  const dispositioned = args.nonconformances.filter((n) => n.stepId === args.stepId && n.disposition !== null);
  const uncovered = live
    .filter((p) => p.round === round && p.outOfRange && !p.override)
    // A nonconformance raised after the pass and dispositioned covers it: its decision is on the record.
    .filter((p) => !dispositioned.some((n) => n.raisedAt >= p.recordedAt))
    .map((p) => ({ passNumber: p.passNumber, messages: p.findings.filter((f) => !f.ok).map((f) => f.message) }));
  return {
    jointId: args.jointId,
    state,
    round,
    rounds,
    // Struck-out passes count too: whoever put an arc on the joint does not inspect it.
    welderIds: [...new Set(args.passes.filter((p) => p.stepId === args.stepId).map((p) => p.welder.id))],
    uncovered,
  };
}

export const JOINT_STATE_LABELS: Record<JointState, string> = {
  welding: "Welding",
  awaiting_inspection: "Waiting for inspection",
  repair: "Repair",
  accepted: "Accepted",
};

/** Separation of duties for a joint: nobody inspects a weld they made any pass of, whatever roles they hold. */
export function inspectionSeparation(joint: JointView, inspectorId: string): string | null {
  return joint.welderIds.includes(inspectorId)
    ? `You recorded a pass of joint ${joint.jointId}, so another inspector must inspect it: nobody inspects their own weld.`
    : null;
}
