import Link from "next/link";
import { StatusBadge } from "@/components/status-badge";
import type { QualificationRow } from "@/db/queries/qualifications";
import type { WpsProcess } from "@/lib/welding/wps-schema";
import { CODE_LABELS } from "@/lib/welding/qualification-schema";
import type { ContinuityCode } from "@/lib/welding";
import { ContinuityBadge } from "./badges";

// Who may weld to this WPS today, and the warnings a lead acts on before assigning work.
export function QualifiedWelders({ process, rows, total, code }: { process: WpsProcess; rows: QualificationRow[]; total: number; code: ContinuityCode }) {
  const lapsing = rows.filter((r) => r.continuity.status === "lapsing");
  const lapsed = rows.filter((r) => r.continuity.status === "lapsed");
  const current = rows.filter((r) => r.continuity.status !== "lapsed");
  return (
    <section className="card p-4" aria-labelledby="qw-h" data-testid="qualification-warnings">
      <h2 id="qw-h" className="font-bold">Welders qualified for {process}</h2>
      <p className="mt-1 text-sm text-graphite-600">Continuity by {CODE_LABELS[code]}.</p>
      <div className="mt-2 flex flex-wrap gap-2">
        {current.length === 0 ? <StatusBadge tone="fail">No welder can weld {process} today</StatusBadge> : null}
        {lapsing.length ? <StatusBadge tone="warn">{lapsing.length} lapsing within 30 days</StatusBadge> : null}
        {lapsed.length ? <StatusBadge tone="fail">{lapsed.length} lapsed</StatusBadge> : null}
        {current.length && !lapsing.length && !lapsed.length ? <StatusBadge tone="pass">All current</StatusBadge> : null}
      </div>
      {rows.length === 0 ? (
        <p className="mt-2 text-graphite-600">Nobody in the shop holds a {process} qualification.</p>
      ) : (
        <ul className="mt-2 divide-y divide-graphite-100">
          {rows.map((r) => (
            <li key={r.id} className="flex flex-wrap items-center justify-between gap-2 py-2">
              <span>
                <Link href={`/qualifications/${r.id}`} className="font-semibold underline underline-offset-4">{r.welderName}</Link>
                <span className="figures block text-sm text-graphite-600">{r.positions.join(" ")}</span>
              </span>
              <ContinuityBadge status={r.continuity.status} daysLeft={r.continuity.daysLeft} expiresOn={r.continuity.expiresOn} />
            </li>
          ))}
        </ul>
      )}
      {total > rows.length ? (
        <p className="mt-2 text-sm">
          <Link href={`/qualifications?process=${process}`} className="underline">All {total} {process} qualifications</Link> (the soonest to lapse are shown here).
        </p>
      ) : null}
    </section>
  );
}
