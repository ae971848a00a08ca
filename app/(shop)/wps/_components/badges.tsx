import { StatusBadge } from "@/components/status-badge";
import { STATUS_LABELS, type WpsStatus } from "@/lib/welding/wps-schema";
import { CONTINUITY_STATUS_LABELS } from "@/lib/welding/qualification-schema";
import type { ContinuityStatus } from "@/lib/welding";

// Word and shape per state: published ● (in use), draft ◆ (being written), retired ○ (out of use).
const WPS_TONE = { published: "pass", draft: "info", retired: "idle" } as const;

export function WpsStatusBadge({ status, number, testId }: { status: WpsStatus; number?: number; testId?: string }) {
  return (
    <StatusBadge tone={WPS_TONE[status]} testId={testId}>
      {STATUS_LABELS[status]}
      {number !== undefined ? <span className="figures whitespace-nowrap font-normal">rev {number}</span> : null}
    </StatusBadge>
  );
}

// Current ●, lapsing ▲ with the days left, lapsed ✕ with the date it lapsed.
export function ContinuityBadge({ status, daysLeft, expiresOn, testId, compact }: { status: ContinuityStatus; daysLeft: number; expiresOn: string; testId?: string; compact?: boolean }) {
  if (compact) {
    const tone = status === "lapsed" ? "fail" : status === "lapsing" ? "warn" : "pass";
    return <StatusBadge tone={tone} testId={testId}>{CONTINUITY_STATUS_LABELS[status]}</StatusBadge>;
  }
  if (status === "lapsed") {
    return (
      <StatusBadge tone="fail" testId={testId}>
        {CONTINUITY_STATUS_LABELS.lapsed} <span className="figures whitespace-nowrap font-normal">on {expiresOn}</span>
      </StatusBadge>
    );
  }
  if (status === "lapsing") {
    return (
      <StatusBadge tone="warn" testId={testId}>
        {CONTINUITY_STATUS_LABELS.lapsing} <span className="figures whitespace-nowrap font-normal">in {daysLeft} day{daysLeft === 1 ? "" : "s"}</span>
      </StatusBadge>
    );
  }
  return (
    <StatusBadge tone="pass" testId={testId}>
      {CONTINUITY_STATUS_LABELS.current}
    </StatusBadge>
  );
}
