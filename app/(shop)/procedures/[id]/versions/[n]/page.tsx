import type { Metadata } from "next";
import Link from "next/link";
import { PageHeader } from "@/components/page-header";
import { StatusBadge } from "@/components/status-badge";
import { getProcedure, getVersion } from "@/db/queries/procedures";
import { can } from "@/lib/authz";
import { requireShop } from "@/lib/auth/context";
import { Markdown } from "@/lib/procedures/markdown-view";
import { newVersionAction, retireAction } from "../../../actions";
import { ActionButton } from "../../../_components/action-button";
import { fmtDate } from "../../../_components/format";
import { idOrNotFound, numberOrNotFound, orNotFound } from "../../../_components/not-found";
import { ProcedureNote } from "../../../_components/procedure-note";
import { VersionStatusBadge } from "../../../_components/status";
import { VersionContentView } from "../../../_components/version-content";
import { WeldMapView } from "@/components/weld-map/weld-map-view";
import { weldJointIds } from "@/lib/procedures/schema";

export const metadata: Metadata = { title: "Procedure version" };

export default async function VersionPage({
  params,
  searchParams,
}: {
  params: Promise<{ id: string; n: string }>;
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const ctx = await requireShop("procedure:read");
  const raw = await params;
  const id = idOrNotFound(raw.id);
  const number = numberOrNotFound(raw.n);
  const [v, p] = await Promise.all([orNotFound(getVersion(ctx.shopId, id, number)), orNotFound(getProcedure(ctx.shopId, id, { page: 1, pageSize: 1 }))]);
  const justPublished = (await searchParams).published === "1";
  const writer = can(ctx.roles, "procedure:write");
  const draft = p.allVersions.find((x) => x.status === "draft");
  const previous = p.allVersions.find((x) => x.number < number);
  const steps = v.content.sections.reduce((n, s) => n + s.steps.length, 0);
  return (
    <>
      <nav aria-label="Breadcrumb" className="mb-2 flex gap-2 text-sm">
        <Link href="/procedures" className="underline">Procedures</Link>
        <span aria-hidden="true">›</span>
        <Link href={`/procedures/${id}`} className="underline">{p.title}</Link>
      </nav>
      <PageHeader title={v.title} lead={v.code || undefined}>
        <a href={`/api/procedures/${id}/versions/${number}/export`} className="btn btn-quiet" download data-testid="export-link">Export file</a>
        {previous ? <Link href={`/procedures/${id}/diff?from=${previous.number}&to=${number}`} className="btn btn-quiet">Compare with v{previous.number}</Link> : null}
        {writer && v.status === "draft" ? <Link href={`/procedures/${id}/versions/${number}/edit`} className="btn btn-primary">Edit draft</Link> : null}
        {writer && v.status !== "draft" && !draft ? (
          <ActionButton action={newVersionAction} fields={{ procedureId: id }} label={`Start version ${(p.allVersions[0]?.number ?? number) + 1}`} tone="primary" pendingLabel="Copying…" />
        ) : null}
      </PageHeader>
      {justPublished ? (
        <p className="mb-4" data-testid="published-banner"><StatusBadge tone="pass">Version {number} published and sealed</StatusBadge></p>
      ) : null}
      <div className="grid gap-4 xl:grid-cols-[1fr_20rem]">
        <div className="space-y-4">
          {v.scope ? (
            <section className="card p-4" aria-labelledby="scope-h">
              <h2 id="scope-h" className="font-bold">Scope</h2>
              <Markdown source={v.scope} className="mt-2" />
            </section>
          ) : null}
          <VersionContentView content={v.content} system={ctx.unitSystem} />
          {weldJointIds(v.content).length ? (
            <section className="card p-4" aria-labelledby="map-h" data-testid="version-weld-map">
              <div className="flex flex-wrap items-center justify-between gap-2">
                <h2 id="map-h" className="font-bold">Weld map</h2>
                {writer && v.status === "draft" ? (
                  <Link href={`/procedures/${id}/versions/${number}/weld-map`} className="inline-flex min-h-12 items-center rounded border-2 border-graphite-950 px-3 font-semibold" data-testid="edit-weld-map">
                    Place joints on the map
                  </Link>
                ) : null}
              </div>
              {v.content.weldMap ? (
                <WeldMapView
                  images={v.content.weldMap.images.map((i) => ({ id: i.id, url: `/api/procedure-images/${i.id}`, width: i.width, height: i.height, label: i.label }))}
                  joints={v.content.weldMap.joints}
                />
              ) : (
                <p className="mt-2 text-sm">No joint is placed on a picture of the part yet.</p>
              )}
            </section>
          ) : null}
        </div>
        <aside className="space-y-4">
          <section className="card space-y-2 p-4 text-sm" aria-labelledby="ver-h" data-testid="version-facts">
            <h2 id="ver-h" className="flex items-center gap-2 font-bold">
              Version <VersionStatusBadge status={v.status} number={v.number} testId="version-status" />
            </h2>
            <dl className="space-y-2">
              <div><dt className="font-semibold text-graphite-700">Steps</dt><dd className="figures">{steps} in {v.content.sections.length} sections</dd></div>
              <div><dt className="font-semibold text-graphite-700">Author</dt><dd>{v.authorName ?? "—"}, started {fmtDate(v.createdAt)}</dd></div>
              {v.publishedAt ? <div><dt className="font-semibold text-graphite-700">Published</dt><dd>{v.publisherName ?? "—"}, <span className="figures">{fmtDate(v.publishedAt)}</span></dd></div> : null}
              {v.retiredAt ? <div><dt className="font-semibold text-graphite-700">Retired</dt><dd className="figures">{fmtDate(v.retiredAt)}</dd></div> : null}
              {v.changeNote ? <div><dt className="font-semibold text-graphite-700">Change note</dt><dd data-testid="change-note">{v.changeNote}</dd></div> : null}
              {v.contentHash ? (
                <div>
                  <dt className="font-semibold text-graphite-700">SHA-256 of its content</dt>
                  <dd><code className="figures block break-all text-xs" data-testid="content-hash">{v.contentHash}</code></dd>
                </div>
              ) : (
                <div><dt className="font-semibold text-graphite-700">SHA-256</dt><dd>Computed when published.</dd></div>
              )}
            </dl>
            {v.status === "retired" ? <p className="text-graphite-700">Retired: jobs that pinned it keep reading it; new jobs cannot pick it.</p> : null}
            {v.status === "published" ? <p className="text-graphite-700">Published: it never changes. New jobs can pin it.</p> : null}
          </section>
          {writer && v.status === "published" ? (
            <section className="card p-4" aria-labelledby="retire-h">
              <h2 id="retire-h" className="mb-2 font-bold">Retire this version</h2>
              <ActionButton action={retireAction} fields={{ procedureId: id, number }} label="Retire" tone="danger" confirm="New jobs will no longer be able to pick it." testId="retire" />
            </section>
          ) : null}
          <ProcedureNote />
        </aside>
      </div>
    </>
  );
}
