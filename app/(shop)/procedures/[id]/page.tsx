import type { Metadata } from "next";
import Link from "next/link";
import { z } from "zod";
import { PageHeader } from "@/components/page-header";
import { getProcedure } from "@/db/queries/procedures";
import { can } from "@/lib/authz";
import { requireShop } from "@/lib/auth/context";
import { Markdown } from "@/lib/procedures/markdown-view";
import { newVersionAction } from "../actions";
import { ActionButton } from "../_components/action-button";
import { CompareForm } from "../_components/compare-form";
import { HistoryTable } from "../_components/history-table";
import { idOrNotFound, orNotFound } from "../_components/not-found";
import { ProcedureNote } from "../_components/procedure-note";
import { fmtDate } from "../_components/format";

export const metadata: Metadata = { title: "Procedure" };

const PAGE_SIZE = 20;
const querySchema = z.object({ page: z.coerce.number().int().min(1).max(10_000).catch(1) });

export default async function ProcedurePage({
  params,
  searchParams,
}: {
  params: Promise<{ id: string }>;
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const ctx = await requireShop("procedure:read");
  const id = idOrNotFound((await params).id);
  const { page } = querySchema.parse(await searchParams);
  const p = await orNotFound(getProcedure(ctx.shopId, id, { page, pageSize: PAGE_SIZE }));
  const writer = can(ctx.roles, "procedure:write");
  const draft = p.allVersions.find((v) => v.status === "draft");
  const latest = p.allVersions[0];
  const published = p.allVersions.find((v) => v.status === "published");
  const numbers = p.allVersions.map((v) => v.number);
  const previousOf = (n: number) => numbers.find((m) => m < n) ?? null;
  return (
    <>
      <nav aria-label="Breadcrumb" className="mb-2 text-sm">
        <Link href="/procedures" className="underline">Procedures</Link>
      </nav>
      <PageHeader title={p.title} lead={p.code || undefined}>
        {published ? (
          <Link href={`/procedures/${p.id}/versions/${published.number}`} className="btn btn-quiet">Read published v{published.number}</Link>
        ) : null}
        {writer && draft ? (
          <Link href={`/procedures/${p.id}/versions/${draft.number}/edit`} className="btn btn-primary" data-testid="open-draft">Edit draft v{draft.number}</Link>
        ) : null}
        {writer && !draft && latest ? (
          <ActionButton action={newVersionAction} fields={{ procedureId: p.id }} label={`Start version ${latest.number + 1}`} pendingLabel="Copying…" tone="primary" testId="start-version" />
        ) : null}
      </PageHeader>
      <div className="space-y-4">
        <div className="grid gap-4 lg:grid-cols-[1fr_18rem]">
          <section className="card p-4" aria-labelledby="scope-h">
            <h2 id="scope-h" className="font-bold">Scope</h2>
            {p.scope ? <Markdown source={p.scope} className="mt-2" /> : <p className="mt-2 text-graphite-600">No scope written.</p>}
          </section>
          <section className="card p-4" aria-labelledby="facts-h">
            <h2 id="facts-h" className="font-bold">About</h2>
            <dl className="mt-2 space-y-2 text-sm">
              <div><dt className="font-semibold text-graphite-700">Owner</dt><dd>{p.ownerName ?? "—"}</dd></div>
              <div><dt className="font-semibold text-graphite-700">Code or standard</dt><dd>{p.code || "—"}</dd></div>
              <div><dt className="font-semibold text-graphite-700">Created</dt><dd className="figures">{fmtDate(p.createdAt)}</dd></div>
            </dl>
          </section>
        </div>
        <section aria-labelledby="hist-h" className="space-y-2">
          <h2 id="hist-h" className="text-lg font-bold">Version history</h2>
          <HistoryTable
            data={p.versions.map((v) => ({
              number: v.number,
              status: v.status,
              changeNote: v.changeNote,
              authorName: v.authorName,
              publisherName: v.publisherName,
              updatedAt: v.updatedAt.toISOString(),
              publishedAt: v.publishedAt?.toISOString() ?? null,
              retiredAt: v.retiredAt?.toISOString() ?? null,
              contentHash: v.contentHash,
              stepCount: v.stepCount,
              procedureId: p.id,
              previous: previousOf(v.number),
            }))}
            total={p.versionTotal}
            page={page}
            pageSize={PAGE_SIZE}
          />
        </section>
        <div className="grid gap-4 lg:grid-cols-2">
          {numbers.length > 1 ? <CompareForm procedureId={p.id} versions={p.allVersions} from={numbers[1]!} to={numbers[0]!} /> : <div />}
          <ProcedureNote className="self-start" />
        </div>
      </div>
    </>
  );
}
