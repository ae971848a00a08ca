import type { Metadata } from "next";
import Link from "next/link";
import { PageHeader } from "@/components/page-header";
import { StatusBadge } from "@/components/status-badge";
import { can } from "@/lib/authz";
import { requireShop } from "@/lib/auth/context";
import { continuityCounts, listQualifications, weldersWithoutQualification } from "@/db/queries/qualifications";
import { CODE_LABELS, CODE_RULES, CONTINUITY_STATUS_LABELS, CONTINUITY_STATUSES, qualificationListQuerySchema } from "@/lib/welding/qualification-schema";
import { WPS_PROCESSES } from "@/lib/welding/wps-schema";
import { CodeForm } from "./_components/code-form";
import { QualificationsTable } from "./_components/qualifications-table";
import { toView } from "./_components/views";

export const metadata: Metadata = { title: "Qualifications" };

const PAGE_SIZE = 20;

const FILTER_LABELS = { current: "Current", lapsing: "Lapsing within 30 days", lapsed: "Lapsed" } as const;

export default async function QualificationsPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const ctx = await requireShop("job:read");
  const raw = await searchParams;
  const str = (k: string) => (typeof raw[k] === "string" && (raw[k] as string).trim() ? (raw[k] as string) : undefined);
  const parsed = qualificationListQuerySchema.safeParse({ q: str("q"), process: str("process"), status: str("status"), page: str("page"), pageSize: PAGE_SIZE });
  const query = parsed.success ? parsed.data : { page: 1, pageSize: PAGE_SIZE, q: undefined, process: undefined, status: undefined };
  const [list, counts, unqualified] = await Promise.all([
    listQualifications(ctx.shopId, { q: query.q, process: query.process, status: query.status, page: query.page, pageSize: PAGE_SIZE }),
    continuityCounts(ctx.shopId),
    weldersWithoutQualification(ctx.shopId),
  ]);
  const lead = can(ctx.roles, "qualification:write");
  return (
    <>
      <PageHeader title="Qualifications" lead={`Who may weld with which process today. A process unused too long lapses; continuity follows ${CODE_LABELS[list.code]}. Dates are worked out for ${list.today}.`}>
        {lead ? <Link href="/qualifications/new" className="btn btn-primary">Add a qualification</Link> : null}
      </PageHeader>
      <nav aria-label="Continuity summary" className="mb-4 flex flex-wrap gap-2" data-testid="continuity-summary">
        <Link href="/qualifications?status=lapsing" className="rounded focus-visible:outline"><StatusBadge tone="warn" testId="count-lapsing">{counts.lapsing} lapsing within 30 days</StatusBadge></Link>
        <Link href="/qualifications?status=lapsed" className="rounded"><StatusBadge tone="fail" testId="count-lapsed">{counts.lapsed} lapsed</StatusBadge></Link>
        <Link href="/qualifications?status=current" className="rounded"><StatusBadge tone="pass" testId="count-current">{counts.current} current</StatusBadge></Link>
        {unqualified.length ? (
          <StatusBadge tone="info" testId="unqualified">
            {unqualified.length} welder{unqualified.length === 1 ? "" : "s"} with no qualification: {unqualified.map((u) => u.name).join(", ")}
          </StatusBadge>
        ) : null}
      </nav>
      <div className="grid gap-4 2xl:grid-cols-[1fr_22rem]">
        <div className="space-y-3">
          <form className="flex flex-wrap items-end gap-2" role="search" data-testid="qualification-filters">
            <div>
              <label className="field-label" htmlFor="q">Search welder</label>
              <input id="q" name="q" defaultValue={query.q ?? ""} className="field-input w-56" />
            </div>
            <div>
              <label className="field-label" htmlFor="process">Process</label>
              <select id="process" name="process" defaultValue={query.process ?? ""} className="field-input w-36">
                <option value="">Any process</option>
                {WPS_PROCESSES.map((p) => <option key={p} value={p}>{p}</option>)}
              </select>
            </div>
            <div>
              <label className="field-label" htmlFor="status">Continuity</label>
              <select id="status" name="status" defaultValue={query.status ?? ""} className="field-input w-56">
                <option value="">Any</option>
                {CONTINUITY_STATUSES.map((s) => <option key={s} value={s}>{FILTER_LABELS[s]}</option>)}
              </select>
            </div>
            <button className="btn btn-quiet" type="submit">Show</button>
          </form>
          {query.status ? <p className="text-sm text-graphite-700">Showing: {CONTINUITY_STATUS_LABELS[query.status]} only.</p> : null}
          <QualificationsTable data={list.rows.map((r) => toView(r, ctx.unitSystem))} total={list.total} page={query.page} pageSize={PAGE_SIZE} />
        </div>
        <section className="card h-fit space-y-2 p-4" aria-labelledby="code-h">
          <h2 id="code-h" className="font-bold">Continuity code</h2>
          {lead ? (
            <CodeForm current={list.code} />
          ) : (
            <p data-testid="code-readonly">
              <span className="font-semibold">{CODE_LABELS[list.code]}.</span> {CODE_RULES[list.code]}
            </p>
          )}
        </section>
      </div>
    </>
  );
}
