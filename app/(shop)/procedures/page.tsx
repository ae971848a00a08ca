import type { Metadata } from "next";
import Link from "next/link";
import { PageHeader } from "@/components/page-header";
import { ProcedureNote } from "./_components/procedure-note";
import { listProcedures } from "@/db/queries/procedures";
import { can } from "@/lib/authz";
import { requireShop } from "@/lib/auth/context";
import { listQuerySchema } from "@/lib/procedures/forms";
import { ProceduresTable } from "./_components/procedures-table";

export const metadata: Metadata = { title: "Procedures" };

const STATE_OPTIONS = [
  ["all", "All procedures"],
  ["published", "Published (in use)"],
  ["draft", "With a draft"],
  ["retired", "Retired (out of use)"],
] as const;

export default async function ProceduresPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const ctx = await requireShop("procedure:read");
  const raw = await searchParams;
  const parsed = listQuerySchema.safeParse(Object.fromEntries(Object.entries(raw).filter(([, v]) => typeof v === "string" && v !== "")));
  const query = parsed.success ? parsed.data : listQuerySchema.parse({});
  const { rows, total } = await listProcedures(ctx.shopId, query);
  const writer = can(ctx.roles, "procedure:write");
  return (
    <>
      <PageHeader
        title="Procedures"
        lead="The shop's written procedures. A job pins one published version for life; published versions never change."
      >
        {writer ? (
          <>
            <Link href="/procedures/import" className="btn btn-quiet">Import a file</Link>
            <Link href="/procedures/new" className="btn btn-primary">New procedure</Link>
          </>
        ) : null}
      </PageHeader>
      <div className="space-y-3">
        <form className="flex flex-wrap items-end gap-2" role="search" data-testid="procedure-search">
          <div>
            <label className="field-label" htmlFor="q">Search title, scope or code</label>
            <input id="q" name="q" defaultValue={query.q} className="field-input w-72" />
          </div>
          <div>
            <label className="field-label" htmlFor="state">State</label>
            <select id="state" name="state" defaultValue={query.state} className="field-input w-56">
              {STATE_OPTIONS.map(([v, l]) => <option key={v} value={v}>{l}</option>)}
            </select>
          </div>
          <input type="hidden" name="sort" value={query.sort} />
          <input type="hidden" name="dir" value={query.dir} />
          <button className="btn btn-quiet" type="submit">Show</button>
        </form>
        <ProceduresTable
          data={rows.map((r) => ({ ...r, changedAt: r.changedAt.toISOString() }))}
          total={total}
          page={query.page}
          pageSize={query.pageSize}
        />
        <ProcedureNote />
      </div>
    </>
  );
}
