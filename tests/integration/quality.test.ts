// GET /api/quality over HTTP against the demo shop: the figures equal counts made directly in SQL here (written
// independently of db/queries/quality.ts), a welder gets only their own figures, another shop gets none.
import { beforeAll, describe, expect, it } from "vitest";
import { api, session, withDb, type Session } from "./support";

type Rec = Record<string, any>;
// The widest range the API allows (ten years) around the demo, whose work is all from the last days.
const ALL_TIME = "from=2020-01-01&to=2029-12-31";

let lead: Session;
let welder: Session;
let otherLead: Session;
let shopId: string;
let welderId: string;
let leadId: string;

beforeAll(async () => {
  [lead, welder, otherLead] = await Promise.all([session("lead@irongully.example"), session("welder@irongully.example"), session("lead@saltpan.example")]);
  await withDb(async (c) => {
    shopId = (await c.query("select id from shop where slug = 'iron-gully'")).rows[0].id;
    welderId = (await c.query(`select id from "user" where email = 'welder@irongully.example'`)).rows[0].id;
    leadId = (await c.query(`select id from "user" where email = 'lead@irongully.example'`)).rows[0].id;
  });
});

/** Joints inspected at least once, and those whose lowest-round inspection accepted them. */
async function jointCounts(welder?: string): Promise<{ inspected: number; acceptedFirst: number }> {
  return withDb(async (c) => {
    const r = await c.query(
      `select count(*)::int as inspected, count(*) filter (where first.decision = 'accepted')::int as accepted
       from (select distinct on (step_id) step_id, round, decision from weld_inspection where shop_id = $1 order by step_id, round) first
       where $2::text is null or first.step_id in (select step_id from weld_pass where welder_id = $2 and round = first.round and removed_at is null)`,
      [shopId, welder ?? null],
    );
    return { inspected: r.rows[0].inspected, acceptedFirst: r.rows[0].accepted };
  });
}

describe("GET /api/quality as the lead", () => {
  let body: Rec;
  beforeAll(async () => {
    const res = await api(`/api/quality?${ALL_TIME}`, { session: lead });
    expect(res.status).toBe(200);
    body = res.json;
  });

  it("counts inspected and first-time-accepted joints as SQL does", async () => {
    const sqlCounts = await jointCounts();
    expect(sqlCounts.inspected).toBeGreaterThan(0);
    expect(body.scope).toBe("shop");
    expect(body.firstPassYield.overall).toEqual({ ...sqlCounts, ratio: sqlCounts.acceptedFirst / sqlCounts.inspected });
    // The demo's rejections: W2 of one released job (repaired, then accepted) and W3 of an open job.
    expect(sqlCounts.acceptedFirst).toBeLessThan(sqlCounts.inspected);
    const sumWps = body.firstPassYield.byWps.reduce((a: number, w: Rec) => a + w.inspected, 0);
    expect(sumWps).toBe(sqlCounts.inspected);
    const mine = body.firstPassYield.byWelder.find((w: Rec) => w.welderId === welderId);
    expect(mine).toMatchObject(await jointCounts(welderId));
  });

  it("lists the seeded undercut rejection among the defects, with its count", async () => {
    const undercut = await withDb(async (c) =>
      (await c.query(
        `select count(*)::int as n from weld_inspection i, jsonb_array_elements(i.items) it where i.shop_id = $1 and it->>'item' = 'undercut' and it->>'ok' = 'false'`,
        [shopId],
      )).rows[0].n as number,
    );
    expect(undercut).toBeGreaterThanOrEqual(1);
    expect(body.defects).toContainEqual({ criterion: "undercut", count: undercut });
    const counts = body.defects.map((d: Rec) => d.count);
    expect(counts).toEqual([...counts].sort((a: number, b: number) => b - a));
  });

  it("has heat-input points for each WPS used, with the WPS limit and whether each pass is within it", async () => {
    const used = await withDb(async (c) =>
      (await c.query(
        `select w.reference, count(*)::int as n from weld_pass p join wps_revision r on r.id = p.wps_revision_id join wps w on w.id = r.wps_id
         where p.shop_id = $1 and p.removed_at is null group by w.reference order by w.reference`,
        [shopId],
      )).rows as { reference: string; n: number }[],
    );
    expect(used.length).toBeGreaterThan(0);
    for (const u of used) {
      const s = body.heatInput.find((x: Rec) => x.reference === u.reference);
      expect(s, u.reference).toBeDefined();
      expect(s.total).toBe(u.n);
      expect(s.points.length).toBe(Math.min(u.n, 500));
      for (const p of s.points) {
        expect(typeof p.kJPerMm).toBe("number");
        expect(p.within).toBe(p.limitKJPerMm === null || p.kJPerMm <= p.limitKJPerMm);
      }
    }
  });

  it("answers nonconformances, inspection wait, jobs by state and lapsing qualifications", async () => {
    const jobs = await withDb(async (c) => (await c.query(`select count(*)::int as n from job where shop_id = $1`, [shopId])).rows[0].n as number);
    expect(body.jobs.reduce((a: number, j: Rec) => a + j.count, 0)).toBe(jobs);
    const open = body.nonconformances.byDisposition.find((d: Rec) => d.disposition === "open");
    expect(open?.count ?? 0).toBeGreaterThanOrEqual(1); // the demo's surface-temperature nonconformance
    expect(body.inspectionWait.inspected).toBeGreaterThan(0);
    expect(body.inspectionWait.medianHours).toBeGreaterThanOrEqual(0);
    expect(body.qualifications.within30).toBeGreaterThanOrEqual(1); // the demo's lapsing qualification
  });

  it("without dates counts the last 90 days; the demo's work is all inside them", async () => {
    const res = await api("/api/quality", { session: lead });
    expect(res.status).toBe(200);
    expect(res.json.range.to).toBe(new Date().toISOString().slice(0, 10));
    expect(res.json.firstPassYield.overall.inspected).toBe(body.firstPassYield.overall.inspected);
  });

  it("a date range before any work counts nothing", async () => {
    const res = await api("/api/quality?from=2001-01-01&to=2001-12-31", { session: lead });
    expect(res.json.firstPassYield.overall).toEqual({ inspected: 0, acceptedFirst: 0, ratio: null });
    expect(res.json.heatInput).toEqual([]);
  });

  it("refuses bad filters with a 400 naming each field", async () => {
    const res = await api("/api/quality?from=2026-13-01&wpsId=nope&to=x", { session: lead });
    expect(res.status).toBe(400);
    expect(Object.keys(res.json.error.fields)).toEqual(expect.arrayContaining(["from", "to", "wpsId"]));
    const backwards = await api("/api/quality?from=2026-03-01&to=2026-01-01", { session: lead });
    expect(backwards.status).toBe(400);
    expect(backwards.json.error.fields.to).toBeDefined();
  });
});

describe("scope", () => {
  it("a welder gets only their own figures, and may not ask for another's", async () => {
    const res = await api(`/api/quality?${ALL_TIME}`, { session: welder });
    expect(res.status).toBe(200);
    expect(res.json.scope).toBe("welder");
    const own = await jointCounts(welderId);
    expect(res.json.firstPassYield.overall).toMatchObject(own);
    expect(res.json.firstPassYield.byWelder.map((w: Rec) => w.welderId)).toEqual(own.inspected ? [welderId] : []);
    const name = await withDb(async (c) => (await c.query(`select name from "user" where id = $1`, [welderId])).rows[0].name as string);
    for (const s of res.json.heatInput) for (const p of s.points) expect(p.welderName).toBe(name);
    const other = await api(`/api/quality?welderId=${leadId}`, { session: welder });
    expect(other.status).toBe(403);
  });

  it("another shop's lead counts none of these jobs, and cannot name this shop's welder", async () => {
    const res = await api(`/api/quality?${ALL_TIME}`, { session: otherLead });
    expect(res.status).toBe(200);
    const b = res.json;
    expect(b.firstPassYield.overall.inspected).toBe(0);
    expect(b.firstPassYield.byWelder).toEqual([]);
    expect(b.defects).toEqual([]);
    expect(b.heatInput).toEqual([]);
    expect(b.nonconformances.byDisposition).toEqual([]);
    const theirJobs = await withDb(async (c) => (await c.query(`select count(*)::int as n from job j join shop s on s.id = j.shop_id where s.slug = 'saltpan'`)).rows[0].n as number);
    expect(b.jobs.reduce((a: number, j: Rec) => a + j.count, 0)).toBe(theirJobs);
    expect(b.qualifications.lapsing.every((q: Rec) => q.welderId !== welderId)).toBe(true);
    expect((await api(`/api/quality?welderId=${welderId}`, { session: otherLead })).status).toBe(404);
  });

  it("signed out is 401", async () => {
    expect((await api("/api/quality")).status).toBe(401);
  });
});
