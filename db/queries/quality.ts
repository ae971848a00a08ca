import "server-only";
// The shop's quality figures, counted by the database: first-pass yield, defects, heat input per pass,
// nonconformances, inspection wait, jobs by state and lapsing qualifications. Every query is bounded by the
// shop and, where records have a date, by the date range, so its cost follows the window asked about, not
// the size of the shop's history (bench/quality.ts).
import { and, eq, sql, type SQL } from "drizzle-orm";
import { membership, procedure, user, welderProcessUse, welderQualification, wps } from "@/db/schema";
import { db } from "@/lib/db";
import { AppError } from "@/lib/errors";
import { MAX_HEAT_POINTS, ratio, type HeatPoint, type QualityFigures } from "@/lib/quality/schema";
import { countOpenNonconformances } from "./jobs-nc";
import { daysLeftSql, expiresOnSql, PROCESS_LAST_USE, QUALIFIED_MEMBER, shopContinuityCode } from "./qualifications";

const DAY_MS = 86_400_000;

// PostgreSQL's JIT compiler switches on above a cost these aggregates reach with a few thousand jobs, and then
// spends a second compiling what runs in milliseconds (measured in bench/quality.ts): off for these reads.
async function run<T extends Record<string, unknown>>(query: SQL): Promise<{ rows: T[] }> {
  return db().transaction(async (tx) => {
    await tx.execute(sql`set local jit = off`);
    const result = await tx.execute(query);
    return { rows: result.rows as T[] };
  });
}

export type QualityFilter = {
  shopId: string;
  from?: string | undefined;
  to?: string | undefined;
  /** a welder's own figures: only joints, passes and jobs they welded */
  welderId?: string | undefined;
  wpsId?: string | undefined;
  procedureId?: string | undefined;
};

type Resolved = { shopId: string; fromTs: string | null; toTs: string | null; welderId: string | null; wpsRef: string | null; wpsId: string | null; procedureId: string | null };

// A filter naming a person, WPS or procedure of another shop finds nothing: answered 404, as for any record.
async function resolve(f: QualityFilter): Promise<Resolved> {
  const [w, p, m] = await Promise.all([
    f.wpsId ? db().select({ reference: wps.reference }).from(wps).where(and(eq(wps.id, f.wpsId), eq(wps.shopId, f.shopId))) : Promise.resolve(null),
    f.procedureId ? db().select({ id: procedure.id }).from(procedure).where(and(eq(procedure.id, f.procedureId), eq(procedure.shopId, f.shopId))) : Promise.resolve(null),
    f.welderId ? db().select({ id: membership.id }).from(membership).where(and(eq(membership.userId, f.welderId), eq(membership.shopId, f.shopId))) : Promise.resolve(null),
  ]);
  if (w && !w[0]) throw new AppError("not_found", "WPS not found.", { wpsId: ["No such WPS in this shop."] });
  if (p && !p[0]) throw new AppError("not_found", "Procedure not found.", { procedureId: ["No such procedure in this shop."] });
  if (m && !m[0]) throw new AppError("not_found", "Person not found.", { welderId: ["No such person in this shop."] });
  return {
    shopId: f.shopId,
    fromTs: f.from ? `${f.from}T00:00:00Z` : null,
    // The end date is included: up to the start of the next day.
    toTs: f.to ? new Date(Date.parse(`${f.to}T00:00:00Z`) + DAY_MS).toISOString() : null,
    welderId: f.welderId ?? null,
    wpsRef: w?.[0]?.reference ?? null,
    wpsId: f.wpsId ?? null,
    procedureId: f.procedureId ?? null,
  };
}

const AND = (cond: boolean, frag: () => SQL): SQL => (cond ? sql` and ${frag()}` : sql``);

function window(r: Resolved, column: SQL): SQL {
  return sql`${AND(r.fromTs !== null, () => sql`${column} >= ${r.fromTs}::timestamptz`)}${AND(r.toTs !== null, () => sql`${column} < ${r.toTs}::timestamptz`)}`;
}

/** The joint's WPS is the one its weld step names (references are kept upper-case in the library). */
const jointRef = (step: string) => sql.raw(`upper(trim(${step}.spec->>'wpsRef'))`);

function jobAndStepFilters(r: Resolved, jobAlias: string, stepAlias: string | null): SQL {
  const job = sql.raw(jobAlias);
  return sql`${AND(r.procedureId !== null, () => sql`${job}.procedure_id = ${r.procedureId}`)}${AND(r.wpsRef !== null && stepAlias !== null, () => sql`${jointRef(stepAlias!)} = ${r.wpsRef}`)}`;
}

/** Joins to the job and its step only when a filter needs them: most reads are one table and its index. */
function filterJoins(r: Resolved, on: { job: string; step: string }): SQL {
  return sql`${r.procedureId !== null ? sql.raw(` join job on job.id = ${on.job}`) : sql``}${r.wpsRef !== null ? sql.raw(` join job_step s on s.id = ${on.step}`) : sql``}`;
}

type Num = number | string | null;
const num = (v: Num): number | null => (v === null || v === undefined ? null : Number(v));
const round = (v: Num, digits = 1): number | null => {
  const n = num(v);
  return n === null ? null : Math.round(n * 10 ** digits) / 10 ** digits;
};

async function firstPassYield(r: Resolved): Promise<QualityFigures["firstPassYield"]> {
  // A joint's first inspection is its lowest round; the window applies to when that inspection was signed.
  // The welders of a joint are those who laid a (not struck out) pass in that first round.
  const rows = await run<{ k: string; id: string | null; name: string | null; inspected: number; accepted: number }>(sql`
    with j as (
      select i.step_id, i.round, i.decision = 'accepted' as ok, ${jointRef("s")} as ref
      from weld_inspection i
      join job_step s on s.id = i.step_id
      ${r.procedureId !== null ? sql`join job on job.id = i.job_id` : sql``}
      where i.shop_id = ${r.shopId}
        and not exists (select 1 from weld_inspection e where e.step_id = i.step_id and e.round < i.round)
        ${window(r, sql`i.inspected_at`)}
        ${jobAndStepFilters(r, "job", "s")}
        ${AND(r.welderId !== null, () => sql`exists (select 1 from weld_pass p where p.step_id = i.step_id and p.round = i.round and p.removed_at is null and p.welder_id = ${r.welderId})`)}
    )
    select 'all' as k, null as id, null as name, count(*)::int as inspected, (count(*) filter (where ok))::int as accepted from j
    union all
    select 'welder', w.welder_id, u.name, count(*)::int, (count(*) filter (where w.ok))::int
    from (select distinct j.step_id, j.ok, p.welder_id from j join weld_pass p on p.step_id = j.step_id and p.round = j.round and p.removed_at is null
          ${r.welderId !== null ? sql`where p.welder_id = ${r.welderId}` : sql``}) w
    join "user" u on u.id = w.welder_id
    group by w.welder_id, u.name
    union all
    select 'wps', w.id::text, j.ref, count(*)::int, (count(*) filter (where j.ok))::int
    from j left join wps w on w.shop_id = ${r.shopId} and w.reference = j.ref
    group by w.id, j.ref`);
  const all = rows.rows.find((x) => x.k === "all");
  const overall = { inspected: all?.inspected ?? 0, acceptedFirst: all?.accepted ?? 0, ratio: ratio(all?.accepted ?? 0, all?.inspected ?? 0) };
  const byWelder = rows.rows
    .filter((x) => x.k === "welder")
    .map((x) => ({ welderId: x.id!, welderName: x.name ?? "", inspected: x.inspected, acceptedFirst: x.accepted, ratio: ratio(x.accepted, x.inspected) }))
    .sort((a, b) => a.welderName.localeCompare(b.welderName));
  const byWps = rows.rows
    .filter((x) => x.k === "wps")
    .map((x) => ({ wpsId: x.id, reference: x.name ?? "", inspected: x.inspected, acceptedFirst: x.accepted, ratio: ratio(x.accepted, x.inspected) }))
    .sort((a, b) => a.reference.localeCompare(b.reference));
  return { overall, byWelder, byWps };
}

async function defects(r: Resolved): Promise<QualityFigures["defects"]> {
  // Every visual-inspection item judged outside its limit counts once, per inspection round.
  const rows = await run<{ criterion: string; count: number }>(sql`
    select it->>'item' as criterion, count(*)::int as count
    from weld_inspection i
    cross join lateral jsonb_array_elements(i.items) it
    ${filterJoins(r, { job: "i.job_id", step: "i.step_id" })}
    where i.shop_id = ${r.shopId} and (it->>'ok')::boolean = false
      ${window(r, sql`i.inspected_at`)}
      ${jobAndStepFilters(r, "job", "s")}
      ${AND(r.welderId !== null, () => sql`exists (select 1 from weld_pass p where p.step_id = i.step_id and p.round = i.round and p.removed_at is null and p.welder_id = ${r.welderId})`)}
    group by 1
    order by 2 desc, 1`);
  return rows.rows.map((x) => ({ criterion: x.criterion, count: x.count }));
}

async function heatInput(r: Resolved): Promise<QualityFigures["heatInput"]> {
  // Each pass on the basis its WPS revision limits (arc energy unless the revision says ISO Q), against that
  // revision's limit; the latest points per WPS, oldest first for the chart.
  const rows = await run<{
    wps_id: string | null; reference: string; at: Date; value: number; limit_kj: number | null; job_number: string; joint_id: string | null;
    pass_number: number; round: number; welder_name: string; total: number;
  }>(sql`
    select x.*, job.number as job_number, s.spec->>'jointId' as joint_id, u.name as welder_name from (
      select r.wps_id, coalesce(w.reference, nullif(p.wps_reference, ''), '(no WPS)') as reference, p.recorded_at as at,
        case when r.heat_input_basis = 'iso-q' then p.heat_input_kj_per_mm else p.arc_energy_kj_per_mm end as value,
        r.heat_input_max_kj_per_mm as limit_kj, p.job_id, p.step_id, p.welder_id, p.pass_number, p.round,
        row_number() over (partition by coalesce(r.wps_id::text, p.wps_reference) order by p.recorded_at desc, p.id) as rn,
        (count(*) over (partition by coalesce(r.wps_id::text, p.wps_reference)))::int as total
      from weld_pass p
      left join wps_revision r on r.id = p.wps_revision_id
      left join wps w on w.id = r.wps_id
      ${r.procedureId !== null ? sql`join job pj on pj.id = p.job_id` : sql``}
      where p.shop_id = ${r.shopId} and p.removed_at is null
        ${window(r, sql`p.recorded_at`)}
        ${AND(r.procedureId !== null, () => sql`pj.procedure_id = ${r.procedureId}`)}
        ${AND(r.wpsId !== null, () => sql`r.wps_id = ${r.wpsId}`)}
        ${AND(r.welderId !== null, () => sql`p.welder_id = ${r.welderId}`)}
    ) x
    join job on job.id = x.job_id
    join job_step s on s.id = x.step_id
    join "user" u on u.id = x.welder_id
    where x.rn <= ${MAX_HEAT_POINTS}
    order by reference, at, pass_number`);
  const series = new Map<string, QualityFigures["heatInput"][number]>();
  for (const x of rows.rows) {
    const key = x.wps_id ?? `ref:${x.reference}`;
    let s = series.get(key);
    if (!s) series.set(key, (s = { wpsId: x.wps_id, reference: x.reference, total: x.total, points: [] }));
    const value = Number(x.value);
    const limit = num(x.limit_kj);
    const point: HeatPoint = {
      at: new Date(x.at).toISOString(),
      kJPerMm: value,
      within: limit === null || value <= limit,
      limitKJPerMm: limit,
      jobNumber: x.job_number,
      jointId: x.joint_id ?? "",
      passNumber: x.pass_number,
      round: x.round,
      welderName: x.welder_name,
    };
    s.points.push(point);
  }
  return [...series.values()];
}

async function nonconformances(r: Resolved): Promise<QualityFigures["nonconformances"]> {
  // Age: raised to decided, or to now while still open. Window: when it was raised.
  const where = sql`
    from nonconformance n
    left join nonconformance_disposition d on d.nonconformance_id = n.id
    join job on job.id = n.job_id
    ${r.wpsRef !== null ? sql`join job_step s on s.id = n.step_id` : sql``}
    where n.shop_id = ${r.shopId}
      ${window(r, sql`n.raised_at`)}
      ${jobAndStepFilters(r, "job", "s")}
      ${AND(r.welderId !== null, () => sql`(exists (select 1 from weld_pass p where p.step_id = n.step_id and p.removed_at is null and p.welder_id = ${r.welderId})
        or exists (select 1 from sign_off so where so.job_id = n.job_id and so.step_id = n.step_id and so.meaning = 'performed' and so.user_id = ${r.welderId}))`)}`;
  const [by, open] = await Promise.all([
    run<{ disposition: string; count: number; median: Num; max: Num }>(sql`
      select coalesce(d.disposition, 'open') as disposition, count(*)::int as count,
        percentile_cont(0.5) within group (order by extract(epoch from coalesce(d.decided_at, now()) - n.raised_at) / 86400) as median,
        max(extract(epoch from coalesce(d.decided_at, now()) - n.raised_at) / 86400) as max
      ${where}
      group by 1 order by 2 desc, 1`),
    run<{ job_id: string; job_number: string; number: number; description: string; raised_at: Date; days: Num }>(sql`
      select n.job_id, job.number as job_number, n.number, n.description, n.raised_at, extract(epoch from now() - n.raised_at) / 86400 as days
      ${where} and d.id is null
      order by n.raised_at, n.id limit 10`),
  ]);
  return {
    byDisposition: by.rows.map((x) => ({ disposition: x.disposition, count: x.count, medianDays: round(x.median), maxDays: round(x.max) })),
    oldestOpen: open.rows.map((x) => ({ jobId: x.job_id, jobNumber: x.job_number, number: x.number, description: x.description, raisedAt: new Date(x.raised_at).toISOString(), days: round(x.days) ?? 0 })),
  };
}

async function inspectionWait(r: Resolved): Promise<QualityFigures["inspectionWait"]> {
  // Ready for inspection = the welder's sign-off of the round; waited = until that round's inspection.
  const [done, waiting] = await Promise.all([
    run<{ n: number; median: Num; p90: Num; max: Num }>(sql`
      select count(*)::int as n, percentile_cont(0.5) within group (order by h) as median, percentile_cont(0.9) within group (order by h) as p90, max(h) as max
      from (
        select extract(epoch from i.inspected_at - so.signed_at) / 3600 as h
        from weld_inspection i
        join sign_off so on so.step_id = i.step_id and so.meaning = 'performed' and coalesce(so.round, 1) = i.round and so.amends_sign_off_id is null
        ${filterJoins(r, { job: "i.job_id", step: "i.step_id" })}
        where i.shop_id = ${r.shopId}
          ${window(r, sql`i.inspected_at`)}
          ${jobAndStepFilters(r, "job", "s")}
          ${AND(r.welderId !== null, () => sql`so.user_id = ${r.welderId}`)}
      ) w`),
    // Waiting now, whatever the dates: rounds signed by their welder on open jobs and not yet inspected.
    run<{ n: number; oldest: Num }>(sql`
      select count(*)::int as n, max(extract(epoch from now() - so.signed_at) / 3600) as oldest
      from job
      join sign_off so on so.job_id = job.id and so.meaning = 'performed' and so.amends_sign_off_id is null
      join job_step s on s.id = so.step_id and s.kind = 'weld'
      where job.shop_id = ${r.shopId} and job.status not in ('released', 'void')
        and not exists (select 1 from weld_inspection i where i.step_id = s.id and i.round = coalesce(so.round, 1))
        and coalesce(so.round, 1) = 1 + (select count(*) from weld_inspection i where i.step_id = s.id and i.decision = 'rejected')
        ${jobAndStepFilters(r, "job", "s")}
        ${AND(r.welderId !== null, () => sql`so.user_id = ${r.welderId}`)}`),
  ]);
  const d = done.rows[0];
  const w = waiting.rows[0];
  return {
    inspected: d?.n ?? 0,
    medianHours: round(d?.median ?? null),
    p90Hours: round(d?.p90 ?? null),
    maxHours: round(d?.max ?? null),
    waitingNow: w?.n ?? 0,
    oldestWaitingHours: round(w?.oldest ?? null),
  };
}

const OPEN_STATES = sql.raw(`('planned','in_progress','on_hold','ready_for_release')`);

async function jobsByState(r: Resolved): Promise<QualityFigures["jobs"]> {
  // Jobs open at some time in the window: made before its end, and not closed before its start. Days in the
  // state: since the last recorded change of state (or since the job was made), for jobs still open.
  const rows = await run<{ status: string; count: number; median: Num; max: Num }>(sql`
    select status, count(*)::int as count, percentile_cont(0.5) within group (order by days) as median, max(days) as max
    from (
      select job.status,
        case when job.status in ${OPEN_STATES} then extract(epoch from now() - coalesce(
          (select max(a.at) from job_activity a where a.job_id = job.id and a.action = 'job.state'), job.created_at)) / 86400 end as days
      from job
      where job.shop_id = ${r.shopId}
        ${AND(r.toTs !== null, () => sql`job.created_at < ${r.toTs}::timestamptz`)}
        ${AND(r.fromTs !== null, () => sql`coalesce(job.released_at, job.voided_at, 'infinity'::timestamptz) >= ${r.fromTs}::timestamptz`)}
        ${AND(r.procedureId !== null, () => sql`job.procedure_id = ${r.procedureId}`)}
        ${AND(r.wpsRef !== null, () => sql`exists (select 1 from job_step s where s.shop_id = job.shop_id and s.job_id = job.id and s.kind = 'weld' and ${jointRef("s")} = ${r.wpsRef})`)}
        ${AND(r.welderId !== null, () => sql`(exists (select 1 from job_assignment a where a.job_id = job.id and a.user_id = ${r.welderId} and a.role = 'welder')
          or exists (select 1 from weld_pass p where p.job_id = job.id and p.welder_id = ${r.welderId} and p.removed_at is null))`)}
    ) x
    group by status`);
  const order = ["planned", "in_progress", "on_hold", "ready_for_release", "released", "void"];
  return rows.rows
    .map((x) => ({ state: x.status, count: x.count, medianDays: round(x.median), maxDays: round(x.max) }))
    .sort((a, b) => order.indexOf(a.state) - order.indexOf(b.state));
}

async function lapsingQualifications(r: Resolved, today: string): Promise<QualityFigures["qualifications"]> {
  const code = await shopContinuityCode(r.shopId);
  const daysLeft = daysLeftSql(code, today);
  const filters: SQL[] = [eq(welderQualification.shopId, r.shopId), eq(membership.active, true), sql`'welder' = any(${membership.roles})`, sql`${daysLeft} <= 90`];
  if (r.welderId) filters.push(eq(welderQualification.welderUserId, r.welderId));
  const rows = await db()
    .select({
      welderId: welderQualification.welderUserId,
      welderName: user.name,
      process: welderQualification.process,
      expiresOn: sql<string>`to_char(${expiresOnSql(code, today)}, 'YYYY-MM-DD')`,
      daysLeft: sql<number>`(${daysLeft})::int`,
    })
    .from(welderQualification)
    .innerJoin(user, eq(user.id, welderQualification.welderUserId))
    .innerJoin(membership, QUALIFIED_MEMBER)
    .leftJoin(welderProcessUse, PROCESS_LAST_USE)
    .where(and(...filters))
    .orderBy(sql`${daysLeft}`, user.name);
  const lapsing = rows.filter((x) => x.daysLeft > 0);
  return {
    lapsed: rows.length - lapsing.length,
    within30: lapsing.filter((x) => x.daysLeft <= 30).length,
    within60: lapsing.filter((x) => x.daysLeft <= 60).length,
    within90: lapsing.length,
    lapsing: lapsing.map((x) => ({ ...x, daysLeft: Number(x.daysLeft) })),
  };
}

/** The figures for one shop (and, with welderId, one welder's own work), counted in SQL. */
export async function qualityFigures(filter: QualityFilter, opts: { today?: string } = {}): Promise<QualityFigures> {
  const r = await resolve(filter);
  const today = opts.today ?? new Date().toISOString().slice(0, 10);
  const [fpy, def, heat, nc, wait, jobs, quals] = await Promise.all([
    firstPassYield(r),
    defects(r),
    heatInput(r),
    nonconformances(r),
    inspectionWait(r),
    jobsByState(r),
    lapsingQualifications(r, today),
  ]);
  return {
    range: { from: filter.from ?? null, to: filter.to ?? null },
    scope: filter.welderId ? "welder" : "shop",
    firstPassYield: fpy,
    defects: def,
    heatInput: heat,
    nonconformances: nc,
    inspectionWait: wait,
    jobs,
    qualifications: quals,
  };
}

/** The lead's desk tiles: first-pass yield, open nonconformances and joints waiting, without the rest. */
export async function qualityTiles(shopId: string, from: string, to: string) {
  const r = await resolve({ shopId, from, to });
  const [fpy, wait, open] = await Promise.all([firstPassYield(r), inspectionWait(r), countOpenNonconformances(shopId)]);
  return { firstPassYield: fpy.overall, waitingNow: wait.waitingNow, oldestWaitingHours: wait.oldestWaitingHours, openNonconformances: open };
}

/** What the filter form offers: the shop's welders, WPSs and procedures. */
export async function qualityFilterOptions(shopId: string) {
  const [welders, wpsList, procedures] = await Promise.all([
    db()
      .select({ id: user.id, name: user.name })
      .from(membership)
      .innerJoin(user, eq(user.id, membership.userId))
      .where(and(eq(membership.shopId, shopId), sql`'welder' = any(${membership.roles})`))
      .orderBy(user.name),
    db().select({ id: wps.id, reference: wps.reference }).from(wps).where(eq(wps.shopId, shopId)).orderBy(wps.reference),
    db().select({ id: procedure.id, title: procedure.title }).from(procedure).where(eq(procedure.shopId, shopId)).orderBy(procedure.title),
  ]);
  return { welders, wps: wpsList, procedures };
}
