// A weld joint's state in words and tone, as the runner's header and step panels show it. Kept apart from
// the weld step's controls so that a step list can name the state without loading them.
import { JOINT_STATE_LABELS } from "@/lib/jobs/joint";
import type { JointView } from "@/lib/jobs/record";
import { Pill, type VerdictTone } from "./verdict";

const STATE_TONE: Record<JointView["state"], VerdictTone> = { welding: "idle", awaiting_inspection: "wait", repair: "fail", accepted: "pass" };

export function jointStateWord(joint: Pick<JointView, "state" | "round">): string {
  return joint.state === "repair" ? `Repair round ${joint.round}` : JOINT_STATE_LABELS[joint.state];
}

export function JointStatePill({ joint, testId }: { joint: Pick<JointView, "state" | "round">; testId?: string }) {
  return <Pill tone={STATE_TONE[joint.state]} testId={testId}>{jointStateWord(joint)}</Pill>;
}
