import type { Metadata } from "next";
import Link from "next/link";
import { PageHeader } from "@/components/page-header";
import { jobFormOptions, listJobs } from "@/db/queries/jobs";
import { can } from "@/lib/authz";
import { requireShop } from "@/lib/auth/context";
import { JOB_STATE_LABELS, JOB_STATE_VALUES } from "@/lib/jobs/labels";
import { listJobsQuerySchema } from "@/lib/jobs/schemas";
import { JobsTable } from "./_components/jobs-table";
import { todayIso } from "@/lib/jobs/due";

export const metadata: Metadata = { title: "Jobs" };

export default async function JobsPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const ctx = await requireShop("job:read");
  const raw = await searchParams;
  const query = listJobsQuerySchema.parse(Object.fromEntries(Object.entries(raw).map(([k, v]) => [k, Array.isArray(v) ? v[0] : v])));
  const [{ rows, total }, options] = await Promise.all([listJobs(ctx.shopId, query, ctx.userId), jobFormOptions(ctx.shopId)]);
  const people = [...new Map([...options.welders, ...options.inspectors].map((p) => [p.id, p])).values()];
  const filtered = Boolean(query.q || query.status || query.assignee || query.dueFrom || query.dueTo);
  return (
    <>
      <PageHeader title="Jobs" lead="Every job of the shop: search by job number, VIN, axle tag, customer or welder.">
        {can(ctx.roles, "job:write") ? <Link href="/jobs/new" className="btn btn-primary" data-testid="new-job">New job</Link> : null}
      </PageHeader>
      <form className="mb-4 grid gap-3 rounded-lg border border-graphite-200 bg-white p-3 md:grid-cols-3 xl:grid-cols-6" role="search" data-testid="jobs-filters">
        <div className="md:col-span-2">
          <label className="field-label" htmlFor="q">Search</label>
          <input id="q" name="q" defaultValue={query.q} className="field-input" placeholder="GJ-2026-0012, VIN, axle tag, customer, welder" />
        </div>
        <div>
          <label className="field-label" htmlFor="status">State</label>
          <select id="status" name="status" defaultValue={query.status ?? ""} className="field-input">
            <option value="">Any</option>
            <option value="open">Not released or void</option>
            {JOB_STATE_VALUES.map((s) => <option key={s} value={s}>{JOB_STATE_LABELS[s].label}</option>)}
          </select>
        </div>
        <div>
          <label className="field-label" htmlFor="assignee">Assigned to</label>
          <select id="assignee" name="assignee" defaultValue={query.assignee ?? ""} className="field-input">
            <option value="">Anyone</option>
            <option value="me">Me</option>
            {people.map((p) => <option key={p.id} value={p.id}>{p.name}</option>)}
          </select>
        </div>
        <div>
          <label className="field-label" htmlFor="dueFrom">Due from</label>
          <input id="dueFrom" name="dueFrom" type="date" defaultValue={query.dueFrom} className="field-input" />
        </div>
        <div>
          <label className="field-label" htmlFor="dueTo">Due by</label>
          <input id="dueTo" name="dueTo" type="date" defaultValue={query.dueTo} className="field-input" />
        </div>
        <input type="hidden" name="sort" value={query.sort} />
        <input type="hidden" name="dir" value={query.dir} />
        <div className="flex items-end gap-2 md:col-span-3 xl:col-span-6">
          <button className="btn btn-primary" type="submit">Apply</button>
          {filtered ? <Link href="/jobs" className="btn btn-quiet">Clear</Link> : null}
        </div>
      </form>
      <JobsTable rows={rows} total={total} page={query.page} pageSize={query.pageSize} sort={query.sort} dir={query.dir} today={todayIso()} />
    </>
  );
}
