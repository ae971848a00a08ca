import type { Metadata } from "next";
import Link from "next/link";
import { PageHeader } from "@/components/page-header";
import { StatusBadge } from "@/components/status-badge";
import { getProcedure, getVersion } from "@/db/queries/procedures";
import { requireShop } from "@/lib/auth/context";
import { publishReadiness } from "@/lib/procedures/checks";
import { diffVersions } from "@/lib/procedures/diff";
import { DiffSummary } from "../../../../_components/diff-view";
import { idOrNotFound, numberOrNotFound, orNotFound } from "../../../../_components/not-found";
import { ProcedureNote } from "../../../../_components/procedure-note";
import { PublishForm } from "../../../../_components/publish-form";

export const metadata: Metadata = { title: "Publish" };

export default async function PublishPage({ params }: { params: Promise<{ id: string; n: string }> }) {
  const ctx = await requireShop("procedure:write");
  const raw = await params;
  const id = idOrNotFound(raw.id);
  const number = numberOrNotFound(raw.n);
  const [v, p] = await Promise.all([orNotFound(getVersion(ctx.shopId, id, number)), orNotFound(getProcedure(ctx.shopId, id, { page: 1, pageSize: 1 }))]);
  const editHref = `/procedures/${id}/versions/${number}/edit`;
  if (v.status !== "draft") {
    return (
      <>
        <PageHeader title={`Version ${number} is already ${v.status}`} />
        <Link href={`/procedures/${id}/versions/${number}`} className="btn btn-primary">Read it</Link>
      </>
    );
  }
  const readiness = publishReadiness(v);
  const published = p.allVersions.find((x) => x.status === "published");
  const base = p.allVersions.find((x) => x.number < number && x.status !== "draft");
  const diff = base ? diffVersions(await getVersion(ctx.shopId, id, base.number), v) : null;
  return (
    <>
      <nav aria-label="Breadcrumb" className="mb-2 flex gap-2 text-sm">
        <Link href="/procedures" className="underline">Procedures</Link>
        <span aria-hidden="true">›</span>
        <Link href={`/procedures/${id}`} className="underline">{p.title}</Link>
        <span aria-hidden="true">›</span>
        <Link href={editHref} className="underline">Draft v{number}</Link>
      </nav>
      <PageHeader title={`Publish draft v${number}`} lead={v.title}>
        <Link href={editHref} className="btn btn-quiet">Back to the editor</Link>
      </PageHeader>
      <div className="grid gap-4 lg:grid-cols-[1fr_26rem]">
        <div className="space-y-4">
          <section className="card p-4" aria-labelledby="ready-h" data-testid="readiness">
            <h2 id="ready-h" className="font-bold">Before publishing</h2>
            {readiness.blockers.length === 0 ? (
              <p className="mt-2"><StatusBadge tone="pass">Nothing blocks publishing</StatusBadge></p>
            ) : (
              <ul className="mt-2 space-y-1">
                {readiness.blockers.map((b, i) => (
                  <li key={i}>
                    <StatusBadge tone="fail">Fix first</StatusBadge>{" "}
                    {b.stepKey ? <Link className="underline" href={`${editHref}?step=${encodeURIComponent(b.stepKey)}`}>{b.message}</Link> : b.message}
                  </li>
                ))}
              </ul>
            )}
            {readiness.warnings.length ? (
              <ul className="mt-3 space-y-1">
                {readiness.warnings.map((w, i) => (
                  <li key={i}><StatusBadge tone="warn">Check</StatusBadge> {w.message}</li>
                ))}
              </ul>
            ) : null}
          </section>
          <section className="card p-4" aria-labelledby="changes-h">
            <h2 id="changes-h" className="font-bold">{base ? `What changes against v${base.number}` : "First version"}</h2>
            {diff ? (
              <>
                <DiffSummary diff={diff} />
                <Link href={`/procedures/${id}/diff?from=${base!.number}&to=${number}`} className="btn btn-quiet mt-3">See the differences side by side</Link>
              </>
            ) : (
              <p className="mt-2 text-graphite-700">Nothing published before: every step is new.</p>
            )}
          </section>
        </div>
        <div className="space-y-4">
          <PublishForm procedureId={id} number={number} currentPublished={published?.number ?? null} blocked={readiness.blockers.length > 0} />
          <ProcedureNote />
        </div>
      </div>
    </>
  );
}
