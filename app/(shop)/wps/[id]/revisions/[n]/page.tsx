import type { Metadata } from "next";
import Link from "next/link";
import { PageHeader } from "@/components/page-header";
import { SafetyNote } from "@/components/safety-note";
import { can } from "@/lib/authz";
import { requireShop } from "@/lib/auth/context";
import { WpsStatusBadge } from "../../../_components/badges";
import { day } from "../../../_components/format";
import { loadRevision } from "../../../_components/load";
import { RevisionView } from "../../../_components/revision-view";

export const metadata: Metadata = { title: "WPS revision" };

export default async function RevisionPage({ params }: { params: Promise<{ id: string; n: string }> }) {
  const ctx = await requireShop("procedure:read");
  const { id, n } = await params;
  const r = await loadRevision(ctx.shopId, id, n);
  return (
    <>
      <PageHeader title={`${r.reference} revision ${r.number}`} lead={r.content.title || "Untitled draft"}>
        <Link href={`/wps/${r.wpsId}`} className="btn btn-quiet">← {r.reference}</Link>
        {r.status === "draft" && can(ctx.roles, "wps:write") ? (
          <Link href={`/wps/${r.wpsId}/revisions/${r.number}/edit`} className="btn btn-primary">Edit this draft</Link>
        ) : null}
      </PageHeader>
      <div className="mb-4 flex flex-wrap items-center gap-3 text-sm text-graphite-700">
        <WpsStatusBadge status={r.status} number={r.number} />
        {r.publishedAt ? <span>Published <span className="figures">{day(r.publishedAt)}</span> by {r.publisherName ?? "someone"}.</span> : null}
        {r.retiredAt ? <span>Retired <span className="figures">{day(r.retiredAt)}</span>: {r.retireNote}</span> : null}
        {r.status === "retired" ? <span className="font-semibold">Out of use: shown for the record.</span> : null}
      </div>
      {r.changeNote ? <p className="card mb-4 p-3"><span className="font-semibold">Change note:</span> {r.changeNote}</p> : null}
      <RevisionView content={r.content} system={ctx.unitSystem} />
      <SafetyNote className="mt-4" />
    </>
  );
}
