// Weld joints whose round is signed by its welder and waits for visual inspection, oldest first. Each row
// opens the runner on the joint's step (the runner's ?step= takes the step key).
import Link from "next/link";
import { StatusBadge } from "@/components/status-badge";
import type { WaitingJoint } from "@/db/queries/jobs-welds";

const utc = (iso: string) => `${iso.slice(0, 16).replace("T", " ")} UTC`;

function runHref(j: Pick<WaitingJoint, "jobId" | "stepKey">) {
  return `/run/${j.jobId}?step=${encodeURIComponent(j.stepKey)}`;
}

export function WaitingJoints({ joints, empty, testId = "welds-waiting" }: { joints: WaitingJoint[]; empty: string; testId?: string }) {
  if (!joints.length) return <p className="mt-2 text-graphite-700" data-testid={testId}>{empty}</p>;
  return (
    <ul className="mt-2 divide-y divide-graphite-100" data-testid={testId}>
      {joints.map((j) => (
        <li key={`${j.stepId}:${j.round}`} className="py-2" data-testid="weld-waiting">
          <Link href={runHref(j)} className="flex min-h-12 flex-wrap items-center justify-between gap-2 rounded-md px-1 hover:bg-graphite-50">
            <span className="min-w-0">
              <span className="font-bold">{j.jointId}</span> · <span className="figures font-bold">{j.jobNumber}</span> · axle <span className="figures">{j.axleTag}</span>
              <span className="block text-sm text-graphite-700">
                {j.stepTitle} · welded by {j.welderName} · ready <time className="figures" dateTime={j.readyAt}>{utc(j.readyAt)}</time>
                {j.mine ? " · assigned to you" : ""}
              </span>
              {j.outOfRangePasses > 0 ? (
                <span className="block text-sm font-semibold text-verdict-warn">
                  <span aria-hidden="true">▲ </span>
                  {j.outOfRangePasses} pass{j.outOfRangePasses === 1 ? "" : "es"} outside the WPS, accepted by a lead or a nonconformance
                </span>
              ) : null}
              {j.ownWeld ? (
                <span className="block text-sm font-semibold text-verdict-fail" data-testid="own-weld">
                  <span aria-hidden="true">✕ </span>You welded this: another inspector inspects it
                </span>
              ) : null}
            </span>
            <StatusBadge tone={j.round > 1 ? "fail" : "warn"}>{j.round > 1 ? `Repair round ${j.round}` : "Round 1"}</StatusBadge>
          </Link>
        </li>
      ))}
    </ul>
  );
}
