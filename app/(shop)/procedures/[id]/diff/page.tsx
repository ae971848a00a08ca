import type { Metadata } from "next";
import Link from "next/link";
import { z } from "zod";
import { PageHeader } from "@/components/page-header";
import { StatusBadge } from "@/components/status-badge";
import { getProcedure, getVersion } from "@/db/queries/procedures";
import { requireShop } from "@/lib/auth/context";
import { diffVersions } from "@/lib/procedures/diff";
import { VERSION_STATUS_LABELS } from "@/lib/procedures/labels";
import { CompareForm } from "../../_components/compare-form";
import { DiffSummary, DiffView } from "../../_components/diff-view";
import { idOrNotFound, orNotFound } from "../../_components/not-found";
import { ProcedureNote } from "../../_components/procedure-note";

export const metadata: Metadata = { title: "Compare versions" };

const querySchema = z.object({
  from: z.coerce.number().int().min(1).optional().catch(undefined),
  to: z.coerce.number().int().min(1).optional().catch(undefined),
  published: z.enum(["1"]).optional().catch(undefined),
});

export default async function DiffPage({
  params,
  searchParams,
}: {
  params: Promise<{ id: string }>;
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const ctx = await requireShop("procedure:read");
  const id = idOrNotFound((await params).id);
  const q = querySchema.parse(await searchParams);
  const p = await orNotFound(getProcedure(ctx.shopId, id, { page: 1, pageSize: 1 }));
  const numbers = p.allVersions.map((v) => v.number);
  const to = q.to ?? numbers[0] ?? 1;
  const from = q.from ?? numbers.find((n) => n < to) ?? to;
  const [a, b] = await Promise.all([orNotFound(getVersion(ctx.shopId, id, from)), orNotFound(getVersion(ctx.shopId, id, to))]);
  const diff = diffVersions(a, b);
  const label = (v: typeof a) => `v${v.number} · ${VERSION_STATUS_LABELS[v.status]}`;
  return (
    <>
      <nav aria-label="Breadcrumb" className="mb-2 flex gap-2 text-sm">
        <Link href="/procedures" className="underline">Procedures</Link>
        <span aria-hidden="true">›</span>
        <Link href={`/procedures/${id}`} className="underline">{p.title}</Link>
      </nav>
      <PageHeader title={`Version ${from} → version ${to}`} lead="Steps are matched by their key; changed steps list each field that differs.">
        <Link href={`/procedures/${id}/versions/${from}`} className="btn btn-quiet">Read v{from}</Link>
        <Link href={`/procedures/${id}/versions/${to}`} className="btn btn-quiet">Read v{to}</Link>
      </PageHeader>
      {q.published ? (
        <p className="mb-4" data-testid="published-banner"><StatusBadge tone="pass">Version {to} published and sealed</StatusBadge></p>
      ) : null}
      <div className="grid gap-4 xl:grid-cols-[1fr_18rem]">
        <div className="space-y-4">
          {b.changeNote ? (
            <p className="card p-3 text-sm" data-testid="diff-change-note"><strong>Change note of v{to}:</strong> {b.changeNote}</p>
          ) : null}
          <DiffSummary diff={diff} />
          <DiffView diff={diff} system={ctx.unitSystem} fromLabel={label(a)} toLabel={label(b)} />
        </div>
        <aside className="space-y-4">
          <CompareForm procedureId={id} versions={p.allVersions} from={from} to={to} />
          <ProcedureNote />
        </aside>
      </div>
    </>
  );
}
