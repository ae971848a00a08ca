import type { Metadata } from "next";
import { PageHeader } from "@/components/page-header";
import { can } from "@/lib/authz";
import { requireShop } from "@/lib/auth/context";
import { listWps } from "@/db/queries/wps";
import { WPS_PROCESSES, WPS_STATES, STATUS_LABELS, wpsListQuerySchema } from "@/lib/welding/wps-schema";
import { StartWpsForm } from "./_components/start-wps-form";
import { WpsTable } from "./_components/wps-table";
import { day } from "./_components/format";

export const metadata: Metadata = { title: "WPS library" };

const PAGE_SIZE = 20;

export default async function WpsLibraryPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const ctx = await requireShop("procedure:read");
  const raw = await searchParams;
  const parsed = wpsListQuerySchema.safeParse({
    q: typeof raw.q === "string" && raw.q.trim() ? raw.q : undefined,
    state: typeof raw.state === "string" && raw.state ? raw.state : undefined,
    process: typeof raw.process === "string" && raw.process ? raw.process : undefined,
    page: typeof raw.page === "string" ? raw.page : undefined,
    pageSize: PAGE_SIZE,
  });
  // A hand-edited URL that does not parse shows the first page of everything rather than an error.
  const query = parsed.success ? parsed.data : { page: 1, pageSize: PAGE_SIZE };
  const { rows, total } = await listWps(ctx.shopId, query);
  const lead = can(ctx.roles, "wps:write");
  return (
    <>
      <PageHeader
        title="WPS library"
        lead="The welding procedure specifications the shop welds to. A published revision never changes: a new revision starts as a draft copy, and publishing it retires the one before."
      />
      <div className={lead ? "grid gap-4 xl:grid-cols-[1fr_22rem]" : ""}>
        <div className="space-y-3">
          <form className="flex flex-wrap items-end gap-2" role="search" data-testid="wps-filters">
            <div>
              <label className="field-label" htmlFor="q">Search reference, title, filler or base metal</label>
              <input id="q" name="q" defaultValue={"q" in query ? query.q : ""} className="field-input w-72" />
            </div>
            <div>
              <label className="field-label" htmlFor="state">State</label>
              <select id="state" name="state" defaultValue={"state" in query ? (query.state ?? "") : ""} className="field-input w-40">
                <option value="">Any state</option>
                {WPS_STATES.map((s) => <option key={s} value={s}>{STATUS_LABELS[s]}</option>)}
              </select>
            </div>
            <div>
              <label className="field-label" htmlFor="process">Process</label>
              <select id="process" name="process" defaultValue={"process" in query ? (query.process ?? "") : ""} className="field-input w-36">
                <option value="">Any process</option>
                {WPS_PROCESSES.map((p) => <option key={p} value={p}>{p}</option>)}
              </select>
            </div>
            <button className="btn btn-quiet" type="submit">Show</button>
          </form>
          <WpsTable
            data={rows.map(({ changedAt, ...r }) => ({ ...r, changedOn: day(changedAt) }))}
            total={total}
            page={query.page}
            pageSize={PAGE_SIZE}
          />
        </div>
        {lead ? <StartWpsForm /> : null}
      </div>
    </>
  );
}
