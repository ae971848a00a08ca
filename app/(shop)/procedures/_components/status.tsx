import { StatusBadge } from "@/components/status-badge";
import { VERSION_STATUS_LABELS, type VersionStatus } from "@/lib/procedures/labels";

const TONE = { draft: "info", published: "pass", retired: "idle" } as const;

export function VersionStatusBadge({ status, number, testId }: { status: VersionStatus; number?: number; testId?: string }) {
  return (
    <StatusBadge tone={TONE[status]} testId={testId}>
      {number !== undefined ? <span className="figures">v{number}</span> : null}
      {VERSION_STATUS_LABELS[status]}
    </StatusBadge>
  );
}
