// Short job lists for the role desks ("your jobs", "waiting for you"), linking to the runner or the job.
import Link from "next/link";
import { StatusBadge } from "@/components/status-badge";
import type { DeskJob } from "@/db/queries/jobs";
import { DUE_CUE_LABELS, dueCue, todayIso } from "@/lib/jobs/due";
import { JOB_STATE_LABELS } from "@/lib/jobs/labels";

export function DeskJobList<J extends DeskJob>({ jobs, empty, href, extra, testId }: { jobs: J[]; empty: string; href: (j: J) => string; extra?: (j: J) => React.ReactNode; testId: string }) {
  const today = todayIso();
  const cue = (j: J) => dueCue(j.dueDate, today, j.status);
  if (!jobs.length) return <p className="mt-2 text-graphite-700" data-testid={testId}>{empty}</p>;
  return (
    <ul className="mt-2 divide-y divide-graphite-100" data-testid={testId}>
      {jobs.map((j) => (
        <li key={j.id} className="py-2">
          <Link href={href(j)} className="flex min-h-12 flex-wrap items-center justify-between gap-2 rounded-md px-1 hover:bg-graphite-50">
            <span>
              <span className="figures font-bold">{j.number}</span> · {j.customerName}
              <span className="block text-sm text-graphite-700">{j.vehicle} · axle {j.axleTag}{j.dueDate ? ` · due ${j.dueDate}` : ""}</span>
              {cue(j) ? <span className="block text-sm font-semibold" data-testid="due-cue">{DUE_CUE_LABELS[cue(j)!]}</span> : null}
              {extra ? <span className="block text-sm font-semibold">{extra(j)}</span> : null}
            </span>
            <span className="flex items-center gap-2">
              <span className="figures text-sm">{j.stepsSigned}/{j.stepsTotal}</span>
              <StatusBadge tone={JOB_STATE_LABELS[j.status].tone}>{JOB_STATE_LABELS[j.status].label}</StatusBadge>
            </span>
          </Link>
        </li>
      ))}
    </ul>
  );
}
