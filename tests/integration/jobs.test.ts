import { beforeAll, describe, expect, it } from "vitest";
import { recordEntryFor } from "@/lib/records/entry";
import { contentHash, verifyChain } from "@/lib/seal";
import { vinCheckDigit } from "@/lib/vin";
import { GEOMETRY_INPUT, insertPublishedProcedure, jobBody, MEASURING_PROCEDURE_CONTENT, SHORT_PROCEDURE_CONTENT, SOUND_FILLET, TEST_PROCEDURE_CONTENT } from "../fixtures/jobs/procedure";
import { ensureQualified, uploadFixture } from "./jobs-support";
import { api, session, signIn, waitFor, withDb, type Session } from "./support";

const PIN = "2468";
type Rec = Record<string, any>;

let lead: Session;
let welder: Session;
let welder2: Session; // welder and inspector
let inspector: Session;
let otherLead: Session;
let versionId: string;
let shortVersionId: string;
let measuringVersionId: string;

beforeAll(async () => {
  [lead, welder, welder2, inspector, otherLead] = await Promise.all([
    session("lead@irongully.example"),
    session("welder@irongully.example"),
    session("welder2@irongully.example"),
    session("inspector@irongully.example"),
    session("lead@saltpan.example"),
  ]);
  [versionId, shortVersionId, measuringVersionId] = await withDb(async (c) => [
    await insertPublishedProcedure(c, { shopSlug: "iron-gully", ownerEmail: "lead@irongully.example", title: "Jobs test procedure", content: TEST_PROCEDURE_CONTENT }),
    await insertPublishedProcedure(c, { shopSlug: "iron-gully", ownerEmail: "lead@irongully.example", title: "Jobs short procedure", content: SHORT_PROCEDURE_CONTENT }),
    await insertPublishedProcedure(c, { shopSlug: "iron-gully", ownerEmail: "lead@irongully.example", title: "Jobs measuring procedure", content: MEASURING_PROCEDURE_CONTENT }),
  ]);
});

async function newJob(version = versionId, over: Record<string, unknown> = {}): Promise<Rec> {
  const r = await api("/api/jobs", { session: lead, body: jobBody(version, over) });
  expect(r.status, r.text).toBe(201);
  return (await api(`/api/jobs/${r.json.job.id}`, { session: lead })).json;
}
const step = (rec: Rec, key: string) => rec.steps.find((s: Rec) => s.key === key);
async function record(jobId: string, who = lead): Promise<Rec> {
  return (await api(`/api/jobs/${jobId}`, { session: who })).json;
}
async function save(who: Session, rec: Rec, key: string, value: Rec, baseVersion?: number) {
  const s = step(rec, key);
  return api(`/api/jobs/${rec.job.id}/steps/${s.id}/value`, { session: who, method: "PUT", body: { baseVersion: baseVersion ?? s.version, value } });
}
async function sign(who: Session, jobId: string, key: string, pin = PIN) {
  const s = step(await record(jobId, who), key);
  return api(`/api/jobs/${jobId}/steps/${s.id}/sign`, { session: who, body: { pin, baseVersion: s.version } });
}
async function saveAndSign(who: Session, jobId: string, key: string, value: Rec) {
  const saved = await save(who, await record(jobId, who), key, value);
  expect(saved.status, saved.text).toBe(200);
  const signed = await sign(who, jobId, key);
  expect(signed.status, signed.text).toBe(201);
  return signed.json.record as Rec;
}
async function prepDone(jobId: string) {
  await saveAndSign(welder, jobId, "c-clean", { confirmed: true });
  await saveAndSign(welder, jobId, "c-hot", { acknowledged: ["ppe", "fire-watch"] });
  await saveAndSign(welder, jobId, "m-gap", { reading: 100.3, unit: "mm" });
  const rec = await record(jobId);
  const up = await uploadFixture(welder, jobId, { stepId: step(rec, "p-fit").id });
  expect(up.status).toBe(201);
  expect((await sign(welder, jobId, "p-fit")).status).toBe(201);
}
async function pass(who: Session, rec: Rec, key: string, over: Rec = {}) {
  return api(`/api/jobs/${rec.job.id}/steps/${step(rec, key).id}/passes`, {
    session: who,
    // Inside the seeded GUS-GMAW-02 (17–21 V, 110–165 A, 250–450 mm/min, ≤ 1.2 kJ/mm).
    body: { clientKey: crypto.randomUUID(), volts: 19, amps: 140, travelSpeed: { value: 300, unit: "mm/min" }, preheatC: 20, interpassC: 120, fillerLot: "LOT-77", ...over },
  });
}

async function acceptJoint(who: Session, jobId: string, key: string) {
  const up = await uploadFixture(who, jobId);
  expect(up.status, up.text).toBe(201);
  const s = step(await record(jobId, who), key);
  const r = await api(`/api/jobs/${jobId}/steps/${s.id}/inspections`, { session: who, body: { criteria: "aws-d1.1-static", observations: SOUND_FILLET, decision: "accepted", notes: "", photoIds: [up.json.photoId], pin: PIN } });
  expect(r.status, r.text).toBe(201);
  return r.json.record as Rec;
}

describe("jobs: creation, checklist, list", () => {
  it("a lead creates a job: numbered, checklist copied from the pinned version, VIN mismatch warned but saved", async () => {
    const r = await api("/api/jobs", { session: lead, body: jobBody(versionId, { vin: "1M8GDM9A5KP042788" }) });
    expect(r.status).toBe(201);
    expect(r.json.job.number).toMatch(/^GJ-\d{4}-\d{4,}$/);
    expect(r.json.vin.checkDigitOk).toBe(false);
    expect(r.json.vin.warning).toMatch(/Check digit/);
    const rec = await record(r.json.job.id);
    expect(rec.job.status).toBe("planned");
    expect(rec.job.vinWarning).toMatch(/Check digit/);
    expect(rec.job.procedureVersionId).toBe(versionId);
    expect(rec.steps.map((s: Rec) => s.key)).toEqual(TEST_PROCEDURE_CONTENT.sections.flatMap((s) => s.steps.map((t) => t.key)));
    expect(rec.steps.map((s: Rec) => s.kind)).toEqual(["check", "caution", "measure", "photo", "weld", "hold", "torque", "geometry", "coating", "hold"]);
    // Steps after the first hold point start locked.
    expect(step(rec, "t-nut").lockedBy.title).toBe("Visual inspection of W1");
    expect(step(rec, "w-1").lockedBy).toBeNull();
  });

  it("another shop's job answers 404; a welder may not create jobs; bad input names its fields", async () => {
    const rec = await newJob();
    expect((await api(`/api/jobs/${rec.job.id}`, { session: otherLead })).status).toBe(404);
    expect((await api(`/api/jobs/${rec.job.id}/steps/${step(rec, "c-clean").id}/value`, { session: otherLead, method: "PUT", body: { baseVersion: 0, value: { confirmed: true } } })).status).toBe(404);
    expect((await api("/api/jobs/not-a-uuid", { session: lead })).status).toBe(404);
    expect((await api("/api/jobs", { session: welder, body: jobBody(versionId) })).status).toBe(403);
    const bad = await api("/api/jobs", { session: lead, body: { ...jobBody(versionId), customerName: "", customerEmail: "nope", procedureVersionId: "x" } });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.json.error.fields)).toEqual(expect.arrayContaining(["customerName", "customerEmail", "procedureVersionId"]));
  });

  it("the list searches number, VIN, axle tag and customer, filters by state, and pages in the database", async () => {
    const serial = String(Date.now()).slice(-6);
    const body = `ZZGMP41D?BK${serial}`;
    const vin = body.replace("?", vinCheckDigit(body)!);
    const a = await newJob(versionId, { customerName: `Quokka Flats Grazing ${serial}`, vin });
    const b = await newJob();
    const hits = async (q: string) => (await api(`/api/jobs?q=${encodeURIComponent(q)}&pageSize=100`, { session: lead })).json.jobs.map((j: Rec) => j.id);
    expect(await hits(a.job.number)).toEqual([a.job.id]);
    expect(await hits(a.job.axleTag.toLowerCase())).toEqual([a.job.id]);
    expect(await hits(`quokka flats grazing ${serial}`)).toEqual([a.job.id]);
    expect(await hits(`BK${serial}`)).toEqual([a.job.id]);
    const paged = await api(`/api/jobs?status=planned&pageSize=1&sort=number&dir=desc`, { session: lead });
    expect(paged.json.jobs).toHaveLength(1);
    expect(paged.json.jobs[0].id).toBe(b.job.id);
    expect(paged.json.total).toBeGreaterThanOrEqual(2);
    const second = await api(`/api/jobs?status=planned&pageSize=1&page=2&sort=number&dir=desc`, { session: lead });
    expect(second.json.jobs[0].id).toBe(a.job.id);
    const theirs = await api(`/api/jobs?q=${a.job.number}`, { session: otherLead });
    expect(theirs.json.total).toBe(0);
  });

  it("the list finds a job by the name of the welder on it", async () => {
    const me = (await api("/api/me", { session: welder })).json;
    const withWelder = await newJob(versionId, { welderIds: [me.user.id] });
    const without = await newJob();
    const surname = String(me.user.name).split(" ").at(-1)!.toLowerCase();
    const found = await api(`/api/jobs?q=${encodeURIComponent(surname)}&status=planned&pageSize=100&sort=number&dir=desc`, { session: lead });
    const ids = found.json.jobs.map((j: Rec) => j.id);
    expect(ids).toContain(withWelder.job.id);
    expect(ids).not.toContain(without.job.id);
    const theirs = await api(`/api/jobs?q=${encodeURIComponent(surname)}`, { session: otherLead });
    expect(theirs.json.jobs.map((j: Rec) => j.id)).not.toContain(withWelder.job.id);
  });
});

describe("sign-offs", () => {
  it("a sign-off records printed name, role, meaning, server time and the content hash; the job starts", async () => {
    const rec = await newJob();
    const before = Date.now();
    const after = await saveAndSign(welder, rec.job.id, "m-gap", { reading: 100.4, unit: "mm" });
    const s = step(after, "m-gap");
    expect(s.signed).toBe(true);
    expect(s.signOffs).toHaveLength(1);
    const so = s.signOffs[0];
    expect(so).toMatchObject({ printedName: "Mick Tamsin", role: "welder", meaning: "performed", amendsSignOffId: null });
    expect(new Date(so.signedAt).getTime()).toBeGreaterThanOrEqual(before - 5000);
    expect(after.job.status).toBe("in_progress");
    const stored = await withDb(async (c) => (await c.query("select content, content_hash from sign_off where id = $1", [so.id])).rows[0]);
    expect(stored.content_hash).toBe(so.contentHash);
    expect(contentHash(stored.content)).toBe(so.contentHash);
    expect(stored.content.value).toEqual({ reading: 100.4, unit: "mm" });
    const activity = await api(`/api/jobs/${rec.job.id}/activity`, { session: lead });
    expect(activity.json.activity.map((a: Rec) => a.action)).toEqual(expect.arrayContaining(["job.created", "step.value_saved", "step.signed", "job.state"]));
  });

  it("a signed step is frozen: the API answers 409 and the database refuses updates and deletes for every role", async () => {
    const rec = await newJob();
    const after = await saveAndSign(welder, rec.job.id, "c-clean", { confirmed: true });
    const s = step(after, "c-clean");
    const again = await save(welder, after, "c-clean", { confirmed: false });
    expect(again.status).toBe(409);
    expect(again.json.error.message).toMatch(/frozen/);
    expect((await sign(welder, rec.job.id, "c-clean")).status).toBe(409);
    const soId = s.signOffs[0].id;
    for (const url of [process.env.DATABASE_URL, process.env.ADMIN_DATABASE_URL || process.env.DATABASE_URL]) {
      await withDb(async (c) => {
        await expect(c.query("update sign_off set printed_name = 'Someone Else' where id = $1", [soId])).rejects.toThrow(/append-only/);
        await expect(c.query("delete from sign_off where id = $1", [soId])).rejects.toThrow(/append-only/);
        await expect(c.query(`update job_step set value = '{"confirmed": false}' where id = $1`, [s.id])).rejects.toThrow(/frozen/);
        await expect(c.query("delete from job_step where id = $1", [s.id])).rejects.toThrow(/signed/);
        await expect(c.query("update job_activity set action = 'x' where job_id = $1", [rec.job.id])).rejects.toThrow(/append-only/);
        await expect(c.query("delete from job_activity where job_id = $1", [rec.job.id])).rejects.toThrow(/append-only/);
      }, url);
    }
    const unchanged = step(await record(rec.job.id), "c-clean");
    expect(unchanged.signOffs[0].printedName).toBe("Mick Tamsin");
    expect(unchanged.value).toEqual({ confirmed: true });
  });

  it("a correction is an amendment pointing at the original with a reason; both stay, in order", async () => {
    const rec = await newJob();
    const signed = await saveAndSign(welder, rec.job.id, "m-gap", { reading: 100.2, unit: "mm" });
    const original = step(signed, "m-gap").signOffs[0];
    const s = step(signed, "m-gap");
    const noReason = await api(`/api/jobs/${rec.job.id}/steps/${s.id}/amend`, { session: welder, body: { pin: PIN, amendsSignOffId: original.id, reason: "", value: { reading: 100.5, unit: "mm" } } });
    expect(noReason.status).toBe(400);
    const amended = await api(`/api/jobs/${rec.job.id}/steps/${s.id}/amend`, { session: welder, body: { pin: PIN, amendsSignOffId: original.id, reason: "Read the wrong side of the rule", value: { reading: 100.5, unit: "mm" } } });
    expect(amended.status, amended.text).toBe(201);
    const now = step(amended.json.record, "m-gap");
    expect(now.signOffs.map((o: Rec) => o.amendsSignOffId)).toEqual([null, original.id]);
    expect(now.signOffs[1].reason).toBe("Read the wrong side of the rule");
    expect(now.signOffs[0].contentHash).toBe(original.contentHash);
    expect(now.effectiveValue).toEqual({ reading: 100.5, unit: "mm" });
    expect(now.value).toEqual({ reading: 100.2, unit: "mm" });
    // Amending the original again, past the newer amendment, is a conflict, not a fork.
    const stale = await api(`/api/jobs/${rec.job.id}/steps/${s.id}/amend`, { session: welder, body: { pin: PIN, amendsSignOffId: original.id, reason: "Another try at it", value: { reading: 100.1, unit: "mm" } } });
    expect(stale.status).toBe(409);
    // An amendment must still be within tolerance (or accepted under a nonconformance).
    const out = await api(`/api/jobs/${rec.job.id}/steps/${s.id}/amend`, { session: welder, body: { pin: PIN, amendsSignOffId: now.signOffs[1].id, reason: "Out of tolerance after all", value: { reading: 103, unit: "mm" } } });
    expect(out.status).toBe(422);
  });

  it("two tablets on one step: the second writer gets 409 with the current value, never a silent overwrite", async () => {
    const rec = await newJob();
    const first = await save(welder, rec, "m-gap", { reading: 100.1, unit: "mm" }, 0);
    expect(first.status).toBe(200);
    const second = await save(welder2, rec, "m-gap", { reading: 99.8, unit: "mm" }, 0);
    expect(second.status).toBe(409);
    expect(second.json.error.message).toMatch(/Mick Tamsin changed/);
    expect(second.json.error.current).toMatchObject({ value: { reading: 100.1, unit: "mm" }, version: 1, updatedBy: { name: "Mick Tamsin" } });
    expect(step(await record(rec.job.id), "m-gap").value).toEqual({ reading: 100.1, unit: "mm" });
    const retried = await save(welder2, rec, "m-gap", { reading: 99.8, unit: "mm" }, second.json.error.current.version);
    expect(retried.status).toBe(200);
    // Signing names the version it saw too: a sign-off based on a stale version is refused.
    const s = step(await record(rec.job.id), "m-gap");
    const staleSign = await api(`/api/jobs/${rec.job.id}/steps/${s.id}/sign`, { session: welder, body: { pin: PIN, baseVersion: 1 } });
    expect(staleSign.status).toBe(409);
    expect(step(await record(rec.job.id), "m-gap").signed).toBe(false);
  });

  it("bad values answer 400 with field paths", async () => {
    const rec = await newJob();
    const r = await save(welder, rec, "m-gap", { reading: "a lot" });
    expect(r.status).toBe(400);
    expect(Object.keys(r.json.error.fields)).toContain("reading");
    expect((await save(welder, rec, "c-clean", { confirmed: true, extra: 1 })).status).toBe(400);
  });
});

async function chainOf(jobId: string) {
  return withDb(async (c) => {
    const entries = (await c.query("select seq, prev_hash, hash, sign_off_id from record_entry where job_id = $1 order by seq", [jobId])).rows;
    const signOffs = (await c.query("select * from sign_off where job_id = $1", [jobId])).rows;
    const byId = new Map(signOffs.map((s) => [s.id, s]));
    const rows = entries.map((e) => {
      const s = byId.get(e.sign_off_id);
      return {
        seq: e.seq,
        prevHash: e.prev_hash,
        hash: e.hash,
        entry: recordEntryFor({ id: s.id, jobId: s.job_id, stepId: s.step_id, nonconformanceId: s.nonconformance_id, userId: s.user_id, printedName: s.printed_name, role: s.role, meaning: s.meaning, signedAt: s.signed_at, contentHash: s.content_hash, amendsSignOffId: s.amends_sign_off_id, reason: s.reason }),
      };
    });
    return { signOffs: signOffs.length, verification: verifyChain(rows) };
  });
}

describe("record chain", () => {
  it("every sign-off (step, amendment, disposition, release) lands on the job's chain in its own transaction", async () => {
    const rec = await newJob(shortVersionId);
    const signed = await saveAndSign(welder, rec.job.id, "c-one", { confirmed: true });
    const first = step(signed, "c-one").signOffs[0];
    const amended = await api(`/api/jobs/${rec.job.id}/steps/${step(signed, "c-one").id}/amend`, { session: welder, body: { pin: PIN, amendsSignOffId: first.id, reason: "Note the wire wheel used", value: { confirmed: true, note: "Knotted wire wheel" } } });
    expect(amended.status).toBe(201);
    expect((await sign(inspector, rec.job.id, "h-one")).status).toBe(201);
    expect((await api(`/api/jobs/${rec.job.id}/release`, { session: lead, body: { pin: PIN } })).status).toBe(200);
    const chain = await chainOf(rec.job.id);
    expect(chain.signOffs).toBe(4);
    expect(chain.verification).toMatchObject({ intact: true, entries: 4 });
  });

  it("the demo seed's signed jobs carry their chain too", async () => {
    const seeded = await withDb(async (c) => (await c.query("select id from job where axle_tag = 'AX-0412'")).rows[0]);
    expect(seeded).toBeDefined();
    const chain = await chainOf(seeded.id);
    expect(chain.signOffs).toBeGreaterThan(10);
    expect(chain.verification).toMatchObject({ intact: true, entries: chain.signOffs });
  });
});

describe("job header", () => {
  it("an edit names the version it saw; a stale one answers 409 with the current header", async () => {
    const rec = await newJob();
    const ids = await withDb(async (c) => (await c.query(`select id, email from "user" where email in ('welder@irongully.example', 'inspector@irongully.example')`)).rows);
    const welderId = ids.find((r) => r.email === "welder@irongully.example").id;
    const inspectorId = ids.find((r) => r.email === "inspector@irongully.example").id;
    const first = await api(`/api/jobs/${rec.job.id}`, { session: lead, method: "PATCH", body: { baseVersion: rec.job.version, welderIds: [welderId], inspectorId, dueDate: "2026-03-14" } });
    expect(first.status, first.text).toBe(200);
    expect(first.json.job).toMatchObject({ welders: [{ name: "Mick Tamsin" }], inspector: { name: "Ines Lindqvist" }, dueDate: "2026-03-14" });
    const stale = await api(`/api/jobs/${rec.job.id}`, { session: lead, method: "PATCH", body: { baseVersion: rec.job.version, notes: "Overwrite?" } });
    expect(stale.status).toBe(409);
    expect(stale.json.error.current.dueDate).toBe("2026-03-14");
    const notAWelder = await api(`/api/jobs/${rec.job.id}`, { session: lead, method: "PATCH", body: { baseVersion: first.json.job.version, welderIds: [inspectorId] } });
    expect(notAWelder.status).toBe(400);
    expect(notAWelder.json.error.fields.welderIds).toBeDefined();
    expect((await api(`/api/jobs/${rec.job.id}`, { session: welder, method: "PATCH", body: { baseVersion: first.json.job.version, notes: "x" } })).status).toBe(403);
  });
});

describe("signing PIN", () => {
  it("a wrong PIN is refused and counted; the fifth locks signing, even for the right PIN", async () => {
    const email = `pin-${Date.now()}@irongully.example`;
    const inv = await api("/api/people/invitations", { session: lead, body: { email, roles: ["welder"] } });
    expect(inv.status).toBe(201);
    const mail = await waitFor(() => withDb(async (c) => (await c.query("select text_body from caught_mail where to_address like $1", [`%${email}%`])).rows[0]));
    const token = /\/invite\/([A-Za-z0-9_-]+)/.exec(mail.text_body)![1]!;
    expect((await api(`/api/invitations/${token}/accept`, { body: { name: "Pat Lockwood", password: "a-long-password-1" } })).status).toBe(201);
    const { session: pat } = await signIn(email, "a-long-password-1");
    expect((await api("/api/me/pin", { session: pat, method: "PUT", body: { password: "a-long-password-1", pin: "8642" } })).status).toBe(200);
    const rec = await newJob();
    expect((await save(pat, rec, "c-clean", { confirmed: true })).status).toBe(200);
    for (let i = 1; i <= 4; i++) {
      const r = await sign(pat, rec.job.id, "c-clean", "1111");
      expect(r.status).toBe(403);
      expect(r.json.error.message).toMatch(new RegExp(`${5 - i} tr(y|ies) left`));
    }
    const fifth = await sign(pat, rec.job.id, "c-clean", "1111");
    expect(fifth.status).toBe(423);
    const right = await sign(pat, rec.job.id, "c-clean", "8642");
    expect(right.status).toBe(423);
    expect(step(await record(rec.job.id), "c-clean").signed).toBe(false);
    const failures = await withDb(async (c) => (await c.query(`select m.pin_failures, m.pin_locked_at from membership m join "user" u on u.id = m.user_id where u.email = $1`, [email])).rows[0]);
    expect(failures.pin_failures).toBe(5);
    expect(failures.pin_locked_at).not.toBeNull();
    const activity = (await api(`/api/jobs/${rec.job.id}/activity`, { session: lead })).json.activity;
    expect(activity.filter((a: Rec) => a.action === "sign.refused").length).toBeGreaterThanOrEqual(5);
  });
});

describe("hold points", () => {
  it("steps after a hold stay locked until an inspector who did none of the work signs it, once the weld before it is accepted", async () => {
    const rec = await newJob();
    const torque = step(rec, "t-nut");
    const locked = await save(welder, rec, "t-nut", { achievedNm: 100, unit: "N_m" });
    expect(locked.status).toBe(423);
    expect(locked.json.error.message).toMatch(/locked behind the hold point/);
    // The hold is signed only once the work before it is done.
    expect((await sign(inspector, rec.job.id, "h-visual")).status).toBe(409);
    await prepDone(rec.job.id);
    let r = await record(rec.job.id);
    const cold = await pass(welder, r, "w-1", { preheatC: 5 });
    expect(cold.status).toBe(422);
    expect(cold.json.error.message).toMatch(/below the 10 °C minimum/);
    const ok = await pass(welder, r, "w-1");
    expect(ok.status, ok.text).toBe(201);
    expect(ok.json.record.passes[0]).toMatchObject({ round: 1, outOfRange: false, wps: { reference: "GUS-GMAW-02", number: 1 } });
    expect((await sign(welder, rec.job.id, "w-1")).status).toBe(201);
    r = await record(rec.job.id);
    expect(step(r, "w-1").joint.state).toBe("awaiting_inspection");
    // The weld is not accepted yet, so the hold point waits.
    const early = await sign(inspector, rec.job.id, "h-visual");
    expect(early.status).toBe(409);
    expect(early.json.error.message).toMatch(/W1 is not accepted yet/);
    await acceptJoint(inspector, rec.job.id, "w-1");
    const notInspector = await sign(welder, rec.job.id, "h-visual");
    expect(notInspector.status).toBe(403);
    expect(notInspector.json.error.message).toMatch(/Only an inspector/);
    const held = await sign(inspector, rec.job.id, "h-visual");
    expect(held.status, held.text).toBe(201);
    const h = step(held.json.record, "h-visual").signOffs[0];
    expect(h).toMatchObject({ printedName: "Ines Lindqvist", role: "inspector", meaning: "inspected" });
    expect(held.json.record.job.status).toBe("in_progress");
    expect(step(held.json.record, "t-nut").lockedBy).toBeNull();
    expect(step(held.json.record, "g-after").lockedBy).toBeNull();
    r = held.json.record;
    expect((await save(welder, r, "t-nut", { achievedNm: 100, unit: "N_m" })).status).toBe(200);
    expect(step(await record(rec.job.id), "t-nut").id).toBe(torque.id);
  });

  it("an inspector who welded before the hold point may not sign it", async () => {
    const rec = await newJob();
    await prepDone(rec.job.id);
    // Priya (welder and inspector) gets a GMAW qualification of this test's own, then welds W1.
    await ensureQualified(lead, "welder2@irongully.example", "GMAW");
    const r = await record(rec.job.id, welder2);
    expect((await pass(welder2, r, "w-1")).status).toBe(201);
    expect((await sign(welder2, rec.job.id, "w-1")).status).toBe(201);
    await acceptJoint(inspector, rec.job.id, "w-1");
    const ownWeld = await sign(welder2, rec.job.id, "h-visual");
    expect(ownWeld.status).toBe(403);
    expect(ownWeld.json.error.message).toMatch(/weld pass before this hold point/);
  });
});

describe("nonconformances", () => {
  it("out of tolerance: cannot be signed as passed; raised, it holds the job; the raiser cannot disposition it", async () => {
    const rec = await newJob();
    expect((await save(welder2, rec, "m-gap", { reading: 101.8, unit: "mm" })).status).toBe(200);
    const refused = await sign(welder2, rec.job.id, "m-gap");
    expect(refused.status).toBe(422);
    expect(refused.json.error.message).toMatch(/cannot be signed as passed/);
    const raised = await api(`/api/jobs/${rec.job.id}/nonconformances`, {
      session: welder2,
      body: { stepId: step(rec, "m-gap").id, description: "Hole centre 0.8 mm high", proposedDisposition: "use_as_is" },
    });
    expect(raised.status, raised.text).toBe(201);
    expect(raised.json.number).toBe(1);
    expect(raised.json.record.job.status).toBe("on_hold");
    const ncId = raised.json.nonconformanceId;
    expect((await api(`/api/jobs/${rec.job.id}/nonconformances`, { session: welder2, body: { stepId: step(rec, "m-gap").id, description: "Again the same", proposedDisposition: "rework" } })).status).toBe(409);
    const byRaiser = await api(`/api/jobs/${rec.job.id}/nonconformances/${ncId}/disposition`, { session: welder2, body: { disposition: "use_as_is", notes: "", pin: PIN } });
    expect(byRaiser.status).toBe(403);
    expect(byRaiser.json.error.message).toMatch(/You raised NC-1/);
    const byWelder = await api(`/api/jobs/${rec.job.id}/nonconformances/${ncId}/disposition`, { session: welder, body: { disposition: "use_as_is", notes: "", pin: PIN } });
    expect(byWelder.status).toBe(403);
    const wrongPin = await api(`/api/jobs/${rec.job.id}/nonconformances/${ncId}/disposition`, { session: lead, body: { disposition: "use_as_is", notes: "", pin: "9999" } });
    expect(wrongPin.status).toBe(403);
    const decided = await api(`/api/jobs/${rec.job.id}/nonconformances/${ncId}/disposition`, { session: lead, body: { disposition: "use_as_is", notes: "Within the bracket's slot adjustment.", pin: PIN } });
    expect(decided.status, decided.text).toBe(201);
    const nc = decided.json.record.nonconformances[0];
    expect(nc.disposition).toMatchObject({ disposition: "use_as_is", decidedBy: { name: "Nell Corrigan" } });
    expect(decided.json.record.job.status).toBe("planned");
    const dso = await withDb(async (c) => (await c.query("select meaning, role, printed_name from sign_off where id = $1", [nc.disposition.signOffId])).rows[0]);
    expect(dso).toEqual({ meaning: "dispositioned", role: "lead", printed_name: "Nell Corrigan" });
    expect((await api(`/api/jobs/${rec.job.id}/nonconformances/${ncId}/disposition`, { session: inspector, body: { disposition: "scrap", notes: "", pin: PIN } })).status).toBe(409);
    // "Use as is" lets exactly the observed value be signed, under NC-1.
    const signed = await sign(welder2, rec.job.id, "m-gap");
    expect(signed.status, signed.text).toBe(201);
    const so = step(signed.json.record, "m-gap").signOffs[0];
    const content = await withDb(async (c) => (await c.query("select content from sign_off where id = $1", [so.id])).rows[0].content);
    expect(content.acceptedUnder).toEqual([1]);
    await withDb(async (c) => {
      await expect(c.query("update nonconformance set description = 'nothing wrong' where id = $1", [ncId])).rejects.toThrow(/append-only/);
      await expect(c.query("delete from nonconformance_disposition where nonconformance_id = $1", [ncId])).rejects.toThrow(/append-only/);
    });
  });

  it("after rework the step is measured again and signed only when within tolerance", async () => {
    const rec = await newJob();
    expect((await save(welder, rec, "m-gap", { reading: 98.2, unit: "mm" })).status).toBe(200);
    const raised = await api(`/api/jobs/${rec.job.id}/nonconformances`, { session: welder, body: { stepId: step(rec, "m-gap").id, description: "Hole 1.8 mm low", proposedDisposition: "rework" } });
    expect(raised.status).toBe(201);
    expect((await api(`/api/jobs/${rec.job.id}/nonconformances/${raised.json.nonconformanceId}/disposition`, { session: inspector, body: { disposition: "rework", notes: "Cut the tacks, refit.", pin: PIN } })).status).toBe(201);
    expect((await sign(welder, rec.job.id, "m-gap")).status).toBe(422);
    await saveAndSign(welder, rec.job.id, "m-gap", { reading: 100.1, unit: "mm" });
  });
});

describe("the other step kinds", () => {
  it("geometry results are computed by the server; coating cannot be signed while conditions fail; torque is judged", async () => {
    const rec = await newJob(measuringVersionId);
    const wrong = { after: { input: GEOMETRY_INPUT, unit: "mm", results: { trackBarAngleDeg: 99 } } };
    const saved = await save(welder, rec, "g-after", wrong);
    expect(saved.status, saved.text).toBe(200);
    const g = step(saved.json, "g-after").value.after.results;
    expect(g.trackBarAngleDeg).toBeCloseTo(-4.447, 3);
    expect(g.curve.length).toBeGreaterThan(10);
    const impossible = await save(welder, saved.json, "g-after", { after: { input: { ...GEOMETRY_INPUT, steeringArmLength: 0.001 }, unit: "mm" } });
    expect(impossible.status).toBe(422);
    // Dew point at 20 °C and 80 % RH is 16.4 °C (Magnus, Alduchov & Eskridge 1996): a surface at 18 °C is too close.
    const spots = Array.from({ length: 5 }, () => [80, 90, 100]);
    const wet = await save(welder, await record(rec.job.id), "k-prime", { airTempC: 20, relativeHumidity: 80, surfaceTempC: 18, dftSpots: spots });
    expect(wet.status).toBe(200);
    expect(step(wet.json, "k-prime").readiness.canSign).toBe(false);
    expect(step(wet.json, "k-prime").readiness.reasons.join(" ")).toMatch(/Conditions fail/);
    expect((await sign(welder, rec.job.id, "k-prime")).status).toBe(422);
    // The same readings with the surface at 20 °C: 3.6 °C over the dew point, DFT area 90 µm within 60–120 µm.
    await saveAndSign(welder, rec.job.id, "k-prime", { airTempC: 20, relativeHumidity: 80, surfaceTempC: 20, dftSpots: spots });
    // 100 N·m ± 10 %: 111 N·m is over; 82 lbf·ft (111.2 N·m) too; 70 lbf·ft (94.9 N·m) is within.
    expect((await save(welder, await record(rec.job.id), "t-nut", { achievedNm: 111, unit: "N_m" })).status).toBe(200);
    expect((await sign(welder, rec.job.id, "t-nut")).status).toBe(422);
    await saveAndSign(welder, rec.job.id, "t-nut", { achievedNm: 94.9, unit: "lbf_ft" });
  });
});

describe("release and void", () => {
  it("a lead releases a job once everything is signed; then its record is closed", async () => {
    const rec = await newJob(shortVersionId);
    expect((await api(`/api/jobs/${rec.job.id}/release`, { session: lead, body: { pin: PIN } })).status).toBe(409);
    await saveAndSign(welder, rec.job.id, "c-one", { confirmed: true });
    const held = await sign(inspector, rec.job.id, "h-one");
    expect(held.status).toBe(201);
    expect(held.json.record.job.status).toBe("ready_for_release");
    expect((await api(`/api/jobs/${rec.job.id}/release`, { session: welder, body: { pin: PIN } })).status).toBe(403);
    const released = await api(`/api/jobs/${rec.job.id}/release`, { session: lead, body: { pin: PIN } });
    expect(released.status, released.text).toBe(200);
    expect(released.json.job.status).toBe("released");
    expect(released.json.releaseSignOff).toMatchObject({ meaning: "released", role: "lead", printedName: "Nell Corrigan" });
    expect((await api(`/api/jobs/${rec.job.id}/void`, { session: lead, body: { reason: "Changed my mind" } })).status).toBe(409);
    await withDb(async (c) => {
      await expect(c.query("update job set notes = 'edited' where id = $1", [rec.job.id])).rejects.toThrow(/closed/);
    });
  });

  it("a lead voids a job with a reason; nothing more is recorded on it", async () => {
    const rec = await newJob();
    expect((await api(`/api/jobs/${rec.job.id}/void`, { session: lead, body: { reason: "" } })).status).toBe(400);
    const voided = await api(`/api/jobs/${rec.job.id}/void`, { session: lead, body: { reason: "Customer took the vehicle elsewhere" } });
    expect(voided.status).toBe(200);
    expect(voided.json.job).toMatchObject({ status: "void", voidReason: "Customer took the vehicle elsewhere" });
    expect((await save(welder, rec, "c-clean", { confirmed: true })).status).toBe(409);
  });
});
