import Link from "next/link";
import { searchReleased } from "@/db/queries/audit";
import { auditQuerySchema } from "@/lib/schemas/audit";
import { RecordsTable } from "./records-table";

const PAGE_SIZE = 20;

function exportQuery(q: { q?: string; from?: string; to?: string }) {
  const p = new URLSearchParams();
  if (q.q) p.set("q", q.q);
  if (q.from) p.set("from", q.from);
  if (q.to) p.set("to", q.to);
  return p.toString();
}

// The search form and its results; shared by the auditor's desk and the Released records page.
export async function RecordsSearch({ shopId, params, action }: { shopId: string; params: Record<string, string | string[] | undefined>; action: string }) {
  const flat = Object.fromEntries(Object.entries(params).map(([k, v]) => [k, Array.isArray(v) ? v[0] : v]));
  const parsed = auditQuerySchema.safeParse({ ...flat, pageSize: PAGE_SIZE });
  const q = parsed.success ? parsed.data : { page: 1, pageSize: PAGE_SIZE };
  const errors = parsed.success ? {} : Object.fromEntries(parsed.error.issues.map((i) => [String(i.path[0]), i.message]));
  const { rows, total } = await searchReleased(shopId, q);
  return (
    <div className="space-y-3">
      <form className="card flex flex-wrap items-start gap-3 p-4" role="search" action={action}>
        <div>
          <label className="field-label" htmlFor="rq">Job no., VIN, axle tag or customer</label>
          <input id="rq" name="q" defaultValue={flat.q ?? ""} className="field-input w-72" />
          <p className="field-error">{errors.q}</p>
        </div>
        <div>
          <label className="field-label" htmlFor="rfrom">Released from</label>
          <input id="rfrom" name="from" type="date" defaultValue={flat.from ?? ""} className="field-input" aria-invalid={errors.from ? true : undefined} />
          <p className="field-error">{errors.from}</p>
        </div>
        <div>
          <label className="field-label" htmlFor="rto">to</label>
          <input id="rto" name="to" type="date" defaultValue={flat.to ?? ""} className="field-input" aria-invalid={errors.to ? true : undefined} />
          <p className="field-error">{errors.to}</p>
        </div>
        <div className="flex gap-2 self-center">
          <button className="btn btn-primary" type="submit">Search</button>
          <Link className="btn btn-quiet" href={action}>Clear</Link>
        </div>
      </form>
      {parsed.success && total > 0 ? (
        <p className="flex flex-wrap items-center gap-3">
          {/* The same filters, every page: one row per recorded value, with value, unit, limit and verdict. */}
          <a className="btn btn-quiet" data-testid="records-export" download href={`/api/records/export.csv?${exportQuery(parsed.data)}`}>
            Download all {total} as CSV
          </a>
          <span className="text-sm text-graphite-600">One row per reading, torque, coating figure and weld pass value.</span>
        </p>
      ) : null}
      <RecordsTable data={rows.map((r) => ({ ...r, releasedAt: r.releasedAt ? r.releasedAt.toISOString() : null }))} total={total} page={q.page} pageSize={PAGE_SIZE} />
    </div>
  );
}
