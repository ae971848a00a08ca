// The welder's tablet handed to an inspector for one sign-off, over HTTP: the server signs as the inspector
// only with that inspector's PIN and role, keeps separation of duties for them, records who held the
// tablet and answers with the holder's view. Also: a raised nonconformance is mailed to the shop's leads.
import { simpleParser } from "mailparser";
import { beforeAll, describe, expect, it } from "vitest";
import { gmawWeldStep, insertPublishedProcedure, jobBody, SOUND_FILLET } from "../fixtures/jobs/procedure";
import { ensureQualified, uploadFixture } from "./jobs-support";
import { api, session, waitFor, withDb, type Session } from "./support";

const PIN = "2468";
type Rec = Record<string, any>;

let lead: Session;
let welder: Session; // welder only
let welder2: Session; // welder and inspector
let version: string;
const member: Record<string, { membershipId: string; userId: string; legalName: string }> = {};

const CONTENT = {
  sections: [
    {
      key: "weld",
      title: "Weld and inspect",
      steps: [
        gmawWeldStep({}),
        { key: "h-after", kind: "hold", title: "Hold after W1", instructions: "", signedBy: "inspector", photos: { required: false, min: 0 }, inspection: "W1 accepted at visual inspection." },
      ],
    },
  ],
};

beforeAll(async () => {
  [lead, welder, welder2] = await Promise.all([session("lead@irongully.example"), session("welder@irongully.example"), session("welder2@irongully.example")]);
  version = await withDb((c) => insertPublishedProcedure(c, { shopSlug: "iron-gully", ownerEmail: "lead@irongully.example", title: "Hand-over", content: CONTENT }));
  const rows = await withDb(
    async (c) =>
      (
        await c.query(
          `select m.id, u.id as user_id, u.email, m.legal_name from membership m join "user" u on u.id = m.user_id join shop s on s.id = m.shop_id where s.slug = 'iron-gully'`,
        )
      ).rows as { id: string; user_id: string; email: string; legal_name: string }[],
  );
  for (const r of rows) member[r.email.split("@")[0]!] = { membershipId: r.id, userId: r.user_id, legalName: r.legal_name };
  await ensureQualified(lead, "welder2@irongully.example", "GMAW");
});

const step = (rec: Rec, key: string) => rec.steps.find((s: Rec) => s.key === key);
const record = async (jobId: string, who: Session = lead): Promise<Rec> => (await api(`/api/jobs/${jobId}`, { session: who })).json;

async function weldedJob(by: Session) {
  const r = await api("/api/jobs", { session: lead, body: jobBody(version) });
  expect(r.status, r.text).toBe(201);
  const jobId = r.json.job.id as string;
  const w = step(await record(jobId), "w-1");
  const p = await api(`/api/jobs/${jobId}/steps/${w.id}/passes`, { session: by, body: { clientKey: crypto.randomUUID(), volts: 19, amps: 140, travelSpeed: { value: 300, unit: "mm/min" }, preheatC: 20, fillerLot: "LOT 9-1" } });
  expect(p.status, p.text).toBe(201);
  const signed = await api(`/api/jobs/${jobId}/steps/${w.id}/sign`, { session: by, body: { pin: PIN, baseVersion: step(p.json.record, "w-1").version } });
  expect(signed.status, signed.text).toBe(201);
  return jobId;
}

async function inspectOnTablet(holder: Session, jobId: string, handOver: string, pin = PIN) {
  const up = await uploadFixture(holder, jobId);
  expect(up.status, up.text).toBe(201);
  const w = step(await record(jobId, holder), "w-1");
  return api(`/api/jobs/${jobId}/steps/${w.id}/inspections`, {
    session: holder,
    body: { criteria: "aws-d1.1-static", observations: SOUND_FILLET, decision: "accepted", notes: "", photoIds: [up.json.photoId], pin, handOver: { membershipId: handOver } },
  });
}

function signHold(holder: Session, jobId: string, rec: Rec, membershipId: string, pin = PIN) {
  const h = step(rec, "h-after");
  return api(`/api/jobs/${jobId}/steps/${h.id}/sign`, { session: holder, body: { pin, baseVersion: h.version, handOver: { membershipId } } });
}

describe("hand-over of the tablet to an inspector", () => {
  it("lists the shop's other inspectors with a PIN, never the holder or a non-inspector", async () => {
    const jobId = await weldedJob(welder);
    const list = await api(`/api/jobs/${jobId}/hand-over`, { session: welder });
    expect(list.status).toBe(200);
    const ids = list.json.inspectors.map((p: Rec) => p.membershipId);
    expect(ids).toContain(member.inspector!.membershipId);
    expect(ids).toContain(member.welder2!.membershipId);
    expect(ids).not.toContain(member.welder!.membershipId);
    expect(ids).not.toContain(member.lead!.membershipId);
    const asWelder2 = await api(`/api/jobs/${jobId}/hand-over`, { session: welder2 });
    expect(asWelder2.json.inspectors.map((p: Rec) => p.membershipId)).not.toContain(member.welder2!.membershipId);
  });

  it("refuses a wrong PIN, a non-inspector and an inspector who welded before the hold; signs under the inspector and records who held the tablet", async () => {
    // welder2 (also an inspector) welds W1; the inspector inspects it on the welder2's tablet.
    const jobId = await weldedJob(welder2);
    const inspected = await inspectOnTablet(welder2, jobId, member.inspector!.membershipId);
    expect(inspected.status, inspected.text).toBe(201);
    const round1 = step(inspected.json.record, "w-1").joint.rounds[0];
    expect(round1.inspection.inspector.id).toBe(member.inspector!.userId);
    // The answer is the holder's view of the record.
    expect(inspected.json.record.viewer.userId).toBe(member.welder2!.userId);

    const rec = await record(jobId, welder);
    // Wrong PIN of the inspector: refused, nothing signed.
    const wrong = await signHold(welder, jobId, rec, member.inspector!.membershipId, "9999");
    expect(wrong.status).toBe(403);
    expect(wrong.json.error.message).toMatch(/Wrong PIN/);
    // The lead is no inspector: refused whatever the PIN.
    const notInspector = await signHold(welder, jobId, rec, member.lead!.membershipId);
    expect(notInspector.status).toBe(403);
    expect(notInspector.json.error.message).toMatch(/is not an inspector in this shop/);
    // welder2 holds the inspector role but welded before the hold point: nobody inspects their own weld.
    const ownWeld = await signHold(welder, jobId, rec, member.welder2!.membershipId);
    expect(ownWeld.status).toBe(403);
    expect(ownWeld.json.error.message).toMatch(/You recorded a weld pass before this hold point/);
    // Handing over to yourself is not a hand-over.
    expect((await signHold(welder2, jobId, rec, member.welder2!.membershipId)).status).toBe(400);
    // A membership of no shop member is 404.
    expect((await signHold(welder, jobId, rec, crypto.randomUUID())).status).toBe(404);
    expect(step(await record(jobId), "h-after").signed).toBe(false);

    const ok = await signHold(welder, jobId, rec, member.inspector!.membershipId);
    expect(ok.status, ok.text).toBe(201);
    const hold = step(ok.json.record, "h-after");
    expect(hold.signed).toBe(true);
    expect(hold.signOffs[0]).toMatchObject({ userId: member.inspector!.userId, printedName: member.inspector!.legalName, role: "inspector", meaning: "inspected" });
    expect(ok.json.record.viewer.userId).toBe(member.welder!.userId);
    const held = await withDb(async (c) => (await c.query(`select actor_id, detail from job_activity where job_id = $1 and action = 'step.signed' order by at desc limit 1`, [jobId])).rows[0]);
    expect(held.actor_id).toBe(member.inspector!.userId);
    expect(held.detail.handOver).toEqual({ tabletHeldBy: member.welder!.userId, tabletHeldByName: member.welder!.legalName });

    // The hand-over ended with that sign-off: a later sign-off without one is the holder's own (a welder's: refused at an inspector's step).
    const again = await api(`/api/jobs/${jobId}/steps/${hold.id}/sign`, { session: welder, body: { pin: PIN, baseVersion: hold.version } });
    expect(again.status).toBe(409);
  });

  it("needs a chosen inspector's id that is a UUID", async () => {
    const jobId = await weldedJob(welder);
    const w = step(await record(jobId), "w-1");
    const bad = await api(`/api/jobs/${jobId}/steps/${w.id}/inspections`, {
      session: welder,
      body: { criteria: "aws-d1.1-static", observations: SOUND_FILLET, decision: "accepted", notes: "", photoIds: [crypto.randomUUID()], pin: PIN, handOver: { membershipId: "ines" } },
    });
    expect(bad.status).toBe(400);
    expect(bad.json.error.fields["handOver.membershipId"] ?? bad.json.error.fields.handOver).toBeTruthy();
  });
});

describe("a nonconformance is mailed to the shop's leads", () => {
  it("names the job, the step, what is wrong and the proposed disposition", async () => {
    const r = await api("/api/jobs", { session: lead, body: jobBody(version) });
    const jobId = r.json.job.id as string;
    const w = step(await record(jobId), "w-1");
    const raised = await api(`/api/jobs/${jobId}/nonconformances`, { session: welder, body: { stepId: w.id, description: "Bracket tacked 3 mm off its mark.", proposedDisposition: "rework", photoIds: [] } });
    expect(raised.status, raised.text).toBe(201);
    const mail = await waitFor(async () =>
      (await withDb(async (c) => (await c.query("select raw from caught_mail where to_address like $1 and subject = $2", ["%lead@irongully.example%", `NC-1 raised on ${r.json.job.number}`])).rows))[0],
    );
    const parsed = await simpleParser(mail.raw);
    expect(parsed.text).toContain(`raised NC-1 on job ${r.json.job.number}`);
    expect(parsed.text).toContain("Weld joint W1");
    expect(parsed.text).toContain("What is wrong: Bracket tacked 3 mm off its mark.");
    expect(parsed.text).toContain("Proposed disposition: Rework");
    expect(parsed.html).toContain("Open the step");
    // The welder who raised it is no lead and gets no copy.
    const toWelder = await withDb(async (c) => (await c.query("select 1 from caught_mail where to_address like $1 and subject = $2", ["%welder@irongully.example%", `NC-1 raised on ${r.json.job.number}`])).rows);
    expect(toWelder).toEqual([]);
  });
});
