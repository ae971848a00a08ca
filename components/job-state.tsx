import { StatusBadge, type Tone } from "./status-badge";

const STATES: Record<string, { label: string; tone: Tone }> = {
  planned: { label: "Planned", tone: "idle" },
  in_progress: { label: "In progress", tone: "info" },
  on_hold: { label: "On hold", tone: "warn" },
  ready_for_release: { label: "Ready for release", tone: "info" },
  released: { label: "Released", tone: "pass" },
  void: { label: "Void", tone: "fail" },
};

export function JobStateBadge({ status }: { status: string }) {
  const s = STATES[status] ?? { label: status, tone: "idle" as Tone };
  return <StatusBadge tone={s.tone} testId="job-state">{s.label}</StatusBadge>;
}
