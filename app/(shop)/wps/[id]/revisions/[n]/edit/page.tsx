import type { Metadata } from "next";
import Link from "next/link";
import { PageHeader } from "@/components/page-header";
import { requireShop } from "@/lib/auth/context";
import { FIELD_LABELS, publishIssues } from "@/lib/welding/wps-schema";
import { WpsStatusBadge } from "../../../../_components/badges";
import { DraftEditor } from "../../../../_components/draft-editor";
import { loadRevision } from "../../../../_components/load";
import { PublishForm } from "../../../../_components/note-forms";

export const metadata: Metadata = { title: "WPS draft" };

export default async function EditDraftPage({ params }: { params: Promise<{ id: string; n: string }> }) {
  const ctx = await requireShop("wps:write");
  const { id, n } = await params;
  const r = await loadRevision(ctx.shopId, id, n);
  if (r.status !== "draft") {
    return (
      <>
        <PageHeader title={`${r.reference} revision ${r.number}`} />
        <div className="card max-w-2xl space-y-3 p-4" data-testid="not-a-draft">
          <WpsStatusBadge status={r.status} number={r.number} />
          <p>This revision is {r.status} and never changes. To change the WPS, start a new revision: it begins as a draft copy.</p>
          <Link href={`/wps/${r.wpsId}`} className="btn btn-primary">Back to {r.reference}</Link>
        </div>
      </>
    );
  }
  const missing = publishIssues(r.content).map((i) => `${FIELD_LABELS[i.path]}: ${i.message}`);
  return (
    <>
      <PageHeader title={`${r.reference} · draft revision ${r.number}`} lead="Values are SI: mm, L/min, V, A, mm/min, kJ/mm and °C. Save as often as you like; nothing reaches a welder until it is published.">
        <Link href={`/wps/${r.wpsId}`} className="btn btn-quiet">← {r.reference}</Link>
      </PageHeader>
      <div className="grid gap-4 xl:grid-cols-[1fr_24rem]">
        <DraftEditor wpsId={r.wpsId} number={r.number} content={r.content} />
        <div className="space-y-4">
          <PublishForm wpsId={r.wpsId} number={r.number} reference={r.reference} missing={missing} />
        </div>
      </div>
    </>
  );
}
