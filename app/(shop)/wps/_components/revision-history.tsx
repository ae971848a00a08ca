import Link from "next/link";
import type { RevisionSummary } from "@/db/queries/wps";
import { WpsStatusBadge } from "./badges";
import { day } from "./format";

export function RevisionHistory({ wpsId, revisions, shownNumber }: { wpsId: string; revisions: RevisionSummary[]; shownNumber: number }) {
  return (
    <section className="card p-4" aria-labelledby="history-h">
      <h2 id="history-h" className="font-bold">Revision history</h2>
      <ol className="mt-2 divide-y divide-graphite-100" data-testid="revision-history">
        {revisions.map((r) => (
          <li key={r.id} className="py-2" data-testid={`revision-${r.number}`}>
            <div className="flex flex-wrap items-center gap-2">
              <Link href={`/wps/${wpsId}/revisions/${r.number}`} className="figures font-semibold underline underline-offset-4" aria-current={r.number === shownNumber ? "page" : undefined}>
                Revision {r.number}
              </Link>
              <WpsStatusBadge status={r.status} />
            </div>
            <div className="mt-1 text-sm text-graphite-700">
              {r.status === "draft" ? (
                <>Started <span className="figures">{day(r.createdAt)}</span> by {r.authorName ?? "someone"}; last saved <span className="figures">{day(r.updatedAt)}</span>.</>
              ) : (
                <>Published <span className="figures">{day(r.publishedAt)}</span> by {r.publisherName ?? "someone"}.</>
              )}
            </div>
            {r.changeNote ? <p className="mt-1 text-sm">“{r.changeNote}”</p> : null}
            {r.status === "retired" ? (
              <p className="mt-1 text-sm text-graphite-700">
                Retired <span className="figures">{day(r.retiredAt)}</span> by {r.retiredByName ?? "someone"}: {r.retireNote}
              </p>
            ) : null}
          </li>
        ))}
      </ol>
    </section>
  );
}
