import type { Metadata } from "next";
import Link from "next/link";
import { PageHeader } from "@/components/page-header";
import { SafetyNote } from "@/components/safety-note";
import { StatusBadge } from "@/components/status-badge";
import { qualityFigures, qualityFilterOptions } from "@/db/queries/quality";
import { requireShop } from "@/lib/auth/context";
import { can } from "@/lib/authz";
import { AppError } from "@/lib/errors";
import { IMR_METHOD, IMR_SOURCE, individualsChart } from "@/lib/quality/control-chart";
import { csvHref, defectsCsv, heatCsv, jobsCsv, nonconformanceCsv, qualificationsCsv, waitCsv, yieldCsv } from "@/lib/quality/csv";
import { defectLabel, dispositionLabel, jobStateLabel, percent } from "@/lib/quality/labels";
import { defaultRange, qualityQuerySchema } from "@/lib/quality/schema";
import { DefectsChart, HeatChart, YieldChart } from "./_components/lazy-charts";

export const metadata: Metadata = { title: "Quality" };

const fig = (v: number | null, digits = 1) => (v === null ? "–" : v.toFixed(digits));

function Section({ id, title, csv, file, children }: { id: string; title: string; csv: string; file: string; children: React.ReactNode }) {
  return (
    <section id={`section-${id}`} className="card p-4" aria-labelledby={`${id}-h`} data-testid={`section-${id}`}>
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h2 id={`${id}-h`} className="font-bold">{title}</h2>
        <a className="btn btn-quiet min-h-12" href={csvHref(csv)} download={file} data-testid={`csv-${id}`}>Download CSV</a>
      </div>
      <div className="mt-3 grid gap-4 lg:grid-cols-2">{children}</div>
    </section>
  );
}

function Table({ caption, head, rows, testId }: { caption: string; head: string[]; rows: React.ReactNode[][]; testId: string }) {
  return (
    <div className="min-w-0 overflow-x-auto">
      <table className="w-full border-collapse text-left" data-testid={testId}>
        <caption className="sr-only">{caption}</caption>
        <thead className="bg-graphite-100">
          <tr>{head.map((h) => <th key={h} scope="col" className="px-3 py-2 text-sm font-semibold">{h}</th>)}</tr>
        </thead>
        <tbody>
          {rows.length === 0 ? (
            <tr><td colSpan={head.length} className="px-3 py-4 text-center text-graphite-600">Nothing in this range.</td></tr>
          ) : (
            rows.map((r, i) => (
              <tr key={i} className="border-t border-graphite-100">
                {r.map((c, j) => <td key={j} className={`px-3 py-2 ${j > 0 ? "figures whitespace-nowrap" : ""}`}>{c}</td>)}
              </tr>
            ))
          )}
        </tbody>
      </table>
    </div>
  );
}

export default async function QualityPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const ctx = await requireShop("quality:read");
  const shopWide = can(ctx.roles, "quality:shop");
  const flat = Object.fromEntries(Object.entries(await searchParams).map(([k, v]) => [k, Array.isArray(v) ? v[0] : v]));
  const parsed = qualityQuerySchema.safeParse(flat);
  const errors: Record<string, string> = parsed.success ? {} : Object.fromEntries(parsed.error.issues.map((i) => [String(i.path[0] ?? "_"), i.message]));
  const q = parsed.success ? parsed.data : {};
  const today = new Date().toISOString().slice(0, 10);
  const range = q.from || q.to ? { from: q.from, to: q.to } : defaultRange(today);
  const welderId = shopWide ? q.welderId : ctx.userId;
  const [options, f] = await Promise.all([
    qualityFilterOptions(ctx.shopId),
    // A filter naming another shop's person, WPS or procedure finds nothing: said so, not a failed page.
    qualityFigures({ shopId: ctx.shopId, ...range, welderId, wpsId: q.wpsId, procedureId: q.procedureId }).catch((error: unknown) => {
      if (error instanceof AppError) return null;
      throw error;
    }),
  ]);
  const fpy = f?.firstPassYield;
  return (
    <>
      <PageHeader
        title="Quality"
        lead={`${shopWide ? ctx.shop.name : "Your own work"}: first-pass yield, defects, heat input, nonconformances and waiting time, ${range.from ?? "from the start"} to ${range.to ?? "today"}.`}
      />
      <form className="card mb-4 flex flex-wrap items-start gap-3 p-4" role="search" action="/quality" data-testid="quality-filters">
        <div>
          <label className="field-label" htmlFor="qfrom">From</label>
          <input id="qfrom" name="from" type="date" defaultValue={flat.from ?? range.from ?? ""} className="field-input min-h-12" aria-invalid={errors.from ? true : undefined} />
          <p className="field-error" data-testid="error-from">{errors.from}</p>
        </div>
        <div>
          <label className="field-label" htmlFor="qto">To</label>
          <input id="qto" name="to" type="date" defaultValue={flat.to ?? range.to ?? ""} className="field-input min-h-12" aria-invalid={errors.to ? true : undefined} />
          <p className="field-error" data-testid="error-to">{errors.to}</p>
        </div>
        {shopWide ? (
          <FilterSelect id="qwelder" name="welderId" label="Welder" all="Every welder" value={flat.welderId} error={errors.welderId}
            options={options.welders.map((w) => ({ id: w.id, label: w.name }))} />
        ) : null}
        <FilterSelect id="qwps" name="wpsId" label="WPS" all="Every WPS" value={flat.wpsId} error={errors.wpsId}
          options={options.wps.map((w) => ({ id: w.id, label: w.reference }))} />
        <FilterSelect id="qproc" name="procedureId" label="Procedure" all="Every procedure" value={flat.procedureId} error={errors.procedureId} wide
          options={options.procedures.map((p) => ({ id: p.id, label: p.title }))} />
        <div className="flex gap-2 self-center">
          <button className="btn btn-primary min-h-12" type="submit">Show</button>
          <Link className="btn btn-quiet min-h-12" href="/quality">Last 90 days</Link>
        </div>
      </form>
      {!f || !fpy ? (
        <p className="card p-4" data-testid="quality-unavailable">No figures for these filters: a filter names something this shop does not have.</p>
      ) : (
        <div className="space-y-4">
          <Section id="yield" title="First-pass yield" csv={yieldCsv(fpy)} file="first-pass-yield.csv">
            <div>
              <p className="text-sm text-graphite-600">Joints accepted at their first visual inspection ÷ joints inspected.</p>
              <p className="mt-2 text-3xl font-semibold figures" data-testid="fpy-overall">{percent(fpy.overall.ratio)}</p>
              <p className="figures text-sm" data-testid="fpy-counts">{fpy.overall.acceptedFirst} of {fpy.overall.inspected} joints accepted first time</p>
              <h3 className="mt-3 text-sm font-semibold">By welder</h3>
              <YieldChart testId="yield-welder-chart" rows={fpy.byWelder.map((w) => ({ name: w.welderName, ratio: w.ratio, inspected: w.inspected }))} />
              <h3 className="mt-3 text-sm font-semibold">By WPS</h3>
              <YieldChart testId="yield-wps-chart" rows={fpy.byWps.map((w) => ({ name: w.reference, ratio: w.ratio, inspected: w.inspected }))} />
            </div>
            <div className="space-y-3">
              <Table caption="First-pass yield by welder" testId="yield-welder-table" head={["Welder", "Inspected", "Accepted first", "Yield"]} rows={fpy.byWelder.map((w) => [w.welderName, w.inspected, w.acceptedFirst, percent(w.ratio)])} />
              <Table caption="First-pass yield by WPS" testId="yield-wps-table" head={["WPS", "Inspected", "Accepted first", "Yield"]} rows={fpy.byWps.map((w) => [w.reference, w.inspected, w.acceptedFirst, percent(w.ratio)])} />
            </div>
          </Section>

          <Section id="defects" title="Defects found at visual inspection" csv={defectsCsv(f.defects)} file="defects.csv">
            {f.defects.length ? <DefectsChart defects={f.defects} /> : <p className="text-graphite-600">No defect found in this range.</p>}
            <Table caption="Defects by criterion, most frequent first" testId="defects-table" head={["Criterion", "Count"]} rows={f.defects.map((d) => [defectLabel(d.criterion), d.count])} />
          </Section>

          <Section id="heat" title="Heat input per pass" csv={heatCsv(f.heatInput)} file="heat-input.csv">
            <div className="lg:col-span-2 space-y-1 text-sm text-graphite-700">
              <p>{IMR_METHOD}. Method: {IMR_SOURCE}.</p>
              <p>
                <span aria-hidden="true">●</span> inside the WPS limit and the control limits · <span aria-hidden="true">▲</span> outside the control limits (look for a cause) ·{" "}
                <span aria-hidden="true">✕</span> above the WPS heat-input limit · dotted line: the WPS limit in force for each pass. Values on the basis the WPS limits (arc energy unless it says ISO).
              </p>
            </div>
            {f.heatInput.length === 0 ? <p className="text-graphite-600">No passes in this range.</p> : null}
            {f.heatInput.map((s) => {
              const c = individualsChart(s.points.map((p) => p.kJPerMm));
              const over = s.points.filter((p) => !p.within).length;
              return (
                <figure key={s.wpsId ?? s.reference} className="min-w-0 rounded-md border-2 border-graphite-200 p-3 lg:col-span-2" data-testid={`heat-${s.reference}`}>
                  <figcaption className="flex flex-wrap items-center justify-between gap-2 font-semibold">
                    <span>{s.reference}</span>
                    {over ? <StatusBadge tone="fail">{over} above the WPS limit</StatusBadge> : <StatusBadge tone="pass">Every pass inside the WPS limit</StatusBadge>}
                  </figcaption>
                  <div className="grid gap-4 lg:grid-cols-2">
                    <HeatChart series={s} />
                    <Table
                      caption={`Individuals chart of ${s.reference}`}
                      testId={`heat-table-${s.reference}`}
                      head={["Figure", "kJ/mm"]}
                      rows={[
                        ["Passes shown", `${s.points.length}${s.total > s.points.length ? ` (latest of ${s.total})` : ""}`],
                        ["Centre line (mean)", fig(c?.mean ?? null, 3)],
                        ["Average moving range", fig(c?.mrBar ?? null, 3)],
                        ["Upper control limit", fig(c?.ucl ?? null, 3)],
                        ["Lower control limit", fig(c?.lcl ?? null, 3)],
                        ["WPS limit (latest pass)", fig(s.points.at(-1)?.limitKJPerMm ?? null, 2)],
                        ["Passes above the WPS limit", over],
                      ]}
                    />
                  </div>
                </figure>
              );
            })}
          </Section>

          <Section id="nc" title="Nonconformances by disposition and age" csv={nonconformanceCsv(f.nonconformances)} file="nonconformances.csv">
            <Table caption="Nonconformances by disposition" testId="nc-table" head={["Disposition", "Count", "Median days", "Longest, days"]} rows={f.nonconformances.byDisposition.map((d) => [dispositionLabel(d.disposition), d.count, fig(d.medianDays), fig(d.maxDays)])} />
            <Table caption="Oldest open nonconformances" testId="nc-open-table" head={["Open", "Job", "Days open"]} rows={f.nonconformances.oldestOpen.map((n) => [`NC ${n.number}: ${n.description.slice(0, 60)}`, <Link key={n.jobId} href={`/jobs/${n.jobId}`} className="underline">{n.jobNumber}</Link>, fig(n.days)])} />
          </Section>

          <Section id="wait" title="Waiting for inspection" csv={waitCsv(f.inspectionWait)} file="inspection-wait.csv">
            <Table
              caption="Time from ready for inspection to inspection"
              testId="wait-table"
              head={["Ready → inspected", "Hours"]}
              rows={[
                ["Rounds inspected", f.inspectionWait.inspected],
                ["Median wait", fig(f.inspectionWait.medianHours)],
                ["90th percentile", fig(f.inspectionWait.p90Hours)],
                ["Longest", fig(f.inspectionWait.maxHours)],
                ["Waiting now", f.inspectionWait.waitingNow],
                ["Oldest waiting now", fig(f.inspectionWait.oldestWaitingHours)],
              ]}
            />
          </Section>

          <Section id="jobs" title="Jobs by state" csv={jobsCsv(f.jobs)} file="jobs-by-state.csv">
            <Table caption="Jobs by state and days in that state" testId="jobs-table" head={["State", "Jobs", "Median days in state", "Longest"]} rows={f.jobs.map((j) => [jobStateLabel(j.state), j.count, fig(j.medianDays), fig(j.maxDays)])} />
          </Section>

          <Section id="quals" title="Welder qualifications lapsing" csv={qualificationsCsv(f.qualifications)} file="qualifications-lapsing.csv">
            <Table
              caption="Qualifications lapsing within 30, 60 and 90 days"
              testId="quals-summary"
              head={["Lapsing", "Qualifications"]}
              rows={[["Already lapsed", f.qualifications.lapsed], ["Within 30 days", f.qualifications.within30], ["Within 60 days", f.qualifications.within60], ["Within 90 days", f.qualifications.within90]]}
            />
            <Table caption="Qualifications lapsing soonest" testId="quals-table" head={["Welder and process", "Lapses on", "Days left"]} rows={f.qualifications.lapsing.map((x) => [`${x.welderName} · ${x.process}`, x.expiresOn, x.daysLeft])} />
          </Section>
          <SafetyNote />
        </div>
      )}
    </>
  );
}

function FilterSelect(props: {
  id: string;
  name: string;
  label: string;
  all: string;
  value: string | undefined;
  error: string | undefined;
  options: { id: string; label: string }[];
  wide?: boolean;
}) {
  return (
    <div>
      <label className="field-label" htmlFor={props.id}>{props.label}</label>
      <select id={props.id} name={props.name} defaultValue={props.value ?? ""} className={`field-input min-h-12 ${props.wide ? "max-w-72" : ""}`}>
        <option value="">{props.all}</option>
        {props.options.map((o) => <option key={o.id} value={o.id}>{o.label}</option>)}
      </select>
      <p className="field-error">{props.error}</p>
    </div>
  );
}
