import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { z } from "zod";
import { FormMessage } from "@/components/form-message";
import { PageHeader } from "@/components/page-header";
import { SafetyNote } from "@/components/safety-note";
import { can } from "@/lib/authz";
import { requireShop } from "@/lib/auth/context";
import { AppError } from "@/lib/errors";
import { getRevision, getWps } from "@/db/queries/wps";
import { listQualifications } from "@/db/queries/qualifications";
import { WpsStatusBadge } from "../_components/badges";
import { NewRevisionForm, RetireForm } from "../_components/note-forms";
import { QualifiedWelders } from "../_components/qualified-welders";
import { RevisionHistory } from "../_components/revision-history";
import { RevisionView } from "../_components/revision-view";

export const metadata: Metadata = { title: "WPS" };

async function load(shopId: string, id: string) {
  if (!z.string().uuid().safeParse(id).success) notFound();
  try {
    const w = await getWps(shopId, id);
    return { w, shown: await getRevision(shopId, id, w.shownNumber) };
  } catch (error) {
    if (error instanceof AppError && error.code === "not_found") notFound();
    throw error;
  }
}

export default async function WpsPage({ params, searchParams }: { params: Promise<{ id: string }>; searchParams: Promise<Record<string, string | undefined>> }) {
  const ctx = await requireShop("procedure:read");
  const { id } = await params;
  const published = z.coerce.number().int().min(1).optional().catch(undefined).parse((await searchParams).published);
  const { w, shown } = await load(ctx.shopId, id);
  const lead = can(ctx.roles, "wps:write");
  const process = shown.content.process;
  const welders = process ? await listQualifications(ctx.shopId, { process, page: 1, pageSize: 50 }) : null;
  const latest = w.revisions[0]!.number;
  return (
    <>
      <PageHeader title={`${w.reference} · ${shown.content.title || "untitled draft"}`} lead={`Revision ${shown.number}${w.state === "published" ? ", in use" : w.state === "retired" ? ", out of use" : ", not yet published"}.`}>
        <Link href="/wps" className="btn btn-quiet">← WPS library</Link>
      </PageHeader>
      {published ? <div className="mb-4"><FormMessage ok={`Revision ${published} published. It never changes from now on.`} testId="published" /></div> : null}
      <div className="mb-4 flex flex-wrap items-center gap-3" data-testid="wps-state">
        <WpsStatusBadge status={shown.status} number={shown.number} />
        {w.draftNumber && w.draftNumber !== shown.number ? (
          <span className="text-sm text-graphite-700">Draft <span className="figures">revision {w.draftNumber}</span> is being written.</span>
        ) : null}
      </div>
      <div className="grid gap-4 xl:grid-cols-[1fr_22rem]">
        <div className="space-y-4">
          <RevisionView content={shown.content} system={ctx.unitSystem} />
          <SafetyNote />
        </div>
        <div className="space-y-4">
          {lead ? (
            <section className="card space-y-2 p-4" aria-labelledby="lead-h">
              <h2 id="lead-h" className="font-bold">Change this WPS</h2>
              {w.draftNumber ? (
                <Link href={`/wps/${w.id}/revisions/${w.draftNumber}/edit`} className="btn btn-primary" data-testid="edit-draft">Edit draft revision {w.draftNumber}</Link>
              ) : (
                <>
                  <p className="text-sm text-graphite-600">A new revision starts as a draft copy of revision {latest}.</p>
                  <NewRevisionForm wpsId={w.id} next={latest + 1} />
                </>
              )}
            </section>
          ) : null}
          {lead && w.publishedNumber ? <RetireForm wpsId={w.id} number={w.publishedNumber} /> : null}
          {process && welders ? <QualifiedWelders process={process} rows={welders.rows} total={welders.total} code={welders.code} /> : null}
          <RevisionHistory wpsId={w.id} revisions={w.revisions} shownNumber={shown.number} />
        </div>
      </div>
    </>
  );
}
